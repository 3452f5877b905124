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
import org.fadebench.coding.stbc.SpaceTimeCodes;

/**
 * A validated {@code run}: everything needed to simulate, report and resume.
 *
 * @param scenario the scenario file it came from, or null
 * @param archive  the archive to write, or null
 * @param codeFile the file the space-time code came from, or null for a catalogue code
 * @param bounds   the outage bounds to compare with, or null when they do not apply to the code
 */
record RunPlan(LinkSettings link, String snrSpec, double[] snrDb, StopRules rules, long seed, int threads,
               double confidence, Path outDir, Path archive, boolean resume, boolean quiet, Scenario scenario,
               Path codeFile, BoundSettings bounds, double targetFer) {

    /** The settings as results.json records them (option names without dashes). */
    Map<String, Object> settings() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("code", link.code().name());
        m.put("decoder", link.decoder().cliName());
        m.put("tx", link.transmitAntennas());
        m.put("rx", link.receiveAntennas());
        m.put("mod", link.modulation().cliName());
        m.put("fading", link.fading().cliName());
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
        return String.join("|", "v2", link.describe(), link.coding().toString(), SpaceTimeCodeFile.format(link.code()), link.decoder().cliName(),
                link.modulation().cliName(),
                link.fading().cliName(), Integer.toString(link.coherenceSlots()), Arrays.toString(snrDb),
                Long.toString(rules.minErrors()), Long.toString(rules.maxFrames()), Double.toString(rules.maxSeconds()),
                Double.toString(rules.ferFloor()), Long.toString(seed), Integer.toString(batchFrames));
    }

    /** The run written back as a scenario file of our schema, for archives and reruns. */
    String asScenarioYaml() {
        StringBuilder y = new StringBuilder();
        y.append("# fadebench scenario: the settings of this run (written by fadebench)\n");
        y.append("link:\n");
        if (SpaceTimeCodes.isCatalogued(link.code())) {
            y.append("  code: ").append(link.code().name()).append('\n');
        } else {
            y.append("  code_file: \"").append(codeFile).append("\"\n");
        }
        y.append("  decoder: ").append(link.decoder().cliName()).append('\n');
        y.append("  tx: ").append(link.transmitAntennas()).append('\n');
        y.append("  rx: ").append(link.receiveAntennas()).append('\n');
        y.append("  modulation: ").append(link.modulation().cliName()).append('\n');
        y.append("  fading: ").append(link.fading().cliName()).append('\n');
        y.append("  fec: ").append(link.coding().scheme().code().cliName()).append('\n');
        y.append("  crc: ").append(link.coding().scheme().crc().cliName()).append('\n');
        y.append("  interleaver: ").append(link.coding().interleaving().cliName()).append('\n');
        if (link.coding().interleaverRows() > 0) {
            y.append("  interleaver_rows: ").append(link.coding().interleaverRows()).append('\n');
        }
        y.append("  llr: ").append(link.coding().llr().cliName()).append('\n');
        y.append("  frame_bits: ").append(link.frameBits()).append('\n');
        y.append("  coherence: ").append(link.coherenceSlots()).append("   # 0 = whole frame\n");
        y.append("sweep:\n");
        y.append("  snr_db: \"").append(snrSpec).append("\"\n");
        y.append("  min_errors: ").append(rules.minErrors()).append('\n');
        y.append("  max_frames: ").append(rules.maxFrames()).append('\n');
        y.append("  max_seconds: ").append(rules.maxSeconds()).append('\n');
        y.append("  fer_floor: ").append(rules.ferFloor()).append('\n');
        y.append("  confidence: ").append(confidence).append('\n');
        y.append("  seed: ").append(seed).append('\n');
        y.append("analysis:\n");
        y.append("  target_fer: ").append(targetFer).append('\n');
        if (bounds != null) {
            y.append("  rate: ").append(bounds.spectralEfficiency()).append('\n');
            y.append("  mi: ").append(bounds.information().cliName()).append('\n');
            y.append("  outage_draws: ").append(bounds.mimoDraws()).append('\n');
        }
        return y.toString();
    }
}
