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
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.LogAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.NumberTickUnit;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.block.BlockBorder;
import org.jfree.chart.plot.Plot;
import org.jfree.chart.plot.SeriesRenderingOrder;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYErrorRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.text.TextUtils;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.chart.ui.RectangleInsets;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.jfree.svg.SVGGraphics2D;
import org.jfree.svg.ViewBox;

/**
 * The pieces the error-rate plots share ({@link FerPlot} for one run, {@link ComparisonPlot} for
 * several designs): the look (white background, faint decade grid, fonts, axis colours), the
 * logarithmic rate axis, the x axis, the target-FER line, centred text lines, wrapping, simulated
 * series with interval bars, marker shapes, and writing a chart as PNG and SVG.
 */
final class PlotParts {

    static final Color TARGET_GREY = new Color(0x777777);
    static final Color GRID = new Color(0xD9D9D9);
    static final Color MINOR_GRID = new Color(0xF0F0F0);
    static final Color TEXT = new Color(0x222222);
    static final Color NOTE_TEXT = new Color(0x444444);
    static final String FONT = Font.SANS_SERIF;
    static final Font TITLE_FONT = new Font(FONT, Font.BOLD, 21);
    static final Font RUN_FONT = new Font(FONT, Font.PLAIN, 14);
    /** The y axis reaches this factor beyond 1 and below its lowest decade. */
    static final double MARGIN = 1.6;

    static {
        if (System.getProperty("java.awt.headless") == null) {
            System.setProperty("java.awt.headless", "true");
        }
        // Rotated text (the y-axis title) as a string, not glyph outlines, so the SVG keeps it as text.
        TextUtils.setUseDrawRotatedStringWorkaround(false);
    }

    private PlotParts() {
    }

    /**
     * Writes the chart as {@code png} and {@code svg} ({@code width} x {@code height} pixels), each
     * atomically, and returns the SVG as an element for embedding in HTML: the same drawing without
     * the XML prolog, with a view box so that it scales with the page.
     *
     * @param idPrefix the prefix of the SVG's internal ids (fixed, so the same chart gives the same
     *                 bytes; distinct per kind of chart, so that two charts can share a page)
     */
    static String write(JFreeChart chart, int width, int height, Path png, Path svg, String idPrefix)
            throws IOException {
        AtomicFiles.write(png, out -> ChartUtils.writeChartAsPNG(out, chart, width, height));
        SVGGraphics2D g = new SVGGraphics2D(width, height);
        g.setDefsKeyPrefix(idPrefix);
        chart.draw(g, new Rectangle2D.Double(0, 0, width, height));
        byte[] document = g.getSVGDocument().getBytes(StandardCharsets.UTF_8);
        AtomicFiles.write(svg, out -> out.write(document));
        return g.getSVGElement(null, true, new ViewBox(0, 0, width, height), null, null);
    }

    /** A centred line of text under the title; {@code above}: space above it in pixels. */
    static TextTitle textLine(String text, Font font, Color colour, double above) {
        TextTitle t = new TextTitle(text, font);
        t.setPaint(colour);
        t.setPadding(new RectangleInsets(above, 0, 2, 0));
        return t;
    }

    /** The chart's title: the first line of {@code title} wrapped to {@code textWidth}, the rest as subtitles. */
    static JFreeChart titled(String title, Plot plot, double textWidth) {
        List<String> lines = wrap(title, TITLE_FONT, textWidth);
        JFreeChart chart = new JFreeChart(lines.get(0), TITLE_FONT, plot, false);
        chart.setBackgroundPaint(Color.WHITE);
        chart.setPadding(new RectangleInsets(8, 8, 12, 20));
        for (String line : lines.subList(1, lines.size())) {
            chart.addSubtitle(textLine(line, TITLE_FONT, Color.BLACK, 0));
        }
        return chart;
    }

    /** The legend under the plot; items flow in rows as their widths allow, so a long label never runs into its neighbour. */
    static LegendTitle legend(Plot plot) {
        LegendTitle legend = new LegendTitle(plot);
        legend.setPosition(RectangleEdge.BOTTOM);
        legend.setItemFont(new Font(FONT, Font.PLAIN, 14));
        legend.setFrame(BlockBorder.NONE);
        legend.setMargin(new RectangleInsets(12, 0, 0, 0));
        legend.setItemLabelPadding(new RectangleInsets(3, 4, 3, 14));
        return legend;
    }

