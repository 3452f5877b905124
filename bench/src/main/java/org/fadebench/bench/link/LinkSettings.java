package org.fadebench.bench.link;

import java.io.Serializable;
import org.fadebench.bench.settings.InvalidSettingException;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.Fading;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.modem.Modulation;

/**
 * What one link is: modulation, space-time code, antennas, fading and frame layout. Validated on
 * construction, so a {@code LinkSettings} object always describes a link that can be simulated;
 * every message names the setting at fault ({@link InvalidSettingException}) and the valid choices.
 *
 * @param frameBits       information bits per frame; a whole number of code blocks
 * @param coherenceSlots  slots (symbol periods) per fading block; 0 means the whole frame
 * @param equaliser       linear equaliser in front of the slicer or demapper (matched filter, ZF or
 *                        MMSE; option {@code --decoder}); all coincide for orthogonal codes
 * @param channel         fading model, correlation, Doppler, receiver CSI, or a recorded trace
 * @param coding          CRC, channel code, interleaver and LLRs; {@link FrameCoding#NONE} for uncoded
 */
public record LinkSettings(Modulation modulation, SpaceTimeCode code, int receiveAntennas,
                           int transmitAntennas, ChannelSpec channel, int frameBits, int coherenceSlots,
                           Equaliser equaliser, FrameCoding coding) implements Serializable {

    /**
     * Frame length used when the user gives none: rounded up to whole code blocks when uncoded, the
     * nearest payload the channel code serves when coded ({@link FecScheme#payloadNear}).
     */
    public static final int DEFAULT_FRAME_BITS = 1024;

    /** Most information bits per frame. */
    public static final int MAX_FRAME_BITS = 1 << 24;

    /** A link equalised by the matched filter. */
    public LinkSettings(Modulation modulation, SpaceTimeCode code, int receiveAntennas, int transmitAntennas,
                        Fading fading, int frameBits, int coherenceSlots) {
        this(modulation, code, receiveAntennas, transmitAntennas, ChannelSpec.of(fading), frameBits, coherenceSlots,
                Equaliser.MF, FrameCoding.NONE);
    }

    /** A link over a plain fading model with perfect CSI. */
    public LinkSettings(Modulation modulation, SpaceTimeCode code, int receiveAntennas, int transmitAntennas,
                        Fading fading, int frameBits, int coherenceSlots, Equaliser equaliser, FrameCoding coding) {
        this(modulation, code, receiveAntennas, transmitAntennas, ChannelSpec.of(fading), frameBits, coherenceSlots,
                equaliser, coding);
    }

    /** An uncoded link. */
    public LinkSettings(Modulation modulation, SpaceTimeCode code, int receiveAntennas, int transmitAntennas,
                        Fading fading, int frameBits, int coherenceSlots, Equaliser equaliser) {
        this(modulation, code, receiveAntennas, transmitAntennas, ChannelSpec.of(fading), frameBits, coherenceSlots,
                equaliser, FrameCoding.NONE);
    }

    /** The fading model's name (a trace reports the model it replaces, see {@link ChannelSpec#modelName}). */
    public String fading() {
        return channel.modelName();
    }

    public LinkSettings {
        if (transmitAntennas <= 0) {
            throw new InvalidSettingException(RunSettings.TX, "must be a positive number of transmit antennas, got "
                    + transmitAntennas);
        }
        if (receiveAntennas <= 0) {
            throw new InvalidSettingException(RunSettings.RX, "must be a positive number of receive antennas, got "
                    + receiveAntennas);
        }
        if (receiveAntennas > 64) {
            throw new InvalidSettingException(RunSettings.RX, receiveAntennas + " is more than the 64 supported");
        }
        if (code.transmitAntennas() != transmitAntennas) {
            throw new InvalidSettingException(RunSettings.CODE, code.name() + " needs exactly "
                    + code.transmitAntennas() + " transmit antenna" + (code.transmitAntennas() == 1 ? "" : "s")
                    + " (--tx " + code.transmitAntennas() + "), got --tx " + transmitAntennas);
        }
        int blockBits = code.symbolsPerBlock() * modulation.bitsPerSymbol();
        if (frameBits <= 0) {
            throw new InvalidSettingException(RunSettings.FRAME_BITS, "must be a positive number of information bits, got "
                    + frameBits);
        }
        if (!coding.coded() && frameBits % blockBits != 0) {
            throw new InvalidSettingException(RunSettings.FRAME_BITS, frameBits + " does not fill whole code blocks: "
                    + code.name() + " with " + modulation.cliName() + " carries " + blockBits
                    + " bits per block, so use a positive multiple of " + blockBits + " (e.g. "
                    + roundUpToBlocks(DEFAULT_FRAME_BITS, modulation, code) + ")");
        }
        if (frameBits > MAX_FRAME_BITS) {
            throw new InvalidSettingException(RunSettings.FRAME_BITS, frameBits + " is more than the 16777216 supported");
        }
        coding.check(frameBits);
        channel.check(receiveAntennas, transmitAntennas);
        if (equaliser == Equaliser.ZF && !code.isOrthogonal()
                && (long) code.slotsPerBlock() * receiveAntennas * 2 < 2L * code.symbolsPerBlock()) {
            throw new InvalidSettingException(RunSettings.DECODER, "zf cannot separate " + code.symbolsPerBlock()
                    + " symbols from " + code.slotsPerBlock() + " slot(s) x " + receiveAntennas
                    + " receive antenna(s); use --decoder mmse or more receive antennas");
        }
        if (coherenceSlots < 0 || coherenceSlots % code.slotsPerBlock() != 0) {
            throw new InvalidSettingException(RunSettings.COHERENCE, coherenceSlots + " must be a positive multiple of "
                    + code.name() + "'s " + code.slotsPerBlock() + " slot" + (code.slotsPerBlock() == 1 ? "" : "s")
                    + " per block (the channel is constant over a code block), or omitted for the whole frame");
        }
    }

    /** The smallest multiple of the code block's bits that is at least {@code bits}. */
    public static int roundUpToBlocks(int bits, Modulation modulation, SpaceTimeCode code) {
        int blockBits = code.symbolsPerBlock() * modulation.bitsPerSymbol();
        return ((bits + blockBits - 1) / blockBits) * blockBits;
    }

    /** Bits sent per frame: the information bits, or the coded bits of a coded frame. */
    public int codedBitsPerFrame() {
        return coding.codedBits(frameBits);
    }

    /** QAM symbols per frame: the sent bits in whole code blocks (a coded frame is padded). */
    public int symbolsPerFrame() {
        int blockBits = code.symbolsPerBlock() * modulation.bitsPerSymbol();
        int blocks = (codedBitsPerFrame() + blockBits - 1) / blockBits;
        return blocks * code.symbolsPerBlock();
    }

    public int blocksPerFrame() {
        return symbolsPerFrame() / code.symbolsPerBlock();
    }

    /**
     * Lanes: how many frames the receiver decodes together (see {@link FecScheme#lanes}); 1 for an
     * uncoded link.
     */
    public int lanes() {
        return coding.scheme().lanes(frameBits);
    }

    /** Channel uses (slots) per frame. */
    public int slotsPerFrame() {
        return blocksPerFrame() * code.slotsPerBlock();
    }

    /** Slots per fading block, with 0 resolved to the whole frame and capped at the frame. */
    public int effectiveCoherenceSlots() {
        return coherenceSlots == 0 ? slotsPerFrame() : Math.min(coherenceSlots, slotsPerFrame());
    }

    /** Independent fading blocks per frame. */
    public int fadingBlocksPerFrame() {
        int c = effectiveCoherenceSlots();
        return (slotsPerFrame() + c - 1) / c;
    }

    /** Information bits per channel use R: bits per symbol times the code's symbol rate. */
    public double bitsPerChannelUse() {
        return (double) frameBits / slotsPerFrame();
    }

    /**
     * The share of slots spent on pilots ({@code --pilots}, N per fading block), 0 without: pilots
     * are not counted in the SNR or in {@link #bitsPerChannelUse}, only reported as this overhead.
     */
    public double pilotOverhead() {
        return channel.pilotOverhead(slotsPerFrame(), fadingBlocksPerFrame());
    }

    /** Information bits per channel use with the pilot slots counted: R·(1 − pilot overhead). */
    public double netBitsPerChannelUse() {
        return bitsPerChannelUse() * (1.0 - pilotOverhead());
    }

    /** Eb/N0 in dB at a given SNR in dB: Eb/N0 = SNR / R. */
    public double ebN0Db(double snrDb) {
        return snrDb - 10.0 * Math.log10(bitsPerChannelUse());
    }

    /** One line for tables and file headers. */
    public String describe() {
        String coherence = channel.awgn() ? ""
                : coherenceSlots == 0 || coherenceSlots >= slotsPerFrame()
                ? ", one fading block per frame"
                : ", " + effectiveCoherenceSlots() + " slots per fading block (" + fadingBlocksPerFrame() + " per frame)";
        String dec = code.isOrthogonal() ? "" : ", " + equaliser.cliName() + " decoder";
        String fec = coding.coded() ? ", " + coding.describe() : "";
        return String.format(java.util.Locale.ROOT, "%s %dx%d, %s, %s, %d bits/frame (%d symbols, %d slots)%s%s%s",
                code.name(), transmitAntennas, receiveAntennas, modulation.cliName(), channel.describe(),
                frameBits, symbolsPerFrame(), slotsPerFrame(), coherence, dec, fec);
    }
}
