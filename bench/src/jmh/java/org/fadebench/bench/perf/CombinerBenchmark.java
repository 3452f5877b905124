package org.fadebench.bench.perf;

import org.fadebench.channel.Draws;
import org.fadebench.channel.MimoChannel;
import org.fadebench.coding.stbc.AlamoutiKernel;
import org.fadebench.coding.stbc.Combiner;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.coding.stbc.StbcEncoder;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.Setup;

/**
 * Space-time stages on 512 symbols, score in symbols/s. {@code alamoutiEncodeChannelCombine}: the
 * Alamouti 2x2 kernel with the channel and its noise; {@code alamoutiPlanarEncodeChannelCombine}: the
 * same on planar arrays (the link's path for uncoded Alamouti frames); {@code alamoutiEncodeOnly},
 * {@code channel2x2Only}, {@code alamoutiCombineOnly}: one stage each; {@code generalDecodeG4}: the
 * general EJML matched filter on G4 4x1 (channel set once per 512 symbols, as in a quasi-static
 * frame). Every input (symbols, grids, received signals at n0 = 0.05) is made in {@link #setUp} and
 * never written by a benchmark, so each stage sees realistic data whichever runs.
 */
public class CombinerBenchmark extends ThroughputBenchmark {

    private static final int SYMBOLS = 512;
    private static final double N0 = 0.05;

    private Draws draws;
    private final double[] h22 = new double[8];
    private final double[] h41 = new double[8];
    private StbcEncoder alamoutiEncoder;
    private Combiner alamoutiCombiner;
    private final AlamoutiKernel alamoutiPlanar = new AlamoutiKernel(2);
    private Combiner g4Combiner;
    private int g4Blocks;

    // inputs
    private final double[] symbols = new double[2 * SYMBOLS];
    private final double[][] symbolPlanes = new double[4][SYMBOLS / 2];
    /** The Alamouti grid of {@link #symbols}. */
    private final double[] grid22 = new double[2 * 2 * SYMBOLS];
    /** {@link #grid22} through h22 with noise. */
    private final double[] received22 = new double[2 * 2 * SYMBOLS];
    /** The G4 grid of {@link #symbols} through h41 with noise. */
    private double[] received41;

    // outputs
    private final double[] gridOut = new double[2 * 2 * SYMBOLS];
    private final double[] receivedOut = new double[2 * 2 * SYMBOLS];
    private final double[] estimates = new double[2 * SYMBOLS];
    private final double[] gain = new double[SYMBOLS];
    private final double[][] gridPlanes = new double[8][SYMBOLS / 2];
    private final double[][] receivedPlanes = new double[8][SYMBOLS / 2];
    private final double[][] estimatePlanes = new double[4][SYMBOLS / 2];

    @Setup
    public void setUp() {
        draws = Draws.of(9);
        for (int i = 0; i < symbols.length; i++) {
            symbols[i] = draws.gaussian();
            symbolPlanes[i % 4][i / 4] = symbols[i];
        }
        for (int i = 0; i < 8; i++) {
            h22[i] = draws.gaussian();
            h41[i] = draws.gaussian();
        }
        alamoutiEncoder = SpaceTimeCodes.ALAMOUTI.newEncoder();
        alamoutiCombiner = SpaceTimeCodes.ALAMOUTI.newCombiner(2);
        alamoutiEncoder.encode(symbols, 0, SYMBOLS / 2, grid22, 0);
        MimoChannel.apply(h22, 2, 2, grid22, 0, SYMBOLS, N0, draws, received22, 0);

        SpaceTimeCode g4 = SpaceTimeCodes.G4;
        g4Combiner = g4.newCombiner(1);
        g4Blocks = SYMBOLS / g4.symbolsPerBlock();
        int g4Slots = g4Blocks * g4.slotsPerBlock();
        double[] grid41 = new double[2 * g4Slots * g4.transmitAntennas()];
        g4.newEncoder().encode(symbols, 0, g4Blocks, grid41, 0);
        received41 = new double[2 * g4Slots];
        MimoChannel.apply(h41, 1, 4, grid41, 0, g4Slots, N0, draws, received41, 0);
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] alamoutiEncodeChannelCombine() {
        alamoutiEncoder.encode(symbols, 0, SYMBOLS / 2, gridOut, 0);
        MimoChannel.apply(h22, 2, 2, gridOut, 0, SYMBOLS, N0, draws, receivedOut, 0);
        alamoutiCombiner.setChannel(h22);
        alamoutiCombiner.combine(receivedOut, 0, SYMBOLS / 2, estimates, gain, 0);
        return estimates;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[][] alamoutiPlanarEncodeChannelCombine() {
        alamoutiPlanar.encode(symbolPlanes, 0, SYMBOLS / 2, gridPlanes);
        MimoChannel.applyTwoTransmittersPlanar(h22, 2, gridPlanes, 0, SYMBOLS / 2, N0, draws, receivedPlanes);
        alamoutiPlanar.setChannel(h22);
        alamoutiPlanar.combine(receivedPlanes, 0, SYMBOLS / 2, estimatePlanes);
        return estimatePlanes;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] generalDecodeG4() {
        g4Combiner.setChannel(h41);
        g4Combiner.combine(received41, 0, g4Blocks, estimates, gain, 0);
        return estimates;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] alamoutiEncodeOnly() {
        alamoutiEncoder.encode(symbols, 0, SYMBOLS / 2, gridOut, 0);
        return gridOut;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] channel2x2Only() {
        MimoChannel.apply(h22, 2, 2, grid22, 0, SYMBOLS, N0, draws, receivedOut, 0);
        return receivedOut;
    }

    @Benchmark
    @OperationsPerInvocation(SYMBOLS)
    public double[] alamoutiCombineOnly() {
        alamoutiCombiner.setChannel(h22);
        alamoutiCombiner.combine(received22, 0, SYMBOLS / 2, estimates, gain, 0);
        return estimates;
    }
}
