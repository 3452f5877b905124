package org.fadebench.bench.link;

import org.fadebench.channel.Draws;
import org.fadebench.channel.LinkChannel;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecCodec;
import org.fadebench.coding.stbc.AlamoutiKernel;
import org.fadebench.coding.stbc.Combiner;
import org.fadebench.coding.stbc.Decoder;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.StbcEncoder;
import org.fadebench.modem.QamConstellation;

/**
 * One link, end to end:
 * <pre>
 * info bits → (CRC, convolutional code, puncturing, interleaver) → QAM map → space-time encode
 *   → per fading block: its channel (model, Doppler or trace), Y = X Hᵀ + N, the receiver's
 *     estimate Ĥ (perfect, noisy or from pilots) → combine with Ĥ
 *   → uncoded: slice; coded: LLRs → deinterleave, depuncture, Viterbi, CRC
 *   → count bit, symbol and frame errors
 * </pre>
 * An uncoded frame carries its bits as symbol labels (the bits of a symbol as one integer), which
 * is the same data and lets errors be counted per symbol. Coded frames are sent one by one and
 * decoded in groups of {@link LinkSettings#framesDecodedTogether()}, which the Viterbi decoder
 * takes at once; each frame's outcome is the same as if it were decoded alone. A chain owns all
 * its buffers and allocates nothing per frame; each worker thread has its own. Random draws are
 * taken in a fixed order (bits, padding, then per fading block H and noise), so a frame depends
 * only on the stream it is given.
 *
 * <p>Uncoded Alamouti frames over channels that stay constant within a fading block take a faster
 * path with the same draws and the same arithmetic: symbols, grid, received signal and estimates
 * are kept as planes, one array per real or imaginary part of each symbol, slot and antenna of a
 * code block, indexed by code block, so that encoder, channel and combiner run as short
 * unit-stride loops the JIT vectorises. Every other link takes the general interleaved path.
 */
public final class LinkChain {

    private final LinkSettings settings;
    private final QamConstellation constellation;
    private final StbcEncoder encoder;
    private Combiner combiner;
    /** The noise level the combiner was made for (only MMSE depends on it). */
    private double combinerN0;
    private final LinkChannel channel;
    private final int mt;
    private final int nr;
    private final int k;
    private final int t;
    private final int frameBits;
    private final int symbols;
    private final int blocksPerFrame;
    private final int blocksPerFade;
    private final int bitsPerSymbol;

    private final double[] txSymbols;
    private final double[] estimates;
    private final double[] gain;
    private final double[] hHat;
    private final int fadesPerFrame;
    private final double[] grid;
    private final double[] received;

    // uncoded frames: symbol labels
    private final int[] sent;
    /** The uncoded frame being counted: wrong bits and wrong labels so far. */
    private final int[] labelErrors = new int[2];

    // the planar path (null on the general path): 2 label, 4 symbol, 8 grid, 4·Nr received and
    // 4 estimate planes
    private final AlamoutiKernel alamouti;
    private final int[][] sentPlanes;
    private final double[][] symbolPlanes;
    private final double[][] gridPlanes;
    private final double[][] receivedPlanes;
    private final double[][] estimatePlanes;

    // coded frames: bits, LLRs and the codec
    private final FecCodec codec;
    /** Whether coded frames carry a CRC (else no frame counts as a CRC failure or undetected). */
    private final boolean withCrc;
    private final int lanes;
    /** Row l: the payload sent in lane l of the group being decoded. */
    private final byte[][] payload;
    /** Per lane: raw symbol errors (hard decisions on the coded bits' LLRs). */
    private final int[] rawSymbolErrors;
    private final byte[] payloadOut;
    private final byte[] codedBits;
    private final double[] llr;
    private final int codedLength;

    public LinkChain(LinkSettings settings) {
        this(settings, true);
    }

    /** Whether a chain of {@code settings} takes the planar path (uncoded Alamouti over block fading). */
    private static boolean planarApplies(LinkSettings settings) {
        return !settings.coding().coded() && settings.code().kernel() == SpaceTimeCode.Kernel.ALAMOUTI
                && !settings.channel().varies();
    }

    /**
     * Bytes one chain's buffers take: the arrays the constructor below allocates, the channel's
     * matrices and the codec's buffers (array headers aside), so that a run can check the memory it
     * needs, chains times threads, before it starts.
     */
    public static long bufferBytes(LinkSettings settings) {
        long symbols = settings.symbolsPerFrame();
        long nr = settings.receiveAntennas();
        long mt = settings.transmitAntennas();
        long fadeSlots = settings.effectiveCoherenceSlots();
        long bytes = 8 * 5 * symbols // symbols sent, estimates (complex) and gains
                + 8 * 2 * fadeSlots * (mt + nr) // grid and received signal of a fading block
                + 8 * 2 * nr * mt * (settings.channel().varies() ? fadeSlots + 2 : 3); // H (per slot), Ĥ
        if (settings.coding().coded()) {
            int lanes = settings.framesDecodedTogether();
            long sentBits = symbols * settings.modulation().bitsPerSymbol();
            return bytes + (lanes + 1L) * settings.frameBits() + 9 * sentBits
                    + FecCodec.bufferBytes(settings.coding().scheme(), settings.frameBits(), lanes);
        }
        bytes += 4 * symbols; // labels sent
        if (planarApplies(settings)) {
            bytes += 8 * (2 + 4 + 8 + 4 * nr + 4) * settings.blocksPerFrame();
        }
        return bytes;
    }

