package org.fadebench.bench.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.fadebench.bench.analysis.RunSummary;
import org.fadebench.bench.run.RunPlan;
import org.fadebench.bench.scenario.Scenario;
import org.fadebench.bench.scenario.ScenarioException;
import org.fadebench.bench.scenario.ScenarioLoader;
import org.fadebench.bench.settings.InvalidSettingException;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.settings.SettingValues;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code fadebench run [SCENARIO.yaml] [options]}: simulate one link over a sweep of SNR points.
 * Its options are the settings table ({@link RunSettings}); the values are taken from the table's
 * defaults, then the scenario file, then the command line.
 */
@Command(name = "run", mixinStandardHelpOptions = true, sortOptions = false, abbreviateSynopsis = true,
        modelTransformer = RunCommand.Options.class,
        description = {"Simulate one link over a sweep of SNR points; print a table and write "
                + FadebenchCli.RUN_OUTPUTS + ".",
            "SNR is the total transmitted energy per channel use over N0 at each receive antenna "
                + "(E|h|^2 = 1, power split equally over the transmit antennas).",
            "Options given on the command line override the scenario file."})
final class RunCommand implements Callable<Integer> {

    @Parameters(arity = "0..1", paramLabel = "SCENARIO", description = "A scenario file (YAML); see README.")
    Path scenarioFile;

    @Option(names = "--resume", description = "Continue an interrupted run from the checkpoint in --out.")
    boolean resume;

    @CommandLine.Spec
    CommandSpec spec;

    /** A scenario given by the caller instead of a file (the built-in demo). */
    Scenario preloaded;

    /** The summary of the sweep, once {@link #call} has run it (for the demo's closing words). */
    RunSummary summary;

    /** Adds the table's settings as options. */
    static final class Options implements CommandLine.IModelTransformer {
        @Override
        public CommandSpec transform(CommandSpec spec) {
            return SettingOptions.addTo(spec, RunSettings.all(), Map.of());
        }
    }

    @Override
    public Integer call() {
        Scenario scenario = loadScenario();
        SettingValues given = SettingOptions.given(spec.commandLine().getParseResult(), RunSettings.all(), Map.of());
        SettingValues values = scenario == null ? given : scenario.values().overlaidBy(given);
        RunPlan plan = plan(values, scenario == null ? null : scenario.source());
        RunOutputs.checkBeforeRun(plan, preloaded == null ? scenarioFile : null, resume);
        if (!plan.quiet()) {
            plan.warnings().forEach(w -> spec.commandLine().getErr().println("fadebench run: warning: " + w));
        }
        SweepJob job = new SweepJob(plan, plan.engine(), resume, spec.commandLine().getOut(), commandArgs());
        int code = job.run();
        summary = job.summary();
        return code;
    }

    /**
     * The arguments after {@code fadebench}; a run called from another command (the demo) names
     * itself, so the line is the equivalent run.
     */
    private List<String> commandArgs() {
        return commandArgs(spec);
    }

    /** The arguments after {@code fadebench} of the command {@code spec} parsed, its own name first. */
    static List<String> commandArgs(CommandSpec spec) {
        List<String> args = new ArrayList<>(spec.commandLine().getParseResult().originalArgs());
        if (spec.parent() == null) {
            args.add(0, spec.name());
        }
        return args;
    }

    /** Builds the plan; a problem becomes invalid input that points at the option or the scenario line. */
    static RunPlan plan(SettingValues values, String source) {
        try {
            return RunPlan.from(values, source);
        } catch (InvalidSettingException e) {
            throw new InvalidInputException(values.locate(e.setting(), e.problem()));
        } catch (IllegalArgumentException e) {
            throw new InvalidInputException(e.getMessage());
        }
    }

    private Scenario loadScenario() {
        if (preloaded != null) {
            return preloaded;
        }
        if (scenarioFile == null) {
            return null;
        }
        try {
            return ScenarioLoader.load(scenarioFile);
        } catch (ScenarioException e) {
            throw new InvalidInputException(e.getMessage());
        }
    }
}
