package org.fadebench.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.report.Numbers;
import org.fadebench.bench.report.ResultsCsv;
import org.fadebench.bench.report.ResultsTable;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.bench.sweep.SweepEngine;

/** One validated sweep, ready to run: prints the table as it goes and writes the outputs at the end. */
record SweepJob(LinkSettings link, double[] snrDb, StopRules rules, long seed, int threads,
                double confidence, Path outDir) {

    /** Checks that the output folder can be used, before any simulation starts. */
    static Path checkOutDir(String out) {
        Path dir = Path.of(out);
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new InvalidInputException("--out " + out + " exists and is not a folder");
        }
        return dir;
    }

    /** The thread count: the option's value, or all cores when it is not given. */
    static int threads(Integer option) {
        int n = option != null ? option : Runtime.getRuntime().availableProcessors();
        if (n <= 0 || n > 1024) {
            throw new InvalidInputException("--threads must be between 1 and 1024, got " + n);
        }
        return n;
    }

    List<PointResult> run(PrintWriter out) {
        out.println("link: " + link.describe());
        out.println("SNR convention: " + ResultsCsv.SNR_CONVENTION + "; Eb/N0 = SNR / "
                + Numbers.db(link.bitsPerChannelUse()) + " information bits per channel use");
        out.println(String.format(Locale.ROOT, "stop: %s frame errors or %d frames per point; seed %d; %d thread%s",
                rules.minErrors() == 0 ? "no minimum of" : Long.toString(rules.minErrors()), rules.maxFrames(), seed,
                threads, threads == 1 ? "" : "s"));
        ResultsTable table = new ResultsTable(out);
        table.header(confidence);
        SweepEngine engine = new SweepEngine(link, rules, seed, threads, confidence);
        List<PointResult> results = engine.run(snrDb, table::row);
        if (results.size() < snrDb.length) {
            out.println("stopped after " + Numbers.db(results.get(results.size() - 1).snrDb())
                    + " dB: no frame errors in " + rules.maxFrames() + " frames; higher SNRs skipped");
        }
        Path csv = outDir.resolve("results.csv");
        try {
            ResultsCsv.write(csv, link, seed, confidence, results);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        double seconds = engine.nanosSimulating() * 1e-9;
        double symbolsPerSecond = engine.framesSimulated() * (double) link.symbolsPerFrame() / seconds;
        out.println(String.format(Locale.ROOT, "simulated %d frames in %.2f s: %.2f M symbols/s on %d thread%s",
                engine.framesSimulated(), seconds, symbolsPerSecond * 1e-6, threads, threads == 1 ? "" : "s"));
        out.println("wrote " + csv);
        return results;
    }
}
