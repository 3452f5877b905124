package org.fadebench.coding.stbc;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class CatalogueTest {

    /**
     * Sizes as published: Alamouti (IEEE JSAC 16(8), 1998) 2 Tx, K = T = 2; Tarokh, Jafarkhani and
     * Calderbank (IEEE Trans. Inf. Theory 45(5), 1999): G3, G4 are 8 x Mt with K = 4 (rate 1/2),
     * H3, H4 are 4 x Mt with K = 3 (rate 3/4), the generalised rate-1/2 designs for 5 to 8 Tx are
     * 16 x Mt with K = 8.
     */
    @ParameterizedTest
    @CsvSource({
        "none, 1, 1, 1", "alamouti, 2, 2, 2", "g3, 3, 4, 8", "g4, 4, 4, 8", "h3, 3, 3, 4",
        "h4, 4, 3, 4", "r12-5, 5, 8, 16", "r12-6, 6, 8, 16", "r12-7, 7, 8, 16", "r12-8, 8, 8, 16"})
    void publishedSizes(String name, int mt, int k, int t) {
        SpaceTimeCode code = SpaceTimeCodes.byName(name);
        assertEquals(name, code.name());
        assertEquals(mt, code.transmitAntennas());
        assertEquals(k, code.symbolsPerBlock());
        assertEquals(t, code.slotsPerBlock());
        assertEquals((double) k / t, code.rate(), 0.0);
    }

    @Test
    void catalogueListsEveryCodeOnce() {
        List<String> names = new ArrayList<>();
        SpaceTimeCodes.all().forEach(c -> names.add(c.name()));
        assertEquals(List.of("none", "alamouti", "g3", "g4", "h3", "h4", "r12-5", "r12-6", "r12-7", "r12-8"),
                names);
        assertEquals(String.join(", ", names), SpaceTimeCodes.choices());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> SpaceTimeCodes.byName("g5"));
        assertTrue(e.getMessage().contains("'g5'") && e.getMessage().contains(SpaceTimeCodes.choices()),
                e.getMessage());
    }

    /**
     * Orthogonal designs have full diversity: X(d)^H X(d) = c·‖d‖²·I is nonsingular for d ≠ 0
     * (Tarokh et al. 1999, with the rank criterion of Tarokh, Seshadri and Calderbank, IEEE Trans.
     * Inf. Theory 44(2), 1998).
     */
    @Test
    void everyCatalogueCodeIsOrthogonalWithFullDiversity() {
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            assertTrue(code.isOrthogonal(), code.name());
            assertTrue(code.hasFullDiversity(), code.name());
        }
    }

    /**
     * The checks can say no. Spatial multiplexing X = [s1 s2]/√2 (T = 1 < Mt = 2) is neither
     * orthogonal nor of full diversity. Spatial multiplexing over two slots, X = [s1 s2; s3 s4]/√2,
     * has T = Mt and X(d) of full rank for random d, but a difference in s1 alone gives a rank-one
     * matrix, so it fails the single-symbol part of the rank check (common practice, no source).
     */
    @Test
    void checksRejectSpatialMultiplexing() {
        SpaceTimeCode sm = TestCodes.spatialMultiplexing2x2();
        assertFalse(sm.isOrthogonal());
        assertFalse(sm.hasFullDiversity());
        SpaceTimeCode twoSlots = TestCodes.design("sm-2slot", Math.sqrt(0.5), "s1 s2", "s3 s4");
        assertFalse(twoSlots.isOrthogonal());
        assertFalse(twoSlots.hasFullDiversity());
        // a dispersion code with no zero-structure: full rank for all tested d, yet not orthogonal
        SpaceTimeCode random = TestCodes.randomCode(new Random(3), 2, 2, 2);
        assertFalse(random.isOrthogonal());
        assertTrue(random.hasFullDiversity());
    }

    /**
     * Power convention: average total energy per slot 1 with unit-energy symbols. Checked exactly
     * by averaging ‖X‖²_F / T over every QPSK block (all 4^K symbol vectors, points (±1 ± j)/√2),
     * encoded by the code's own encoder (no source needed: it is the definition).
     */
    @Test
    void everyCatalogueCodeSendsUnitEnergyPerSlot() {
        double q = Math.sqrt(0.5);
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            int k = code.symbolsPerBlock();
            int cells = code.slotsPerBlock() * code.transmitAntennas();
            StbcEncoder enc = code.newEncoder();
            double[] s = new double[2 * k];
            double[] x = new double[2 * cells];
            // Kahan summation over up to 65536 blocks keeps the rounding near one ulp
            double total = 0;
            double carry = 0;
            int blocks = 1 << (2 * k);
            for (int label = 0; label < blocks; label++) {
                for (int bit = 0; bit < 2 * k; bit++) {
                    s[bit] = ((label >>> bit) & 1) == 0 ? q : -q;
                }
                enc.encode(s, 0, 1, x, 0);
                double block = 0;
                for (double v : x) {
                    block += v * v;
                }
                double term = block - carry;
                double next = total + term;
                carry = (next - total) - term;
                total = next;
            }
            assertEquals(1.0, total / blocks / code.slotsPerBlock(), 1e-12, code.name());
            assertEquals(1.0, SpaceTimeCode.averageSlotEnergy(dispersions(code, true),
                    dispersions(code, false), code.slotsPerBlock()), 1e-12, code.name());
        }
    }

    static double[][] dispersions(SpaceTimeCode code, boolean real) {
        double[][] m = new double[code.symbolsPerBlock()][];
        for (int i = 0; i < m.length; i++) {
            m[i] = real ? code.realDispersion(i) : code.imagDispersion(i);
        }
        return m;
    }

    /**
     * Post-combining gain of an orthogonal code: with X^H X = c·Σ|s|²·I and c = T/(Mt·K), the
     * matched filter delivers each symbol with gain c·‖H‖²_F = ‖H‖²_F/(Mt·rate) (Tarokh et al.
     * 1999, decoding of orthogonal designs, with our power scale). All K gains, fast kernel and
     * general matched filter, 1 to 3 receive antennas.
     */
    @Test
    void matchedFilterGainIsChannelEnergyOverMtTimesRate() {
        Random rnd = new Random(17);
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            int mt = code.transmitAntennas();
            int k = code.symbolsPerBlock();
            for (int nr = 1; nr <= 3; nr++) {
                double[] h = TestCodes.gaussians(rnd, 2 * nr * mt, Math.sqrt(0.5));
                double norm2 = 0;
                for (double v : h) {
                    norm2 += v * v;
                }
                double[] y = TestCodes.gaussians(rnd, 2 * nr * code.slotsPerBlock(), 1);
                for (Combiner comb : new Combiner[] {code.newCombiner(nr), new MatchedFilterCombiner(code, nr)}) {
                    double[] est = new double[2 * k];
                    double[] gain = new double[k];
                    comb.setChannel(h);
                    comb.combine(y, 0, 1, est, gain, 0);
                    for (int i = 0; i < k; i++) {
                        assertEquals(norm2 / (mt * code.rate()), gain[i], 1e-12 * norm2, code.name());
                    }
                }
            }
        }
    }
}
