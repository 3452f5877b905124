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
 * The 4-cycles are unavoidable at small Z for the denser protographs: two base rows sharing c
 * columns need c distinct shift differences mod Z. Rate 1/2 has none at any k; rates 2/3, 3/4
 * and 5/6 have them only for Z ≤ 11 (k ≤ 160, 198 and 220).
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
    private final ShiftSearch search;
    private final ConcurrentHashMap<Integer, QcBaseMatrix> lifted = new ConcurrentHashMap<>();

    LdpcFamily(String cliName, int infoColumns, int parityColumns, int highDegree, int highCount) {
        this.cliName = cliName;
        this.protograph = new Protograph(infoColumns, parityColumns, highDegree, highCount);
        this.search = new ShiftSearch(protograph.template());
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
        return lifted.computeIfAbsent(lifting, z -> new QcBaseMatrix(search.shifts(z), z));
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
