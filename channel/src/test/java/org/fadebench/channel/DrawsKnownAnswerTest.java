package org.fadebench.channel;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Arrays;
import org.junit.jupiter.api.Test;

/**
 * Known answers of {@link Draws}: the first values of a few streams. The literals pin the output of
 * the code as of the commit that added this test (obtained by running it, not from an outside
 * source), the way a random-number library pins its generators' output: every simulated number
 * descends from these streams, so any change here is a deliberate act that updates the pin in the
 * same commit and gives the reason in its message.
 */
class DrawsKnownAnswerTest {

    private static final long SEED = 20261202L;

    /** Uniform 64-bit words and a double in [0, 1) of the streams (seed), (seed, 0, 0) and (seed, 3, 7). */
    @Test
    void uniforms() {
        assertEquals("b368935450b38209 ba8e9626a497fec8 95f45b8013dda57c 0.8948110152963863",
                words(Draws.of(SEED)));
        assertEquals("4d30f3b44c74aa9c 35f3a81c368fe563 b94c861d49298b14 0.4907937261958004",
                words(Draws.of(SEED, 0, 0)));
        assertEquals("159736eade231300 222cba78164cb56c 4b605eef32d40b2 0.5050841445885419",
                words(Draws.of(SEED, 3, 7)));
    }

    private static String words(Draws d) {
        return Long.toHexString(d.uniform().nextLong()) + " " + Long.toHexString(d.uniform().nextLong()) + " "
                + Long.toHexString(d.uniform().nextLong()) + " " + d.uniform().nextDouble();
    }

    /**
     * Standard normal draws (Ziggurat), one at a time and in bulk with a σ; the planar form fills
     * plane after plane and the interleaved one column by column, the same draws.
     */
    @Test
    void gaussians() {
        Draws d = Draws.of(SEED, 1, 2);
        double[] first = {d.gaussian(), d.gaussian(), d.gaussian()};
        assertArrayEquals(new double[] {0.28928373508729655, 0.3303721110849051, 0.49669119907926207}, first, 0.0,
                Arrays.toString(first));
        double[] bulk = new double[6];
        Draws.of(SEED, 1, 3).fillGaussian(bulk, 0, 6, 0.5);
        assertArrayEquals(new double[] {0.12112740598938404, 0.08625506520937053, -0.4417976133973287,
            0.1546059126001028, 0.7155018824546548, -0.9127311359121966}, bulk, 0.0, Arrays.toString(bulk));
        double[][] planes = new double[2][3];
        Draws.of(SEED, 1, 3).fillGaussian(planes, 0, 3, 0.5);
        assertArrayEquals(bulk, new double[] {planes[0][0], planes[0][1], planes[0][2], planes[1][0], planes[1][1],
            planes[1][2]}, 0.0);
        double[] columns = new double[6];
        Draws.of(SEED, 1, 3).fillGaussianColumns(columns, 0, 3, 2, 0.5);
        assertArrayEquals(new double[] {bulk[0], bulk[3], bulk[1], bulk[4], bulk[2], bulk[5]}, columns, 0.0);
    }

    /** Uniform labels of 4 and 6 bits, and the planar form for rows of two labels. */
    @Test
    void labels() {
        int[] four = new int[20];
        Draws.of(SEED, 2, 0).fillLabels(four, 0, 20, 4);
        assertArrayEquals(new int[] {2, 9, 1, 7, 13, 4, 13, 10, 13, 9, 9, 12, 2, 0, 3, 6, 0, 3, 12, 8}, four,
                Arrays.toString(four));
        int[] six = new int[12];
        Draws.of(SEED, 2, 1).fillLabels(six, 0, 12, 6);
        assertArrayEquals(new int[] {22, 38, 37, 16, 39, 15, 59, 47, 56, 30, 60, 24}, six, Arrays.toString(six));
        int[][] planes = new int[2][10];
        Draws.of(SEED, 2, 0).fillLabels(planes, 0, 10, 4);
        for (int i = 0; i < 10; i++) {
            assertEquals(four[2 * i], planes[0][i]);
            assertEquals(four[2 * i + 1], planes[1][i]);
        }
    }

    /** Fair bits, one per byte, across a 64-bit word boundary. */
    @Test
    void bits() {
        byte[] bits = new byte[70];
        Draws.of(SEED, 4, 0).fillBits(bits, 0, 70);
        StringBuilder s = new StringBuilder();
        for (byte b : bits) {
            s.append(b);
        }
        assertEquals("0010010101000101010110010011010110011110010010111100111100100101001010", s.toString());
    }
}
