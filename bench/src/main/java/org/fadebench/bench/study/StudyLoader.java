package org.fadebench.bench.study;

import static org.fadebench.bench.scenario.ScenarioLoader.keyText;
import static org.fadebench.bench.scenario.ScenarioLoader.line;
import static org.fadebench.bench.scenario.ScenarioLoader.mapping;
import static org.fadebench.bench.scenario.ScenarioLoader.suggest;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import org.fadebench.bench.scenario.ScenarioException;
import org.fadebench.bench.scenario.ScenarioLoader;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.settings.Setting;
import org.fadebench.bench.settings.SettingValues;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * Reads study files: the scenario sections ({@code link}, {@code sweep}, {@code analysis},
 * {@code output}) as the common settings, read by {@link ScenarioLoader} with its safe loader and
 * its messages, plus {@code designs:} (a list of {@code {name, link: {...}}}) and/or {@code vary:}
 * (a map from a link key to a list of values, crossed into designs named from their values), and
 * the study's own keys in {@code analysis}: {@code budget_db}, {@code screen}, {@code screen_margin}.
 * With both {@code designs:} and {@code vary:}, every design is crossed with the grid.
 */
public final class StudyLoader {

    /** The SNR the link budget allows, dB. */
    public static final Setting BUDGET_DB = new Setting("analysis", "budget_db", null, Setting.Kind.NUMBER, "DB", null,
            "The SNR the link budget allows, dB: meets_target says whether a design reaches the target FER there.");
    /** Screening by the outage bound at the budget. */
    public static final Setting SCREEN = new Setting("analysis", "screen", null, Setting.Kind.FLAG, null, "false",
            "Skip designs whose QAM-constrained outage at budget_db exceeds the target FER by more than the margin.");
    /** The margin of the screen, a factor over the target FER. */
    public static final Setting SCREEN_MARGIN = new Setting("analysis", "screen_margin", null, Setting.Kind.NUMBER, "F",
            Double.toString(Screening.DEFAULT_MARGIN), "Factor over the target FER the outage may reach before a "
                    + "design is screened out (at least 1).");

    private static final List<Setting> STUDY_KEYS = List.of(BUDGET_DB, SCREEN, SCREEN_MARGIN);
    private static final List<String> TOP = List.of("title", "link", "sweep", "analysis", "output", "designs", "vary");
    private static final Pattern NAME = Pattern.compile("[A-Za-z0-9._+-]{1,64}");
    /** Output keys a study cannot share between its designs: one file each. */
    private static final List<Setting> NOT_IN_A_STUDY = List.of(RunSettings.ARCHIVE, RunSettings.TRACE_OUT);

    private StudyLoader() {
    }

    /** Loads a study file; {@link ScenarioException} (one line: file, line, key) for anything wrong with it. */
    public static StudyFile load(Path file) {
        return parse(file.toString(), ScenarioLoader.readText(file, "study file"));
    }

