package org.fadebench.bench.analysis;

import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import org.fadebench.bench.sweep.PointResult;

/**
 * Where a curve meets the target FER, or why it has no such SNR: each case has its own words, so
 * that "not reached" never stands for several things.
 */
public enum Reach {
    /** The curve crosses the target within the swept SNR range. */
    IN_RANGE("within the swept range"),
    /**
     * A bound or the normal approximation crosses the target outside the swept range; the SNR is
     * still given (closed form: bisection; Monte Carlo: extra points beyond the sweep, see
     * {@link BoundCurves#reaching}).
     */
    OUTSIDE_RANGE("outside the swept range; the curve was computed beyond it"),
    /**
     * A closed-form curve stays above the target at every SNR (the normal approximation of a frame
     * of a few bits, whose limit at high SNR lies above the target).
     */
    NEVER_REACHED("the curve stays above the target FER at every SNR"),
    /** The simulated link did not fall to the target FER at any swept SNR. */
    LINK_NOT_REACHED("the link did not reach the target FER in the swept range"),
    /** The simulated FER is already at or below the target at the lowest swept SNR. */
    LINK_BELOW_RANGE("the link's FER is already below the target at the lowest swept SNR: its crossing lies below"
            + " the swept range"),
    /** A Monte Carlo bound is still above the target {@link BoundCurves#REACH_LIMIT_DB} dB above the highest swept SNR. */
    ABOVE_RANGE("the Monte Carlo bound is still above the target " + (int) BoundCurves.REACH_LIMIT_DB
            + " dB above the highest swept SNR"),
    /** A Monte Carlo bound is already below the target {@link BoundCurves#REACH_LIMIT_DB} dB below the lowest swept SNR. */
    BELOW_RANGE("the Monte Carlo bound is already below the target " + (int) BoundCurves.REACH_LIMIT_DB
            + " dB below the lowest swept SNR"),
    /** The target is below what a Monte Carlo bound's draws resolve (see {@link #note}). */
    UNRESOLVED("the target FER is below what the Monte Carlo bound's draws resolve"),
    /** The rate equals the constellation's entropy r·log2 M: the QAM-constrained bound is 1. */
    FULL_RATE("uncoded link at the constellation's full rate: the QAM-constrained bound is 1 at every SNR"),
    /** The rate exceeds r·log2 M (given with --rate): the QAM-constrained bound is 1. */
    ABOVE_ALPHABET("the rate is above the r·log2 M bits the constellation carries: the QAM-constrained bound is 1"
            + " at every SNR");

    private final String words;

    Reach(String words) {
        this.words = words;
    }

    /** Key in results.json, e.g. {@code outside_range}. */
    public String key() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** Plain words for the terminal, the JSON and the plot. */
    public String words() {
        return words;
    }

    /**
     * The words, and for {@link #UNRESOLVED} the effort that would resolve the target:
     * {@code outageDraws} is the {@code --outage-draws} value needed (see
     * {@link BoundCurves#resolvable}), ignored for the other cases.
     */
    public String note(long outageDraws) {
        return this == UNRESOLVED ? words + "; --outage-draws " + outageDraws + " or more would resolve it" : words;
    }

    /** Why the QAM bound of {@code s} is 1 at every SNR: {@link #FULL_RATE} or {@link #ABOVE_ALPHABET}. */
    public static Reach ofFullRate(BoundSettings s) {
        return s.spectralEfficiency() > s.qamLimit() * (1 + 1e-12) ? ABOVE_ALPHABET : FULL_RATE;
    }

    /**
     * Where the simulated curve meets the target: {@link #IN_RANGE} when {@code crossing} is
     * there, {@link #LINK_BELOW_RANGE} when the point of lowest SNR is already at or below the
     * target, else {@link #LINK_NOT_REACHED}.
     */
    public static Reach ofLink(List<PointResult> points, double targetFer, OptionalDouble crossing) {
        if (crossing.isPresent()) {
            return IN_RANGE;
        }
        return points.stream().min(Comparator.comparingDouble(PointResult::snrDb))
                .filter(p -> p.counts().frames() > 0 && p.counts().fer() <= targetFer)
                .map(p -> LINK_BELOW_RANGE).orElse(LINK_NOT_REACHED);
    }

    /** True when the curve has an SNR at the target. */
    public boolean hasSnr() {
        return this == IN_RANGE || this == OUTSIDE_RANGE;
    }
}
