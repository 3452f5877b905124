package org.fadebench.bench.report;

import java.awt.BasicStroke;
import java.awt.Shape;
import java.awt.Color;
import java.awt.Font;
import java.awt.Stroke;
import java.awt.geom.Line2D;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.DoubleUnaryOperator;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundPoint;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.analysis.NormalApproximation;
import org.fadebench.bench.analysis.Reach;
import org.fadebench.bench.analysis.RunSummary;
import org.fadebench.channel.OutageEstimate;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.coding.fec.ChannelCodes;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.Layer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;

import static org.fadebench.bench.report.PlotParts.NOTE_TEXT;
import static org.fadebench.bench.report.PlotParts.RUN_FONT;
import static org.fadebench.bench.report.PlotParts.addSeries;
import static org.fadebench.bench.report.PlotParts.capitalised;
import static org.fadebench.bench.report.PlotParts.textLine;

/**
 * Writes {@code fer.png} and {@code fer.svg}: two panels over a shared x axis (SNR or Eb/N0, see
 * {@link Axes}). The upper panel holds the simulated FER with a bar over each point's confidence
 * interval, the outage bounds as lines and the target FER as a thin grey line; the lower panel holds
 * the simulated BER on its own axis, so that a BER below an outage bound never reads as a link that
 * beats the bound (the bounds are limits on the frame error rate).
 *
 * <p>The title names the link, and the lines under it everything else that defines the run, in the
 * words of the terminal's {@code link:} line ({@link LinkSettings#describe}) and the seed, wrapped
 * between list items, never inside a word. Under the style line, the terminal's lines on where the
 * link or a bound has no SNR at the target FER or crosses it outside the swept range
 * ({@link RunSummary#reachLines}), wrapped the same way.
 *
 * <p>Look: white background, faint decade grid, colours from the Okabe–Ito colour-blind-safe set
 * (M. Okabe and K. Ito, "Color Universal Design (CUD): how to make figures and presentations that
 * are friendly to colorblind people", 2008; from memory). Simulated curves are solid with markers
 * (FER blue circles, BER vermillion squares); bounds are broken lines without markers, each its own
 * pattern (MIMO black long dashes, STBC bluish-green dash-dots, QAM reddish-purple short dashes), so
 * the chart also reads in grey; a subtitle says so in words. Every Monte Carlo bound carries a light
 * band over its 95 % interval and stops where that interval is wider than its value. An AWGN link
 * also shows its finite-length limit, the normal approximation, as an orange (Okabe–Ito) dash-dot-dot
 * line, named in a line of its own under the style line.
 *
 * <p>A point with no errors has an error rate of 0, which a log axis cannot show. It is drawn as
 * an open downward triangle at the upper end of its interval, the largest rate the run leaves
 * plausible, and is left out of the connecting line. Bound values of 0 (Monte Carlo with no outage)
 * are left out likewise. Each y axis spans whole decades from below the lowest simulated value of its
 * panel to 1, with a small margin, unless {@link Axes#floor} fixes its lower end (so that two runs can
 * be laid side by side).
 */
public final class FerPlot {

    public static final String PNG_FILE = "fer.png";
    public static final String SVG_FILE = "fer.svg";
    public static final int WIDTH = 1000;
    public static final int HEIGHT = 900;

    static final String SNR_AXIS_TITLE = "SNR (dB): total transmit energy per channel use / N0 per receive antenna";
    static final String FER_AXIS_TITLE = "FER, outage probability";
    static final String BER_AXIS_TITLE = "BER (not comparable with outage)";
    static final String STYLE_WORDS = "simulated: solid lines with markers   ·   outage bounds: broken lines"
            + "   ·   grey line: target FER";
    /** The style line of a plot without outage bounds. */
    static final String STYLE_WORDS_NO_BOUNDS = "simulated: solid lines with markers   ·   grey line: target FER";
    static final String NORMAL_APPROX_WORDS =
            "AWGN finite-length limit (normal approximation): orange dash-dot-dot line";

    private static final Color BLUE = new Color(0x0072B2);
    private static final Color VERMILLION = new Color(0xD55E00);
    private static final Color BLACK = new Color(0x000000);
    private static final Color BLUISH_GREEN = new Color(0x009E73);
    private static final Color REDDISH_PURPLE = new Color(0xCC79A7);
    private static final Color ORANGE = new Color(0xE69F00);
    /** Widest line of the title and the run lines, in pixels: the chart less its padding and a margin. */
    static final double TEXT_WIDTH = WIDTH - 80;