    /** Parses study text; {@code name} is used in messages. */
    public static StudyFile parse(String name, String text) {
        Node root = ScenarioLoader.compose(name, text);
        if (root == null) {
            throw new ScenarioException(name + ": empty; a study file needs designs: or vary:");
        }
        MappingNode top = mapping(root, name, "the top level", "sections " + String.join(", ", TOP));
        SettingValues common = SettingValues.empty();
        SettingValues own = SettingValues.defaults(STUDY_KEYS);
        Node designsNode = null;
        Node varyNode = null;
        String title = name;
        Set<String> seen = new HashSet<>();
        for (NodeTuple t : top.getValue()) {
            String key = keyText(t.getKeyNode(), name);
            int line = line(t.getKeyNode());
            if (!seen.add(key)) {
                throw new ScenarioException(name + " line " + line + ": section '" + key + "' appears twice");
            }
            switch (key) {
                case "designs" -> designsNode = t.getValueNode();
                case "vary" -> varyNode = t.getValueNode();
                case "title" -> title = title(name, line, t.getValueNode());
                case "analysis" -> {
                    common = ScenarioLoader.section(name, key, t.getValueNode(), common,
                            STUDY_KEYS.stream().map(Setting::name).toList());
                    own = studyKeys(name, (MappingNode) t.getValueNode(), own);
                }
                default -> {
                    if (!RunSettings.sections().contains(key)) {
                        throw new ScenarioException(name + " line " + line + ": unknown section '" + key + "'"
                                + suggest(key, TOP) + "; valid sections: " + String.join(", ", TOP));
                    }
                    common = ScenarioLoader.section(name, key, t.getValueNode(), common, List.of());
                }
            }
        }
        for (Setting s : NOT_IN_A_STUDY) {
            if (common.isSet(s)) {
                throw new ScenarioException(common.locate(s, "is not taken by a study (each design would write the "
                        + "same file); run a design's folder alone with 'fadebench run DIR/DESIGN/scenario.yaml' for it"));
            }
        }
        double margin = own.number(SCREEN_MARGIN);
        if (!(margin >= 1)) {
            throw new ScenarioException(own.locate(SCREEN_MARGIN, "must be at least 1 (a factor over the target FER), got "
                    + margin));
        }
        if (own.flag(SCREEN) && !own.isSet(BUDGET_DB)) {
            throw new ScenarioException(own.locate(SCREEN, "needs analysis.budget_db, the SNR at which the outage "
                    + "bound is judged"));
        }
        if (designsNode == null && varyNode == null) {
            throw new ScenarioException(name + ": no designs: give designs: (a list of {name, link}) or vary: "
                    + "(a map from a link key to a list of values)");
        }
        List<StudyFile.Design> base = designsNode == null
                ? List.of(new StudyFile.Design("", 0, false, SettingValues.empty(), List.of()))
                : designs(name, designsNode);
        List<StudyFile.GridValue> grid = new ArrayList<>();
        List<StudyFile.Design> crossed = varyNode == null ? base : cross(name, varyNode, base, grid);
        Map<String, Integer> names = new LinkedHashMap<>();
        for (StudyFile.Design d : crossed) {
            Integer first = names.putIfAbsent(d.name(), d.line());
            if (first != null) {
                throw new ScenarioException(name + " line " + d.line() + ", key designs.name: design name '" + d.name()
                        + "' appears twice (first at line " + first + "); each design needs its own name (its folder)");
            }
        }
        double budget = own.isSet(BUDGET_DB) ? own.number(BUDGET_DB) : Double.NaN;
        return new StudyFile(name, title, text, common, List.copyOf(crossed), budget, own.flag(SCREEN), margin, grid);
    }

    /** The study's {@code title:}: one line of plain text, 1 to 120 characters. */
    private static String title(String name, int line, Node node) {
        String text = node instanceof ScalarNode s ? s.getValue().trim() : "";
        if (text.isEmpty() || text.length() > 120 || text.chars().anyMatch(Character::isISOControl)) {
            throw new ScenarioException(name + " line " + line + ", key title: the study's title is one line of 1 to "
                    + "120 characters (it heads the table, the plot and the report)");
        }
        return text;
    }

    /** budget_db, screen and screen_margin from the analysis section (their kinds checked with their lines). */
    private static SettingValues studyKeys(String name, MappingNode analysis, SettingValues own) {
        for (NodeTuple kv : analysis.getValue()) {
            String key = ((ScalarNode) kv.getKeyNode()).getValue();
            for (Setting s : STUDY_KEYS) {
                if (s.name().equals(key)) {
                    own = ScenarioLoader.set(name, s, kv.getValueNode(), own);
                }
            }
        }
        return own;
    }

