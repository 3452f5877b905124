package org.fadebench.coding.stbc;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class CombinerAgreementTest {

    /** The specialised kernels encode exactly as the general dispersion-matrix formula. */
    @Test
    void kernelsEncodeLikeDispersionForm() {
        Random rnd = new Random(1);
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            int blocks = 5;
            double[] s = TestCodes.gaussians(rnd, 2 * code.symbolsPerBlock() * blocks + 2, 1);
            int rows = code.slotsPerBlock() * blocks;
            double[] fast = new double[2 * code.transmitAntennas() * (rows + 1)];
            double[] general = fast.clone();
            code.newEncoder().encode(s, 1, blocks, fast, 1);
            new LinearEncoder(code).encode(s, 1, blocks, general, 1);
            assertArrayEquals(general, fast, 1e-15, code.name());
        }
    }

    /**
     * The planar Alamouti encoder and combiner give exactly the interleaved ones' numbers (the
     * planes are the interleaved arrays read as rows of one code block); an exact claim, checked
     * without tolerance.
     */
    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3, 4})
    void alamoutiPlanarEqualsInterleaved(int nr) {
        Random rnd = new Random(200 + nr);
        int blocks = 9;
        int from = 3;
        double[] s = TestCodes.gaussians(rnd, 4 * blocks, 1);
        double[] x = new double[8 * blocks];
        AlamoutiKernel.encode(s, 0, blocks, x, 0);
        AlamoutiKernel kernel = new AlamoutiKernel(nr);
        double[][] xPlanes = new double[8][from + blocks];
        kernel.encode(planes(s, 4, from), from, blocks, xPlanes);
        assertPlanesEqual(x, xPlanes, from);

        double[] h = TestCodes.gaussians(rnd, 4 * nr, Math.sqrt(0.5));
        double[] y = TestCodes.gaussians(rnd, 4 * nr * blocks, 1.3);
        kernel.setChannel(h);
        double[] est = new double[4 * blocks];
        kernel.combine(y, 0, blocks, est, new double[2 * blocks], 0);
        double[][] estPlanes = new double[4][from + blocks];
        kernel.combine(planes(y, 4 * nr, from), from, blocks, estPlanes);
        assertPlanesEqual(est, estPlanes, from);
    }

    /** Rows of {@code width} values of {@code a} as planes, row i at element {@code from + i}. */
    private static double[][] planes(double[] a, int width, int from) {
        double[][] p = new double[width][from + a.length / width];
        for (int i = 0; i < a.length; i++) {
            p[i % width][from + i / width] = a[i];
        }
        return p;
    }

    private static void assertPlanesEqual(double[] interleaved, double[][] planes, int from) {
        double[][] expected = planes(interleaved, planes.length, from);
        for (int j = 0; j < planes.length; j++) {
            assertArrayEquals(expected[j], planes[j], "plane " + j);
        }
    }

    /**
     * Alamouti's kernel and the single-antenna MRC kernel agree with the general EJML matched
     * filter to 1e-12 on random channels and noise, for 1 to 4 receive antennas.
     */
    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3, 4})
    void kernelsAgreeWithGeneralMatchedFilter(int nr) {
        Random rnd = new Random(100 + nr);
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            int mt = code.transmitAntennas();
            int k = code.symbolsPerBlock();
            int t = code.slotsPerBlock();
            Combiner fast = code.newCombiner(nr);
            Combiner general = new MatchedFilterCombiner(code, nr);
            int blocks = 3;
            for (int trial = 0; trial < 200; trial++) {
                double[] h = TestCodes.gaussians(rnd, 2 * nr * mt, Math.sqrt(0.5));
                double[] y = TestCodes.gaussians(rnd, 2 * nr * t * blocks, 1.3);
                double[] e1 = new double[2 * k * blocks];
                double[] e2 = new double[2 * k * blocks];
                double[] g1 = new double[k * blocks];
                double[] g2 = new double[k * blocks];
                fast.setChannel(h);
                general.setChannel(h);
                fast.combine(y, 0, blocks, e1, g1, 0);
                general.combine(y, 0, blocks, e2, g2, 0);
                assertArrayEquals(e2, e1, 1e-12, code.name());
                assertArrayEquals(g2, g1, 1e-12, code.name());
            }
        }
    }

    /**
     * Tarokh, Jafarkhani and Calderbank (IEEE Trans. Inf. Theory 45(5), 1999), definition of a
     * complex orthogonal design: X^H X = c·(Σ_k |s_k|²)·I. With our power convention
     * c = T / (Mt·K), so the average total energy per slot is 1 for unit-energy symbols.
     */
    @Test
    void catalogueCodesAreOrthogonalWithTheConventionScale() {
        Random rnd = new Random(5);
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            int mt = code.transmitAntennas();
            int k = code.symbolsPerBlock();
            int t = code.slotsPerBlock();
            double c = (double) t / (mt * k);
            for (int trial = 0; trial < 50; trial++) {
                double[] s = TestCodes.gaussians(rnd, 2 * k, 1);
                double energy = 0;
                for (double v : s) {
                    energy += v * v;
                }
                double[] x = new double[2 * t * mt];
                code.encodeGeneral(s, 0, 1, x, 0);
                for (int i = 0; i < mt; i++) {
                    for (int j = 0; j < mt; j++) {
                        double re = 0;
                        double im = 0;
                        for (int slot = 0; slot < t; slot++) {
                            double ar = x[2 * (slot * mt + i)];
                            double ai = -x[2 * (slot * mt + i) + 1];
                            double br = x[2 * (slot * mt + j)];
                            double bi = x[2 * (slot * mt + j) + 1];
                            re += ar * br - ai * bi;
                            im += ar * bi + ai * br;
                        }
                        assertEquals(i == j ? c * energy : 0.0, re, 1e-12, code.name() + " (" + i + "," + j + ")");
                        assertEquals(0.0, im, 1e-12, code.name());
                    }
                }
            }
        }
    }

    /** Without noise every combiner returns the sent symbols exactly. */
    @Test
    void noiselessRecovery() {
        Random rnd = new Random(9);
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            int nr = 2;
            int mt = code.transmitAntennas();
            int k = code.symbolsPerBlock();
            int t = code.slotsPerBlock();
            double[] s = TestCodes.gaussians(rnd, 2 * k, 1);
            double[] x = new double[2 * t * mt];
            code.newEncoder().encode(s, 0, 1, x, 0);
            double[] h = TestCodes.gaussians(rnd, 2 * nr * mt, 1);
            double[] y = TestCodes.receive(x, h, nr, mt, t);
            Combiner comb = code.newCombiner(nr);
            comb.setChannel(h);
            double[] est = new double[2 * k];
            double[] gain = new double[k];
            comb.combine(y, 0, 1, est, gain, 0);
            assertArrayEquals(s, est, 1e-12, code.name());
            double norm2 = 0;
            for (double v : h) {
                norm2 += v * v;
            }
            // post-combining gain ‖H‖²/(Mt·rate) (SNR convention; README)
            assertEquals(norm2 / (mt * code.rate()), gain[0], 1e-12, code.name());
        }
    }
}