    /** The quantity on the x axis. */
    public enum XQuantity {
        SNR("snr"), EBN0("ebn0");

        private final String cliName;

        XQuantity(String cliName) {
            this.cliName = cliName;
        }

        public String cliName() {
            return cliName;
        }

        /** The quantity named {@code name} ({@code snr} or {@code ebn0}). */
        public static XQuantity fromCliName(String name) {
            for (XQuantity q : values()) {
                if (q.cliName.equals(name.trim().toLowerCase(Locale.ROOT))) {
                    return q;
                }
            }
            throw new IllegalArgumentException("unknown x axis '" + name + "'; valid: snr, ebn0");
        }
    }

    /**
     * The axes' layout.
     *
     * @param x     SNR or Eb/N0 on the x axis
     * @param floor the fixed lower end of both y axes, in (0, 1), or NaN to fit each panel's values
     */
    public record Axes(XQuantity x, double floor) {
        /** SNR on the x axis, y axes fitted to the values. */
        public static final Axes AUTOMATIC = new Axes(XQuantity.SNR, Double.NaN);

        public Axes {
            if (x == null) {
                throw new IllegalArgumentException("--plot-x must be snr or ebn0");
            }
            if (!Double.isNaN(floor) && !(floor > 0.0 && floor < 1.0)) {
                throw new IllegalArgumentException("--plot-floor must lie strictly between 0 and 1 (e.g. 1e-6), got "
                        + floor);
            }
        }

        boolean fixedFloor() {
            return !Double.isNaN(floor);
        }
    }

    private FerPlot() {
    }

    /**
     * Writes {@value #PNG_FILE} ({@value #WIDTH} x {@value #HEIGHT} pixels) and {@value #SVG_FILE}
     * into {@code directory}, each atomically, and returns the drawing as an SVG element to embed in
     * HTML (see {@link HtmlReport}).
     *
     * @param seed       the run's master seed, named under the title
     * @param confidence the level of the points' intervals, for the subtitle (e.g. 0.95)
     * @param bounds     the outage bounds to draw, or null when they do not apply to the channel
     * @param targetFer  the FER drawn as a line across the FER panel
     */
    public static String write(Path directory, LinkSettings link, long seed, List<PointResult> points,
                               double confidence, BoundCurves bounds, double targetFer, Axes axes) throws IOException {
        JFreeChart chart = chart(link, seed, points, confidence, bounds, targetFer, axes);
        return PlotParts.write(chart, WIDTH, HEIGHT, directory.resolve(PNG_FILE), directory.resolve(SVG_FILE), "fer-");
    }

