package org.fadebench.bench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.BasicStroke;
import java.awt.Font;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Collection;
import java.util.List;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilderFactory;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.analysis.NormalApproximation;
import org.fadebench.bench.analysis.Reach;
import org.fadebench.bench.analysis.RunSummary;
import org.fadebench.bench.link.FrameCoding;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.BinomialInterval;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.Fading;
import org.fadebench.channel.OutageEstimate;
import org.fadebench.coding.fec.ChannelCodes;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.LegendItem;
import org.jfree.chart.LegendItemCollection;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.ui.Layer;
import org.jfree.data.xy.XYDataset;
import org.jfree.data.xy.YIntervalSeriesCollection;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.w3c.dom.Document;
import org.w3c.dom.NodeList;

class FerPlotTest {

    static final LinkSettings LINK = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, 2,
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

    private static final long SEED = 1;
    private static final double TARGET_FER = 0.01;

    private static JFreeChart chart(List<PointResult> points, FerPlot.Axes axes) {
        return FerPlot.chart(LINK, SEED, points, 0.95, bounds(), TARGET_FER, axes);
    }

    private static void write(Path dir, LinkSettings link, FerPlot.Axes axes) throws IOException {
        FerPlot.write(dir, link, SEED, sweep(), 0.95, bounds(), TARGET_FER, axes);
    }

    /** The FER panel (upper) and the BER panel (lower). */
    private static List<XYPlot> panels(JFreeChart chart) {
        @SuppressWarnings("unchecked")
        List<XYPlot> panels = ((CombinedDomainXYPlot) chart.getXYPlot()).getSubplots();
        assertEquals(2, panels.size());
        return panels;
    }

    @Test
    void writesPngAndSvg(@TempDir Path dir) throws Exception {
        write(dir, LINK, FerPlot.Axes.AUTOMATIC);

        BufferedImage png = ImageIO.read(dir.resolve(FerPlot.PNG_FILE).toFile());
        assertEquals(FerPlot.WIDTH, png.getWidth());
        assertEquals(FerPlot.HEIGHT, png.getHeight());
        assertTrue(countColour(png, 0x0072B2) > 200, "the FER curve is drawn in Okabe–Ito blue");
        assertTrue(countColour(png, 0xD55E00) > 200, "the BER curve is drawn in Okabe–Ito vermillion");

        String text = svgText(dir.resolve(FerPlot.SVG_FILE));
        BoundSettings s = bounds().settings();
        for (String expected : List.of(FerPlot.title(LINK), FerPlot.SNR_AXIS_TITLE, FerPlot.FER_AXIS_TITLE,
                FerPlot.BER_AXIS_TITLE, FerPlot.STYLE_WORDS, "target FER 0.01",
                "FER, simulated", "BER, simulated", "FER upper limit (no frame error seen)",
                FerPlot.boundLabel(Bound.MIMO, LINK, s), FerPlot.boundLabel(Bound.STBC, LINK, s),
                FerPlot.boundLabel(Bound.QAM, LINK, s), "outage bounds at R = 1.5 bits per channel use")) {
            assertTrue(text.contains(expected), "SVG lacks '" + expected + "'");
        }
        try (Stream<Path> files = Files.list(dir)) {
            assertEquals(2, files.count(), "no temporary files left behind");
        }
    }

    /** The same results give byte-identical files. */
    @Test
    void reproducible(@TempDir Path dir) throws IOException {
        write(dir.resolve("a"), LINK, FerPlot.Axes.AUTOMATIC);
        write(dir.resolve("b"), LINK, FerPlot.Axes.AUTOMATIC);
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
        List<XYPlot> panels = panels(chart(points, FerPlot.Axes.AUTOMATIC));
        YIntervalSeriesCollection fer = (YIntervalSeriesCollection) panels.get(0).getDataset(0);
        assertEquals("FER, simulated", fer.getSeriesKey(0));
        assertEquals(4, fer.getItemCount(0));
        XYDataset limits = panels.get(0).getDataset(1);
        assertEquals("FER upper limit (no frame error seen)", limits.getSeriesKey(0));
        assertEquals(20.0, limits.getXValue(0, 0));
        double upper = points.get(4).ferHigh();
        assertEquals(upper, limits.getYValue(0, 0));
        assertEquals(3.69 / 20_000, upper, 0.01 / 20_000);
        assertEquals(1e-4 / 1.6, panels.get(0).getRangeAxis().getLowerBound(), 1e-20,
                "decade below the smallest FER value, the upper limit 1.8e-4, less the margin");
        YIntervalSeriesCollection ber = (YIntervalSeriesCollection) panels.get(1).getDataset(0);
        assertEquals("BER, simulated", ber.getSeriesKey(0));
        double floor = panels.get(1).getRangeAxis().getLowerBound();
        assertEquals(1e-6 / 1.6, floor, 1e-20, "decade below the smallest BER, 3/(128·20000) = 1.2e-6,"
                + " less the margin");
        for (int i = 0; i < ber.getItemCount(0); i++) {
            assertTrue(ber.getStartYValue(0, i) >= floor, "BER interval from " + ber.getStartYValue(0, i));
        }
    }

