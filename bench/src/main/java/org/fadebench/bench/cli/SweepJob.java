package org.fadebench.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CancellationException;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.RunSummary;
import org.fadebench.channel.ChannelTrace;
import org.fadebench.bench.report.Archive;
import org.fadebench.bench.report.FerPlot;
import org.fadebench.bench.report.HtmlReport;
import org.fadebench.bench.report.RunReport;
import org.fadebench.bench.report.AtomicFiles;
import org.fadebench.bench.report.Checkpoint;
import org.fadebench.bench.report.Numbers;
import org.fadebench.bench.report.ResultsCsv;
import org.fadebench.bench.report.ResultsJson;
import org.fadebench.bench.report.ResultsTable;
import org.fadebench.bench.run.Engine;
import org.fadebench.bench.run.RunPlan;
import org.fadebench.bench.sweep.BatchExecutor;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.PointState;
import org.fadebench.bench.sweep.SweepEngine;
import org.fadebench.bench.sweep.SweepOutcome;

/**
 * Runs a {@link RunPlan}: prints the table as points finish, shows progress on a terminal, keeps a
 * checkpoint, stops cleanly on Ctrl-C or SIGTERM (during the sweep and during the outage bounds;
 * exit code 130 or 143), and writes results.csv, results.json, the plot, report.html, the
 * effective scenario and, if asked, an archive.
 */
final class SweepJob {

    private final RunPlan plan;
    /** Who computes the batches, as the run's lines name it. */
    private final Engine engine;
    private final boolean resume;
    private final PrintWriter out;
    /** The command line's arguments after {@code fadebench}, for the report's provenance. */
    private final List<String> args;
    /** The summary of the finished sweep, once {@link #run} has written the outputs. */
    private RunSummary summary;

    /**
     * @param engine who computes the batches: the plan's own for {@code run}, the study's for a design
     * @param args   the command line's arguments after {@code fadebench}, named in report.html
     */
    SweepJob(RunPlan plan, Engine engine, boolean resume, PrintWriter out, List<String> args) {
        this.plan = plan;
        this.engine = engine;
        this.resume = resume;
        this.out = out;
        this.args = List.copyOf(args);
    }

