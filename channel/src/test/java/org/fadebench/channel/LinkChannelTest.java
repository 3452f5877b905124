package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import java.util.Arrays;
import org.junit.jupiter.api.Test;

/** The link's view of the channel: options, their checks, and the per-block calls. */
class LinkChannelTest {

    /**
     * Block fading with perfect CSI draws exactly what the link drew before this class existed:
     * H by the fading model, then the noise, from the same stream; the estimate is H itself.
     */
    @Test
    void rayleighWithPerfectCsiKeepsTheOldDrawOrder() {
        int nr = 2;
        int mt = 2;
        int slots = 6;
        LinkChannel channel = ChannelSpec.of(Fading.RAYLEIGH).newLinkChannel(nr, mt, slots);
        double[] x = new double[2 * mt * slots];
        Draws.of(1).fillGaussian(x, 0, x.length, 1.0);
        double[] y = new double[2 * nr * slots];
        double[] hHat = new double[2 * nr * mt];
        Draws draws = Draws.of(2);
        channel.startBlock(draws, 0, slots);
        channel.transmit(x, 0, 2, 0.25, draws, y, 0);
        channel.estimate(0.25, draws, hHat);

        double[] h = new double[2 * nr * mt];
        double[] yOld = new double[y.length];
        Draws old = Draws.of(2);
        new RayleighFading().draw(old, nr, mt, h);
        MimoChannel.apply(h, nr, mt, x, 0, slots, 2, 0.25, old, yOld, 0);
        assertArrayEquals(yOld, y, 0.0);
        assertArrayEquals(h, hHat, 0.0);
        assertEquals(old.gaussian(), draws.gaussian(), 0.0);
        assertFalse(channel.varies());
    }

    /**
     * The planar transmit (block fading; two antennas by their own method, 1 and 3 to 8 by the
     * general one, whose odd counts end on a single antenna) writes exactly the interleaved
     * transmit's numbers, from the same draws: the received planes are the interleaved output read
     * as rows of one code block (T = 2 slots), and both streams end at the same place. Some grid
     * entries are exact zeros, as in the orthogonal designs. An exact claim, checked without
     * tolerance.
     */
    @Test
    void planarTransmitEqualsInterleaved() {
        for (int mt : new int[] {1, 2, 3, 4, 5, 8}) {
            for (int nr = 1; nr <= 3; nr++) {
                int slots = 6;
                int from = 2;
                double[] x = new double[2 * mt * slots];
                Draws.of(3).fillGaussian(x, 0, x.length, 1.0);
                for (int i = 0; i < x.length; i += 7) {
                    x[i] = 0.0;
                }
                double[] y = new double[2 * nr * slots];
                double[][] yPlanes = new double[4 * nr][from + slots / 2];
                double[][] xPlanes = planes(x, 4 * mt, from);
                LinkChannel general = ChannelSpec.of(Fading.RAYLEIGH).withCsiError(0.1).newLinkChannel(nr, mt, slots);
                LinkChannel planar = ChannelSpec.of(Fading.RAYLEIGH).withCsiError(0.1).newLinkChannel(nr, mt, slots);
                Draws generalDraws = Draws.of(4);
                Draws planarDraws = Draws.of(4);
                general.startBlock(generalDraws, 0, slots);
                planar.startBlock(planarDraws, 0, slots);
                general.transmit(x, 0, 2, 0.3, generalDraws, y, 0);
                planar.transmit(xPlanes, from, 0.3, planarDraws, yPlanes);
                double[][] expected = planes(y, 4 * nr, from);
                for (int j = 0; j < expected.length; j++) {
                    assertArrayEquals(expected[j], yPlanes[j], "mt " + mt + ", nr " + nr + ", plane " + j);
                }
                assertEquals(generalDraws.gaussian(), planarDraws.gaussian());
            }
        }
        LinkChannel whole = ChannelSpec.of(Fading.RAYLEIGH).newLinkChannel(1, 2, 6);
        whole.startBlock(Draws.of(1), 0, 6);
        assertThrows(IllegalArgumentException.class,
                () -> whole.transmit(new double[24], 0, 4, 0.1, Draws.of(1), new double[12], 0), "6 slots in runs of 4");
        LinkChannel moving = ChannelSpec.of(Fading.RAYLEIGH).withDoppler(0.01).newLinkChannel(1, 2, 2);
        moving.startBlock(Draws.of(1), 0, 2);
        assertThrows(IllegalStateException.class,
                () -> moving.transmit(new double[8][1], 0, 0.1, Draws.of(1), new double[4][1]));
    }

