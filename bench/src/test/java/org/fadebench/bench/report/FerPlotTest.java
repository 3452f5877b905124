package org.fadebench.bench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilderFactory;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.BinomialInterval;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.Fading;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.Modulation;
import org.jfree.chart.JFreeChart;
import org.jfree.data.xy.XYDataset;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;

class FerPlotTest {

    private static final LinkSettings LINK = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, 2,
            Fading.RAYLEIGH, 128, 0);
    private static final double[] SNR_DB = {0, 5, 10, 15, 20};
    private static final long[][] FRAME_ERRORS_AND_FRAMES = {{900, 1000}, {300, 1000}, {40, 2000}, {3, 20_000},
            {0, 20_000}};

    /** A sweep with 1 bit error per erroneous frame, intervals as the sweep computes them; the last point has none. */
    static List<PointResult> sweep() {
        PointResult[] p = new PointResult[SNR_DB.length];
        for (int i = 0; i < p.length; i++) {
            long errors = FRAME_ERRORS_AND_FRAMES[i][0];
            long frames = FRAME_ERRORS_AND_FRAMES[i][1];
            FrameCounters c = FrameCounters.of(frames, errors, 128 * frames, errors, 64 * frames, errors, errors, 0, 0);
            double[] fer = BinomialInterval.clopperPearson(errors, frames, 0.95);
            double[] ber = BinomialInterval.clusteredBer(frames, 128, errors, errors, 0.95);
            p[i] = new PointResult(i, SNR_DB[i], LINK.ebN0Db(SNR_DB[i]), c, fer[0], fer[1], ber[0], ber[1], true, 0.1);
        }
        return List.of(p);
    }

    static BoundCurves bounds() {
        return BoundCurves.compute(BoundSettings.of(LINK).withSpectralEfficiency(1.5).withMimoDraws(5000, 2L), SNR_DB);
    }

    @Test
    void writesPngAndSvg(@TempDir Path dir) throws Exception {
        FerPlot.write(dir, LINK, sweep(), 0.95, bounds());

        BufferedImage png = ImageIO.read(dir.resolve(FerPlot.PNG_FILE).toFile());
        assertEquals(FerPlot.WIDTH, png.getWidth());
        assertEquals(FerPlot.HEIGHT, png.getHeight());
        assertTrue(countColour(png, 0x0072B2) > 200, "the FER curve is drawn in Okabe–Ito blue");
        assertTrue(countColour(png, 0xD55E00) > 200, "the BER curve is drawn in Okabe–Ito vermillion");

        String text = svgText(dir.resolve(FerPlot.SVG_FILE));
        BoundSettings s = bounds().settings();
        for (String expected : List.of(FerPlot.title(LINK), FerPlot.X_AXIS_TITLE, FerPlot.Y_AXIS_TITLE,
                "FER, simulated", "BER, simulated", "FER upper limit (no frame error seen)",
                FerPlot.boundLabel(Bound.MIMO, LINK, s), FerPlot.boundLabel(Bound.STBC, LINK, s),
                FerPlot.boundLabel(Bound.QAM, LINK, s), "R = 1.5 bits per channel use")) {
            assertTrue(text.contains(expected), "SVG lacks '" + expected + "'");
        }
        try (Stream<Path> files = Files.list(dir)) {
            assertEquals(2, files.count(), "no temporary files left behind");
        }
    }

    /** The same results give byte-identical files. */
    @Test
    void reproducible(@TempDir Path dir) throws IOException {
        FerPlot.write(dir.resolve("a"), LINK, sweep(), 0.95, bounds());
        FerPlot.write(dir.resolve("b"), LINK, sweep(), 0.95, bounds());
        for (String f : List.of(FerPlot.PNG_FILE, FerPlot.SVG_FILE)) {
            assertEquals(-1L, Files.mismatch(dir.resolve("a").resolve(f), dir.resolve("b").resolve(f)), f);
        }
    }

    /**
     * The zero-error point is not on the FER line but is a separate marker at the upper end of its
     * interval: for 0 errors in n the two-sided 95 % Clopper–Pearson upper end solves
     * (1 − p)^n = 0.025, so p = 1 − 0.025^(1/n) ≈ 3.69/n. Interval ends at 0 are drawn from the axis floor.
     */
    @Test
    void zeroErrorPointIsAnUpperLimit() {
        List<PointResult> points = sweep();
        JFreeChart chart = FerPlot.chart(LINK, points, 0.95, bounds());
        YIntervalSeriesCollection sim = (YIntervalSeriesCollection) chart.getXYPlot().getDataset(0);
        assertEquals("FER, simulated", sim.getSeriesKey(0));
        assertEquals(4, sim.getItemCount(0));
        XYDataset limits = chart.getXYPlot().getDataset(1);
        assertEquals("FER upper limit (no frame error seen)", limits.getSeriesKey(0));
        assertEquals(20.0, limits.getXValue(0, 0));
        double upper = points.get(4).ferHigh();
        assertEquals(upper, limits.getYValue(0, 0));
        assertEquals(3.69 / 20_000, upper, 0.01 / 20_000);
        double floor = chart.getXYPlot().getRangeAxis().getLowerBound();
        assertEquals(1e-6 / 1.6, floor, 1e-20, "decade below the smallest value, the BER 3/(128·20000) = 1.2e-6,"
                + " less the margin");
        for (int i = 0; i < sim.getItemCount(1); i++) {
            assertTrue(sim.getStartYValue(1, i) >= floor, "BER interval from " + sim.getStartYValue(1, i));
        }
    }

    /**
     * Over Rician fading every bound is a count: each carries a band over its interval, and a
     * point whose count cannot resolve it (0 outages at 20 dB in 2000 draws) is left out.
     */
    @Test
    void everyCountedBoundHasABandAndStopsWhereUnresolved() {
        BoundCurves curves = BoundCurves.compute(BoundSettings.of(LINK).withSpectralEfficiency(1.5)
                .withMimoDraws(2000, 2L).withChannel(ChannelSpec.of(Fading.RICIAN).withKFactor(3)), SNR_DB);
        JFreeChart chart = FerPlot.chart(LINK, sweep(), 0.95, curves);
        YIntervalSeriesCollection outage = (YIntervalSeriesCollection) chart.getXYPlot().getDataset(2);
        for (Bound b : Bound.values()) {
            int series = b.ordinal();
            assertTrue(outage.getSeriesKey(series).toString().contains("Monte Carlo, band"), outage.getSeriesKey(series)
                    .toString());
            long resolved = curves.points().stream().filter(p -> p.estimate(b).resolved()).count();
            assertTrue(resolved < SNR_DB.length, b + ": the last points have no outage in 2000 draws");
            assertEquals(resolved, outage.getItemCount(series), b.key());
            for (int i = 0; i < outage.getItemCount(series); i++) {
                assertTrue(outage.getStartYValue(series, i) < outage.getYValue(series, i)
                        && outage.getYValue(series, i) < outage.getEndYValue(series, i), b + " band at " + i);
            }
        }
    }

    @Test
    void titleNamesTheLink() {
        assertEquals("Alamouti 2×2, QPSK, Rayleigh fading", FerPlot.title(LINK));
        assertEquals("1×3, 16QAM, Rayleigh fading, no space-time code", FerPlot.title(new LinkSettings(Modulation.QAM16,
                SpaceTimeCodes.NONE, 1, 3, Fading.RAYLEIGH, 128, 0)));
    }

    @Test
    void badConfidence(@TempDir Path dir) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> FerPlot.write(dir, LINK, sweep(), 95, bounds()));
        assertEquals("confidence level must be in (0, 1), e.g. 0.95, got 95.0", e.getMessage());
    }

    private static int countColour(BufferedImage image, int rgb) {
        int n = 0;
        for (int y = 0; y < image.getHeight(); y++) {
            for (int x = 0; x < image.getWidth(); x++) {
                n += (image.getRGB(x, y) & 0xFFFFFF) == rgb ? 1 : 0;
            }
        }
        return n;
    }

    /** Parses the SVG as XML (well-formedness; the DTD is not fetched) and returns its text content. */
    private static String svgText(Path svg) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
        Document doc;
        try (InputStream in = Files.newInputStream(svg)) {
            doc = f.newDocumentBuilder().parse(in);
        }
        assertEquals("svg", doc.getDocumentElement().getTagName());
        return doc.getDocumentElement().getTextContent();
    }
}
