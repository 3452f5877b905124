package org.fadebench.bench.report;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.fadebench.bench.analysis.RunSummary;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.WeightedInterval;

/**
 * Writes {@code results.json}: the settings, seed and versions, every point with its intervals and
 * time, and the run's throughput. Unlike results.csv this file holds timing, so it differs between
 * runs.
 */
public final class ResultsJson {

    private static final ObjectMapper JSON = new ObjectMapper();

    private ResultsJson() {
    }

    /** Everything results.json says about one run. */
    public record Run(Map<String, Object> settings, LinkSettings link, long seed, List<PointResult> results,
                      boolean complete, String stopReason, long framesSimulated, double seconds, int threads,
                      RunSummary summary, List<String> warnings) {

        /** Data QAM symbols simulated per wall-clock second (speculative batches included). */
        public double symbolsPerSecond() {
            return seconds > 0 ? framesSimulated * (double) link.symbolsPerFrame() / seconds : 0;
        }

        /** Payload (information) bits of the frames simulated per wall-clock second, as {@link #symbolsPerSecond}. */
        public double infoBitsPerSecond() {
            return seconds > 0 ? framesSimulated * (double) link.frameBits() / seconds : 0;
        }
    }

    public static ObjectNode tree(Run run) {
        ObjectNode root = JSON.createObjectNode();
        root.put("tool", "fadebench");
        root.put("version", ToolVersion.version());
        root.put("java", System.getProperty("java.version"));
        root.put("complete", run.complete());
        if (run.stopReason() == null) {
            root.putNull("stop_reason");
        } else {
            root.put("stop_reason", run.stopReason());
        }
        ObjectNode settings = root.putObject("settings");
        run.settings().forEach((k, v) -> settings.set(k, JSON.valueToTree(v)));
        root.put("seed", run.seed());
        root.put("link", run.link().describe());
        root.put("snr_convention", ResultsCsv.SNR_CONVENTION);
        root.put("bits_per_channel_use", run.link().bitsPerChannelUse());
        root.put("pilot_overhead", run.link().pilotOverhead());
        root.put("net_bits_per_channel_use", run.link().netBitsPerChannelUse());
        ArrayNode warnings = root.putArray("warnings");
        run.warnings().forEach(warnings::add);
        ArrayNode points = root.putArray("points");
        for (PointResult r : run.results()) {
            FrameCounters c = r.counts();
            ObjectNode p = points.addObject();
            p.put("snr_db", r.snrDb());
            p.put("ebn0_db", r.ebN0Db());
            p.put("complete", r.complete());
            CountsJson.put(p, c);
            p.put("fer", finite(c.fer()));
            p.put("fer_ci_low", r.ferLow());
            p.put("fer_ci_high", r.ferHigh());
            p.put("ber", finite(c.ber()));
            p.put("ber_ci_low", r.berLow());
            p.put("ber_ci_high", r.berHigh());
            p.put("ser", finite(c.ser()));
            p.put("fec_iterations_mean", finite(c.fecIterationsMean()));
            if (c.weighted()) {
                String[] cells = ResultsCsv.fadeSamplingCells(r);
                String[] names = ResultsCsv.FADE_SAMPLING_COLUMNS.split(",");
                p.put(names[0], cells[0]);
                p.put(names[1], finite(WeightedInterval.effectiveFrames(c)));
                p.put(names[2], finite(r.ferRelativeHalfWidth()));
                p.put("effective_errors", WeightedInterval.effectiveErrors(c));
                p.put("trusted", r.trusted());
            }
            p.put("seconds", r.seconds());
        }
        root.set("summary", JSON.valueToTree(run.summary().toJson()));
        root.set("bounds", run.summary().analysis() == null ? JSON.nullNode()
                : JSON.valueToTree(run.summary().analysis().toJson()));
        root.put("symbols_per_second", run.symbolsPerSecond());
        root.put("info_bits_per_second", run.infoBitsPerSecond());
        ObjectNode timing = root.putObject("timing");
        timing.put("seconds", run.seconds());
        timing.put("frames_simulated", run.framesSimulated());
        timing.put("threads", run.threads());
        return root;
    }

    /** JSON has no NaN: a rate of nothing is null. */
    private static Double finite(double v) {
        return Double.isFinite(v) ? v : null;
    }

    public static void write(Path file, Run run) throws IOException {
        byte[] bytes = JSON.writerWithDefaultPrettyPrinter().writeValueAsBytes(tree(run));
        AtomicFiles.write(file, out -> {
            out.write(bytes);
            out.write('\n');
        });
    }
}
