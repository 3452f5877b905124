package org.fadebench.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundPoint;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.report.AtomicFiles;
import org.fadebench.bench.report.Numbers;
import org.fadebench.bench.report.ResultsCsv;
import org.fadebench.bench.sweep.SnrGrid;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.modem.Modulation;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code fadebench bounds}: the three outage bounds of a link over i.i.d. Rayleigh block fading,
 * without simulating it: a table on the terminal and {@code DIR/bounds.csv}.
 */
@Command(name = "bounds", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Print and write the outage bounds of a link (i.i.d. Rayleigh block fading) without simulating it.",
            "SNR is the total transmitted energy per channel use over N0 at each receive antenna."})
final class BoundsCommand implements Callable<Integer> {

    static final String HEADER = "snr_db,p_out_mimo,p_out_stbc,p_out_qam,p_out_mimo_ci_low,p_out_mimo_ci_high";

    @CommandLine.Mixin
    LinkOptions linkOptions = new LinkOptions();

    @Option(names = "--snr", paramLabel = "DB", defaultValue = "0..30/2",
            description = "SNR points in dB: FROM..TO/STEP (TO included when on the grid), one value, or a list a,b,c (default: ${DEFAULT-VALUE}).")
    String snr;

    @CommandLine.Mixin
    BoundOptions boundOptions = new BoundOptions();

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "fadebench-bounds",
            description = "Folder for bounds.csv (default: ${DEFAULT-VALUE}).")
    String out;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() {
        Modulation mod = linkOptions.modulation();
        SpaceTimeCode code = linkOptions.code();
        if (!code.isOrthogonal()) {
            throw new InvalidInputException("--code " + code.name() + " is not orthogonal; the code bounds hold for "
                    + "orthogonal codes only (see 'fadebench codes')");
        }
        double[] snrDb = RunCommand.parse(null, () -> SnrGrid.parse(snr));
        int bits = LinkSettings.roundUpToBlocks(LinkSettings.DEFAULT_FRAME_BITS, mod, code);
        LinkSettings link = RunCommand.parse(null, () -> new LinkSettings(mod, code, linkOptions.transmitAntennas(code),
                linkOptions.rx, Fading.RAYLEIGH, bits, 0));
        BoundSettings settings = boundOptions.settings(link);
        Path dir = SweepJob.checkOutDir(out);
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
