package org.fadebench.bench.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Shape;
import java.awt.Stroke;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Line2D;
import java.awt.geom.Path2D;
import java.awt.geom.Rectangle2D;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.text.DecimalFormat;
import java.text.DecimalFormatSymbols;
import java.util.List;
import java.util.Locale;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundPoint;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.analysis.Reach;
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
import org.jfree.chart.block.GridArrangement;
import org.jfree.chart.plot.SeriesRenderingOrder;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.text.TextUtils;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.jfree.svg.SVGGraphics2D;

/**
 * Writes {@code fer.png} and {@code fer.svg}: simulated FER and BER against SNR on a logarithmic
 * axis, each point with a bar over its confidence interval, and the three outage bounds as lines.
 *
 * <p>Look: white background, faint decade grid, colours from the Okabe–Ito colour-blind-safe set
 * (M. Okabe and K. Ito, "Color Universal Design (CUD): how to make figures and presentations that
 * are friendly to colorblind people", 2008; from memory). Simulated curves are solid with markers
 * (FER blue circles, BER vermillion squares); bounds have no markers and each its own dash (MIMO
 * black long dashes, STBC bluish-green dash-dots, QAM reddish-purple short dashes), so the chart
 * also reads in grey. Every Monte Carlo bound carries a light band over its 95 % interval
 * and stops where that interval is wider than its value.
 *
 * <p>A point with no errors has an error rate of 0, which a log axis cannot show. It is drawn as
 * an open downward triangle at the upper end of its interval, the largest rate the run leaves
 * plausible, and is left out of the connecting line. Bound values of 0 (Monte Carlo with no outage)
 * are left out likewise. The y axis spans whole decades from below the lowest simulated value to 1,
 * with a small margin.
 */
public final class FerPlot {

    public static final String PNG_FILE = "fer.png";
    public static final String SVG_FILE = "fer.svg";
    public static final int WIDTH = 1000;
    public static final int HEIGHT = 700;

    static final String X_AXIS_TITLE = "SNR (dB): total transmit energy per channel use / N0 per receive antenna";
    static final String Y_AXIS_TITLE = "Error rate, outage probability";

    private static final Color BLUE = new Color(0x0072B2);
    private static final Color VERMILLION = new Color(0xD55E00);
    private static final Color BLACK = new Color(0x000000);
    private static final Color BLUISH_GREEN = new Color(0x009E73);
    private static final Color REDDISH_PURPLE = new Color(0xCC79A7);
    private static final Color GRID = new Color(0xD9D9D9);
    private static final Color MINOR_GRID = new Color(0xF0F0F0);
    private static final String FONT = Font.SANS_SERIF;
    /** The y axis reaches this factor beyond 1 and below its lowest decade. */
    private static final double MARGIN = 1.6;

    static {
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
        // Rotated text (the y-axis title) as a string, not glyph outlines, so the SVG keeps it as text.
        TextUtils.setUseDrawRotatedStringWorkaround(false);
    }

    private FerPlot() {
    }

    /**
     * Writes {@value #PNG_FILE} ({@value #WIDTH} x {@value #HEIGHT} pixels) and {@value #SVG_FILE}
     * into {@code directory}, each atomically.
     *
     * @param confidence the level of the points' intervals, for the subtitle (e.g. 0.95)
     * @param bounds     the outage bounds to draw, or null when they do not apply to the channel
     */
    public static void write(Path directory, LinkSettings link, List<PointResult> points, double confidence,
                             BoundCurves bounds) throws IOException {
        JFreeChart chart = chart(link, points, confidence, bounds);
        AtomicFiles.write(directory.resolve(PNG_FILE), out -> ChartUtils.writeChartAsPNG(out, chart, WIDTH, HEIGHT));
        SVGGraphics2D svg = new SVGGraphics2D(WIDTH, HEIGHT);
        svg.setDefsKeyPrefix("fer-"); // fixed ids, so the same results give the same file
        chart.draw(svg, new Rectangle2D.Double(0, 0, WIDTH, HEIGHT));
        byte[] document = svg.getSVGDocument().getBytes(StandardCharsets.UTF_8);
        AtomicFiles.write(directory.resolve(SVG_FILE), out -> out.write(document));
    }

