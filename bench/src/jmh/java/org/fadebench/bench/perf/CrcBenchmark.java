package org.fadebench.bench.perf;

import java.util.Random;
import org.fadebench.coding.fec.Crc;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Setup;

/**
 * One idea: CRC-32 over a 12000-bit frame, from packed bytes and from a one-bit-per-byte frame.
 * Score: message bits per second on one thread. Run with {@code -prof gc} to see bytes allocated
 * per frame (expected: 0).
 */
public class CrcBenchmark extends ThroughputBenchmark {

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
