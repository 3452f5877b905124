package org.fadebench.bench.scenario;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.settings.Setting;
import org.fadebench.bench.settings.SettingValues;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.events.CollectionStartEvent;
import org.yaml.snakeyaml.events.Event;
import org.yaml.snakeyaml.events.ScalarEvent;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * Reads scenario files: YAML with the sections and keys of {@link RunSettings}. The file is
 * composed into plain nodes by SnakeYAML's safe loader (no types are ever constructed from the
 * file), then walked here so every error can name the file, the line and the key, and suggest
 * the closest valid key.
 */
public final class ScenarioLoader {

    /** Largest scenario file read, in bytes. */
    static final long MAX_BYTES = 1 << 20;

    private ScenarioLoader() {
    }

    /** Loads a file; {@link ScenarioException} for anything wrong with it. */
    public static Scenario load(Path file) {
        return parse(file.toString(), readText(file, "scenario file"));
    }

    /**
     * A YAML file's text, read as a scenario file is: a regular file of at most 1 MiB of UTF-8;
     * {@code what} names it in messages (e.g. {@code scenario file}).
     */
    public static String readText(Path file, String what) {
        String name = file.toString();
        try {
            if (Files.isDirectory(file)) {
                throw new ScenarioException(name + ": is a folder; give a " + what + " (YAML)");
            }
            if (!Files.isRegularFile(file)) {
                throw new ScenarioException(name + (Files.exists(file)
                        ? ": not a regular file (a pipe or a device?); give a " + what + " (YAML)"
                        : ": no such " + what));
            }
            if (Files.size(file) > MAX_BYTES) {
                throw new ScenarioException(name + ": larger than " + MAX_BYTES + " bytes; not a " + what);
            }
            return Files.readString(file, StandardCharsets.UTF_8);
        } catch (java.nio.charset.MalformedInputException e) {
            throw new ScenarioException(name + ": not UTF-8 text");
        } catch (IOException e) {
            throw new ScenarioException(name + ": cannot be read (" + e.getMessage() + ")");
        }
    }

    /** Parses scenario text; {@code name} is used in messages. */
    public static Scenario parse(String name, String text) {
        Node root = compose(name, text);
        SettingValues values = SettingValues.empty();
        if (root == null) {
            return new Scenario(name, text, values);
        }
        MappingNode top = mapping(root, name, "the top level", "sections " + String.join(", ", RunSettings.sections()));
        java.util.Set<String> seenSections = new java.util.HashSet<>();
        for (NodeTuple t : top.getValue()) {
            String section = keyText(t.getKeyNode(), name);
            int line = line(t.getKeyNode());
            if (!seenSections.add(section)) {
                throw new ScenarioException(name + " line " + line + ": section '" + section + "' appears twice");
            }
            if (!RunSettings.sections().contains(section)) {
                throw new ScenarioException(name + " line " + line + ": unknown section '" + section + "'"
                        + suggest(section, RunSettings.sections()) + "; valid sections: "
                        + String.join(", ", RunSettings.sections()));
            }
            values = section(name, section, t.getValueNode(), values, List.of());
        }
        return new Scenario(name, text, values);
    }

    /**
     * Composes YAML text into plain nodes with the safe loader (duplicate keys, explicit tags and
     * alias bombs refused); null for an empty document.
     */
    public static Node compose(String name, String text) {
        LoaderOptions options = new LoaderOptions();
        options.setAllowDuplicateKeys(false);
        options.setMaxAliasesForCollections(10);
        options.setCodePointLimit((int) MAX_BYTES);
        Yaml yaml = new Yaml(new SafeConstructor(options));
        Node root;
        try {
            rejectExplicitTags(yaml, text, name);
            root = yaml.compose(new StringReader(text));
        } catch (MarkedYAMLException e) {
            int line = e.getProblemMark() != null ? e.getProblemMark().getLine() + 1 : 0;
            throw new ScenarioException(name + " line " + line + ": not valid YAML: " + e.getProblem());
        } catch (YAMLException e) {
            throw new ScenarioException(name + ": not valid YAML: " + e.getMessage());
        }
        if (root != null) {
            rejectTags(root, name);
        }
        return root;
    }