    /** A chain that takes the planar path where it applies ({@code planar}) or always the general one. */
    LinkChain(LinkSettings settings, boolean planar) {
        this.settings = settings;
        SpaceTimeCode code = settings.code();
        this.constellation = settings.modulation().constellation();
        this.encoder = code.newEncoder();
        this.nr = settings.receiveAntennas();
        this.mt = settings.transmitAntennas();
        this.combinerN0 = 1.0;
        this.combiner = code.newCombiner(nr, settings.decoder(), combinerN0);
        this.channel = settings.channel().newLinkChannel(settings.receiveAntennas(), settings.transmitAntennas(),
                settings.effectiveCoherenceSlots());
        this.k = code.symbolsPerBlock();
        this.t = code.slotsPerBlock();
        this.frameBits = settings.frameBits();
        this.symbols = settings.symbolsPerFrame();
        this.blocksPerFrame = settings.blocksPerFrame();
        this.blocksPerFade = settings.effectiveCoherenceSlots() / t;
        this.bitsPerSymbol = settings.modulation().bitsPerSymbol();
        this.txSymbols = new double[2 * symbols];
        this.estimates = new double[2 * symbols];
        this.gain = new double[symbols];
        this.hHat = new double[2 * nr * mt];
        this.fadesPerFrame = settings.fadingBlocksPerFrame();
        int fadeSlots = blocksPerFade * t;
        this.grid = new double[2 * fadeSlots * mt];
        this.received = new double[2 * fadeSlots * nr];
        FrameCoding coding = settings.coding();
        if (coding.coded()) {
            this.withCrc = coding.scheme().crc() != Crc.NONE;
            this.lanes = settings.framesDecodedTogether();
            this.codec = coding.scheme().newCodec(frameBits, coding.interleaver(frameBits), lanes);
            this.codedLength = codec.codedBits();
            this.payload = new byte[lanes][frameBits];
            this.rawSymbolErrors = new int[lanes];
            this.payloadOut = new byte[frameBits];
            this.codedBits = new byte[symbols * bitsPerSymbol];
            this.llr = new double[symbols * bitsPerSymbol];
            this.sent = null;
        } else {
            this.codec = null;
            this.withCrc = false;
            this.lanes = 1;
            this.codedLength = 0;
            this.payload = null;
            this.rawSymbolErrors = null;
            this.payloadOut = null;
            this.codedBits = null;
            this.llr = null;
            this.sent = new int[symbols];
        }
        if (planar && planarApplies(settings)) {
            this.alamouti = new AlamoutiKernel(nr);
            this.sentPlanes = new int[2][blocksPerFrame];
            this.symbolPlanes = new double[4][blocksPerFrame];
            this.gridPlanes = new double[8][blocksPerFrame];
            this.receivedPlanes = new double[4 * nr][blocksPerFrame];
            this.estimatePlanes = new double[4][blocksPerFrame];
        } else {
            this.alamouti = null;
            this.sentPlanes = null;
            this.symbolPlanes = null;
            this.gridPlanes = null;
            this.receivedPlanes = null;
            this.estimatePlanes = null;
        }
    }

    public LinkSettings settings() {
        return settings;
    }

    /** Where the chain copies the true channel of each fading block, or null (the default). */
    private ChannelRecorder recorder;

    /** Records the channels of the following frames into {@code recorder} (null to stop). */
    public void recordChannels(ChannelRecorder recorder) {
        this.recorder = recorder;
    }

    /**
     * Simulates frames {@code first .. first+count-1} of an SNR point (the frame number numbers the
     * fading blocks, which select a recorded trace's matrices) at noise level {@code n0} (SNR =
     * 1/n0), drawing from {@code draws} frame after frame, and adds them to {@code counters}.
     */
    public void runFrames(Draws draws, double n0, long first, int count, FrameCounters counters) {
        if (codec == null) {
            for (int f = 0; f < count; f++) {
                runUncoded(draws, n0, first + f, counters);
            }
            return;
        }
        for (int done = 0; done < count; done += lanes) {
            int group = Math.min(lanes, count - done);
            for (int lane = 0; lane < group; lane++) {
                sendCoded(draws, n0, first + done + lane, lane);
            }
            codec.decodeReceived(group);
            for (int lane = 0; lane < group; lane++) {
                countCoded(lane, counters);
            }
        }
    }

