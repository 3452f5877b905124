package org.fadebench.bench.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.fadebench.bench.scenario.ScenarioLoader;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code fadebench demo}: the built-in example, two scenario files shipped in the jar. A hilltop
 * gateway with two transmit antennas sends 256-bit QPSK telemetry frames with Alamouti's code to
 * field sensors over slow Rayleigh fading; sensors with one and with two receive antennas are
 * compared. Invented scenario, for demonstration only.
 */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = "Run the built-in example: a hilltop gateway (2 antennas, Alamouti, QPSK) "
                + "sending telemetry frames to field sensors with 1 or 2 receive antennas.")
final class DemoCommand implements Callable<Integer> {

    private static final String[] SCENARIOS = {"sensor-1rx", "sensor-2rx"};

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "fadebench-demo",
            description = "Folder for the outputs, one sub-folder per sensor (default: ${DEFAULT-VALUE}).")
    String out;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: all cores).")
    Integer threads;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        SweepJob.checkOutDir(out);
        PrintWriter w = spec.commandLine().getOut();
        w.println("Demo: a hilltop gateway with two transmit antennas (Alamouti) sends 256-bit QPSK telemetry");
        w.println("frames to field sensors through slow (per-frame) Rayleigh fading.");
        List<String> folders = new ArrayList<>();
        for (String name : SCENARIOS) {
            w.println();
            w.println("== " + name + " ==");
            RunCommand run = new RunCommand();
            CommandLine cl = new CommandLine(run);
            cl.setOut(w);
            cl.setErr(spec.commandLine().getErr());
            // the demo replaces its own earlier output, so that it can be run again and again
            List<String> args = new ArrayList<>(List.of("--out", out + "/" + name, "--overwrite"));
            if (threads != null) {
                args.add("--threads");
                args.add(threads.toString());
            }
            cl.parseArgs(args.toArray(new String[0]));
            run.preloaded = ScenarioLoader.parse("built-in " + name + ".yaml", resource(name + ".yaml"));
            int code = run.call();
            if (code != ExitCodes.OK) {
                return code;
            }
            folders.add(out + "/" + name);
        }
        w.println();
        w.println("With two receive antennas the FER falls about twice as fast with SNR (diversity 4 against 2).");
        w.println("Outputs: " + String.join(", ", folders) + " (results.csv, results.json, fer.png, fer.svg, scenario.yaml).");
        return ExitCodes.OK;
    }

    private static String resource(String name) {
        try (InputStream in = DemoCommand.class.getResourceAsStream("/org/fadebench/bench/demo/" + name)) {
            if (in == null) {
                throw new IllegalStateException("built-in scenario " + name + " missing from the jar");
            }
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
