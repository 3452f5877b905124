package org.fadebench.bench.link;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.fadebench.bench.sweep.BinomialInterval;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.bench.sweep.SweepEngine;
import org.fadebench.channel.Fading;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.ChannelCodes;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.fec.LaneCoder;
import org.fadebench.coding.fec.Lanes;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.ErrorRates;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;

/**
 * The recipe "add a channel-code family" of DEVELOPERS.md, followed in a test: a repetition code
 * written here and nowhere else, added to a registry with {@link ChannelCodes#with}, found by its
 * name and run through the whole link by the sweep engine, in lanes, with a CRC.
 *
 * <p>Closed form: BPSK over AWGN (no fading, one antenna each side) with soft decisions. Summing
 * the n LLRs of a bit adds n independent looks at it, so a bit is wrong with probability
 * Q(√(2·n·Es/N0)) (BPSK in AWGN, P_b = Q(√(2 Eb/N0)): J. G. Proakis and M. Salehi, Digital
 * Communications, 5th ed., 2008, Sec. 4.2; the energy of n equal-gain looks adds up: common
 * practice, no source). Bits are wrong independently, so a frame of k bits is wrong with
 * probability 1 − (1 − p)^k.
 */
class RepetitionCodeLinkTest {

    /** Each bit sent n times in a row; decoded by the sign of the sum of its n LLRs. */
    static final class RepetitionCode implements ChannelCode {

        private final int n;

        RepetitionCode(int n) {
            this.n = n;
        }

        @Override
        public String cliName() {
            return "rep" + n;
        }

        @Override
        public double rate() {
            return 1.0 / n;
        }

        @Override
        public int codedBits(int infoBits) {
            return n * infoBits;
        }

        @Override
        public long bytesPerLane(int infoBits) {
            return 9L * infoBits;
        }

        @Override
        public long coderBytes(int infoBits, int lanes) {
            return 8L * lanes * infoBits;
        }

        @Override
        public LaneCoder newCoder(int infoBits, int lanes) {
            return new LaneCoder() {
                private final double[][] sums = new double[lanes][infoBits];
                private int decoded;

                @Override
                public void encode(byte[] info, int off, byte[] coded, int codedOff) {
                    for (int i = 0; i < infoBits; i++) {
                        for (int r = 0; r < n; r++) {
                            coded[codedOff + n * i + r] = info[off + i];
                        }
                    }
                }

                @Override
                public void load(int lane, double[] llr, int off) {
                    Lanes.checkLane(lane, lanes);
                    for (int i = 0; i < infoBits; i++) {
                        double sum = 0;
                        for (int r = 0; r < n; r++) {
                            sum += llr[off + n * i + r];
                        }
                        sums[lane][i] = sum;
                    }
                }

                @Override
                public void decode(int frames) {
                    Lanes.checkFrames(frames, lanes);
                    decoded = frames;
                }

                @Override
                public void decided(int lane, byte[] info, int off) {
                    Lanes.checkLane(lane, decoded);
                    for (int i = 0; i < infoBits; i++) {
                        info[off + i] = (byte) (sums[lane][i] < 0 ? 1 : 0);
                    }
                }
            };
        }
    }

    private static final int PAYLOAD_BITS = 64;
    private static final long FRAMES = 2560;
    /** Two-sided level of the Clopper–Pearson intervals the closed forms must fall in. */
    private static final double LEVEL = 0.999;

    @Test
    void repetitionCodeRunsThroughTheLinkAsItsClosedFormSays() {
        ChannelCodes codes = ChannelCodes.standard().with(new RepetitionCode(3));
        ChannelCode rep3 = codes.find("rep3");
        FrameCoding coding = new FrameCoding(new FecScheme(Crc.CRC16, rep3), Interleaving.RANDOM, 0, LlrMethod.EXACT);
        LinkSettings link = new LinkSettings(Modulation.BPSK, SpaceTimeCodes.NONE, 1, 1, Fading.NONE, PAYLOAD_BITS, 0,
                Equaliser.MF, coding);
        assertEquals(3 * (PAYLOAD_BITS + 16), link.codedBitsPerFrame());
        assertEquals(ChannelCode.MAX_LANES, link.lanes());
        double[] snrDb = {-3, 0};
        List<PointResult> results = new SweepEngine(link, new StopRules(0, FRAMES, 0, 0), 41, 2, 0.95)
                .run(snrDb, p -> { }).results();
        for (PointResult r : results) {
            FrameCounters c = r.counts();
            assertEquals(FRAMES, c.frames());
            double p = ErrorRates.bpskBitErrorRate(3 * Math.pow(10, r.snrDb() / 10));
            assertWithin(p, c.bitErrors(), c.bits(), "BER at " + r.snrDb() + " dB");
            assertWithin(1 - Math.pow(1 - p, PAYLOAD_BITS), c.frameErrors(), c.frames(), "FER at " + r.snrDb());
            // the CRC covers payload and check: 80 decided bits
            assertWithin(1 - Math.pow(1 - p, PAYLOAD_BITS + 16), c.crcFailures(), c.frames(),
                    "CRC failures at " + r.snrDb());
        }
    }

    private static void assertWithin(double expected, long errors, long trials, String what) {
        double[] ci = BinomialInterval.clopperPearson(errors, trials, LEVEL);
        assertTrue(ci[0] <= expected && expected <= ci[1],
                what + ": closed form " + expected + " outside [" + ci[0] + ", " + ci[1] + "] of " + errors + "/"
                        + trials);
    }
}
