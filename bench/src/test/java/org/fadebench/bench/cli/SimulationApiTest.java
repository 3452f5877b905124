package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.fadebench.bench.run.Simulation;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.SweepEngine;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The Java entry point gives the numbers {@code run} writes for the same settings and seed. */
class SimulationApiTest {

    @TempDir
    Path tmp;

    @Test
    void javaEntryPointGivesTheRunsNumbers() throws IOException {
        List<SweepEngine.Progress> seen = new ArrayList<>();
        Simulation.Result r = Simulation.of(Map.of("link.code", "alamouti", "rx", 2, "link.frame_bits", 128,
                "sweep.snr_db", List.of(0, 6, 12), "sweep.min_errors", 30, "sweep.seed", 5, "sweep.threads", 2,
                "analysis.target_fer", 0.1))
                .run(seen::add);
        assertTrue(!seen.isEmpty() && seen.get(0).points() == 3, "progress reported");

        Path dir = tmp.resolve("cli");
        CliTest.Outcome o = CliTest.run("run", "--code", "alamouti", "--rx", "2", "--frame-bits", "128", "--snr", "0,6,12",
                "--min-errors", "30", "--seed", "5", "--threads", "1", "--target-fer", "0.1", "--quiet", "--out", dir.toString());
        assertEquals(0, o.code(), o.err());
        JsonNode results = new ObjectMapper().readTree(dir.resolve("results.json").toFile());
        assertEquals(3, r.points().size());
        for (int i = 0; i < 3; i++) {
            PointResult p = r.points().get(i);
            JsonNode q = results.path("points").get(i);
            assertEquals(q.path("snr_db").asDouble(), p.snrDb(), 0.0);
            assertEquals(q.path("frames").asLong(), p.counts().frames());
            assertEquals(q.path("frame_errors").asLong(), p.counts().frameErrors());
            assertEquals(q.path("bit_errors").asLong(), p.counts().bitErrors());
        }
        assertEquals(results.path("summary").path("snr_db_at_target").asDouble(),
                r.summary().snrDbAtTarget().getAsDouble(), 0.0);
        assertTrue(r.bounds() != null, "Alamouti over Rayleigh block fading has outage bounds");
    }

    @Test
    void unknownKeysAreNamed() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Simulation.of(Map.of("link.rxx", 2)));
        assertEquals("unknown setting 'link.rxx' (did you mean 'link.rx'?); give a scenario key, e.g. link.rx",
                e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Simulation.of(Map.of("rx", 0)));
        assertTrue(e.getMessage().startsWith("link.rx: "), e.getMessage());
    }
}
