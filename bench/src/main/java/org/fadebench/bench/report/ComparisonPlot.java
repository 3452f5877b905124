package org.fadebench.bench.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Shape;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.HashSet;
import java.util.Locale;
import java.util.Set;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundPoint;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.report.FerPlot.XQuantity;
import org.fadebench.bench.sweep.PointResult;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.ui.Layer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;

/**
 * Writes {@code fer.png} and {@code fer.svg} for several designs: every design's simulated FER on
 * one panel with one x axis (SNR or Eb/N0) and one logarithmic FER axis, so that all designs are
 * read against the same range. Each design has its own colour and marker, a bar over each point's
 * confidence interval, and an open downward triangle in its colour at the upper end of the interval
 * of a point without frame errors (as in {@link FerPlot}); optionally its QAM-constrained outage
 * bound as a dashed line in its colour. The target FER is a thin grey horizontal line, the SNR the
 * link budget allows (if given) a dark vertical line.
 *
 * <p>Colours: seven of the Okabe–Ito colour-blind-safe set (M. Okabe and K. Ito, "Color Universal
 * Design (CUD): how to make figures and presentations that are friendly to colorblind people",
 * 2008; from memory), without its yellow, which is too faint on white; markers: seven plain shapes.
 * Design i takes colour i mod 7 and marker (i + ⌊i/7⌋) mod 7, so up to 49 designs differ in colour
 * or marker, and the plot still reads in grey.
 *
 * <p>Fill {@link Design} records (from a run in memory with {@link Design#of}, or from a run
 * folder's results.json and results.csv with the constructor) and a {@link Layout}, then call
 * {@link #write}.
 */
public final class ComparisonPlot {

    public static final int WIDTH = 1000;
    public static final int HEIGHT = 760;

    static final String FER_AXIS_TITLE = "FER";
    static final String BUDGET_COLOUR_WORDS = "dark vertical line: link-budget SNR";
    static final Color BUDGET_DARK = new Color(0x333333);

    /** Okabe–Ito blue, vermillion, bluish green, reddish purple, orange, sky blue, black. */
    static final Color[] PALETTE = {new Color(0x0072B2), new Color(0xD55E00), new Color(0x009E73),
        new Color(0xCC79A7), new Color(0xE69F00), new Color(0x56B4E9), new Color(0x000000)};

    /** Circle, square, diamond, upward triangle, hexagon, left- and right-pointing triangles. */
    private static final Shape[] MARKERS = {PlotParts.circle(9), PlotParts.square(8),
        PlotParts.polygon(11, 0, -0.5, 0.5, 0, 0, 0.5, -0.5, 0), PlotParts.polygon(10, 0, -0.5, 0.5, 0.45, -0.5, 0.45),
        PlotParts.polygon(10, -0.25, -0.45, 0.25, -0.45, 0.5, 0, 0.25, 0.45, -0.25, 0.45, -0.5, 0),
        PlotParts.polygon(10, -0.5, 0, 0.45, -0.5, 0.45, 0.5), PlotParts.polygon(10, 0.5, 0, -0.45, -0.5, -0.45, 0.5)};

    private ComparisonPlot() {
    }

    /**
     * One simulated SNR point of a design: the fields of a results.json point of the same names.
     *
     * @param ferLow  lower end of the FER's confidence interval
     * @param ferHigh upper end of the FER's confidence interval
     */
    public record Point(double snrDb, long frames, long frameErrors, double ferLow, double ferHigh) {
        public Point {
            if (frames < 0 || frameErrors < 0 || frameErrors > frames) {
                throw new IllegalArgumentException("a point needs 0 <= frame errors <= frames, got " + frameErrors
                        + " of " + frames);
            }
        }

        /** The point of a sweep. */
        public static Point of(PointResult r) {
            return new Point(r.snrDb(), r.equivalentFrames(), r.equivalentErrors(), r.ferLow(), r.ferHigh());
        }

        /** The FER, NaN without frames. */
        public double fer() {
            return frames == 0 ? Double.NaN : frameErrors / (double) frames;
        }
    }

