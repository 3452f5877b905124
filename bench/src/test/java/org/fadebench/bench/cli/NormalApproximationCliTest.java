package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.fadebench.bench.analysis.NormalApproximation;
import org.fadebench.bench.report.ResultsCsv;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code run} over AWGN writes the finite-length limit beside the simulated curve. */
class NormalApproximationCliTest {

    @TempDir
    Path tmp;

    /**
     * BPSK, the rate-1/2 convolutional code, 256-bit frames, {@code --fading none}: results.csv ends
     * each row with fer_normal_approx, and results.json's summary gives gap_db.normal_approx. No
     * code does meaningfully better than the normal approximation (Polyanskiy, Poor and Verdú
     * 2010); a 64-state convolutional code is about 2 dB from it, so the FER's 95 % Clopper-Pearson
     * interval lies wholly above the approximation at each point, and the gap is positive (seed
     * fixed).
     */
    @Test
    void awgnRunWritesColumnAndGap() throws IOException {
        Path dir = tmp.resolve("awgn");
        CliTest.Outcome o = CliTest.run("run", "--fading", "none", "--mod", "bpsk", "--fec", "conv-r12",
                "--frame-bits", "256", "--snr", "0,1", "--min-errors", "40", "--max-frames", "3000", "--seed", "3",
                "--threads", "2", "--quiet", "--out", dir.toString());
        assertEquals(0, o.code(), o.err());
        List<String> rows = Files.readAllLines(dir.resolve("results.csv")).stream().filter(l -> !l.startsWith("#"))
                .toList();
        assertTrue(rows.get(0).endsWith("," + ResultsCsv.NORMAL_APPROX_COLUMN), rows.get(0));
        for (String row : rows.subList(1, rows.size())) {
            String[] f = row.split(",", -1);
            double ferLow = Double.parseDouble(f[8]);
            double approx = Double.parseDouble(f[f.length - 1]);
            assertTrue(approx < ferLow, row);
        }
        JsonNode summary = new ObjectMapper().readTree(dir.resolve("results.json").toFile()).get("summary");
        JsonNode gap = summary.get("gap_db").get(NormalApproximation.KEY);
        assertTrue(gap.isNumber() && gap.asDouble() > 0, summary.toString());
        assertEquals(summary.get("snr_db_at_target").asDouble()
                - summary.get(NormalApproximation.KEY).get("snr_db_at_target").asDouble(), gap.asDouble(), 1e-12);
    }
}
