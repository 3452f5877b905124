package org.fadebench.bench.analysis;

import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.channel.ChannelSpec;

/**
 * The diversity order a link's FER tends to at high SNR, where the model lets one say, and the
 * check that a fitted order is on that asymptote.
 *
 * <p>Known for an orthogonal space-time code with Mt x Nr antennas whose channel is drawn from a
 * model, with perfect CSI or pilot estimates (which keep the diversity; common practice, no
 * source), and either one fading block per frame or an uncoded frame (a frame with F blocks then
 * fails at any block's error, F·P_block, with the same slope):
 * <ul>
 * <li>i.i.d. or exponentially correlated Rayleigh (|r| < 1 keeps the correlation full rank), and
 *     Rician (K only delays the asymptote): Mt·Nr (V. Tarokh, H. Jafarkhani and A. R. Calderbank,
 *     "Space-time block codes from orthogonal designs", IEEE Trans. Inf. Theory 45(5), 1999);</li>
 * <li>Nakagami-m on every entry: m·Mt·Nr (‖H‖²_F is then Gamma(m·Mt·Nr); common practice, no
 *     source).</li>
 * </ul>
 * Each fading model states its share per antenna pair ({@code ChannelModel.diversityPerPair}).
 * Not said: no fading (the FER falls exponentially, with no finite slope), a fixed CSI error
 * (the FER meets a floor), Doppler, a trace, full correlation matrices (which may be singular),
 * non-orthogonal codes with linear decoders, and coded frames over F > 1 blocks, whose order is at
 * most Mt·Nr·(1 + ⌊F·(1 − R/(r·log2 M))⌋) by the Singleton bound of block fading (Knopp and
 * Humblet 2000; Malkamäki and Leib 1999) but may be lower through the code's free distance.
 *
 * @param order the asymptotic diversity order
 * @param basis how it follows, e.g. {@code Mt·Nr = 2x1 for an orthogonal code in rayleigh fading}
 */
public record AsymptoticDiversity(double order, String basis) {

    /** A fit counts as far from the asymptote when it is off by more than this share of it. */
    public static final double TOLERANCE = 0.25;
    /** A fit whose every point has FER above this is not yet on its asymptote. */
    public static final double HIGH_FER = 1e-2;

    /** The asymptote of a link, or empty where it cannot be said (see the class comment). */
    public static Optional<AsymptoticDiversity> of(LinkSettings link) {
        ChannelSpec c = link.channel();
        boolean oneBlockOrUncoded = link.fadingBlocksPerFrame() == 1 || !link.coding().coded();
        if (!link.code().isOrthogonal() || c.trace() != null || c.varies() || c.fixedCsiError()
                || !oneBlockOrUncoded) {
            return Optional.empty();
        }
        double perPair = c.model().diversityPerPair();
        if (Double.isNaN(perPair)) {
            return Optional.empty();
        }
        String antennas = link.transmitAntennas() + "x" + link.receiveAntennas();
        String basis = (perPair == 1.0 ? "Mt·Nr = " + antennas : "m·Mt·Nr = " + perPair + "·" + antennas)
                + " for an orthogonal code in " + c.model().name() + " fading";
        return Optional.of(new AsymptoticDiversity(perPair * link.transmitAntennas() * link.receiveAntennas(), basis));
    }

    /**
     * Why a fit is not yet on this asymptote, or empty when it is: the order is off by more than
     * {@value #TOLERANCE} of the asymptote (and, for a counted fit, the asymptote is outside its
     * interval), or every fitted point has FER above {@value #HIGH_FER}.
     */
    public Optional<String> warning(DiversityFit fit, List<PointResult> points) {
        boolean inside = fit.hasInterval() && fit.low() <= order && order <= fit.high();
        boolean far = Math.abs(fit.order() - order) > TOLERANCE * order && !inside;
        boolean high = highFer(fit, points);
        if (!far && !high) {
            return Optional.empty();
        }
        return Optional.of(notYet(String.format(Locale.ROOT, "asymptote %.2f: %s", order, basis), high));
    }

    /** The warning where no asymptote is known: only the FER of the fit window is checked. */
    static Optional<String> warningWithoutAsymptote(DiversityFit fit, List<PointResult> points) {
        return highFer(fit, points) ? Optional.of(notYet(null, true)) : Optional.empty();
    }

    private static String notYet(String asymptote, boolean high) {
        String why = high ? "fitted where FER is above " + HIGH_FER : null;
        String detail = asymptote == null ? why : why == null ? asymptote : asymptote + "; " + why;
        return "not yet on its asymptote (" + detail + "); simulate higher SNR (and more frames) before quoting it";
    }

    private static boolean highFer(DiversityFit fit, List<PointResult> points) {
        return points.stream().filter(p -> fit.snrDbUsed().contains(p.snrDb()))
                .allMatch(p -> p.counts().fer() > HIGH_FER);
    }
}