    /**
     * Planar labels are the interleaved labels read as rows of the planes' count, from the same
     * draws, for every label width of the modulations (1, 2, 4, 6, 8 bits) and for widths whose
     * draws do not hold whole rows (3 bits: 21 labels per draw), for 1 to 8 planes (the symbols of
     * a code block: 2 for Alamouti, 3 for H3 and H4, 4 for G3 and G4, 8 for the rate-1/2 codes on 5
     * to 8 antennas).
     */
    @Test
    void planarLabelsEqualInterleaved() {
        for (int bits : new int[] {1, 2, 3, 4, 6, 8}) {
            for (int width = 1; width <= 8; width++) {
                int rows = 37;
                int[] flat = new int[width * rows];
                int[][] planes = new int[width][rows + 1];
                Draws a = Draws.of(5);
                Draws b = Draws.of(5);
                a.fillLabels(flat, 0, flat.length, bits);
                b.fillLabels(planes, 1, rows, bits);
                for (int i = 0; i < flat.length; i++) {
                    assertEquals(flat[i], planes[i % width][1 + i / width], "bits " + bits + ", width " + width);
                }
                assertEquals(a.uniform().nextLong(), b.uniform().nextLong());
            }
        }
    }

    /** Rows of {@code width} values of {@code a} as planes, row i at element {@code from + i}. */
    private static double[][] planes(double[] a, int width, int from) {
        double[][] p = new double[width][from + a.length / width];
        for (int i = 0; i < a.length; i++) {
            p[i % width][from + i / width] = a[i];
        }
        return p;
    }

    /** With Doppler the channel changes over the block and the CSI is that of its first slot. */
    @Test
    void dopplerChannelAgesAndCsiIsTheFirstSlot() {
        LinkChannel channel = ChannelSpec.of(Fading.RICIAN).withKFactor(1.0).withDoppler(0.05).withRxCorr(0.3)
                .newLinkChannel(2, 1, 20);
        assertTrue(channel.varies());
        Draws draws = Draws.of(3);
        channel.startBlock(draws, 0, 20);
        double[] first = new double[4];
        double[] later = new double[4];
        double[] hHat = new double[4];
        channel.trueChannel(0, first);
        channel.trueChannel(19, later);
        assertFalse(first[0] == later[0]);
        channel.estimate(0.1, draws, hHat);
        assertArrayEquals(first, hHat, 0.0);
        // with no noise the received slot s is H(s)·x
        double[] x = new double[40];
        x[2 * 7] = 1.0;
        double[] y = new double[80];
        channel.transmit(x, 0, 2, 0.0, draws, y, 0);
        channel.trueChannel(7, later);
        assertArrayEquals(later, Arrays.copyOfRange(y, 4 * 7, 4 * 7 + 4), 0.0);
        assertThrows(IllegalArgumentException.class, () -> channel.trueChannel(20, first));
        assertThrows(IllegalArgumentException.class, () -> channel.startBlock(draws, 1, 21));
    }

    /** A trace of h = 1 is the AWGN channel: the same received samples and estimate as no fading. */
    @Test
    void traceOfOnesIsAwgn() {
        double[] ones = new double[3 * 8];
        for (int i = 0; i < ones.length; i += 2) {
            ones[i] = 1.0;
        }
        ChannelTrace trace = ChannelTrace.of("ones", 2, 2, ones);
        LinkChannel fromTrace = ChannelSpec.of(Fading.RAYLEIGH).withTrace(trace).withPilots(2).newLinkChannel(2, 2, 4);
        LinkChannel none = ChannelSpec.of(Fading.NONE).withPilots(2).newLinkChannel(2, 2, 4);
        double[] x = new double[2 * 2 * 4];
        Draws.of(1).fillGaussian(x, 0, x.length, 1.0);
        double[] y1 = new double[2 * 2 * 4];
        double[] y2 = new double[2 * 2 * 4];
        double[] e1 = new double[8];
        double[] e2 = new double[8];
        Draws a = Draws.of(2);
        Draws b = Draws.of(2);
        for (long block = 0; block < 5; block++) {
            fromTrace.startBlock(a, block, 4);
            fromTrace.transmit(x, 0, 2, 0.5, a, y1, 0);
            fromTrace.estimate(0.5, a, e1);
            none.startBlock(b, block, 4);
            none.transmit(x, 0, 2, 0.5, b, y2, 0);
            none.estimate(0.5, b, e2);
            assertArrayEquals(y2, y1, 0.0);
            assertArrayEquals(e2, e1, 0.0);
        }
    }