    /**
     * A value of an outage bound: results.csv's {@code snr_db} and {@code p_out_qam} of one row.
     *
     * @param probability the outage probability, NaN where a count cannot resolve it (an empty cell)
     */
    public record BoundValue(double snrDb, double probability) {
    }

    /**
     * One design on the plot.
     *
     * @param name              its name in the legend
     * @param bitsPerChannelUse its information bits per channel use R (results.json's
     *                          {@code bits_per_channel_use}), which places it on an Eb/N0 axis:
     *                          Eb/N0 = SNR − 10·log10(R)
     * @param points            its simulated points, in SNR order
     * @param qamBound          its QAM-constrained outage bound (empty where none applies)
     */
    public record Design(String name, double bitsPerChannelUse, List<Point> points, List<BoundValue> qamBound) {
        public Design {
            if (name == null || name.isBlank()) {
                throw new IllegalArgumentException("a design needs a name");
            }
            if (!(bitsPerChannelUse > 0 && Double.isFinite(bitsPerChannelUse))) {
                throw new IllegalArgumentException("design " + name + ": bits per channel use must be positive, got "
                        + bitsPerChannelUse);
            }
            points = List.copyOf(points);
            qamBound = List.copyOf(qamBound);
        }

        /** The design of a sweep of {@code link} in memory; {@code bounds} may be null (no bound drawn). */
        public static Design of(String name, LinkSettings link, List<PointResult> points, BoundCurves bounds) {
            List<BoundValue> qam = new ArrayList<>();
            if (bounds != null) {
                for (BoundPoint p : bounds.points()) {
                    qam.add(new BoundValue(p.snrDb(), p.shown(Bound.QAM)));
                }
            }
            return new Design(name, link.bitsPerChannelUse(), points.stream().map(Point::of).toList(), qam);
        }

        double x(double snrDb, XQuantity q) {
            return q == XQuantity.EBN0 ? snrDb - 10 * Math.log10(bitsPerChannelUse) : snrDb;
        }
    }

    /**
     * What the plot shows besides the designs.
     *
     * @param title      the title line (wrapped between list items when long)
     * @param x          SNR or Eb/N0 on the x axis
     * @param targetFer  the FER drawn as a horizontal line, in (0, 1)
     * @param budgetDb   the SNR in dB the link budget allows, drawn as a vertical line; NaN for none.
     *                   On an Eb/N0 axis it is drawn only when every design has the same rate (else
     *                   a line under the title says why not)
     * @param withBounds whether to draw each design's QAM-constrained outage bound
     * @param confidence the level of the points' intervals, for the line under the title (e.g. 0.95)
     * @param floor      the fixed lower end of the FER axis, in (0, 1), or NaN to fit the values
     */
    public record Layout(String title, XQuantity x, double targetFer, double budgetDb, boolean withBounds,
                         double confidence, double floor) {
        public Layout {
            if (x == null) {
                throw new IllegalArgumentException("--x-axis must be snr or ebn0");
            }
            if (!(targetFer > 0.0 && targetFer < 1.0)) {
                throw new IllegalArgumentException("target FER must be in (0, 1), e.g. 0.01, got " + targetFer);
            }
            if (!(confidence > 0.0 && confidence < 1.0)) {
                throw new IllegalArgumentException("confidence level must be in (0, 1), e.g. 0.95, got " + confidence);
            }
            if (!Double.isNaN(floor) && !(floor > 0.0 && floor < 1.0)) {
                throw new IllegalArgumentException("the FER axis floor must lie strictly between 0 and 1, got " + floor);
            }
            if (Double.isInfinite(budgetDb)) {
                throw new IllegalArgumentException("the link budget must be a finite SNR in dB, got " + budgetDb);
            }
        }
    }

    /**
     * Writes {@link FerPlot#PNG_FILE} ({@value #WIDTH} x {@value #HEIGHT} pixels) and
     * {@link FerPlot#SVG_FILE} into {@code directory}, each atomically, and returns the drawing as an
     * SVG element to embed in {@link HtmlReport}. The designs need distinct names (the legend tells
     * them apart by name); an empty list or a repeated name is an {@link IllegalArgumentException}.
     */
    public static String write(Path directory, List<Design> designs, Layout layout) throws IOException {
        JFreeChart chart = chart(designs, layout);
        return PlotParts.write(chart, WIDTH, HEIGHT, directory.resolve(FerPlot.PNG_FILE),
                directory.resolve(FerPlot.SVG_FILE), "compare-");
    }

