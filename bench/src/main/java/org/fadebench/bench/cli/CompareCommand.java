package org.fadebench.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.Callable;
import java.util.stream.Stream;
import org.fadebench.bench.study.DesignRow;
import org.fadebench.bench.study.StudyOutputs;
import org.fadebench.bench.study.StudyTable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code fadebench compare DIR1 DIR2 … [--out DIR]}: finished runs (or a study's folders) in one
 * ranking, from their results.json alone, without simulating. Runs with different SNR conventions
 * or target FERs are refused; runs of different tool versions are flagged.
 */
@Command(name = "compare", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Rank finished runs side by side without simulating: each DIR is a run folder, or a study "
                + "folder (its designs' folders are taken). Prints the ranking; with --out writes study.csv, "
                + "study.json, fer.png, fer.svg (every run's FER) and report.html there."})
final class CompareCommand implements Callable<Integer> {

    @Parameters(arity = "1..*", paramLabel = "DIR", description = "Run folders (or study folders).")
    List<Path> dirs;

    @Option(names = "--out", paramLabel = "DIR", description = "Write study.csv, study.json, the plot and report.html "
            + "into DIR.")
    String out;

    @Option(names = "--budget-db", paramLabel = "DB", description = "The SNR the link budget allows, dB (meets_target).")
    Double budgetDb;

    @Option(names = "--x-axis", paramLabel = "NAME", description = "X axis of the plot: snr, ebn0 (default: snr).")
    String xAxis;

    @Option(names = "--with-bounds", description = "Draw each run's QAM-constrained outage bound, dashed in its colour.")
    boolean withBounds;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        Path outDir = out == null ? null : SweepJob.checkOutDir(out);
        if (outDir != null) {
            StudyRunner.checkNotARun(outDir);
        }
        StudyOutputs.Figure figure = new StudyOutputs.Figure(StudyCommand.xQuantity(xAxis), withBounds);
        List<DesignRow> rows = rows(dirs);
        StudyTable table = StudyTable.ranked("comparison of " + String.join(", ", dirs.stream().map(Path::toString)
                .toList()), budgetDb == null ? Double.NaN : budgetDb, rows, List.of(), List.of(), flags(rows));
        PrintWriter w = spec.commandLine().getOut();
        table.lines().forEach(w::println);
        if (outDir != null) {
            try {
                StudyOutputs.write(outDir, table, figure, table.sentences(), RunCommand.commandArgs(spec))
                        .forEach(p -> w.println("wrote " + p));
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        w.flush();
        return ExitCodes.OK;
    }

    /**
     * One row per run folder: each DIR, or each sub-folder of a study folder (one holding study.json
     * and no results.json) that holds a run. A row is named by its folder, or by its parent and
     * folder where two folders share a name.
     */
    static List<DesignRow> rows(List<Path> dirs) {
        List<Path> folders = new ArrayList<>();
        for (Path d : dirs) {
            if (!Files.isDirectory(d)) {
                throw new InvalidInputException(d + ": no such folder; give run folders (or study folders)");
            }
            if (!Files.exists(d.resolve(DesignRow.RESULTS_JSON)) && Files.exists(d.resolve(StudyOutputs.JSON))) {
                try (Stream<Path> s = Files.list(d)) {
                    s.filter(p -> Files.isRegularFile(p.resolve(DesignRow.RESULTS_JSON))).sorted().forEach(folders::add);
                } catch (IOException e) {
                    throw new UncheckedIOException(e);
                }
            } else {
                folders.add(d);
            }
        }
        Set<String> seen = new HashSet<>();
        Set<String> repeated = new HashSet<>();
        for (Path f : folders) {
            if (!seen.add(name(f))) {
                repeated.add(name(f));
            }
        }
        Set<Path> distinct = new LinkedHashSet<>();
        List<DesignRow> rows = new ArrayList<>();
        for (Path f : folders) {
            if (!distinct.add(f.toAbsolutePath().normalize())) {
                throw new InvalidInputException(f + ": given twice");
            }
            String n = repeated.contains(name(f)) && f.toAbsolutePath().getParent().getFileName() != null
                    ? f.toAbsolutePath().normalize().getParent().getFileName() + "/" + name(f) : name(f);
            try {
                rows.add(DesignRow.read(n, f));
            } catch (IllegalArgumentException e) {
                throw new InvalidInputException(e.getMessage());
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        DesignRow first = rows.get(0);
        for (DesignRow r : rows) {
            if (!r.snrConvention().equals(first.snrConvention())) {
                throw new InvalidInputException(r.folder() + ": its SNR convention differs from " + first.folder()
                        + "'s ('" + r.snrConvention() + "' against '" + first.snrConvention() + "'); their SNRs cannot "
                        + "be compared");
            }
            if (r.targetFer() != first.targetFer()) {
                throw new InvalidInputException(r.folder() + ": its target FER " + r.targetFer() + " differs from "
                        + first.folder() + "'s " + first.targetFer() + "; rerun one with --target-fer to compare them");
            }
        }
        return rows;
    }

    private static String name(Path f) {
        Path n = f.toAbsolutePath().normalize().getFileName();
        return n == null ? f.toString() : n.toString();
    }

    /** Tool versions that differ between the runs, as a flag for the table. */
    static List<String> flags(List<DesignRow> rows) {
        Set<String> versions = new LinkedHashSet<>();
        rows.forEach(r -> versions.add(r.version()));
        if (versions.size() < 2) {
            return List.of();
        }
        List<String> parts = rows.stream().map(r -> r.design() + " " + r.version()).toList();
        return List.of("runs written by different tool versions (" + String.join(", ", parts)
                + "): numbers of one seed may differ between versions");
    }
}