    /** The chart, for callers that draw it elsewhere. */
    public static JFreeChart chart(LinkSettings link, long seed, List<PointResult> points, double confidence,
                                   BoundCurves bounds, double targetFer, Axes axes) {
        if (!(confidence > 0.0 && confidence < 1.0)) {
            throw new IllegalArgumentException("confidence level must be in (0, 1), e.g. 0.95, got " + confidence);
        }
        if (!(targetFer > 0.0 && targetFer < 1.0)) {
            throw new IllegalArgumentException("target FER must be in (0, 1), e.g. 0.01, got " + targetFer);
        }
        DoubleUnaryOperator x = axes.x() == XQuantity.EBN0 ? link::ebN0Db : snrDb -> snrDb;
        double ferFloor = axes.fixedFloor() ? axes.floor() : axisLowerBound(points, Measure.FER);
        double berFloor = axes.fixedFloor() ? axes.floor() : axisLowerBound(points, Measure.BER);
        XYPlot fer = PlotParts.panel(FER_AXIS_TITLE, ferFloor);
        addSimulated(fer, points, Measure.FER, x, ferFloor);
        if (bounds != null) {
            addBounds(fer, link, bounds, ferFloor, x);
        }
        Optional<NormalApproximation> normal = points.isEmpty() ? Optional.empty() : NormalApproximation.of(link);
        normal.ifPresent(a -> addNormalApproximation(fer, a, points, ferFloor, x));
        fer.addRangeMarker(PlotParts.targetLine(targetFer), Layer.BACKGROUND);
        XYPlot ber = PlotParts.panel(BER_AXIS_TITLE, berFloor);
        addSimulated(ber, points, Measure.BER, x, berFloor);

        CombinedDomainXYPlot plot = new CombinedDomainXYPlot(PlotParts.xAxis(xAxisTitle(link, axes.x())));
        plot.setGap(16.0);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setOutlineVisible(false);
        plot.add(fer, 3);
        plot.add(ber, 2);

        JFreeChart chart = PlotParts.titled(title(link), plot, TEXT_WIDTH);
        List<String> runLines = wrap(runLine(link, seed), RUN_FONT);
        for (int i = 0; i < runLines.size(); i++) {
            chart.addSubtitle(textLine(runLines.get(i), RUN_FONT, PlotParts.TEXT, i == 0 ? 4 : 0));
        }
        String sub = bounds != null ? subtitle(bounds.settings(), confidence)
                : String.format(Locale.ROOT, "bars: %s %% confidence intervals   ·   %s", Numbers.db(100 * confidence),
                        link.channel().awgn() ? "no outage bounds over AWGN" : RunSummary.NO_BOUNDS);
        chart.addSubtitle(textLine(sub, RUN_FONT, NOTE_TEXT, 6));
        chart.addSubtitle(textLine(bounds != null ? STYLE_WORDS : STYLE_WORDS_NO_BOUNDS, RUN_FONT, NOTE_TEXT, 0));
        if (normal.isPresent()) {
            chart.addSubtitle(textLine(NORMAL_APPROX_WORDS, RUN_FONT, NOTE_TEXT, 0));
        }
        double above = 6;
        for (String note : RunSummary.of(link, points, bounds, targetFer, RunSummary.noBounds(link)).reachLines()) {
            for (String line : wrap(note, RUN_FONT)) {
                chart.addSubtitle(textLine(line, RUN_FONT, NOTE_TEXT, above));
                above = 0;
            }
        }
        chart.addSubtitle(PlotParts.legend(plot));
        return chart;
    }

    static String xAxisTitle(LinkSettings link, XQuantity x) {
        return x == XQuantity.SNR ? SNR_AXIS_TITLE
                : "Eb/N0 (dB) = SNR − 10·log10(R), R = " + Numbers.db(link.bitsPerChannelUse())
                        + " information bits per channel use";
    }

    /** What a panel of simulated values shows. */
    private enum Measure { FER, BER }

    /**
     * Dataset 0: the simulated FER or BER with interval bars; dataset 1: upper-limit markers of points
     * without errors.
     */
    private static void addSimulated(XYPlot plot, List<PointResult> points, Measure m, DoubleUnaryOperator x,
                                     double floor) {
        boolean isFer = m == Measure.FER;
        YIntervalSeries rate = new YIntervalSeries(isFer ? "FER, simulated" : "BER, simulated");
        XYSeries limit = new XYSeries(isFer ? "FER upper limit (no frame error seen)"
                : "BER upper limit (no bit error seen)", false);
        String name = isFer ? "FER" : "BER";
        YIntervalSeries weighted = new YIntervalSeries(name + ", fade sampling");
        YIntervalSeries untrusted = new YIntervalSeries(name + ", fade sampling: too few effective errors");
        for (PointResult p : points) {
            double at = x.applyAsDouble(p.snrDb());
            if (p.counts().frameErrors() > 0) {
                YIntervalSeries series = !p.counts().weighted() ? rate : p.trusted() ? weighted : untrusted;
                if (isFer) {
                    series.add(at, p.counts().fer(), Math.max(p.ferLow(), floor), p.ferHigh());
                } else {
                    series.add(at, p.counts().ber(), Math.max(p.berLow(), floor), p.berHigh());
                }
            } else if (p.counts().frames() > 0) {
                limit.add(at, isFer ? p.ferHigh() : p.berHigh());
            }
        }
        Color colour = isFer ? BLUE : VERMILLION;
        YIntervalSeriesCollection simulated = new YIntervalSeriesCollection();
        XYErrorRenderer renderer = PlotParts.intervalRenderer();
        addSeries(simulated, renderer, rate, colour, new BasicStroke(2.4f),
                isFer ? PlotParts.circle(9) : PlotParts.square(8));
        // points estimated by importance sampling: a diamond; a hollow one where the interval is not trusted
        Shape diamond = PlotParts.polygon(11, 0, -0.5, 0.5, 0, 0, 0.5, -0.5, 0);
        addSeries(simulated, renderer, weighted, colour, new BasicStroke(2.4f), diamond);
        int before = simulated.getSeriesCount();
        addSeries(simulated, renderer, untrusted, colour, new BasicStroke(2.4f), diamond);
        if (simulated.getSeriesCount() > before) {
            renderer.setSeriesShapesFilled(before, false);
        }
        plot.setDataset(0, simulated);
        plot.setRenderer(0, renderer);

        XYSeriesCollection limits = new XYSeriesCollection();
        XYLineAndShapeRenderer limitRenderer = PlotParts.limitRenderer();
        if (limit.getItemCount() > 0) {
            limits.addSeries(limit);
            limitRenderer.setSeriesPaint(0, colour);
            limitRenderer.setSeriesShape(0, PlotParts.downTriangle(12));
            limitRenderer.setSeriesOutlineStroke(0, new BasicStroke(1.8f));
        }
        plot.setDataset(1, limits);
        plot.setRenderer(1, limitRenderer);
    }

