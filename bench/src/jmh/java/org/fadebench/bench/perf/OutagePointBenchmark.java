package org.fadebench.bench.perf;

import org.fadebench.bench.analysis.BoundPoint;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.channel.OutageEstimate;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.MutualInformation;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Setup;

/**
 * One idea: the cost of one 4x4 point of the Monte Carlo MIMO outage bound (i.i.d. Rayleigh,
 * R = 8 bits per channel use, 15 dB), as {@code BoundCurves} computes it. Score: channel draws per
 * second on one thread; a point of {@link BoundSettings#DEFAULT_MIMO_DRAWS} draws takes
 * DEFAULT_MIMO_DRAWS / score seconds.
 */
public class OutagePointBenchmark extends ThroughputBenchmark {

    private static final int DRAWS = 10_000;

    /** Frames of the block-fading point: 33 blocks each, so 33 x this many channel draws. */
    private static final int FRAMES = 1_000;

    private BoundSettings settings;
    private BoundSettings blockFading;

    @Setup
    public void setUp() {
        settings = new BoundSettings(4, 4, 1.0, Modulation.QAM16, 8.0, MutualInformation.Kind.CODED_MODULATION,
                DRAWS, 1L, null, null);
        // Alamouti 2x1 QPSK, 264 slots in blocks of 8 (33 per frame), all three bounds at once
        blockFading = new BoundSettings(1, 2, 1.0, Modulation.QPSK, 0.98, MutualInformation.Kind.CODED_MODULATION,
                FRAMES, 1L, null, null, 264, 8);
    }

    @Benchmark
    @OperationsPerInvocation(DRAWS)
    public OutageEstimate mimo4x4Point() {
        return settings.mimoOutage(15.0);
    }

    /** One point of the three block-fading bounds; score: channel draws (fading blocks) per second. */
    @Benchmark
    @OperationsPerInvocation(FRAMES * 33)
    public BoundPoint blockFading2x1Point() {
        return blockFading.point(2.0, () -> false);
    }
}
