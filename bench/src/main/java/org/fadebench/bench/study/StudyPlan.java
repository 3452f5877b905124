package org.fadebench.bench.study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.fadebench.bench.run.Engine;
import org.fadebench.bench.run.RunPlan;
import org.fadebench.bench.scenario.ScenarioException;
import org.fadebench.bench.settings.InvalidSettingException;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.settings.Setting;
import org.fadebench.bench.settings.SettingValues;

/**
 * A checked study: one {@link RunPlan} per design, each writing into {@code DIR/<design>/} exactly
 * what {@code run} writes, on the study's thread count and engine, with the thread count, the
 * engine and quietness kept out of its settings (none changes a number, so each design's
 * scenario.yaml is the same on any machine and engine). A design of {@code designs:}
 * that is invalid is refused; a combination of {@code vary:} that is impossible is skipped with its
 * reason, unless a value is used by no design at all or no design is left.
 *
 * @param file     the study file
 * @param dir      the study's folder
 * @param threads  worker threads of every design
 * @param engine   who computes every design's batches (one executor serves the whole study)
 * @param designs  the designs to run, in file order
 * @param skipped  the impossible combinations of the grid, with their reasons
 */
public record StudyPlan(StudyFile file, Path dir, int threads, Engine engine, List<Entry> designs,
                        List<Skipped> skipped) {

    /** A design and its run. */
    public record Entry(StudyFile.Design design, RunPlan plan) {
        public String name() {
            return design.name();
        }
    }

    /** A combination of the grid that makes no link, and why. */
    public record Skipped(StudyFile.Design design, String reason) {
        public String name() {
            return design.name();
        }
    }

    /**
     * Checks every design of {@code file}; {@link ScenarioException} (one line naming the file, the
     * line and the key) for an invalid design, a grid value no design can use or a grid with no design.
     *
     * @param dir       the study's folder
     * @param threads   worker threads, or null for the study file's {@code sweep.threads} or all cores
     * @param quiet     print nothing but errors (and the ranking), whatever the file says
     * @param overrides values given on the command line over the common settings (e.g. the plots' x axis), or empty
     */
    public static StudyPlan of(StudyFile file, Path dir, Integer threads, boolean quiet, SettingValues overrides) {
        SettingValues common = file.common().overlaidBy(overrides);
        int workers = threads != null ? threads
                : common.isSet(RunSettings.THREADS) ? common.integer(RunSettings.THREADS)
                : Runtime.getRuntime().availableProcessors();
        boolean silent = quiet || common.flag(RunSettings.QUIET);
        Engine engine = Engine.from(SettingValues.defaults(RunSettings.all()).overlaidBy(common));
        for (Setting s : List.of(RunSettings.THREADS, RunSettings.ENGINE, RunSettings.SPARK_MASTER,
                RunSettings.SPARK_TASKS)) {
            common = common.with(s, null, null);
        }
        List<Entry> designs = new ArrayList<>();
        List<Skipped> skipped = new ArrayList<>();
        for (StudyFile.Design d : file.designs()) {
            SettingValues values = common.overlaidBy(d.values()).with(RunSettings.FOLDER,
                    dir.resolve(d.name()).toString(), SettingValues.Origin.DERIVED);
            String problem;
            try {
                designs.add(new Entry(d, RunPlan.from(values, file.source()).onThreads(workers, silent)));
                continue;
            } catch (InvalidSettingException e) {
                problem = values.locate(e.setting(), e.problem());
            } catch (IllegalArgumentException e) {
                problem = e.getMessage();
            }
            if (!d.fromGrid()) {
                throw new ScenarioException(problem.startsWith(file.source()) ? problem + " (design " + d.name() + ")"
                        : file.source() + " line " + d.line() + ", design " + d.name() + ": " + problem);
            }
            skipped.add(new Skipped(d, problem));
        }
        if (designs.isEmpty()) {
            throw new ScenarioException(file.source() + ": the grid yields zero designs (every combination is "
                    + "impossible; the first: " + skipped.get(0).name() + ": " + skipped.get(0).reason() + ")");
        }
        for (StudyFile.GridValue v : file.grid()) {
            if (designs.stream().noneMatch(e -> e.design().grid().contains(v))) {
                String example = skipped.stream().filter(s -> s.design().grid().contains(v)).findFirst()
                        .map(s -> s.name() + ": " + s.reason()).orElse("no combination");
                throw new ScenarioException(file.source() + " line " + v.line() + ", key vary." + v.setting().name()
                        + ": the value '" + v.text() + "' makes no possible design (e.g. " + example + ")");
            }
        }
        return new StudyPlan(file, dir, workers, engine, List.copyOf(designs), List.copyOf(skipped));
    }

}
