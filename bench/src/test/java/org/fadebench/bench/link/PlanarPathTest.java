package org.fadebench.bench.link;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import java.util.stream.Stream;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.ChannelTrace;
import org.fadebench.channel.Draws;
import org.fadebench.channel.Fading;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.fadebench.coding.fec.ldpc.LdpcCode;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;
import org.fadebench.coding.fec.ldpc.LdpcFamily;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodeFile;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.QamConstellation;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * The planar Alamouti path gives exactly the general path's results: the same error counts and the
 * same symbol estimates to the last bit, frame after frame, and it leaves the random stream at the
 * same place (so it took the same draws). An exact claim, so exact comparison: no tolerance.
 */
class PlanarPathTest {

    private static final double[] SNR_DB = {0, 7, 14, 21, 28};
    private static final int FRAMES = 40;

    private static LinkSettings alamouti(Modulation mod, int rx, ChannelSpec channel, int frameBits, int coherence,
                                         Equaliser decoder) {
        return new LinkSettings(mod, SpaceTimeCodes.ALAMOUTI, rx, 2, channel, frameBits, coherence, decoder,
                FrameCoding.NONE);
    }

    static Stream<LinkSettings> planarLinks() {
        double[] matrices = new double[2 * 2 * 2 * 7];
        Random rnd = new Random(3);
        for (int i = 0; i < matrices.length; i++) {
            matrices[i] = rnd.nextGaussian();
        }
        ChannelTrace trace = ChannelTrace.of("random", 2, 2, matrices);
        return Stream.of(
                alamouti(Modulation.QAM16, 2, ChannelSpec.of(Fading.RAYLEIGH), 2048, 0, Equaliser.MF),
                // 50 code blocks, 3 per fading block: the last fading block is short
                alamouti(Modulation.QPSK, 1, ChannelSpec.of(Fading.RAYLEIGH), 200, 6, Equaliser.MF),
                alamouti(Modulation.QAM64, 3, ChannelSpec.of(Fading.RICIAN).withKFactor(3).withRxCorr(0.5), 600, 4,
                        Equaliser.MF),
                alamouti(Modulation.BPSK, 2, ChannelSpec.of(Fading.NAKAGAMI).withNakagamiM(2), 128, 2, Equaliser.MF),
                alamouti(Modulation.QAM256, 2, ChannelSpec.of(Fading.RAYLEIGH).withCsiError(0.05), 1024, 0,
                        Equaliser.MF),
                alamouti(Modulation.QAM16, 2, ChannelSpec.of(Fading.RAYLEIGH).withPilots(4).withTxCorr(0.3), 512, 8,
                        Equaliser.MF),
                alamouti(Modulation.QAM16, 2, ChannelSpec.of(Fading.RAYLEIGH), 512, 0, Equaliser.MMSE),
                alamouti(Modulation.QPSK, 2, ChannelSpec.of(Fading.RAYLEIGH).withTrace(trace), 256, 2, Equaliser.ZF),
                alamouti(Modulation.QAM16, 4, ChannelSpec.of(Fading.NONE), 512, 0, Equaliser.MF));
    }

    @ParameterizedTest
    @MethodSource("planarLinks")
    void planarPathEqualsGeneralPath(LinkSettings settings) {
        LinkChain planar = new LinkChain(settings, true);
        LinkChain general = new LinkChain(settings, false);
        assertTrue(planar.planar(), settings.describe());
        assertFalse(general.planar());
        Draws planarDraws = Draws.of(11, 4, 2);
        Draws generalDraws = Draws.of(11, 4, 2);
        double[] planarEstimates = new double[2 * settings.symbolsPerFrame()];
        double[] generalEstimates = new double[2 * settings.symbolsPerFrame()];
        for (int frame = 0; frame < FRAMES; frame++) {
            double n0 = Math.pow(10, -SNR_DB[frame % SNR_DB.length] / 10);
            FrameCounters p = new FrameCounters();
            FrameCounters g = new FrameCounters();
            planar.runFrames(planarDraws, n0, frame, 1, p);
            general.runFrames(generalDraws, n0, frame, 1, g);
            assertEquals(g.bitErrors(), p.bitErrors(), "frame " + frame);
            assertEquals(g.symbolErrors(), p.symbolErrors(), "frame " + frame);
            assertEquals(g.frameErrors(), p.frameErrors(), "frame " + frame);
            planar.copyEstimates(planarEstimates);
            general.copyEstimates(generalEstimates);
            // assertArrayEquals on double[] without a delta compares the bit patterns
            assertArrayEquals(generalEstimates, planarEstimates, "frame " + frame);
        }
        assertEquals(generalDraws.uniform().nextLong(), planarDraws.uniform().nextLong());
    }

