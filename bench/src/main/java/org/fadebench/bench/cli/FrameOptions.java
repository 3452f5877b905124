package org.fadebench.bench.cli;

import org.fadebench.bench.link.FrameCoding;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import picocli.CommandLine.Option;

/**
 * The options that set a frame's rate and its fading blocks: channel code, CRC, frame length and
 * coherence (shared by run and bounds).
 */
final class FrameOptions {

    @Option(names = "--fec", paramLabel = "NAME", defaultValue = "none",
            description = "Channel code: none, conv-r12, conv-r23, conv-r34 (64-state (133,171) code, punctured), "
                    + "conv-small (4-state (5,7)) (default: ${DEFAULT-VALUE}).")
    String fec;

    @Option(names = "--crc", paramLabel = "NAME", defaultValue = "none",
            description = "CRC appended to each frame: none, crc16, crc24, crc32 (default: ${DEFAULT-VALUE}).")
    String crc;

    @Option(names = "--frame-bits", paramLabel = "N",
            description = "Information bits per frame, a whole number of code blocks (default: 1024 rounded up to whole blocks).")
    Integer frameBits;

    @Option(names = "--coherence", paramLabel = "SLOTS", defaultValue = "0",
            description = "Symbol periods per fading block, a multiple of the code's slots (default: the whole frame).")
    int coherence;

    /**
     * The frame's coding: CRC and code from these options; {@code interleaving} as chosen, or null
     * for the default (random when coded, none otherwise).
     */
    FrameCoding coding(Interleaving interleaving, int interleaverRows, LlrMethod llr) {
        Crc c = RunCommand.parse("--crc", () -> Crc.fromCliName(crc));
        ChannelCode code = RunCommand.parse("--fec", () -> ChannelCode.fromCliName(fec));
        boolean coded = c != Crc.NONE || code != ChannelCode.NONE;
        Interleaving il = interleaving != null ? interleaving : coded ? Interleaving.RANDOM : Interleaving.NONE;
        return RunCommand.parse(null, () -> new FrameCoding(new FecScheme(c, code), il, interleaverRows, llr));
    }

    /** Information bits per frame: as given, or the default (rounded up to whole code blocks when uncoded). */
    int frameBits(boolean coded, Modulation modulation, SpaceTimeCode code) {
        return frameBits != null ? frameBits
                : coded ? LinkSettings.DEFAULT_FRAME_BITS
                : LinkSettings.roundUpToBlocks(LinkSettings.DEFAULT_FRAME_BITS, modulation, code);
    }
}
