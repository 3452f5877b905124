package org.fadebench.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.report.AtomicFiles;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.ChannelCodes;
import org.fadebench.coding.fec.ldpc.LdpcCode;
import org.fadebench.coding.fec.ldpc.LdpcCodeFile;
import org.fadebench.coding.fec.ldpc.MatrixMarketWriter;
import org.fadebench.coding.fec.ldpc.ParityCheckMatrix;
import org.fadebench.coding.fec.ldpc.ParityCheckSummary;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodeFile;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code fadebench codes}: the space-time code catalogue with the properties of each code checked
 * numerically (orthogonality, the rank criterion for full diversity), not asserted from its name;
 * then the channel codes at a payload size (n, k, rate; for LDPC codes the degree distributions and
 * the girth measured on the parity-check matrix used), and on request that matrix written to a
 * Matrix Market file. Every input is checked before anything is printed or written.
 */
@Command(name = "codes", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"List the space-time block codes with their size, rate, power scale and numerical checks, and "
            + "the channel codes with k, n and rate at --frame-bits (LDPC codes also with degrees and girth).",
            "With --export-h, write the parity-check matrix of the LDPC code chosen by --fec or --fec-file."})
final class CodesCommand implements Callable<Integer> {

    @Option(names = "--code-file", paramLabel = "FILE",
            description = "Also check a space-time code of your own from a YAML or JSON file.")
    Path codeFile;

    @Option(names = "--fec", paramLabel = "NAME",
            description = "List only this channel code (and with --export-h, write its parity-check matrix).")
    String fec;

    @Option(names = "--fec-file", paramLabel = "FILE",
            description = "Also list an LDPC code of your own: a parity-check matrix in Matrix Market format (.mtx) or "
                    + "a quasi-cyclic base matrix in YAML (.yaml, .yml).")
    Path fecFile;

    @Option(names = "--frame-bits", paramLabel = "K", defaultValue = "" + LinkSettings.DEFAULT_FRAME_BITS,
            description = "Information bits per frame at which the channel codes are listed (default: ${DEFAULT-VALUE}).")
    int frameBits;

    @Option(names = "--export-h", paramLabel = "FILE.mtx",
            description = "Write the parity-check matrix of the LDPC code chosen by --fec (at --frame-bits) or "
                    + "--fec-file (as read) in Matrix Market format.")
    Path exportH;

    @Option(names = "--overwrite", description = "Replace an existing --export-h file.")
    boolean overwrite;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    /** A channel code as listed: its name, k, n and, for an LDPC code, the parity-check matrix used. */
    private record Listed(String name, int k, int n, ParityCheckMatrix matrix) {
    }

    @Override
    public Integer call() {
        if (frameBits < 1 || frameBits > LinkSettings.MAX_FRAME_BITS) {
            throw new InvalidInputException("--frame-bits must be a whole number from 1 to " + LinkSettings.MAX_FRAME_BITS
                    + ", got " + frameBits);
        }
        if (fec != null && fecFile != null) {
            throw new InvalidInputException("give either --fec or --fec-file, not both");
        }
        if (exportH != null) {
            checkExport();
        }
        List<SpaceTimeCode> spaceTime = new ArrayList<>();
        SpaceTimeCodes.all().forEach(spaceTime::add);
        if (codeFile != null) {
            try {
                spaceTime.add(SpaceTimeCodeFile.read(codeFile));
            } catch (IllegalArgumentException e) {
                throw new InvalidInputException("--code-file: " + e.getMessage());
            }
        }
        List<Listed> channel = channelCodes();
        Listed chosen = channel.get(channel.size() - 1); // with --export-h: the one --fec lists, or --fec-file's (last)
        if (exportH != null) {
            export(chosen);
        }
        PrintWriter w = spec.commandLine().getOut();
        printSpaceTimeCodes(w, spaceTime);
        w.println();
        printChannelCodes(w, channel);
        if (exportH != null) {
            ParityCheckMatrix h = chosen.matrix();
            w.printf(Locale.ROOT, "%nwrote %s: the %d x %d parity-check matrix of %s (%d ones)%n", exportH, h.rows(),
                    h.columns(), chosen.name(), h.edges());
        }
        w.flush();
        return ExitCodes.OK;
    }

    /**
     * The parity-check matrix {@code code} uses for frames of {@code infoBits} information bits, or
     * null for a code that is not an LDPC code. This is where LDPC codes plug into the listing and
     * into {@code --export-h}: for the LDPC channel code, return its layout's matrix at
     * {@code infoBits} (a size the code cannot serve throws an {@link IllegalArgumentException},
     * reported as one line naming {@code --frame-bits}).
     */
    static ParityCheckMatrix ldpcMatrix(ChannelCode code, int infoBits) {
        return code instanceof LdpcCode ldpc ? ldpc.layout(infoBits).matrix() : null;
    }

