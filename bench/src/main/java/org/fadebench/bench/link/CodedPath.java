package org.fadebench.bench.link;

import org.fadebench.channel.Draws;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecCodec;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.QamConstellation;

/**
 * Coded frames, on the link's {@link Transmission} (planar or interleaved): payload bits → CRC,
 * channel code, interleaver → QAM → … → LLRs → deinterleaver, channel decoder, CRC. Frames are
 * sent one by one and decoded in lanes, up to {@link LinkSettings#lanes()} frames at once, or
 * continuously where the codec can (a lane takes the next frame as soon as its own is decided, so
 * an LDPC frame that needs every iteration does not hold up the others); each frame's outcome is
 * the same as if it were decoded alone. A frame's raw symbol errors are the hard decisions on its
 * coded bits' LLRs against the bits sent.
 */
final class CodedPath implements FramePath {

    private final Transmission transmission;
    private final QamConstellation constellation;
    private final LlrMethod llrMethod;
    private final FecCodec codec;
    /** Whether frames carry a CRC (else no frame counts as a CRC failure or undetected). */
    private final boolean withCrc;
    private final int frameBits;
    private final int symbols;
    private final int bitsPerSymbol;
    private final int lanes;
    private final int codedLength;
    /** Row l: the payload sent in lane l of the group being decoded. */
    private final byte[][] payload;
    /** Per lane: raw symbol errors. */
    private final int[] rawSymbolErrors;
    /** Per lane, when fades are scaled: the frame's weight and fade energy. */
    private final double[] laneWeight;
    private final double[] laneFadeEnergy;
    private final byte[] payloadOut;
    private final byte[] codedBits;
    private final double[] llr;
    /** Lanes the codec decodes continuously (empty if it decodes in groups only), for the lanes it finishes. */
    private final int[] finished;

    CodedPath(LinkSettings settings, Transmission transmission) {
        FrameCoding coding = settings.coding();
        this.transmission = transmission;
        this.constellation = settings.modulation().constellation();
        this.llrMethod = coding.llr();
        this.frameBits = settings.frameBits();
        this.symbols = settings.symbolsPerFrame();
        this.bitsPerSymbol = settings.modulation().bitsPerSymbol();
        this.lanes = settings.lanes();
        this.withCrc = coding.scheme().crc() != Crc.NONE;
        this.codec = coding.scheme().newCodec(frameBits, coding.interleaver(frameBits), lanes);
        this.codedLength = codec.codedBits();
        this.payload = new byte[lanes][frameBits];
        this.rawSymbolErrors = new int[lanes];
        this.laneWeight = new double[lanes];
        this.laneFadeEnergy = new double[lanes];
        this.payloadOut = new byte[frameBits];
        this.codedBits = new byte[symbols * bitsPerSymbol];
        this.llr = new double[symbols * bitsPerSymbol];
        this.finished = new int[codec.continuousLanes()];
    }

    /** Bytes the constructor allocates: payloads of every lane, bits and LLRs sent, and the codec's buffers. */
    static long bufferBytes(LinkSettings settings) {
        int lanes = settings.lanes();
        long sentBits = (long) settings.symbolsPerFrame() * settings.modulation().bitsPerSymbol();
        return (lanes + 1L) * settings.frameBits() + 16L * lanes + 9 * sentBits
                + FecCodec.bufferBytes(settings.coding().scheme(), settings.frameBits(), lanes);
    }

    @Override
    public void runFrames(Draws draws, double n0, long first, int count, FrameCounters counters) {
        if (finished.length > 0) {
            runContinuously(draws, n0, first, count, counters);
            return;
        }
        for (int done = 0; done < count; done += lanes) {
            int group = Math.min(lanes, count - done);
            for (int lane = 0; lane < group; lane++) {
                send(draws, n0, first + done + lane, lane);
            }
            codec.decodeReceived(group);
            for (int lane = 0; lane < group; lane++) {
                count(lane, counters);
            }
        }
    }

    /**
     * The frames through a codec that decodes continuously: each lane it decodes so takes the next
     * frame as soon as its own is counted. Frames are sent in order, as in groups, so every frame
     * meets the same draws and is decoded as it would be alone: the counters equal those of groups.
     */
    private void runContinuously(Draws draws, double n0, long first, int count, FrameCounters counters) {
        int sent = 0;
        while (sent < Math.min(finished.length, count)) {
            send(draws, n0, first + sent, sent);
            sent++;
        }
        for (int running = sent; running > 0; ) {
            int done = codec.advance(finished);
            for (int k = 0; k < done; k++) {
                int lane = finished[k];
                count(lane, counters);
                if (sent < count) {
                    send(draws, n0, first + sent++, lane);
                } else {
                    running--;
                }
            }
        }
    }

    /** One frame up to its LLRs, which go into a lane of the codec; counts raw symbol errors. */
    private void send(Draws draws, double n0, long frame, int lane) {
        byte[] bits = payload[lane];
        draws.fillBits(bits, 0, frameBits);
        codec.encode(bits, 0, codedBits, 0);
        // padding up to whole code blocks: random bits, sent and ignored
        draws.fillBits(codedBits, codedLength, codedBits.length - codedLength);
        transmission.map(constellation, codedBits);
        transmission.transmit(draws, n0, frame);
        if (transmission.weighted()) {
            laneWeight[lane] = transmission.frameWeight();
            laneFadeEnergy[lane] = transmission.frameFadeEnergy();
        }
        transmission.demap(constellation, llrMethod, n0, llr);
        codec.receive(lane, llr, 0);
        int symbolErrors = 0;
        for (int s = 0, b = 0; s < symbols; s++) {
            int wrong = 0;
            for (int j = 0; j < bitsPerSymbol; j++, b++) {
                wrong |= codedBits[b] ^ (llr[b] < 0 ? 1 : 0);
            }
            symbolErrors += wrong;
        }
        rawSymbolErrors[lane] = symbolErrors;
    }

    /** Compares a decoded lane with its payload and adds the frame to the counters. */
    private void count(int lane, FrameCounters counters) {
        boolean crcOk = codec.decided(lane, payloadOut, 0);
        byte[] bits = payload[lane];
        int bitErrors = 0;
        for (int i = 0; i < frameBits; i++) {
            bitErrors += bits[i] ^ payloadOut[i];
        }
        counters.addFrame(frameBits, bitErrors, symbols, rawSymbolErrors[lane], withCrc && !crcOk,
                withCrc && crcOk && bitErrors > 0, codec.iterations(lane));
        if (transmission.weighted()) {
            counters.addWeight(laneWeight[lane], laneFadeEnergy[lane], bitErrors, rawSymbolErrors[lane]);
        }
    }
}
