package org.fadebench.bench.perf;

import java.util.random.RandomGenerator;
import java.util.random.RandomGeneratorFactory;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.BoxMullerNormalizedGaussianSampler;
import org.apache.commons.rng.sampling.distribution.MarsagliaNormalizedGaussianSampler;
import org.apache.commons.rng.sampling.distribution.NormalizedGaussianSampler;
import org.apache.commons.rng.sampling.distribution.ZigguratNormalizedGaussianSampler;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.rng.simple.RandomSource;
import org.fadebench.channel.Draws;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * One idea: the cost of standard normal draws, which bound the whole simulation. {@code draw}
 * compares samplers by filling a buffer of 1024 draws, as the link fills a frame's noise (score:
 * draws per second); {@code alamouti2x2NoiseOnly} draws exactly the noise of 512 Alamouti 2x2
 * symbols (4 draws per symbol) through the simulator's own {@link Draws}, in symbols per second,
 * the yardstick for the full frame.
 */
public class NoiseBenchmark extends ThroughputBenchmark {

    private static final int N = 1024;
    private static final int SYMBOLS = 512;

    /** The simulator's own stream and a buffer the size of a frame's noise. */
    @State(Scope.Thread)
    public static class FrameNoise {
        final Draws draws = Draws.of(1, 2, 3);
        final double[] out = new double[4 * SYMBOLS];
    }

    /** One of the candidate samplers and the buffer it fills. */
    @State(Scope.Thread)
    public static class Candidate {
        @Param({"fadebench-ziggurat", "commons-ziggurat", "commons-ziggurat-old", "commons-marsaglia",
            "commons-boxmuller", "jdk17-xoshiro"})
        public String sampler;

        final double[] out = new double[N];
        NormalizedGaussianSampler commons;
        RandomGenerator jdk;
        Draws own;

        @Setup
        public void setUp() {
            UniformRandomProvider rng = RandomSource.XO_SHI_RO_256_PP.create(12345L);
            switch (sampler) {
                case "fadebench-ziggurat":
                    own = Draws.of(12345L);
                    break;
                case "commons-ziggurat":
                    commons = ZigguratSampler.NormalizedGaussian.of(rng);
                    break;
                case "commons-ziggurat-old":
                    commons = ZigguratNormalizedGaussianSampler.of(rng);
                    break;
                case "commons-marsaglia":
                    commons = MarsagliaNormalizedGaussianSampler.of(rng);
                    break;
                case "commons-boxmuller":
                    commons = BoxMullerNormalizedGaussianSampler.of(rng);
                    break;
                case "jdk17-xoshiro":
                    jdk = RandomGeneratorFactory.of("Xoshiro256PlusPlus").create(12345L);
                    break;
                default:
                    throw new IllegalArgumentException(sampler);
            }
        }

        /** Fills {@link #out} with standard normal draws: the simulator's kernel, or the same loop. */
        double[] fill() {
            if (own != null) {
                own.fillGaussian(out, 0, N, 1.0);
            } else if (jdk != null) {
                for (int i = 0; i < N; i++) {
                    out[i] = jdk.nextGaussian();
                }
            } else {
                for (int i = 0; i < N; i++) {
                    out[i] = commons.sample();
                }
            }
            return out;
        }
    }

    @Benchmark
    @OperationsPerInvocation(N)
    public double[] draw(Candidate c) {
        return c.fill();
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] alamouti2x2NoiseOnly(FrameNoise f) {
        f.draws.fillGaussian(f.out, 0, f.out.length, 1.0);
        return f.out;
    }
}