    /**
     * BER has its own panel and axis title: no outage bound shares an axis with it, so a BER below a
     * bound never reads as a link beating the bound.
     */
    @Test
    void berHasItsOwnPanel() {
        List<XYPlot> panels = panels(chart(sweep(), FerPlot.Axes.AUTOMATIC));
        assertEquals(FerPlot.FER_AXIS_TITLE, panels.get(0).getRangeAxis().getLabel());
        assertEquals(FerPlot.BER_AXIS_TITLE, panels.get(1).getRangeAxis().getLabel());
        List<String> upper = seriesKeys(panels.get(0));
        List<String> lower = seriesKeys(panels.get(1));
        assertTrue(upper.contains("FER, simulated") && upper.stream().anyMatch(k -> k.startsWith("Outage")), upper.toString());
        assertEquals(List.of("BER, simulated", "BER upper limit (no bit error seen)"), lower,
                "the BER panel holds the BER alone");
    }

    /** The target FER is a line across the FER panel, labelled with its value. */
    @Test
    void targetFerIsALine() {
        XYPlot fer = panels(chart(sweep(), FerPlot.Axes.AUTOMATIC)).get(0);
        Collection<?> markers = fer.getRangeMarkers(Layer.BACKGROUND);
        assertEquals(1, markers.size());
        ValueMarker m = (ValueMarker) markers.iterator().next();
        assertEquals(TARGET_FER, m.getValue());
        assertEquals("target FER 0.01", m.getLabel());
        assertEquals(null, ((BasicStroke) m.getStroke()).getDashArray(), "solid, unlike every bound");
    }

    /**
     * The subtitle says "simulated: solid lines with markers" and "outage bounds: broken lines": the
     * legend draws exactly that (the legend items carry the strokes and shapes the renderers use).
     */
    @Test
    void legendStylesMatchTheWords() {
        JFreeChart chart = chart(sweep(), FerPlot.Axes.AUTOMATIC);
        assertTrue(FerPlot.STYLE_WORDS.contains("simulated: solid lines with markers"));
        assertTrue(FerPlot.STYLE_WORDS.contains("outage bounds: broken lines"));
        LegendItemCollection items = chart.getXYPlot().getLegendItems();
        int simulated = 0;
        int bounds = 0;
        for (int i = 0; i < items.getItemCount(); i++) {
            LegendItem item = items.get(i);
            float[] dashes = ((BasicStroke) item.getLineStroke()).getDashArray();
            if (item.getLabel().endsWith(", simulated")) {
                simulated++;
                assertTrue(item.isLineVisible() && dashes == null && item.isShapeVisible(), item.getLabel());
            } else if (item.getLabel().startsWith("Outage")) {
                bounds++;
                assertTrue(item.isLineVisible() && dashes != null && dashes.length >= 2, item.getLabel());
                assertFalse(item.isShapeVisible(), item.getLabel() + " has no marker");
            }
        }
        assertEquals(2, simulated);
        assertEquals(3, bounds);
    }

