package org.fadebench.coding.fec;

import java.lang.invoke.MethodHandles;
import java.lang.invoke.VarHandle;
import java.nio.ByteOrder;
import org.fadebench.modem.NamedChoice;

/**
 * Cyclic redundancy checks, table-driven (one table look-up per byte), in the parameter model of
 * R. N. Williams, "A painless guide to CRC error detection algorithms", 1993: width, polynomial,
 * initial register, reflection, final xor.
 *
 * <p>Bit order: a bit frame (one bit per byte, 0 or 1) is fed to the register in frame order, which
 * is the order a serial CRC circuit shifts it in. Packed bytes therefore map to bits most
 * significant bit first for the non-reflected CRCs and least significant bit first for the
 * reflected CRC-32; {@link #ofBytes} and {@link #ofBits} agree under that mapping. The check bits
 * are appended in the same order (register's top bit first when not reflected, lowest bit first
 * when reflected).
 */
public enum Crc implements NamedChoice {
    /** No check: zero bits, every frame passes. */
    NONE("none", 0, 0, 0, 0, false),
    /** CRC-16, poly 0x1021, init 0xFFFF, not reflected, no final xor ("CCITT-FALSE" parameters). */
    CRC16("crc16", 16, 0x1021, 0xFFFF, 0, false),
    /** CRC-24 of OpenPGP (RFC 4880, Sec. 6.1): poly 0x864CFB, init 0xB704CE, not reflected. */
    CRC24("crc24", 24, 0x864CFB, 0xB704CE, 0, false),
    /** CRC-32 (poly 0x04C11DB7, reflected 0xEDB88320), init and final xor 0xFFFFFFFF. */
    CRC32("crc32", 32, 0x04C11DB7, 0xFFFFFFFF, 0xFFFFFFFF, true);

    private final String cliName;
    private final int width;
    private final int poly;
    private final int init;
    private final int xorOut;
    private final boolean reflected;
    private final int mask;
    private final int[] table = new int[256];

    Crc(String cliName, int width, int poly, int init, int xorOut, boolean reflected) {
        this.cliName = cliName;
        this.width = width;
        this.mask = width == 32 ? -1 : (1 << width) - 1;
        this.reflected = reflected;
        this.poly = reflected ? reflect(poly, width) : poly;
        this.init = reflected ? reflect(init, width) : init;
        this.xorOut = xorOut;
        if (width > 0) {
            for (int b = 0; b < 256; b++) {
                int r = reflected ? b : b << (width - 8);
                for (int i = 0; i < 8; i++) {
                    r = step(r, 0);
                }
                table[b] = r;
            }
        }
    }

    /** Name on the command line, e.g. {@code crc24}. */
    @Override
    public String cliName() {
        return cliName;
    }

    /** Number of check bits appended to a frame (0 for {@link #NONE}). */
    public int bits() {
        return width;
    }

    /** The CRC of {@code len} packed bytes, in the low {@link #bits()} bits of the result. */
    public long ofBytes(byte[] data, int off, int len) {
        if (width == 0) {
            return 0;
        }
        int r = init;
        for (int i = off, end = off + len; i < end; i++) {
            r = feedByte(r, data[i] & 0xFF);
        }
        return finish(r);
    }

    /**
     * The CRC of {@code len} bits given one per byte, in frame order. Whole groups of eight bits
     * are packed (see {@link #pack}) and go through the byte table; the rest is shifted in bit by bit.
     */
    public long ofBits(byte[] bits, int off, int len) {
        if (width == 0) {
            return 0;
        }
        int r = init;
        int i = off;
        int end = off + len;
        for (int byteEnd = off + (len & ~7); i < byteEnd; i += 8) {
            r = feedByte(r, pack(bits, i));
        }
        for (; i < end; i++) {
            r = step(r, bits[i] & 1);
        }
        return finish(r);
    }

    /**
     * Computes the CRC of {@code frame[off .. off+dataBits)} and writes its {@link #bits()} bits
     * right after the data, at {@code frame[off+dataBits ..]}.
     */
    public void append(byte[] frame, int off, int dataBits) {
        long crc = ofBits(frame, off, dataBits);
        for (int i = 0; i < width; i++) {
            frame[off + dataBits + i] = checkBit(crc, i);
        }
    }

    /**
     * Whether the last {@link #bits()} bits of {@code frame[off .. off+frameBits)} equal the CRC of
     * the bits before them. Always true for {@link #NONE}.
     *
     * @throws IllegalArgumentException if the frame is shorter than the check
     */
    public boolean check(byte[] frame, int off, int frameBits) {
        if (frameBits < width) {
            throw new IllegalArgumentException("frame of " + frameBits + " bits is shorter than the "
                    + width + " bits of " + cliName);
        }
        int dataBits = frameBits - width;
        long crc = ofBits(frame, off, dataBits);
        for (int i = 0; i < width; i++) {
            if (frame[off + dataBits + i] != checkBit(crc, i)) {
                return false;
            }
        }
        return true;
    }

    /** Eight bytes of an array as a little-endian long: byte t at bits 8t .. 8t + 7. */
    private static final VarHandle EIGHT_BYTES = MethodHandles.byteArrayViewVarHandle(long[].class,
            ByteOrder.LITTLE_ENDIAN);

    /**
     * The eight bits at {@code bits[i .. i+8)} (the low bit of each byte) as the byte the register
     * takes: the first bit lowest if reflected, else highest. With the bytes' low bits at 8t, the
     * product with Σ_t 2^(56 − 7t) puts bit t at 56 + t and every other partial product at a
     * different place outside bits 56 .. 63 (8t − 7u = 8t' − 7u' needs t − t' a multiple of 7 and
     * u − u' of 8), so nothing carries into them (common practice, no source).
     */
    private int pack(byte[] bits, int i) {
        long eight = (long) EIGHT_BYTES.get(bits, i);
        if (!reflected) {
            eight = Long.reverseBytes(eight);
        }
        return (int) (((eight & 0x0101010101010101L) * 0x0102040810204080L) >>> 56);
    }

    /** The i-th transmitted check bit: register top bit first, or lowest bit first if reflected. */
    private byte checkBit(long crc, int i) {
        return (byte) ((crc >>> (reflected ? i : width - 1 - i)) & 1);
    }

    private int feedByte(int r, int b) {
        if (reflected) {
            return (r >>> 8) ^ table[(r ^ b) & 0xFF];
        }
        return ((r << 8) ^ table[((r >>> (width - 8)) ^ b) & 0xFF]) & mask;
    }

    /** One register shift with input bit {@code bit} (a serial CRC circuit). */
    private int step(int r, int bit) {
        if (reflected) {
            int out = (r ^ bit) & 1;
            return (r >>> 1) ^ (-out & poly);
        }
        int out = ((r >>> (width - 1)) ^ bit) & 1;
        return ((r << 1) ^ (-out & poly)) & mask;
    }

    private static int reflect(int x, int width) {
        return Integer.reverse(x) >>> (32 - width);
    }

    private long finish(int r) {
        return (r ^ xorOut) & (mask & 0xFFFFFFFFL);
    }

    /**
     * Looks a CRC up by its command-line name, ignoring case.
     *
     * @throws IllegalArgumentException naming the valid choices when the name is unknown
     */
    public static Crc fromCliName(String name) {
        return NamedChoice.find(values(), name, "CRC");
    }

    /** The valid command-line names, comma separated. */
    public static String choices() {
        return NamedChoice.list(values());
    }

    @Override
    public String toString() {
        return cliName;
    }
}