    /** The {@code designs:} list. */
    private static List<StudyFile.Design> designs(String name, Node node) {
        if (!(node instanceof SequenceNode list)) {
            throw new ScenarioException(name + " line " + line(node) + ": designs must be a list of {name, link} "
                    + "mappings");
        }
        if (list.getValue().isEmpty()) {
            throw new ScenarioException(name + " line " + line(node) + ": designs is an empty list; the study has no "
                    + "design");
        }
        List<StudyFile.Design> out = new ArrayList<>();
        for (Node item : list.getValue()) {
            MappingNode m = mapping(item, name, "a design", "keys name, link");
            String designName = null;
            int nameLine = line(item);
            SettingValues values = SettingValues.empty();
            for (NodeTuple kv : m.getValue()) {
                String key = keyText(kv.getKeyNode(), name);
                int line = line(kv.getKeyNode());
                if (key.equals("name")) {
                    nameLine = line(kv.getValueNode());
                    designName = kv.getValueNode() instanceof ScalarNode s ? s.getValue().trim() : null;
                    checkName(name, nameLine, designName);
                } else if (key.equals("link")) {
                    values = ScenarioLoader.section(name, "link", kv.getValueNode(), values, List.of());
                } else {
                    throw new ScenarioException(name + " line " + line + ": unknown key 'designs." + key + "'"
                            + suggest(key, List.of("name", "link")) + "; valid keys of a design: name, link");
                }
            }
            if (designName == null) {
                throw new ScenarioException(name + " line " + line(item) + ", key designs.name: a design needs a name "
                        + "(letters, digits, . _ + -)");
            }
            out.add(new StudyFile.Design(designName, nameLine, false, values, List.of()));
        }
        return out;
    }

    private static void checkName(String name, int line, String designName) {
        if (designName == null || !NAME.matcher(designName).matches() || designName.equals(".")
                || designName.equals("..")) {
            throw new ScenarioException(name + " line " + line + ", key designs.name: a design name is 1 to 64 "
                    + "letters, digits or . _ + - (it names the design's folder), got '" + designName + "'");
        }
        if (designName.equals(StudyOutputs.CSV) || designName.equals(StudyOutputs.JSON)) {
            throw new ScenarioException(name + " line " + line + ", key designs.name: '" + designName + "' is the name "
                    + "of the study's own file; give the design another name");
        }
    }

    /** Every design crossed with every combination of the grid's values, named from them. */
    private static List<StudyFile.Design> cross(String name, Node node, List<StudyFile.Design> base,
                                                List<StudyFile.GridValue> grid) {
        List<String> linkKeys = RunSettings.names("link");
        MappingNode vary = mapping(node, name, "vary", "link keys, each with a list of values");
        List<StudyFile.Design> designs = base;
        for (NodeTuple kv : vary.getValue()) {
            String key = keyText(kv.getKeyNode(), name);
            int keyLine = line(kv.getKeyNode());
            Setting setting = RunSettings.find("link", key).orElseThrow(() -> new ScenarioException(name + " line "
                    + keyLine + ": unknown key 'vary." + key + "'" + suggest(key, linkKeys)
                    + "; vary takes link keys: " + String.join(", ", linkKeys)));
            if (setting.kind() == Setting.Kind.MATRIX || setting.kind() == Setting.Kind.PATH) {
                throw new ScenarioException(name + " line " + keyLine + ": vary." + key + ": a file or matrix setting "
                        + "cannot be varied; give each value its own entry under designs:");
            }
            if (!(kv.getValueNode() instanceof SequenceNode values)) {
                throw new ScenarioException(name + " line " + keyLine + ", key vary." + key + ": expected a list of "
                        + "values, e.g. [1, 2]");
            }
            if (values.getValue().isEmpty()) {
                throw new ScenarioException(name + " line " + keyLine + ", key vary." + key + ": an empty list, so "
                        + "the grid yields zero designs");
            }
            List<StudyFile.GridValue> these = new ArrayList<>();
            for (Node v : values.getValue()) {
                these.add(new StudyFile.GridValue(setting, ScenarioLoader.set(name, setting, v, SettingValues.empty())
                        .text(setting), line(v)));
            }
            grid.addAll(these);
            List<StudyFile.Design> next = new ArrayList<>();
            for (StudyFile.Design d : designs) {
                for (StudyFile.GridValue v : these) {
                    String part = key + "-" + v.text().replaceAll("[^A-Za-z0-9.+-]", "-");
                    String designName = d.name().isEmpty() ? part : d.name() + "_" + part;
                    checkName(name, v.line(), designName);
                    List<StudyFile.GridValue> taken = new ArrayList<>(d.grid());
                    taken.add(v);
                    next.add(new StudyFile.Design(designName, d.name().isEmpty() ? v.line() : d.line(), true,
                            d.values().with(setting, v.text(), new SettingValues.Origin(name, v.line())),
                            List.copyOf(taken)));
                }
            }
            designs = next;
        }
        return designs;
    }
}
