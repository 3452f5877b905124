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
        assertTrue(g.frameErrors() > 0 && g.frameErrors() < g.frames(), "some frames fail, some pass: " + g.byName());
        assertEquals(interleavedDraws.uniform().nextLong(), planarDraws.uniform().nextLong());
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
        assertFalse(new LinkChain(new LinkSettings(Modulation.QPSK, SpaceTimeCodes.G4, 1, 4, Fading.RAYLEIGH, 256, 0))
                .planar());
    }
}