    /**
     * An AWGN link also shows its normal approximation (dataset 3) as an orange dash-dot-dot line
     * without markers, named in its own style line: the approximation's values, from near 1 down
     * to the axis floor (for this rate-1/2 code at about −2 dB, below the swept SNRs, so the curve
     * widens the range); a fading link has none.
     */
    @Test
    void awgnLinkShowsTheNormalApproximation() {
        LinkSettings awgn = new LinkSettings(Modulation.BPSK, SpaceTimeCodes.NONE, 1, 1, Fading.NONE, 1024, 0,
                Equaliser.MF, new FrameCoding(new FecScheme(Crc.NONE, ChannelCodes.standard().find("conv-r12")),
                        Interleaving.RANDOM, 0, LlrMethod.MAXLOG));
        NormalApproximation a = NormalApproximation.of(awgn).orElseThrow();
        JFreeChart chart = FerPlot.chart(awgn, SEED, sweep(), 0.95, null, TARGET_FER, FerPlot.Axes.AUTOMATIC);
        XYPlot fer = panels(chart).get(0);
        XYDataset curve = fer.getDataset(3);
        assertEquals(1, curve.getSeriesCount());
        int n = curve.getItemCount(0);
        assertTrue(n >= 50, n + " points");
        for (int i = 0; i < n; i++) {
            assertEquals(a.fer(curve.getXValue(0, i)), curve.getYValue(0, i), 0.0);
        }
        assertTrue(curve.getXValue(0, 0) < SNR_DB[0] && curve.getYValue(0, 0) >= 0.99 - 1e-9, "starts near 1");
        assertEquals(fer.getRangeAxis().getLowerBound(), curve.getYValue(0, n - 1),
                1e-6 * fer.getRangeAxis().getLowerBound(), "ends at the axis");
        LegendItem item = null;
        LegendItemCollection items = chart.getXYPlot().getLegendItems();
        for (int i = 0; i < items.getItemCount(); i++) {
            if (items.get(i).getLabel().startsWith("Normal approximation, n = 2060 channel uses, k = 1024 bits")) {
                item = items.get(i);
            }
        }
        assertTrue(item != null && item.isLineVisible() && !item.isShapeVisible());
        assertEquals(6, ((BasicStroke) item.getLineStroke()).getDashArray().length);
        assertEquals(new java.awt.Color(0xE69F00), item.getLinePaint());
        assertTrue(subtitles(chart).contains(FerPlot.NORMAL_APPROX_WORDS));
        assertTrue(subtitles(chart).contains("bars: 95 % confidence intervals   ·   no outage bounds over AWGN"),
                "an AWGN link has no outage bounds, and the plot says so: " + subtitles(chart));
        assertTrue(subtitles(chart).contains(FerPlot.STYLE_WORDS_NO_BOUNDS) && !subtitles(chart).contains(FerPlot.STYLE_WORDS),
                "and its style line names no broken lines of bounds: " + subtitles(chart));
        assertTrue(panels(chart(sweep(), FerPlot.Axes.AUTOMATIC)).get(0).getDataset(3) == null);
        assertFalse(subtitles(chart(sweep(), FerPlot.Axes.AUTOMATIC)).contains(FerPlot.NORMAL_APPROX_WORDS));
    }

    private static List<String> subtitles(JFreeChart chart) {
        List<String> texts = new java.util.ArrayList<>();
        for (int i = 0; i < chart.getSubtitleCount(); i++) {
            if (chart.getSubtitle(i) instanceof org.jfree.chart.title.TextTitle t) {
                texts.add(t.getText());
            }
        }
        return texts;
    }

