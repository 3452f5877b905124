package org.fadebench.bench.link;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.List;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.BoundSettings;
import org.fadebench.bench.report.ResultsCsv;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.StopRules;
import org.fadebench.bench.sweep.SweepEngine;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.ChannelTrace;
import org.fadebench.channel.Fading;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.fadebench.coding.fec.ldpc.LdpcAlgorithm;
import org.fadebench.coding.fec.ldpc.LdpcCode;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;
import org.fadebench.coding.fec.ldpc.LdpcFamily;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodeFile;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Known-answer tests: the exact counters of short seeded sweeps, one per frame path and channel
 * model, and the bytes of one {@code results.csv}. The literals below pin the output of the code as
 * of the commit that added this test (they were obtained by running it, not from an outside
 * source), the way a random-number library pins its generators' output: any later change of a
 * number must be a deliberate act that updates the pin in the same commit and gives the reason in
 * its message. Refactoring changes none of them.
 *
 * <p>Each row is one SNR point: {frames, frame_errors, bits, bit_errors, symbols, symbol_errors,
 * crc_failures, undetected_errors, Σ (bit errors per frame)²}, and for an LDPC code the decoder's
 * iterations summed over the frames after them (so the mean iterations per point are pinned too).
 * The LDPC cases guard both decoders: the fixed-point lane decoder (normalised and offset min-sum)
 * and the floating-point sum-product decoder. Every sweep runs exactly its frame
 * budget (no minimum error count, no FER floor) over several batches, so the ordered merge of
 * batches is pinned too; one case runs on 1 and 2 threads to pin thread independence.
 */
class KnownAnswerTest {

    private static final long SEED = 20261202L;

    @TempDir
    Path tmp;

    private static long[][] sweep(LinkSettings link, double[] snrDb, long frames, int threads) {
        return sweep(link, snrDb, frames, threads, false);
    }

    /** The rows of a sweep, each ending with the decoder's iteration sum when {@code iterations} is set. */
    private static long[][] sweep(LinkSettings link, double[] snrDb, long frames, int threads, boolean iterations) {
        List<PointResult> results = new SweepEngine(link, new StopRules(0, frames, 0, 0), SEED, threads, 0.95)
                .run(snrDb, p -> { }).results();
        long[][] rows = new long[results.size()][];
        for (int i = 0; i < rows.length; i++) {
            FrameCounters c = results.get(i).counts();
            double squares = c.bitErrorsSquared();
            assertEquals(Math.rint(squares), squares, 0.0, "a sum of integer squares");
            long[] row = {c.frames(), c.frameErrors(), c.bits(), c.bitErrors(), c.symbols(),
                c.symbolErrors(), c.crcFailures(), c.undetectedErrors(), (long) squares, c.fecIterations()};
            rows[i] = iterations ? row : Arrays.copyOf(row, row.length - 1);
        }
        return rows;
    }

    private static void assertPinned(long[][] expected, long[][] actual) {
        assertEquals(Arrays.deepToString(expected), Arrays.deepToString(actual));
    }

    private static LinkSettings uncoded(Modulation m, SpaceTimeCode code, int rx, ChannelSpec channel, int frameBits,
                                        int coherence) {
        return new LinkSettings(m, code, rx, code.transmitAntennas(), channel, frameBits, coherence, Equaliser.MF,
                FrameCoding.NONE);
    }

    private static final ChannelSpec RAYLEIGH = ChannelSpec.of(Fading.RAYLEIGH);

    /** Uncoded Alamouti 2x2 16-QAM: the planar frame path; the same numbers on 1 and 2 threads. */
    @Test
    void alamoutiTwoByTwoQam16PlanarPath() {
        LinkSettings link = uncoded(Modulation.QAM16, SpaceTimeCodes.ALAMOUTI, 2, RAYLEIGH, 256, 0);
        long[][] expected = {
            {1200, 1199, 307200, 27936, 76800, 24556, 0, 0, 839676},
            {1200, 788, 307200, 4244, 76800, 4060, 0, 0, 50598}};
        assertPinned(expected, sweep(link, new double[] {6, 12}, 1200, 1));
        assertPinned(expected, sweep(link, new double[] {6, 12}, 1200, 2));
    }

