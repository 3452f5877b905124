package org.fadebench.coding.fec.ldpc;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class DegreeDistributionTest {

    @Test
    void regularEnsemblesHaveRateOneMinusDvOverDc() {
        // a regular (dv, dc) ensemble has n·dv = m·dc edges, so rate 1 − m/n = 1 − dv/dc
        // (R. G. Gallager, "Low-density parity-check codes", 1963, Chapter 2)
        assertEquals(0.5, DegreeDistribution.regular(3, 6).designRate(), 1e-15);
        assertEquals(2.0 / 3.0, DegreeDistribution.regular(3, 9).designRate(), 1e-15);
        assertEquals(0.75, DegreeDistribution.regular(4, 16).designRate(), 1e-15);
        assertEquals(0.25, DegreeDistribution.regular(3, 4).designRate(), 1e-15);
    }

    @Test
    void nodePerspectiveConvertsToEdgeFractions() {
        // half the variable nodes of degree 2, half of degree 3: edges 2·½ + 3·½ = 2.5 per node,
        // so λ_2 = 1/2.5 = 0.4 and λ_3 = 1.5/2.5 = 0.6 (Richardson, Shokrollahi, Urbanke, IEEE
        // Trans. Inf. Theory 47(2), 2001, Section I: λ_i = iΛ_i / Σ_k kΛ_k)
        double[] variableNodes = {0, 0, 0.5, 0.5};
        double[] checkNodes = {0, 0, 0, 0, 0, 0.25, 0.75}; // degrees 5 and 6
        DegreeDistribution d = DegreeDistribution.ofNodes(variableNodes, checkNodes);
        assertEquals(0.4, d.lambda(2), 1e-15);
        assertEquals(0.6, d.lambda(3), 1e-15);
        double checkEdges = 5 * 0.25 + 6 * 0.75;
        assertEquals(5 * 0.25 / checkEdges, d.rho(5), 1e-15);
        assertEquals(6 * 0.75 / checkEdges, d.rho(6), 1e-15);
        assertEquals(0.0, d.rho(7));
        // counting nodes instead: m/n = (mean variable degree) / (mean check degree)
        assertEquals(1.0 - 2.5 / checkEdges, d.designRate(), 1e-14);
        assertEquals(3, d.maxVariableDegree());
        assertEquals(6, d.maxCheckDegree());
    }

    @Test
    void trailingZeroWeightsDoNotChangeTheEnsemble() {
        DegreeDistribution d = DegreeDistribution.ofEdges(new double[] {0, 0, 0, 1, 0, 0},
                new double[] {0, 0, 0, 0, 0, 0, 1, 0});
        assertEquals(3, d.maxVariableDegree());
        assertEquals(6, d.maxCheckDegree());
        assertEquals(0.5, d.designRate(), 1e-15);
    }

    @Test
    void invalidWeightsAreRejectedWithTheProblemNamed() {
        double[] rho = {0, 0, 0, 0, 0, 0, 1};
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> DegreeDistribution.ofEdges(new double[] {0, 0, 1.2, -0.2}, rho));
        assertTrue(e.getMessage().contains("degree 3"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> DegreeDistribution.ofEdges(new double[] {0, 0, 0.5, 0.4}, rho));
        assertTrue(e.getMessage().contains("sum to"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> DegreeDistribution.ofEdges(new double[] {0, 0.5, 0.5}, rho));
        assertTrue(e.getMessage().contains("at least 2"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> DegreeDistribution.ofEdges(new double[] {0, 0, Double.NaN, 1}, rho));
        assertTrue(e.getMessage().contains("NaN"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> DegreeDistribution.regular(1, 6));
        assertThrows(IllegalArgumentException.class,
                () -> DegreeDistribution.ofNodes(new double[] {0, 0, 1}, new double[] {0, 0, 0.5}));
    }
}