    private static LinkSettings codedAlamouti(Modulation mod, int rx, ChannelSpec channel, int frameBits,
                                              int coherence, FecScheme scheme, LlrMethod llr) {
        return new LinkSettings(mod, SpaceTimeCodes.ALAMOUTI, rx, 2, channel, frameBits, coherence, Equaliser.MF,
                new FrameCoding(scheme, Interleaving.RANDOM, 0, llr));
    }

    static Stream<LinkSettings> codedPlanarLinks() {
        FecScheme ldpc = new FecScheme(Crc.CRC24, LdpcCode.of(LdpcFamily.R12, LdpcDecoding.DEFAULT));
        return Stream.of(
                codedAlamouti(Modulation.QAM16, 2, ChannelSpec.of(Fading.RAYLEIGH), 1024, 0, ldpc, LlrMethod.MAXLOG),
                // 3 code blocks per fading block, the last one short; padding bits after the code
                codedAlamouti(Modulation.QPSK, 1, ChannelSpec.of(Fading.RAYLEIGH), 100, 6,
                        new FecScheme(Crc.CRC16, PuncturedCode.CONV_R12), LlrMethod.MAXLOG),
                codedAlamouti(Modulation.QAM64, 2, ChannelSpec.of(Fading.RICIAN).withKFactor(3), 300, 8,
                        new FecScheme(Crc.CRC16, LdpcCode.of(LdpcFamily.R34, LdpcDecoding.DEFAULT)), LlrMethod.EXACT),
                codedAlamouti(Modulation.BPSK, 2, ChannelSpec.of(Fading.RAYLEIGH).withCsiError(0.05), 64, 0,
                        new FecScheme(Crc.CRC16, PuncturedCode.CONV_R12), LlrMethod.EXACT));
    }

    /**
     * Coded frames on planes give exactly the counts of coded frames on interleaved arrays (raw
     * symbol errors are the LLRs' signs, so they check the LLRs too), the same estimates to the last
     * bit, and the same place in the random stream.
     */
    @ParameterizedTest
    @MethodSource("codedPlanarLinks")
    void codedFramesOnPlanesEqualInterleaved(LinkSettings settings) {
        FrameCounters g = codedFramesCompared(settings);
        assertTrue(g.frameErrors() > 0 && g.frameErrors() < g.frames(), "some frames fail, some pass: " + g.byName());
    }

    /** The comparison of {@link #codedFramesOnPlanesEqualInterleaved}; the interleaved chain's counters. */
    private static FrameCounters codedFramesCompared(LinkSettings settings) {
        LinkChain planar = new LinkChain(settings, true);
        LinkChain interleaved = new LinkChain(settings, false);
        assertTrue(planar.planar(), settings.describe());
        assertFalse(interleaved.planar());
        Draws planarDraws = Draws.of(12, 5, 3);
        Draws interleavedDraws = Draws.of(12, 5, 3);
        double[] planarEstimates = new double[2 * settings.symbolsPerFrame()];
        double[] interleavedEstimates = new double[2 * settings.symbolsPerFrame()];
        FrameCounters p = new FrameCounters();
        FrameCounters g = new FrameCounters();
        for (int call = 0; call < 10; call++) {
            double n0 = Math.pow(10, -(-4 + 2.5 * call) / 10); // -4 to 18.5 dB
            int frames = 8 + call;
            planar.runFrames(planarDraws, n0, 100L * call, frames, p);
            interleaved.runFrames(interleavedDraws, n0, 100L * call, frames, g);
            assertEquals(g.byName(), p.byName(), "call " + call);
            planar.copyEstimates(planarEstimates);
            interleaved.copyEstimates(interleavedEstimates);
            assertArrayEquals(interleavedEstimates, planarEstimates, "call " + call);
        }
        assertEquals(interleavedDraws.uniform().nextLong(), planarDraws.uniform().nextLong());
        return g;
    }

