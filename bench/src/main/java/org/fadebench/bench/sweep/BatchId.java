package org.fadebench.bench.sweep;

import java.io.Serializable;

/** Batch number {@code batch} of SNR point number {@code point}: a unit of work of a sweep. */
public record BatchId(int point, long batch) implements Serializable {
}
