package org.fadebench.coding.stbc;

/** The general encoder: X = Σ_k (a_k A_k + b_k B_k), for any linear code. */
final class LinearEncoder implements StbcEncoder {

    private final SpaceTimeCode code;

    LinearEncoder(SpaceTimeCode code) {
        this.code = code;
    }

    @Override
    public void encode(double[] symbols, int symOffset, int blocks, double[] grid, int gridRow) {
        code.encodeGeneral(symbols, symOffset, blocks, grid, gridRow);
    }
}
