package org.fadebench.coding.fec.conv;

import java.io.Serializable;
import java.util.Arrays;

/**
 * A binary feed-forward convolutional code of rate 1/n and constraint length K, given by its n
 * generator polynomials, terminated with K-1 zero tail bits.
 *
 * <p>Generator convention: the K bits of a generator, written most significant first (as in the
 * usual octal notation, e.g. 133 = 1 011 011), are the taps on the current input bit and then on
 * the K-1 previous ones. So the response of output i to a single 1 is generator i read from its
 * top bit down.
 *
 * <p>Trellis convention shared with {@link ViterbiDecoder}: the state holds the last K-1 inputs,
 * the newest in the top bit (bit K-2). With input u in state s the register is
 * {@code (u << (K-1)) | s} and the next state is that register shifted right by one.
 */
public final class ConvolutionalCode implements Serializable {

    private static final long serialVersionUID = 1L;

    /** Largest constraint length: decisions of one trellis step fit in one 64-bit word. */
    public static final int MAX_CONSTRAINT_LENGTH = 7;

    private static final int MAX_OUTPUTS = 8;

    /** The 64-state rate-1/2 code with generators (133, 171) in octal, K = 7. */
    public static final ConvolutionalCode K7_133_171 = ofOctal(7, "133", "171");

    /** The 4-state rate-1/2 code with generators (5, 7) in octal, K = 3. */
    public static final ConvolutionalCode K3_5_7 = ofOctal(3, "5", "7");

    private final int constraintLength;
    private final int[] generators;
    /** Output label of each register value: bit i is output i. */
    private final int[] labelOfRegister;

    /**
     * @param constraintLength K, from 2 to {@value #MAX_CONSTRAINT_LENGTH}
     * @param generators       n generator polynomials (1 to 8 of them), each in 1 .. 2^K - 1
     * @throws IllegalArgumentException naming the problem and the valid range
     */
    public ConvolutionalCode(int constraintLength, int... generators) {
        if (constraintLength < 2 || constraintLength > MAX_CONSTRAINT_LENGTH) {
            throw new IllegalArgumentException("constraint length " + constraintLength
                    + " not supported; valid: 2 to " + MAX_CONSTRAINT_LENGTH);
        }
        if (generators.length < 1 || generators.length > MAX_OUTPUTS) {
            throw new IllegalArgumentException(generators.length
                    + " generators given; valid: 1 to " + MAX_OUTPUTS + " (code rate 1/n)");
        }
        int registers = 1 << constraintLength;
        for (int g : generators) {
            if (g <= 0 || g >= registers) {
                throw new IllegalArgumentException("generator " + Integer.toOctalString(g)
                        + " (octal) does not fit constraint length " + constraintLength
                        + "; valid: 1 to " + Integer.toOctalString(registers - 1) + " (octal)");
            }
        }
        this.constraintLength = constraintLength;
        this.generators = generators.clone();
        this.labelOfRegister = new int[registers];
        for (int reg = 0; reg < registers; reg++) {
            int label = 0;
            for (int i = 0; i < generators.length; i++) {
                label |= (Integer.bitCount(reg & generators[i]) & 1) << i;
            }
            labelOfRegister[reg] = label;
        }
    }

    /**
     * A code from generators written in octal, e.g. {@code ofOctal(7, "133", "171")}.
     *
     * @throws IllegalArgumentException if a generator is not an octal number or does not fit
     */
    public static ConvolutionalCode ofOctal(int constraintLength, String... octalGenerators) {
        int[] g = new int[octalGenerators.length];
        for (int i = 0; i < g.length; i++) {
            try {
                g[i] = Integer.parseInt(octalGenerators[i].trim(), 8);
            } catch (NumberFormatException e) {
                throw new IllegalArgumentException("generator '" + octalGenerators[i]
                        + "' is not an octal number; valid digits: 0 to 7");
            }
        }
        return new ConvolutionalCode(constraintLength, g);
    }

    /** Constraint length K. */
    public int constraintLength() {
        return constraintLength;
    }

    /** Number of tail bits, K - 1. */
    public int tailBits() {
        return constraintLength - 1;
    }

    /** Number of outputs n per input bit. */
    public int outputs() {
        return generators.length;
    }

    /** Number of trellis states, 2^(K-1). */
    public int states() {
        return 1 << (constraintLength - 1);
    }

    /** The generator polynomials (a copy). */
    public int[] generators() {
        return generators.clone();
    }

    /** Trellis steps for k information bits: k + K - 1. */
    public int steps(int infoBits) {
        return infoBits + constraintLength - 1;
    }

    /** Coded bits before puncturing for k information bits: n (k + K - 1). */
    public int codedBits(int infoBits) {
        return outputs() * steps(infoBits);
    }

    /**
     * The output label of the branch leaving {@code state} with input {@code inputBit}: bit i of
     * the result is output i.
     */
    public int label(int state, int inputBit) {
        return labelOfRegister[(inputBit << (constraintLength - 1)) | state];
    }

    /**
     * Encodes {@code k} information bits from {@code info[off..]} followed by K-1 zero tail bits,
     * writing n (k + K - 1) coded bits to {@code out[outOff..]}: the n outputs of each step in
     * generator order.
     *
     * @return the number of coded bits written
     */
    public int encode(byte[] info, int off, int k, byte[] out, int outOff) {
        int n = outputs();
        int top = constraintLength - 1;
        int state = 0;
        int o = outOff;
        for (int t = 0, steps = steps(k); t < steps; t++) {
            int reg = t < k ? ((info[off + t] & 1) << top) | state : state;
            int label = labelOfRegister[reg];
            for (int i = 0; i < n; i++) {
                out[o++] = (byte) ((label >>> i) & 1);
            }
            state = reg >>> 1;
        }
        return o - outOff;
    }

    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder("K=").append(constraintLength).append(" (");
        for (int i = 0; i < generators.length; i++) {
            sb.append(i == 0 ? "" : ", ").append(Integer.toOctalString(generators[i]));
        }
        return sb.append(")_8").toString();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof ConvolutionalCode c && c.constraintLength == constraintLength
                && Arrays.equals(c.generators, generators);
    }

    @Override
    public int hashCode() {
        return 31 * constraintLength + Arrays.hashCode(generators);
    }
}
