package org.fadebench.channel;

/**
 * Limits for reading a channel trace, against oversized and decompression-bomb files: at most
 * {@code maxBytes} bytes of content after decompression (the file itself when not compressed) and at
 * most {@code maxMatrices} channel matrices.
 */
public record TraceLimits(long maxBytes, long maxMatrices) {

    /** 1 GiB of content and 2^24 matrices. */
    public static final TraceLimits DEFAULT = new TraceLimits(1L << 30, 1L << 24);

    public TraceLimits {
        if (maxBytes < 1 || maxMatrices < 1) {
            throw new IllegalArgumentException("trace limits must be >= 1, got maxBytes = " + maxBytes
                    + ", maxMatrices = " + maxMatrices);
        }
    }
}
