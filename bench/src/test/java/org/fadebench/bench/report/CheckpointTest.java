package org.fadebench.bench.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.fadebench.bench.link.FrameCounters;
import org.fadebench.bench.sweep.PointState;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** checkpoint.json: every count read back as written, and the file pinned byte for byte. */
class CheckpointTest {

    @TempDir
    Path dir;

    private static final List<PointState> STATES = List.of(
            new PointState(3, FrameCounters.of(768, 41, 98_304, 1_234, 49_152, 1_001, 91_337.0, 40, 1), false),
            new PointState(7, FrameCounters.of(1_792, 2, 229_376, 9, 114_688, 8, 45.0, 2, 0), true));

    /**
     * The file this version writes for fixed states, pinned when the counts' names and the checksum
     * were first written out by hand (a checkpoint written then still resumes now).
     */
    @Test
    void fileIsPinned() throws Exception {
        Checkpoint.write(dir, "fp", STATES);
        String text = Files.readString(dir.resolve(Checkpoint.FILE_NAME));
        assertEquals(PINNED, text.replace("\r\n", "\n"));
    }

    @Test
    void everyCountReadsBack() throws Exception {
        Checkpoint.write(dir, "fp", STATES);
        List<PointState> back = Checkpoint.read(dir, "fp", 2);
        for (int i = 0; i < STATES.size(); i++) {
            assertEquals(STATES.get(i).counts().byName(), back.get(i).counts().byName());
            assertEquals(STATES.get(i).mergedBatches(), back.get(i).mergedBatches());
            assertEquals(STATES.get(i).done(), back.get(i).done());
        }
    }

    /**
     * A point estimated by importance sampling keeps its fade scale and weighted sums (written only
     * there) and reads them back exactly, so that a resumed run merges on from the same sums.
     */
    @Test
    void weightedSumsReadBack() throws Exception {
        FrameCounters weighted = new FrameCounters();
        weighted.fadeScale(0.0123);
        weighted.addFrame(128, 3, 64, 2);
        weighted.addWeight(1.7e-5, 0.04, 3, 2);
        weighted.addFrame(128, 0, 64, 0);
        weighted.addWeight(0.31, 0.9, 0, 0);
        List<PointState> states = List.of(new PointState(1, weighted, true), STATES.get(1));
        Checkpoint.write(dir, "fp", states);
        List<PointState> back = Checkpoint.read(dir, "fp", 2);
        assertEquals(weighted.byName(), back.get(0).counts().byName());
        assertTrue(back.get(0).counts().weighted());
        assertEquals(1.7e-5 / 2, back.get(0).counts().fer(), 0.0);
        assertEquals(STATES.get(1).counts().byName(), back.get(1).counts().byName());
    }

    /**
     * A point of an iterating decoder also keeps its iterations' sum, written only there, so that
     * the pinned file above (no decoder that iterates) and older checkpoints read as before.
     */
    @Test
    void iterationsAreKeptWhereThereAreAny() throws Exception {
        java.util.Map<String, Number> counts = new java.util.LinkedHashMap<>(STATES.get(0).counts().byName());
        counts.put(FrameCounters.FEC_ITERATIONS, 4321L);
        List<PointState> states = List.of(new PointState(3, FrameCounters.of(counts), false), STATES.get(1));
        Checkpoint.write(dir, "fp", states);
        String text = Files.readString(dir.resolve(Checkpoint.FILE_NAME));
        assertEquals(1, text.split("\"fec_iterations_sum\" : 4321", -1).length - 1, text);
        List<PointState> back = Checkpoint.read(dir, "fp", 2);
        assertEquals(4321L, back.get(0).counts().fecIterations());
        assertEquals(0L, back.get(1).counts().fecIterations());
        Files.writeString(dir.resolve(Checkpoint.FILE_NAME), text.replace(": 4321", ": 4322"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Checkpoint.read(dir, "fp", 2));
        assertTrue(e.getMessage().contains("its checksum does not match"), e.getMessage());
    }

    @Test
    void aDamagedCountIsNamed() throws Exception {
        Checkpoint.write(dir, "fp", STATES);
        Path file = dir.resolve(Checkpoint.FILE_NAME);
        Files.writeString(file, Files.readString(file).replace("\"bit_errors_squared\" : 45.0", "\"bit_errors_squared\" : -1"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Checkpoint.read(dir, "fp", 2));
        assertTrue(e.getMessage().contains("damaged checkpoint (bit_errors_squared)"), e.getMessage());
    }

    private static final String PINNED = """
            {
              "format" : "fadebench-checkpoint-3",
              "fingerprint" : "fp",
              "checksum" : "5a36448f0487022b190e1c73ef56d61984468d50dcea43f08e50ef30bef2aa1e",
              "points" : [ {
                "merged_batches" : 3,
                "done" : false,
                "frames" : 768,
                "frame_errors" : 41,
                "bits" : 98304,
                "bit_errors" : 1234,
                "symbols" : 49152,
                "symbol_errors" : 1001,
                "bit_errors_squared" : 91337.0,
                "crc_failures" : 40,
                "undetected_errors" : 1
              }, {
                "merged_batches" : 7,
                "done" : true,
                "frames" : 1792,
                "frame_errors" : 2,
                "bits" : 229376,
                "bit_errors" : 9,
                "symbols" : 114688,
                "symbol_errors" : 8,
                "bit_errors_squared" : 45.0,
                "crc_failures" : 2,
                "undetected_errors" : 0
              } ]
            }""";
}
