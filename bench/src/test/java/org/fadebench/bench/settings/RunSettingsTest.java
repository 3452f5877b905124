package org.fadebench.bench.settings;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import org.fadebench.bench.run.RunPlan;
import org.fadebench.bench.scenario.Scenario;
import org.fadebench.bench.scenario.ScenarioLoader;
import org.fadebench.coding.fec.ldpc.LdpcAlgorithm;
import org.fadebench.coding.fec.ldpc.LdpcDecoding;
import org.junit.jupiter.api.Test;

/** The settings table and what is served from it: scenario text, JSON settings, plans without the CLI. */
class RunSettingsTest {

    private static final SettingValues.Origin CLI = SettingValues.Origin.COMMAND_LINE;

    @Test
    void everySettingHasOneOptionOneKeyAndOneJsonKey() {
        Set<String> options = new HashSet<>();
        Set<String> paths = new HashSet<>();
        Set<String> json = new HashSet<>();
        for (Setting s : RunSettings.all()) {
            assertTrue(s.option() == null || options.add(s.option()), "option twice: " + s.option());
            assertTrue(paths.add(s.path()), "key twice: " + s.path());
            assertTrue(json.add(s.jsonKey()), "JSON key twice: " + s.jsonKey());
            assertTrue(s.help().endsWith(".") || s.help().endsWith(")"), "help is a sentence: " + s.help());
            assertTrue(s.option() == null || s.kind() == Setting.Kind.FLAG || s.label() != null, s.path());
        }
    }

    /** The LDPC settings' help states the defaults the decoders use. */
    @Test
    void ldpcHelpStatesTheDefaults() {
        assertTrue(RunSettings.FEC_CORRECTION.help().endsWith("(default: 0.8125, 0.5)."),
                RunSettings.FEC_CORRECTION.help());
        assertEquals(0.8125, LdpcAlgorithm.MIN_SUM.defaultCorrection());
        assertEquals(0.5, LdpcAlgorithm.OFFSET_MIN_SUM.defaultCorrection());
        assertTrue(RunSettings.FEC_ITERATIONS.help().endsWith("(default: 50)."), RunSettings.FEC_ITERATIONS.help());
        assertEquals(50, LdpcDecoding.DEFAULT.iterations());
    }

    @Test
    void editDistance() {
        // V. I. Levenshtein's distance; kitten -> sitting takes 3 edits (from memory, the usual example)
        assertEquals(3, RunSettings.editDistance("kitten", "sitting"));
        assertEquals(0, RunSettings.editDistance("rx", "rx"));
    }

    /** A written scenario reads back to the same values, every kind of value included. */
    @Test
    void scenarioTextReadsBackToTheSameValues() {
        SettingValues v = SettingValues.defaults(RunSettings.all())
                .with(RunSettings.CODE, "alamouti", CLI)
                .with(RunSettings.RX, "2", CLI)
                .with(RunSettings.SNR_DB, "0,2.5,5", CLI)
                .with(RunSettings.QUIET, "true", CLI)
                .with(RunSettings.TRACE, "/tmp/a \"quoted\" name.npy", CLI)
                .withMatrix(RunSettings.RX_CORR_MATRIX, new double[] {1, 0, 0.5, 0.25, 0.5, -0.25, 1, 0}, CLI);
        String text = SettingsText.scenario(v, RunSettings.all(), java.util.List.of("test"));
        Scenario back = ScenarioLoader.parse("back.yaml", text);
        assertEquals(v, back.values());
        assertTrue(text.contains("  # k_factor:"), "unset settings are listed as comments:\n" + text);
        assertEquals(text, SettingsText.scenario(back.values(), RunSettings.all(), java.util.List.of("test")));
    }

    @Test
    void jsonHoldsEverySettingTyped() {
        SettingValues v = SettingValues.defaults(RunSettings.all()).with(RunSettings.RX, "3", CLI);
        Map<String, Object> m = SettingsText.json(v, RunSettings.all());
        assertEquals(RunSettings.all().size(), m.size());
        assertEquals(3L, m.get("rx"));
        assertEquals(0.95, m.get("confidence"));
        assertEquals(false, m.get("quiet"));
        assertEquals("qpsk", m.get("modulation"));
        assertNull(m.get("k_factor"));
    }

    @Test
    void messagesPointAtTheOptionOrTheScenarioLine() {
        SettingValues fromFile = ScenarioLoader.parse("s.yaml", "link:\n  rx: 0\n").values();
        assertEquals("s.yaml line 2, key link.rx: --rx must be positive", fromFile.locate(RunSettings.RX,
                "must be positive"));
        SettingValues fromCli = SettingValues.empty().with(RunSettings.RX, "0", CLI);
        assertEquals("--rx must be positive", fromCli.locate(RunSettings.RX, "must be positive"));
        InvalidSettingException e = assertThrows(InvalidSettingException.class,
                () -> SettingValues.empty().with(RunSettings.RX, "two", CLI).whole(RunSettings.RX));
        assertEquals("--rx expected a whole number, got 'two'", e.getMessage());
    }

    /** A plan is built from values alone and travels as them: a worker rebuilds the same run. */
    @Test
    void planIsBuiltAndSerialisedWithoutTheCommandLine() throws Exception {
        SettingValues v = SettingValues.empty()
                .with(RunSettings.CODE, "alamouti", CLI)
                .with(RunSettings.RX, "2", CLI)
                .with(RunSettings.FEC, "conv-r12", CLI)
                .with(RunSettings.SEED, "9", CLI)
                .with(RunSettings.THREADS, "1", CLI);
        RunPlan plan = RunPlan.from(v, null);
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ObjectOutputStream out = new ObjectOutputStream(bytes)) {
            out.writeObject(plan);
        }
        RunPlan back;
        try (ObjectInputStream in = new ObjectInputStream(new ByteArrayInputStream(bytes.toByteArray()))) {
            back = (RunPlan) in.readObject();
        }
        assertEquals(plan.numbersFingerprintText(128), back.numbersFingerprintText(128));
        assertEquals(plan.scenarioText(), back.scenarioText());
        assertEquals(plan.values(), back.values());
    }

    @Test
    void planErrorsNameTheSetting() {
        InvalidSettingException e = assertThrows(InvalidSettingException.class, () -> RunPlan.from(
                SettingValues.empty().with(RunSettings.CONFIDENCE, "2", CLI), null));
        assertEquals(RunSettings.CONFIDENCE, e.setting());
        InvalidSettingException m = assertThrows(InvalidSettingException.class, () -> RunPlan.from(
                SettingValues.empty().with(RunSettings.MODULATION, "8psk", CLI), null));
        assertEquals(RunSettings.MODULATION, m.setting());
        assertTrue(m.getMessage().startsWith("--mod: unknown"), m.getMessage());
    }
}
