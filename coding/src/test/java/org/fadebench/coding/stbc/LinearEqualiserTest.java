package org.fadebench.coding.stbc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class LinearEqualiserTest {

    /** Non-orthogonal test codes: spatial multiplexing and a random dispersion code (T·Nr ≥ K at Nr = 2). */
    private static SpaceTimeCode[] nonOrthogonalCodes() {
        return new SpaceTimeCode[] {TestCodes.spatialMultiplexing2x2(), TestCodes.randomCode(new Random(7), 2, 3, 2)};
    }

    private static double[] combine(Combiner c, double[] h, double[] y, int k, int blocks, double[] gain) {
        double[] est = new double[2 * k * blocks];
        c.setChannel(h);
        c.combine(y, 0, blocks, est, gain, 0);
        return est;
    }

    /**
     * On an orthogonal code FᵀF = g·I, so (FᵀF)⁻¹Fᵀy = Fᵀy/g and the unbiased MMSE estimate
     * ((g + n0)⁻¹Fᵀy divided by β = g/(g + n0)) is Fᵀy/g as well, with gain g in all three (linear
     * algebra on the definitions; common practice, no source). Random channels and received grids.
     */
    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3})
    void zfAndMmseEqualMatchedFilterOnOrthogonalCodes(int nr) {
        Random rnd = new Random(40 + nr);
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            int k = code.symbolsPerBlock();
            int blocks = 2;
            Combiner mf = new MatchedFilterCombiner(code, nr);
            Combiner zf = LinearEqualiser.zeroForcing(code, nr);
            Combiner mmse = LinearEqualiser.mmse(code, nr, 0.37);
            for (int trial = 0; trial < 20; trial++) {
                double[] h = TestCodes.gaussians(rnd, 2 * nr * code.transmitAntennas(), Math.sqrt(0.5));
                double[] y = TestCodes.gaussians(rnd, 2 * nr * code.slotsPerBlock() * blocks, 1);
                double[] g0 = new double[k * blocks];
                double[] e0 = combine(mf, h, y, k, blocks, g0);
                for (Combiner other : new Combiner[] {zf, mmse}) {
                    double[] g = new double[k * blocks];
                    double[] e = combine(other, h, y, k, blocks, g);
                    assertArrayEquals(e0, e, 1e-10, code.name());
                    assertArrayEquals(g0, g, 1e-10 * g0[0], code.name());
                }
            }
        }
    }

    /** The factory serves every decoder with the matched filter on orthogonal codes only. */
    @Test
    void factoryPicksTheEqualiserForNonOrthogonalCodes() {
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            for (Equaliser d : Equaliser.values()) {
                assertEquals(code.newCombiner(2).getClass(), code.newCombiner(2, d, 0.1).getClass(), code.name());
            }
        }
        SpaceTimeCode sm = TestCodes.spatialMultiplexing2x2();
        assertInstanceOf(MatchedFilterCombiner.class, sm.newCombiner(2, Equaliser.MF, 0.1));
        assertInstanceOf(LinearEqualiser.class, sm.newCombiner(2, Equaliser.ZF, 0.1));
        assertInstanceOf(LinearEqualiser.class, sm.newCombiner(2, Equaliser.MMSE, 0.1));
    }

    /** Without noise ZF inverts the effective channel exactly; MMSE with n0 = 0 is ZF. */
    @Test
    void zeroForcingRecoversSymbolsWithoutNoise() {
        Random rnd = new Random(11);
        for (SpaceTimeCode code : nonOrthogonalCodes()) {
            int mt = code.transmitAntennas();
            int k = code.symbolsPerBlock();
            int t = code.slotsPerBlock();
            int blocks = 4;
            for (int nr = 2; nr <= 3; nr++) {
                double[] s = TestCodes.gaussians(rnd, 2 * k * blocks, 1);
                double[] x = new double[2 * t * mt * blocks];
                code.newEncoder().encode(s, 0, blocks, x, 0);
                double[] h = TestCodes.gaussians(rnd, 2 * nr * mt, Math.sqrt(0.5));
                double[] y = TestCodes.receive(x, h, nr, mt, t * blocks);
                for (Combiner c : new Combiner[] {LinearEqualiser.zeroForcing(code, nr),
                                                  LinearEqualiser.mmse(code, nr, 0.0)}) {
                    assertArrayEquals(s, combine(c, h, y, k, blocks, new double[k * blocks]), 1e-10, code.name());
                }
            }
        }
    }

    /**
     * The effective channel built independently: column j of F is the received image of the unit
     * symbol vector e_j, encoded by the code's encoder and passed through Y = X Hᵀ.
     */
    private static DMatrixRMaj effectiveChannel(SpaceTimeCode code, double[] h, int nr) {
        int k = code.symbolsPerBlock();
        int t = code.slotsPerBlock();
        int mt = code.transmitAntennas();
        DMatrixRMaj f = new DMatrixRMaj(2 * t * nr, 2 * k);
        for (int j = 0; j < 2 * k; j++) {
            double[] v = new double[2 * k];
            v[j] = 1;
            double[] x = new double[2 * t * mt];
            code.newEncoder().encode(v, 0, 1, x, 0);
            double[] col = TestCodes.receive(x, h, nr, mt, t);
            for (int row = 0; row < col.length; row++) {
                f.set(row, j, col[row]);
            }
        }
        return f;
    }

    /**
     * ZF against direct EJML algebra: estimates equal the pseudo-inverse solution pinv(F)·y, and the
     * gain is 2/(P_aa + P_bb) with P = (FᵀF)⁻¹ (LU inverse), since the estimate's noise covariance
     * is (n0/2)·P for real noise of variance n0/2 (decorrelator noise enhancement; D. Tse and
     * P. Viswanath, Fundamentals of Wireless Communication, 2005, Sec. 8.3.1; from memory).
     */
    @Test
    void zeroForcingMatchesDirectLinearAlgebra() {
        Random rnd = new Random(12);
        for (SpaceTimeCode code : nonOrthogonalCodes()) {
            int k = code.symbolsPerBlock();
            for (int nr = 2; nr <= 3; nr++) {
                LinearEqualiser zf = LinearEqualiser.zeroForcing(code, nr);
                for (int trial = 0; trial < 10; trial++) {
                    double[] h = TestCodes.gaussians(rnd, 2 * nr * code.transmitAntennas(), Math.sqrt(0.5));
                    double[] y = TestCodes.gaussians(rnd, 2 * nr * code.slotsPerBlock(), 1);
                    double[] gain = new double[k];
                    double[] est = combine(zf, h, y, k, 1, gain);

                    DMatrixRMaj f = effectiveChannel(code, h, nr);
                    DMatrixRMaj pinv = new DMatrixRMaj(1, 1);
                    CommonOps_DDRM.pinv(f, pinv);
                    DMatrixRMaj u = new DMatrixRMaj(2 * k, 1);
                    CommonOps_DDRM.mult(pinv, DMatrixRMaj.wrap(y.length, 1, y), u);
                    DMatrixRMaj p = new DMatrixRMaj(2 * k, 2 * k);
                    CommonOps_DDRM.multTransA(f, f, p);
                    CommonOps_DDRM.invert(p);
                    for (int i = 0; i < k; i++) {
                        assertEquals(u.get(2 * i), est[2 * i], 1e-9, code.name());
                        assertEquals(u.get(2 * i + 1), est[2 * i + 1], 1e-9, code.name());
                        double expected = 2 / (p.get(2 * i, 2 * i) + p.get(2 * i + 1, 2 * i + 1));
                        assertEquals(expected, gain[i], 1e-9 * expected, code.name());
                    }
                }
            }
        }
    }

    /**
     * MMSE against direct EJML algebra. Estimates: u = (FᵀF + n0·I)⁻¹Fᵀy, each entry divided by
     * its bias β_i = [(FᵀF + n0·I)⁻¹FᵀF]_ii formed as a matrix product. Gain: from the SINR of the
     * linear MMSE receiver for real dimension i, SINR_i = σ_v² f_iᵀ(σ_n² I + σ_v² Σ_{j≠i} f_j f_jᵀ)⁻¹f_i
     * (Tse and Viswanath 2005, Sec. 8.3.3; from memory) with σ_v² = 1/2 and σ_n² = n0/2: the unbiased
     * estimate's complex error variance is (1/2)(1/SINR_a + 1/SINR_b) = n0/g.
     */
    @Test
    void mmseMatchesDirectLinearAlgebra() {
        Random rnd = new Random(13);
        for (SpaceTimeCode code : nonOrthogonalCodes()) {
            int k = code.symbolsPerBlock();
            for (int nr = 1; nr <= 3; nr++) {
                for (double n0 : new double[] {0.05, 0.5, 2.0}) {
                    LinearEqualiser mmse = LinearEqualiser.mmse(code, nr, n0);
                    double[] h = TestCodes.gaussians(rnd, 2 * nr * code.transmitAntennas(), Math.sqrt(0.5));
                    double[] y = TestCodes.gaussians(rnd, 2 * nr * code.slotsPerBlock(), 1);
                    double[] gain = new double[k];
                    double[] est = combine(mmse, h, y, k, 1, gain);

                    DMatrixRMaj f = effectiveChannel(code, h, nr);
                    DMatrixRMaj gram = new DMatrixRMaj(2 * k, 2 * k);
                    CommonOps_DDRM.multTransA(f, f, gram);
                    DMatrixRMaj m = gram.copy();
                    for (int i = 0; i < 2 * k; i++) {
                        m.add(i, i, n0);
                    }
                    CommonOps_DDRM.invert(m);
                    DMatrixRMaj bias = new DMatrixRMaj(2 * k, 2 * k);
                    CommonOps_DDRM.mult(m, gram, bias);
                    DMatrixRMaj fty = new DMatrixRMaj(2 * k, 1);
                    CommonOps_DDRM.multTransA(f, DMatrixRMaj.wrap(y.length, 1, y), fty);
                    DMatrixRMaj u = new DMatrixRMaj(2 * k, 1);
                    CommonOps_DDRM.mult(m, fty, u);
                    double[] sinr = new double[2 * k];
                    for (int i = 0; i < 2 * k; i++) {
                        assertEquals(u.get(i) / bias.get(i, i), est[i], 1e-9, code.name());
                        sinr[i] = mmseSinr(f, i, n0);
                    }
                    for (int i = 0; i < k; i++) {
                        double expected = 2 * n0 / (1 / sinr[2 * i] + 1 / sinr[2 * i + 1]);
                        assertEquals(expected, gain[i], 1e-9 * expected, code.name() + " n0=" + n0);
                    }
                }
            }
        }
    }

    private static double mmseSinr(DMatrixRMaj f, int i, double n0) {
        int n = f.numRows;
        DMatrixRMaj cov = CommonOps_DDRM.identity(n);
        CommonOps_DDRM.scale(n0 / 2, cov);
        for (int j = 0; j < f.numCols; j++) {
            if (j == i) {
                continue;
            }
            for (int r = 0; r < n; r++) {
                for (int c = 0; c < n; c++) {
                    cov.add(r, c, 0.5 * f.get(r, j) * f.get(c, j));
                }
            }
        }
        CommonOps_DDRM.invert(cov);
        DMatrixRMaj fi = CommonOps_DDRM.extractColumn(f, i, null);
        DMatrixRMaj tmp = new DMatrixRMaj(n, 1);
        CommonOps_DDRM.mult(cov, fi, tmp);
        return 0.5 * CommonOps_DDRM.dot(fi, tmp);
    }

    /**
     * The Combiner contract by simulation: ŝ_k = s_k + w_k with E[w_k] = 0 and E|w_k|² = n0/g_k,
     * for ZF and MMSE on a fixed channel, QPSK symbols and Gaussian noise, N = 20000 blocks. Each
     * sample mean is compared with its expectation within 4.42 standard errors (the sample
     * standard deviation over √N): a two-sided 1e-5 normal interval per check.
     */
    @Test
    void estimatesAreUnbiasedWithTheReportedErrorVariance() {
        Random rnd = new Random(14);
        int nr = 2;
        int blocks = 20000;
        double n0 = 0.5;
        double z = 4.42;
        double q = Math.sqrt(0.5);
        for (SpaceTimeCode code : nonOrthogonalCodes()) {
            int mt = code.transmitAntennas();
            int k = code.symbolsPerBlock();
            int t = code.slotsPerBlock();
            double[] h = TestCodes.gaussians(rnd, 2 * nr * mt, Math.sqrt(0.5));
            double[] s = new double[2 * k * blocks];
            for (int i = 0; i < s.length; i++) {
                s[i] = rnd.nextBoolean() ? q : -q;
            }
            double[] x = new double[2 * t * mt * blocks];
            code.newEncoder().encode(s, 0, blocks, x, 0);
            double[] y = TestCodes.receive(x, h, nr, mt, t * blocks);
            for (int i = 0; i < y.length; i++) {
                y[i] += Math.sqrt(n0 / 2) * rnd.nextGaussian();
            }
            for (LinearEqualiser eq : new LinearEqualiser[] {LinearEqualiser.zeroForcing(code, nr),
                                                             LinearEqualiser.mmse(code, nr, n0)}) {
                double[] gain = new double[k * blocks];
                double[] est = combine(eq, h, y, k, blocks, gain);
                for (int sym = 0; sym < k; sym++) {
                    double[] re = new double[blocks];
                    double[] im = new double[blocks];
                    double[] power = new double[blocks];
                    double[] ownRe = new double[blocks];
                    double[] ownIm = new double[blocks];
                    for (int b = 0; b < blocks; b++) {
                        int idx = b * k + sym;
                        re[b] = est[2 * idx] - s[2 * idx];
                        im[b] = est[2 * idx + 1] - s[2 * idx + 1];
                        power[b] = re[b] * re[b] + im[b] * im[b];
                        ownRe[b] = re[b] * s[2 * idx];
                        ownIm[b] = im[b] * s[2 * idx + 1];
                    }
                    String what = code.name() + " symbol " + sym;
                    assertWithin(0.0, re, z, what + " re mean error");
                    assertWithin(0.0, im, z, what + " im mean error");
                    // unbiased given the symbol: the error is uncorrelated with the symbol itself
                    // (a biased MMSE estimate would give −(1 − β)/2 here)
                    assertWithin(0.0, ownRe, z, what + " re bias");
                    assertWithin(0.0, ownIm, z, what + " im bias");
                    assertWithin(n0 / gain[sym], power, z, what + " error power");
                }
            }
        }
    }

    private static void assertWithin(double expected, double[] samples, double z, String what) {
        double mean = 0;
        for (double v : samples) {
            mean += v;
        }
        mean /= samples.length;
        double var = 0;
        for (double v : samples) {
            var += (v - mean) * (v - mean);
        }
        double se = Math.sqrt(var / (samples.length - 1) / samples.length);
        assertEquals(expected, mean, z * se, what);
    }

    /** A channel that carries nothing: ZF cannot factor FᵀF and reports zero estimates and gains. */
    @Test
    void zeroChannelGivesZeroGains() {
        SpaceTimeCode sm = TestCodes.spatialMultiplexing2x2();
        double[] gain = {9, 9};
        double[] est = combine(LinearEqualiser.zeroForcing(sm, 2), new double[8], new double[] {1, 2, 3, 4}, 2, 1, gain);
        assertArrayEquals(new double[4], est, 0.0);
        assertArrayEquals(new double[2], gain, 0.0);
    }

    @Test
    void badConfigurationsAreRejectedWithTheValidChoices() {
        SpaceTimeCode sm = TestCodes.spatialMultiplexing2x2();
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> sm.newCombiner(1, Equaliser.ZF, 0.1));
        assertTrue(e.getMessage().contains("decoder zf") && e.getMessage().contains("sm2")
                && e.getMessage().contains("at least 2 receive antennas"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> LinearEqualiser.mmse(sm, 1, 0.0));
        LinearEqualiser.mmse(sm, 1, 0.1);
        for (double bad : new double[] {-0.1, Double.NaN, Double.POSITIVE_INFINITY}) {
            e = assertThrows(IllegalArgumentException.class, () -> sm.newCombiner(2, Equaliser.MMSE, bad));
            assertTrue(e.getMessage().contains("n0") && e.getMessage().contains("valid"), e.getMessage());
            assertThrows(IllegalArgumentException.class,
                    () -> SpaceTimeCodes.ALAMOUTI.newCombiner(2, Equaliser.MMSE, bad));
        }
        for (Equaliser d : Equaliser.values()) {
            e = assertThrows(IllegalArgumentException.class, () -> SpaceTimeCodes.G3.newCombiner(0, d, 0.1));
            assertTrue(e.getMessage().contains("receive antennas"), e.getMessage());
        }
        assertThrows(IllegalArgumentException.class, () -> new MatchedFilterCombiner(sm, 0));
    }

    @Test
    void decoderNames() {
        assertEquals(Equaliser.ZF, Equaliser.fromCliName(" ZF "));
        assertEquals(Equaliser.MMSE, Equaliser.fromCliName("mmse"));
        assertEquals(Equaliser.MF, Equaliser.fromCliName("mf"));
        assertEquals("mf, zf, mmse", Equaliser.choices());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Equaliser.fromCliName("ml"));
        assertEquals("unknown decoder 'ml'; valid: mf, zf, mmse", e.getMessage());
    }
}
