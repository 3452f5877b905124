package org.fadebench.bench.cli;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.fadebench.bench.report.FerPlot;
import org.fadebench.bench.scenario.ScenarioException;
import org.fadebench.bench.settings.InvalidSettingException;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.settings.Setting;
import org.fadebench.bench.settings.SettingValues;
import org.fadebench.bench.study.StudyFile;
import org.fadebench.bench.study.StudyLoader;
import org.fadebench.bench.study.StudyOutputs;
import org.fadebench.bench.study.StudyPlan;
import org.fadebench.bench.study.StudyTable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code fadebench study FILE [--out DIR] [--resume] [--threads N] [--x-axis snr|ebn0] [--engine spark ...]}: several
 * designs from one study file, one after another on all threads, each into {@code DIR/<design>/}
 * as {@code run} writes it, then ranked in study.csv and study.json.
 */
@Command(name = "study", mixinStandardHelpOptions = true, sortOptions = false,
        modelTransformer = StudyCommand.Options.class,
        description = {"Run several designs from one study file (the scenario sections as common settings, plus "
                + "designs: and/or vary:), each into DIR/<design>/ as run writes it; rank them against the target FER "
                + "in study.csv and study.json.", "See README, Design studies."})
final class StudyCommand implements Callable<Integer> {

    @Parameters(paramLabel = "FILE", description = "The study file (YAML).")
    Path file;

    @Option(names = "--out", paramLabel = "DIR", description = "Folder of the study (default: the file's output.folder, "
            + "else fadebench-study).")
    String out;

    @Option(names = "--resume", description = "Continue an interrupted study: finished designs are kept, the one "
            + "interrupted continues from its checkpoint.")
    boolean resume;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads of every design (default: all cores).")
    Integer threads;

    @Option(names = "--x-axis", paramLabel = "NAME", description = "X axis of the study's plot and the designs' plots: "
            + "snr, ebn0 (default: the file's output.plot_x, else snr).")
    String xAxis;

    @Option(names = "--with-bounds", description = "Draw each design's QAM-constrained outage bound, dashed in its "
            + "colour, on the study's plot.")
    boolean withBounds;

    @Option(names = "--overwrite", description = "Replace the results of other runs in the designs' folders.")
    boolean overwrite;

    @Option(names = "--quiet", description = "Print nothing but errors and the ranking.")
    boolean quiet;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    /** The settings of the table a study also takes on its command line: who computes every design's batches. */
    static final List<Setting> SETTINGS = List.of(RunSettings.ENGINE, RunSettings.SPARK_MASTER, RunSettings.SPARK_TASKS);

    /** Adds {@link #SETTINGS} as options. */
    static final class Options implements CommandLine.IModelTransformer {
        @Override
        public CommandLine.Model.CommandSpec transform(CommandLine.Model.CommandSpec spec) {
            return SettingOptions.addTo(spec, SETTINGS, Map.of());
        }
    }

    @Override
    public Integer call() {
        StudyFile study;
        try {
            study = StudyLoader.load(file);
        } catch (ScenarioException e) {
            throw new InvalidInputException(e.getMessage());
        }
        SettingValues given = SettingOptions.given(spec.commandLine().getParseResult(), SETTINGS, Map.of());
        if (xAxis != null) {
            given = given.with(RunSettings.PLOT_X, xAxis, SettingValues.Origin.COMMAND_LINE);
        }
        FerPlot.XQuantity x = xQuantity(xAxis != null ? xAxis : study.common().text(RunSettings.PLOT_X));
        String dir = out != null ? out : study.common().isSet(RunSettings.FOLDER) ? study.common().text(RunSettings.FOLDER)
                : "fadebench-study";
        StudyRunner runner = new StudyRunner(plan(study, SweepJob.checkOutDir(dir), threads, quiet, given),
                resume, overwrite, spec.commandLine().getOut(), spec.commandLine().getErr(),
                new StudyOutputs.Figure(x, withBounds), StudyTable::sentences, RunCommand.commandArgs(spec));
        runner.checkBeforeRun(file);
        return runner.run();
    }

    /** The x axis named by {@code --x-axis} (or the file's {@code output.plot_x}); snr when null. */
    static FerPlot.XQuantity xQuantity(String name) {
        try {
            return name == null ? FerPlot.XQuantity.SNR : FerPlot.XQuantity.fromCliName(name);
        } catch (IllegalArgumentException e) {
            throw new InvalidInputException("--x-axis: " + e.getMessage());
        }
    }

    /** The checked study; an invalid design becomes invalid input naming the file, line and key. */
    static StudyPlan plan(StudyFile study, Path dir, Integer threads, boolean quiet, SettingValues given) {
        if (threads != null && (threads < 1 || threads > 1024)) {
            throw new InvalidInputException("--threads must be between 1 and 1024, got " + threads);
        }
        try {
            return StudyPlan.of(study, dir, threads, quiet, given);
        } catch (ScenarioException e) {
            throw new InvalidInputException(e.getMessage());
        } catch (InvalidSettingException e) {
            throw new InvalidInputException(study.common().locate(e.setting(), e.problem()));
        }
    }
}
