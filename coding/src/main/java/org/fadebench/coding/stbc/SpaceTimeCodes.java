package org.fadebench.coding.stbc;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

/**
 * The catalogue of built-in space-time block codes, by command-line name.
 *
 * <p>Each code is written out below as its published matrix, one string per slot (row) and one
 * token per antenna (column): {@code s3} is the symbol s_3, {@code -s3*} is −s_3*, {@code 0} is
 * silence. The scale factor beside each code makes the average total energy per slot 1 for
 * unit-energy symbols (the power convention of {@link SpaceTimeCode}): it is 1/√E where E is the
 * unscaled design's average energy per slot, the number of its nonzero (unit) entries over T. For
 * an orthogonal design it gives X^H X = c·(Σ|s_k|²)·I with c = T/(Mt·K). Orthogonality, full
 * diversity and the scale are checked numerically in the tests, not assumed from the names.
 */
public final class SpaceTimeCodes {

    /** No space-time code: one transmit antenna, one symbol per slot (SISO and SIMO links). */
    public static final SpaceTimeCode NONE = design("none", 1.0,
            "scale 1: one antenna sends each unit-energy symbol",
            SpaceTimeCode.Kernel.SINGLE_ANTENNA,
            "s1");

    /** Alamouti (S. M. Alamouti, IEEE JSAC 16(8), 1998). */
    public static final SpaceTimeCode ALAMOUTI = design("alamouti", Math.sqrt(0.5),
            "scale 1/√2: unscaled energy 2 per slot",
            SpaceTimeCode.Kernel.ALAMOUTI,
            "  s1   s2",
            " -s2*  s1*");

    /**
     * Real orthogonal design of size 4, G^T G = (Σ x_k²) I for real x (V. Tarokh, H. Jafarkhani and
     * A. R. Calderbank, "Space-time block codes from orthogonal designs", IEEE Trans. Inf. Theory
     * 45(5), 1999; written from memory, checked numerically).
     */
    private static final String[] REAL_4 = {
        "  s1   s2   s3   s4",
        " -s2   s1  -s4   s3",
        " -s3   s4   s1  -s2",
        " -s4  -s3   s2   s1",
    };

    /** Real orthogonal design of size 8 (same paper and remark as {@link #REAL_4}). */
    private static final String[] REAL_8 = {
        "  s1   s2   s3   s4   s5   s6   s7   s8",
        " -s2   s1   s4  -s3   s6  -s5  -s8   s7",
        " -s3  -s4   s1   s2   s7   s8  -s5  -s6",
        " -s4   s3  -s2   s1   s8  -s7   s6  -s5",
        " -s5  -s6  -s7  -s8   s1   s2   s3   s4",
        " -s6   s5  -s8   s7  -s2   s1  -s4   s3",
        " -s7   s8   s5  -s6  -s3   s4   s1  -s2",
        " -s8  -s7   s6   s5  -s4  -s3   s2   s1",
    };

    /**
     * G3 of Tarokh et al. (1999), rate 1/2: the first three columns of the size-4 real design,
     * stacked over their conjugates (8 x 3, slots down, antennas across):
     * <pre>
     *   s1   s2   s3
     *  -s2   s1  -s4
     *  -s3   s4   s1
     *  -s4  -s3   s2
     *   s1*  s2*  s3*
     *  -s2*  s1* -s4*
     *  -s3*  s4*  s1*
     *  -s4* -s3*  s2*
     * </pre>
     * Unscaled X^H X = 2·Σ|s_k|²·I.
     */
    public static final SpaceTimeCode G3 = halfRate("g3", REAL_4, 3, 1 / Math.sqrt(3),
            "scale 1/√3: unscaled energy 24/8 = 3 per slot");

    /** G4 of Tarokh et al. (1999), rate 1/2: the size-4 real design over its conjugate (8 x 4). */
    public static final SpaceTimeCode G4 = halfRate("g4", REAL_4, 4, 0.5,
            "scale 1/2: unscaled energy 32/8 = 4 per slot");

    /**
     * Rate-3/4 orthogonal design for 4 antennas, the form with zeros rather than the one with
     * factors 1/2 and 1/√2 printed by Tarokh et al. (1999); written from memory, X^H X = Σ|s_k|²·I
     * before scaling, checked numerically in the tests.
     */
    public static final SpaceTimeCode H4 = design("h4", 1 / Math.sqrt(3),
            "scale 1/√3: unscaled energy 12/4 = 3 per slot",
            SpaceTimeCode.Kernel.GENERAL,
            "  s1    s2    s3    0 ",
            " -s2*   s1*   0     s3 ",
            " -s3*   0     s1*  -s2 ",
            "  0    -s3*   s2*   s1 ");

    /** Rate-3/4 orthogonal design for 3 antennas: the first three columns of {@link #H4}. */
    public static final SpaceTimeCode H3 = design("h3", 2.0 / 3.0,
            "scale 2/3: unscaled energy 9/4 per slot",
            SpaceTimeCode.Kernel.GENERAL,
            "  s1    s2    s3 ",
            " -s2*   s1*   0  ",
            " -s3*   0     s1*",
            "  0    -s3*   s2*");

