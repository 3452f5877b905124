package org.fadebench.bench.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.fadebench.bench.report.FerPlot;
import org.fadebench.bench.report.HtmlReport;
import org.fadebench.bench.settings.SettingValues;
import org.fadebench.bench.study.DesignRow;
import org.fadebench.bench.study.StudyFile;
import org.fadebench.bench.study.StudyLoader;
import org.fadebench.bench.study.StudyOutputs;
import org.fadebench.bench.study.StudyTable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code fadebench demo}: the built-in example, a small study shipped in the jar
 * ({@code demo/study.yaml}). A hilltop gateway sends coded QPSK telemetry frames to field sensors
 * over slow Rayleigh fading; three designs are ranked: a 1x2 combining (MRC) receiver, Alamouti 2x1
 * and Alamouti 2x2. Invented scenario, for demonstration only. Every sentence it prints about the
 * result is computed from the ranking.
 */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = "Run the built-in example study: a hilltop gateway sending coded QPSK telemetry frames to field "
                + "sensors; 1x2 combining, Alamouti 2x1 and Alamouti 2x2 ranked against the target FER.")
final class DemoCommand implements Callable<Integer> {

    /** The demo's designs that the closing words compare: the combining receiver and Alamouti 2x1. */
    static final String MRC = "mrc-1x2";
    static final String ALAMOUTI = "alamouti-2x1";

    /** The SNR lost by splitting the power over two transmit antennas, 10 log10 2 dB (Alamouti 1998). */
    static final double POWER_SPLIT_DB = 10 * Math.log10(2);

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "fadebench-demo",
            description = "Folder of the study: one sub-folder per design (default: ${DEFAULT-VALUE}).")
    String out;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    Integer threads;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        Path dir = SweepJob.checkOutDir(out);
        PrintWriter w = spec.commandLine().getOut();
        StudyFile study = StudyLoader.parse("built-in demo study.yaml", resource("study.yaml"));
        w.println("Demo: a hilltop gateway sends 256-bit QPSK telemetry frames (rate-1/2 convolutional code) to field");
        w.println("sensors through slow (per-frame) Rayleigh fading. Three designs: " + designNames(study) + ".");
        // the demo replaces its own earlier output (overwrite), so that it can be run again and again
        StudyRunner runner = new StudyRunner(StudyCommand.plan(study, dir, threads, false, SettingValues.empty()), false,
                true, w, spec.commandLine().getErr(), new StudyOutputs.Figure(FerPlot.XQuantity.SNR, true),
                DemoCommand::closing, RunCommand.commandArgs(spec));
        runner.checkBeforeRun(null);
        int code = runner.run();
        if (code != ExitCodes.OK) {
            return code;
        }
        w.println();
        closing(runner.table()).forEach(w::println);
        w.println("Outputs: " + dir + " (" + StudyOutputs.CSV + ", " + StudyOutputs.JSON + ", " + FerPlot.PNG_FILE + ", "
                + FerPlot.SVG_FILE + ", " + HtmlReport.FILE + ") and one folder per design (" + FadebenchCli.RUN_OUTPUTS
                + ").");
        return ExitCodes.OK;
    }

    private static String designNames(StudyFile study) {
        return String.join(", ", study.designs().stream().map(StudyFile.Design::name).toList());
    }

    /**
     * The demo's closing words, from the ranking alone: the best design with its SNR interval, how
     * much more SNR Alamouti 2x1 needs than the 1x2 combining receiver (with the interval of the
     * difference, and whether it holds the 3 dB of the power split), and which designs meet the
     * target at the budget.
     */
    static List<String> closing(StudyTable table) {
        List<String> lines = new ArrayList<>(table.sentences());
        Optional<DesignRow> mrc = find(table, MRC);
        Optional<DesignRow> alamouti = find(table, ALAMOUTI);
        if (mrc.isPresent() && alamouti.isPresent() && mrc.get().reached() && alamouti.get().reached()) {
            DesignRow m = mrc.get();
            DesignRow a = alamouti.get();
            double low = a.snrDbLow() - m.snrDbHigh();
            double high = a.snrDbHigh() - m.snrDbLow();
            String holds = Double.isNaN(low) || Double.isNaN(high) ? ""
                    : low <= POWER_SPLIT_DB && POWER_SPLIT_DB <= high
                    ? String.format(Locale.ROOT, "; the interval holds the %.2f dB expected from splitting the "
                            + "transmit power over two antennas", POWER_SPLIT_DB)
                    : String.format(Locale.ROOT, "; the interval does not hold the %.2f dB expected from "
                            + "splitting the transmit power over two antennas", POWER_SPLIT_DB);
            lines.add(1, String.format(Locale.ROOT, "%s needs %.2f dB %s SNR than %s (%s)%s.", a.design(),
                    Math.abs(a.snrDbAtTarget() - m.snrDbAtTarget()),
                    a.snrDbAtTarget() >= m.snrDbAtTarget() ? "more" : "less", m.design(),
                    StudyTable.interval(low, high), holds));
        }
        return lines;
    }

    private static Optional<DesignRow> find(StudyTable table, String name) {
        return table.rows().stream().filter(r -> r.design().equals(name)).findFirst();
    }

    private static String resource(String name) {
        try (InputStream in = DemoCommand.class.getResourceAsStream("/org/fadebench/bench/demo/" + name)) {
            if (in == null) {
                throw new IllegalStateException("built-in study " + name + " missing from the jar");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
