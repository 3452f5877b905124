package org.fadebench.bench.perf;

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

    private BoundSettings settings;

    @Setup
    public void setUp() {
        settings = new BoundSettings(4, 4, 1.0, Modulation.QAM16, 8.0, MutualInformation.Kind.CODED_MODULATION,
                DRAWS, 1L, null, null);
    }

    @Benchmark
    @OperationsPerInvocation(DRAWS)
    public OutageEstimate mimo4x4Point() {
        return settings.mimoOutage(15.0);
    }
}