    /** Checks that the output folder can be used, before any simulation starts. */
    static Path checkOutDir(String out) {
        if (out == null || out.isBlank()) {
            throw new InvalidInputException("--out needs a file or folder name, got nothing");
        }
        Path dir = Path.of(out);
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new InvalidInputException("--out " + out + " exists and is not a folder");
        }
        return dir;
    }

    /** Runs the sweep on an executor of its own; returns the exit code. */
    int run() {
        try (BatchExecutor executor = startExecutor(engine, plan.threads())) {
            return run(executor);
        }
    }

    /**
     * Starts an executor, before anything is written (a cluster that cannot be used is invalid
     * input); the caller closes it.
     */
    static BatchExecutor startExecutor(Engine engine, int threads) {
        try {
            return engine.start(threads);
        } catch (IllegalArgumentException e) {
            throw new InvalidInputException(e.getMessage());
        }
    }

    /**
     * Runs the sweep on an executor already started from {@link #engine}, which stays open (a
     * study's designs share one). Returns the exit code.
     */
    int run(BatchExecutor executor) {
        var link = plan.link();
        SweepEngine sweep = new SweepEngine(link, plan.rules(), plan.seed(), executor, plan.confidence());
        sweep.progressMillis(250);
        sweep.recordChannels(plan.traceOut() == null ? 0 : plan.traceOutBlocks());
        String fingerprint = Checkpoint.fingerprint(plan.numbersFingerprintText(sweep.batchFrames()));
        List<PointState> resumed = resume ? readCheckpoint(fingerprint, sweep) : null;
        RunOutputs.checkWritable(plan);

        boolean talk = !plan.quiet();
        if (talk) {
            out.println("link: " + link.describe());
            out.println("SNR convention: " + ResultsCsv.SNR_CONVENTION + "; Eb/N0 = SNR / "
                    + Numbers.db(link.bitsPerChannelUse()) + " information bits per channel use");
            if (link.channel().pilots() > 0) {
                out.println(ResultsCsv.pilotLine(link));
            }
            out.println(String.format(Locale.ROOT, "stop: %s frame errors or %d frames per point%s; seed %d; %s",
                    plan.rules().fadeSampling() ? "fade-sampling to a FER half-width of "
                            + Numbers.db(plan.rules().relPrecision()) + " x FER after at least "
                            + Numbers.db(org.fadebench.bench.sweep.WeightedInterval.MIN_EFFECTIVE_ERRORS) + " effective"
                            : plan.rules().minErrors() == 0 ? "no minimum of" : Long.toString(plan.rules().minErrors()),
                    plan.rules().maxFrames(),
                    plan.rules().maxSeconds() > 0 ? " or " + Numbers.db(plan.rules().maxSeconds()) + " s" : "",
                    plan.seed(), engine.describe(plan.threads())));
            if (resumed != null) {
                long done = resumed.stream().filter(PointState::done).count();
                out.println("resuming from " + plan.outDir().resolve(Checkpoint.FILE_NAME) + " (" + done + " of "
                        + resumed.size() + " points finished)");
            }
        }
        ResultsTable table = new ResultsTable(out);
        if (talk) {
            table.header(plan.confidence());
        }
        ProgressDisplay progress = ProgressDisplay.startIfTerminal(plan.snrDb(), plan.quiet());
        long start = System.nanoTime();
        // the handler stays installed while the outputs are written: a signal then changes nothing
        try (SignalStop signals = SignalStop.install(sweep::requestStop)) {
            SweepOutcome outcome;
            try {
                outcome = sweep.run(plan.snrDb(), resumed, listener(table, progress, fingerprint, start));
            } finally {
                if (progress != null) {
                    progress.close();
                }
            }
            return finish(outcome, fingerprint, signals);
        }
    }

    /** Prints finished points, draws progress and keeps the checkpoint current. */
    private SweepEngine.Listener listener(ResultsTable table, ProgressDisplay progress, String fingerprint, long start) {
        boolean talk = !plan.quiet();
        return new SweepEngine.Listener() {
            @Override
            public void pointDone(PointResult result) {
                if (talk) {
                    ProgressDisplay.clearLine(progress, System.err);
                    table.row(result);
                }
            }

            @Override
            public void progress(SweepEngine.Progress p) {
                if (progress != null) {
                    progress.update(p, System.nanoTime() - start);
                }
            }

            @Override
            public void stateChanged(List<PointState> states) {
                writeCheckpoint(fingerprint, states);
            }
        };
    }

    private int finish(SweepOutcome outcome, String fingerprint, SignalStop signals) {
        boolean interrupted = outcome.interrupted();
        ChannelTrace replayed = plan.link().channel().trace();
        if (replayed != null && !plan.quiet()) {
            long most = outcome.results().stream().mapToLong(r -> r.counts().frames()).max().orElse(0);
            if (replayed.cyclesOver(most * plan.link().fadingBlocksPerFrame())) {
                out.println("note: the trace's " + replayed.size() + " matrices were used cyclically (up to "
                        + most * plan.link().fadingBlocksPerFrame() + " fading blocks per point), so blocks repeat");
            }
        }
        if (!plan.quiet()) {
            for (PointResult r : outcome.results()) {
                if (!r.complete()) {
                    out.println("partial: " + Numbers.db(r.snrDb()) + " dB after " + r.counts().frames() + " frames");
                }
            }
            if (outcome.stopReason() != null) {
                out.println(outcome.stopReason());
            }
        }
        Path dir = plan.outDir();
        List<PointResult> results = outcome.results();
        BoundCurves curves = null;
        String noBounds = null;
        try {
            curves = plan.boundCurves(results, signals::requested);
        } catch (CancellationException e) {
            if (!interrupted) {
                return stoppedInBounds(outcome, fingerprint, signals);
            }
            noBounds = "outage bounds not computed (interrupted); --resume computes them";
        }
        summary = plan.summary(outcome.complete(), curves, noBounds);
        if (!plan.quiet()) {
            summary.lines().forEach(out::println);
        }
        List<Path> written = new ArrayList<>();
        try {
            Path csv = dir.resolve(RunOutputs.RESULTS_CSV);
            ResultsCsv.write(csv, plan.link(), plan.seed(), plan.confidence(), results, interrupted, curves);
            written.add(csv);
            Path json = dir.resolve(RunOutputs.RESULTS_JSON);
            double seconds = outcome.nanos() * 1e-9;
            ResultsJson.Run run = new ResultsJson.Run(plan.settings(), plan.link(), plan.seed(), outcome.results(),
                    !interrupted, outcome.stopReason(), outcome.framesSimulated(), seconds, plan.threads(), summary,
                    plan.warnings());
            ResultsJson.write(json, run);
            written.add(json);
            String svg = null;
            if (!results.isEmpty()) {
                svg = FerPlot.write(dir, plan.link(), plan.seed(), results, plan.confidence(), curves, plan.targetFer(),
                        plan.plotAxes());
                written.add(dir.resolve(FerPlot.PNG_FILE));
                written.add(dir.resolve(FerPlot.SVG_FILE));
            } else {
                // no plot without results: a plot left by an earlier run in this folder would mislead
                Files.deleteIfExists(dir.resolve(FerPlot.PNG_FILE));
                Files.deleteIfExists(dir.resolve(FerPlot.SVG_FILE));
            }
            Path scenario = dir.resolve(RunOutputs.SCENARIO);
            AtomicFiles.writeString(scenario, plan.scenarioText());
            written.add(scenario);
            Path report = dir.resolve(HtmlReport.FILE);
            RunReport.write(report, run, plan.confidence(), svg, plan.scenarioText(),
                    HtmlReport.Provenance.now(Long.toString(plan.seed()), args));
            written.add(report);
            if (interrupted) {
                Checkpoint.write(dir, fingerprint, outcome.states());
            } else {
                Checkpoint.delete(dir);
            }
            if (plan.traceOut() != null && !outcome.results().isEmpty()) {
                ChannelTrace drawn = ChannelTrace.of("channels of " + plan.link().describe(),
                        plan.link().receiveAntennas(), plan.link().transmitAntennas(), outcome.recordedChannels());
                drawn.write(plan.traceOut());
                written.add(plan.traceOut());
            }
            if (plan.archive() != null && !interrupted) {
                Archive.write(plan.archive(), written);
                written.add(plan.archive());
            }
            if (!plan.quiet()) {
                out.println(String.format(Locale.ROOT,
                        "simulated %d frames in %.2f s: %.2f M symbols/s, %.2f M information bits/s on %s",
                        outcome.framesSimulated(), seconds, run.symbolsPerSecond() * 1e-6,
                        run.infoBitsPerSecond() * 1e-6, engine.describe(plan.threads())));
                for (Path p : written) {
                    out.println("wrote " + p);
                }
                if (interrupted) {
                    out.println("interrupted: partial results written; run the same command with --resume to finish");
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        out.flush();
        return interrupted ? signals.exitCode() : ExitCodes.OK;
    }

    /**
     * A signal came while the outage bounds of a finished sweep were computed: keeps the sweep in
     * the checkpoint, so that --resume only computes the bounds and writes the outputs.
     */
    private int stoppedInBounds(SweepOutcome outcome, String fingerprint, SignalStop signals) {
        writeCheckpoint(fingerprint, outcome.states());
        if (!plan.quiet()) {
            out.println("interrupted while computing the outage bounds; the sweep is kept in "
                    + plan.outDir().resolve(Checkpoint.FILE_NAME)
                    + ": run the same command with --resume to compute the bounds and write the results");
        }
        out.flush();
        return signals.exitCode();
    }

    /** The summary of the sweep {@link #run} finished, or null before. */
    RunSummary summary() {
        return summary;
    }

    private List<PointState> readCheckpoint(String fingerprint, SweepEngine engine) {
        try {
            List<PointState> s = Checkpoint.read(plan.outDir(), fingerprint, plan.snrDb().length);
            if (s == null && !plan.quiet()) {
                out.println("no checkpoint in " + plan.outDir() + "; starting from the beginning");
            }
            String problem = s == null ? null : engine.checkpointProblem(s);
            if (problem != null) {
                throw new IllegalArgumentException(plan.outDir().resolve(Checkpoint.FILE_NAME)
                        + ": damaged or edited checkpoint (" + problem + "); delete it or run without --resume");
            }
            return s;
        } catch (IllegalArgumentException e) {
            throw new InvalidInputException("--resume: " + e.getMessage());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private void writeCheckpoint(String fingerprint, List<PointState> states) {
        try {
            Checkpoint.write(plan.outDir(), fingerprint, states);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
