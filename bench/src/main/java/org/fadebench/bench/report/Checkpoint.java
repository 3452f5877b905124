package org.fadebench.bench.report;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.sweep.PointState;

/**
 * The sweep's checkpoint, {@code DIR/checkpoint.json}: the reproducible state of every point
 * (batches merged in order, their counts, finished or not), a fingerprint of every setting that
 * changes the numbers, and a checksum over both. A resumed run continues each point from its merged
 * batches, so it ends with the same results as a run that was never interrupted. The checksum
 * catches a file edited by hand or damaged; the sweep also checks the counts against its settings
 * ({@code SweepEngine.checkpointProblem}).
 */
public final class Checkpoint {

    public static final String FILE_NAME = "checkpoint.json";
    private static final String FORMAT = "fadebench-checkpoint-3";
    private static final ObjectMapper JSON = new ObjectMapper();

    private Checkpoint() {
    }

    /** SHA-256 of a description of every setting that changes the numbers. */
    public static String fingerprint(String settings) {
        try {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            return HexFormat.of().formatHex(md.digest(settings.getBytes(StandardCharsets.UTF_8)));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    public static void write(Path dir, String fingerprint, List<PointState> states) throws IOException {
        ObjectNode root = JSON.createObjectNode();
        root.put("format", FORMAT);
        root.put("fingerprint", fingerprint);
        root.put("checksum", checksum(fingerprint, states));
        ArrayNode points = root.putArray("points");
        for (PointState s : states) {
            FrameCounters c = s.counts();
            ObjectNode p = points.addObject();
            p.put("merged_batches", s.mergedBatches());
            p.put("done", s.done());
            CountsJson.put(p, c);
        }
        byte[] bytes = JSON.writerWithDefaultPrettyPrinter().writeValueAsBytes(root);
        AtomicFiles.write(dir.resolve(FILE_NAME), out -> out.write(bytes));
    }

    /**
     * Reads the checkpoint in {@code dir}, checked against the fingerprint of the current settings.
     *
     * @return the states, or null when there is no checkpoint
     * @throws IllegalArgumentException when the file is damaged or belongs to other settings
     */
    public static List<PointState> read(Path dir, String fingerprint, int points) throws IOException {
        Path file = dir.resolve(FILE_NAME);
        if (!Files.exists(file)) {
            return null;
        }
        String where = file + ": ";
        JsonNode root;
        try {
            if (Files.size(file) > 64L << 20) {
                throw new IllegalArgumentException(where + "too large to be a checkpoint");
            }
            root = JSON.readTree(Files.readAllBytes(file));
        } catch (JsonProcessingException e) {
            throw new IllegalArgumentException(where + "damaged checkpoint (not JSON); delete it or run without --resume");
        }
        if (root == null || !FORMAT.equals(root.path("format").asText())) {
            throw new IllegalArgumentException(where + "not a fadebench checkpoint; delete it or run without --resume");
        }
        if (!fingerprint.equals(root.path("fingerprint").asText())) {
            throw new IllegalArgumentException(where + "written for different settings; --resume needs the same "
                    + "link, SNR points, stop rules and seed (run without --resume to start over)");
        }
        JsonNode list = root.path("points");
        if (!list.isArray() || list.size() != points) {
            throw new IllegalArgumentException(where + "damaged checkpoint (wrong number of points)");
        }
        List<PointState> states = new ArrayList<>();
        for (JsonNode p : list) {
            long merged = whole(p, "merged_batches", where);
            Map<String, Number> counts = new LinkedHashMap<>();
            new FrameCounters().byName().forEach((name, zero) ->
                    counts.put(name, zero instanceof Long ? whole(p, name, where) : real(p, name, where)));
            if (p.has(FrameCounters.FEC_ITERATIONS)) { // written only for a decoder that iterates
                counts.put(FrameCounters.FEC_ITERATIONS, whole(p, FrameCounters.FEC_ITERATIONS, where));
            }
            if (p.has(FrameCounters.FADE_SCALE)) { // written only for frames weighted by importance sampling
                for (String name : FrameCounters.WEIGHT_NAMES) {
                    counts.put(name, real(p, name, where));
                }
            }
            FrameCounters c = FrameCounters.of(counts);
            if (!p.path("done").isBoolean()) {
                throw new IllegalArgumentException(where + "damaged checkpoint (done)");
            }
            states.add(new PointState(merged, c, p.path("done").asBoolean()));
        }
        if (!checksum(fingerprint, states).equals(root.path("checksum").asText())) {
            throw new IllegalArgumentException(where + "damaged or edited checkpoint (its checksum does not match its "
                    + "content); delete it or run without --resume");
        }
        return states;
    }

    /** SHA-256 over the fingerprint and every field of every point, in a fixed text form. */
    private static String checksum(String fingerprint, List<PointState> states) {
        StringBuilder t = new StringBuilder(FORMAT).append('|').append(fingerprint);
        for (PointState s : states) {
            FrameCounters c = s.counts();
            t.append('|').append(s.mergedBatches()).append(',').append(s.done());
            for (Number n : c.byName().values()) {
                t.append(',').append(n);
            }
        }
        return fingerprint(t.toString());
    }

    private static long whole(JsonNode p, String field, String where) {
        JsonNode n = p.path(field);
        if (!n.canConvertToLong() || !n.isIntegralNumber() || n.asLong() < 0) {
            throw new IllegalArgumentException(where + "damaged checkpoint (" + field + ")");
        }
        return n.asLong();
    }

    private static double real(JsonNode p, String field, String where) {
        JsonNode n = p.path(field);
        if (!n.isNumber() || !(n.asDouble() >= 0)) {
            throw new IllegalArgumentException(where + "damaged checkpoint (" + field + ")");
        }
        return n.asDouble();
    }

    public static void delete(Path dir) throws IOException {
        Files.deleteIfExists(dir.resolve(FILE_NAME));
    }
}
