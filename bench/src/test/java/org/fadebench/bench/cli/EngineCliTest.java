package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code --engine}: the main jar has no Spark, so {@code --engine spark} is refused in one line
 * that says which jar to use, before anything is written; the Spark settings go only with it.
 * (The Spark engine itself is tested in the module bench/spark.)
 */
class EngineCliTest {

    @TempDir
    Path tmp;

    @Test
    void sparkWithoutSparkOnTheClasspathIsRefused() {
        Path out = tmp.resolve("out");
        CliTest.Outcome o = CliTest.run("run", "--snr", "0", "--max-frames", "100", "--engine", "spark",
                "--spark-master", "local[2]", "--out", out.toString());
        assertEquals(2, o.code(), o.err());
        assertEquals("fadebench run: --engine spark: Apache Spark is not on the classpath of this jar; run "
                + "bench/target/fadebench-spark-local.jar (built by 'mvn -q -Pspark package -DskipTests'), or "
                + "bench/target/fadebench-spark.jar through spark-submit; or use --engine local", o.err().trim());
        assertFalse(Files.exists(out), "nothing written");
    }

    @Test
    void engineNamesAndSparkSettingsAreChecked() {
        CliTest.Outcome unknown = CliTest.run("run", "--engine", "cluster", "--out", tmp.resolve("a").toString());
        assertEquals(2, unknown.code());
        assertEquals("fadebench run: --engine: unknown engine 'cluster'; valid: local, spark", unknown.err().trim());
        CliTest.Outcome stray = CliTest.run("run", "--spark-master", "local[2]", "--out", tmp.resolve("b").toString());
        assertEquals(2, stray.code());
        assertEquals("fadebench run: --spark-master goes with --engine spark; --engine is local", stray.err().trim());
        CliTest.Outcome tasks = CliTest.run("run", "--engine", "spark", "--spark-tasks-per-round", "0", "--out",
                tmp.resolve("c").toString());
        assertEquals(2, tasks.code());
        assertEquals("fadebench run: --spark-tasks-per-round must be between 1 and 1000000, got 0",
                tasks.err().trim());
        assertTrue(!Files.exists(tmp.resolve("a")) && !Files.exists(tmp.resolve("b")) && !Files.exists(tmp.resolve("c")));
    }
}
