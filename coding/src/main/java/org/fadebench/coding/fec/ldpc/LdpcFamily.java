package org.fadebench.coding.fec.ldpc;

import java.util.concurrent.ConcurrentHashMap;

/**
 * The built-in quasi-cyclic LDPC family: four protographs of our own design with {@value #BASE_COLUMNS}
 * base columns each (kb information, mb parity; see {@link Protograph}), lifted, shortened and
 * punctured to serve any information size k from {@value #MIN_INFO_BITS} to {@value #MAX_INFO_BITS}
 * (a payload of 64 to 8192 bits with a CRC of up to 32 bits) at exactly the nominal rate:
 * Z = ⌈k / kb⌉, and round(k / R) bits are sent ({@link LiftedLayout}).
 *
 * <p>Information degree profiles, chosen by {@link Protograph#search} (high degrees 4 to 8; lifts
 * without 4-cycles at k = 256), and their Gaussian-approximation thresholds on the BI-AWGN channel
 * (Eb/N0 at the design rate):
 * <ul>
 * <li>rate 1/2: 12 + 12 columns, 4 of degree 8, 8 of degree 3; σ* = 0.9298, 0.633 dB
 * <li>rate 2/3: 16 + 8 columns, 4 of degree 8, 12 of degree 3; σ* = 0.7294, 1.492 dB
 * <li>rate 3/4: 18 + 6 columns, 5 of degree 6, 13 of degree 3; σ* = 0.6406, 2.107 dB
 * <li>rate 5/6: 20 + 4 columns, 1 of degree 4, 19 of degree 3; σ* = 0.5551, 2.894 dB
 * </ul>
 * (The BPSK-constrained capacity limits at these rates are 0.187, 1.059, 1.626 and 2.362 dB, by
 * Gauss–Hermite quadrature of the mutual information.)
 *
 * <p>Measured at k = 1024, BPSK over AWGN, 50 iterations with early stop, the floating layered
 * decoder, FER (frame errors / frames): rate 1/2 (n = 2048) sum-product 3.5e-3 (7/2000) at 1.50 dB
 * and 2.5e-4 (4/16000) at 1.75 dB; normalised min-sum (α = 0.75) 2.1e-3 (53/25312) at 1.75 dB,
 * 4.7e-4 (28/60000) at 2.00 dB. Min-sum: rate 2/3 (n = 1536) 1.2e-3 (30/26064) at 2.50 dB,
 * 1.7e-4 (5/30000) at 2.75 dB; rate 3/4 (n = 1365) 2.7e-3 (30/11072) at 3.00 dB, 1.7e-4 (5/30000)
 * at 3.25 dB; rate 5/6 (n = 1229) 2.5e-3 (30/11792) at 4.00 dB, 1.5e-4 (6/40000) at 4.25 dB
 * (sum-product 8.3e-4, 5/6000, at 4.00 dB). The normal approximation (Y. Polyanskiy, H. V. Poor,
 * S. Verdú, IEEE Trans. Inf. Theory 56(5), 2010) puts FER 1e-3 at 0.87, 1.75, 2.34 and 3.09 dB.
 *
 * <p>The circulant shifts for each Z come from {@link ShiftSearch} (no 4-cycles wherever the
 * search finds such shifts, as few 6-cycles as it can), computed on first use of a Z and kept
 * (a few milliseconds per Z, at most about 25; the four protographs' cycle lists about 0.1 s at
 * class load; wall clock on the development machine, not a benchmark). Girth of H as used
 * ({@code LdpcFamilyTest} pins it):
 * <pre>
 *   k        64  128  256  512  1024  2048  4096  8192
 *   r12       6    6    6    8     8     8     8     8
 *   r23       4    4    6    6     6     8     8     8
 *   r34       4    4    6    6     6     8     8     8
 *   r56       4    4    6    6     6     6     8     8
 * </pre>
 * Rate 1/2 has no 4-cycles at any k; rates 2/3, 3/4 and 5/6 have them at their smallest sizes
 * only, Z ≤ 10, 11 and 11 (k ≤ 160, 198 and 220), and keep them there, by measurement. Two base
 * rows sharing c columns need c distinct shift differences mod Z, and more generally a graph
 * without 4-cycles meets each pair of checks in at most one column, so the columns' C(d, 2)
 * summed cannot exceed C(m, 2) for m checks (common practice, no source): at k = 64 the family's
 * information columns alone (592, 432 and 204 pairs) need at least 35, 30 and 21 checks, against
 * the 32, 21 and 13 parity bits a frame sends. A 4-cycle-free code there must leave out ones or
 * carry parity bits that are punctured. Both were tried (see the version history: the shift search
 * leaving out base entries, a column keeping two ones or more, where the lift by ⌈k / kb⌉ closes
 * 4-cycles; where that was not enough, a larger Z with the spare information bits shortened and
 * the extra parity bits punctured) and measured against these codes: BPSK over AWGN, min-sum
 * defaults, seed 7, up to 200 000 frames or 300 frame errors per point, FER before → after with
 * 95 % Wilson intervals:
 * <pre>
 *   rate  k  Eb/N0  FER, frame errors/frames [95 %] before  →  after
 *   r23  64 4.00  6.5e-3 300/45824  [5.9e-3, 7.3e-3] → 6.1e-3 300/48928  [5.5e-3, 6.9e-3]
 *   r23  64 5.00  4.2e-4  84/200000 [3.4e-4, 5.2e-4] → 2.6e-4  53/200000 [2.0e-4, 3.5e-4]
 *   r23 128 3.50  4.2e-3 300/72144  [3.7e-3, 4.7e-3] → 5.1e-3 300/58800  [4.6e-3, 5.7e-3]
 *   r23 128 4.50  1.1e-4  22/200000 [7.3e-5, 1.7e-4] → 1.5e-4  30/200000 [1.1e-4, 2.1e-4]
 *   r23 160 3.50  2.7e-3 300/111488 [2.4e-3, 3.0e-3] → 5.8e-3 300/51488  [5.2e-3, 6.5e-3]
 *   r23 160 4.50  4.5e-5   9/200000 [2.4e-5, 8.6e-5] → 8.0e-4 159/200000 [6.8e-4, 9.3e-4]
 *   r34  64 4.00  2.6e-2 300/11568  [2.3e-2, 2.9e-2] → 4.3e-2 300/6928   [3.9e-2, 4.8e-2]
 *   r34  64 5.00  2.2e-3 300/133888 [2.0e-3, 2.5e-3] → 5.6e-3 300/53680  [5.0e-3, 6.3e-3]
 *   r34 128 4.00  7.0e-3 300/42672  [6.3e-3, 7.9e-3] → 9.4e-3 300/32000  [8.4e-3, 1.1e-2]
 *   r34 128 4.75  4.4e-4  87/200000 [3.5e-4, 5.4e-4] → 1.2e-3 247/200000 [1.1e-3, 1.4e-3]
 *   r34 198 3.75  4.2e-3 300/71584  [3.7e-3, 4.7e-3] → 4.6e-3 300/64896  [4.1e-3, 5.2e-3]
 *   r34 198 4.50  1.6e-4  33/200000 [1.2e-4, 2.3e-4] → 2.0e-4  40/200000 [1.5e-4, 2.7e-4]
 *   r56  64 4.50  5.1e-2 300/5920   [4.5e-2, 5.7e-2] → 8.4e-2 301/3584   [7.5e-2, 9.3e-2]
 *   r56  64 5.50  8.2e-3 300/36608  [7.3e-3, 9.2e-3] → 1.4e-2 300/20768  [1.3e-2, 1.6e-2]
 *   r56 128 4.25  3.8e-2 301/7888   [3.4e-2, 4.3e-2] → 5.2e-2 300/5824   [4.6e-2, 5.8e-2]
 *   r56 128 5.00  4.9e-3 300/60624  [4.4e-3, 5.5e-3] → 8.5e-3 300/35104  [7.6e-3, 9.6e-3]
 *   r56 200 4.00  4.2e-2 301/7136   [3.8e-2, 4.7e-2] → 4.0e-2 301/7456   [3.6e-2, 4.5e-2]
 *   r56 200 4.75  3.0e-3 300/98992  [2.7e-3, 3.4e-3] → 3.2e-3 300/92512  [2.9e-3, 3.6e-3]
 * </pre>
 * (r34 k = 64 was lifted by Z = 6 instead of 4, r56 k = 64 and 128 by Z = 10 instead of 4 and 7;
 * the others kept Z and left out 0 to 13 base entries.) Worse beyond the intervals at 10 of the
 * 18 points, better beyond them at none: the extra punctured parity bits cost more than the
 * 4-cycles did, and the codes with entries left out vary with their shifts (from slightly better
 * to 18 times worse); so the codes with 4-cycles stay at these sizes.
 *
 * <p>Constants are serialisable (by name); layouts are not.
 */
