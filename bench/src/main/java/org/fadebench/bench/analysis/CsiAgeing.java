package org.fadebench.bench.analysis;

import java.util.Locale;
import java.util.Optional;
import org.apache.commons.math3.analysis.solvers.BrentSolver;
import org.apache.commons.math3.special.BesselJ;
import org.fadebench.bench.link.LinkSettings;

/**
 * Whether the receiver's CSI still describes the channel across a fading block when the channel
 * changes every slot ({@code --doppler}).
 *
 * <p>The receiver's CSI refers to the first slot of each fading block (README, Channels). With the
 * Clarke/Jakes spectrum the correlation of one channel entry τ slots apart is
 * ρ(τ) = J0(2π·f_D·τ) (R. H. Clarke, "A statistical theory of mobile-radio reception", Bell Syst.
 * Tech. J. 47(6), 1968; W. C. Jakes, <i>Microwave Mobile Communications</i>, 1974, ch. 1). Decoding
 * slot τ with h(0) in place of h(τ) leaves an error of mean power E|h(τ) − h(0)|² = 2(1 − ρ(τ)),
 * with E|h|² = 1. At ρ ≤ 1/2 that error is at least the channel's own power, which is what a
 * receiver that knew nothing (Ĥ = 0) would make: from there on the CSI is meaningless.
 *
 * <p>Criterion (ours, from the above): warn when ρ at the block's last slot, τ = L − 1 for a block
 * of L slots, is below 1/2. The longest block that passes has L − 1 ≤ x½/(2π·f_D), with x½ ≈ 1.5211
 * the first root of J0(x) = 1/2. J0 is Commons Math's {@link BesselJ}.
 */
public final class CsiAgeing {

    /** The correlation below which stale CSI is worse than none (see the class comment). */
    public static final double LEAST_CORRELATION = 0.5;

    /** x½: the first root of J0(x) = 1/2, on (0, 2.405) where J0 falls from 1 to 0. */
    static final double HALF_CORRELATION_ARGUMENT = new BrentSolver(1e-12)
            .solve(100, x -> BesselJ.value(0, x) - LEAST_CORRELATION, 0.0, 2.4);

    private CsiAgeing() {
    }

    /** ρ(τ) = J0(2π·f_D·τ): the correlation of a channel entry with itself {@code lagSlots} slots later. */
    public static double correlation(double doppler, int lagSlots) {
        return BesselJ.value(0, 2.0 * Math.PI * doppler * lagSlots);
    }

    /**
     * The warning for a link whose CSI is meaningless over part of each fading block, saying what to
     * change; empty for block fading or a block short enough.
     */
    public static Optional<String> warning(LinkSettings link) {
        double fd = link.channel().model().normalisedDoppler();
        int block = link.effectiveCoherenceSlots();
        if (fd <= 0.0 || block < 2) {
            return Optional.empty();
        }
        double rho = correlation(fd, block - 1);
        if (rho >= LEAST_CORRELATION) {
            return Optional.empty();
        }
        int codeSlots = link.code().slotsPerBlock();
        int longest = 1 + (int) Math.floor(HALF_CORRELATION_ARGUMENT / (2.0 * Math.PI * fd));
        int coherence = longest / codeSlots * codeSlots;
        String change = coherence >= codeSlots
                ? "use --coherence " + coherence + " or less so that the CSI keeps some meaning to each block's"
                        + " end (shorter blocks lower the error floor further), or a lower --doppler"
                : "even one code block of " + codeSlots + " slots is too long at this Doppler: use a code with fewer"
                        + " slots or a lower --doppler";
        return Optional.of(String.format(Locale.ROOT, "--doppler %s changes the channel so much within each fading"
                        + " block of %d slots that the receiver's CSI, taken at the block's first slot, is meaningless"
                        + " by its end (Clarke correlation J0(2π·f_D·τ) = %.2f at τ = %d, below %s); %s",
                fd, block, rho, block - 1, LEAST_CORRELATION, change));
    }
}
