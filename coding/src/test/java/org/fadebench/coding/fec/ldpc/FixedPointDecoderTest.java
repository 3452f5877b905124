package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;

class FixedPointDecoderTest {

    private static final ParityCheckMatrix H = DecoderTestCodes.QC_960.expand();
    private static final QcStructure QC = QcStructure.whole(DecoderTestCodes.QC_960);

    /** Rounding to steps of 1/16 LLR unit and the channel limit, as documented. */
    @Test
    void quantisesToSixteenthsWithinTheLimit() {
        assertEquals(16, FixedPointDecoder.quantise(1.0));
        assertEquals(-40, FixedPointDecoder.quantise(-2.5));
        assertEquals(3, FixedPointDecoder.quantise(0.19)); // 3.04 steps
        assertEquals(0, FixedPointDecoder.quantise(0));
        assertEquals(1023, FixedPointDecoder.quantise(64));
        assertEquals(-1023, FixedPointDecoder.quantise(-1e300));
    }

    /**
     * Each lane's bits, iterations and satisfied flag equal those of its frame decoded alone, with
     * early stop on and off, for both min-sum variants: 37 lanes (not a multiple of any vector
     * length) of frames from easy (Eb/N0 4 dB) to hopeless (0 dB) mixed, decoded all together and
     * as a batch of 23; then one frame at a time in a 1-lane decoder. Both kernels: by rows, and
     * by block rows (37 lanes are two full groups of 16 and one of 5).
     */
    @Test
    void eachLaneDecodesAsIfAlone() {
        SystematicEncoder encoder = new SystematicEncoder(H);
        Random random = new Random(17);
        int n = H.columns();
        int lanes = 37;
        double[][] llr = new double[lanes][n];
        double[] ebN0Db = {4, 0, 1.5, 2, 1, 0.5, 3};
        for (int l = 0; l < lanes; l++) {
            DecoderTestCodes.bpskLlrs(DecoderTestCodes.codeword(encoder, random), 0.5, ebN0Db[l % ebN0Db.length], random,
                    llr[l]);
        }
        for (LdpcAlgorithm algorithm : new LdpcAlgorithm[] {LdpcAlgorithm.MIN_SUM, LdpcAlgorithm.OFFSET_MIN_SUM}) {
            for (boolean earlyStop : new boolean[] {true, false}) {
                LdpcDecoding decoding = new LdpcDecoding(algorithm, 25, earlyStop, algorithm.defaultCorrection());
                for (boolean blockRows : new boolean[] {false, true}) {
                    LdpcDecoder together = blockRows ? new QcDecoder(QC, decoding, lanes) : new FixedPointDecoder(H, decoding, lanes);
                    LdpcDecoder alone = blockRows ? new QcDecoder(QC, decoding, 1) : new FixedPointDecoder(H, decoding, 1);
                    int minIterations = Integer.MAX_VALUE;
                    int maxIterations = 0;
                    int failures = 0;
                    for (int batch : new int[] {lanes, 23}) {
                        for (int l = 0; l < batch; l++) {
                            together.load(l, llr[l], 0);
                        }
                        together.decode(batch);
                        for (int l = 0; l < batch; l++) {
                            alone.load(0, llr[l], 0);
                            alone.decode(1);
                            String where = decoding + (blockRows ? " block rows" : " rows") + " batch " + batch + " lane " + l;
                            assertArrayEquals(LdpcDecodersTest.decisions(alone, 0, n), LdpcDecodersTest.decisions(together, l, n),
                                    where);
                            assertEquals(alone.iterations(0), together.iterations(l), where);
                            assertEquals(alone.satisfied(0), together.satisfied(l), where);
                            minIterations = Math.min(minIterations, together.iterations(l));
                            maxIterations = Math.max(maxIterations, together.iterations(l));
                            failures += together.satisfied(l) ? 0 : 1;
                        }
                    }
                    // the mix is a real one: some lanes stop early, some fail after every iteration
                    assertTrue(failures > 0, decoding.toString());
                    assertEquals(25, maxIterations);
                    assertTrue(earlyStop ? minIterations < 5 : minIterations == 25, decoding.toString());
                }
            }
        }
    }

    @Test
    void sumProductIsNotFixedPoint() {
        assertThrows(IllegalArgumentException.class,
                () -> new FixedPointDecoder(H, LdpcDecoding.of(LdpcAlgorithm.SUM_PRODUCT, 5), 2));
    }
}
