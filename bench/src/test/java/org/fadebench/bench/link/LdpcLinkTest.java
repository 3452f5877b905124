package org.fadebench.bench.link;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.bench.sweep.SweepEngine;
import org.fadebench.channel.Draws;
import org.fadebench.channel.Fading;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.fec.LaneCoder;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.fadebench.coding.fec.ldpc.LdpcAlgorithm;
import org.fadebench.coding.fec.ldpc.LdpcCode;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.ErrorRates;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;

/**
 * An LDPC code through the whole link (the small code of {@link LdpcTestCode}, n = 192, k = 96,
 * with CRC-16: 80 payload bits per frame), BPSK over AWGN with one antenna each side, run by the
 * sweep engine in lanes: frame errors, bit errors against the uncoded closed form, the decoder's
 * iterations, and the lanes giving the counts one lane gives.
 */
class LdpcLinkTest {

    private static final int PAYLOAD = LdpcTestCode.K - 16;
    private static final long FRAMES = 2000;

    private static LinkSettings link(ChannelCode code) {
        FrameCoding coding = new FrameCoding(new FecScheme(Crc.CRC16, code), Interleaving.RANDOM, 0, LlrMethod.EXACT);
        return new LinkSettings(Modulation.BPSK, SpaceTimeCodes.NONE, 1, 1, Fading.NONE, PAYLOAD, 0, Equaliser.MF,
                coding);
    }

    private static List<PointResult> sweep(LinkSettings link, double... snrDb) {
        return new SweepEngine(link, new StopRules(0, FRAMES, 0, 0), 17, 2, 0.95).run(snrDb, p -> { }).results();
    }

    @Test
    void testCodeHasNoFourCycleAndHalfRate() {
        assertFalse(LdpcTestCode.BASE.hasFourCycle());
        LdpcCode code = LdpcTestCode.code(LdpcDecoding.DEFAULT);
        assertEquals(LdpcTestCode.K, code.minInfoBits());
        assertEquals(192, code.codedBits(LdpcTestCode.K));
    }

    /**
     * Three SNRs, 2000 frames each. Eb/N0 = SNR − 10·log10(80/192) = SNR + 3.80 dB.
     * <ul>
     * <li>−5 dB (Eb/N0 −1.2 dB): below the capacity limit of BPSK over AWGN at rate 1/2 (Eb/N0 ≈ 0.19 dB,
     * the limit of the binary-input channel, from memory) and so below it at our lower rate too; no code
     * gets most frames through there: FER above 1/2.</li>
     * <li>−1 dB (Eb/N0 2.8 dB): the code must beat uncoded BPSK at the same Eb/N0, BER Q(√(2·Eb/N0)) = 2.6e-2
     * (J. G. Proakis and M. Salehi, Digital Communications, 5th ed., 2008, Sec. 4.2): the upper end of
     * the coded BER's 95 % interval, with frames as clusters of bits (the errors of a frame come
     * together; E. L. Korn and B. I. Graubard, Survey Methodology 24(2), 1998), below it. (About
     * 1.0e-2 against 2.6e-2 when written.)</li>
     * <li>3 dB (Eb/N0 6.8 dB): the raw bit error rate is Q(√(2·SNR)) = 2.3 %, about 4.4 wrong bits of 192
     * per frame, which this code corrects with overwhelming probability (it showed no error in 20 000
     * frames at 2 dB, without CRC, when written): no frame error at all.</li>
     * </ul>
     * Every frame error is a CRC failure or an undetected one; the mean iterations lie between 1 and
     * the limit of 50 and fall as the SNR rises.
     */
    @Test
    void decodesThroughTheLink() {
        LinkSettings link = link(LdpcTestCode.code(LdpcDecoding.DEFAULT));
        assertEquals(192, link.codedBitsPerFrame());
        assertEquals(ChannelCode.MAX_LANES, link.lanes());
        List<PointResult> r = sweep(link, -5, -1, 3);
        FrameCounters low = r.get(0).counts();
        FrameCounters high = r.get(2).counts();
        assertTrue(low.fer() > 0.5, "FER below the capacity limit: " + low.fer());
        double uncoded = ErrorRates.bpskBitErrorRate(Math.pow(10, link.ebN0Db(-1) / 10));
        double berHigh = r.get(1).berHigh();
        assertTrue(berHigh < uncoded, "coded BER up to " + berHigh + " against uncoded " + uncoded);
        assertEquals(0, high.frameErrors(), "frame errors at 3 dB");
        double previous = Double.POSITIVE_INFINITY;
        for (PointResult p : r) {
            FrameCounters c = p.counts();
            assertEquals(FRAMES, c.frames());
            assertTrue(c.frameErrors() <= c.crcFailures() + c.undetectedErrors(), "errors " + c.byName());
            double mean = c.fecIterationsMean();
            assertTrue(mean >= 1 && mean <= 50, "mean iterations " + mean + " at " + p.snrDb() + " dB");
            assertTrue(mean < previous, "fewer iterations at " + p.snrDb() + " dB: " + mean);
            previous = mean;
        }
    }

