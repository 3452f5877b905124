package org.fadebench.bench.study;

import java.util.Locale;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.analysis.RunSummary;
import org.fadebench.bench.run.RunPlan;
import org.fadebench.channel.OutageEstimate;

/**
 * Screening a design by its QAM-constrained outage probability at the budget SNR, before it is
 * simulated. Over quasi-static fading (one fading block per frame) no code of the link's rate and
 * alphabet gets its FER far below the outage probability, so a design whose outage at
 * {@code budget_db} exceeds the target FER by more than the margin cannot meet the target at the
 * budget and is not simulated.
 *
 * <p>The margin is a factor over the target FER ({@value #DEFAULT_MARGIN} by default): at short
 * frames the error probability of a good code can sit slightly below the outage probability, the
 * difference shrinking with the blocklength (Y. Yang, G. Durisi, T. Koch, Y. Polyanskiy,
 * "Quasi-static multiple-antenna fading channels at finite blocklength", IEEE Trans. Inf. Theory
 * 60(7), 2014: the outage probability is the limit, approached as O(log n / n)). The factor 2 is our
 * choice (common practice, no source): a design is dropped only when its outage is more than twice
 * the target, far beyond that finite-length correction for frames of hundreds of channel uses. A
 * Monte Carlo bound (correlated, Rician or Nakagami fading, or MIMO counts) is judged by the lower
 * end of its 95 % interval, so a count never screens out a design its noise alone condemns.
 *
 * <p>Not screened, and simulated (the reason kept): links without outage bounds (AWGN, Doppler,
 * traces, codes that are not orthogonal), links with several fading blocks per frame (their
 * block-fading bound is a different limit, and the study keeps the screen to quasi-static fading),
 * and links at the constellation's full rate (uncoded), whose QAM-constrained bound is 1 at every
 * SNR and says nothing about a finite frame.
 *
 * @param outcome what the screen decided
 * @param outage  the QAM-constrained outage probability at the budget (NaN when not computed)
 * @param words   the decision in words, for the terminal and study.json
 */
public record Screening(Outcome outcome, double outage, String words) {

    /** The default margin: a factor over the target FER. */
    public static final double DEFAULT_MARGIN = 2.0;

    /** What the screen decided. */
    public enum Outcome {
        /** Outage at the budget is within the margin of the target: simulated. */
        PASSED,
        /** Outage at the budget exceeds the target by more than the margin: not simulated. */
        SCREENED_OUT,
        /** The screen does not apply to this link (see the words): simulated. */
        NOT_SCREENED
    }

    /** Screens {@code plan} at {@code budgetDb} with {@code margin} (a factor, at least 1). */
    public static Screening of(RunPlan plan, double budgetDb, double margin) {
        BoundSettings b = plan.bounds();
        if (b == null) {
            return new Screening(Outcome.NOT_SCREENED, Double.NaN, "not screened: " + RunSummary.noBounds(plan.link()));
        }
        if (b.fadingBlocks() > 1) {
            return new Screening(Outcome.NOT_SCREENED, Double.NaN, "not screened: " + b.fadingBlocks()
                    + " fading blocks per frame; the screen is for quasi-static fading (one block per frame)");
        }
        if (b.fullRate()) {
            return new Screening(Outcome.NOT_SCREENED, Double.NaN, "not screened: at the constellation's full rate "
                    + "the QAM-constrained bound is 1 at every SNR and says nothing about an uncoded frame");
        }
        OutageEstimate e = b.outage(Bound.QAM, budgetDb);
        double judged = e.lower();
        double limit = margin * plan.targetFer();
        String value = e.isExact() ? String.format(Locale.ROOT, "%.3g", e.probability())
                : String.format(Locale.ROOT, "%.3g (95 %% interval from %.3g)", e.probability(), judged);
        if (judged > limit) {
            return new Screening(Outcome.SCREENED_OUT, e.probability(), String.format(Locale.ROOT,
                    "screened out: QAM-constrained outage %s at the budget %s dB is above %s x the target FER %s",
                    value, fmt(budgetDb), fmt(margin), plan.targetFer()));
        }
        return new Screening(Outcome.PASSED, e.probability(), String.format(Locale.ROOT,
                "passed the screen: QAM-constrained outage %s at the budget %s dB, within %s x the target FER %s", value,
                fmt(budgetDb), fmt(margin), plan.targetFer()));
    }

    private static String fmt(double v) {
        return org.fadebench.bench.report.Numbers.db(v);
    }
}
