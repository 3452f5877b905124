package org.fadebench.bench.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodeFile;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import picocli.CommandLine.Option;

/** The options that name a link's antennas, space-time code and modulation (shared by run and bounds). */
final class LinkOptions {

    @Option(names = "--code", paramLabel = "NAME",
            description = "Space-time block code: ${COMPLETION-CANDIDATES} (default: none; see 'fadebench codes').",
            completionCandidates = CodeNames.class)
    String code;

    @Option(names = "--code-file", paramLabel = "FILE",
            description = "A linear space-time code of your own, from a YAML or JSON file (see README), instead of --code.")
    Path codeFile;

    @Option(names = "--tx", paramLabel = "N", description = "Transmit antennas (default: what the code needs).")
    Integer tx;

    @Option(names = "--rx", paramLabel = "N", defaultValue = "1", description = "Receive antennas (default: ${DEFAULT-VALUE}).")
    int rx;

    @Option(names = "--mod", paramLabel = "NAME", defaultValue = "qpsk",
            description = "Modulation: bpsk, qpsk, 16qam, 64qam, 256qam (default: ${DEFAULT-VALUE}).")
    String modulation;

    Modulation modulation() {
        return RunCommand.parse("--mod", () -> Modulation.fromCliName(modulation));
    }

    SpaceTimeCode code() {
        if (code != null && codeFile != null) {
            throw new InvalidInputException("--code-file " + codeFile + ": give either --code or --code-file, not both");
        }
        return codeFile != null
                ? RunCommand.parse("--code-file", () -> SpaceTimeCodeFile.read(codeFile))
                : RunCommand.parse("--code", () -> SpaceTimeCodes.byName(code == null ? "none" : code));
    }

    /** Transmit antennas: as given, or what the code needs. */
    int transmitAntennas(SpaceTimeCode stbc) {
        return tx != null ? tx : stbc.transmitAntennas();
    }

    /** Catalogue names for the help text. */
    static final class CodeNames implements Iterable<String> {
        @Override
        public Iterator<String> iterator() {
            List<String> names = new ArrayList<>();
            for (SpaceTimeCode c : SpaceTimeCodes.all()) {
                names.add(c.name());
            }
            return names.iterator();
        }
    }
}
