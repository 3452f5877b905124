package org.fadebench.bench.cli;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.fadebench.bench.report.Checkpoint;
import org.fadebench.bench.report.FerPlot;
import org.fadebench.bench.report.HtmlReport;
import org.fadebench.bench.run.RunPlan;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.settings.Setting;

/**
 * The files a run reads and writes, and the checks made on them before anything is simulated: no
 * output may be an input or another output, a folder holding another run's results is not reused
 * without {@code --overwrite}, and every destination must be writable.
 */
final class RunOutputs {

    static final String RESULTS_CSV = "results.csv";
    static final String RESULTS_JSON = "results.json";
    static final String SCENARIO = "scenario.yaml";

    /** The files of the output folder that belong to a run: its results and its checkpoint. */
    static final List<String> FOLDER_FILES = List.of(RESULTS_CSV, RESULTS_JSON, FerPlot.PNG_FILE, FerPlot.SVG_FILE,
            HtmlReport.FILE, SCENARIO, Checkpoint.FILE_NAME);

    /** A file the run reads or writes, with the words that name it in a message. */
    record Named(String label, Path path) {
    }

    private RunOutputs() {
    }

    /**
     * The path made absolute and normalised, with its deepest existing ancestor replaced by that
     * ancestor's real path (symbolic links resolved), so that two names of one file compare equal.
     */
    static Path resolved(Path p) {
        Path abs = p.toAbsolutePath().normalize();
        Path existing = abs;
        while (existing != null && !Files.exists(existing)) {
            existing = existing.getParent();
        }
        if (existing == null) {
            return abs;
        }
        try {
            return existing.toRealPath().resolve(existing.relativize(abs)).normalize();
        } catch (IOException e) {
            return abs;
        }
    }

    /**
     * The checks made before a run: its outputs are distinct from its inputs and each other, and its
     * folder holds no other run's results (unless {@code --overwrite}).
     *
     * @param scenarioFile the scenario file read, or null
     */
    static void checkBeforeRun(RunPlan plan, Path scenarioFile, boolean resume) {
        String text = plan.scenarioText();
        checkDistinct(inputs(plan, scenarioFile), outputs(plan), text);
        checkFolderReuse(plan.outDir(), plan.values().flag(RunSettings.OVERWRITE), resume, text);
    }

    /** The files the run reads. */
    static List<Named> inputs(RunPlan plan, Path scenarioFile) {
        List<Named> in = new ArrayList<>();
        if (scenarioFile != null) {
            in.add(new Named("the scenario file " + scenarioFile, scenarioFile));
        }
        for (Setting s : List.of(RunSettings.CODE_FILE, RunSettings.FEC_FILE, RunSettings.TRACE)) {
            if (plan.values().isSet(s)) {
                in.add(new Named(s.option() + " " + plan.values().text(s), Path.of(plan.values().text(s))));
            }
        }
        return in;
    }

    /** The run folder's files, the archive and the trace written, as outputs. */
    static List<Named> outputs(RunPlan plan) {
        List<Named> o = new ArrayList<>();
        for (String f : FOLDER_FILES) {
            o.add(new Named("--out " + plan.outDir() + " (its " + f + ")", plan.outDir().resolve(f)));
        }
        if (plan.archive() != null) {
            o.add(new Named("--archive " + plan.archive(), plan.archive()));
        }
        if (plan.traceOut() != null) {
            o.add(new Named("--trace-out " + plan.traceOut(), plan.traceOut()));
        }
        return o;
    }

    /**
     * Refuses an output that is an input or another output. The one exception: the run folder's
     * scenario.yaml may be the scenario file being read when it would be written with the same bytes
     * (a run repeated in its own folder loses nothing).
     */
    static void checkDistinct(List<Named> inputs, List<Named> outputs, String scenarioText) {
        List<Named> seen = new ArrayList<>();
        for (Named in : inputs) {
            seen.add(new Named(in.label() + " (read by this run)", resolved(in.path())));
        }
        for (Named out : outputs) {
            Path p = resolved(out.path());
            for (Named s : seen) {
                if (s.path().equals(p) && !(out.path().endsWith(SCENARIO) && sameBytes(p, scenarioText))) {
                    throw new InvalidInputException(out.label() + " is the same file as " + s.label()
                            + "; every input and output of a run must be a different file");
                }
            }
            seen.add(new Named(out.label(), p));
        }
    }

