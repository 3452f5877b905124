package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.fadebench.bench.analysis.NormalApproximation;
import org.fadebench.bench.analysis.RunSummary;
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
        for (double[] interval : runAndCheckGap("conv-r12", "0,1", 3000)) {
            assertTrue(interval[2] < interval[0], "FER interval " + interval[0] + " to " + interval[1]
                    + " against the approximation " + interval[2]);
        }
    }

    /**
     * The same for an LDPC code ({@code ldpc-r12}, BPSK, 256-bit payloads, n = 512): such a code comes
     * within about a dB of the normal approximation (Polyanskiy, Poor and Verdú 2010, Sec. IV, show
     * good codes of this length near it; about 1.1 dB at FER 1e-2 here, seed 3, when written), so the
     * check is the approximation's own claim alone: the upper end of the FER's 95 % Clopper-Pearson
     * interval is at or above it at each point (FER about 0.5, 0.16, 0.02 and 0.005 at −2, −1.5, −1
     * and −0.5 dB), and the gap at the target FER 1e-2 is positive.
     */
    @Test
    void ldpcFerIsNotBelowTheApproximation() throws IOException {
        for (double[] interval : runAndCheckGap("ldpc-r12", "-2,-1.5,-1,-0.5", 10000)) {
            assertTrue(interval[1] >= interval[2], "FER interval " + interval[0] + " to " + interval[1]
                    + " against the approximation " + interval[2]);
        }
    }

    /**
     * Runs BPSK over AWGN with {@code fec}, 256-bit frames, at least 40 frame errors per point, and
     * checks the column and the gap's arithmetic, and that no outage bound is given (the channel is
     * fixed, so no frame is ever in outage): the p_out columns empty with a comment line saying why,
     * no bounds in results.json and that reason as the gaps' note; returns per point {FER interval
     * low, high, approximation}.
     */
    private List<double[]> runAndCheckGap(String fec, String snrDb, int maxFrames) throws IOException {
        Path dir = tmp.resolve(fec);
        CliTest.Outcome o = CliTest.run("run", "--fading", "none", "--mod", "bpsk", "--fec", fec,
                "--frame-bits", "256", "--snr", snrDb, "--min-errors", "40", "--max-frames", Integer.toString(maxFrames),
                "--seed", "3", "--threads", "2", "--quiet", "--out", dir.toString());
        assertEquals(0, o.code(), o.err());
        List<String> lines = Files.readAllLines(dir.resolve("results.csv"));
        assertTrue(lines.contains("# p_out_*: empty, " + RunSummary.NO_BOUNDS_AWGN), String.join("\n", lines));
        List<String> rows = lines.stream().filter(l -> !l.startsWith("#")).toList();
        assertTrue(rows.get(0).endsWith("," + ResultsCsv.NORMAL_APPROX_COLUMN), rows.get(0));
        List<String> header = List.of(rows.get(0).split(","));
        List<double[]> points = new ArrayList<>();
        for (String row : rows.subList(1, rows.size())) {
            String[] f = row.split(",", -1);
            for (String column : header) {
                if (column.startsWith("p_out_")) {
                    assertEquals("", f[header.indexOf(column)], column + " in " + row);
                }
            }
            points.add(new double[] {Double.parseDouble(f[8]), Double.parseDouble(f[9]),
                Double.parseDouble(f[f.length - 1])});
        }
        JsonNode json = new ObjectMapper().readTree(dir.resolve("results.json").toFile());
        assertTrue(json.get("bounds").isNull(), json.get("bounds").toString());
        JsonNode summary = json.get("summary");
        assertEquals(RunSummary.NO_BOUNDS_AWGN, summary.get("gap_note").get("qam").asText());
        JsonNode gap = summary.get("gap_db").get(NormalApproximation.KEY);
        assertTrue(gap.isNumber() && gap.asDouble() > 0, summary.toString());
        assertEquals(summary.get("snr_db_at_target").asDouble()
                - summary.get(NormalApproximation.KEY).get("snr_db_at_target").asDouble(), gap.asDouble(), 1e-12);
        return points;
    }
}
