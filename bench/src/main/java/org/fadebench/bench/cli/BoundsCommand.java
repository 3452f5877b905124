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
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundPoint;
import org.fadebench.bench.analysis.BoundSettings;
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
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.modem.Modulation;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code fadebench bounds}: the three outage bounds of a link over i.i.d. Rayleigh block fading,
 * without simulating it: a table on the terminal and {@code DIR/bounds.csv}. Its options are the
 * settings of {@code run} that define the bounds ({@link #SETTINGS}).
 */
@Command(name = "bounds", mixinStandardHelpOptions = true, sortOptions = false,
        modelTransformer = BoundsCommand.Options.class,
        description = {"Print and write the outage bounds of a link (i.i.d. Rayleigh block fading) without simulating it.",
            "SNR is the total transmitted energy per channel use over N0 at each receive antenna."})
final class BoundsCommand implements Callable<Integer> {

    static final String HEADER = "snr_db,p_out_mimo,p_out_stbc,p_out_qam,p_out_mimo_ci_low,p_out_mimo_ci_high";

    /** The settings {@code bounds} takes. */
    static final List<Setting> SETTINGS = List.of(CODE, CODE_FILE, TX, RX, MODULATION, SNR_DB, RATE, MI,
            OUTAGE_DRAWS, FOLDER);

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
        Modulation mod = Modulation.fromCliName(v.text(MODULATION));
        SpaceTimeCode code = RunPlan.code(v);
        if (!code.isOrthogonal()) {
            throw new InvalidSettingException(CODE, code.name() + " is not orthogonal; the code bounds hold for "
                    + "orthogonal codes only (see 'fadebench codes')");
        }
        double[] snrDb = SnrGrid.parse(v.text(SNR_DB));
        int bits = LinkSettings.roundUpToBlocks(LinkSettings.DEFAULT_FRAME_BITS, mod, code);
        int tx = v.isSet(TX) ? v.integer(TX) : code.transmitAntennas();
        LinkSettings link = new LinkSettings(mod, code, tx, v.integer(RX), Fading.RAYLEIGH, bits, 0);
        BoundSettings settings = RunPlan.bounds(v, link);
        Path dir = SweepJob.checkOutDir(v.text(FOLDER));
        BoundCurves curves = BoundCurves.compute(settings, snrDb);

        PrintWriter w = spec.commandLine().getOut();
        w.println(String.format(Locale.ROOT, "outage bounds: %s %dx%d, %s, i.i.d. Rayleigh block fading, R = %s bits "
                        + "per channel use, QAM information %s", code.name(), link.transmitAntennas(),
                link.receiveAntennas(), mod.cliName(), Numbers.db(settings.spectralEfficiency()),
                settings.information().cliName()));
        w.println("SNR convention: " + ResultsCsv.SNR_CONVENTION);
        w.println(String.format(Locale.ROOT, "%8s %12s %12s %12s", "SNR dB", "p_out_mimo", "p_out_stbc", "p_out_qam"));
        StringBuilder csv = new StringBuilder();
        csv.append("# fadebench outage bounds: ").append(code.name()).append(' ').append(link.transmitAntennas())
                .append('x').append(link.receiveAntennas()).append(", ").append(mod.cliName())
                .append(", i.i.d. Rayleigh, R = ").append(Numbers.db(settings.spectralEfficiency()))
                .append(" bits per channel use, QAM information ").append(settings.information().cliName()).append('\n');
        csv.append("# ").append(ResultsCsv.SNR_CONVENTION).append('\n');
        csv.append("# p_out_mimo: ").append(settings.mimoExact() ? "exact"
                : "Monte Carlo over " + settings.mimoDraws() + " channel draws with a 95 % Wilson interval").append('\n');
        csv.append(HEADER).append('\n');
        for (BoundPoint p : curves.points()) {
            w.println(String.format(Locale.ROOT, "%8s %12s %12s %12s", Numbers.db(p.snrDb()),
                    Numbers.shortRate(p.mimo()), Numbers.shortRate(p.stbc()), Numbers.shortRate(p.qam())));
            csv.append(String.join(",", Numbers.db(p.snrDb()), Numbers.rate(p.mimo()), Numbers.rate(p.stbc()),
                    Numbers.rate(p.qam()), Numbers.rate(p.mimoLow()), Numbers.rate(p.mimoHigh()))).append('\n');
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
