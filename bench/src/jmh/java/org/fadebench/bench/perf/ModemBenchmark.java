package org.fadebench.bench.perf;

import java.util.Arrays;
import org.fadebench.channel.Draws;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.QamConstellation;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Setup;

/**
 * One idea each: QAM mapping, hard demapping, max-log LLR demapping, and counting hard-decision
 * errors against the symbols sent, of 512 symbols; score in symbols/s. Estimates are the symbols
 * plus N(0, 0.01) per axis; for counting errors, plus N(0, (d/4)²) per axis, d the distance from a
 * point to a decision boundary, so that an estimate crosses one with probability 2Q(4) ≈ 6e-5 per
 * axis, as at the SNR of a low error rate.
 */
public class ModemBenchmark extends ThroughputBenchmark {

    private static final int SYMBOLS = 512;

    @Param({"qpsk", "16qam", "64qam"})
    public String modulation;

    private QamConstellation constellation;
    private byte[] bits;
    private byte[] decided;
    /** Where the mapping benchmarks write (their inputs stay as made in {@link #setUp}). */
    private final double[] mapped = new double[2 * SYMBOLS];
    private double[] noisy;
    private double[] gain;
    private double[] llr;
    private int[] labels;
    private int[] decidedLabels;
    private final double[] labelSymbols = new double[2 * SYMBOLS];
    private final double[] labelNoisy = new double[2 * SYMBOLS];
    private final int[] errorCounts = new int[2];

    @Setup
    public void setUp() {
        constellation = Modulation.fromCliName(modulation).constellation();
        int b = constellation.bitsPerSymbol();
        bits = new byte[SYMBOLS * b];
        decided = new byte[SYMBOLS * b];
        llr = new double[SYMBOLS * b];
        double[] symbols = new double[2 * SYMBOLS];
        noisy = new double[2 * SYMBOLS];
        gain = new double[SYMBOLS];
        Draws d = Draws.of(5);
        d.fillBits(bits, 0, bits.length);
        constellation.map(bits, 0, symbols, 0, SYMBOLS);
        for (int i = 0; i < noisy.length; i++) {
            noisy[i] = symbols[i] + 0.1 * d.gaussian();
        }
        Arrays.fill(gain, 1.0);
        labels = new int[SYMBOLS];
        decidedLabels = new int[SYMBOLS];
        d.fillLabels(labels, 0, SYMBOLS, b);
        constellation.mapLabels(labels, 0, labelSymbols, 0, SYMBOLS);
        for (int i = 0; i < labelNoisy.length; i++) {
            labelNoisy[i] = labelSymbols[i] + 0.25 * constellation.halfSpacing() * d.gaussian();
        }
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] map() {
        constellation.map(bits, 0, mapped, 0, SYMBOLS);
        return mapped;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public byte[] demapHard() {
        constellation.demapHard(noisy, 0, decided, 0, SYMBOLS);
        return decided;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] demapMaxLog() {
        constellation.demapMaxLog(noisy, gain, 0, 0.1, llr, 0, SYMBOLS);
        return llr;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] mapLabels() {
        constellation.mapLabels(labels, 0, mapped, 0, SYMBOLS);
        return mapped;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public int[] demapLabels() {
        constellation.demapLabels(noisy, 0, decidedLabels, 0, SYMBOLS);
        return decidedLabels;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public int[] countHardErrors() {
        constellation.countHardErrors(labels, 0, labelSymbols, labelNoisy, 0, SYMBOLS, errorCounts);
        return errorCounts;
    }
}
