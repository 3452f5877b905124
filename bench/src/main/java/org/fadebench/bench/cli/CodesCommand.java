package org.fadebench.bench.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodeFile;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code fadebench codes}: the space-time code catalogue with the properties of each code checked
 * numerically (orthogonality, the rank criterion for full diversity), not asserted from its name.
 */
@Command(name = "codes", mixinStandardHelpOptions = true,
        description = "List the space-time block codes with their size, rate, power scale and numerical checks.")
final class CodesCommand implements Callable<Integer> {

    @Option(names = "--code-file", paramLabel = "FILE",
            description = "Also check a code of your own from a YAML or JSON file.")
    Path codeFile;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        List<SpaceTimeCode> codes = new ArrayList<>();
        for (SpaceTimeCode c : SpaceTimeCodes.all()) {
            codes.add(c);
        }
        if (codeFile != null) {
            try {
                codes.add(SpaceTimeCodeFile.read(codeFile));
            } catch (IllegalArgumentException e) {
                throw new InvalidInputException("--code-file: " + e.getMessage());
            }
        }
        PrintWriter w = spec.commandLine().getOut();
        String fmt = "%-10s %3s %3s %3s %6s %-10s %-14s %s%n";
        w.printf(Locale.ROOT, fmt, "code", "Tx", "K", "T", "rate", "orthogonal", "full diversity", "power scale");
        for (SpaceTimeCode c : codes) {
            w.printf(Locale.ROOT, fmt, c.name(), c.transmitAntennas(), c.symbolsPerBlock(), c.slotsPerBlock(),
                    String.format(Locale.ROOT, "%.3f", c.rate()), c.isOrthogonal() ? "yes" : "no",
                    c.hasFullDiversity() ? "yes" : "no", c.scaleNote());
        }
        w.println();
        w.println("K symbols are sent over T slots; rate = K/T symbols per channel use. orthogonal: X^H X is a "
                + "multiple of the identity for random symbols (checked numerically); full diversity: the rank "
                + "criterion on symbol differences (checked numerically). Each code is scaled to unit total "
                + "energy per slot, so each symbol arrives with SNR |H|^2 SNR / (Tx rate).");
        w.flush();
        return ExitCodes.OK;
    }
}