    /**
     * Reads one section's mapping ({@code section} is its name, e.g. {@code link}) onto
     * {@code values}: every key must be a setting of that section, or one of {@code otherKeys},
     * which are left to the caller (and named among the valid keys in messages).
     */
    public static SettingValues section(String name, String section, Node node, SettingValues values,
                                        List<String> otherKeys) {
        List<String> valid = new ArrayList<>(RunSettings.names(section));
        valid.addAll(otherKeys);
        MappingNode body = mapping(node, name, "section '" + section + "'", "keys " + String.join(", ", valid));
        java.util.Set<String> seen = new java.util.HashSet<>();
        for (NodeTuple kv : body.getValue()) {
            String key = keyText(kv.getKeyNode(), name);
            int keyLine = line(kv.getKeyNode());
            if (!seen.add(key)) {
                throw new ScenarioException(name + " line " + keyLine + ": key '" + section + "." + key
                        + "' appears twice");
            }
            if (otherKeys.contains(key)) {
                continue;
            }
            Optional<Setting> k = RunSettings.find(section, key);
            if (k.isEmpty()) {
                throw new ScenarioException(name + " line " + keyLine + ": unknown key '" + section + "." + key + "'"
                        + suggest(key, valid) + "; valid keys in " + section + ": " + String.join(", ", valid));
            }
            values = set(name, k.get(), kv.getValueNode(), values);
        }
        return values;
    }

    /** {@code values} with {@code setting} set from a value node, checked against its kind, with its line. */
    public static SettingValues set(String name, Setting setting, Node value, SettingValues values) {
        SettingValues.Origin origin = new SettingValues.Origin(name, line(value));
        return setting.kind() == Setting.Kind.MATRIX
                ? values.withMatrix(setting, matrix(setting, value, name), origin)
                : values.with(setting, value(setting, value, name), origin);
    }

    /**
     * Refuses every tag written in the file ({@code !!int 5}, {@code !name x}, {@code !<…>}): a
     * scenario holds plain values only, typed by its keys.
     */
    private static void rejectExplicitTags(Yaml yaml, String text, String name) {
        for (Event e : yaml.parse(new StringReader(text))) {
            String tag = e instanceof ScalarEvent s ? s.getTag()
                    : e instanceof CollectionStartEvent c ? c.getTag() : null;
            if (tag != null) {
                throw new ScenarioException(name + " line " + (e.getStartMark().getLine() + 1)
                        + ": YAML tags are not allowed (" + tag.replace("tag:yaml.org,2002:", "!!")
                        + "); write the plain value");
            }
        }
    }

    /** Only the standard YAML types are allowed: no tags that could name a class or anything else. */
    private static void rejectTags(Node node, String name) {
        String tag = node.getTag().getValue();
        boolean standard = tag.startsWith("tag:yaml.org,2002:") && STANDARD_TAGS.contains(tag.substring(18));
        if (!standard) {
            throw new ScenarioException(name + " line " + line(node) + ": YAML tags are not allowed ("
                    + tag.replace("tag:yaml.org,2002:", "!!") + ")");
        }
        if (node instanceof MappingNode m) {
            for (NodeTuple t : m.getValue()) {
                rejectTags(t.getKeyNode(), name);
                rejectTags(t.getValueNode(), name);
            }
        } else if (node instanceof SequenceNode q) {
            for (Node n : q.getValue()) {
                rejectTags(n, name);
            }
        }
    }

    private static final java.util.Set<String> STANDARD_TAGS =
            java.util.Set.of("str", "int", "float", "bool", "null", "seq", "map");

    /** E.g. {@code  (did you mean 'rx'?)}, or nothing when no valid word is close. */
    public static String suggest(String word, List<String> valid) {
        return RunSettings.closest(word, valid).map(s -> " (did you mean '" + s + "'?)").orElse("");
    }

    /** The node as a mapping, or a one-line error: {@code NAME line N: WHAT must be a mapping of EXPECTED}. */
    public static MappingNode mapping(Node node, String name, String what, String expected) {
        if (node instanceof MappingNode m) {
            return m;
        }
        throw new ScenarioException(name + " line " + line(node) + ": " + what + " must be a mapping of "
                + expected);
    }