    /**
     * Every kind of link channel allocates nothing per block once built. Any allocation per block
     * costs at least 16 bytes (the smallest object) a block, 80 000 bytes over the 5000 blocks
     * measured; the limit of 16 KiB catches even one allocation every five blocks, and leaves room
     * for the few hundred bytes the JIT's own tier changes are sometimes charged to the thread
     * (seen here: 64 to 800 bytes at scattered blocks, none at all with {@code -Xint}).
     */
    @Test
    void blocksAllocateNothing() {
        double[] ones = {1, 0, 1, 0, 1, 0, 1, 0};
        ChannelTrace trace = ChannelTrace.of("ones", 2, 2, ones);
        ChannelSpec[] specs = {
            ChannelSpec.of(Fading.RAYLEIGH),
            ChannelSpec.of(Fading.RAYLEIGH).withTxCorr(0.5).withRxCorr(-0.2).withCsiError(0.1),
            ChannelSpec.of(Fading.RICIAN).withKFactor(3).withRxCorr(0.7).withPilots(4),
            ChannelSpec.of(Fading.NAKAGAMI).withNakagamiM(0.6),
            ChannelSpec.of(Fading.RAYLEIGH).withDoppler(0.01).withTxCorr(0.4).withPilots(2),
            ChannelSpec.of(Fading.NONE).withTrace(trace),
        };
        com.sun.management.ThreadMXBean threads =
                (com.sun.management.ThreadMXBean) ManagementFactory.getThreadMXBean();
        for (ChannelSpec spec : specs) {
            LinkChannel channel = spec.newLinkChannel(2, 2, 16);
            double[] x = new double[2 * 2 * 16];
            double[] y = new double[2 * 2 * 16];
            double[] hHat = new double[8];
            Draws draws = Draws.of(5);
            runBlocks(channel, draws, x, y, hHat, 0, 1000);
            long before = threads.getCurrentThreadAllocatedBytes();
            runBlocks(channel, draws, x, y, hHat, 1000, 5000);
            long allocated = threads.getCurrentThreadAllocatedBytes() - before;
            assertTrue(allocated < 16 * 1024, spec + ": 5000 blocks allocated " + allocated + " bytes");
        }
    }

    private static void runBlocks(LinkChannel channel, Draws draws, double[] x, double[] y, double[] hHat,
                                  long first, int blocks) {
        for (int b = 0; b < blocks; b++) {
            channel.startBlock(draws, first + b, 16);
            channel.transmit(x, 0, 2, 0.1, draws, y, 0);
            channel.estimate(0.1, draws, hHat);
        }
    }

    @Test
    void optionValuesAreChecked() {
        ChannelSpec s = ChannelSpec.of(Fading.RAYLEIGH);
        assertMessage("--k-factor must be a finite linear K-factor >= 0, got -1.0", () -> s.withKFactor(-1));
        assertMessage("--k-factor must be a finite linear K-factor >= 0, got Infinity",
                () -> s.withKFactor(Double.POSITIVE_INFINITY));
        assertMessage("--nakagami-m must be a finite Nakagami m >= 0.5, got 0.3", () -> s.withNakagamiM(0.3));
        assertMessage("--tx-corr must be an exponential correlation coefficient in (-1, 1), got 1.0", () -> s.withTxCorr(1));
        assertMessage("--rx-corr must be an exponential correlation coefficient in (-1, 1), got NaN",
                () -> s.withRxCorr(Double.NaN));
        assertMessage("--doppler must be a normalised Doppler f_D·T_s in [0, 0.5], got 0.7", () -> s.withDoppler(0.7));
        assertMessage("--csi-error must be a finite error variance >= 0, got -0.5", () -> s.withCsiError(-0.5));
        assertMessage("--pilots must be 1 to 65536 (and at least Mt), got 0", () -> s.withPilots(0));
        assertMessage("--fading must be one of rayleigh, rician, nakagami, none", () -> ChannelSpec.of((Fading) null));
    }