public enum LdpcFamily {

    R12("ldpc-r12", 12, 12, 8, 4),
    R23("ldpc-r23", 16, 8, 8, 4),
    R34("ldpc-r34", 18, 6, 6, 5),
    R56("ldpc-r56", 20, 4, 4, 1);

    /** Base columns of every protograph of the family. */
    public static final int BASE_COLUMNS = 24;
    /** Fewest information bits per codeword. */
    public static final int MIN_INFO_BITS = 64;
    /** Most information bits per codeword: 8192 payload bits and a 32-bit CRC. */
    public static final int MAX_INFO_BITS = 8192 + 32;

    private final String cliName;
    private final Protograph protograph;
    /** The cycles of the template, enumerated on the first lifting asked for (not at start-up). */
    private volatile ShiftSearch search;
    private final ConcurrentHashMap<Integer, QcBaseMatrix> lifted = new ConcurrentHashMap<>();

    LdpcFamily(String cliName, int infoColumns, int parityColumns, int highDegree, int highCount) {
        this.cliName = cliName;
        this.protograph = new Protograph(infoColumns, parityColumns, highDegree, highCount);
    }

    /** The shift search of this family's template; built once, on first use. */
    private ShiftSearch search() {
        ShiftSearch s = search;
        if (s == null) {
            synchronized (this) {
                s = search;
                if (s == null) {
                    s = new ShiftSearch(protograph.template());
                    search = s;
                }
            }
        }
        return s;
    }

