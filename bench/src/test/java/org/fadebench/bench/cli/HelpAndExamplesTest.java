package org.fadebench.bench.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import java.util.stream.StreamSupport;
import org.fadebench.bench.analysis.Bound;
import org.fadebench.bench.study.DesignRow;
import org.fadebench.bench.study.StudyTable;
import org.fadebench.bench.report.FerPlot;
import org.fadebench.bench.settings.RunSettings;
import org.fadebench.bench.settings.Setting;
import org.fadebench.channel.ChannelModels;
import org.fadebench.coding.fec.ChannelCode;
import org.fadebench.coding.fec.ChannelCodes;
import org.fadebench.coding.fec.Crc;
import org.fadebench.coding.fec.Interleaving;
import org.fadebench.coding.fec.ldpc.LdpcAlgorithm;
import org.fadebench.coding.stbc.Equaliser;
import org.fadebench.coding.stbc.SpaceTimeCode;
import org.fadebench.coding.stbc.SpaceTimeCodes;
import org.fadebench.modem.LlrMethod;
import org.fadebench.modem.Modulation;
import org.fadebench.modem.MutualInformation;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;
import picocli.CommandLine.Model.ArgSpec;
import picocli.CommandLine.Model.CommandSpec;

/** The help texts, the example files and the README agree with what the tool does. */
class HelpAndExamplesTest {

    /** The surefire working directory is the bench module. */
    private static final Path SCENARIOS = Path.of("scenarios");
    private static final Path README = Path.of("..", "README.md");

    @Test
    void runHelpListsEveryFadingModel() {
        String help = collapse(CliTest.run("run", "--help").out());
        assertTrue(help.contains("Fading model: " + ChannelModels.STANDARD.choices() + ". "), help);
    }

    /** Every file a run leaves in its folder is named in the top-level help. */
    @Test
    void topLevelHelpListsEveryOutput(@TempDir Path tmp) throws IOException {
        Path dir = tmp.resolve("out");
        assertEquals(0, CliTest.run("run", "--snr", "10", "--max-frames", "200", "--quiet", "--out", dir.toString())
                .code());
        String help = collapse(CliTest.run("--help").out());
        List<String> names = new ArrayList<>(List.of("checkpoint.json", "bounds.csv"));
        try (Stream<Path> files = Files.list(dir)) {
            files.forEach(f -> names.add(f.getFileName().toString()));
        }
        assertEquals(8, names.size(), names.toString());
        for (String name : names) {
            assertTrue(help.contains(name), "top-level help lacks " + name + ": " + help);
        }
    }

    /**
     * Help is wrapped only at spaces: every option's, parameter's and command's description appears
     * in the printed help whole once the line breaks and their indentation are read as single spaces
     * (a break after "results." or "conv-" would leave "results. csv" or "conv- r12").
     */
    @Test
    void helpWrapsOnlyAtSpaces() {
        CommandLine root = new CommandLine(new FadebenchCli());
        List<CommandLine> commands = new ArrayList<>(List.of(root));
        commands.addAll(root.getSubcommands().values());
        int checked = 0;
        for (CommandLine c : commands) {
            CommandSpec spec = c.getCommandSpec();
            if (spec.name().equals("help")) {
                continue;
            }
            List<String> args = new ArrayList<>(List.of(spec.qualifiedName(" ").split(" ")));
            args.remove(0);
            args.add("--help");
            String help = collapse(CliTest.run(args.toArray(new String[0])).out());
            List<String> texts = new ArrayList<>(List.of(spec.usageMessage().description()));
            for (ArgSpec a : spec.args()) {
                texts.add(String.join(" ", a.description()));
            }
            for (String text : texts) {
                String expected = collapse(String.format(text));
                assertTrue(help.contains(expected), spec.qualifiedName() + " help breaks '" + expected + "': " + help);
                checked++;
            }
        }
        assertTrue(checked > 60, "checked " + checked + " texts");
        assertEquals(List.of("results.csv,", "conv-r12", "conv-small"),
                HelpLayout.wrap("results.csv, conv-r12 conv-small", 12));
    }

