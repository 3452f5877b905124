package org.fadebench.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.function.Function;
import org.fadebench.bench.report.Checkpoint;
import org.fadebench.bench.run.RunPlan;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.study.DesignRow;
import org.fadebench.bench.study.Screening;
import org.fadebench.bench.study.StudyOutputs;
import org.fadebench.bench.study.StudyPlan;
import org.fadebench.bench.study.StudyTable;
import org.fadebench.bench.sweep.BatchExecutor;

/**
 * Runs a {@link StudyPlan}: each design in turn, on all the study's threads, into its own folder as
 * {@code run} would (with its checkpoint, so Ctrl-C then {@code --resume} continues the design that
 * was running and keeps those finished); then ranks the designs from their folders and writes
 * study.csv and study.json. Used by {@code study} and {@code demo}.
 */
final class StudyRunner {

    private final StudyPlan plan;
    private final boolean resume;
    private final boolean overwrite;
    private final PrintWriter out;
    private final PrintWriter err;
    private final StudyOutputs.Figure figure;
    private final Function<StudyTable, List<String>> sentences;
    private final List<String> args;
    /** The ranking, once {@link #run} has finished every design. */
    private StudyTable table;

    /**
     * @param overwrite replace other runs' results in the designs' folders (the study's --overwrite)
     * @param figure    how the plot of every design is drawn
     * @param sentences the report's sentences about the result, from the ranking
     * @param args      the command line after {@code fadebench}, for the reports' provenance
     */
    StudyRunner(StudyPlan plan, boolean resume, boolean overwrite, PrintWriter out, PrintWriter err,
                StudyOutputs.Figure figure, Function<StudyTable, List<String>> sentences, List<String> args) {
        this.plan = plan;
        this.resume = resume;
        this.overwrite = overwrite;
        this.figure = figure;
        this.sentences = sentences;
        this.args = List.copyOf(args);
        this.out = out;
        this.err = err;
    }

    /**
     * Checks every design's folder before anything is simulated (as {@code run} does for its own),
     * so that a study refused for one design has written nothing.
     *
     * @param studyFile the study file read, or null (the demo's is built in)
     */
    void checkBeforeRun(Path studyFile) {
        checkNotARun(plan.dir());
        for (StudyPlan.Entry e : plan.designs()) {
            RunPlan p = e.plan();
            String text = p.scenarioText();
            RunOutputs.checkDistinct(RunOutputs.inputs(p, studyFile), RunOutputs.outputs(p), text);
            RunOutputs.checkFolderReuse(p.outDir(), overwrite || p.values().flag(RunSettings.OVERWRITE), resume, text);
        }
    }

    /**
     * Refuses, as the folder of a study or comparison, a run's own folder: its plot and report
     * would be replaced by the study's.
     */
    static void checkNotARun(Path dir) {
        SweepJob.checkOutDir(dir.toString());
        if (Files.exists(dir.resolve(RunOutputs.RESULTS_JSON)) || Files.exists(dir.resolve(Checkpoint.FILE_NAME))) {
            throw new InvalidInputException("--out " + dir + " holds a run's results (its plot and report.html would be "
                    + "replaced); give a folder of its own to the study or comparison");
        }
    }

    /**
     * Runs every design not finished yet, all on one executor (started before the first design
     * that runs, so that a study starts Spark once, not once per design); returns the exit code
     * (130 or 143 when interrupted).
     */
    int run() {
        BatchExecutor executor = null;
        try {
            List<DesignRow> rows = new ArrayList<>();
            List<StudyTable.Named> screened = new ArrayList<>();
            int n = plan.designs().size();
            boolean quiet = plan.designs().get(0).plan().quiet();
            for (int i = 0; i < n; i++) {
                StudyPlan.Entry e = plan.designs().get(i);
                if (!quiet) {
                    out.println();
                    out.println("== " + e.name() + " (design " + (i + 1) + " of " + n + ") ==");
                }
                if (plan.file().screen()) {
                    Screening s = Screening.of(e.plan(), plan.file().budgetDb(), plan.file().screenMargin());
                    if (!quiet) {
                        out.println(s.words());
                    }
                    if (s.outcome() == Screening.Outcome.SCREENED_OUT) {
                        screened.add(new StudyTable.Named(e.name(), s.words()));
                        continue;
                    }
                }
                if (resume && finished(e)) {
                    if (!quiet) {
                        out.println("finished earlier; kept: " + e.plan().outDir());
                    }
                } else {
                    if (!quiet) {
                        e.plan().warnings().forEach(w -> err.println("fadebench study: " + e.name() + ": warning: " + w));
                    }
                    if (executor == null) {
                        executor = SweepJob.startExecutor(plan.engine(), plan.threads());
                    }
                    int code = new SweepJob(e.plan(), plan.engine(), resume, out, args).run(executor);
                    if (code != ExitCodes.OK) {
                        out.println("study interrupted in design " + e.name() + "; run the same command with --resume to "
                                + "continue (finished designs are kept)");
                        out.flush();
                        return code;
                    }
                }
                rows.add(read(e));
            }
            List<StudyTable.Named> skipped = plan.skipped().stream()
                    .map(s -> new StudyTable.Named(s.name(), s.reason())).toList();
            table = StudyTable.ranked(plan.file().title(), plan.file().budgetDb(), rows, screened, skipped, List.of());
            try {
                List<Path> written = StudyOutputs.write(plan.dir(), table, figure, sentences.apply(table), args);
                out.println();
                out.println("Ranking (" + plan.file().title() + "):");
                table.lines().forEach(out::println);
                written.forEach(p -> out.println("wrote " + p));
            } catch (IOException ex) {
                throw new UncheckedIOException(ex);
            }
            out.flush();
            return ExitCodes.OK;
        } finally {
            if (executor != null) {
                executor.close();
            }
        }
    }

    /** The ranking of the finished study, or null before. */
    StudyTable table() {
        return table;
    }

    /** A design's folder holds its finished run: results, no checkpoint, and this design's scenario, byte for byte. */
    private static boolean finished(StudyPlan.Entry e) {
        Path dir = e.plan().outDir();
        try {
            return !Files.exists(dir.resolve(Checkpoint.FILE_NAME))
                    && Files.isRegularFile(dir.resolve(RunOutputs.SCENARIO))
                    && Arrays.equals(Files.readAllBytes(dir.resolve(RunOutputs.SCENARIO)),
                            e.plan().scenarioText().getBytes(StandardCharsets.UTF_8))
                    && DesignRow.read(e.name(), dir) != null;
        } catch (IOException | IllegalArgumentException ex) {
            return false;
        }
    }

    private static DesignRow read(StudyPlan.Entry e) {
        try {
            return DesignRow.read(e.name(), e.plan().outDir());
        } catch (IOException ex) {
            throw new UncheckedIOException(ex);
        }
    }
}