    /** The chart, for callers that draw it elsewhere. */
    public static JFreeChart chart(LinkSettings link, List<PointResult> points, double confidence,
                                   BoundCurves bounds) {
        if (!(confidence > 0.0 && confidence < 1.0)) {
            throw new IllegalArgumentException("confidence level must be in (0, 1), e.g. 0.95, got " + confidence);
        }
        double floor = axisLowerBound(points);
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
        plot.setDomainAxis(snrAxis());
        plot.setRangeAxis(rateAxis(floor));
        addSimulated(plot, points, floor);
        if (bounds != null) {
            addBounds(plot, link, bounds, floor);
        }

        JFreeChart chart = new JFreeChart(title(link), new Font(FONT, Font.BOLD, 21), plot, false);
        chart.setBackgroundPaint(Color.WHITE);
        chart.setPadding(new RectangleInsets(8, 8, 12, 20));
        String sub = bounds != null ? subtitle(bounds.settings(), confidence)
                : String.format(Locale.ROOT, "bars: %s %% confidence intervals   ·   no outage bounds for this channel",
                        new java.math.BigDecimal(String.valueOf(100 * confidence)).stripTrailingZeros().toPlainString());
        TextTitle subtitle = new TextTitle(sub, new Font(FONT, Font.PLAIN, 14));
        subtitle.setPaint(new Color(0x444444));
        subtitle.setPadding(new RectangleInsets(2, 0, 10, 0));
        chart.addSubtitle(subtitle);
        int rows = (plot.getLegendItems().getItemCount() + 1) / 2;
        LegendTitle legend = new LegendTitle(plot, new GridArrangement(rows, 2), new GridArrangement(rows, 2));
        legend.setPosition(RectangleEdge.BOTTOM);
        legend.setItemFont(new Font(FONT, Font.PLAIN, 14));
        legend.setFrame(BlockBorder.NONE);
        legend.setMargin(new RectangleInsets(12, 0, 0, 0));
        legend.setItemLabelPadding(new RectangleInsets(3, 4, 3, 14));
        chart.addSubtitle(legend);
        return chart;
    }

    private static NumberAxis snrAxis() {
        NumberAxis x = new NumberAxis(X_AXIS_TITLE);
        x.setAutoRangeIncludesZero(false);
        x.setAutoRangeStickyZero(false);
        x.setLowerMargin(0.03);
        x.setUpperMargin(0.03);
        styleAxis(x);
        return x;
    }