    /**
     * Dataset 2: the three bounds as dashed lines; a Monte Carlo bound with a band over its
     * interval, and left out where its interval is wider than its value.
     */
    private static void addBounds(XYPlot plot, LinkSettings link, BoundCurves bounds, double floor,
                                  DoubleUnaryOperator x) {
        YIntervalSeriesCollection outage = new YIntervalSeriesCollection();
        DeviationRenderer renderer = new DeviationRenderer(true, false);
        renderer.setAlpha(0.18f);
        renderer.setLegendLine(new Line2D.Double(-20, 0, 20, 0));
        for (Bound b : Bound.values()) {
            YIntervalSeries series = new YIntervalSeries(boundLabel(b, link, bounds.settings()));
            for (BoundPoint p : bounds.points()) {
                OutageEstimate e = p.estimate(b);
                double v = p.shown(b);
                if (v > 0.0) {
                    series.add(x.applyAsDouble(p.snrDb()), v, Math.min(v, Math.max(e.lower(), floor)), e.upper());
                }
            }
            addSeries(outage, renderer, series, boundColour(b), boundStroke(b), null);
        }
        plot.setDataset(2, outage);
        plot.setRenderer(2, renderer);
    }

    /**
     * Dataset 3: the normal approximation of an AWGN link ({@link NormalApproximation}) as an orange
     * dash-dot-dot line. Unlike the bounds it is drawn on a fine grid over its fall from near 1 to
     * the axis floor ({@link NormalApproximation#grid}), within the swept range or beyond it, since
     * it falls by decades within a dB; it ends at the first value below the axis.
     */
    private static void addNormalApproximation(XYPlot plot, NormalApproximation a, List<PointResult> points,
                                               double floor, DoubleUnaryOperator x) {
        XYSeries series = new XYSeries(String.format(Locale.ROOT,
                "Normal approximation, n = %d channel uses, k = %d bits (AWGN, finite length)", a.symbols(),
                a.payloadBits()), false);
        for (double snrDb : a.grid(points.stream().mapToDouble(PointResult::snrDb).toArray(), floor)) {
            double v = a.fer(snrDb);
            if (v > 0.0) {
                series.add(x.applyAsDouble(snrDb), v);
            }
            if (v < floor) {
                break;
            }
        }
        XYSeriesCollection dataset = new XYSeriesCollection();
        XYLineAndShapeRenderer renderer = new XYLineAndShapeRenderer(true, false);
        renderer.setLegendLine(new Line2D.Double(-20, 0, 20, 0));
        if (series.getItemCount() > 0) {
            dataset.addSeries(series);
            renderer.setSeriesPaint(0, ORANGE);
            renderer.setSeriesStroke(0, PlotParts.dashed(2.2f, 12f, 4f, 2f, 4f, 2f, 4f));
        }
        plot.setDataset(3, dataset);
        plot.setRenderer(3, renderer);
    }

