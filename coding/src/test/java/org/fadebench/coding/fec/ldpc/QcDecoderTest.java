package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;

class QcDecoderTest {

    private static final LdpcDecoding[] MIN_SUMS = {
        new LdpcDecoding(LdpcAlgorithm.MIN_SUM, 12, true, 0.8125),
        new LdpcDecoding(LdpcAlgorithm.MIN_SUM, 12, false, 0.75),
        new LdpcDecoding(LdpcAlgorithm.OFFSET_MIN_SUM, 12, true, 0.5),
        new LdpcDecoding(LdpcAlgorithm.OFFSET_MIN_SUM, 12, false, 1),
    };

    /**
     * The block-row kernel gives the row kernel's result for every frame, bit for bit: decisions on
     * every column, iterations and satisfied, for the four family rates at sizes with and without
     * shortened and punctured bits (k = 64 … 8192, and 8192 with a 16- or 32-bit CRC), both min-sum
     * variants, early stop on and off; 21 lanes (one group of 16 and one partly filled), then a
     * batch of 6. The frames mix Eb/N0 from below the waterfall to above it, so some lanes stop
     * early, some never satisfy their checks.
     */
    @Test
    void decodesEveryFrameAsTheRowKernel() {
        Random random = new Random(29);
        int lanes = 21;
        for (LdpcFamily family : LdpcFamily.values()) {
            for (int k : new int[] {64, 100, 1000, 1024, 4096, 8192, 8208, 8224}) {
                CodeLayout layout = family.layout(k);
                double[][] llr = frames(layout, lanes, random);
                int n = layout.matrix().columns();
                int stopped = 0;
                int failed = 0;
                for (LdpcDecoding decoding : MIN_SUMS) {
                    LdpcDecoder rows = new FixedPointDecoder(layout.matrix(), decoding, lanes);
                    LdpcDecoder blocks = LdpcDecoders.create(layout, decoding, lanes);
                    assertEquals(QcDecoder.class, blocks.getClass());
                    for (int batch : new int[] {lanes, 6}) {
                        for (int l = 0; l < batch; l++) {
                            rows.load(l, llr[l], 0);
                            blocks.load(l, llr[l], 0);
                        }
                        rows.decode(batch);
                        blocks.decode(batch);
                        for (int l = 0; l < batch; l++) {
                            String where = family + " k " + k + " " + decoding + " batch " + batch + " lane " + l;
                            assertArrayEquals(LdpcDecodersTest.decisions(rows, l, n), LdpcDecodersTest.decisions(blocks, l, n),
                                    where);
                            assertEquals(rows.iterations(l), blocks.iterations(l), where);
                            assertEquals(rows.satisfied(l), blocks.satisfied(l), where);
                            stopped += rows.iterations(l) < 12 ? 1 : 0;
                            failed += rows.satisfied(l) ? 0 : 1;
                        }
                    }
                }
                assertTrue(stopped > 0 && failed > 0, family + " k " + k + ": " + stopped + " stopped early, "
                        + failed + " failed");
            }
        }
    }

    /**
     * Continuous decoding gives every frame the result of decoding it in a group: 60 frames through
     * the 16 lanes, each finished lane loaded with the next frame at once, against the same frames
     * decoded in groups of 20 (decisions on every column, iterations, satisfied), both min-sum
     * variants, early stop on and off, two rates and sizes with shortened and punctured bits.
     */
    @Test
    void decodesContinuouslyAsInGroups() {
        Random random = new Random(31);
        int frames = 60;
        for (LdpcFamily family : new LdpcFamily[] {LdpcFamily.R12, LdpcFamily.R56}) {
            for (int k : new int[] {100, 1024}) {
                CodeLayout layout = family.layout(k);
                int n = layout.matrix().columns();
                double[][] llr = frames(layout, frames, random);
                for (LdpcDecoding decoding : MIN_SUMS) {
                    LdpcDecoder groups = LdpcDecoders.create(layout, decoding, 20);
                    byte[][] expected = new byte[frames][];
                    int[] expectedIterations = new int[frames];
                    boolean[] expectedSatisfied = new boolean[frames];
                    for (int first = 0; first < frames; first += 20) {
                        for (int l = 0; l < 20; l++) {
                            groups.load(l, llr[first + l], 0);
                        }
                        groups.decode(20);
                        for (int l = 0; l < 20; l++) {
                            expected[first + l] = LdpcDecodersTest.decisions(groups, l, n);
                            expectedIterations[first + l] = groups.iterations(l);
                            expectedSatisfied[first + l] = groups.satisfied(l);
                        }
                    }
                    LdpcDecoder continuous = LdpcDecoders.create(layout, decoding, 20);
                    int lanes = continuous.continuousLanes();
                    assertEquals(QcDecoder.WIDTH, lanes);
                    int[] frameOf = new int[lanes];
                    int[] finished = new int[lanes];
                    int next = 0;
                    for (; next < lanes; next++) {
                        continuous.load(next, llr[next], 0);
                        frameOf[next] = next;
                    }
                    int checked = 0;
                    for (int running = lanes; running > 0; ) {
                        int done = continuous.advance(finished);
                        assertTrue(done > 0);
                        for (int d = 0; d < done; d++) {
                            int lane = finished[d];
                            int f = frameOf[lane];
                            String where = family + " k " + k + " " + decoding + " frame " + f;
                            assertArrayEquals(expected[f], LdpcDecodersTest.decisions(continuous, lane, n), where);
                            assertEquals(expectedIterations[f], continuous.iterations(lane), where);
                            assertEquals(expectedSatisfied[f], continuous.satisfied(lane), where);
                            checked++;
                            if (next < frames) {
                                continuous.load(lane, llr[next], 0);
                                frameOf[lane] = next++;
                            } else {
                                running--;
                            }
                        }
                    }
                    assertEquals(frames, checked);
                    assertEquals(0, continuous.advance(finished), "nothing left running");
                }
            }
        }
    }

