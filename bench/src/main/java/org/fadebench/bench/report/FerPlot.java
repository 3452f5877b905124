package org.fadebench.bench.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.font.FontRenderContext;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.text.DecimalFormat;
import java.text.DecimalFormatSymbols;
import java.util.ArrayList;
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
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.SeriesRenderingOrder;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.text.TextUtils;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.jfree.svg.SVGGraphics2D;

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
    private static final Color TARGET_GREY = new Color(0x777777);
    private static final Color GRID = new Color(0xD9D9D9);
    private static final Color MINOR_GRID = new Color(0xF0F0F0);
    private static final String FONT = Font.SANS_SERIF;
    private static final Font TITLE_FONT = new Font(FONT, Font.BOLD, 21);
    private static final Font RUN_FONT = new Font(FONT, Font.PLAIN, 14);
    /** Widest line of the title and the run lines, in pixels: the chart less its padding and a margin. */
    private static final double TEXT_WIDTH = WIDTH - 80;
    /** The y axis reaches this factor beyond 1 and below its lowest decade. */
    private static final double MARGIN = 1.6;

    static {
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
        // Rotated text (the y-axis title) as a string, not glyph outlines, so the SVG keeps it as text.
        TextUtils.setUseDrawRotatedStringWorkaround(false);
    }

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
     * into {@code directory}, each atomically.
     *
     * @param seed       the run's master seed, named under the title
     * @param confidence the level of the points' intervals, for the subtitle (e.g. 0.95)
     * @param bounds     the outage bounds to draw, or null when they do not apply to the channel
     * @param targetFer  the FER drawn as a line across the FER panel
     */
    public static void write(Path directory, LinkSettings link, long seed, List<PointResult> points, double confidence,
                             BoundCurves bounds, double targetFer, Axes axes) throws IOException {
        JFreeChart chart = chart(link, seed, points, confidence, bounds, targetFer, axes);
        AtomicFiles.write(directory.resolve(PNG_FILE), out -> ChartUtils.writeChartAsPNG(out, chart, WIDTH, HEIGHT));
        SVGGraphics2D svg = new SVGGraphics2D(WIDTH, HEIGHT);
        svg.setDefsKeyPrefix("fer-"); // fixed ids, so the same results give the same file
        chart.draw(svg, new Rectangle2D.Double(0, 0, WIDTH, HEIGHT));
        byte[] document = svg.getSVGDocument().getBytes(StandardCharsets.UTF_8);
        AtomicFiles.write(directory.resolve(SVG_FILE), out -> out.write(document));
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
        XYPlot fer = panel(FER_AXIS_TITLE, ferFloor);
        addSimulated(fer, points, Measure.FER, x, ferFloor);
        if (bounds != null) {
            addBounds(fer, link, bounds, ferFloor, x);
        }
        Optional<NormalApproximation> normal = points.isEmpty() ? Optional.empty() : NormalApproximation.of(link);
        normal.ifPresent(a -> addNormalApproximation(fer, a, points, ferFloor, x));
        fer.addRangeMarker(targetLine(targetFer), Layer.BACKGROUND);
        XYPlot ber = panel(BER_AXIS_TITLE, berFloor);
        addSimulated(ber, points, Measure.BER, x, berFloor);

        CombinedDomainXYPlot plot = new CombinedDomainXYPlot(xAxis(link, axes.x()));
        plot.setGap(16.0);
        plot.setBackgroundPaint(Color.WHITE);
        plot.setOutlineVisible(false);
        plot.add(fer, 3);
        plot.add(ber, 2);

        List<String> titleLines = wrap(title(link), TITLE_FONT);
        JFreeChart chart = new JFreeChart(titleLines.get(0), TITLE_FONT, plot, false);
        chart.setBackgroundPaint(Color.WHITE);
        chart.setPadding(new RectangleInsets(8, 8, 12, 20));
        for (String line : titleLines.subList(1, titleLines.size())) {
            chart.addSubtitle(textLine(line, TITLE_FONT, Color.BLACK, 0));
        }
        List<String> runLines = wrap(runLine(link, seed), RUN_FONT);
        for (int i = 0; i < runLines.size(); i++) {
            chart.addSubtitle(textLine(runLines.get(i), RUN_FONT, new Color(0x222222), i == 0 ? 4 : 0));
        }
        String sub = bounds != null ? subtitle(bounds.settings(), confidence)
                : String.format(Locale.ROOT, "bars: %s %% confidence intervals   ·   %s", Numbers.db(100 * confidence),
                        link.channel().awgn() ? "no outage bounds over AWGN" : RunSummary.NO_BOUNDS);
        chart.addSubtitle(textLine(sub, RUN_FONT, new Color(0x444444), 6));
        chart.addSubtitle(textLine(bounds != null ? STYLE_WORDS : STYLE_WORDS_NO_BOUNDS, RUN_FONT, new Color(0x444444), 0));
        if (normal.isPresent()) {
            chart.addSubtitle(textLine(NORMAL_APPROX_WORDS, RUN_FONT, new Color(0x444444), 0));
        }
        double above = 6;
        for (String note : RunSummary.of(link, points, bounds, targetFer, RunSummary.noBounds(link)).reachLines()) {
            for (String line : wrap(note, RUN_FONT)) {
                chart.addSubtitle(textLine(line, RUN_FONT, new Color(0x444444), above));
                above = 0;
            }
        }
        // items flow in rows as their widths allow, so a long label never runs into its neighbour
        LegendTitle legend = new LegendTitle(plot);
        legend.setPosition(RectangleEdge.BOTTOM);
        legend.setItemFont(new Font(FONT, Font.PLAIN, 14));
        legend.setFrame(BlockBorder.NONE);
        legend.setMargin(new RectangleInsets(12, 0, 0, 0));
        legend.setItemLabelPadding(new RectangleInsets(3, 4, 3, 14));
        chart.addSubtitle(legend);
        return chart;
    }

    /** A centred line of text under the title; {@code above}: space above it in pixels. */
    private static TextTitle textLine(String text, Font font, Color colour, double above) {
        TextTitle t = new TextTitle(text, font);
        t.setPaint(colour);
        t.setPadding(new RectangleInsets(above, 0, 2, 0));
        return t;
    }

    /** One panel: white, faint decade grid, a logarithmic y axis from {@code floor} to just above 1. */
    private static XYPlot panel(String yTitle, double floor) {
        XYPlot plot = new XYPlot();
        plot.setBackgroundPaint(Color.WHITE);
        plot.setOutlinePaint(GRID);
        plot.setDomainGridlinePaint(GRID);
        plot.setRangeGridlinePaint(GRID);
        plot.setRangeMinorGridlinesVisible(true);
        plot.setRangeMinorGridlinePaint(MINOR_GRID);
        plot.setDomainGridlineStroke(new BasicStroke(1f));
        plot.setRangeGridlineStroke(new BasicStroke(1f));
        plot.setRangeMinorGridlineStroke(new BasicStroke(1f));
        plot.setAxisOffset(RectangleInsets.ZERO_INSETS);
        plot.setSeriesRenderingOrder(SeriesRenderingOrder.FORWARD);
        plot.setRangeAxis(rateAxis(yTitle, floor));
        return plot;
    }

    /** The target FER: a thin solid grey line (no bound is solid, no simulated curve is grey), labelled. */
    private static ValueMarker targetLine(double targetFer) {
        ValueMarker m = new ValueMarker(targetFer, TARGET_GREY, new BasicStroke(1.4f));
        m.setLabel("target FER " + targetFer);
        m.setLabelFont(new Font(FONT, Font.PLAIN, 13));
        m.setLabelPaint(TARGET_GREY);
        m.setLabelBackgroundColor(new Color(255, 255, 255, 0));
        m.setLabelAnchor(RectangleAnchor.BOTTOM_LEFT);
        m.setLabelTextAnchor(TextAnchor.TOP_LEFT);
        m.setLabelOffset(new RectangleInsets(4, 6, 4, 6));
        return m;
    }

    static String xAxisTitle(LinkSettings link, XQuantity x) {
        return x == XQuantity.SNR ? SNR_AXIS_TITLE
                : "Eb/N0 (dB) = SNR − 10·log10(R), R = " + Numbers.db(link.bitsPerChannelUse())
                        + " information bits per channel use";
    }

    private static NumberAxis xAxis(LinkSettings link, XQuantity quantity) {
        NumberAxis x = new NumberAxis(xAxisTitle(link, quantity));
        x.setAutoRangeIncludesZero(false);
        x.setAutoRangeStickyZero(false);
        x.setLowerMargin(0.03);
        x.setUpperMargin(0.03);
        styleAxis(x);
        return x;
    }

    /** Logarithmic, from {@code floor} to just above 1, labelled 10⁰, 10⁻¹, … with a minor tick per unit. */
    private static LogAxis rateAxis(String title, double floor) {
        LogAxis y = new LogAxis(title);
        y.setBase(10.0);
        y.setBaseSymbol("10");
        y.setSmallestValue(1e-300);
        y.setRange(floor, MARGIN);
        DecimalFormat exponent = new DecimalFormat("0", DecimalFormatSymbols.getInstance(Locale.ROOT));
        DecimalFormatSymbols minus = exponent.getDecimalFormatSymbols();
        minus.setMinusSign('\u2212');
        exponent.setDecimalFormatSymbols(minus);
        y.setTickUnit(new NumberTickUnit(1.0, exponent), false, true);
        y.setMinorTickCount(9);
        y.setMinorTickMarksVisible(true);
        styleAxis(y);
        return y;
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
        for (PointResult p : points) {
            double at = x.applyAsDouble(p.snrDb());
            if (p.counts().frameErrors() > 0) {
                if (isFer) {
                    rate.add(at, p.counts().fer(), Math.max(p.ferLow(), floor), p.ferHigh());
                } else {
                    rate.add(at, p.counts().ber(), Math.max(p.berLow(), floor), p.berHigh());
                }
            } else if (p.counts().frames() > 0) {
                limit.add(at, isFer ? p.ferHigh() : p.berHigh());
            }
        }
        Color colour = isFer ? BLUE : VERMILLION;
        YIntervalSeriesCollection simulated = new YIntervalSeriesCollection();
        XYErrorRenderer renderer = new XYErrorRenderer();
        renderer.setDefaultLinesVisible(true);
        renderer.setLegendLine(new Line2D.Double(-12, 0, 12, 0));
        renderer.setDrawXError(false);
        renderer.setCapLength(7.0);
        renderer.setErrorStroke(new BasicStroke(1.5f));
        addSeries(simulated, renderer, rate, colour, new BasicStroke(2.4f), isFer ? circle(9) : square(8));
        plot.setDataset(0, simulated);
        plot.setRenderer(0, renderer);

        XYSeriesCollection limits = new XYSeriesCollection();
        XYLineAndShapeRenderer limitRenderer = new XYLineAndShapeRenderer(false, true);
        limitRenderer.setUseFillPaint(true);
        limitRenderer.setDefaultFillPaint(Color.WHITE);
        limitRenderer.setUseOutlinePaint(false);
        if (limit.getItemCount() > 0) {
            limits.addSeries(limit);
            limitRenderer.setSeriesPaint(0, colour);
            limitRenderer.setSeriesShape(0, downTriangle(12));
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
            renderer.setSeriesStroke(0, new BasicStroke(2.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f,
                    new float[] {12f, 4f, 2f, 4f, 2f, 4f}, 0f));
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

    /**
     * {@code text} in lines no wider than the chart, broken only after the ", " or "; " between list
     * items, never inside a word (an item wider than the chart keeps a line of its own).
     */
    static List<String> wrap(String text, Font font) {
        FontRenderContext frc = new FontRenderContext(null, true, true);
        List<String> items = new ArrayList<>();
        int from = 0;
        for (int i = 0; i < text.length() - 1; i++) {
            char c = text.charAt(i);
            if ((c == ',' || c == ';') && text.charAt(i + 1) == ' ') {
                items.add(text.substring(from, i + 2));
                from = i + 2;
            }
        }
        items.add(text.substring(from));
        List<String> lines = new ArrayList<>();
        StringBuilder line = new StringBuilder();
        for (String item : items) {
            String longer = line + item;
            if (line.length() > 0 && font.getStringBounds(longer.strip(), frc).getWidth() > TEXT_WIDTH) {
                lines.add(line.toString().strip());
                line.setLength(0);
            }
            line.append(item);
        }
        lines.add(line.toString().strip());
        return lines;
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
        float[] dash;
        switch (b) {
            case MIMO:
                dash = new float[] {14f, 6f};
                break;
            case STBC:
                dash = new float[] {10f, 4f, 2f, 4f};
                break;
            default:
                dash = new float[] {4f, 4f};
                break;
        }
        return new BasicStroke(2.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, dash, 0f);
    }

    private static void addSeries(YIntervalSeriesCollection dataset, XYLineAndShapeRenderer renderer,
                                  YIntervalSeries series, Color colour, Stroke stroke, Shape shape) {
        if (series.getItemCount() == 0) {
            return;
        }
        int i = dataset.getSeriesCount();
        dataset.addSeries(series);
        renderer.setSeriesPaint(i, colour);
        renderer.setSeriesFillPaint(i, colour);
        renderer.setSeriesStroke(i, stroke);
        if (shape != null) {
            renderer.setSeriesShape(i, shape);
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
        double decade = lowest == Double.POSITIVE_INFINITY ? 1e-6
                : Math.min(1e-2, Math.pow(10.0, Math.floor(Math.log10(lowest))));
        return decade / MARGIN;
    }

    private static void styleAxis(ValueAxis axis) {
        axis.setLabelFont(new Font(FONT, Font.PLAIN, 16));
        axis.setTickLabelFont(new Font(FONT, Font.PLAIN, 14));
        axis.setLabelPaint(new Color(0x222222));
        axis.setTickLabelPaint(new Color(0x222222));
        axis.setAxisLinePaint(new Color(0x888888));
        axis.setTickMarkPaint(new Color(0x888888));
    }

    private static String capitalised(String s) {
        return s.isEmpty() ? s : Character.toUpperCase(s.charAt(0)) + s.substring(1);
    }

    private static Shape circle(double d) {
        return new Ellipse2D.Double(-d / 2, -d / 2, d, d);
    }

    private static Shape square(double d) {
        return new Rectangle2D.Double(-d / 2, -d / 2, d, d);
    }

    private static Shape downTriangle(double d) {
        Path2D.Double p = new Path2D.Double();
        p.moveTo(-d / 2, -d / 2);
        p.lineTo(d / 2, -d / 2);
        p.lineTo(0, d / 2);
        p.closePath();
        return p;
    }
}
