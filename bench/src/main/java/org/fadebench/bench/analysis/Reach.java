package org.fadebench.bench.analysis;

import java.util.Locale;

/**
 * Where a curve meets the target FER, or why it has no such SNR: each case has its own words, so
 * that "not reached" never stands for several things.
 */
public enum Reach {
    /** The curve crosses the target within the swept SNR range. */
    IN_RANGE("within the swept range"),
    /** A closed-form bound crosses the target outside the swept range; the SNR is still given. */
    OUTSIDE_RANGE("outside the swept range, from the closed form"),
    /** The simulated link did not fall to the target FER at any swept SNR. */
    LINK_NOT_REACHED("the link did not reach the target FER in the swept range"),
    /** A Monte Carlo bound is still above the target at the highest swept SNR (it is counted only there). */
    ABOVE_RANGE("the Monte Carlo bound is still above the target at the highest swept SNR"),
    /** A Monte Carlo bound is already below the target at the lowest swept SNR. */
    BELOW_RANGE("the Monte Carlo bound is already below the target at the lowest swept SNR"),
    /** A Monte Carlo bound falls below what its draws resolve before it reaches the target. */
    UNRESOLVED("the Monte Carlo bound is too small for its channel draws to resolve; raise --outage-draws"),
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

    /** Why the QAM bound of {@code s} is 1 at every SNR: {@link #FULL_RATE} or {@link #ABOVE_ALPHABET}. */
    public static Reach ofFullRate(BoundSettings s) {
        return s.spectralEfficiency() > s.qamLimit() * (1 + 1e-12) ? ABOVE_ALPHABET : FULL_RATE;
    }

    /** True when the curve has an SNR at the target. */
    public boolean hasSnr() {
        return this == IN_RANGE || this == OUTSIDE_RANGE;
    }
}
