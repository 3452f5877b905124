package org.fadebench.bench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.BasicStroke;
import java.awt.Paint;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import javax.imageio.ImageIO;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.report.ComparisonPlot.BoundValue;
import org.fadebench.bench.report.ComparisonPlot.Design;
import org.fadebench.bench.report.ComparisonPlot.Layout;
import org.fadebench.bench.report.ComparisonPlot.Point;
import org.fadebench.bench.report.FerPlot.XQuantity;
import org.fadebench.bench.sweep.BinomialInterval;
import org.fadebench.bench.sweep.PointResult;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYItemRenderer;
import org.jfree.chart.title.TextTitle;
import org.jfree.chart.ui.Layer;
import org.jfree.data.xy.IntervalXYDataset;
import org.jfree.data.xy.XYDataset;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ComparisonPlotTest {

    private static final double TARGET_FER = 0.01;

    /** A point of {@code errors} frame errors in {@code frames}, with its 95 % Clopper–Pearson interval. */
    static Point point(double snrDb, long errors, long frames) {
        double[] ci = BinomialInterval.clopperPearson(errors, frames, 0.95);
        return new Point(snrDb, frames, errors, ci[0], ci[1]);
    }

    /**
     * Three invented designs over different SNR ranges and rates: the first reaches 2e-4, the second
     * ends with a point without errors, the third has a bound value a count could not resolve (NaN).
     */
    static List<Design> designs() {
        return List.of(
                new Design("1x2 combining", 2, List.of(point(0, 400, 1000), point(5, 90, 1000), point(10, 12, 2000),
                        point(15, 4, 20_000)), List.of(new BoundValue(0, 0.3), new BoundValue(5, 0.05),
                        new BoundValue(10, 4e-3), new BoundValue(15, 3e-4))),
                new Design("Alamouti 2x1", 2, List.of(point(2, 500, 1000), point(8, 60, 1000), point(14, 0, 5000)),
                        List.of(new BoundValue(2, 0.4), new BoundValue(8, 0.03), new BoundValue(14, 1e-3))),
                new Design("Alamouti 2x2 16qam", 4, List.of(point(6, 300, 1000), point(12, 20, 1000),
                        point(18, 5, 4000)), List.of(new BoundValue(6, 0.2), new BoundValue(12, 8e-3),
                        new BoundValue(18, Double.NaN))));
    }

    private static Layout layout(XQuantity x, double budgetDb, boolean withBounds) {
        return new Layout("Three receivers compared", x, TARGET_FER, budgetDb, withBounds, 0.95, Double.NaN);
    }

    /**
     * One series per design in dataset 0, named after it, in its own colour and marker; the points
     * without errors in dataset 1 at their upper ends; every value and interval of every design
     * inside the one x range and the one FER range, whose lower end is the decade at or below the
     * smallest value over all designs (the first design's 4/20000 = 2e-4: 1e-4), less the 1.6 margin.
     */
    @Test
    void oneSeriesPerDesignOnOneRange() {
        List<Design> designs = designs();
        XYPlot plot = chart(designs, layout(XQuantity.SNR, Double.NaN, false)).getXYPlot();
        IntervalXYDataset fer = (IntervalXYDataset) plot.getDataset(0);
        assertEquals(3, fer.getSeriesCount());
        XYItemRenderer r = plot.getRenderer(0);
        Set<Paint> colours = new HashSet<>();
        Set<String> shapes = new HashSet<>();
        for (int i = 0; i < 3; i++) {
            Design d = designs.get(i);
            assertEquals(d.name(), fer.getSeriesKey(i));
            long withErrors = d.points().stream().filter(p -> p.frameErrors() > 0).count();
            assertEquals(withErrors, fer.getItemCount(i), d.name());
            for (int k = 0; k < fer.getItemCount(i); k++) {
                Point p = d.points().get(k);
                assertEquals(p.snrDb(), fer.getXValue(i, k));
                assertEquals(p.fer(), fer.getYValue(i, k));
                assertEquals(p.ferHigh(), fer.getEndYValue(i, k));
            }
            colours.add(r.getSeriesPaint(i));
            shapes.add(r.getSeriesShape(i).getBounds2D().toString() + r.getSeriesShape(i).getClass());
            assertEquals(null, ((BasicStroke) r.getSeriesStroke(i)).getDashArray(), "simulated lines are solid");
        }
        assertEquals(3, colours.size(), "a colour per design");
        assertEquals(3, shapes.size(), "a marker per design");
        XYDataset limits = plot.getDataset(1);
        assertEquals(3, limits.getSeriesCount());
        assertEquals(1, limits.getItemCount(1));
        assertEquals(14.0, limits.getXValue(1, 0));
        assertEquals(designs.get(1).points().get(2).ferHigh(), limits.getYValue(1, 0));
        assertEquals(3.69 / 5000, limits.getYValue(1, 0), 0.01 / 5000, "(1 − p)^n = 0.025 gives p ≈ 3.69/n");
        assertEquals(r.getSeriesPaint(1), plot.getRenderer(1).getSeriesPaint(1), "the upper limit in its design's colour");

        double floor = plot.getRangeAxis().getLowerBound();
        assertEquals(1e-4 / 1.6, floor, 1e-20);
        for (int d = 0; d < 2; d++) {
            XYDataset data = plot.getDataset(d);
            for (int s = 0; s < data.getSeriesCount(); s++) {
                for (int k = 0; k < data.getItemCount(s); k++) {
                    double x = data.getXValue(s, k);
                    double y = data.getYValue(s, k);
                    assertTrue(x >= plot.getDomainAxis().getLowerBound() && x <= plot.getDomainAxis().getUpperBound(),
                            "x " + x + " in the range");
                    assertTrue(y >= floor && y <= plot.getRangeAxis().getUpperBound(), "y " + y + " in the range");
                    if (data instanceof IntervalXYDataset bars) {
                        assertTrue(bars.getStartYValue(s, k) >= floor, "bar from the axis or above");
                    }
                }
            }
        }
        assertTrue(plot.getDomainAxis().getLowerBound() < 0 && plot.getDomainAxis().getUpperBound() > 18,
                "from the lowest to the highest SNR of all designs: " + plot.getDomainAxis().getRange());
    }

    /** The target FER is a horizontal line, the link budget a vertical one, each labelled with its value. */
    @Test
    void targetAndBudgetLines() {
        JFreeChart chart = chart(designs(), layout(XQuantity.SNR, 21, false));
        XYPlot plot = chart.getXYPlot();
        ValueMarker target = only(plot.getRangeMarkers(Layer.BACKGROUND));
        assertEquals(TARGET_FER, target.getValue());
        assertEquals("target FER 0.01", target.getLabel());
        ValueMarker budget = only(plot.getDomainMarkers(Layer.BACKGROUND));
        assertEquals(21.0, budget.getValue());
        assertEquals("link budget 21 dB SNR", budget.getLabel());
        assertTrue(plot.getDomainAxis().getUpperBound() > 21, "the axis reaches the budget beyond the points");
        assertTrue(subtitles(chart).stream().anyMatch(s -> s.contains(ComparisonPlot.BUDGET_COLOUR_WORDS)));
        assertEquals(null, chart(designs(), layout(XQuantity.SNR, Double.NaN, false)).getXYPlot()
                .getDomainMarkers(Layer.BACKGROUND), "no budget, no line");
    }

    /**
     * On an Eb/N0 axis each design moves by its own 10·log10(R) (3.0103 dB for R = 2, 6.0206 dB for
     * R = 4); a budget, an SNR, then has no single place and is left out, with the reason under the
     * title; designs of one rate keep it, moved by the same amount.
     */
    @Test
    void ebN0AxisMovesEachDesignByItsRate() {
        List<Design> designs = designs();
        JFreeChart chart = chart(designs, layout(XQuantity.EBN0, 12, false));
        XYDataset fer = chart.getXYPlot().getDataset(0);
        assertEquals(0 - 3.0103, fer.getXValue(0, 0), 1e-4);
        assertEquals(6 - 6.0206, fer.getXValue(2, 0), 1e-4);
        assertEquals("Alamouti 2x2 16qam (R = 4)", fer.getSeriesKey(2));
        assertEquals(null, chart.getXYPlot().getDomainMarkers(Layer.BACKGROUND));
        assertTrue(subtitles(chart).stream().anyMatch(s -> s.contains("no budget line")), subtitles(chart).toString());

        JFreeChart sameRate = chart(designs.subList(0, 2), layout(XQuantity.EBN0, 12, false));
        assertEquals(12 - 3.0103, only(sameRate.getXYPlot().getDomainMarkers(Layer.BACKGROUND)).getValue(), 1e-4);
    }

    /**
     * With bounds: dataset 2 holds each design's QAM-constrained outage bound, dashed, in its colour,
     * without the values a count could not resolve; without, dataset 2 is empty.
     */
    @Test
    void boundsAreDashedInTheDesignsColours() {
        List<Design> designs = designs();
        XYPlot plot = chart(designs, layout(XQuantity.SNR, Double.NaN, true)).getXYPlot();
        XYDataset bounds = plot.getDataset(2);
        assertEquals(3, bounds.getSeriesCount());
        for (int i = 0; i < 3; i++) {
            List<BoundValue> shown = designs.get(i).qamBound().stream().filter(b -> b.probability() > 0).toList();
            assertEquals(shown.size(), bounds.getItemCount(i));
            for (int k = 0; k < shown.size(); k++) {
                assertEquals(shown.get(k).snrDb(), bounds.getXValue(i, k));
                assertEquals(shown.get(k).probability(), bounds.getYValue(i, k));
            }
            assertEquals(plot.getRenderer(0).getSeriesPaint(i), plot.getRenderer(2).getSeriesPaint(i));
            assertTrue(((BasicStroke) plot.getRenderer(2).getSeriesStroke(i)).getDashArray().length >= 2, "dashed");
        }
        assertEquals(2, bounds.getItemCount(2), "the unresolved value is left out");
        assertEquals(0, chart(designs, layout(XQuantity.SNR, Double.NaN, false)).getXYPlot().getDataset(2)
                .getSeriesCount());
    }

    /** A design built from a sweep in memory carries its points and its QAM bound as the curves show it. */
    @Test
    void designOfASweep() {
        List<PointResult> sweep = FerPlotTest.sweep();
        BoundCurves curves = FerPlotTest.bounds();
        Design d = Design.of("alamouti", FerPlotTest.LINK, sweep, curves);
        assertEquals(2.0, d.bitsPerChannelUse(), "QPSK, rate-1 code");
        assertEquals(sweep.size(), d.points().size());
        for (int i = 0; i < sweep.size(); i++) {
            assertEquals(sweep.get(i).counts().frameErrors(), d.points().get(i).frameErrors());
            assertEquals(sweep.get(i).ferHigh(), d.points().get(i).ferHigh());
            assertEquals(curves.points().get(i).shown(Bound.QAM), d.qamBound().get(i).probability());
        }
    }

    /** Up to 49 designs differ in colour or marker; the seven colours are distinct. */
    @Test
    void colourAndMarkerPairsAreDistinct() {
        Set<String> pairs = new HashSet<>();
        for (int i = 0; i < 49; i++) {
            pairs.add(ComparisonPlot.colour(i) + "/" + System.identityHashCode(ComparisonPlot.marker(i)));
        }
        assertEquals(49, pairs.size());
        assertEquals(7, Set.of(ComparisonPlot.PALETTE).size());
    }

    /** Writes fer.png and fer.svg and returns the SVG element, well-formed XML with the (escaped) names. */
    @Test
    void writesFilesAndReturnsTheSvg(@TempDir Path dir) throws Exception {
        List<Design> designs = new ArrayList<>(designs());
        designs.add(new Design("<b>R & D</b>", 1, List.of(point(3, 100, 1000)), List.of()));
        String svg = ComparisonPlot.write(dir, designs, layout(XQuantity.SNR, 15, true));
        BufferedImage png = ImageIO.read(dir.resolve(FerPlot.PNG_FILE).toFile());
        assertEquals(ComparisonPlot.WIDTH, png.getWidth());
        assertEquals(ComparisonPlot.HEIGHT, png.getHeight());
        assertTrue(svg.startsWith("<svg") && !svg.contains("<?xml"), "an element, no prolog");
        String text = HtmlChecks.wellFormedXml(svg).getDocumentElement().getTextContent();
        for (Design d : designs) {
            assertTrue(text.contains(d.name()), d.name());
        }
        assertEquals(text, HtmlChecks.wellFormedXml(Files.readString(dir.resolve(FerPlot.SVG_FILE)).replaceFirst(
                "(?s)^<\\?xml.*?\\?>\\s*<!DOCTYPE[^>]*>\\s*", "")).getDocumentElement().getTextContent(),
                "the file and the element draw the same");
        try (var files = Files.list(dir)) {
            assertEquals(2, files.count(), "no temporary files");
        }
    }

    @Test
    void badInput() {
        assertThrows(IllegalArgumentException.class, () -> new Point(0, 10, 11, 0, 1));
        assertThrows(IllegalArgumentException.class, () -> new Design(" ", 1, List.of(), List.of()));
        assertThrows(IllegalArgumentException.class, () -> new Design("a", 0, List.of(), List.of()));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new Layout("t", XQuantity.SNR, 1.5, Double.NaN, false, 0.95, Double.NaN));
        assertEquals("target FER must be in (0, 1), e.g. 0.01, got 1.5", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> chart(List.of(), layout(XQuantity.SNR, 1, false)));
        Design d = designs().get(0);
        e = assertThrows(IllegalArgumentException.class, () -> chart(List.of(d, d), layout(XQuantity.SNR, 1, false)));
        assertEquals("two designs are named '1x2 combining'; each needs its own name", e.getMessage());
    }

    private static JFreeChart chart(List<Design> designs, Layout layout) {
        return ComparisonPlot.chart(designs, layout);
    }

    private static ValueMarker only(Collection<?> markers) {
        assertEquals(1, markers.size());
        return (ValueMarker) markers.iterator().next();
    }

    private static List<String> subtitles(JFreeChart chart) {
        List<String> texts = new ArrayList<>();
        for (int i = 0; i < chart.getSubtitleCount(); i++) {
            if (chart.getSubtitle(i) instanceof TextTitle t) {
                texts.add(t.getText());
            }
        }
        return texts;
    }
}