    /** Logarithmic, from {@code floor} to just above 1, labelled 10⁰, 10⁻¹, … with a minor tick per unit. */
    private static LogAxis rateAxis(double floor) {
        LogAxis y = new LogAxis(Y_AXIS_TITLE);
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

    /** Dataset 0: FER and BER with interval bars; dataset 1: upper-limit markers of points without errors. */
    private static void addSimulated(XYPlot plot, List<PointResult> points, double floor) {
        YIntervalSeries fer = new YIntervalSeries("FER, simulated");
        YIntervalSeries ber = new YIntervalSeries("BER, simulated");
        XYSeries ferLimit = new XYSeries("FER upper limit (no frame error seen)", false);
        XYSeries berLimit = new XYSeries("BER upper limit (no bit error seen)", false);
        for (PointResult p : points) {
            if (p.counts().frameErrors() > 0) {
                fer.add(p.snrDb(), p.counts().fer(), Math.max(p.ferLow(), floor), p.ferHigh());
                ber.add(p.snrDb(), p.counts().ber(), Math.max(p.berLow(), floor), p.berHigh());
            } else if (p.counts().frames() > 0) {
                ferLimit.add(p.snrDb(), p.ferHigh());
                berLimit.add(p.snrDb(), p.berHigh());
            }
        }
        YIntervalSeriesCollection simulated = new YIntervalSeriesCollection();
        XYErrorRenderer renderer = new XYErrorRenderer();
        renderer.setDefaultLinesVisible(true);
        renderer.setLegendLine(new Line2D.Double(-12, 0, 12, 0));
        renderer.setDrawXError(false);
        renderer.setCapLength(7.0);
        renderer.setErrorStroke(new BasicStroke(1.5f));
        addSeries(simulated, renderer, fer, BLUE, new BasicStroke(2.4f), circle(9));
        addSeries(simulated, renderer, ber, VERMILLION, new BasicStroke(2.4f), square(8));
        plot.setDataset(0, simulated);
        plot.setRenderer(0, renderer);

        XYSeriesCollection limits = new XYSeriesCollection();
        XYLineAndShapeRenderer limitRenderer = new XYLineAndShapeRenderer(false, true);
        limitRenderer.setUseFillPaint(true);
        limitRenderer.setDefaultFillPaint(Color.WHITE);
        limitRenderer.setUseOutlinePaint(false);
        for (XYSeries limit : List.of(ferLimit, berLimit)) {
            if (limit.getItemCount() > 0) {
                // A point without errors usually has the same limit for both: BER's smaller triangle sits inside.
                int i = limits.getSeriesCount();
                limits.addSeries(limit);
                limitRenderer.setSeriesPaint(i, limit == ferLimit ? BLUE : VERMILLION);
                limitRenderer.setSeriesShape(i, downTriangle(limit == ferLimit ? 14 : 8));
                limitRenderer.setSeriesOutlineStroke(i, new BasicStroke(1.8f));
            }
        }
        plot.setDataset(1, limits);
        plot.setRenderer(1, limitRenderer);
    }

    /**
     * Dataset 2: the three bounds as dashed lines; a Monte Carlo bound with a band over its
     * interval, and left out where its interval is wider than its value.
     */
    private static void addBounds(XYPlot plot, LinkSettings link, BoundCurves bounds, double floor) {
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
                    series.add(p.snrDb(), v, Math.max(e.lower(), floor), e.upper());
                }
            }
            addSeries(outage, renderer, series, boundColour(b), boundStroke(b), null);
        }
        plot.setDataset(2, outage);
        plot.setRenderer(2, renderer);
    }

    /** E.g. "Alamouti 2×2, 16QAM, Rayleigh fading" or "1×2, BPSK, Rayleigh fading, no space-time code". */
    static String title(LinkSettings link) {
        String antennasAndSignal = String.format(Locale.ROOT, "%d×%d, %s, %s fading", link.transmitAntennas(),
                link.receiveAntennas(), link.modulation(), capitalised(link.fading()));
        String title = link.code() == SpaceTimeCodes.NONE ? antennasAndSignal + ", no space-time code"
                : capitalised(link.code().name()) + " " + antennasAndSignal;
        FecScheme fec = link.coding().scheme();
        if (link.coding().coded()) {
            title += ", " + (fec.code() == ChannelCodes.NONE ? "uncoded" : fec.code().cliName())
                    + (fec.crc() == Crc.NONE ? "" : " + " + fec.crc().cliName());
        }
        return title;
    }

    private static String subtitle(BoundSettings s, double confidence) {
        return String.format(Locale.ROOT, "R = %s bits per channel use   ·   bars: %s %% confidence intervals"
                        + "   ·   dashed: outage bounds at the same R",
                Numbers.db(s.spectralEfficiency()), Numbers.db(100 * confidence));
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
     * The decade at or below the lowest simulated value (BER, FER, or the upper limit of a point
     * without errors), at most 1e-2, or 1e-6 when nothing was simulated; less a margin so that
     * markers on that decade show whole. Interval ends below it, including ends at 0, are drawn from it.
     */
    private static double axisLowerBound(List<PointResult> points) {
        double lowest = Double.POSITIVE_INFINITY;
        for (PointResult p : points) {
            boolean errors = p.counts().frameErrors() > 0;
            for (double v : errors ? new double[] {p.counts().fer(), p.counts().ber()}
                    : new double[] {p.ferHigh(), p.berHigh()}) {
                if (v > 0.0) {
                    lowest = Math.min(lowest, v);
                }
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