    /** Without early stop every frame takes every iteration: the mean is the limit exactly. */
    @Test
    void fullIterationsTakeTheLimit() {
        LdpcDecoding twelve = new LdpcDecoding(LdpcAlgorithm.OFFSET_MIN_SUM, 12, false,
                LdpcAlgorithm.OFFSET_MIN_SUM.defaultCorrection());
        FrameCounters c = sweep(link(LdpcTestCode.code(twelve)), 3).get(0).counts();
        assertEquals(12L * FRAMES, c.fecIterations());
        assertEquals(0, c.frameErrors());
    }

    /** 300 frames through one chain decoding 128 lanes at once and through one decoding a lane at a time. */
    @Test
    void lanesGiveTheCountsOfOneLane() {
        LdpcCode code = LdpcTestCode.code(LdpcDecoding.DEFAULT);
        LinkSettings many = link(code);
        LinkSettings one = link(new OneLane(code));
        assertEquals(128, many.lanes());
        assertEquals(1, one.lanes());
        double n0 = Math.pow(10, 2.0 / 10); // SNR -2 dB: some frames fail, not all
        FrameCounters a = new FrameCounters();
        FrameCounters b = new FrameCounters();
        new LinkChain(many).runFrames(Draws.of(5, 0, 0), n0, 0, 300, a);
        new LinkChain(one).runFrames(Draws.of(5, 0, 0), n0, 0, 300, b);
        assertTrue(a.frameErrors() > 0 && a.frameErrors() < 300, "some frames fail: " + a.byName());
        assertEquals(a.byName(), b.byName());
    }

    /** A code whose decoder does not iterate reports no iterations: the column stays empty. */
    @Test
    void convolutionalCodeReportsNoIterations() {
        FrameCounters c = sweep(link(PuncturedCode.CONV_SMALL), 2).get(0).counts();
        assertEquals(0, c.fecIterations());
        assertTrue(Double.isNaN(c.fecIterationsMean()));
        assertFalse(c.byName().containsKey(FrameCounters.FEC_ITERATIONS));
    }

    /** The code, decoded one frame at a time. */
    private record OneLane(ChannelCode code) implements ChannelCode {

        @Override
        public String cliName() {
            return code.cliName();
        }

        @Override
        public double rate() {
            return code.rate();
        }

        @Override
        public int minInfoBits() {
            return code.minInfoBits();
        }

        @Override
        public int maxInfoBits() {
            return code.maxInfoBits();
        }

        @Override
        public int codedBits(int infoBits) {
            return code.codedBits(infoBits);
        }

        @Override
        public long bytesPerLane(int infoBits) {
            return code.bytesPerLane(infoBits);
        }

        @Override
        public long coderBytes(int infoBits, int lanes) {
            return code.coderBytes(infoBits, lanes);
        }

        @Override
        public int lanes(int infoBits) {
            return 1;
        }

        @Override
        public LaneCoder newCoder(int infoBits, int lanes) {
            return code.newCoder(infoBits, lanes);
        }
    }
}
