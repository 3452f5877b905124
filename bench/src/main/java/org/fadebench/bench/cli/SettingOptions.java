package org.fadebench.bench.cli;

import java.util.List;
import java.util.Map;
import org.fadebench.bench.settings.Setting;
import org.fadebench.bench.settings.SettingValues;
import picocli.CommandLine;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;

/**
 * Command-line options made from the settings table: a command lists the settings it takes, and
 * each becomes an option with the table's name, value label, help and default. What the user gave
 * is read back as {@link SettingValues} with the command line as their origin.
 */
final class SettingOptions {

    private SettingOptions() {
    }

    /**
     * Adds one option per setting to {@code spec}.
     *
     * @param defaults defaults of this command that differ from the table's, by setting
     */
    static CommandSpec addTo(CommandSpec spec, List<Setting> settings, Map<Setting, String> defaults) {
        for (Setting s : settings) {
            if (!s.hasOption()) {
                continue;
            }
            String def = defaults.getOrDefault(s, s.defaultText());
            OptionSpec.Builder o = OptionSpec.builder(s.option()).description(
                    s.help() + (def != null && s.kind() != Setting.Kind.FLAG ? " (default: " + def + ")" : ""));
            if (s.kind() == Setting.Kind.FLAG) {
                o.type(boolean.class).arity("0");
            } else {
                o.type(String.class).paramLabel(s.label()).arity("1");
            }
            spec.addOption(o.build());
        }
        return spec;
    }

    /** The values of {@code settings} given on the command line, after the command's own defaults. */
    static SettingValues given(CommandLine.ParseResult parsed, List<Setting> settings, Map<Setting, String> defaults) {
        SettingValues v = SettingValues.empty();
        for (Map.Entry<Setting, String> d : defaults.entrySet()) {
            v = v.with(d.getKey(), d.getValue(), SettingValues.Origin.DEFAULT);
        }
        for (Setting s : settings) {
            if (s.hasOption() && parsed != null && parsed.hasMatchedOption(s.option())) {
                String text = s.kind() == Setting.Kind.FLAG ? "true"
                        : parsed.matchedOptionValue(s.option(), (String) null);
                v = v.with(s, text, SettingValues.Origin.COMMAND_LINE);
            }
        }
        return v;
    }
}
