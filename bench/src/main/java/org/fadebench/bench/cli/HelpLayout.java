package org.fadebench.bench.cli;

import java.util.ArrayList;
import java.util.IllegalFormatException;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import picocli.CommandLine;
import picocli.CommandLine.Model.ArgSpec;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;
import picocli.CommandLine.Model.PositionalParamSpec;
import picocli.CommandLine.Model.UsageMessageSpec;

/**
 * Help text wrapped only at spaces. picocli wraps with the JDK's line break rules, which also break
 * after a full stop or a hyphen inside a word ({@code results.} / {@code csv}, {@code conv-} /
 * {@code r12}); this lays out the description, the command list, the parameters and the options in
 * the same two columns, breaking lines only between words.
 */
final class HelpLayout {

    /** Characters per line, as picocli's default. */
    static final int WIDTH = 80;
    private static final int INDENT = 2;

    private HelpLayout() {
    }

    /** Installs the layout on {@code cli} and its subcommands. */
    static void install(CommandLine cli) {
        Map<String, CommandLine.IHelpSectionRenderer> sections = cli.getHelpSectionMap();
        sections.put(UsageMessageSpec.SECTION_KEY_DESCRIPTION, help -> paragraphs(help.commandSpec()));
        sections.put(UsageMessageSpec.SECTION_KEY_COMMAND_LIST, help -> commands(help.commandSpec()));
        sections.put(UsageMessageSpec.SECTION_KEY_PARAMETER_LIST, help -> arguments(help.commandSpec()));
        sections.put(UsageMessageSpec.SECTION_KEY_OPTION_LIST, help -> options(help.commandSpec()));
        cli.setHelpSectionMap(sections);
        for (CommandLine sub : cli.getSubcommands().values()) {
            install(sub);
        }
    }

    private static String paragraphs(CommandSpec spec) {
        StringBuilder sb = new StringBuilder();
        for (String paragraph : spec.usageMessage().description()) {
            for (String part : formatted(paragraph).split("\n")) {
                for (String line : wrap(part, WIDTH)) {
                    sb.append(line).append('\n');
                }
            }
        }
        return sb.toString();
    }

    /** A help string as picocli reads it: a format string, so {@code %n} is a line break and {@code %%} a per cent sign. */
    private static String formatted(String text) {
        try {
            return String.format(Locale.ROOT, text).replace(System.lineSeparator(), "\n");
        } catch (IllegalFormatException e) {
            return text;
        }
    }

    private static String commands(CommandSpec spec) {
        List<String[]> rows = new ArrayList<>();
        for (Map.Entry<String, CommandLine> e : spec.subcommands().entrySet()) {
            UsageMessageSpec usage = e.getValue().getCommandSpec().usageMessage();
            String[] text = usage.header().length > 0 ? usage.header() : usage.description();
            rows.add(new String[] {e.getKey(), text.length == 0 ? "" : formatted(text[0]).strip()});
        }
        return table(rows, labelWidth(rows));
    }

    private static String arguments(CommandSpec spec) {
        return table(argumentRows(spec), labelWidth(spec));
    }

    private static String options(CommandSpec spec) {
        return table(optionRows(spec), labelWidth(spec));
    }

    /** The label column's width: the longest parameter or option label, so both lists line up. */
    private static int labelWidth(CommandSpec spec) {
        List<String[]> rows = argumentRows(spec);
        rows.addAll(optionRows(spec));
        return labelWidth(rows);
    }

    private static int labelWidth(List<String[]> rows) {
        int width = 0;
        for (String[] r : rows) {
            width = Math.max(width, r[0].length());
        }
        return width;
    }

    private static List<String[]> argumentRows(CommandSpec spec) {
        List<String[]> rows = new ArrayList<>();
        for (PositionalParamSpec p : spec.positionalParameters()) {
            if (!p.hidden()) {
                String label = p.paramLabel();
                rows.add(new String[] {"    " + (p.arity().min == 0 ? "[" + label + "]" : label), text(p)});
            }
        }
        return rows;
    }

    private static List<String[]> optionRows(CommandSpec spec) {
        List<String[]> rows = new ArrayList<>();
        List<String[]> last = new ArrayList<>();
        for (OptionSpec o : spec.options()) {
            if (o.hidden()) {
                continue;
            }
            String shortName = o.shortestName().startsWith("--") ? null : o.shortestName();
            String label = (shortName == null ? "    " : shortName + ", ") + o.longestName()
                    + (o.arity().max > 0 && !o.typeInfo().isBoolean() ? "=" + o.paramLabel() : "");
            (o.usageHelp() || o.versionHelp() ? last : rows).add(new String[] {label, text(o)});
        }
        rows.addAll(last);
        return rows;
    }

    private static String text(ArgSpec a) {
        return formatted(String.join(" ", a.description()));
    }

    /** Two columns: labels indented, descriptions wrapped at spaces in the rest of the line. */
    private static String table(List<String[]> rows, int labelWidth) {
        int column = INDENT + labelWidth + 3;
        StringBuilder sb = new StringBuilder();
        for (String[] r : rows) {
            List<String> lines = wrap(r[1], WIDTH - column - 2);
            sb.append(" ".repeat(INDENT)).append(r[0]).append(" ".repeat(column - INDENT - r[0].length()))
                    .append(lines.get(0)).append('\n');
            for (String line : lines.subList(1, lines.size())) {
                sb.append(" ".repeat(column + 2)).append(line).append('\n');
            }
        }
        return sb.toString();
    }

    /** Words of {@code text} in lines of at most {@code width} characters, broken only at spaces. */
    static List<String> wrap(String text, int width) {
        List<String> lines = new ArrayList<>();
        StringBuilder line = new StringBuilder();
        for (String word : text.trim().split("\\s+")) {
            if (line.length() > 0 && line.length() + 1 + word.length() > width) {
                lines.add(line.toString());
                line.setLength(0);
            }
            line.append(line.length() > 0 ? " " : "").append(word);
        }
        lines.add(line.toString());
        return lines;
    }
}
