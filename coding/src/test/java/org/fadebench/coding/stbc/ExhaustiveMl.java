package org.fadebench.coding.stbc;

import org.fadebench.modem.QamConstellation;

/**
 * Joint maximum-likelihood decoding by exhaustive search, a test reference: for one received
 * block Y (T x Nr) and channel H, the symbol labels that minimise ‖Y − X(s)Hᵀ‖²_F over all M^K
 * symbol vectors, which is ML for white Gaussian noise (e.g. J. G. Proakis and M. Salehi, Digital
 * Communications, 5th ed., 2008, optimum detection in AWGN). Linearity of the code lets the search
 * add precomputed per-symbol received images, depth first.
 */
final class ExhaustiveMl {

    private final SpaceTimeCode code;
    private final int nr;
    private final int order;
    private final double[][] points;
    /** images[k][m]: received grid of symbol k alone, at constellation point m. */
    private final double[][][] images;
    private final double[][] partial;
    private final int[] trial;
    private final int[] best;
    private double bestMetric;

    ExhaustiveMl(SpaceTimeCode code, QamConstellation constellation, int nr) {
        this.code = code;
        this.nr = nr;
        this.order = constellation.modulation().order();
        this.points = new double[order][2];
        for (int m = 0; m < order; m++) {
            constellation.point(m, points[m]);
        }
        int k = code.symbolsPerBlock();
        this.images = new double[k][order][];
        this.partial = new double[k + 1][2 * code.slotsPerBlock() * nr];
        this.trial = new int[k];
        this.best = new int[k];
    }

    /** Labels of the ML symbol vector for the block at row {@code yRow} of {@code y}. */
    int[] decide(double[] h, double[] y, int yRow) {
        int k = code.symbolsPerBlock();
        int t = code.slotsPerBlock();
        int mt = code.transmitAntennas();
        for (int i = 0; i < k; i++) {
            for (int m = 0; m < order; m++) {
                double[] s = new double[2 * k];
                s[2 * i] = points[m][0];
                s[2 * i + 1] = points[m][1];
                double[] x = new double[2 * t * mt];
                code.encodeGeneral(s, 0, 1, x, 0);
                images[i][m] = TestCodes.receive(x, h, nr, mt, t);
            }
        }
        bestMetric = Double.POSITIVE_INFINITY;
        search(0, y, 2 * yRow * nr);
        return best.clone();
    }

    private void search(int depth, double[] y, int yo) {
        double[] from = partial[depth];
        double[] to = partial[depth + 1];
        boolean leaf = depth + 1 == trial.length;
        for (int m = 0; m < order; m++) {
            double[] img = images[depth][m];
            trial[depth] = m;
            for (int i = 0; i < to.length; i++) {
                to[i] = from[i] + img[i];
            }
            if (!leaf) {
                search(depth + 1, y, yo);
                continue;
            }
            double metric = 0;
            for (int i = 0; i < to.length; i++) {
                double d = y[yo + i] - to[i];
                metric += d * d;
            }
            if (metric < bestMetric) {
                bestMetric = metric;
                System.arraycopy(trial, 0, best, 0, trial.length);
            }
        }
    }
}