    /**
     * Rate-1/2 designs for 5 to 8 antennas by the generalised construction of Tarokh et al. (1999):
     * the first n columns G_R(s) of the size-8 real design stacked over G_R(s*), T = 16, K = 8.
     * Unscaled X^H X = 2·Σ|s_k|²·I; scale 1/√n.
     */
    public static final SpaceTimeCode R12_5 = halfRate("r12-5", REAL_8, 5, 1 / Math.sqrt(5),
            "scale 1/√5: unscaled energy 80/16 = 5 per slot");
    public static final SpaceTimeCode R12_6 = halfRate("r12-6", REAL_8, 6, 1 / Math.sqrt(6),
            "scale 1/√6: unscaled energy 96/16 = 6 per slot");
    public static final SpaceTimeCode R12_7 = halfRate("r12-7", REAL_8, 7, 1 / Math.sqrt(7),
            "scale 1/√7: unscaled energy 112/16 = 7 per slot");
    public static final SpaceTimeCode R12_8 = halfRate("r12-8", REAL_8, 8, 1 / Math.sqrt(8),
            "scale 1/√8: unscaled energy 128/16 = 8 per slot");

    private static final Map<String, SpaceTimeCode> CATALOGUE = new LinkedHashMap<>();

    static {
        for (SpaceTimeCode c : new SpaceTimeCode[] {
            NONE, ALAMOUTI, G3, G4, H3, H4, R12_5, R12_6, R12_7, R12_8}) {
            CATALOGUE.put(c.name(), c);
        }
    }

    private SpaceTimeCodes() {
    }

    /** All built-in codes in catalogue order. */
    public static Iterable<SpaceTimeCode> all() {
        return CATALOGUE.values();
    }

    /** @throws IllegalArgumentException naming the valid choices when the name is unknown */
    public static SpaceTimeCode byName(String name) {
        SpaceTimeCode c = CATALOGUE.get(name.trim().toLowerCase(Locale.ROOT));
        if (c == null) {
            throw new IllegalArgumentException("unknown space-time code '" + name + "'; valid: " + choices());
        }
        return c;
    }

    public static String choices() {
        return String.join(", ", CATALOGUE.keySet());
    }

    /** Whether {@code code} is one of the built-in codes (not one read from a file). */
    public static boolean isCatalogued(SpaceTimeCode code) {
        return CATALOGUE.get(code.name()) == code;
    }

    /** The first {@code columns} columns of a real design over the same columns conjugated. */
    private static SpaceTimeCode halfRate(String name, String[] realDesign, int columns, double scale,
                                          String scaleNote) {
        int p = realDesign.length;
        String[] rows = new String[2 * p];
        for (int r = 0; r < p; r++) {
            String[] tokens = Arrays.copyOf(realDesign[r].trim().split("\\s+"), columns);
            rows[r] = String.join(" ", tokens);
            rows[p + r] = String.join("* ", tokens) + "*";
        }
        return design(name, scale, scaleNote, SpaceTimeCode.Kernel.GENERAL, rows);
    }

    /**
     * Builds a code from its matrix written one slot per string; tokens {@code 0}, {@code s<k>},
     * {@code -s<k>}, {@code s<k>*} or {@code -s<k>*} with k from 1 to K, every k present; every
     * entry is multiplied by {@code scale}.
     */
    static SpaceTimeCode design(String name, double scale, String scaleNote, SpaceTimeCode.Kernel kernel,
                                String... rows) {
        int t = rows.length;
        String[][] tokens = new String[t][];
        int k = 0;
        for (int slot = 0; slot < t; slot++) {
            tokens[slot] = rows[slot].trim().split("\\s+");
            for (String tok : tokens[slot]) {
                if (!tok.equals("0")) {
                    k = Math.max(k, symbolIndex(tok) + 1);
                }
            }
        }
        int mt = tokens[0].length;
        boolean[] used = new boolean[k];
        double[][] a = new double[k][2 * t * mt];
        double[][] b = new double[k][2 * t * mt];
        for (int slot = 0; slot < t; slot++) {
            if (tokens[slot].length != mt) {
                throw new IllegalStateException(name + ": ragged row " + slot);
            }
            for (int tx = 0; tx < mt; tx++) {
                String tok = tokens[slot][tx];
                if (tok.equals("0")) {
                    continue;
                }
                int i = symbolIndex(tok);
                used[i] = true;
                double sign = tok.startsWith("-") ? -scale : scale;
                int cell = 2 * (slot * mt + tx);
                // ±s = ±(a + jb); ±s* = ±(a - jb)
                a[i][cell] = sign;
                b[i][cell + 1] = tok.endsWith("*") ? -sign : sign;
            }
        }
        for (int i = 0; i < k; i++) {
            if (!used[i]) {
                throw new IllegalStateException(name + ": symbol s" + (i + 1) + " never sent");
            }
        }
        return new SpaceTimeCode(name, mt, k, t, a, b, scaleNote, kernel);
    }

    private static int symbolIndex(String tok) {
        String core = tok.replace("-", "").replace("*", "");
        if (!core.matches("s[1-9][0-9]*")) {
            throw new IllegalStateException("bad design token " + tok);
        }
        return Integer.parseInt(core.substring(1)) - 1;
    }
}