    /**
     * The planar transmission maps bits and gives LLRs exactly as the interleaved one: the same
     * LLRs to the last bit, frame after frame, for the coded links above at SNRs from -4 to 18.5 dB.
     */
    @ParameterizedTest
    @MethodSource("codedPlanarLinks")
    void planarLlrsEqualInterleaved(LinkSettings settings) {
        int nr = settings.receiveAntennas();
        int mt = settings.transmitAntennas();
        int coherence = settings.effectiveCoherenceSlots();
        PlanarTransmission planar = new PlanarTransmission(settings,
                settings.channel().newLinkChannel(nr, mt, coherence), settings.code().newPlanarKernel(nr).orElseThrow());
        InterleavedTransmission interleaved = new InterleavedTransmission(settings,
                settings.channel().newLinkChannel(nr, mt, coherence));
        QamConstellation constellation = settings.modulation().constellation();
        LlrMethod method = settings.coding().llr();
        Draws bitDraws = Draws.of(13, 1);
        Draws planarDraws = Draws.of(13, 2);
        Draws interleavedDraws = Draws.of(13, 2);
        int bits = settings.symbolsPerFrame() * settings.modulation().bitsPerSymbol();
        byte[] sent = new byte[bits];
        double[] planarLlr = new double[bits];
        double[] interleavedLlr = new double[bits];
        for (int frame = 0; frame < 10; frame++) {
            double n0 = Math.pow(10, -(-4 + 2.5 * frame) / 10);
            bitDraws.fillBits(sent, 0, bits);
            planar.map(constellation, sent);
            interleaved.map(constellation, sent);
            planar.transmit(planarDraws, n0, frame);
            interleaved.transmit(interleavedDraws, n0, frame);
            planar.demap(constellation, method, n0, planarLlr);
            interleaved.demap(constellation, method, n0, interleavedLlr);
            // assertArrayEquals on double[] without a delta compares the bit patterns
            assertArrayEquals(interleavedLlr, planarLlr, settings.describe() + " frame " + frame);
        }
    }

    /** Links the planar transmission does not cover keep the interleaved one. */
    @Test
    void otherLinksTakeTheGeneralPath() {
        ChannelSpec rayleigh = ChannelSpec.of(Fading.RAYLEIGH);
        assertFalse(new LinkChain(alamouti(Modulation.QPSK, 2, rayleigh.withDoppler(0.01), 256, 0, Equaliser.MF))
                .planar());
        assertFalse(new LinkChain(codedAlamouti(Modulation.QPSK, 2, rayleigh.withDoppler(0.01), 256, 0,
                new FecScheme(Crc.CRC16, PuncturedCode.CONV_R12), LlrMethod.MAXLOG)).planar());
        assertFalse(new LinkChain(new LinkSettings(Modulation.QPSK, SpaceTimeCodes.G4, 1, 4,
                rayleigh.withDoppler(0.01), 256, 0, Equaliser.MF, FrameCoding.NONE)).planar());
    }