    /**
     * The chart: dataset 0 the simulated FER (series i: design i), 1 the upper limits, 2 the bounds.
     * Refuses an empty list and two designs of one name.
     */
    static JFreeChart chart(List<Design> designs, Layout layout) {
        if (designs.isEmpty()) {
            throw new IllegalArgumentException("nothing to plot: no designs");
        }
        Set<String> names = new HashSet<>();
        for (Design d : designs) {
            if (!names.add(d.name())) {
                throw new IllegalArgumentException("two designs are named '" + d.name() + "'; each needs its own name");
            }
        }
        double floor = Double.isNaN(layout.floor()) ? PlotParts.floorBelow(lowest(designs)) : layout.floor();
        XYPlot plot = PlotParts.panel(FER_AXIS_TITLE, floor);
        YIntervalSeriesCollection simulated = new YIntervalSeriesCollection();
        XYErrorRenderer renderer = PlotParts.intervalRenderer();
        XYSeriesCollection limits = new XYSeriesCollection();
        XYLineAndShapeRenderer limitRenderer = PlotParts.limitRenderer();
        limitRenderer.setDefaultSeriesVisibleInLegend(false);
        XYSeriesCollection bounds = new XYSeriesCollection();
        XYLineAndShapeRenderer boundRenderer = new XYLineAndShapeRenderer(true, false);
        boundRenderer.setDefaultSeriesVisibleInLegend(false);
        List<Double> xs = new ArrayList<>();
        for (int i = 0; i < designs.size(); i++) {
            Design d = designs.get(i);
            Color colour = colour(i);
            YIntervalSeries rate = new YIntervalSeries(legendLabel(d, layout.x()));
            XYSeries limit = new XYSeries(d.name() + ": upper limit", false);
            for (Point p : d.points()) {
                double at = d.x(p.snrDb(), layout.x());
                if (p.frameErrors() > 0) {
                    rate.add(at, p.fer(), Math.max(p.ferLow(), floor), p.ferHigh());
                    xs.add(at);
                } else if (p.frames() > 0) {
                    limit.add(at, p.ferHigh());
                    xs.add(at);
                }
            }
            simulated.addSeries(rate);
            renderer.setSeriesPaint(i, colour);
            renderer.setSeriesFillPaint(i, colour);
            renderer.setSeriesStroke(i, new BasicStroke(2.4f));
            renderer.setSeriesShape(i, marker(i));
            limits.addSeries(limit);
            limitRenderer.setSeriesPaint(i, colour);
            limitRenderer.setSeriesShape(i, PlotParts.downTriangle(12));
            limitRenderer.setSeriesOutlineStroke(i, new BasicStroke(1.8f));
            if (layout.withBounds()) {
                XYSeries bound = new XYSeries(d.name() + ": QAM outage bound", false);
                for (BoundValue b : d.qamBound()) {
                    if (b.probability() > 0.0) {
                        bound.add(d.x(b.snrDb(), layout.x()), b.probability());
                    }
                }
                bounds.addSeries(bound);
                boundRenderer.setSeriesPaint(i, colour);
                boundRenderer.setSeriesStroke(i, PlotParts.dashed(2.0f, 7f, 5f));
            }
        }
        plot.setDataset(0, simulated);
        plot.setRenderer(0, renderer);
        plot.setDataset(1, limits);
        plot.setRenderer(1, limitRenderer);
        plot.setDataset(2, bounds);
        plot.setRenderer(2, boundRenderer);
        plot.addRangeMarker(PlotParts.targetLine(layout.targetFer()), Layer.BACKGROUND);
        double budgetX = budgetX(designs, layout);
        if (!Double.isNaN(budgetX)) {
            plot.addDomainMarker(budgetLine(budgetX, layout.budgetDb()), Layer.BACKGROUND);
            xs.add(budgetX);
        }
        NumberAxis x = PlotParts.xAxis(xAxisTitle(layout.x()));
        if (!xs.isEmpty()) {
            double lo = xs.stream().mapToDouble(Double::doubleValue).min().getAsDouble();
            double hi = xs.stream().mapToDouble(Double::doubleValue).max().getAsDouble();
            double margin = hi > lo ? 0.03 * (hi - lo) : 1.0;
            x.setRange(lo - margin, hi + margin);
        }
        plot.setDomainAxis(x);

        JFreeChart chart = PlotParts.titled(layout.title(), plot, WIDTH - 80);
        for (String line : styleLines(designs, layout)) {
            chart.addSubtitle(PlotParts.textLine(line, PlotParts.RUN_FONT, PlotParts.NOTE_TEXT, 0));
        }
        chart.addSubtitle(PlotParts.legend(plot));
        return chart;
    }