    /** The channel codes to list: all, or the one {@code --fec} names; then the {@code --fec-file} code. */
    private List<Listed> channelCodes() {
        List<ChannelCode> codes;
        try {
            codes = fec == null ? ChannelCodes.standard().all() : List.of(ChannelCodes.standard().find(fec));
        } catch (IllegalArgumentException e) {
            throw new InvalidInputException("--fec: " + e.getMessage());
        }
        List<Listed> listed = new ArrayList<>();
        for (ChannelCode c : codes) {
            try {
                listed.add(new Listed(c.cliName(), frameBits, c.codedBits(frameBits), ldpcMatrix(c, frameBits)));
            } catch (IllegalArgumentException e) {
                throw new InvalidInputException("--frame-bits " + frameBits + " with " + c.cliName() + ": " + e.getMessage());
            }
        }
        if (fecFile != null) {
            ParityCheckMatrix h;
            try {
                h = LdpcCodeFile.read(fecFile);
            } catch (IllegalArgumentException e) {
                throw new InvalidInputException("--fec-file: " + e.getMessage());
            }
            // the file is refused unless H has full row rank, so k = n - m
            listed.add(new Listed(String.valueOf(fecFile.getFileName()), h.columns() - h.rows(), h.columns(), h));
        }
        return listed;
    }

    /** The checks on {@code --export-h} made before anything is read or written. */
    private void checkExport() {
        if (fec == null && fecFile == null) {
            throw new InvalidInputException("--export-h needs the code whose parity-check matrix to write: give --fec NAME"
                    + " or --fec-file FILE");
        }
        if (!String.valueOf(exportH.getFileName()).toLowerCase(Locale.ROOT).endsWith(".mtx")) {
            throw new InvalidInputException("--export-h " + exportH + ": the name must end in .mtx (Matrix Market)");
        }
        List<RunOutputs.Named> inputs = new ArrayList<>();
        if (fecFile != null) {
            inputs.add(new RunOutputs.Named("--fec-file " + fecFile, fecFile));
        }
        if (codeFile != null) {
            inputs.add(new RunOutputs.Named("--code-file " + codeFile, codeFile));
        }
        RunOutputs.checkDistinct(inputs, List.of(new RunOutputs.Named("--export-h " + exportH, exportH)), "");
        if (Files.isDirectory(exportH)) {
            throw new InvalidInputException("--export-h " + exportH + " is a folder; valid: a file name ending in .mtx");
        }
        if (Files.exists(exportH) && !overwrite) {
            throw new InvalidInputException("--export-h " + exportH + " already exists: give another name, or --overwrite"
                    + " to replace it");
        }
    }

    /** Writes the code's matrix, or refuses a code that has none. */
    private void export(Listed code) {
        if (code.matrix() == null) {
            throw new InvalidInputException("--export-h: " + code.name() + " is not an LDPC code and has no parity-check"
                    + " matrix; valid: --fec-file FILE" + ldpcChoices());
        }
        String comment = "parity-check matrix of " + code.name() + ", n = " + code.matrix().columns() + ", k = "
                + code.k() + ", written by fadebench";
        try {
            AtomicFiles.write(exportH, out -> MatrixMarketWriter.write(code.matrix(), comment, out));
        } catch (IOException e) {
            throw new UncheckedIOException(new IOException("--export-h " + exportH + ": " + RunOutputs.describe(e), e));
        }
    }

    /** ", or --fec with one of: a, b" naming the registered LDPC codes, or nothing when there are none. */
    private String ldpcChoices() {
        List<String> names = new ArrayList<>();
        for (ChannelCode c : ChannelCodes.standard().all()) {
            try {
                if (ldpcMatrix(c, frameBits) != null) {
                    names.add(c.cliName());
                }
            } catch (IllegalArgumentException e) {
                names.add(c.cliName()); // an LDPC code, though not at this size
            }
        }
        return names.isEmpty() ? "" : ", or --fec with one of: " + String.join(", ", names);
    }

    private static void printSpaceTimeCodes(PrintWriter w, List<SpaceTimeCode> codes) {
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
    }

    private void printChannelCodes(PrintWriter w, List<Listed> codes) {
        int width = codes.stream().mapToInt(c -> c.name().length()).max().orElse(0);
        String fmt = "%-" + Math.max(12, width) + "s %8s %8s %6s %6s  %s%n";
        w.printf(Locale.ROOT, fmt, "channel code", "k", "n", "rate", "girth", "degrees (degree:count)");
        for (Listed c : codes) {
            ParityCheckSummary s = c.matrix() == null ? null : ParityCheckSummary.of(c.matrix());
            w.printf(Locale.ROOT, fmt, c.name(), c.k(), c.n(), String.format(Locale.ROOT, "%.3f", (double) c.k() / c.n()),
                    s == null ? "-" : s.girthText(),
                    s == null ? "-" : "variable " + s.variableDegrees() + "; check " + s.checkDegrees());
        }
        w.println();
        w.println("k information bits per frame (--frame-bits, here " + frameBits + "; a code file has its own k = n - "
                + "rank) and n bits sent, with the convolutional codes' zero tail and puncturing; rate = k/n. For LDPC "
                + "codes, on the parity-check matrix used: degrees of the variable nodes (columns) and check nodes "
                + "(rows) as degree:count, and the girth (shortest cycle of the Tanner graph; none for a tree), "
                + "measured.");
    }
}