    private void runUncoded(Draws draws, double n0, long frame, FrameCounters counters) {
        labelErrors[0] = 0;
        labelErrors[1] = 0;
        if (alamouti != null) {
            // symbol k of code block i is label 2i + k of the frame, in plane k
            draws.fillLabels(sentPlanes, 0, blocksPerFrame, bitsPerSymbol);
            for (int k = 0; k < 2; k++) {
                constellation.mapLabels(sentPlanes[k], symbolPlanes[2 * k], symbolPlanes[2 * k + 1], 0, blocksPerFrame);
            }
            transmit(draws, n0, frame);
            for (int k = 0; k < 2; k++) {
                constellation.countHardErrors(sentPlanes[k], symbolPlanes[2 * k], symbolPlanes[2 * k + 1],
                        estimatePlanes[2 * k], estimatePlanes[2 * k + 1], 0, blocksPerFrame, labelErrors);
            }
        } else {
            draws.fillLabels(sent, 0, symbols, bitsPerSymbol);
            constellation.mapLabels(sent, 0, txSymbols, 0, symbols);
            transmit(draws, n0, frame);
            constellation.countHardErrors(sent, 0, txSymbols, estimates, 0, symbols, labelErrors);
        }
        counters.addFrame(frameBits, labelErrors[0], symbols, labelErrors[1]);
    }

    /** One coded frame up to its LLRs, which go into a lane of the codec; counts raw symbol errors. */
    private void sendCoded(Draws draws, double n0, long frame, int lane) {
        byte[] bits = payload[lane];
        draws.fillBits(bits, 0, frameBits);
        codec.encode(bits, 0, codedBits, 0);
        // padding up to whole code blocks: random bits, sent and ignored
        draws.fillBits(codedBits, codedLength, codedBits.length - codedLength);
        constellation.map(codedBits, 0, txSymbols, 0, symbols);
        transmit(draws, n0, frame);
        constellation.demap(settings.coding().llr(), estimates, gain, 0, n0, llr, 0, symbols);
        codec.receive(lane, llr, 0);
        // raw symbol errors: the sign of each coded bit's LLR against the bit sent
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
    private void countCoded(int lane, FrameCounters counters) {
        boolean crcOk = codec.decided(lane, payloadOut, 0);
        byte[] bits = payload[lane];
        int bitErrors = 0;
        for (int i = 0; i < frameBits; i++) {
            bitErrors += bits[i] ^ payloadOut[i];
        }
        counters.addFrame(frameBits, bitErrors, symbols, rawSymbolErrors[lane], withCrc && !crcOk,
                withCrc && crcOk && bitErrors > 0);
    }

    /**
     * Space-time encoding, the channel of each fading block, the receiver's channel estimate, and
     * combining with it: txSymbols → estimates, gain.
     */
    private void transmit(Draws draws, double n0, long frame) {
        if (n0 != combinerN0 && settings.decoder() == Decoder.MMSE) {
            // MMSE weights depend on the noise level: a new combiner when the SNR point changes
            combiner = settings.code().newCombiner(nr, Decoder.MMSE, n0);
            combinerN0 = n0;
        }
        long fade = frame * fadesPerFrame;
        for (int first = 0; first < blocksPerFrame; first += blocksPerFade, fade++) {
            int blocks = Math.min(blocksPerFade, blocksPerFrame - first);
            channel.startBlock(draws, fade, blocks * t);
            if (alamouti != null) {
                AlamoutiKernel.encode(symbolPlanes, first, blocks, gridPlanes);
                channel.transmit(gridPlanes, first, n0, draws, receivedPlanes);
                channel.estimate(n0, draws, hHat);
                alamouti.setChannel(hHat);
                alamouti.combine(receivedPlanes, first, blocks, estimatePlanes);
            } else {
                encoder.encode(txSymbols, first * k, blocks, grid, 0);
                channel.transmit(grid, 0, n0, draws, received, 0);
                channel.estimate(n0, draws, hHat);
                combiner.setChannel(hHat);
                combiner.combine(received, 0, blocks, estimates, gain, first * k);
            }
            if (recorder != null) {
                recorder.record(channel, fade);
            }
        }
    }

    /** Whether this chain takes the planar path. */
    boolean planar() {
        return alamouti != null;
    }

    /** The last frame's symbol estimates, interleaved complex, into {@code out} (for tests). */
    void copyEstimates(double[] out) {
        if (alamouti == null) {
            System.arraycopy(estimates, 0, out, 0, 2 * symbols);
            return;
        }
        for (int i = 0; i < blocksPerFrame; i++) {
            for (int j = 0; j < 4; j++) {
                out[4 * i + j] = estimatePlanes[j][i];
            }
        }
    }
}
