package org.fadebench.coding.stbc;

import java.util.LinkedHashMap;
import java.util.Map;

/** The catalogue of built-in space-time block codes, by command-line name. */
public final class SpaceTimeCodes {

    private static final double R = Math.sqrt(0.5);

    /** No space-time code: one transmit antenna, one symbol per slot (SISO and SIMO links). */
    public static final SpaceTimeCode NONE = new SpaceTimeCode("none", 1, 1, 1,
            new double[][] {{1, 0}}, new double[][] {{0, 1}},
            "scale 1: one antenna sends each unit-energy symbol",
            SpaceTimeCode.Kernel.SINGLE_ANTENNA);

    /**
     * Alamouti, X = (1/√2)[[s1, s2], [-s2*, s1*]] (S. M. Alamouti, IEEE JSAC 16(8), 1998), scaled by
     * 1/√2 so the two antennas together send unit energy per slot.
     */
    public static final SpaceTimeCode ALAMOUTI = new SpaceTimeCode("alamouti", 2, 2, 2,
            new double[][] {
                // a1: s1 at (0,0), s1* at (1,1)
                {R, 0, 0, 0, 0, 0, R, 0},
                // a2: s2 at (0,1), -s2* at (1,0)
                {0, 0, R, 0, -R, 0, 0, 0}},
            new double[][] {
                // j·b1 at (0,0), -j·b1 at (1,1)
                {0, R, 0, 0, 0, 0, 0, -R},
                // j·b2 at (0,1), +j·b2 at (1,0)
                {0, 0, 0, R, 0, R, 0, 0}},
            "scale 1/√2: two antennas share unit energy per slot",
            SpaceTimeCode.Kernel.ALAMOUTI);

    private static final Map<String, SpaceTimeCode> CATALOGUE = new LinkedHashMap<>();

    static {
        CATALOGUE.put(NONE.name(), NONE);
        CATALOGUE.put(ALAMOUTI.name(), ALAMOUTI);
    }

    private SpaceTimeCodes() {
    }

    /** All built-in codes in catalogue order. */
    public static Iterable<SpaceTimeCode> all() {
        return CATALOGUE.values();
    }

    /** @throws IllegalArgumentException naming the valid choices when the name is unknown */
    public static SpaceTimeCode byName(String name) {
        SpaceTimeCode c = CATALOGUE.get(name.trim().toLowerCase(java.util.Locale.ROOT));
        if (c == null) {
            throw new IllegalArgumentException("unknown space-time code '" + name + "'; valid: " + choices());
        }
        return c;
    }

    public static String choices() {
        return String.join(", ", CATALOGUE.keySet());
    }
}