    /** The colour of design {@code i}. */
    static Color colour(int i) {
        return PALETTE[i % PALETTE.length];
    }

    /** The marker of design {@code i}. */
    static Shape marker(int i) {
        return MARKERS[(i + i / PALETTE.length) % MARKERS.length];
    }

    static String xAxisTitle(XQuantity x) {
        return x == XQuantity.SNR ? FerPlot.SNR_AXIS_TITLE
                : "Eb/N0 (dB) = SNR − 10·log10(R), R: each design's information bits per channel use";
    }

    private static String legendLabel(Design d, XQuantity x) {
        return x == XQuantity.EBN0 ? d.name() + " (R = " + Numbers.db(d.bitsPerChannelUse()) + ")" : d.name();
    }

    /** Where the budget line goes on the x axis, NaN where it is not drawn. */
    private static double budgetX(List<Design> designs, Layout layout) {
        if (Double.isNaN(layout.budgetDb()) || layout.x() == XQuantity.EBN0 && !oneRate(designs)) {
            return Double.NaN;
        }
        return designs.get(0).x(layout.budgetDb(), layout.x());
    }

    private static boolean oneRate(List<Design> designs) {
        return designs.stream().mapToDouble(Design::bitsPerChannelUse).distinct().count() == 1;
    }

    private static ValueMarker budgetLine(double at, double budgetDb) {
        ValueMarker m = new ValueMarker(at, BUDGET_DARK, new BasicStroke(1.4f));
        m.setLabel("link budget " + Numbers.db(budgetDb) + " dB SNR");
        PlotParts.labelMarker(m, BUDGET_DARK);
        // the label left of the line, inside the plot even when the budget is the axis's highest value
        m.setLabelAnchor(RectangleAnchor.TOP_LEFT);
        m.setLabelTextAnchor(TextAnchor.TOP_RIGHT);
        return m;
    }

    /** The lines under the title that say what each kind of line means. */
    static List<String> styleLines(List<Design> designs, Layout layout) {
        List<String> lines = new ArrayList<>();
        lines.add(String.format(Locale.ROOT, "solid lines with markers: simulated FER   ·   bars: %s %% confidence "
                + "intervals   ·   open triangles: upper limit where no frame error was seen",
                Numbers.db(100 * layout.confidence())));
        String budget = Double.isNaN(layout.budgetDb()) ? ""
                : Double.isNaN(budgetX(designs, layout))
                ? "   ·   no budget line: at one SNR the designs' Eb/N0 differ (their rates differ)"
                : "   ·   " + BUDGET_COLOUR_WORDS;
        lines.add("grey line: target FER" + budget);
        if (layout.withBounds()) {
            lines.add("dashed, in each design's colour: its QAM-constrained outage bound");
        }
        return lines;
    }

    /** The smallest simulated value shown (a FER, or the upper limit of a point without errors). */
    private static double lowest(List<Design> designs) {
        double lowest = Double.POSITIVE_INFINITY;
        for (Design d : designs) {
            for (Point p : d.points()) {
                double v = p.frameErrors() > 0 ? p.fer() : p.frames() > 0 ? p.ferHigh() : Double.NaN;
                if (v > 0.0) {
                    lowest = Math.min(lowest, v);
                }
            }
        }
        return lowest;
    }
}
