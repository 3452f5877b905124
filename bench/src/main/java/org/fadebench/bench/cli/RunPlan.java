package org.fadebench.bench.cli;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.Map;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.scenario.Scenario;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.coding.stbc.SpaceTimeCodeFile;

/**
 * A validated {@code run}: everything needed to simulate, report and resume.
 *
 * @param scenario the scenario file it came from, or null
 * @param archive  the archive to write, or null
 * @param bounds   the outage bounds to compare with, or null when they do not apply to the code
 * @param traceOut where to write the channels of the first point's fading blocks, or null
 * @param scenarioText the run's settings as a scenario file (written beside the results)
 */
record RunPlan(LinkSettings link, String snrSpec, double[] snrDb, StopRules rules, long seed, int threads,
               double confidence, Path outDir, Path archive, boolean resume, boolean quiet, Scenario scenario,
               BoundSettings bounds, double targetFer, Path traceOut, int traceOutBlocks,
               String scenarioText) {

    /** The settings as results.json records them (option names without dashes). */
    Map<String, Object> settings() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("code", link.code().name());
        m.put("decoder", link.equaliser().cliName());
        m.put("tx", link.transmitAntennas());
        m.put("rx", link.receiveAntennas());
        m.put("mod", link.modulation().cliName());
        m.put("fading", link.fading());
        m.put("channel", link.channel().describe());
        m.put("fec", link.coding().scheme().code().cliName());
        m.put("crc", link.coding().scheme().crc().cliName());
        m.put("interleaver", link.coding().interleaving().cliName());
        m.put("interleaver_rows", link.coding().interleaverRows());
        m.put("llr", link.coding().llr().cliName());
        m.put("frame_bits", link.frameBits());
        m.put("coherence", link.coherenceSlots());
        m.put("snr", snrSpec);
        m.put("snr_db", snrDb);
        m.put("min_errors", rules.minErrors());
        m.put("max_frames", rules.maxFrames());
        m.put("max_seconds", rules.maxSeconds());
        m.put("fer_floor", rules.ferFloor());
        m.put("confidence", confidence);
        m.put("target_fer", targetFer);
        m.put("rate", bounds == null ? null : bounds.spectralEfficiency());
        m.put("mi", bounds == null ? null : bounds.information().cliName());
        m.put("outage_draws", bounds == null ? null : bounds.mimoDraws());
        m.put("seed", seed);
        m.put("threads", threads);
        m.put("out", outDir.toString());
        m.put("archive", archive == null ? null : archive.toString());
        m.put("scenario", scenario == null ? null : scenario.source());
        return m;
    }

    /** Every setting that changes the numbers, for the checkpoint's fingerprint. */
    String numbersFingerprintText(int batchFrames) {
        return String.join("|", "v3", link.describe(), link.coding().toString(), link.channel().describe(), SpaceTimeCodeFile.format(link.code()), link.equaliser().cliName(),
                link.modulation().cliName(),
                link.fading(), Integer.toString(link.coherenceSlots()), Arrays.toString(snrDb),
                Long.toString(rules.minErrors()), Long.toString(rules.maxFrames()), Double.toString(rules.maxSeconds()),
                Double.toString(rules.ferFloor()), Long.toString(seed), Integer.toString(batchFrames));
    }
}
