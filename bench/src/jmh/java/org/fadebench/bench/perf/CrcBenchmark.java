package org.fadebench.bench.perf;

import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.fadebench.coding.fec.Crc;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * One idea: CRC-32 over a 12000-bit frame, from packed bytes and from a one-bit-per-byte frame.
 * Score: message bits per second on one thread. Run with {@code -prof gc} to see bytes allocated
 * per frame (expected: 0).
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class CrcBenchmark {

    private static final int BITS = 12000;

    private byte[] packed;
    private byte[] bits;

    @Setup
    public void setUp() {
        Random random = new Random(1);
        packed = new byte[BITS / 8];
        random.nextBytes(packed);
        bits = new byte[BITS];
        for (int i = 0; i < BITS; i++) {
            bits[i] = (byte) random.nextInt(2);
        }
    }

    @Benchmark
    @OperationsPerInvocation(BITS)
    public long crc32PackedBytes() {
        return Crc.CRC32.ofBytes(packed, 0, packed.length);
    }

    @Benchmark
    @OperationsPerInvocation(BITS)
    public long crc32BitFrame() {
        return Crc.CRC32.ofBits(bits, 0, BITS);
    }

    @Benchmark
    @OperationsPerInvocation(BITS)
    public long crc24BitFrame() {
        return Crc.CRC24.ofBits(bits, 0, BITS);
    }
}