    /** G4 4x1 QPSK: the general (interleaved) frame path. */
    @Test
    void g4FourByOneQpskGeneralPath() {
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.G4, 1, RAYLEIGH, 256, 0);
        assertPinned(new long[][] {
            {600, 496, 153600, 4449, 76800, 4287, 0, 0, 82665},
            {600, 51, 153600, 132, 76800, 132, 0, 0, 696}}, sweep(link, new double[] {4, 10}, 600, 2));
    }

    /** Alamouti 2x1 QPSK with conv-r12 + crc24, random interleaver, max-log LLRs: the lane decoder. */
    @Test
    void codedAlamoutiLaneDecoder() {
        FrameCoding coding = new FrameCoding(new FecScheme(Crc.CRC24, PuncturedCode.CONV_R12), Interleaving.RANDOM, 0,
                LlrMethod.MAXLOG);
        LinkSettings link = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2, RAYLEIGH, 200, 0,
                Equaliser.MF, coding);
        assertPinned(new long[][] {
            {300, 76, 60000, 4371, 69000, 11760, 78, 0, 341751},
            {300, 20, 60000, 1186, 69000, 4318, 21, 0, 100076}}, sweep(link, new double[] {4, 8}, 300, 2));
    }

    /** An LDPC link: the built-in code {@code family} decoded as {@code decoding}, random interleaver, max-log LLRs. */
    private static LinkSettings ldpc(LdpcFamily family, LdpcDecoding decoding, Crc crc, Modulation m,
                                     SpaceTimeCode code, int rx, ChannelSpec channel, int frameBits, int coherence) {
        FrameCoding coding = new FrameCoding(new FecScheme(crc, LdpcCode.of(family, decoding)), Interleaving.RANDOM, 0,
                LlrMethod.MAXLOG);
        return new LinkSettings(m, code, rx, code.transmitAntennas(), channel, frameBits, coherence, Equaliser.MF,
                coding);
    }

    /**
     * ldpc-r12 + crc24, Alamouti 2x2 16-QAM over quasi-static Rayleigh, 1024-bit payloads: normalised
     * min-sum (α = 13/16, the default) on the fixed-point decoder, 128 lanes; the same numbers on 1 and
     * 2 threads.
     */
    @Test
    void ldpcAlamoutiQam16Crc24Lanes() {
        LinkSettings link = ldpc(LdpcFamily.R12, LdpcDecoding.DEFAULT, Crc.CRC24, Modulation.QAM16,
                SpaceTimeCodes.ALAMOUTI, 2, RAYLEIGH, 1024, 0);
        assertEquals(128, link.lanes());
        long[][] expected = {
            {256, 41, 262144, 6669, 134144, 43268, 41, 0, 1255515, 3049},
            {256, 6, 262144, 846, 134144, 21039, 6, 0, 154178, 879}};
        assertPinned(expected, sweep(link, new double[] {6, 9}, 256, 1, true));
        assertPinned(expected, sweep(link, new double[] {6, 9}, 256, 2, true));
    }

    /** ldpc-r34 without CRC, BPSK over AWGN, 512-bit payloads, around FER 0.4 and 0.07: normalised min-sum. */
    @Test
    void ldpcRate34BpskAwgn() {
        LinkSettings link = ldpc(LdpcFamily.R34, LdpcDecoding.DEFAULT, Crc.NONE, Modulation.BPSK, SpaceTimeCodes.NONE, 1,
                ChannelSpec.of(Fading.NONE), 512, 0);
        assertPinned(new long[][] {
            {512, 227, 262144, 5450, 349696, 19809, 0, 0, 150000, 14048},
            {512, 27, 262144, 614, 349696, 16082, 0, 0, 15202, 3870}}, sweep(link, new double[] {1, 1.5}, 512, 2, true));
    }

    /**
     * ldpc-r23 + crc16, offset min-sum (β = 0.5, the default) at most 20 iterations, QPSK with 1x2
     * combining over Rayleigh blocks of 32 slots (7 per 204-slot frame), 256-bit payloads.
     */
    @Test
    void ldpcOffsetMinSumBlockFading() {
        LinkSettings link = ldpc(LdpcFamily.R23, LdpcDecoding.of(LdpcAlgorithm.OFFSET_MIN_SUM, 20), Crc.CRC16,
                Modulation.QPSK, SpaceTimeCodes.NONE, 2, RAYLEIGH, 256, 32);
        assertPinned(new long[][] {
            {512, 174, 131072, 4026, 104448, 14434, 174, 0, 109476, 4760},
            {512, 10, 131072, 197, 104448, 6580, 10, 0, 4141, 1150}}, sweep(link, new double[] {2, 5}, 512, 2, true));
    }

    /** ldpc-r12, sum-product on the floating-point decoder, BPSK over AWGN, 128-bit payloads. */
    @Test
    void ldpcSumProductAwgn() {
        LinkSettings link = ldpc(LdpcFamily.R12, LdpcDecoding.of(LdpcAlgorithm.SUM_PRODUCT, 50), Crc.NONE,
                Modulation.BPSK, SpaceTimeCodes.NONE, 1, ChannelSpec.of(Fading.NONE), 128, 0);
        assertPinned(new long[][] {
            {256, 60, 32768, 731, 65536, 7804, 0, 0, 10575, 4161},
            {256, 15, 32768, 171, 65536, 6755, 0, 0, 2639, 1867}}, sweep(link, new double[] {-1.5, -1}, 256, 2, true));
    }

    /** Rician K = 3 with exponential transmit and receive correlation, Alamouti 2x2 QPSK. */
    @Test
    void ricianWithCorrelation() {
        ChannelSpec channel = ChannelSpec.of(Fading.RICIAN).withKFactor(3).withTxCorr(0.5).withRxCorr(0.3);
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, channel, 256, 32);
        assertPinned(new long[][] {
            {600, 599, 153600, 8471, 76800, 8062, 0, 0, 146231},
            {600, 223, 153600, 453, 76800, 445, 0, 0, 1653}}, sweep(link, new double[] {2, 8}, 600, 2));
    }

    /** Rayleigh with Doppler f_D·T_s = 0.01: a channel that ages slot by slot. */
    @Test
    void doppler() {
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, RAYLEIGH.withDoppler(0.01), 256, 32);
        assertPinned(new long[][] {
            {600, 600, 153600, 36201, 76800, 28789, 0, 0, 2506317},
            {600, 600, 153600, 27809, 76800, 21284, 0, 0, 1623283}}, sweep(link, new double[] {5, 15}, 600, 2));
    }

    /** Least-squares CSI from 2 pilot slots per fading block. */
    @Test
    void pilots() {
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, RAYLEIGH.withPilots(2), 256, 32);
        assertPinned(new long[][] {
            {600, 600, 153600, 18272, 76800, 16967, 0, 0, 647698},
            {600, 428, 153600, 1971, 76800, 1913, 0, 0, 18155}}, sweep(link, new double[] {3, 9}, 600, 2));
    }

    /** Noisy CSI, Ĥ = H + CN(0, 0.05). */
    @Test
    void csiError() {
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, RAYLEIGH.withCsiError(0.05), 256, 32);
        assertPinned(new long[][] {
            {600, 598, 153600, 7644, 76800, 7299, 0, 0, 125074},
            {600, 285, 153600, 790, 76800, 777, 0, 0, 4486}}, sweep(link, new double[] {3, 9}, 600, 2));
    }

    /** Nakagami m = 2, 1x2 BPSK. */
    @Test
    void nakagami() {
        ChannelSpec channel = ChannelSpec.of(Fading.NAKAGAMI).withNakagamiM(2);
        LinkSettings link = uncoded(Modulation.BPSK, SpaceTimeCodes.NONE, 2, channel, 256, 16);
        assertPinned(new long[][] {
            {600, 600, 153600, 6094, 153600, 6094, 0, 0, 71362},
            {600, 205, 153600, 286, 153600, 286, 0, 0, 518}}, sweep(link, new double[] {0, 6}, 600, 2));
    }

    /** No fading (AWGN, h = 1), 1x1 16-QAM. */
    @Test
    void noFading() {
        LinkSettings link = uncoded(Modulation.QAM16, SpaceTimeCodes.NONE, 1, ChannelSpec.of(Fading.NONE), 256, 0);
        assertPinned(new long[][] {
            {600, 600, 153600, 15097, 38400, 13588, 0, 0, 391757},
            {600, 600, 153600, 4298, 38400, 4192, 0, 0, 35188}}, sweep(link, new double[] {8, 12}, 600, 2));
    }

    /** A trace file of 5 matrices (2x2) written by the test in the CSV layout, replayed by block number. */
    @Test
    void trace() throws IOException {
        StringBuilder csv = new StringBuilder("# fadebench channel trace\n2,2\n");
        for (int m = 0; m < 5; m++) {
            for (int k = 0; k < 8; k++) {
                csv.append(k == 0 ? "" : ",").append(((m * 8 + k) * 37 % 17 - 8) / 8.0);
            }
            csv.append('\n');
        }
        Path file = tmp.resolve("five.csv");
        Files.writeString(file, csv, StandardCharsets.US_ASCII);
        ChannelSpec channel = RAYLEIGH.withTrace(ChannelTrace.read(file));
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, channel, 256, 32);
        assertPinned(new long[][] {
            {600, 600, 153600, 17150, 76800, 16175, 0, 0, 508028},
            {600, 509, 153600, 1271, 76800, 1262, 0, 0, 4117}}, sweep(link, new double[] {0, 6}, 600, 2));
    }

    /** A code file: two-antenna spatial multiplexing (not orthogonal), MMSE decoder, 2x2 QPSK. */
    @Test
    void codeFile() {
        SpaceTimeCode sm2 = SpaceTimeCodeFile.parse("""
                name: sm2
                tx: 2
                slots: 1
                symbols:
                  - real:
                      - [1, 0]
                    imag:
                      - ["j", 0]
                  - real:
                      - [0, 1]
                    imag:
                      - [0, "j"]
                """, "sm2.yaml");
        LinkSettings link = new LinkSettings(Modulation.QPSK, sm2, 2, 2, RAYLEIGH, 256, 0, Equaliser.MMSE,
                FrameCoding.NONE);
        assertPinned(new long[][] {
            {600, 596, 153600, 15596, 76800, 14303, 0, 0, 541524},
            {600, 340, 153600, 3845, 76800, 3597, 0, 0, 94669}}, sweep(link, new double[] {6, 14}, 600, 2));
    }

    /**
     * The bytes of {@code results.csv} for one seeded run (Alamouti 2x1 QPSK, closed-form bounds),
     * written through {@link ResultsCsv}. The comment lines and the header are wording that later
     * work may change on purpose; such a change updates this pin in the same commit. (Last: the column
     * fec_iterations_mean added, empty for this uncoded link; every number the same.)
     */
    @Test
    void resultsCsvBytes() throws NoSuchAlgorithmException {
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, RAYLEIGH, 256, 0);
        double[] snr = {0, 5, 10};
        List<PointResult> results = new SweepEngine(link, new StopRules(0, 700, 0, 0), SEED, 2, 0.95)
                .run(snr, p -> { }).results();
        String text = ResultsCsv.text(link, SEED, 0.95, results, false,
                BoundCurves.compute(BoundSettings.of(link), snr));
        String sha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
                .digest(text.getBytes(StandardCharsets.UTF_8)));
        assertEquals("e364c9184f0dbd911ab7205c30243bb7de4902c974c32da2eb8b5760fa9ec3bd", sha, text);
    }
}
