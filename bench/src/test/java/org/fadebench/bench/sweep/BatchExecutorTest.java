package org.fadebench.bench.sweep;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import org.fadebench.bench.link.FrameCoding;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.link.LdpcTestCode;
import org.fadebench.bench.link.LinkSettings;
import org.fadebench.channel.ChannelSpec;
import org.fadebench.channel.ChannelTrace;
import org.fadebench.channel.Fading;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.ChannelCodes;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.FecScheme;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.fec.conv.PuncturedCode;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.junit.jupiter.api.Test;

/**
 * The recipe "a batch executor" of DEVELOPERS.md, followed: an executor written here, outside the
 * sweep's code, plugs into {@link SweepEngine} and gives the thread pool's numbers exactly.
 *
 * <p>It behaves like a small cluster: it takes a few wanted batches at a time, sends the plan and
 * every result through Java serialisation (as a remote worker would receive and return them),
 * computes the batches in reverse order on one thread, and hands them back.
 */
class BatchExecutorTest {

    /** Takes up to {@code window} batches, computes them last first from a serialised plan. */
    private static final class ReverseOrderExecutor implements BatchExecutor {
        private final int window;

        ReverseOrderExecutor(int window) {
            this.window = window;
        }

        @Override
        public void execute(SweepPlan plan, Feed feed) {
            BatchWorker worker = new BatchWorker((SweepPlan) roundTrip(plan));
            List<BatchId> taken = new ArrayList<>();
            do {
                taken.clear();
                BatchId id;
                while (taken.size() < window && (id = feed.next()) != null) {
                    taken.add(id);
                }
                for (int i = taken.size() - 1; i >= 0; i--) {
                    feed.done((BatchResult) roundTrip(worker.compute(taken.get(i))));
                }
            } while (!taken.isEmpty());
        }
    }