    @Test
    void archiveHelpSaysTheNameIsTakenAsGiven() {
        String help = collapse(CliTest.run("run", "--help").out());
        assertTrue(help.contains("--archive=FILE Also bundle the outputs into FILE (.tar.xz, .txz, .tar.gz or .tgz;"
                + " the name is taken as given)."), help);
    }

    /** {@code --version} prints the version the POM gives the project, filled in by the build. */
    @Test
    void versionIsTheProjectVersion() throws IOException {
        String pom = Files.readString(Path.of("pom.xml"), StandardCharsets.UTF_8);
        Matcher parent = Pattern.compile("<parent>.*?<version>([^<]+)</version>", Pattern.DOTALL).matcher(pom);
        assertTrue(parent.find());
        CliTest.Outcome o = CliTest.run("--version");
        assertEquals(0, o.code());
        assertEquals("fadebench " + parent.group(1), o.out().trim());
    }

    /** The example code file is on disk beside the scenarios and identical to the copy in the jar. */
    @Test
    void exampleCodeFileOnDiskIsTheOneInTheJar() throws IOException {
        String onDisk = Files.readString(SCENARIOS.resolve("example-code.yaml"), StandardCharsets.UTF_8);
        try (InputStream in = SpaceTimeCode.class.getResourceAsStream("/org/fadebench/coding/stbc/example-code.yaml")) {
            assertEquals(new String(in.readAllBytes(), StandardCharsets.UTF_8), onDisk);
        }
        CliTest.Outcome o = CliTest.run("codes", "--code-file", SCENARIOS.resolve("example-code.yaml").toString());
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("sm2"), o.out());
    }

    /**
     * The example scenario names every key of the schema, and the comment beside each key with a
     * fixed set of values lists today's values.
     */
    @Test
    void exampleScenarioListsTodaysChoices() throws IOException {
        List<String> lines = Files.readAllLines(SCENARIOS.resolve("hilltop-gateway.yaml"), StandardCharsets.UTF_8);
        for (Setting key : RunSettings.all()) {
            assertTrue(line(lines, key.name()).isPresent(), "example scenario lacks " + key.path());
        }
        Map<String, List<String>> choices = Map.ofEntries(
                Map.entry("code", names(StreamSupport.stream(SpaceTimeCodes.all().spliterator(), false)
                        .map(SpaceTimeCode::name))),
                Map.entry("fading", List.of(ChannelModels.STANDARD.choices().split(", "))),
                Map.entry("modulation", names(Stream.of(Modulation.values()).map(Modulation::cliName))),
                Map.entry("decoder", names(Stream.of(Equaliser.values()).map(Equaliser::cliName))),
                Map.entry("fec", names(ChannelCodes.standard().all().stream().map(ChannelCode::cliName))),
                Map.entry("fec_decoder", names(Stream.of(LdpcAlgorithm.values()).map(LdpcAlgorithm::cliName))),
                Map.entry("crc", names(Stream.of(Crc.values()).map(Crc::cliName))),
                Map.entry("interleaver", names(Stream.of(Interleaving.values()).map(Interleaving::cliName))),
                Map.entry("llr", names(Stream.of(LlrMethod.values()).map(LlrMethod::cliName))),
                Map.entry("mi", names(Stream.of(MutualInformation.Kind.values())
                        .map(MutualInformation.Kind::cliName))),
                Map.entry("plot_x", names(Stream.of(FerPlot.XQuantity.values()).map(FerPlot.XQuantity::cliName))));
        choices.forEach((key, values) -> {
            String comment = line(lines, key).orElseThrow().replaceFirst("^[^#]*#", "");
            for (String v : values) {
                assertTrue(Pattern.compile("(^|[\\s,:])" + Pattern.quote(v) + "([\\s,;)]|$)").matcher(comment).find(),
                        key + " comment lacks " + v + ": " + comment);
            }
        });
    }

    /** The README's table of scenario keys is one table holding every key (no paragraph inside it). */
    @Test
    void readmeScenarioKeysAreOneTable() throws IOException {
        List<String> lines = Files.readAllLines(README, StandardCharsets.UTF_8);
        int start = lines.indexOf("| key | option | key | option |");
        assertTrue(start >= 0, "README lacks the scenario key table");
        StringBuilder table = new StringBuilder();
        for (int i = start; i < lines.size() && lines.get(i).startsWith("|"); i++) {
            table.append(lines.get(i)).append('\n');
        }
        for (Setting key : RunSettings.all()) {
            assertTrue(table.toString().contains("`" + key.path() + "`"), "the table lacks " + key.path());
            if (key.option() != null) {
                assertTrue(table.toString().contains("`" + key.option() + "`"), "the table lacks " + key.option());
            }
        }
    }

    /** The demo's closing words come from the ranking, not from a fixed claim. */
    @Test
    void demoClosingWordsFollowTheRanking() {
        DesignRow mrc = row("mrc-1x2", 9.6, 9.0, 10.3);
        DesignRow alamouti = row("alamouti-2x1", 12.5, 11.9, 13.2);
        DesignRow twoByTwo = row("alamouti-2x2", 5.4, 5.0, 5.8);
        StudyTable table = StudyTable.ranked("demo", 8, List.of(mrc, alamouti, twoByTwo), List.of(), List.of(), List.of());
        assertEquals(List.of("Best at FER 0.01: alamouti-2x2, at 5.40 dB SNR (interval from the FER intervals: 5.00 to "
                + "5.80 dB).", "alamouti-2x1 needs 2.90 dB more SNR than mrc-1x2 (interval from the FER intervals: 1.60 "
                + "to 4.20 dB); the interval holds the 3.01 dB expected from splitting the transmit power over two antennas.",
                "At the budget of 8 dB, 1 of 3 designs meets the target: alamouti-2x2."), DemoCommand.closing(table));
        DesignRow far = row("alamouti-2x1", 16.5, 16.0, 17.0);
        StudyTable apart = StudyTable.ranked("demo", 20, List.of(mrc, far), List.of(), List.of(), List.of());
        List<String> words = DemoCommand.closing(apart);
        assertTrue(words.get(1).endsWith("the interval does not hold the 3.01 dB expected from splitting the "
                + "transmit power over two antennas."), words.get(1));
        assertEquals("At the budget of 20 dB, 2 of 2 designs meet the target: mrc-1x2, alamouti-2x1.", words.get(2));
    }

    private static DesignRow row(String name, double snrDb, double low, double high) {
        Map<Bound, Double> gaps = new EnumMap<>(Bound.class);
        Map<Bound, String> notes = new EnumMap<>(Bound.class);
        for (Bound b : Bound.values()) {
            gaps.put(b, Double.NaN);
            notes.put(b, "none");
        }
        return new DesignRow(name, Path.of(name), "v", "convention", 1, "link", 0.01, 1, snrDb, low, high, null, 0, 16,
                false, 2, gaps, notes, 1000, 1, 0.95, null);
    }

    /**
     * Doppler over the default block (the whole frame): a one-line warning on stderr and in
     * results.json, naming what to change; block fading has none.
     */
    @Test
    void dopplerOverALongBlockIsWarnedAbout(@TempDir Path tmp) throws IOException {
        Path dir = tmp.resolve("doppler");
        CliTest.Outcome o = CliTest.run("run", "--code", "alamouti", "--doppler", "0.01", "--snr", "10",
                "--max-frames", "200", "--out", dir.toString());
        assertEquals(0, o.code(), o.err());
        List<String> warnings = o.err().lines().filter(l -> l.contains("warning")).toList();
        assertEquals(1, warnings.size(), o.err());
        assertTrue(warnings.get(0).startsWith("fadebench run: warning: --doppler 0.01 changes the channel so much"),
                warnings.get(0));
        assertTrue(warnings.get(0).contains("use --coherence 24 or less"), warnings.get(0));
        JsonNode json = resultsJson(dir);
        assertEquals(1, json.get("warnings").size());
        assertEquals(warnings.get(0).substring("fadebench run: warning: ".length()), json.get("warnings").get(0).asText());

        Path plain = tmp.resolve("plain");
        CliTest.Outcome p = CliTest.run("run", "--code", "alamouti", "--snr", "10", "--max-frames", "200", "--out",
                plain.toString());
        assertEquals("", p.err());
        assertEquals(0, resultsJson(plain).get("warnings").size());
    }

    /**
     * Pilots are reported as the README says: not charged to the SNR, reported as overhead. Alamouti
     * QPSK, 1024-bit frames: 512 symbols in 512 slots, one fading block, 2 pilot slots: overhead
     * 2/514 = 0.389 %, net R = 2·512/514 = 1.9922 bits per channel use; the same line on the terminal
     * and in the CSV header, the numbers in results.json.
     */
    @Test
    void pilotOverheadIsReported(@TempDir Path tmp) throws IOException {
        Path dir = tmp.resolve("pilots");
        CliTest.Outcome o = CliTest.run("run", "--code", "alamouti", "--pilots", "2", "--snr", "10", "--max-frames",
                "200", "--out", dir.toString());
        assertEquals(0, o.code(), o.err());
        String line = "pilots: 2 slots per fading block, not counted in the SNR or in R; overhead 0.39 % of the slots,"
                + " so 1.9922 net information bits per channel use";
        assertTrue(o.out().contains("\n" + line + "\n"), o.out());
        assertTrue(Files.readAllLines(dir.resolve("results.csv")).contains("# " + line));
        JsonNode json = resultsJson(dir);
        assertEquals(2.0 / 514, json.get("pilot_overhead").asDouble(), 1e-15);
        assertEquals(2.0 * 512 / 514, json.get("net_bits_per_channel_use").asDouble(), 1e-12);
        assertEquals(2.0, json.get("bits_per_channel_use").asDouble(), 1e-15, "R itself leaves the pilots out");
    }

    /** --plot-x and --plot-floor from the command line and from a scenario; bad values are refused up front. */
    @Test
    void plotOptions(@TempDir Path tmp) throws IOException {
        Path dir = tmp.resolve("ebn0");
        CliTest.Outcome o = CliTest.run("run", "--snr", "10", "--max-frames", "200", "--plot-x", "ebn0",
                "--plot-floor", "1e-7", "--out", dir.toString());
        assertEquals(0, o.code(), o.err());
        assertTrue(Files.readString(dir.resolve(FerPlot.SVG_FILE)).contains("Eb/N0 (dB)"));
        Path scenario = Files.writeString(tmp.resolve("s.yaml"), "output:\n  plot_x: ebn0\n  plot_floor: 1.0e-7\n");
        Path fromFile = tmp.resolve("file");
        assertEquals(0, CliTest.run("run", scenario.toString(), "--snr", "10", "--max-frames", "200", "--out",
                fromFile.toString()).code());
        assertTrue(Files.readString(fromFile.resolve(FerPlot.SVG_FILE)).contains("Eb/N0 (dB)"));

        CliTest.Outcome badX = CliTest.run("run", "--plot-x", "time", "--out", tmp.resolve("never").toString());
        assertEquals(2, badX.code());
        assertEquals("fadebench run: --plot-x: unknown x axis 'time'; valid: snr, ebn0", badX.err().trim());
        CliTest.Outcome badFloor = CliTest.run("run", "--plot-floor", "2", "--out", tmp.resolve("never").toString());
        assertEquals(2, badFloor.code());
        assertEquals("fadebench run: --plot-floor must lie strictly between 0 and 1 (e.g. 1e-6), got 2.0",
                badFloor.err().trim());
        assertTrue(Files.notExists(tmp.resolve("never")));
    }

    private static JsonNode resultsJson(Path dir) throws IOException {
        return new ObjectMapper().readTree(dir.resolve("results.json").toFile());
    }

    /** The key's line in the example, commented out or not. */
    private static Optional<String> line(List<String> lines, String key) {
        Pattern p = Pattern.compile("^\\s*(#\\s*)?" + Pattern.quote(key) + ":");
        return lines.stream().filter(l -> p.matcher(l).find()).findFirst();
    }

    private static List<String> names(Stream<String> s) {
        return s.toList();
    }

    /** Line breaks and runs of spaces as single spaces. */
    private static String collapse(String s) {
        return s.replaceAll("\\s+", " ").trim();
    }
}