    /** A mapping key's text; keys must be plain words. */
    public static String keyText(Node node, String name) {
        if (node instanceof ScalarNode s) {
            return s.getValue();
        }
        throw new ScenarioException(name + " line " + line(node) + ": keys must be plain words");
    }

    /** The node's line, counted from 1. */
    public static int line(Node node) {
        return node.getStartMark() == null ? 0 : node.getStartMark().getLine() + 1;
    }

    /** The value as the command line would spell it, checked against the key's kind. */
    private static String value(Setting key, Node node, String name) {
        String where = name + " line " + line(node) + ", key " + key.path() + ": ";
        if (node instanceof SequenceNode seq && key.kind() == Setting.Kind.SNR) {
            List<String> parts = new ArrayList<>();
            for (Node item : seq.getValue()) {
                if (!(item instanceof ScalarNode s)) {
                    throw new ScenarioException(where + "expected " + key.kind().description() + ", got a nested structure");
                }
                parts.add(number(s.getValue(), where, key));
            }
            if (parts.isEmpty()) {
                throw new ScenarioException(where + "the list of SNR points is empty");
            }
            return String.join(",", parts);
        }
        if (!(node instanceof ScalarNode s)) {
            throw new ScenarioException(where + "expected " + key.kind().description() + ", got a "
                    + (node instanceof SequenceNode ? "list" : "mapping"));
        }
        String v = s.getValue().trim();
        switch (key.kind()) {
            case WHOLE:
                try {
                    Long.parseLong(v);
                } catch (NumberFormatException e) {
                    throw new ScenarioException(where + "expected " + key.kind().description() + ", got '" + v + "'");
                }
                return v;
            case NUMBER:
                return number(v, where, key);
            case FLAG:
                String f = v.toLowerCase(Locale.ROOT);
                if (!f.equals("true") && !f.equals("false")) {
                    throw new ScenarioException(where + "expected true or false, got '" + v + "'");
                }
                return f;
            case SNR:
            case PATH:
            case TEXT:
            default:
                if (v.isEmpty()) {
                    throw new ScenarioException(where + "expected " + key.kind().description() + ", got nothing");
                }
                return v;
        }
    }

    /** A square matrix of numbers or [re, im] pairs, interleaved row-major. */
    private static double[] matrix(Setting key, Node node, String name) {
        String where = name + " line " + line(node) + ", key " + key.path() + ": ";
        if (!(node instanceof SequenceNode rows) || rows.getValue().isEmpty() || rows.getValue().size() > 64) {
            throw new ScenarioException(where + "expected " + key.kind().description() + " (1 to 64 rows)");
        }
        int n = rows.getValue().size();
        double[] m = new double[2 * n * n];
        for (int i = 0; i < n; i++) {
            Node row = rows.getValue().get(i);
            if (!(row instanceof SequenceNode cells) || cells.getValue().size() != n) {
                throw new ScenarioException(name + " line " + line(row) + ", key " + key.path() + ": row " + (i + 1)
                        + " must hold " + n + " entries (the matrix is square)");
            }
            for (int j = 0; j < n; j++) {
                Node cell = cells.getValue().get(j);
                String at = name + " line " + line(cell) + ", key " + key.path() + ": ";
                if (cell instanceof ScalarNode sc) {
                    m[2 * (i * n + j)] = Double.parseDouble(number(sc.getValue(), at, key));
                } else if (cell instanceof SequenceNode pair && pair.getValue().size() == 2
                        && pair.getValue().get(0) instanceof ScalarNode re && pair.getValue().get(1) instanceof ScalarNode im) {
                    m[2 * (i * n + j)] = Double.parseDouble(number(re.getValue(), at, key));
                    m[2 * (i * n + j) + 1] = Double.parseDouble(number(im.getValue(), at, key));
                } else {
                    throw new ScenarioException(at + "entry (" + (i + 1) + ", " + (j + 1) + ") must be a number or a pair "
                            + "[re, im]");
                }
            }
        }
        return m;
    }

    private static String number(String v, String where, Setting key) {
        try {
            double d = Double.parseDouble(v.trim());
            if (!Double.isFinite(d)) {
                throw new NumberFormatException();
            }
            return v.trim();
        } catch (NumberFormatException e) {
            throw new ScenarioException(where + "expected " + key.kind().description() + ", got '" + v + "'");
        }
    }
}
