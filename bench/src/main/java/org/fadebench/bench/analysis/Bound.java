package org.fadebench.bench.analysis;

import java.util.Locale;

/** The three outage bounds a simulated link is compared with (see {@link BoundSettings}). */
public enum Bound {
    /** The Mt x Nr MIMO channel with Gaussian inputs: no code over the antennas does better. */
    MIMO,
    /** The link's orthogonal space-time block code carrying Gaussian symbols. */
    STBC,
    /** The same code carrying the link's QAM alphabet (coded-modulation or BICM information). */
    QAM;

    /** Key in results.json, e.g. {@code mimo}. */
    public String key() {
        return name().toLowerCase(Locale.ROOT);
    }
}