    /**
     * Refuses a folder that holds another run's results unless {@code --overwrite} is given, and one
     * that holds an interrupted run's checkpoint unless {@code --resume} or {@code --overwrite} is.
     * A folder whose scenario.yaml is this run's, byte for byte, holds the same run: repeating it
     * is allowed.
     */
    static void checkFolderReuse(Path dir, boolean overwrite, boolean resume, String scenarioText) {
        if (overwrite || !Files.isDirectory(dir)) {
            return;
        }
        boolean checkpoint = Files.exists(dir.resolve(Checkpoint.FILE_NAME));
        if (checkpoint && !resume) {
            throw new InvalidInputException("--out " + dir + " holds the checkpoint of an interrupted run: "
                    + "continue it with --resume, or give --overwrite to start over");
        }
        if (checkpoint || sameBytes(dir.resolve(SCENARIO), scenarioText)) {
            return;
        }
        List<String> held = FOLDER_FILES.stream().filter(f -> Files.exists(dir.resolve(f))).toList();
        if (!held.isEmpty()) {
            throw new InvalidInputException("--out " + dir + " already holds the results of another run ("
                    + String.join(", ", held) + "): give another --out, or --overwrite to replace them");
        }
    }

    private static boolean sameBytes(Path file, String text) {
        try {
            return Files.isRegularFile(file) && Files.size(file) <= 1 << 20
                    && Arrays.equals(Files.readAllBytes(file), text.getBytes(StandardCharsets.UTF_8));
        } catch (IOException e) {
            return false;
        }
    }

    /**
     * Makes the output folder and the folders of the archive and the trace, and writes and removes a
     * probe file in each, so that an unwritable destination fails before the sweep, not after it.
     *
     * @throws UncheckedIOException with a plain one-line message naming the option
     */
    static void checkWritable(RunPlan plan) {
        probe("--out " + plan.outDir(), plan.outDir());
        if (plan.archive() != null) {
            probe("--archive " + plan.archive(), plan.archive().toAbsolutePath().getParent());
        }
        if (plan.traceOut() != null) {
            probe("--trace-out " + plan.traceOut(), plan.traceOut().toAbsolutePath().getParent());
        }
    }

    private static void probe(String label, Path folder) {
        try {
            Path existing = folder.toAbsolutePath();
            while (!Files.exists(existing)) {
                existing = existing.getParent();
            }
            if (!Files.isDirectory(existing)) {
                throw new NotDirectoryException(existing.toString());
            }
            Files.createDirectories(folder);
            Path probe = folder.resolve(".fadebench-probe-" + ProcessHandle.current().pid() + ".tmp");
            Files.newOutputStream(probe, StandardOpenOption.CREATE, StandardOpenOption.WRITE).close();
            Files.delete(probe);
        } catch (IOException e) {
            throw new UncheckedIOException(new IOException(label + ": cannot write there (" + describe(e) + ")", e));
        }
    }

    /** An I/O failure in plain words, without the Java exception's name. */
    static String describe(IOException e) {
        if (e instanceof FileSystemException f) {
            String file = f.getFile() == null ? "" : f.getFile() + ": ";
            if (f instanceof AccessDeniedException) {
                return file + "permission denied";
            }
            if (f instanceof NoSuchFileException) {
                return file + "no such file or folder";
            }
            if (f instanceof NotDirectoryException) {
                return file + "not a folder";
            }
            if (f instanceof java.nio.file.FileAlreadyExistsException) {
                return file + "already exists";
            }
            return file + (f.getReason() != null ? f.getReason() : "failed");
        }
        return e.getMessage() != null ? e.getMessage() : "read or write failed";
    }
}
