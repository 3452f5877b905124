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
            {1200, 1200, 307200, 27730, 76800, 24332, 0, 0, 824152},
            {1200, 805, 307200, 4295, 76800, 4116, 0, 0, 52221}};
        assertPinned(expected, sweep(link, new double[] {6, 12}, 1200, 1));
        assertPinned(expected, sweep(link, new double[] {6, 12}, 1200, 2));
    }

    /** G4 4x1 QPSK: the general (interleaved) frame path. */
    @Test
    void g4FourByOneQpskGeneralPath() {
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.G4, 1, RAYLEIGH, 256, 0);
        assertPinned(new long[][] {
            {600, 493, 153600, 4624, 76800, 4445, 0, 0, 89782},
            {600, 47, 153600, 136, 76800, 134, 0, 0, 832}}, sweep(link, new double[] {4, 10}, 600, 2));
    }

    /** Alamouti 2x1 QPSK with conv-r12 + crc24, random interleaver, max-log LLRs: the lane decoder. */
    @Test
    void codedAlamoutiLaneDecoder() {
        FrameCoding coding = new FrameCoding(new FecScheme(Crc.CRC24, PuncturedCode.CONV_R12), Interleaving.RANDOM, 0,
                LlrMethod.MAXLOG);
        LinkSettings link = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2, RAYLEIGH, 200, 0,
                Equaliser.MF, coding);
        assertPinned(new long[][] {
            {300, 83, 60000, 4406, 69000, 11901, 84, 0, 334580},
            {300, 22, 60000, 1082, 69000, 4384, 22, 0, 81362}}, sweep(link, new double[] {4, 8}, 300, 2));
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
            {256, 40, 262144, 6539, 134144, 43235, 40, 0, 1249865, 2966},
            {256, 4, 262144, 719, 134144, 20941, 4, 0, 149575, 820}};
        assertPinned(expected, sweep(link, new double[] {6, 9}, 256, 1, true));
        assertPinned(expected, sweep(link, new double[] {6, 9}, 256, 2, true));
    }

    /** ldpc-r34 without CRC, BPSK over AWGN, 512-bit payloads, around FER 0.4 and 0.07: normalised min-sum. */
    @Test
    void ldpcRate34BpskAwgn() {
        LinkSettings link = ldpc(LdpcFamily.R34, LdpcDecoding.DEFAULT, Crc.NONE, Modulation.BPSK, SpaceTimeCodes.NONE, 1,
                ChannelSpec.of(Fading.NONE), 512, 0);
        assertPinned(new long[][] {
            {512, 206, 262144, 5058, 349696, 19690, 0, 0, 141544, 12786},
            {512, 37, 262144, 699, 349696, 15963, 0, 0, 15355, 4156}}, sweep(link, new double[] {1, 1.5}, 512, 2, true));
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
            {512, 172, 131072, 3926, 104448, 14311, 172, 0, 105266, 4663},
            {512, 8, 131072, 156, 104448, 6576, 9, 0, 3408, 1097}}, sweep(link, new double[] {2, 5}, 512, 2, true));
    }

    /** ldpc-r12, sum-product on the floating-point decoder, BPSK over AWGN, 128-bit payloads. */
    @Test
    void ldpcSumProductAwgn() {
        LinkSettings link = ldpc(LdpcFamily.R12, LdpcDecoding.of(LdpcAlgorithm.SUM_PRODUCT, 50), Crc.NONE,
                Modulation.BPSK, SpaceTimeCodes.NONE, 1, ChannelSpec.of(Fading.NONE), 128, 0);
        assertPinned(new long[][] {
            {256, 48, 32768, 645, 65536, 7711, 0, 0, 11197, 3604},
            {256, 4, 32768, 54, 65536, 6627, 0, 0, 758, 1405}}, sweep(link, new double[] {-1.5, -1}, 256, 2, true));
    }

    /** Rician K = 3 with exponential transmit and receive correlation, Alamouti 2x2 QPSK. */
    @Test
    void ricianWithCorrelation() {
        ChannelSpec channel = ChannelSpec.of(Fading.RICIAN).withKFactor(3).withTxCorr(0.5).withRxCorr(0.3);
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, channel, 256, 32);
        assertPinned(new long[][] {
            {600, 600, 153600, 8486, 76800, 8104, 0, 0, 149346},
            {600, 215, 153600, 415, 76800, 409, 0, 0, 1351}}, sweep(link, new double[] {2, 8}, 600, 2));
    }

    /** Rayleigh with Doppler f_D·T_s = 0.01: a channel that ages slot by slot. */
    @Test
    void doppler() {
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, RAYLEIGH.withDoppler(0.01), 256, 32);
        assertPinned(new long[][] {
            {600, 600, 153600, 36239, 76800, 28832, 0, 0, 2499951},
            {600, 598, 153600, 27717, 76800, 21214, 0, 0, 1615133}}, sweep(link, new double[] {5, 15}, 600, 2));
    }

    /** Least-squares CSI from 2 pilot slots per fading block. */
    @Test
    void pilots() {
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, RAYLEIGH.withPilots(2), 256, 32);
        assertPinned(new long[][] {
            {600, 600, 153600, 18244, 76800, 16950, 0, 0, 641784},
            {600, 427, 153600, 1927, 76800, 1877, 0, 0, 16231}}, sweep(link, new double[] {3, 9}, 600, 2));
    }

    /** Noisy CSI, Ĥ = H + CN(0, 0.05). */
    @Test
    void csiError() {
        LinkSettings link = uncoded(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 2, RAYLEIGH.withCsiError(0.05), 256, 32);
        assertPinned(new long[][] {
            {600, 599, 153600, 7706, 76800, 7368, 0, 0, 126356},
            {600, 293, 153600, 812, 76800, 799, 0, 0, 4444}}, sweep(link, new double[] {3, 9}, 600, 2));
    }

    /** Nakagami m = 2, 1x2 BPSK. */
    @Test
    void nakagami() {
        ChannelSpec channel = ChannelSpec.of(Fading.NAKAGAMI).withNakagamiM(2);
        LinkSettings link = uncoded(Modulation.BPSK, SpaceTimeCodes.NONE, 2, channel, 256, 16);
        assertPinned(new long[][] {
            {600, 600, 153600, 6196, 153600, 6196, 0, 0, 73456},
            {600, 200, 153600, 280, 153600, 280, 0, 0, 484}}, sweep(link, new double[] {0, 6}, 600, 2));
    }

    /** No fading (AWGN, h = 1), 1x1 16-QAM. */
    @Test
    void noFading() {
        LinkSettings link = uncoded(Modulation.QAM16, SpaceTimeCodes.NONE, 1, ChannelSpec.of(Fading.NONE), 256, 0);
        assertPinned(new long[][] {
            {600, 600, 153600, 15066, 38400, 13552, 0, 0, 390526},
            {600, 599, 153600, 4340, 38400, 4206, 0, 0, 35776}}, sweep(link, new double[] {8, 12}, 600, 2));
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
            {600, 600, 153600, 17033, 76800, 16053, 0, 0, 500157},
            {600, 533, 153600, 1359, 76800, 1352, 0, 0, 4421}}, sweep(link, new double[] {0, 6}, 600, 2));
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
            {600, 598, 153600, 15761, 76800, 14413, 0, 0, 556319},
            {600, 339, 153600, 3922, 76800, 3684, 0, 0, 96820}}, sweep(link, new double[] {6, 14}, 600, 2));
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
        assertEquals("c7d373cba836854039e77f026bd8baf12e044d806bce4560f1fa60ed9e39e9d8", sha, text);
    }
}
