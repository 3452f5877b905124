package org.fadebench.bench.cli;

import static org.fadebench.bench.settings.RunSettings.*;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.CancellationException;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundPoint;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.analysis.Reach;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.report.AtomicFiles;
import org.fadebench.bench.report.Numbers;
import org.fadebench.bench.report.ResultsCsv;
import org.fadebench.bench.run.RunPlan;
import org.fadebench.bench.settings.InvalidSettingException;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.settings.Setting;
import org.fadebench.bench.settings.SettingValues;
import org.fadebench.bench.sweep.SnrGrid;
import org.fadebench.coding.stbc.SpaceTimeCode;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code fadebench bounds}: the three outage bounds of a link without simulating it: a table on the
 * terminal and {@code DIR/bounds.csv}. Its options are the settings of {@code run} that define the
 * bounds ({@link #SETTINGS}): those that set the rate (channel code, CRC, frame length), the fading
 * blocks per frame (coherence) and the fading model, so the same options give the bounds of the
 * link {@code run} simulates.
 */
@Command(name = "bounds", mixinStandardHelpOptions = true, sortOptions = false, abbreviateSynopsis = true,
        modelTransformer = BoundsCommand.Options.class,
        description = {"Print and write the outage bounds of a link without simulating it.",
            "SNR is the total transmitted energy per channel use over N0 at each receive antenna."})
final class BoundsCommand implements Callable<Integer> {

    static final String HEADER = "snr_db,p_out_mimo,p_out_stbc,p_out_qam,p_out_mimo_ci_low,p_out_mimo_ci_high,"
            + "p_out_stbc_ci_low,p_out_stbc_ci_high,p_out_qam_ci_low,p_out_qam_ci_high";

    /** The settings {@code bounds} takes. */
    static final List<Setting> SETTINGS = List.of(CODE, CODE_FILE, TX, RX, MODULATION, FEC, FEC_FILE, CRC,
            FRAME_BITS, COHERENCE, FADING, K_FACTOR, NAKAGAMI_M, TX_CORR, RX_CORR, SNR_DB, RATE, MI, OUTAGE_DRAWS,
            FOLDER);

    /** Where {@code bounds} differs from {@code run}'s defaults. */
    static final Map<Setting, String> DEFAULTS = Map.of(SNR_DB, "0..30/2", FOLDER, "fadebench-bounds");

    @CommandLine.Spec
    CommandSpec spec;

    /** Adds the settings as options. */
    static final class Options implements CommandLine.IModelTransformer {
        @Override
        public CommandSpec transform(CommandSpec spec) {
            return SettingOptions.addTo(spec, SETTINGS, DEFAULTS);
        }
    }

    @Override
    public Integer call() {
        SettingValues v = SettingValues.defaults(RunSettings.all())
                .overlaidBy(SettingOptions.given(spec.commandLine().getParseResult(), SETTINGS, DEFAULTS));
        try {
            return write(v);
        } catch (InvalidSettingException e) {
            throw new InvalidInputException(v.locate(e.setting(), e.problem()));
        } catch (IllegalArgumentException e) {
            throw new InvalidInputException(e.getMessage());
        }
    }

    private int write(SettingValues v) {
        LinkSettings link = RunPlan.link(v);
        SpaceTimeCode code = link.code();
        if (!code.isOrthogonal()) {
            throw new InvalidSettingException(CODE, code.name() + " is not orthogonal; the code bounds hold for "
                    + "orthogonal codes only (see 'fadebench codes')");
        }
        if (link.channel().awgn()) {
            throw new InvalidSettingException(FADING, "none is an AWGN channel, fixed and never in outage, so it has no"
                    + " outage bounds; valid: a fading model (rayleigh, rician, nakagami); over AWGN 'run' gives the"
                    + " normal approximation");
        }
        double[] snrDb = SnrGrid.parse(v.text(SNR_DB));
        BoundSettings settings = RunPlan.bounds(v, link);
        Path dir = SweepJob.checkOutDir(v.text(FOLDER));
        PrintWriter w = spec.commandLine().getOut();
        BoundCurves curves;
        try (SignalStop signals = SignalStop.install(() -> { })) {
            try {
                curves = BoundCurves.compute(settings, snrDb, signals::requested);
            } catch (CancellationException e) {
                spec.commandLine().getErr().println("fadebench bounds: interrupted; nothing written");
                return signals.exitCode();
            }
        }

        String what = String.format(Locale.ROOT, "%s %dx%d, %s, %s, R = %s bits per channel use, QAM information %s",
                code.name(), link.transmitAntennas(), link.receiveAntennas(), link.modulation().cliName(),
                settings.channelWords(), Numbers.db(settings.spectralEfficiency()), settings.information().cliName());
        w.println("outage bounds: " + what);
        w.println("SNR convention: " + ResultsCsv.SNR_CONVENTION);
        StringBuilder csv = new StringBuilder();
        csv.append("# fadebench outage bounds: ").append(what).append('\n');
        csv.append("# ").append(ResultsCsv.SNR_CONVENTION).append('\n');
        for (Bound b : Bound.values()) {
            String line = "p_out_" + b.key() + ": " + settings.method(b);
            w.println(line);
            csv.append("# ").append(line).append('\n');
        }
        String unresolved = "a Monte Carlo value is left out (-) where its interval is wider than the value";
        w.println(unresolved);
        csv.append("# ").append(unresolved.replace(" (-)", "")).append('\n');
        if (settings.fullRate()) {
            String note = "p_out_qam: " + Reach.ofFullRate(settings).words();
            w.println(note);
            csv.append("# ").append(note).append('\n');
        }
        w.println(String.format(Locale.ROOT, "%8s %12s %12s %12s", "SNR dB", "p_out_mimo", "p_out_stbc", "p_out_qam"));
        csv.append(HEADER).append('\n');
        for (BoundPoint p : curves.points()) {
            w.println(String.format(Locale.ROOT, "%8s %12s %12s %12s", Numbers.db(p.snrDb()),
                    Numbers.shortRate(p.shown(Bound.MIMO)), Numbers.shortRate(p.shown(Bound.STBC)),
                    Numbers.shortRate(p.shown(Bound.QAM))));
            csv.append(Numbers.db(p.snrDb()));
            for (Bound b : Bound.values()) {
                csv.append(',').append(ResultsCsv.shown(p, b));
            }
            for (Bound b : Bound.values()) {
                csv.append(',').append(Numbers.rate(p.estimate(b).lower())).append(',')
                        .append(Numbers.rate(p.estimate(b).upper()));
            }
            csv.append('\n');
        }
        Path file = dir.resolve("bounds.csv");
        try {
            AtomicFiles.writeString(file, csv.toString());
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        w.println("wrote " + file);
        w.flush();
        return ExitCodes.OK;
    }
}