    @Test
    void optionCombinationsAreChecked() {
        ChannelTrace trace = ChannelTrace.of("t.npy", 2, 2, new double[8]);
        assertCheck("--fading rician needs --k-factor (a linear K-factor >= 0)", ChannelSpec.of(Fading.RICIAN));
        assertCheck("--fading nakagami needs --nakagami-m (m >= 0.5)", ChannelSpec.of(Fading.NAKAGAMI));
        assertCheck("--k-factor applies only to --fading rician", ChannelSpec.of(Fading.RAYLEIGH).withKFactor(2));
        assertCheck("--nakagami-m applies only to --fading nakagami", ChannelSpec.of(Fading.RICIAN).withKFactor(1)
                .withNakagamiM(2));
        assertCheck("--tx-corr applies only to --fading rayleigh or rician",
                ChannelSpec.of(Fading.NAKAGAMI).withNakagamiM(2).withTxCorr(0.5));
        assertCheck("--rx-corr applies only to --fading rayleigh or rician", ChannelSpec.of(Fading.NONE).withRxCorr(0.5));
        assertCheck("--doppler applies only to --fading rayleigh or rician", ChannelSpec.of(Fading.NONE).withDoppler(0.1));
        assertCheck("--csi-error and --pilots cannot be combined",
                ChannelSpec.of(Fading.RAYLEIGH).withCsiError(0.1).withPilots(4));
        assertCheck("--pilots must be at least the number of transmit antennas Mt = 2 (orthogonal pilots), got 1",
                ChannelSpec.of(Fading.RAYLEIGH).withPilots(1));
        assertCheck("--trace takes the channel from the file and cannot be combined with --doppler",
                ChannelSpec.of(Fading.RAYLEIGH).withTrace(trace).withDoppler(0.1));
        assertCheck("--trace takes the channel from the file and cannot be combined with --tx-corr",
                ChannelSpec.of(Fading.RAYLEIGH).withTrace(trace).withTxCorr(0.1));
        assertMessage("--trace t.npy: holds 2 x 2 matrices (Nr x Mt) but the link has 3 x 2",
                () -> ChannelSpec.of(Fading.RAYLEIGH).withTrace(trace).check(3, 2));
        assertCheck("--tx-corr and --rx-corr cannot be combined with correlation matrices",
                ChannelSpec.of(Fading.RAYLEIGH).withCorrelation(KroneckerCorrelation.identity(2, 2)).withRxCorr(0.2));
        assertMessage("correlation matrices are for Nr x Mt = 2 x 2 but the link has 1 x 2",
                () -> ChannelSpec.of(Fading.RAYLEIGH).withCorrelation(KroneckerCorrelation.identity(2, 2)).check(1, 2));
        // accepted combinations
        ChannelSpec.of(Fading.NONE).withPilots(2).withTrace(trace).check(2, 2);
        ChannelSpec.of(Fading.RICIAN).withKFactor(0).withDoppler(0).withTxCorr(0).withCsiError(0).check(2, 2);
    }

    @Test
    void modelsDescriptionsAndOverhead() {
        assertTrue(ChannelSpec.of(Fading.RAYLEIGH).newModel(2, 2) instanceof RayleighFading);
        assertTrue(ChannelSpec.of(Fading.RICIAN).withKFactor(2).withTxCorr(0.3).newModel(2, 2) instanceof RicianFading);
        assertTrue(ChannelSpec.of(Fading.NAKAGAMI).withNakagamiM(2).newModel(2, 2) instanceof NakagamiFading);
        assertTrue(ChannelSpec.of(Fading.NONE).newModel(2, 2) instanceof NoFading);
        ChannelTrace trace = ChannelTrace.of("t.npy", 1, 1, new double[] {1, 0, 0, 1});
        assertTrue(ChannelSpec.of(Fading.RAYLEIGH).withTrace(trace).newModel(1, 1) instanceof TraceFading);
        assertEquals("rician K=3.0, rx-corr 0.5, doppler 0.01, pilots 4", ChannelSpec.of(Fading.RICIAN).withKFactor(3)
                .withRxCorr(0.5).withDoppler(0.01).withPilots(4).toString());
        assertEquals("trace t.npy (2 matrices), csi-error 0.1", ChannelSpec.of(Fading.RAYLEIGH).withTrace(trace)
                .withCsiError(0.1).describe());
        ChannelSpec pilots = ChannelSpec.of(Fading.RAYLEIGH).withPilots(4);
        assertEquals(4.0 / 20.0, pilots.pilotOverhead(16, 1), 1e-15);
        assertEquals(8.0 / 38.0, pilots.pilotOverhead(30, 2), 1e-15, "two blocks of 15 and 15 slots, 4 pilots each");
        assertEquals(0.0, ChannelSpec.of(Fading.RAYLEIGH).pilotOverhead(16, 1));
        assertEquals("rayleigh, tx-corr 0.2, perfect CSI", ChannelSpec.of(Fading.RAYLEIGH).withTxCorr(0.2).describe());
        assertEquals(0.2 * 2 / 4, pilots.newLinkChannel(3, 2, 8).csiErrorVariance(0.2), 1e-15);
    }

    @Test
    void fadingNames() {
        assertEquals("rayleigh, rician, nakagami, none", ChannelModels.STANDARD.choices());
        for (Fading f : Fading.values()) {
            assertTrue(ChannelModels.STANDARD.has(f.cliName()), f.cliName());
        }
        assertEquals("nakagami m=2.0, perfect CSI", ChannelSpec.of(" Nakagami ").withNakagamiM(2).describe());
        assertEquals("unknown fading model 'foggy'; valid: rayleigh, rician, nakagami, none",
                assertThrows(IllegalArgumentException.class, () -> ChannelSpec.of("foggy")).getMessage());
    }

    private static void assertCheck(String expected, ChannelSpec spec) {
        assertMessage(expected, () -> spec.check(2, 2));
    }

    private static void assertMessage(String expected, Runnable action) {
        assertEquals(expected, assertThrows(IllegalArgumentException.class, action::run).getMessage());
    }
}
