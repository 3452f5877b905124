package org.fadebench.bench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import java.util.concurrent.CancellationException;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundPoint;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.analysis.Reach;
import org.fadebench.bench.link.FrameCoding;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.report.AtomicFiles;
import org.fadebench.bench.report.Numbers;
import org.fadebench.bench.report.ResultsCsv;
import org.fadebench.bench.sweep.SnrGrid;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.coding.stbc.Decoder;
import org.fadebench.modem.LlrMethod;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.modem.Modulation;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/**
 * {@code fadebench bounds}: the three outage bounds of a link without simulating it: a table on the
 * terminal and {@code DIR/bounds.csv}. Takes the options of {@code run} that set the rate (channel
 * code, CRC, frame length), the fading blocks per frame (coherence) and the fading model, so the
 * bounds are those of the link {@code run} would simulate with the same options.
 */
@Command(name = "bounds", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Print and write the outage bounds of a link without simulating it.",
            "SNR is the total transmitted energy per channel use over N0 at each receive antenna."})
final class BoundsCommand implements Callable<Integer> {

    static final String HEADER = "snr_db,p_out_mimo,p_out_stbc,p_out_qam,p_out_mimo_ci_low,p_out_mimo_ci_high,"
            + "p_out_stbc_ci_low,p_out_stbc_ci_high,p_out_qam_ci_low,p_out_qam_ci_high";

    @CommandLine.Mixin
    LinkOptions linkOptions = new LinkOptions();

    @CommandLine.Mixin
    FrameOptions frameOptions = new FrameOptions();

    @CommandLine.Mixin
    FadingOptions fadingOptions = new FadingOptions();

    @Option(names = "--snr", paramLabel = "DB", defaultValue = "0:2:30",
            description = "SNR points in dB: START:STEP:STOP, one value, or a list a,b,c (default: ${DEFAULT-VALUE}).")
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
        FrameCoding coding = frameOptions.coding(null, 0, LlrMethod.MAXLOG);
        int bits = frameOptions.frameBits(coding.coded(), mod, code);
        ChannelSpec channel = fadingOptions.channel();
        int tx = linkOptions.transmitAntennas(code);
        LinkSettings link = RunCommand.parse(null, () -> new LinkSettings(mod, code, tx, linkOptions.rx, channel, bits,
                frameOptions.coherence, Decoder.MF, coding));
        BoundSettings settings = boundOptions.settings(link);
        Path dir = SweepJob.checkOutDir(out);
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
                code.name(), link.transmitAntennas(), link.receiveAntennas(), mod.cliName(), settings.channelWords(),
                Numbers.db(settings.spectralEfficiency()), settings.information().cliName());
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