    /** With --plot-x ebn0 every point and bound sits at Eb/N0 = SNR − 10 log10(R), here R = 2 (QPSK, rate 1). */
    @Test
    void ebN0Axis() {
        List<XYPlot> panels = panels(chart(sweep(), new FerPlot.Axes(FerPlot.XQuantity.EBN0, Double.NaN)));
        double shift = 10 * Math.log10(2);
        XYDataset fer = panels.get(0).getDataset(0);
        for (int i = 0; i < fer.getItemCount(0); i++) {
            assertEquals(SNR_DB[i] - shift, fer.getXValue(0, i), 1e-12);
        }
        XYDataset outage = panels.get(0).getDataset(2);
        assertEquals(SNR_DB[0] - shift, outage.getXValue(0, 0), 1e-12);
        String label = panels.get(0).getDomainAxis().getLabel();
        assertEquals(FerPlot.xAxisTitle(LINK, FerPlot.XQuantity.EBN0), label);
        assertTrue(label.startsWith("Eb/N0 (dB)") && label.contains("R = 2 information bits"), label);
        assertEquals(FerPlot.XQuantity.EBN0, FerPlot.XQuantity.fromCliName(" EbN0 "));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> FerPlot.XQuantity.fromCliName("esn0"));
        assertEquals("unknown x axis 'esn0'; valid: snr, ebn0", e.getMessage());
    }

    /** A fixed floor puts both panels' y axes on the same lower end, whatever the values. */
    @Test
    void fixedFloor() {
        List<XYPlot> panels = panels(chart(sweep(), new FerPlot.Axes(FerPlot.XQuantity.SNR, 1e-7)));
        assertEquals(1e-7, panels.get(0).getRangeAxis().getLowerBound(), 1e-22);
        assertEquals(1e-7, panels.get(1).getRangeAxis().getLowerBound(), 1e-22);
        for (double bad : new double[] {0, 1, -1e-6, Double.POSITIVE_INFINITY}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                    () -> new FerPlot.Axes(FerPlot.XQuantity.SNR, bad));
            assertTrue(e.getMessage().startsWith("--plot-floor must lie strictly between 0 and 1"), e.getMessage());
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
        JFreeChart chart = FerPlot.chart(LINK, SEED, sweep(), 0.95, curves, TARGET_FER, FerPlot.Axes.AUTOMATIC);
        YIntervalSeriesCollection outage = (YIntervalSeriesCollection) panels(chart).get(0).getDataset(2);
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

    /** An exact bound has no band, also where it falls below a fixed floor of the axis. */
    @Test
    void exactBoundsHaveNoBandEvenBelowTheFloor() {
        List<XYPlot> panels = panels(chart(sweep(), new FerPlot.Axes(FerPlot.XQuantity.SNR, 0.5)));
        YIntervalSeriesCollection outage = (YIntervalSeriesCollection) panels.get(0).getDataset(2);
        int stbc = Bound.STBC.ordinal();
        assertTrue(outage.getItemCount(stbc) > 0);
        for (int i = 0; i < outage.getItemCount(stbc); i++) {
            assertEquals(outage.getYValue(stbc, i), outage.getStartYValue(stbc, i), "no band at " + i);
            assertEquals(outage.getYValue(stbc, i), outage.getEndYValue(stbc, i), "no band at " + i);
        }
    }

    @Test
    void titleNamesTheLink() {
        assertEquals("Alamouti 2×2, QPSK, Rayleigh fading", FerPlot.title(LINK));
        assertEquals("1×3, 16QAM, Rayleigh fading, no space-time code", FerPlot.title(new LinkSettings(Modulation.QAM16,
                SpaceTimeCodes.NONE, 3, 1, Fading.RAYLEIGH, 128, 0)));
        assertEquals("Alamouti 2×1, QPSK, AWGN channel", FerPlot.title(new LinkSettings(Modulation.QPSK,
                SpaceTimeCodes.ALAMOUTI, 1, 2, Fading.NONE, 128, 0)));
    }

    /**
     * The lines under the title name everything that defines the run (fading model and parameters,
     * correlation, Doppler, CSI, frame length, fading blocks, channel code, CRC, seed), and are
     * wrapped only between list items: every line but the last ends with the item's comma, and the
     * lines put together give the whole text back.
     */
    @Test
    void runLinesNameEverythingAndWrapBetweenItems(@TempDir Path dir) throws Exception {
        ChannelSpec channel = ChannelSpec.of(Fading.RICIAN).withKFactor(3).withRxCorr(0.5).withDoppler(0.002)
                .withPilots(4);
        LinkSettings link = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, 2, channel, 512, 16,
                Equaliser.MF, new FrameCoding(new FecScheme(Crc.CRC16, ChannelCodes.standard().find("conv-r12")), Interleaving.RANDOM, 0,
                        LlrMethod.MAXLOG));
        String run = FerPlot.runLine(link, 9);
        for (String part : List.of("rician K=3.0", "rx-corr 0.5", "doppler 0.002", "pilots 4", "512 bits/frame",
                "16 slots per fading block", "conv-r12 + crc16", "seed 9")) {
            assertTrue(run.contains(part), run + " lacks " + part);
        }
        List<String> lines = FerPlot.wrap(run, new Font(Font.SANS_SERIF, Font.PLAIN, 14));
        assertTrue(lines.size() >= 2, "long enough to wrap: " + lines);
        for (String line : lines.subList(0, lines.size() - 1)) {
            assertTrue(line.endsWith(","), "'" + line + "' breaks inside an item");
        }
        assertEquals(run, String.join(" ", lines));
        FerPlot.write(dir, link, 9, sweep(), 0.95, null, TARGET_FER, FerPlot.Axes.AUTOMATIC);
        List<String> svgLines = svgTextElements(dir.resolve(FerPlot.SVG_FILE));
        for (String line : lines) {
            assertTrue(svgLines.contains(line), "SVG lacks the line '" + line + "'");
        }
    }

    /**
     * Where the link or a bound has no SNR at the target, or crosses it outside the swept range,
     * the plot says so under the title in the terminal's words ({@link RunSummary#reachLines}),
     * each note wrapped only between list items: a link that never reaches 1e-2 in 0..4 dB, bounds
     * that cross beyond the sweep (the MIMO one a Monte Carlo count followed there), and a count too
     * short to resolve the target.
     */
    @Test
    void reachNotesAreOnThePlot(@TempDir Path dir) throws Exception {
        double[] snrDb = {0, 2, 4};
        List<PointResult> high = new java.util.ArrayList<>();
        for (int i = 0; i < snrDb.length; i++) {
            long errors = 900 - 200 * i;
            FrameCounters c = FrameCounters.of(1000, errors, 128_000, errors, 64_000, errors, errors, 0, 0);
            double[] fer = BinomialInterval.clopperPearson(errors, 1000, 0.95);
            double[] ber = BinomialInterval.clusteredBer(1000, 128, errors, errors, 0.95);
            high.add(new PointResult(i, snrDb[i], LINK.ebN0Db(snrDb[i]), c, fer[0], fer[1], ber[0], ber[1], true, 0.1));
        }
        Font font = new Font(Font.SANS_SERIF, Font.PLAIN, 14);
        for (int draws : new int[] {5000, 200}) {
            BoundCurves curves = BoundCurves.compute(BoundSettings.of(LINK).withSpectralEfficiency(1.5)
                    .withMimoDraws(draws, 2L), snrDb);
            List<String> notes = RunSummary.of(LINK, high, curves, TARGET_FER, RunSummary.NO_BOUNDS).reachLines();
            String all = String.join("\n", notes);
            assertTrue(all.contains(Reach.LINK_NOT_REACHED.words()), all);
            assertTrue(all.contains("stbc outage bound at FER 0.01: ") && all.contains(Reach.OUTSIDE_RANGE.words()), all);
            assertTrue(all.contains(draws == 200 ? Reach.UNRESOLVED.note(OutageEstimate.drawsToResolve(TARGET_FER))
                    : "mimo outage bound at FER 0.01: "), all);
            FerPlot.write(dir, LINK, SEED, high, 0.95, curves, TARGET_FER, FerPlot.Axes.AUTOMATIC);
            List<String> svgLines = svgTextElements(dir.resolve(FerPlot.SVG_FILE));
            for (String note : notes) {
                List<String> lines = FerPlot.wrap(note, font);
                assertEquals(note, String.join(" ", lines), "wrapped between items only");
                for (String line : lines) {
                    assertTrue(svgLines.contains(line), "SVG lacks the line '" + line + "' of " + svgLines);
                }
            }
        }
    }

    @Test
    void badConfidence(@TempDir Path dir) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> FerPlot.write(dir, LINK, SEED, sweep(), 95, bounds(), TARGET_FER, FerPlot.Axes.AUTOMATIC));
        assertEquals("confidence level must be in (0, 1), e.g. 0.95, got 95.0", e.getMessage());
    }

    private static List<String> seriesKeys(XYPlot plot) {
        List<String> keys = new java.util.ArrayList<>();
        for (int d = 0; d < plot.getDatasetCount(); d++) {
            XYDataset data = plot.getDataset(d);
            for (int i = 0; data != null && i < data.getSeriesCount(); i++) {
                keys.add(data.getSeriesKey(i).toString());
            }
        }
        return keys;
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

    /** Parses the SVG as XML (well-formedness; the DTD is not fetched). */
    private static Document svg(Path svg) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
        Document doc;
        try (InputStream in = Files.newInputStream(svg)) {
            doc = f.newDocumentBuilder().parse(in);
        }
        assertEquals("svg", doc.getDocumentElement().getTagName());
        return doc;
    }

    /** The SVG's text content. */
    private static String svgText(Path svg) throws Exception {
        return svg(svg).getDocumentElement().getTextContent();
    }

    /** The text of each {@code <text>} element of the SVG, one entry per drawn line. */
    private static List<String> svgTextElements(Path svg) throws Exception {
        NodeList nodes = svg(svg).getElementsByTagName("text");
        List<String> texts = new java.util.ArrayList<>();
        for (int i = 0; i < nodes.getLength(); i++) {
            texts.add(nodes.item(i).getTextContent());
        }
        return texts;
    }
}
