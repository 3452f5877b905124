package org.fadebench.bench.perf;

import java.util.concurrent.TimeUnit;
import org.fadebench.channel.Draws;
import org.fadebench.channel.MimoChannel;
import org.fadebench.coding.stbc.AlamoutiKernel;
import org.fadebench.coding.stbc.Combiner;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.coding.stbc.StbcEncoder;
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
 * Space-time stages on 512 symbols, score in symbols/s. {@code alamoutiEncodeChannelCombine}: the
 * Alamouti 2x2 kernel with the channel and its noise; {@code alamoutiPlanarEncodeChannelCombine}: the
 * same on planar arrays (the link's path for uncoded Alamouti frames); {@code generalDecodeG4}: the general EJML
 * matched filter on G4 4x1 (channel set once per 512 symbols, as in a quasi-static frame).
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class CombinerBenchmark {

    private static final int SYMBOLS = 512;

    private final double[] symbols = new double[2 * SYMBOLS];
    private final double[] estimates = new double[2 * SYMBOLS];
    private final double[] gain = new double[SYMBOLS];
    private Draws draws;

    private StbcEncoder alamoutiEncoder;
    private Combiner alamoutiCombiner;
    private final double[] h22 = new double[8];
    private final double[] grid22 = new double[2 * 2 * SYMBOLS];
    private final double[] rx22 = new double[2 * 2 * SYMBOLS];

    private final double[][] symbolPlanes = new double[4][SYMBOLS / 2];
    private final double[][] gridPlanes = new double[8][SYMBOLS / 2];
    private final double[][] rxPlanes = new double[8][SYMBOLS / 2];
    private final double[][] estimatePlanes = new double[4][SYMBOLS / 2];
    private final AlamoutiKernel alamoutiPlanar = new AlamoutiKernel(2);

    private Combiner g4Combiner;
    private final double[] h41 = new double[8];
    private double[] rx41;
    private int g4Blocks;

    @Setup
    public void setUp() {
        draws = Draws.of(9);
        for (int i = 0; i < symbols.length; i++) {
            symbols[i] = draws.gaussian();
        }
        for (int i = 0; i < 8; i++) {
            h22[i] = draws.gaussian();
            h41[i] = draws.gaussian();
        }
        for (int i = 0; i < symbols.length; i++) {
            symbolPlanes[i % 4][i / 4] = symbols[i];
        }
        alamoutiEncoder = SpaceTimeCodes.ALAMOUTI.newEncoder();
        alamoutiCombiner = SpaceTimeCodes.ALAMOUTI.newCombiner(2);
        SpaceTimeCode g4 = SpaceTimeCodes.G4;
        g4Combiner = g4.newCombiner(1);
        g4Blocks = SYMBOLS / g4.symbolsPerBlock();
        rx41 = new double[2 * g4Blocks * g4.slotsPerBlock()];
        for (int i = 0; i < rx41.length; i++) {
            rx41[i] = draws.gaussian();
        }
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] alamoutiEncodeChannelCombine() {
        alamoutiEncoder.encode(symbols, 0, SYMBOLS / 2, grid22, 0);
        MimoChannel.apply(h22, 2, 2, grid22, 0, SYMBOLS, 0.05, draws, rx22, 0);
        alamoutiCombiner.setChannel(h22);
        alamoutiCombiner.combine(rx22, 0, SYMBOLS / 2, estimates, gain, 0);
        return estimates;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[][] alamoutiPlanarEncodeChannelCombine() {
        alamoutiPlanar.encode(symbolPlanes, 0, SYMBOLS / 2, gridPlanes);
        MimoChannel.applyTwoTransmittersPlanar(h22, 2, gridPlanes, 0, SYMBOLS / 2, 0.05, draws, rxPlanes);
        alamoutiPlanar.setChannel(h22);
        alamoutiPlanar.combine(rxPlanes, 0, SYMBOLS / 2, estimatePlanes);
        return estimatePlanes;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] generalDecodeG4() {
        g4Combiner.setChannel(h41);
        g4Combiner.combine(rx41, 0, g4Blocks, estimates, gain, 0);
        return estimates;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] alamoutiEncodeOnly() {
        alamoutiEncoder.encode(symbols, 0, SYMBOLS / 2, grid22, 0);
        return grid22;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] channel2x2Only() {
        MimoChannel.apply(h22, 2, 2, grid22, 0, SYMBOLS, 0.05, draws, rx22, 0);
        return rx22;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] alamoutiCombineOnly() {
        alamoutiCombiner.setChannel(h22);
        alamoutiCombiner.combine(rx22, 0, SYMBOLS / 2, estimates, gain, 0);
        return estimates;
    }
}
