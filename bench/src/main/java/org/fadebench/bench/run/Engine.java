package org.fadebench.bench.run;

import static org.fadebench.bench.settings.RunSettings.ENGINE;
import static org.fadebench.bench.settings.RunSettings.SPARK_MASTER;
import static org.fadebench.bench.settings.RunSettings.SPARK_TASKS;

import java.lang.reflect.InvocationTargetException;
import java.util.List;
import org.fadebench.bench.settings.InvalidSettingException;
import org.fadebench.bench.settings.Setting;
import org.fadebench.bench.settings.SettingValues;
import org.fadebench.bench.sweep.BatchExecutor;
import org.fadebench.bench.sweep.LocalThreadExecutor;
import org.fadebench.modem.NamedChoice;

/**
 * Who computes a run's batches: this machine's threads ({@code --engine local}), or Apache Spark
 * ({@code --engine spark}). The Spark executor lives in the module {@code bench/spark}, built only
 * with {@code -Pspark}; it is found by name when asked for, so that nothing else needs Spark.
 *
 * @param kind          local or spark
 * @param sparkMaster   the Spark master URL, or null for spark-submit's
 * @param tasksPerRound Spark tasks per round, or 0 for the executor's default
 */
public record Engine(Kind kind, String sparkMaster, int tasksPerRound) {

    /** The Spark executor, in the module {@code bench/spark}. */
    static final String SPARK_EXECUTOR = "org.fadebench.bench.spark.SparkExecutor";

    /** The engines by name. */
    public enum Kind implements NamedChoice {
        LOCAL("local"), SPARK("spark");

        private final String cliName;

        Kind(String cliName) {
            this.cliName = cliName;
        }

        @Override
        public String cliName() {
            return cliName;
        }
    }

    /** The engine the values name; the Spark settings are refused with the local engine. */
    public static Engine from(SettingValues v) {
        Kind kind = RunPlan.parse(ENGINE, () -> NamedChoice.find(Kind.values(), v.text(ENGINE), "engine"));
        if (kind == Kind.LOCAL) {
            for (Setting s : List.of(SPARK_MASTER, SPARK_TASKS)) {
                if (v.isSet(s)) {
                    throw new InvalidSettingException(s, "goes with --engine spark; --engine is local");
                }
            }
            return new Engine(kind, null, 0);
        }
        int tasks = v.isSet(SPARK_TASKS) ? v.integer(SPARK_TASKS) : 0;
        if (v.isSet(SPARK_TASKS) && (tasks < 1 || tasks > 1_000_000)) {
            throw new InvalidSettingException(SPARK_TASKS, "must be between 1 and 1000000, got " + tasks);
        }
        String master = v.isSet(SPARK_MASTER) ? v.text(SPARK_MASTER).trim() : null;
        if (master != null && master.isEmpty()) {
            throw new InvalidSettingException(SPARK_MASTER, "needs a URL such as local[2] or spark://HOST:7077, got "
                    + "nothing");
        }
        return new Engine(kind, master, tasks);
    }

    /**
     * Starts the executor: a thread pool of {@code threads}, or a Spark application (which the
     * caller closes).
     *
     * @throws IllegalArgumentException when Spark is missing, the master cannot be used or its
     *                                  workers run another fadebench (message starts with the option)
     */
    public BatchExecutor start(int threads) {
        if (kind == Kind.LOCAL) {
            return new LocalThreadExecutor(threads);
        }
        Class<?> spark;
        try {
            spark = Class.forName(SPARK_EXECUTOR);
        } catch (ClassNotFoundException | LinkageError e) {
            throw noSpark();
        }
        try {
            return (BatchExecutor) spark.getMethod("start", String.class, int.class).invoke(null, sparkMaster,
                    tasksPerRound);
        } catch (InvocationTargetException e) {
            if (e.getCause() instanceof NoClassDefFoundError) {
                throw noSpark();
            }
            if (e.getCause() instanceof RuntimeException r) {
                throw r;
            }
            throw new IllegalStateException(e.getCause());
        } catch (ReflectiveOperationException e) {
            throw new IllegalStateException(e);
        }
    }

    private static IllegalArgumentException noSpark() {
        return new IllegalArgumentException("--engine spark: Apache Spark is not on the classpath of this jar; run "
                + "bench/target/fadebench-spark-local.jar (built by 'mvn -q -Pspark package -DskipTests'), or "
                + "bench/target/fadebench-spark.jar through spark-submit; or use --engine local");
    }

    /** How the run's first lines name the engine, e.g. "2 threads" or "Spark local[2]". */
    public String describe(int threads) {
        return kind == Kind.LOCAL ? threads + " thread" + (threads == 1 ? "" : "s")
                : "Spark " + (sparkMaster == null ? "(spark-submit's master)" : sparkMaster);
    }
}
