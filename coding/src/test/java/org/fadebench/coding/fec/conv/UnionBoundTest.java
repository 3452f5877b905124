package org.fadebench.coding.fec.conv;

import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.rng.simple.RandomSource;
import org.apache.commons.statistics.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;

/**
 * The 64-state (133, 171) code at rate 1/2 with BPSK in AWGN and soft-decision Viterbi decoding,
 * against the union bound on the bit error probability of maximum likelihood decoding:
 * P_b ≤ Σ_d c_d Q(√(2 d R Eb/N0)) (J. G. Proakis and M. Salehi, Digital Communications, 5th ed.,
 * 2008, Sec. 8.2; from memory). The information weights c_d come from
 * {@link TrellisSearch#spectrum} up to d = 40 (checked against the published c_10 .. c_18 in
 * {@link ConvolutionalCodeTest}). The terms from d = 42 to 50 would add about 3 % at 3 dB and
 * 0.1 % at 3.5 dB; leaving out the tail only lowers the bound, so "below the bound" is checked
 * conservatively.
 *
 * <p>Statistics: frames of 2000 information bits are independent, the bit errors inside a frame
 * are not (they come in error events of several bits). So the interval for the BER is built from
 * the per-frame error counts (central limit theorem over frames, as in batch means): BER ± 3
 * standard errors, standard error = sample standard deviation of the per-frame error fraction /
 * √frames. Each check also demands at least 80 frames in error so the normal approximation holds.
 * A 3-sigma limit is crossed by chance with probability 0.13 % per side; seeds are fixed, so the
 * test is deterministic.
 *
 * <p>Choice of SNR. At 4 dB the union bound is already tight: 200 000 frames (4e8 bits, seed 401)
 * gave BER 1.733e-5 with a standard error of 0.050e-5 against the bound 1.878e-5, i.e. 0.92 of
 * the bound and 2.9 standard errors below it; a 3-sigma check there needs more than 250 000 frames
 * (about 20 s), and at 5 dB (bound ≈ 4.5e-7) about 3e9 bits. So the two claims are checked where
 * each is decidable in about a second: "below the bound" at 3 dB, where the bound is loose (BER ≈
 * 4.1e-4 against 8.5e-4), and "within a factor of 2" at 3.5 dB (BER ≈ 9.1e-5 against 1.15e-4).
 */
class UnionBoundTest {

    private static final ConvolutionalCode CODE = ConvolutionalCode.K7_133_171;
    private static final double RATE = 0.5;
    private static final int INFO_BITS = 2000;
    private static final double Z = 3;
    private static final int LANES = 128;
    private static final long[] C_D = TrellisSearch.spectrum(CODE, 40)[1];

    @Test
    void simulatedBerIsBelowTheBoundAt3dB() {
        double[] ber = simulate(3.0, 1000, 301);
        double bound = unionBound(3.0);
        assertTrue(ber[2] < bound, String.format("BER %.3e, upper limit %.3e, bound %.3e", ber[0], ber[2], bound));
    }

    @Test
    void simulatedBerIsWithinFactorTwoOfTheBoundAt3p5dB() {
        double[] ber = simulate(3.5, 3000, 352);
        double bound = unionBound(3.5);
        String detail = String.format("BER %.3e in [%.3e, %.3e], bound %.3e", ber[0], ber[1], ber[2], bound);
        assertTrue(ber[1] > bound / 2, detail);
        assertTrue(ber[2] < 2 * bound, detail);
    }

    private static double unionBound(double ebN0Db) {
        double ebN0 = Math.pow(10, ebN0Db / 10);
        NormalDistribution normal = NormalDistribution.of(0, 1);
        double sum = 0;
        for (int d = 0; d < C_D.length; d++) {
            sum += C_D[d] * normal.survivalProbability(Math.sqrt(2 * d * RATE * ebN0));
        }
        return sum;
    }

    /**
     * BPSK (bit 0 → +1), Es = 1, noise variance σ² = N0/2 = 1 / (2 R Eb/N0) per real dimension, LLR
     * = 2y/σ² (common practice, no source). Returns {BER, lower limit, upper limit}.
     */
    private static double[] simulate(double ebN0Db, int frames, long seed) {
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(seed);
        ZigguratSampler.NormalizedGaussian gaussian = ZigguratSampler.NormalizedGaussian.of(rng);
        double sigma = Math.sqrt(1 / (2 * RATE * Math.pow(10, ebN0Db / 10)));
        double llrScale = 2 / (sigma * sigma);
        byte[][] info = new byte[LANES][INFO_BITS];
        byte[] coded = new byte[CODE.codedBits(INFO_BITS)];
        double[] llr = new double[coded.length];
        byte[] decided = new byte[INFO_BITS];
        ViterbiDecoder decoder = new ViterbiDecoder(CODE, INFO_BITS, LANES);
        double sum = 0;
        double sumSquares = 0;
        int framesInError = 0;
        for (int done = 0; done < frames; done += LANES) {
            int group = Math.min(LANES, frames - done);
            for (int lane = 0; lane < group; lane++) {
                for (int i = 0; i < INFO_BITS; i++) {
                    info[lane][i] = (byte) (rng.nextInt() & 1);
                }
                CODE.encode(info[lane], 0, INFO_BITS, coded, 0);
                for (int i = 0; i < coded.length; i++) {
                    llr[i] = llrScale * (1 - 2 * coded[i] + sigma * gaussian.sample());
                }
                decoder.load(lane, llr, 0);
            }
            decoder.decode(group);
            for (int lane = 0; lane < group; lane++) {
                decoder.decided(lane, decided, 0);
                int errors = 0;
                for (int i = 0; i < INFO_BITS; i++) {
                    errors += decided[i] ^ info[lane][i];
                }
                double fraction = (double) errors / INFO_BITS;
                sum += fraction;
                sumSquares += fraction * fraction;
                framesInError += errors > 0 ? 1 : 0;
            }
        }
        assertTrue(framesInError >= 80, "only " + framesInError + " frames in error at " + ebN0Db + " dB");
        double mean = sum / frames;
        double variance = (sumSquares - frames * mean * mean) / (frames - 1);
        double standardError = Math.sqrt(variance / frames);
        return new double[] {mean, mean - Z * standardError, mean + Z * standardError};
    }
}
