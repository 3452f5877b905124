package org.fadebench.bench.cli;

import java.io.PrintStream;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.util.List;
import org.fadebench.bench.report.ToolVersion;
import org.fadebench.bench.sweep.BatchExecutor;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The {@code fadebench} command: {@code run}, {@code study}, {@code compare}, {@code bounds}, {@code codes}, {@code demo}. */
@Command(name = "fadebench", mixinStandardHelpOptions = true, versionProvider = FadebenchCli.Version.class,
        description = {"Monte Carlo link-level bench for multi-antenna diversity links over block fading.",
            "Outputs: run writes " + FadebenchCli.RUN_OUTPUTS + " into its --out folder, with checkpoint.json while it"
                + " runs, the --trace-out file and the --archive file when asked; study writes a run's outputs per"
                + " design into DIR/<design>/ and study.csv, study.json, fer.png, fer.svg and report.html into DIR;"
                + " compare writes the same five with --out; bounds writes bounds.csv; demo runs a built-in study."},
        subcommands = {RunCommand.class, StudyCommand.class, CompareCommand.class, BoundsCommand.class, CodesCommand.class, DemoCommand.class, CommandLine.HelpCommand.class})
public final class FadebenchCli implements Runnable {

    /** The files every {@code run} writes, for the help texts. */
    static final String RUN_OUTPUTS = "results.csv, results.json, fer.png, fer.svg, report.html and scenario.yaml";

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    public static void main(String[] args) {
        System.exit(execute(args, System.out, System.err));
    }

    /** Runs the command line and returns the exit code; output goes to the given streams. */
    public static int execute(String[] args, PrintStream out, PrintStream err) {
        CommandLine cli = new CommandLine(new FadebenchCli());
        HelpLayout.install(cli);
        PrintWriter errWriter = new PrintWriter(err, true);
        cli.setOut(new PrintWriter(out, true));
        cli.setErr(errWriter);
        cli.setParameterExceptionHandler((ex, a) -> {
            errWriter.println(prefix(ex.getCommandLine()) + oneLine(ex.getMessage()) + suggestion(ex));
            return ExitCodes.INVALID_INPUT;
        });
        cli.setExecutionExceptionHandler((ex, line, parsed) -> {
            if (ex instanceof InvalidInputException) {
                errWriter.println(prefix(line) + oneLine(ex.getMessage()));
                return ExitCodes.INVALID_INPUT;
            }
            if (ex instanceof BatchExecutor.Failure) {
                errWriter.println(prefix(line) + oneLine(ex.getMessage()));
                return ExitCodes.IO_FAILURE;
            }
            if (ex instanceof UncheckedIOException) {
                errWriter.println(prefix(line) + "I/O failure: "
                        + oneLine(RunOutputs.describe(((UncheckedIOException) ex).getCause())));
                return ExitCodes.IO_FAILURE;
            }
            errWriter.println(prefix(line) + "internal error: " + oneLine(String.valueOf(ex))
                    + " (set FADEBENCH_DEBUG=1 for the stack trace)");
            if (System.getenv("FADEBENCH_DEBUG") != null) {
                ex.printStackTrace(errWriter);
            }
            return ExitCodes.INTERNAL;
        });
        return cli.execute(args);
    }

    private static String prefix(CommandLine line) {
        return line.getCommandSpec().qualifiedName() + ": ";
    }

    private static String oneLine(String s) {
        return s == null ? "" : s.replace('\n', ' ').replace('\r', ' ').trim();
    }

    private static String suggestion(CommandLine.ParameterException ex) {
        if (ex instanceof CommandLine.UnmatchedArgumentException) {
            List<String> s = ((CommandLine.UnmatchedArgumentException) ex).getSuggestions();
            if (!s.isEmpty()) {
                return "; did you mean " + String.join(" or ", s.subList(0, Math.min(3, s.size()))) + "?";
            }
            return "; see '" + ex.getCommandLine().getCommandSpec().qualifiedName() + " --help'";
        }
        return "";
    }

    @Override
    public void run() {
        throw new CommandLine.ParameterException(spec.commandLine(),
                "choose a command: run, study, compare, bounds, codes, demo (or --help)");
    }

    /** The project version, as the build recorded it. */
    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"fadebench " + ToolVersion.version()};
        }
    }
}