    /** E.g. "Alamouti 2×2, QPSK, Rayleigh fading" or "1×2, BPSK, Rayleigh fading, no space-time code". */
    static String title(LinkSettings link) {
        String antennasAndSignal = String.format(Locale.ROOT, "%d×%d, %s, %s", link.transmitAntennas(),
                link.receiveAntennas(), link.modulation(),
                link.channel().awgn() ? "AWGN channel" : capitalised(link.fading()) + " fading");
        String title = link.code() == SpaceTimeCodes.NONE ? antennasAndSignal + ", no space-time code"
                : capitalised(link.code().name()) + " " + antennasAndSignal;
        FecScheme fec = link.coding().scheme();
        if (link.coding().coded()) {
            title += ", " + (fec.code() == ChannelCodes.NONE ? "uncoded" : fec.code().cliName())
                    + (fec.crc() == Crc.NONE ? "" : " + " + fec.crc().cliName());
        }
        return title;
    }

    /**
     * Everything that defines the run, as the terminal's {@code link:} line says it (fading model and
     * its parameters, CSI, frame length, fading blocks, channel code, CRC, interleaver, LLRs), and the seed.
     */
    static String runLine(LinkSettings link, long seed) {
        return "Run: " + link.describe() + ", seed " + seed;
    }

    /** {@code text} wrapped to the chart's width between list items ({@link PlotParts#wrap}). */
    static List<String> wrap(String text, Font font) {
        return PlotParts.wrap(text, font, TEXT_WIDTH);
    }

    private static String subtitle(BoundSettings s, double confidence) {
        return String.format(Locale.ROOT, "bars: %s %% confidence intervals   ·   outage bounds at R = %s bits per"
                        + " channel use", Numbers.db(100 * confidence), Numbers.db(s.spectralEfficiency()));
    }

    static String boundLabel(Bound b, LinkSettings link, BoundSettings s) {
        String blocks = s.fadingBlocks() > 1 ? s.fadingBlocks() + " fading blocks" : "";
        String counted = s.exact(b) ? blocks.isEmpty() ? "" : " (" + blocks + ")"
                : " (" + (blocks.isEmpty() ? "Monte Carlo" : blocks) + ", band: 95 %)";
        switch (b) {
            case MIMO:
                return String.format(Locale.ROOT, "Outage, %d×%d MIMO, Gaussian inputs%s", s.transmitAntennas(),
                        s.receiveAntennas(), counted);
            case STBC:
                return "Outage, " + codeName(link) + ", Gaussian symbols" + counted;
            default:
                String label = "Outage, " + codeName(link) + ", " + s.modulation() + " ("
                        + s.information().cliName().toUpperCase(Locale.ROOT) + ")" + counted;
                return s.fullRate() ? label + ": " + Reach.ofFullRate(s).words() : label;
        }
    }


    private static String codeName(LinkSettings link) {
        return link.code() == SpaceTimeCodes.NONE ? "no STBC" : capitalised(link.code().name());
    }

    private static Color boundColour(Bound b) {
        switch (b) {
            case MIMO:
                return BLACK;
            case STBC:
                return BLUISH_GREEN;
            default:
                return REDDISH_PURPLE;
        }
    }

    private static Stroke boundStroke(Bound b) {
        switch (b) {
            case MIMO:
                return PlotParts.dashed(2.2f, 14f, 6f);
            case STBC:
                return PlotParts.dashed(2.2f, 10f, 4f, 2f, 4f);
            default:
                return PlotParts.dashed(2.2f, 4f, 4f);
        }
    }

    /**
     * The decade at or below the lowest simulated value of the panel (the rate, or the upper limit of
     * a point without errors), at most 1e-2, or 1e-6 when nothing was simulated; less a margin so that
     * markers on that decade show whole. Interval ends below it, including ends at 0, are drawn from it.
     */
    private static double axisLowerBound(List<PointResult> points, Measure m) {
        double lowest = Double.POSITIVE_INFINITY;
        for (PointResult p : points) {
            boolean errors = p.counts().frameErrors() > 0;
            double v = m == Measure.FER ? (errors ? p.counts().fer() : p.ferHigh())
                    : (errors ? p.counts().ber() : p.berHigh());
            if (v > 0.0) {
                lowest = Math.min(lowest, v);
            }
        }
        return PlotParts.floorBelow(lowest);
    }
}