    /** One panel: white, faint decade grid, a logarithmic y axis from {@code floor} to just above 1. */
    static XYPlot panel(String yTitle, double floor) {
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
    static ValueMarker targetLine(double targetFer) {
        ValueMarker m = new ValueMarker(targetFer, TARGET_GREY, new BasicStroke(1.4f));
        m.setLabel("target FER " + targetFer);
        labelMarker(m, TARGET_GREY);
        m.setLabelAnchor(RectangleAnchor.BOTTOM_LEFT);
        m.setLabelTextAnchor(TextAnchor.TOP_LEFT);
        return m;
    }

    /** A marker's label: small, in the line's colour, on a clear background. */
    static void labelMarker(ValueMarker m, Color colour) {
        m.setLabelFont(new Font(FONT, Font.PLAIN, 13));
        m.setLabelPaint(colour);
        m.setLabelBackgroundColor(new Color(255, 255, 255, 0));
        m.setLabelOffset(new RectangleInsets(4, 6, 4, 6));
    }

    /** A linear x axis in dB, fitted to the values with a small margin. */
    static NumberAxis xAxis(String title) {
        NumberAxis x = new NumberAxis(title);
        x.setAutoRangeIncludesZero(false);
        x.setAutoRangeStickyZero(false);
        x.setLowerMargin(0.03);
        x.setUpperMargin(0.03);
        styleAxis(x);
        return x;
    }

    /** Logarithmic, from {@code floor} to just above 1, labelled 10⁰, 10⁻¹, … with a minor tick per unit. */
    static LogAxis rateAxis(String title, double floor) {
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

    /**
     * The lower end of a rate axis: the decade at or below {@code lowest} (the smallest value shown),
     * at most 1e-2, or 1e-6 when nothing is shown ({@code lowest} infinite); less a margin so that
     * markers on that decade show whole.
     */
    static double floorBelow(double lowest) {
        double decade = lowest == Double.POSITIVE_INFINITY ? 1e-6
                : Math.min(1e-2, Math.pow(10.0, Math.floor(Math.log10(lowest))));
        return decade / MARGIN;
    }

    /** The renderer of simulated rates: lines through the points, a capped vertical bar over each interval. */
    static XYErrorRenderer intervalRenderer() {
        XYErrorRenderer renderer = new XYErrorRenderer();
        renderer.setDefaultLinesVisible(true);
        renderer.setLegendLine(new Line2D.Double(-12, 0, 12, 0));
        renderer.setDrawXError(false);
        renderer.setCapLength(7.0);
        renderer.setErrorStroke(new BasicStroke(1.5f));
        return renderer;
    }

    /** The renderer of upper limits (points without errors): open markers, no line. */
    static XYLineAndShapeRenderer limitRenderer() {
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(false, true);
        r.setUseFillPaint(true);
        r.setDefaultFillPaint(Color.WHITE);
        r.setUseOutlinePaint(false);
        return r;
    }

    /** Adds {@code series} (unless empty) with its colour, line and marker ({@code shape} null: the renderer's). */
    static void addSeries(YIntervalSeriesCollection dataset, XYLineAndShapeRenderer renderer,
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

    /** A broken line of the given dash pattern. */
    static Stroke dashed(float width, float... dash) {
        return new BasicStroke(width, BasicStroke.CAP_BUTT, BasicStroke.JOIN_ROUND, 10f, dash, 0f);
    }

    static void styleAxis(ValueAxis axis) {
        axis.setLabelFont(new Font(FONT, Font.PLAIN, 16));
        axis.setTickLabelFont(new Font(FONT, Font.PLAIN, 14));
        axis.setLabelPaint(TEXT);
        axis.setTickLabelPaint(TEXT);
        axis.setAxisLinePaint(new Color(0x888888));
        axis.setTickMarkPaint(new Color(0x888888));
    }

    /**
     * {@code text} in lines no wider than {@code width} pixels, broken only after the ", " or "; "
     * between list items, never inside a word (an item wider than that keeps a line of its own).
     */
    static List<String> wrap(String text, Font font, double width) {
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
            if (line.length() > 0 && font.getStringBounds(longer.strip(), frc).getWidth() > width) {
                lines.add(line.toString().strip());
                line.setLength(0);
            }
            line.append(item);
        }
        lines.add(line.toString().strip());
        return lines;
    }

    static String capitalised(String s) {
        return s.isEmpty() ? s : Character.toUpperCase(s.charAt(0)) + s.substring(1);
    }

    static Shape circle(double d) {
        return new Ellipse2D.Double(-d / 2, -d / 2, d, d);
    }

    static Shape square(double d) {
        return new Rectangle2D.Double(-d / 2, -d / 2, d, d);
    }

    static Shape downTriangle(double d) {
        return polygon(d, -0.5, -0.5, 0.5, -0.5, 0, 0.5);
    }

    /**
     * A closed polygon through the given corners ({@code x0, y0, x1, y1, …}, in units of {@code d},
     * y downwards), scaled by {@code d}.
     */
    static Shape polygon(double d, double... corners) {
        Path2D.Double p = new Path2D.Double();
        p.moveTo(corners[0] * d, corners[1] * d);
        for (int i = 2; i < corners.length; i += 2) {
            p.lineTo(corners[i] * d, corners[i + 1] * d);
        }
        p.closePath();
        return p;
    }
}
