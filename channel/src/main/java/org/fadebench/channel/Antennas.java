package org.fadebench.channel;

/** The antenna counts a channel supports; every check takes {@code (nr, mt)} in that order. */
public final class Antennas {

    /** Most antennas on either side. */
    public static final int MAX = 64;

    private Antennas() {
    }

    /** Throws unless {@code nr} receive and {@code mt} transmit antennas are each 1 to {@value #MAX}. */
    public static void check(int nr, int mt) {
        if (mt < 1 || mt > MAX || nr < 1 || nr > MAX) {
            throw new IllegalArgumentException("antenna counts must be in 1.." + MAX + ", got Mt = " + mt
                    + ", Nr = " + nr);
        }
    }
}
