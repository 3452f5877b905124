package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.fadebench.coding.stbc.SpaceTimeCodeFile;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CodesCliTest {

    @TempDir
    Path tmp;

    @Test
    void listsTheCatalogueWithChecks() {
        CliTest.Outcome o = CliTest.run("codes");
        assertEquals(0, o.code(), o.err());
        for (String name : new String[] {"none", "alamouti", "g3", "g4", "h3", "h4", "r12-5", "r12-6", "r12-7", "r12-8"}) {
            assertTrue(o.out().lines().anyMatch(l -> l.startsWith(name + " ") && l.contains("yes")), name);
        }
    }

    /** A user code file: listed, and a run with it equals the same run with the catalogue code. */
    @Test
    void userCodeFileRoundTripsThroughRun() throws IOException {
        Path file = tmp.resolve("my-g4.yaml");
        SpaceTimeCodeFile.write(SpaceTimeCodes.G4, file);
        CliTest.Outcome listed = CliTest.run("codes", "--code-file", file.toString());
        assertEquals(0, listed.code(), listed.err());
        assertEquals(2, listed.out().lines().filter(l -> l.startsWith("g4 ")).count());
        String[] common = {"--mod", "qpsk", "--snr", "2,6", "--min-errors", "20", "--seed", "4", "--tx", "4"};
        Path a = tmp.resolve("a");
        Path b = tmp.resolve("b");
        assertEquals(0, CliTest.run(concat(new String[] {"run", "--code", "g4", "--out", a.toString()}, common)).code());
        CliTest.Outcome fromFile = CliTest.run(concat(new String[] {"run", "--code-file", file.toString(), "--out",
            b.toString()}, common));
        assertEquals(0, fromFile.code(), fromFile.err());
        assertEquals(Files.readString(a.resolve("results.csv")), Files.readString(b.resolve("results.csv")));
    }

    /** A non-orthogonal code (spatial multiplexing, 2 symbols in 1 slot) runs with a warning. */
    @Test
    void nonOrthogonalCodeWarnsAndUsesMmse() throws IOException {
        Path file = Files.writeString(tmp.resolve("sm2.yaml"), String.join("\n",
                "name: sm2", "tx: 2", "slots: 1", "symbols:",
                "  - real: [[1, 0]]", "    imag: [[\"j\", 0]]",
                "  - real: [[0, 1]]", "    imag: [[0, \"j\"]]", ""));
        CliTest.Outcome o = CliTest.run("run", "--code-file", file.toString(), "--rx", "2", "--snr", "10",
                "--min-errors", "10", "--out", tmp.resolve("sm").toString());
        assertEquals(0, o.code(), o.err());
        assertTrue(o.err().contains("warning: code sm2 is not orthogonal; mmse linear decoding"), o.err());
        assertTrue(o.out().contains("mmse decoder"), o.out());
        CliTest.Outcome zf = CliTest.run("run", "--code-file", file.toString(), "--rx", "1", "--decoder", "zf",
                "--snr", "10", "--out", tmp.resolve("zf").toString());
        assertEquals(2, zf.code());
        assertTrue(zf.err().contains("--decoder zf cannot separate 2 symbols"), zf.err());
    }

    @Test
    void badCodeInput() throws IOException {
        CliTest.Outcome o = CliTest.run("run", "--code", "h4", "--tx", "2", "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("--code h4 needs exactly 4 transmit antennas (--tx 4), got --tx 2"), o.err());
        Path nan = Files.writeString(tmp.resolve("nan.yaml"), "name: x\ntx: 1\nslots: 1\nsymbols:\n"
                + "  - real: [[.nan]]\n    imag: [[0]]\n");
        o = CliTest.run("run", "--code-file", nan.toString(), "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().startsWith("fadebench run: --code-file: "), o.err());
        assertFalse(o.err().trim().contains("\n"));
        Path zero = Files.writeString(tmp.resolve("zero.yaml"), "name: z\ntx: 1\nslots: 1\nsymbols:\n"
                + "  - real: [[0]]\n    imag: [[0]]\n");
        o = CliTest.run("run", "--code-file", zero.toString(), "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code(), o.err());
        o = CliTest.run("run", "--code", "g4", "--code-file", zero.toString(), "--out", tmp.resolve("x").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("give either --code or --code-file"), o.err());
        o = CliTest.run("run", "--decoder", "ml", "--out", tmp.resolve("x").toString());
        assertTrue(o.err().contains("--decoder: ") && o.err().contains("mf, zf, mmse"), o.err());
        assertFalse(Files.exists(tmp.resolve("x")));
    }

    private static String[] concat(String[] a, String[] b) {
        String[] c = java.util.Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, c, a.length, b.length);
        return c;
    }
}