    /** The name on the command line. */
    public String cliName() {
        return cliName;
    }

    /** The nominal rate kb / {@value #BASE_COLUMNS}, which is also the rate sent. */
    public double rate() {
        return (double) protograph.infoColumns() / BASE_COLUMNS;
    }

    /** Information columns kb of the base matrix. */
    public int infoColumns() {
        return protograph.infoColumns();
    }

    /** The degree distribution of the protograph (edge perspective), the ensemble it was designed as. */
    public DegreeDistribution ensemble() {
        return protograph.ensemble();
    }

    Protograph protograph() {
        return protograph;
    }

    /**
     * The base matrix of shifts for lifting size Z (searched on the first call for a Z, then kept).
     *
     * @throws IllegalArgumentException if Z is below 2
     */
    public QcBaseMatrix baseMatrix(int lifting) {
        if (lifting < 2) {
            throw new IllegalArgumentException("lifting size " + lifting + "; valid: at least 2");
        }
        return lifted.computeIfAbsent(lifting, z -> new QcBaseMatrix(search().shifts(z), z));
    }

    /** The lifting size for k information bits, ⌈k / kb⌉. */
    public int lifting(int infoBits) {
        check(infoBits);
        return (infoBits + protograph.infoColumns() - 1) / protograph.infoColumns();
    }

    /** Bits sent per codeword of k information bits, round(k / R). */
    public int sentBits(int infoBits) {
        check(infoBits);
        return (int) Math.round((double) infoBits * BASE_COLUMNS / protograph.infoColumns());
    }

    /**
     * The code for k information bits, at rate k / round(k / R).
     *
     * @throws IllegalArgumentException if k is outside {@value #MIN_INFO_BITS} to {@value #MAX_INFO_BITS}
     */
    public CodeLayout layout(int infoBits) {
        return new LiftedLayout(baseMatrix(lifting(infoBits)), protograph.middleRow(), infoBits, sentBits(infoBits));
    }

    private void check(int infoBits) {
        if (infoBits < MIN_INFO_BITS || infoBits > MAX_INFO_BITS) {
            throw new IllegalArgumentException(cliName + " takes " + MIN_INFO_BITS + " to " + MAX_INFO_BITS
                    + " information bits per codeword (payload and CRC), got " + infoBits);
        }
    }
}
