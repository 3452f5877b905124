package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The bounds of a coded link whose frame spans several fading blocks: {@code run} compares the
 * link with the block-fading outage of its own channel, and {@code bounds} gives the same numbers
 * from the same options.
 */
class BlockFadingBoundsCliTest {

    @TempDir
    Path tmp;

    private static final String[] LINK = {"--code", "alamouti", "--mod", "qpsk", "--fec", "conv-r12",
        "--frame-bits", "256", "--coherence", "8"};

    private static String[] args(String command, Path out, String... extra) {
        List<String> a = new java.util.ArrayList<>(List.of(command));
        a.addAll(List.of(LINK));
        a.addAll(List.of(extra));
        a.add("--out");
        a.add(out.toString());
        return a.toArray(new String[0]);
    }

    /**
     * Alamouti QPSK, rate-1/2 convolutional code, 256-bit frames in 8-slot fading blocks (33 per
     * frame), at 4 dB: no code beats the outage of the channel it is sent over, so the FER's
     * Clopper-Pearson interval must lie above each bound's Wilson interval (both 95 %; two
     * disjoint 95 % intervals are a strict test, and the seed is fixed). The quasi-static bound
     * that was reported before, P(Gamma(2) < 2·(2^R − 1)/snr) for Alamouti 2x1 (Tarokh,
     * Jafarkhani and Calderbank 1999), lies above this FER: it is not the bound of this channel.
     */
    @Test
    void codedFerStaysAboveTheBlockFadingBound() throws IOException {
        Path dir = tmp.resolve("run");
        CliTest.Outcome o = CliTest.run(args("run", dir, "--snr", "4", "--min-errors", "50", "--seed", "5",
                "--threads", "1"));
        assertEquals(0, o.code(), o.err());
        JsonNode json = new ObjectMapper().readTree(dir.resolve("results.json").toFile());
        double ferLow = json.get("points").get(0).get("fer_ci_low").asDouble();
        JsonNode bounds = json.get("bounds");
        assertEquals(33, bounds.get("fading_blocks").asInt());
        JsonNode point = bounds.get("points").get(0);
        for (String b : new String[] {"mimo", "stbc", "qam"}) {
            assertEquals("monte_carlo", bounds.get(b).get("method").asText());
            double high = point.get(b).get("ci_high").asDouble();
            assertTrue(ferLow > high, b + ": FER interval from " + ferLow + " reaches below the bound's " + high);
        }
        double rate = json.get("bits_per_channel_use").asDouble();
        double quasiStatic = Gamma.regularizedGammaP(2, 2 * (Math.pow(2, rate) - 1) / Math.pow(10, 0.4));
        double ferHigh = json.get("points").get(0).get("fer_ci_high").asDouble();
        assertTrue(ferHigh < quasiStatic, "the one-block bound " + quasiStatic + " is above the FER " + ferHigh);
        for (JsonNode gap : json.get("summary").get("gap_db")) {
            assertTrue(gap.isNull() || gap.asDouble() > 0, json.get("summary").toString());
        }
    }

    /** {@code bounds} takes the rate, coherence and fading options of {@code run}: the same numbers. */
    @Test
    void boundsCommandTakesTheLinkOptions() throws IOException {
        Path b = tmp.resolve("b");
        CliTest.Outcome o = CliTest.run(args("bounds", b, "--snr", "2"));
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("R = 0.9771 bits per channel use"), o.out());
        assertTrue(o.out().contains("33 fading blocks per frame"), o.out());
        Path r = tmp.resolve("r");
        assertEquals(0, CliTest.run(args("run", r, "--snr", "2", "--max-frames", "64", "--min-errors", "0",
                "--threads", "1")).code());
        String row = Files.readAllLines(b.resolve("bounds.csv")).stream().filter(l -> l.startsWith("2,")).findFirst()
                .orElseThrow();
        JsonNode point = new ObjectMapper().readTree(r.resolve("results.json").toFile()).get("bounds").get("points")
                .get(0);
        assertEquals(point.get("mimo").get("value").asDouble(), Double.parseDouble(row.split(",")[1]), 1e-9, row);

        o = CliTest.run("bounds", "--code", "alamouti", "--fading", "rician", "--k-factor", "3", "--snr", "10", "--outage-draws", "20000",
                "--out", tmp.resolve("k").toString());
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("rician K=3.0"), o.out());
        o = CliTest.run("bounds", "--fading", "rician", "--nakagami-m", "2", "--out", tmp.resolve("bad").toString());
        assertEquals(2, o.code());
        assertFalse(Files.exists(tmp.resolve("bad")));
    }
}
