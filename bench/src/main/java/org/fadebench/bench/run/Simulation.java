package org.fadebench.bench.run;

import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Consumer;
import org.fadebench.bench.analysis.BoundCurves;
import org.fadebench.bench.analysis.RunSummary;
import org.fadebench.bench.settings.InvalidSettingException;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.settings.Setting;
import org.fadebench.bench.settings.SettingValues;
import org.fadebench.bench.sweep.PointResult;
import org.fadebench.bench.sweep.SweepEngine;
import org.fadebench.bench.sweep.SweepOutcome;

/**
 * The Java entry point: simulate a link from Java code (a JVM notebook, a program of your own) and
 * get its points and summary, without files. Settings are given by their scenario keys, as in a
 * scenario file ({@code link.rx}, {@code sweep.snr_db}, …; see {@link RunSettings}); progress comes
 * to a callback on the calling thread. The numbers are those {@code run} writes for the same
 * settings and seed, on any thread count.
 *
 * <pre>{@code
 * Simulation.Result r = Simulation.of(Map.of("link.code", "alamouti", "link.rx", 2,
 *         "sweep.snr_db", "0..20/2", "sweep.seed", 7))
 *     .run(p -> System.out.println("point " + (p.point() + 1) + " of " + p.points()));
 * r.points().forEach(p -> System.out.println(p.snrDb() + " dB: FER " + p.counts().fer()));
 * System.out.println(r.summary().snrDbAtTarget().orElse(Double.NaN));
 * }</pre>
 *
 * A study's designs run the same way, each from its plan:
 * {@code StudyPlan.of(StudyLoader.load(file), dir, null, true, SettingValues.empty()).designs()}, then
 * {@code Simulation.of(entry.plan()).run(...)} for each entry.
 */
public final class Simulation {

    /** What a simulation gives: the points in SNR order, the outage bounds (or null where none apply) and the summary. */
    public record Result(List<PointResult> points, BoundCurves bounds, RunSummary summary) {
    }

    private final RunPlan plan;

    private Simulation(RunPlan plan) {
        this.plan = plan;
    }

    /**
     * A simulation of the link {@code settings} describe: each key a scenario key ({@code section.name},
     * e.g. {@code link.rx}, or the name alone where it is unique, e.g. {@code rx}), each value a
     * number, a flag, text as on the command line, or a collection (a list of SNRs). Unset settings
     * take their defaults.
     *
     * @throws IllegalArgumentException naming the key at fault, and the closest valid key for an unknown one
     */
    public static Simulation of(Map<String, ?> settings) {
        SettingValues values = SettingValues.empty();
        for (Map.Entry<String, ?> e : settings.entrySet()) {
            Setting s = setting(e.getKey());
            Object v = e.getValue();
            String text = v instanceof Collection<?> c ? String.join(",", c.stream().map(String::valueOf).toList())
                    : String.valueOf(v);
            values = values.with(s, text, SettingValues.Origin.COMMAND_LINE);
        }
        try {
            return new Simulation(RunPlan.from(values, null));
        } catch (InvalidSettingException e) {
            throw new IllegalArgumentException(e.setting().path() + ": " + e.problem().replaceFirst("^:\\s*", ""), e);
        }
    }

    /** A simulation of a plan already built (e.g. a study's design). */
    public static Simulation of(RunPlan plan) {
        return new Simulation(plan);
    }

    /** The checked settings: the link, the SNR points, the stop rules, the seed, the threads. */
    public RunPlan plan() {
        return plan;
    }

    /** Runs the sweep and the outage bounds; {@code progress} is called about every half second and at the end. */
    public Result run(Consumer<SweepEngine.Progress> progress) {
        SweepEngine engine = new SweepEngine(plan.link(), plan.rules(), plan.seed(), plan.threads(), plan.confidence());
        SweepOutcome outcome = engine.run(plan.snrDb(), new SweepEngine.Listener() {
            @Override
            public void pointDone(PointResult result) {
            }

            @Override
            public void progress(SweepEngine.Progress p) {
                progress.accept(p);
            }
        });
        BoundCurves curves = plan.boundCurves(outcome.results(), () -> false);
        return new Result(outcome.results(), curves, plan.summary(outcome.complete(), curves, null));
    }

    private static Setting setting(String key) {
        List<Setting> found = new ArrayList<>();
        for (Setting s : RunSettings.all()) {
            if (s.path().equals(key) || s.name().equals(key)) {
                found.add(s);
            }
        }
        if (found.size() == 1) {
            return found.get(0);
        }
        List<String> keys = RunSettings.all().stream().map(Setting::path).toList();
        Optional<String> near = RunSettings.closest(key, keys);
        throw new IllegalArgumentException((found.isEmpty() ? "unknown setting '" : "ambiguous setting '") + key + "'"
                + near.map(n -> " (did you mean '" + n + "'?)").orElse("") + "; give a scenario key, e.g. link.rx");
    }
}
