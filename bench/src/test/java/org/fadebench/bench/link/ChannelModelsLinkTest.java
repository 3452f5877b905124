package org.fadebench.bench.link;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.bench.sweep.SweepEngine;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.ChannelTrace;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.ErrorRates;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The channel models of the channel module inside the whole link. Tolerances as in
 * {@link LinkTheoryTest}: 4.5 binomial standard errors of the closed form.
 */
class ChannelModelsLinkTest {

    @TempDir
    Path tmp;

    private static LinkSettings simo(ChannelSpec channel, int rx, int coherence) {
        return new LinkSettings(Modulation.BPSK, SpaceTimeCodes.NONE, rx, 1, channel, 512, coherence, Equaliser.MF,
                FrameCoding.NONE);
    }

    private static List<PointResult> run(LinkSettings l, double[] snr, long frames, int threads) {
        return new SweepEngine(l, new StopRules(0, frames, 0, 0), 5, threads, 0.95).run(snr, p -> { }).results();
    }

    private static void assertBer(double theory, FrameCounters c, String what) {
        double se = Math.sqrt(theory * (1 - theory) / c.bits());
        assertTrue(c.bitErrors() >= 100, what + ": too few errors");
        assertEquals(theory, c.ber(), 4.5 * se, what);
    }

    /**
     * Nakagami m = 1 and Rician K = 0 are Rayleigh (M. K. Simon and M.-S. Alouini, Digital
     * Communication over Fading Channels, 2nd ed., 2005, ch. 2): BPSK with 1x2 MRC follows the
     * Rayleigh closed form (Proakis and Salehi, 5th ed., Sec. 13.4). Channel per symbol.
     */
    @Test
    void nakagamiOneAndRicianZeroAreRayleigh() {
        double snrDb = 4;
        double theory = ErrorRates.rayleighMrcBpskBitErrorRate(2, Math.pow(10, snrDb / 10));
        FrameCounters nak = run(simo(ChannelSpec.of(Fading.NAKAGAMI).withNakagamiM(1), 2, 1),
                new double[] {snrDb}, 1000, 2).get(0).counts();
        assertBer(theory, nak, "nakagami m=1");
        FrameCounters ric = run(simo(ChannelSpec.of(Fading.RICIAN).withKFactor(0), 2, 1),
                new double[] {snrDb}, 1000, 2).get(0).counts();
        assertBer(theory, ric, "rician K=0");
    }

    /** A trace of h = 1 is the AWGN link: BPSK BER = Q(√(2 Eb/N0)) (Proakis and Salehi, Sec. 4.2). */
    @Test
    void traceOfOnesIsAwgn() {
        double[] ones = new double[2 * 2 * 10];
        for (int i = 0; i < ones.length; i += 2) {
            ones[i] = 1;
        }
        ChannelTrace trace = ChannelTrace.of("ones", 2, 1, ones);
        double snrDb = 1;
        FrameCounters c = run(simo(ChannelSpec.of(Fading.RAYLEIGH).withTrace(trace), 2, 0), new double[] {snrDb},
                300, 2).get(0).counts();
        // two antennas with h = 1: MRC gain 2, so Eb/N0 = 2 SNR
        assertBer(ErrorRates.bpskBitErrorRate(2 * Math.pow(10, snrDb / 10)), c, "trace of ones");
    }

    /** A replayed trace gives the same counts on any number of threads (block number selects the matrix). */
    @Test
    void traceReplayIsDeterministicAcrossThreads() throws Exception {
        ChannelSpec rayleigh = ChannelSpec.of(Fading.RAYLEIGH);
        LinkSettings drawn = simo(rayleigh, 2, 0);
        SweepEngine e = new SweepEngine(drawn, new StopRules(0, 500, 0, 0), 9, 2, 0.95);
        e.recordChannels(500);
        double[] recorded = e.run(new double[] {5}, p -> { }).recordedChannels();
        Path file = tmp.resolve("h.csv.xz");
        ChannelTrace.of("test", 2, 1, recorded).write(file);
        ChannelTrace back = ChannelTrace.read(file);
        assertEquals(500, back.size());
        LinkSettings replay = simo(rayleigh.withTrace(back), 2, 128);
        List<PointResult> one = run(replay, new double[] {3, 6}, 3000, 1);
        List<PointResult> three = run(replay, new double[] {3, 6}, 3000, 3);
        for (int i = 0; i < 2; i++) {
            assertEquals(one.get(i).counts().bitErrors(), three.get(i).counts().bitErrors());
            assertEquals(one.get(i).counts().frameErrors(), three.get(i).counts().frameErrors());
        }
        assertTrue(Files.size(file) > 0);
    }

    /**
     * Doppler breaks Alamouti's assumption of a constant channel over its two slots: an error
     * floor appears (common practice, no source). With f_D·T_s = 0.05 the BER barely moves from
     * 30 to 40 dB, while with a block-constant channel it falls by about a decade per 10 dB per
     * branch (two branches here: 100 times).
     */
    @Test
    void dopplerMakesAnErrorFloorForAlamouti() {
        LinkSettings moving = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2,
                ChannelSpec.of(Fading.RAYLEIGH).withDoppler(0.05), 256, 0, Equaliser.MF, FrameCoding.NONE);
        List<PointResult> r = run(moving, new double[] {30, 40}, 3000, 2);
        double ratio = r.get(0).counts().ber() / r.get(1).counts().ber();
        assertTrue(r.get(1).counts().bitErrors() > 100, "a floor: errors remain at 40 dB");
        assertTrue(ratio < 3, "BER 30 dB / 40 dB = " + ratio);
    }

    /** Noisy CSI costs SNR: the same link with Ĥ = H + CN(0, 0.1) has a clearly higher BER. */
    @Test
    void csiErrorDegrades() {
        LinkSettings perfect = simo(ChannelSpec.of(Fading.RAYLEIGH), 2, 1);
        LinkSettings noisy = simo(ChannelSpec.of(Fading.RAYLEIGH).withCsiError(0.1), 2, 1);
        double a = run(perfect, new double[] {10}, 1000, 2).get(0).counts().ber();
        double b = run(noisy, new double[] {10}, 1000, 2).get(0).counts().ber();
        assertTrue(b > 1.5 * a, "perfect " + a + " noisy " + b);
    }
}
