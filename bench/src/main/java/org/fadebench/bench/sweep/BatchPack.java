package org.fadebench.bench.sweep;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.fadebench.bench.link.FrameCounters;

/**
 * A task's batches and their results as one value each, not one serialised object per batch, for
 * executors whose workers run in other processes (the Spark executor). Spark sends a task's data
 * and results through Java serialisation; thousands of small objects a round make its reflective
 * writer and reader hot, and the JIT then spends seconds of a core compiling them (seen in a flight recording of a sweep on {@code local[2]}). Here a task's batch
 * ids travel as one {@code long[]} and its results as one {@code byte[]}, whose contents are the
 * counts of {@link FrameCounters#byName()} (the names and order the checkpoint uses) with every
 * value's exact bits.
 */
public final class BatchPack {

    private static final byte WHOLE = 'L';
    private static final byte REAL = 'D';

    private BatchPack() {
    }

    /** The batch ids as (point, batch) pairs. */
    public static long[] ids(List<BatchId> ids) {
        long[] packed = new long[2 * ids.size()];
        for (int i = 0; i < ids.size(); i++) {
            packed[2 * i] = ids.get(i).point();
            packed[2 * i + 1] = ids.get(i).batch();
        }
        return packed;
    }

    /** Batch {@code i} of {@link #ids(List)}'s array. */
    public static BatchId id(long[] packed, int i) {
        return new BatchId((int) packed[2 * i], packed[2 * i + 1]);
    }

    /** How many batch ids {@link #ids(List)}'s array holds. */
    public static int count(long[] packed) {
        return packed.length / 2;
    }

    /**
     * The results, in order, as bytes that {@link #results(byte[])} reads back exactly. Each count's
     * name is written once, the first time it occurs, and then referred to by its number, so that
     * neither side handles a string per count.
     */
    public static byte[] results(List<BatchResult> results) {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream(128 * results.size() + 64);
        Map<String, Integer> numbers = new HashMap<>();
        try (DataOutputStream out = new DataOutputStream(bytes)) {
            out.writeInt(results.size());
            for (BatchResult r : results) {
                out.writeInt(r.id().point());
                out.writeLong(r.id().batch());
                Map<String, Number> counts = r.counts().byName();
                out.writeInt(counts.size());
                for (Map.Entry<String, Number> e : counts.entrySet()) {
                    Integer number = numbers.get(e.getKey());
                    if (number == null) {
                        out.writeInt(-1);
                        out.writeUTF(e.getKey());
                        numbers.put(e.getKey(), numbers.size());
                    } else {
                        out.writeInt(number);
                    }
                    if (e.getValue() instanceof Double d) {
                        out.writeByte(REAL);
                        out.writeLong(Double.doubleToRawLongBits(d));
                    } else {
                        out.writeByte(WHOLE);
                        out.writeLong(e.getValue().longValue());
                    }
                }
                double[] channels = r.channels();
                out.writeInt(channels.length);
                for (double v : channels) {
                    out.writeLong(Double.doubleToRawLongBits(v));
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return bytes.toByteArray();
    }

    /** The results {@link #results(List)} packed. */
    public static List<BatchResult> results(byte[] packed) {
        try (DataInputStream in = new DataInputStream(new ByteArrayInputStream(packed))) {
            int n = in.readInt();
            List<BatchResult> results = new ArrayList<>(n);
            List<String> names = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                BatchId id = new BatchId(in.readInt(), in.readLong());
                int count = in.readInt();
                Map<String, Number> counts = new LinkedHashMap<>();
                for (int j = 0; j < count; j++) {
                    int number = in.readInt();
                    if (number < 0) {
                        number = names.size();
                        names.add(in.readUTF());
                    }
                    byte kind = in.readByte();
                    long bits = in.readLong();
                    counts.put(names.get(number), kind == REAL ? (Number) Double.longBitsToDouble(bits) : (Number) bits);
                }
                double[] channels = new double[in.readInt()];
                for (int j = 0; j < channels.length; j++) {
                    channels[j] = Double.longBitsToDouble(in.readLong());
                }
                results.add(new BatchResult(id, FrameCounters.of(counts), channels));
            }
            return results;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