    /** A decoder that decodes in groups only says so, and refuses to advance. */
    @Test
    void rowKernelDecodesInGroupsOnly() {
        LdpcDecoder rows = new FixedPointDecoder(DecoderTestCodes.QC_960.expand(), LdpcDecoding.DEFAULT, 4);
        assertEquals(0, rows.continuousLanes());
        assertThrows(UnsupportedOperationException.class, () -> rows.advance(new int[4]));
    }

    /** Noisy BPSK frames of random codewords, Eb/N0 spread around the code's waterfall; punctured columns at LLR 0. */
    private static double[][] frames(CodeLayout layout, int lanes, Random random) {
        int n = layout.matrix().columns();
        double rate = (double) layout.infoBits() / layout.sentBits();
        boolean[] sent = new boolean[n];
        for (int p = 0; p < layout.sentBits(); p++) {
            sent[layout.sentColumn(p)] = true;
        }
        LdpcEncoder encoder = layout.newEncoder();
        byte[] info = new byte[layout.infoBits()];
        byte[] word = new byte[n];
        double[][] llr = new double[lanes][n];
        double low = 0.5 + 2.5 * (1 - 2 * (1 - rate)); // about 0 dB at rate 1/2 to 2 dB at rate 5/6
        for (int l = 0; l < lanes; l++) {
            for (int t = 0; t < info.length; t++) {
                info[t] = (byte) random.nextInt(2);
            }
            encoder.encode(info, 0, word, 0);
            DecoderTestCodes.bpskLlrs(word, rate, low + 0.5 * (l % 7), random, llr[l]);
            for (int j = 0; j < n; j++) {
                llr[l][j] = sent[j] ? llr[l][j] : 0;
            }
        }
        return llr;
    }

    /** A built-in layout takes the block-row kernel for min-sum, the floating decoder for sum-product; a user's H the row kernel. */
    @Test
    void picksTheKernelByLayout() {
        CodeLayout lifted = LdpcFamily.R12.layout(1024);
        assertEquals(QcDecoder.class, LdpcDecoders.create(lifted, LdpcDecoding.DEFAULT, 4).getClass());
        assertEquals(FloatingPointDecoder.class,
                LdpcDecoders.create(lifted, LdpcDecoding.of(LdpcAlgorithm.SUM_PRODUCT, 5), 4).getClass());
        CodeLayout user = new SystematicLayout(DecoderTestCodes.QC_960.expand());
        assertEquals(FixedPointDecoder.class, LdpcDecoders.create(user, LdpcDecoding.DEFAULT, 4).getClass());
        assertEquals(QcDecoder.bytes(lifted.quasiCyclic().get(), 100), LdpcDecoders.bytes(lifted, LdpcDecoding.DEFAULT, 100));
        assertThrows(IllegalArgumentException.class, () -> LdpcDecoders.create(lifted, LdpcDecoding.DEFAULT, 0));
    }

    @Test
    void refusesSumProductAndBadPositions() {
        QcStructure qc = QcStructure.whole(DecoderTestCodes.QC_960);
        assertThrows(IllegalArgumentException.class,
                () -> new QcDecoder(qc, LdpcDecoding.of(LdpcAlgorithm.SUM_PRODUCT, 5), 2));
        assertEquals("column 1 at lifted position 0; valid: distinct positions from 0 to 959",
                assertThrows(IllegalArgumentException.class,
                        () -> new QcStructure(DecoderTestCodes.QC_960, new int[] {0, 0})).getMessage());
        assertThrows(IllegalArgumentException.class, () -> new QcStructure(DecoderTestCodes.QC_960, new int[] {960}));
    }
}
