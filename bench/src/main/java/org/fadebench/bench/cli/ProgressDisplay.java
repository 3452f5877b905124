package org.fadebench.bench.cli;

import java.io.PrintStream;
import java.time.Duration;
import java.util.Locale;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.report.Numbers;
import org.fadebench.bench.sweep.SweepEngine;

/**
 * A live progress bar for a sweep on a terminal: the current point, its frames, errors and FER so
 * far, and an ETA. A point counts as done in proportion to the larger of frames/max-frames and
 * errors/min-errors. Drawn on stderr; off when output is not a terminal or with {@code --quiet}.
 */
final class ProgressDisplay implements AutoCloseable {

    private static final long STEPS_PER_POINT = 1000;

    private final ProgressBar bar;
    private final double[] snrDb;

    private ProgressDisplay(double[] snrDb) {
        this.snrDb = snrDb;
        this.bar = new ProgressBarBuilder()
                .setTaskName("sweep")
                .setInitialMax(snrDb.length * STEPS_PER_POINT)
                .setStyle(ProgressBarStyle.ASCII)
                .setUpdateIntervalMillis(250)
                .setMaxRenderedLength(110)
                .continuousUpdate()
                .setConsumer(new me.tongfei.progressbar.ConsoleProgressBarConsumer(System.err))
                .hideEta()
                .build();
    }

    /** A display when stdout and stdin are a terminal and not quiet; otherwise null. */
    static ProgressDisplay startIfTerminal(double[] snrDb, boolean quiet) {
        if (quiet || System.console() == null) {
            return null;
        }
        return new ProgressDisplay(snrDb);
    }

    /** Clears the bar's line so a table row can be printed. */
    static void clearLine(ProgressDisplay d, PrintStream err) {
        if (d != null) {
            err.print("\r\033[2K");
            err.flush();
        }
    }

    void update(SweepEngine.Progress p, long elapsedNanos) {
        FrameCounters c = p.counts();
        double byFrames = (double) c.frames() / p.maxFrames();
        double byErrors = p.minErrors() > 0 ? (double) c.frameErrors() / p.minErrors() : 0;
        double fraction = Math.min(1.0, Math.max(byFrames, byErrors));
        long done = 0;
        for (var s : p.states()) {
            if (s.done()) {
                done++;
            }
        }
        long steps = (long) ((done + (p.states().get(p.point()).done() ? 0 : fraction)) * STEPS_PER_POINT);
        bar.stepTo(Math.min(steps, bar.getMax()));
        String eta = "";
        if (steps > 0) {
            long rest = (long) (elapsedNanos * (double) (bar.getMax() - steps) / steps);
            eta = ", about " + format(Duration.ofNanos(rest)) + " left";
        }
        bar.setExtraMessage(String.format(Locale.ROOT, "%s dB: %d frames, %d errors, FER %s%s",
                Numbers.db(snrDb[p.point()]), c.frames(), c.frameErrors(), Numbers.shortRate(c.fer()), eta));
    }

    private static String format(Duration d) {
        long s = d.getSeconds();
        return s >= 3600 ? String.format(Locale.ROOT, "%dh%02dm", s / 3600, (s / 60) % 60)
                : String.format(Locale.ROOT, "%dm%02ds", s / 60, s % 60);
    }

    @Override
    public void close() {
        bar.close();
    }
}