    private static Object roundTrip(Object value) {
        try {
            ByteArrayOutputStream bytes = new ByteArrayOutputStream();
            try (ObjectOutputStream out = new ObjectOutputStream(bytes)) {
                out.writeObject(value);
            }
            try (ObjectInputStream in = new ObjectInputStream(new ByteArrayInputStream(bytes.toByteArray()))) {
                return in.readObject();
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (ClassNotFoundException e) {
            throw new IllegalStateException(e);
        }
    }

    private static SweepOutcome run(LinkSettings link, StopRules rules, double[] snrDb, BatchExecutor executor) {
        SweepEngine engine = new SweepEngine(link, rules, 31, executor, 0.95);
        engine.recordChannels(700);
        return engine.run(snrDb, p -> { });
    }

    private static void assertSameOutcome(LinkSettings link, StopRules rules, double[] snrDb) {
        SweepOutcome threads = run(link, rules, snrDb, new LocalThreadExecutor(2));
        SweepOutcome reverse = run(link, rules, snrDb, new ReverseOrderExecutor(5));
        assertEquals(threads.results().size(), reverse.results().size(), link.describe());
        for (int i = 0; i < threads.results().size(); i++) {
            FrameCounters a = threads.results().get(i).counts();
            FrameCounters b = reverse.results().get(i).counts();
            String what = link.describe() + ", point " + i;
            assertEquals(a.frames(), b.frames(), what);
            assertEquals(a.frameErrors(), b.frameErrors(), what);
            assertEquals(a.bits(), b.bits(), what);
            assertEquals(a.bitErrors(), b.bitErrors(), what);
            assertEquals(a.symbolErrors(), b.symbolErrors(), what);
            assertEquals(a.bitErrorsSquared(), b.bitErrorsSquared(), 0.0, what);
            assertEquals(a.crcFailures(), b.crcFailures(), what);
            assertEquals(a.undetectedErrors(), b.undetectedErrors(), what);
        }
        assertEquals(threads.stopReason(), reverse.stopReason());
        assertEquals(threads.states().size(), reverse.states().size());
        for (int i = 0; i < threads.states().size(); i++) {
            assertEquals(threads.states().get(i).mergedBatches(), reverse.states().get(i).mergedBatches());
        }
        assertTrue(threads.recordedChannels().length > 0);
        assertArrayEquals(threads.recordedChannels(), reverse.recordedChannels());
    }

    /** Uncoded Alamouti 2x2 16-QAM (planar path), stopped by min-errors so batches beyond the stop are discarded. */
    @Test
    void uncodedPlanarLink() {
        LinkSettings link = new LinkSettings(Modulation.QAM16, SpaceTimeCodes.ALAMOUTI, 2, 2, Fading.RAYLEIGH, 256, 0);
        assertSameOutcome(link, new StopRules(40, 1_000_000), new double[] {6, 12, 18});
    }

    /** Coded Alamouti 2x1 QPSK over correlated Rician fading with pilots, several blocks per frame. */
    @Test
    void codedLinkOverCorrelatedRicianFading() {
        ChannelSpec channel = ChannelSpec.of(Fading.RICIAN).withKFactor(3).withTxCorr(0.5).withPilots(2);
        LinkSettings link = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2, channel, 256, 32,
                Equaliser.MF, new FrameCoding(new FecScheme(Crc.CRC16, PuncturedCode.CONV_R12), Interleaving.RANDOM, 0,
                        LlrMethod.MAXLOG));
        assertSameOutcome(link, new StopRules(20, 3000, 0, 0), new double[] {2, 6});
    }

    /**
     * A plan survives serialisation whatever its link holds (each channel model, a trace, CSI
     * settings, a channel code): the copy computes the same batch, bit for bit.
     */
    @Test
    void everyKindOfPlanSurvivesSerialisation() {
        ChannelTrace trace = ChannelTrace.of("ones", 1, 2, new double[] {1, 0, 0, 1, 0.5, 0.5, -1, 0});
        ChannelSpec[] channels = {
            ChannelSpec.of(Fading.RAYLEIGH).withRxCorr(0.4).withDoppler(0.01),
            ChannelSpec.of(Fading.NAKAGAMI).withNakagamiM(2).withCsiError(0.1),
            ChannelSpec.of(Fading.NONE),
            ChannelSpec.of(Fading.RAYLEIGH).withTrace(trace),
        };
        for (ChannelSpec channel : channels) {
            assertPlanSurvivesSerialisation(new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2, channel, 256,
                    0, Equaliser.MF, new FrameCoding(new FecScheme(Crc.CRC24, PuncturedCode.CONV_R12),
                            Interleaving.RANDOM, 0, LlrMethod.MAXLOG)));
        }
        ChannelCode[] ldpc = {LdpcTestCode.code(LdpcDecoding.DEFAULT), ChannelCodes.standard().find("ldpc-r23")};
        for (ChannelCode code : ldpc) {
            int payload = code.minInfoBits() == code.maxInfoBits() ? code.minInfoBits() - 24 : 256;
            assertPlanSurvivesSerialisation(new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2,
                    ChannelSpec.of(Fading.RAYLEIGH), payload, 0, Equaliser.MF, new FrameCoding(new FecScheme(Crc.CRC24,
                            code), Interleaving.RANDOM, 0, LlrMethod.MAXLOG)));
        }
    }

    private static void assertPlanSurvivesSerialisation(LinkSettings link) {
        SweepPlan plan = new SweepPlan(link, new double[] {4, 8}, new StopRules(0, 500), 3, 50);
        SweepPlan copy = (SweepPlan) roundTrip(plan);
        assertEquals(plan.toString(), copy.toString());
        for (BatchId id : new BatchId[] {new BatchId(0, 0), new BatchId(1, 1)}) {
            BatchResult a = new BatchWorker(plan).compute(id);
            BatchResult b = new BatchWorker(copy).compute(id);
            assertEquals(a.counts().bitErrors(), b.counts().bitErrors(), link.describe());
            assertEquals(a.counts().frameErrors(), b.counts().frameErrors(), link.describe());
            assertEquals(a.counts().bitErrorsSquared(), b.counts().bitErrorsSquared(), 0.0, link.describe());
            assertEquals(a.counts().fecIterations(), b.counts().fecIterations(), link.describe());
            assertArrayEquals(a.channels(), b.channels(), link.describe());
        }
    }

    /** An executor that stops taking batches before the sweep is over is an error, not a short result. */
    @Test
    void anExecutorThatDropsBatchesIsCaught() {
        LinkSettings link = new LinkSettings(Modulation.QPSK, SpaceTimeCodes.ALAMOUTI, 1, 2, Fading.RAYLEIGH, 256, 0);
        BatchExecutor lazy = (plan, feed) -> feed.done(new BatchWorker(plan).compute(feed.next()));
        IllegalStateException e = assertThrows(IllegalStateException.class,
                () -> new SweepEngine(link, new StopRules(0, 2000), 1, lazy, 0.95).run(new double[] {5}, p -> { }));
        assertTrue(e.getMessage().contains("before the sweep was finished"), e.getMessage());
    }
}