    /**
     * Every catalogue code but the single-antenna one, and an orthogonal code read from a code
     * file, sends on planes (Alamouti with its own kernel, the others with the table-driven
     * {@link org.fadebench.coding.stbc.DesignKernel}); a code that is not orthogonal does not.
     */
    @Test
    void everyOrthogonalCodeHasAPlanarKernel() {
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            assertEquals(code != SpaceTimeCodes.NONE, code.hasPlanarKernel(), code.name());
        }
        assertTrue(FILE_CODE.hasPlanarKernel());
        assertTrue(TURNED_CODE.isOrthogonal());
        assertTrue(TURNED_CODE.hasPlanarKernel());
        // two symbols in one slot on two antennas (spatial multiplexing): not orthogonal
        SpaceTimeCode multiplexing = SpaceTimeCodeFile.parse(String.join("\n", "name: \"two-streams\"", "tx: 2",
                "slots: 1", "symbols:", "  - real: [[\"1\", \"0\"]]", "    imag: [[\"1j\", \"0\"]]",
                "  - real: [[\"0\", \"1\"]]", "    imag: [[\"0\", \"1j\"]]"), "test");
        assertFalse(multiplexing.isOrthogonal());
        assertFalse(multiplexing.hasPlanarKernel());
    }

    /** H3 read back from its code file: a code the catalogue does not know, with the same matrices. */
    private static final SpaceTimeCode FILE_CODE = SpaceTimeCodeFile.parse(
            SpaceTimeCodeFile.format(SpaceTimeCodes.H3).replace("h3", "h3-from-file"), "test");

    /**
     * H3 with its second antenna turned by j (X·diag(1, j, 1): X^H X is unchanged, so it stays
     * orthogonal): grid entries ±j·s_k and ±j·s_k*, whose dispersion entries are imaginary, a
     * structure no catalogue code has. An own example of this suite.
     */
    private static final SpaceTimeCode TURNED_CODE = SpaceTimeCodeFile.parse(String.join("\n",
            "name: \"h3-turned\"", "tx: 3", "slots: 4", "symbols:",
            "  - real: [[1, 0, 0], [0, \"j\", 0], [0, 0, 1], [0, 0, 0]]",
            "    imag: [[\"j\", 0, 0], [0, 1, 0], [0, 0, \"-j\"], [0, 0, 0]]",
            "  - real: [[0, \"j\", 0], [-1, 0, 0], [0, 0, 0], [0, 0, 1]]",
            "    imag: [[0, -1, 0], [\"j\", 0, 0], [0, 0, 0], [0, 0, \"-j\"]]",
            "  - real: [[0, 0, 1], [0, 0, 0], [-1, 0, 0], [0, \"-j\", 0]]",
            "    imag: [[0, 0, \"j\"], [0, 0, 0], [\"j\", 0, 0], [0, -1, 0]]"), "test");

    private static Stream<SpaceTimeCode> orthogonalCodes() {
        Stream.Builder<SpaceTimeCode> codes = Stream.builder();
        for (SpaceTimeCode code : SpaceTimeCodes.all()) {
            if (code != SpaceTimeCodes.NONE) {
                codes.add(code);
            }
        }
        return codes.add(FILE_CODE).add(TURNED_CODE).build();
    }

    /**
     * Every orthogonal code × 1–4 receive antennas × every modulation × perfect and imperfect CSI,
     * uncoded: 6 code blocks a frame, 2 a fading block (so a frame has 3 channels).
     */
    static Stream<LinkSettings> orthogonalLinks() {
        return orthogonalCodes().flatMap(code -> Stream.of(1, 2, 3, 4).flatMap(rx -> Stream.of(Modulation.values())
                .flatMap(mod -> Stream.of(0.0, 0.05).map(csi -> new LinkSettings(mod, code, rx,
                        code.transmitAntennas(), csi == 0 ? ChannelSpec.of(Fading.RAYLEIGH)
                                : ChannelSpec.of(Fading.RAYLEIGH).withCsiError(csi),
                        6 * code.symbolsPerBlock() * mod.bitsPerSymbol(), 2 * code.slotsPerBlock(), Equaliser.MF,
                        FrameCoding.NONE)))));
    }

    @ParameterizedTest
    @MethodSource("orthogonalLinks")
    void orthogonalCodesOnPlanesEqualGeneralPath(LinkSettings settings) {
        planarPathEqualsGeneralPath(settings);
    }

    /**
     * Every orthogonal code coded (CRC-16 + rate-1/2 convolutional code, 100 information bits), with
     * receive antennas, modulation, LLR method and CSI varying from code to code.
     */
    static Stream<LinkSettings> codedOrthogonalLinks() {
        Modulation[] mods = Modulation.values();
        int[] n = {0};
        return orthogonalCodes().flatMap(code -> Stream.of(0.0, 0.05).map(csi -> {
            int i = n[0]++;
            return new LinkSettings(mods[i % mods.length], code, 1 + i % 4, code.transmitAntennas(),
                    csi == 0 ? ChannelSpec.of(Fading.RAYLEIGH) : ChannelSpec.of(Fading.RAYLEIGH).withCsiError(csi),
                    100, 0, Equaliser.MF, new FrameCoding(new FecScheme(Crc.CRC16, PuncturedCode.CONV_R12),
                    Interleaving.RANDOM, 0, i % 3 == 0 ? LlrMethod.EXACT : LlrMethod.MAXLOG));
        }));
    }

    @ParameterizedTest
    @MethodSource("codedOrthogonalLinks")
    void codedOrthogonalCodesOnPlanesEqualInterleaved(LinkSettings settings) {
        // with up to 32 branches of diversity not every link loses frames, but all make raw symbol errors
        FrameCounters g = codedFramesCompared(settings);
        assertTrue(g.symbolErrors() > 0 && g.symbolErrors() < g.symbols(), g.byName().toString());
        planarLlrsEqualInterleaved(settings);
    }
}
