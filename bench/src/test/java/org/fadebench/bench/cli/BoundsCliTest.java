package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class BoundsCliTest {

    @TempDir
    Path tmp;

    /**
     * SISO over Rayleigh: p_out = 1 − exp(−(2^R − 1)/SNR) (D. Tse and P. Viswanath, Fundamentals of
     * Wireless Communication, 2005, ch. 5), for the MIMO and the code bound alike, read back from
     * bounds.csv.
     */
    @Test
    void sisoBoundsMatchTheClosedForm() throws IOException {
        Path dir = tmp.resolve("b");
        CliTest.Outcome o = CliTest.run("bounds", "--mod", "16qam", "--rate", "2", "--snr", "0..20/5", "--out",
                dir.toString());
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("p_out_mimo"), o.out());
        List<String> rows = Files.readAllLines(dir.resolve("bounds.csv")).stream()
                .filter(l -> !l.startsWith("#")).toList();
        assertTrue(rows.get(0).startsWith("snr_db,p_out_mimo,p_out_stbc,p_out_qam"), rows.get(0));
        assertEquals(6, rows.size());
        for (String row : rows.subList(1, rows.size())) {
            String[] f = row.split(",");
            double snr = Math.pow(10, Double.parseDouble(f[0]) / 10);
            double exact = 1 - Math.exp(-(Math.pow(2, 2) - 1) / snr);
            assertEquals(exact, Double.parseDouble(f[1]), 1e-5 * exact, row);
            assertEquals(exact, Double.parseDouble(f[2]), 1e-5 * exact, row);
            assertTrue(Double.parseDouble(f[3]) >= exact, "finite alphabet cannot beat Gaussian inputs: " + row);
        }
    }

    @Test
    void badBoundsInput() {
        CliTest.Outcome o = CliTest.run("bounds", "--rate", "0", "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("--rate must be a positive number"), o.err());
        o = CliTest.run("bounds", "--code", "h4", "--tx", "2", "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("--code h4 needs exactly 4 transmit antennas"), o.err());
        o = CliTest.run("bounds", "--fading", "none", "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().startsWith("fadebench bounds: --fading none is an AWGN channel") && o.err().contains("valid: ")
                && o.err().trim().indexOf('\n') < 0, o.err());
        assertFalse(Files.exists(tmp.resolve("x")));
    }
}
