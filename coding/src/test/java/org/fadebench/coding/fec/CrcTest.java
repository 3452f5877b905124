package org.fadebench.coding.fec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.util.Random;
import java.util.zip.CRC32;
import org.junit.jupiter.api.Test;

public class CrcTest {

    private static final byte[] CHECK_MESSAGE = "123456789".getBytes(StandardCharsets.US_ASCII);

    /**
     * Check values, the CRC of ASCII "123456789", as listed in G. Cook, "Catalogue of parametrised
     * CRC algorithms" (entries CRC-32, CRC-16/CCITT-FALSE, CRC-24/OPENPGP); the CRC-24 parameters
     * are those of RFC 4880 (J. Callas et al., OpenPGP Message Format, 2007), Sec. 6.1.
     */
    @Test
    void publishedCheckValues() {
        assertEquals(0xCBF43926L, Crc.CRC32.ofBytes(CHECK_MESSAGE, 0, 9));
        assertEquals(0x29B1L, Crc.CRC16.ofBytes(CHECK_MESSAGE, 0, 9));
        assertEquals(0x21CF02L, Crc.CRC24.ofBytes(CHECK_MESSAGE, 0, 9));
        assertEquals(0L, Crc.NONE.ofBytes(CHECK_MESSAGE, 0, 9));
    }

    /** The same check values through the bit path, the message unpacked in each CRC's bit order. */
    @Test
    void checkValuesThroughBitPath() {
        for (Crc crc : new Crc[] {Crc.CRC16, Crc.CRC24, Crc.CRC32}) {
            byte[] bits = unpack(CHECK_MESSAGE, 0, 9, crc == Crc.CRC32);
            assertEquals(crc.ofBytes(CHECK_MESSAGE, 0, 9), crc.ofBits(bits, 0, bits.length), crc.cliName());
        }
    }

    /** CRC-32 against the JDK's java.util.zip.CRC32 on random data of many lengths and offsets. */
    @Test
    void crc32AgreesWithJdk() {
        Random random = new Random(20261201L);
        for (int len = 0; len < 600; len += 7) {
            byte[] data = new byte[len + 3];
            random.nextBytes(data);
            CRC32 reference = new CRC32();
            reference.update(data, 3, len);
            assertEquals(reference.getValue(), Crc.CRC32.ofBytes(data, 3, len), "length " + len);
        }
    }

    /**
     * Bit path against a plain bit-serial shift register written here from the definition (R. N.
     * Williams, "A painless guide to CRC error detection algorithms", 1993, Sec. 9 and 15), on lengths
     * that are not multiples of 8, and against the byte path where they are.
     */
    @Test
    void bitPathAgreesWithSerialRegisterAndBytePath() {
        Random random = new Random(7);
        for (Crc crc : new Crc[] {Crc.CRC16, Crc.CRC24, Crc.CRC32}) {
            for (int len = 0; len < 300; len++) {
                byte[] bits = randomBits(random, len + 5);
                assertEquals(serial(crc, bits, 5, len), crc.ofBits(bits, 5, len), crc + " length " + len);
            }
            for (int bytes = 0; bytes < 70; bytes++) {
                byte[] data = new byte[bytes];
                random.nextBytes(data);
                byte[] bits = unpack(data, 0, bytes, crc == Crc.CRC32);
                assertEquals(crc.ofBytes(data, 0, bytes), crc.ofBits(bits, 0, bits.length), crc + " bytes " + bytes);
            }
        }
    }

    @Test
    void appendedFramePassesAndEverySingleBitErrorIsDetected() {
        Random random = new Random(11);
        for (Crc crc : new Crc[] {Crc.CRC16, Crc.CRC24, Crc.CRC32}) {
            for (int dataBits : new int[] {1, 13, 64, 333}) {
                byte[] frame = randomBits(random, dataBits + crc.bits() + 2);
                crc.append(frame, 2, dataBits);
                assertTrue(crc.check(frame, 2, dataBits + crc.bits()));
                for (int i = 2; i < frame.length; i++) {
                    frame[i] ^= 1;
                    assertFalse(crc.check(frame, 2, dataBits + crc.bits()), crc + " missed an error at bit " + i);
                    frame[i] ^= 1;
                }
            }
        }
    }

    /**
     * CRC-32 residue: a frame with its check appended, read through the register without the final
     * xor, leaves the constant 0xDEBB20E3 (bit-reversed form 0xC704DD7B), from memory.
     */
    @Test
    void crc32ResidueOfAppendedFrame() {
        byte[] frame = randomBits(new Random(3), 100 + 32);
        Crc.CRC32.append(frame, 0, 100);
        long withXor = Crc.CRC32.ofBits(frame, 0, frame.length);
        assertEquals(0xDEBB20E3L, withXor ^ 0xFFFFFFFFL);
    }

    @Test
    void noneAppendsNothingAndAlwaysPasses() {
        byte[] frame = {1, 0, 1};
        Crc.NONE.append(frame, 0, 3);
        assertTrue(Crc.NONE.check(frame, 0, 3));
        assertEquals(0, Crc.NONE.bits());
    }

    @Test
    void namesAndBadInput() {
        assertEquals(Crc.CRC24, Crc.fromCliName(" CRC24 "));
        assertEquals("none, crc16, crc24, crc32", Crc.choices());
        assertEquals(24, Crc.CRC24.bits());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Crc.fromCliName("crc8"));
        assertEquals("unknown CRC 'crc8'; valid: none, crc16, crc24, crc32", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Crc.CRC32.check(new byte[10], 0, 10));
    }

    public static byte[] randomBits(Random random, int n) {
        byte[] bits = new byte[n];
        for (int i = 0; i < n; i++) {
            bits[i] = (byte) random.nextInt(2);
        }
        return bits;
    }

    /** Bits of bytes, lowest bit first when {@code lsbFirst}, else highest first. */
    private static byte[] unpack(byte[] data, int off, int len, boolean lsbFirst) {
        byte[] bits = new byte[8 * len];
        for (int i = 0; i < 8 * len; i++) {
            int shift = lsbFirst ? i % 8 : 7 - i % 8;
            bits[i] = (byte) ((data[off + i / 8] >>> shift) & 1);
        }
        return bits;
    }

    /** The CRC as a bit-serial register with the catalogue parameters written out again here. */
    private static long serial(Crc crc, byte[] bits, int off, int len) {
        switch (crc) {
            case CRC16:
                return serialDirect(bits, off, len, 16, 0x1021, 0xFFFF);
            case CRC24:
                return serialDirect(bits, off, len, 24, 0x864CFB, 0xB704CE);
            case CRC32:
                long r = 0xFFFFFFFFL;
                for (int i = 0; i < len; i++) {
                    boolean out = ((r ^ bits[off + i]) & 1) != 0;
                    r >>>= 1;
                    if (out) {
                        r ^= 0xEDB88320L;
                    }
                }
                return r ^ 0xFFFFFFFFL;
            default:
                throw new AssertionError(crc);
        }
    }

    private static long serialDirect(byte[] bits, int off, int len, int width, long poly, long init) {
        long top = 1L << (width - 1);
        long mask = (1L << width) - 1;
        long r = init;
        for (int i = 0; i < len; i++) {
            boolean out = ((r & top) != 0) ^ (bits[off + i] != 0);
            r = (r << 1) & mask;
            if (out) {
                r ^= poly;
            }
        }
        return r;
    }
}
