package org.fadebench.bench.perf;

import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * The settings every fadebench benchmark shares (JMH reads these annotations from the superclass):
 * throughput per second, 3 warm-up and 5 measured iterations of 1 s, 3 forks (forks of one benchmark
 * differ by up to ±20 % on a shared machine, so one fork is never a result), and the benchmark
 * object as a per-thread state. A subclass states only what differs, e.g. more warm-up.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(3)
public abstract class ThroughputBenchmark {
}
