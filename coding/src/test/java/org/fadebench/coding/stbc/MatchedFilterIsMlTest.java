package org.fadebench.coding.stbc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.QamConstellation;
import org.junit.jupiter.api.Test;

/**
 * For an orthogonal design, ‖Y − X(s)Hᵀ‖² splits into one term per symbol, so matched filtering
 * followed by per-symbol slicing makes the joint ML decision (V. Tarokh, H. Jafarkhani and
 * A. R. Calderbank, IEEE Trans. Inf. Theory 45(5), 1999, decoding of orthogonal designs; S. M.
 * Alamouti, IEEE JSAC 16(8), 1998). Checked against exhaustive joint ML on every catalogue code
 * with BPSK and QPSK, Rayleigh channels (CN(0,1) entries), 1 and 2 receive antennas, at 0, 6 and
 * 12 dB (n0 = 10^(−SNR/10)), with fixed seeds.
 */
class MatchedFilterIsMlTest {

    private static final int BLOCKS = 12;

    @Test
    void matchedFilterSlicingEqualsExhaustiveMl() {
        Random rnd = new Random(2024);
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            int errorsAtLowSnr = 0;
            for (Modulation mod : new Modulation[] {Modulation.BPSK, Modulation.QPSK}) {
                QamConstellation qam = mod.constellation();
                for (int nr = 1; nr <= 2; nr++) {
                    for (double snrDb : new double[] {0, 6, 12}) {
                        int errors = check(code, qam, nr, Math.pow(10, -snrDb / 10), rnd);
                        if (snrDb == 0) {
                            errorsAtLowSnr += errors;
                        }
                    }
                }
            }
            // the comparison must include blocks that ML itself decodes wrongly, or it proves little
            assertTrue(errorsAtLowSnr > 0, code.name() + ": no ML errors at 0 dB");
        }
    }

    /** Runs BLOCKS blocks; asserts equal bit decisions; returns ML's symbol errors. */
    private static int check(SpaceTimeCode code, QamConstellation qam, int nr, double n0, Random rnd) {
        int k = code.symbolsPerBlock();
        int t = code.slotsPerBlock();
        int mt = code.transmitAntennas();
        int bps = qam.bitsPerSymbol();
        int order = qam.modulation().order();
        ExhaustiveMl ml = new ExhaustiveMl(code, qam, nr);
        Combiner mf = code.newCombiner(nr, Equaliser.MF, n0);
        double[] point = new double[2];
        int symbolErrors = 0;
        for (int blk = 0; blk < BLOCKS; blk++) {
            int[] sent = new int[k];
            double[] s = new double[2 * k];
            for (int i = 0; i < k; i++) {
                sent[i] = rnd.nextInt(order);
                qam.point(sent[i], point);
                s[2 * i] = point[0];
                s[2 * i + 1] = point[1];
            }
            double[] x = new double[2 * t * mt];
            code.newEncoder().encode(s, 0, 1, x, 0);
            double[] h = TestCodes.gaussians(rnd, 2 * nr * mt, Math.sqrt(0.5));
            double[] y = TestCodes.receive(x, h, nr, mt, t);
            for (int i = 0; i < y.length; i++) {
                y[i] += Math.sqrt(n0 / 2) * rnd.nextGaussian();
            }

            double[] est = new double[2 * k];
            double[] gain = new double[k];
            mf.setChannel(h);
            mf.combine(y, 0, 1, est, gain, 0);
            byte[] sliced = new byte[k * bps];
            qam.demapHard(est, 0, sliced, 0, k);

            int[] decided = ml.decide(h, y, 0);
            byte[] joint = new byte[k * bps];
            for (int i = 0; i < k; i++) {
                for (int j = 0; j < bps; j++) {
                    joint[i * bps + j] = (byte) ((decided[i] >>> (bps - 1 - j)) & 1);
                }
                if (decided[i] != sent[i]) {
                    symbolErrors++;
                }
            }
            assertArrayEquals(joint, sliced, code.name() + " " + qam.modulation() + " nr=" + nr + " n0=" + n0);
        }
        return symbolErrors;
    }
}
