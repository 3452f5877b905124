package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Random;
import org.apache.commons.math3.stat.interval.ConfidenceInterval;
import org.apache.commons.math3.stat.interval.WilsonScoreInterval;
import org.junit.jupiter.api.Test;

/**
 * The fixed-point lane decoder against the floating-point reference: frame error rates over
 * BPSK/AWGN on the rate-1/2 test code (n = 960) at three Eb/N0 on the waterfall, 256 frames each
 * (seed fixed), every decoder fed the same frames; at most 30 iterations, early stop.
 *
 * <p>Tolerance: each FER gets its 95 % Wilson score interval (E. B. Wilson, "Probable inference,
 * the law of succession, and statistical inference", J. Amer. Statist. Assoc. 22, 1927; computed by
 * Commons Math's {@code WilsonScoreInterval}), and two decoders agree when their intervals
 * overlap. Both decoders see the same noise, so their counts are positively correlated and the
 * overlap test is on the lenient side only for decoders that truly differ; the quantisation's own
 * loss (steps of 1/16 LLR, limits far above the LLRs seen) is far below what 256 frames resolve.
 */
class DecoderAgreementTest {

    private static final double[] EB_N0_DB = {1.25, 1.5, 1.75};
    private static final int LANES = 64;
    private static final int BATCHES = 4;

    @Test
    void fixedPointAndFloatingPointAgreeInFer() {
        ParityCheckMatrix h = DecoderTestCodes.QC_960.expand();
        SystematicEncoder encoder = new SystematicEncoder(h);
        int n = h.columns();
        LdpcDecoding minSum = LdpcDecoding.of(LdpcAlgorithm.MIN_SUM, 30);
        LdpcDecoding offset = LdpcDecoding.of(LdpcAlgorithm.OFFSET_MIN_SUM, 30);
        LdpcDecoder[] decoders = {
            new FixedPointDecoder(h, minSum, LANES), new FloatingPointDecoder(h, minSum, LANES),
            new FixedPointDecoder(h, offset, LANES), new FloatingPointDecoder(h, offset, LANES),
            new FloatingPointDecoder(h, LdpcDecoding.of(LdpcAlgorithm.SUM_PRODUCT, 30), LANES),
        };
        Random random = new Random(23);
        double[] llr = new double[n];
        byte[][] words = new byte[LANES][];
        for (double ebN0Db : EB_N0_DB) {
            int[] errors = new int[decoders.length];
            for (int b = 0; b < BATCHES; b++) {
                for (int l = 0; l < LANES; l++) {
                    words[l] = DecoderTestCodes.codeword(encoder, random);
                    DecoderTestCodes.bpskLlrs(words[l], 0.5, ebN0Db, random, llr);
                    for (LdpcDecoder decoder : decoders) {
                        decoder.load(l, llr, 0);
                    }
                }
                for (int d = 0; d < decoders.length; d++) {
                    decoders[d].decode(LANES);
                    for (int l = 0; l < LANES; l++) {
                        errors[d] += wrong(decoders[d], l, words[l]) ? 1 : 0;
                    }
                }
            }
            String where = "Eb/N0 " + ebN0Db + " dB, frame errors (fixed ms, float ms, fixed oms, float oms, sp) "
                    + Arrays.toString(errors) + " of " + LANES * BATCHES;
            assertTrue(errors[0] > 0 && errors[0] < LANES * BATCHES, where); // on the waterfall
            assertTrue(overlap(errors[0], errors[1]), where);
            assertTrue(overlap(errors[2], errors[3]), where);
            // sum-product is the better decoder, min-sum its approximation (J. Chen, M. P. C.
            // Fossorier, IEEE Trans. Commun. 50(3), 2002, from memory): its FER is not above
            // the fixed-point min-sum's beyond their intervals
            assertTrue(interval(errors[4]).getLowerBound() <= interval(errors[0]).getUpperBound(), where);
        }
    }

    private static boolean wrong(LdpcDecoder decoder, int lane, byte[] word) {
        for (int j = 0; j < word.length; j++) {
            if (decoder.bit(lane, j) != word[j]) {
                return true;
            }
        }
        return false;
    }

    private static ConfidenceInterval interval(int errors) {
        return new WilsonScoreInterval().createInterval(LANES * BATCHES, errors, 0.95);
    }

    private static boolean overlap(int a, int b) {
        ConfidenceInterval x = interval(a);
        ConfidenceInterval y = interval(b);
        return x.getLowerBound() <= y.getUpperBound() && y.getLowerBound() <= x.getUpperBound();
    }
}
