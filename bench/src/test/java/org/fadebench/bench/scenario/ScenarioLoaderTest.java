package org.fadebench.bench.scenario;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import org.fadebench.bench.settings.RunSettings;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class ScenarioLoaderTest {

    private static long count(Scenario s) {
        return RunSettings.all().stream().filter(s.values()::isSet).count();
    }

    @Test
    void readsEveryKindOfValue() {
        Scenario s = ScenarioLoader.parse("t.yaml", String.join("\n",
                "link:",
                "  code: alamouti",
                "  rx: 2",
                "sweep:",
                "  snr_db: [0, 2.5, 5]",
                "  fer_floor: 1e-5",
                "output:",
                "  quiet: true"));
        assertEquals("alamouti", s.values().text(RunSettings.CODE));
        assertEquals("2", s.values().text(RunSettings.RX));
        assertEquals(3, s.values().origin(RunSettings.RX).line());
        assertEquals("t.yaml", s.values().origin(RunSettings.RX).source());
        assertEquals("0,2.5,5", s.values().text(RunSettings.SNR_DB));
        assertEquals("true", s.values().text(RunSettings.QUIET));
        assertEquals(5, count(s));
    }

    @Test
    void emptyFileSetsNothing() {
        assertEquals(0, count(ScenarioLoader.parse("e.yaml", "# nothing\n")));
    }

    /** The shipped example scenario loads and sets only known keys. */
    @Test
    void exampleScenarioLoads() {
        Path example = Path.of("scenarios", "hilltop-gateway.yaml");
        assertTrue(Files.exists(example), "bench/scenarios/hilltop-gateway.yaml is shipped");
        Scenario s = ScenarioLoader.load(example);
        assertTrue(count(s) >= 10, "the example shows most keys");
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
        "'link:\\n  modulaton: qpsk' | t.yaml line 2: unknown key 'link.modulaton' (did you mean 'modulation'?); valid keys in link:",
        "'sweeps:\\n  seed: 1' | t.yaml line 1: unknown section 'sweeps' (did you mean 'sweep'?); valid sections: link, sweep, analysis, output",
        "'link:\\n  rx: two' | t.yaml line 2, key link.rx: expected a whole number, got 'two'",
        "'sweep:\\n  confidence: high' | t.yaml line 2, key sweep.confidence: expected a number, got 'high'",
        "'sweep:\\n  snr_db: [0, x]' | t.yaml line 2, key sweep.snr_db: expected a number, FROM..TO/STEP, or a list of numbers, got 'x'",
        "'output:\\n  quiet: maybe' | t.yaml line 2, key output.quiet: expected true or false, got 'maybe'",
        "'link:\\n  tx: [1, 2]' | t.yaml line 2, key link.tx: expected a whole number, got a list",
        "'link: 3' | t.yaml line 1: section 'link' must be a mapping of keys code, code_file, decoder",
        "'- a\\n- b' | t.yaml line 1: the top level must be a mapping of sections link, sweep, analysis, output",
        "'link:\\n  rx: 1\\n  rx: 2' | t.yaml line 3: key 'link.rx' appears twice",
        "'link: {code: [unclosed' | t.yaml line 1: not valid YAML",
        "'link:\\n  code: !!java.lang.Object x' | t.yaml line 2: YAML tags are not allowed (!!java.lang.Object)",
        "'link:\\n  code: !custom x' | t.yaml line 2: YAML tags are not allowed (!custom)",
        "'link:\\n  rx: !!int 2' | t.yaml line 2: YAML tags are not allowed (!!int); write the plain value",
        "'link:\\n  code: !!str alamouti' | t.yaml line 2: YAML tags are not allowed (!!str)",
        "'sweep:\\n  snr_db: !!seq [1, 2]' | t.yaml line 2: YAML tags are not allowed (!!seq)",
        "'link: !!map\\n  rx: 2' | t.yaml line 1: YAML tags are not allowed (!!map)",
        "'link:\\n  code: ! alamouti' | t.yaml line 2: YAML tags are not allowed (!)",
    })
    void badScenariosNameFileLineAndKey(String yaml, String expected) {
        ScenarioException e = assertThrows(ScenarioException.class,
                () -> ScenarioLoader.parse("t.yaml", yaml.replace("\\n", "\n")));
        assertTrue(e.getMessage().startsWith(expected.trim()), e.getMessage());
        assertTrue(!e.getMessage().contains("\n"), "one line");
    }

    @Test
    void missingFile() {
        ScenarioException e = assertThrows(ScenarioException.class, () -> ScenarioLoader.load(Path.of("nope.yaml")));
        assertEquals("nope.yaml: no such scenario file", e.getMessage());
    }

    @Test
    void folderIsNamedAsAFolder(@org.junit.jupiter.api.io.TempDir Path dir) {
        ScenarioException e = assertThrows(ScenarioException.class, () -> ScenarioLoader.load(dir));
        assertEquals(dir + ": is a folder; give a scenario file (YAML)", e.getMessage());
    }

    @Test
    void closestKey() {
        assertEquals("max_frames", RunSettings.closest("maxframes", RunSettings.names("sweep")).orElseThrow());
        assertTrue(RunSettings.closest("zebra", RunSettings.names("sweep")).isEmpty());
    }
}
