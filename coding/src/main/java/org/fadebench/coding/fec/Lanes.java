package org.fadebench.coding.fec;

/** The argument checks every {@link LaneCoder} makes, with one wording, and the size of its rows. */
public final class Lanes {

    private Lanes() {
    }

    /** A Java array of {@code payload} bytes with its 16-byte header, rounded up to 8 bytes. */
    public static long rowBytes(long payload) {
        return 16 + (payload + 7) / 8 * 8;
    }

    /**
     * @throws IllegalArgumentException "lane L; valid lanes are 0 to count−1" unless 0 ≤ lane < count
     */
    public static void checkLane(int lane, int count) {
        if (lane < 0 || lane >= count) {
            throw new IllegalArgumentException("lane " + lane + "; valid lanes are 0 to " + (count - 1));
        }
    }

    /**
     * @throws IllegalArgumentException "batch of F frames; this decoder takes 1 to lanes" unless 1 ≤ frames ≤ lanes
     */
    public static void checkFrames(int frames, int lanes) {
        if (frames < 1 || frames > lanes) {
            throw new IllegalArgumentException("batch of " + frames + " frames; this decoder takes 1 to " + lanes);
        }
    }
}
