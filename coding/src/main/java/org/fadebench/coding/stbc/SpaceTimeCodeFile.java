package org.fadebench.coding.stbc;

import java.io.IOException;
import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Pattern;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;

/**
 * Reads and writes a linear space-time block code as a YAML or JSON file. The layout:
 * <pre>
 * name: sm2            # 1 to 64 letters, digits or . _ + -
 * tx: 2                # transmit antennas Mt
 * slots: 1             # slots (channel uses) per block T
 * symbols:             # one entry per complex symbol s_k = a_k + j·b_k, K entries
 *   - real:            # A_k, multiplies a_k = Re s_k: T rows (slots) of Mt entries (antennas)
 *       - [1, 0]
 *     imag:            # B_k, multiplies b_k = Im s_k: same shape
 *       - ["j", 0]
 *   - real: [[0, 1]]
 *     imag: [[0, "j"]]
 * </pre>
 * The block sent is X = Σ_k (a_k·A_k + b_k·B_k), a T x Mt matrix (rows are slots, columns
 * antennas). A symbol sent as s_k uses B_k = j·A_k; one sent conjugated, s_k*, uses B_k = −j·A_k.
 * An entry is a number ({@code 0.5}), a string of the form {@code "re+imj"} ({@code "0.5-0.5j"},
 * {@code "j"}, {@code "-2.5j"}, {@code "1e-3+2j"}; spaces allowed, the imaginary unit is written j),
 * or a pair {@code [re, im]} of numbers. JSON is read as the same layout
 * ({@code {"name": "sm2", "tx": 2, "slots": 1, "symbols": [{"real": [[1, 0]], "imag": [["j", 0]]}, …]}}).
 *
 * <p>Every key is required and no other key is allowed. Entries must be finite and at least one
 * entry of each symbol nonzero. On load the code is scaled to the power convention of
 * {@link SpaceTimeCode}: average total energy per slot (1/T)·Σ_k (‖A_k‖² + ‖B_k‖²)/2 = 1 for
 * unit-energy symbols; the factor applied is stated in {@link SpaceTimeCode#scaleNote()}. A file
 * already within 1e-12 of unit energy is taken as written, so writing a code and reading it back
 * gives identical matrices.
 *
 * <p>Parsing uses SnakeYAML's safe constructor, which builds only standard YAML values (maps,
 * lists, strings, numbers, booleans, ...) and never an arbitrary Java class; anything outside the
 * layout's maps, lists, strings and numbers is then rejected. Every problem is an {@link IllegalArgumentException} with a one-line
 * message naming the file, the problem and what is valid.
 */
public final class SpaceTimeCodeFile {

    private static final List<String> KEYS = List.of("name", "tx", "slots", "symbols");
    private static final List<String> SYMBOL_KEYS = List.of("real", "imag");
    private static final Pattern NAME = Pattern.compile("[A-Za-z0-9._+-]{1,64}");
    private static final Pattern REAL = Pattern.compile("[+-]?(?:[0-9]+(?:\\.[0-9]*)?|\\.[0-9]+)(?:[eE][+-]?[0-9]+)?");
    private static final String ENTRY_FORMS =
            "a number, a string such as \"0.5-0.5j\", \"j\" or \"-2j\", or a pair [re, im]";
    private static final double UNIT_ENERGY_TOLERANCE = 1e-12;
    /** Most transmit antennas, slots and symbols per block a code file may have (each). */
    public static final int MAX_SIZE = 64;
    /** Largest code file read, in bytes (SnakeYAML's own limit on a document is 3 Mi characters). */
    public static final long MAX_FILE_BYTES = 3L << 20;

    private SpaceTimeCodeFile() {
    }

    /** Reads a code file (YAML or JSON, UTF-8). */
    public static SpaceTimeCode read(Path file) {
        String text;
        try {
            if (!Files.isRegularFile(file)) {
                throw new IllegalArgumentException("code file " + file + ": " + (Files.isDirectory(file) ? "is a folder"
                        : Files.exists(file) ? "not a regular file (a pipe or a device?)" : "no such file")
                        + "; valid: a YAML or JSON file");
            }
            if (Files.size(file) > MAX_FILE_BYTES) {
                throw new IllegalArgumentException("code file " + file + ": larger than the limit of " + MAX_FILE_BYTES
                        + " bytes; valid: a code of at most " + MAX_SIZE + " antennas, slots and symbols");
            }
            text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new IllegalArgumentException("code file " + file + ": cannot be read (" + e.getClass().getSimpleName()
                    + "); valid: a readable UTF-8 YAML or JSON file");
        }
        return parse(text, file.toString());
    }

    /** Parses code-file text; {@code source} names it in error messages. */
    public static SpaceTimeCode parse(String text, String source) {
        return new Parser(source).code(load(text, source));
    }

    /** Writes {@code code} to {@code file} in the layout above (UTF-8 YAML). */
    public static void write(SpaceTimeCode code, Path file) throws IOException {
        Files.writeString(file, format(code), StandardCharsets.UTF_8);
    }

    /** The code in the layout above, as YAML text; entries are written so they read back exactly. */
    public static String format(SpaceTimeCode code) {
        int mt = code.transmitAntennas();
        int t = code.slotsPerBlock();
        StringBuilder sb = new StringBuilder();
        sb.append("# fadebench space-time code: ").append(code.symbolsPerBlock()).append(" symbols over ")
                .append(t).append(" slots on ").append(mt).append(" antennas\n");
        sb.append("# ").append(code.scaleNote()).append('\n');
        sb.append("name: \"").append(code.name()).append("\"\n");
        sb.append("tx: ").append(mt).append('\n');
        sb.append("slots: ").append(t).append('\n');
        sb.append("symbols:\n");
        for (int i = 0; i < code.symbolsPerBlock(); i++) {
            appendMatrix(sb, "  - real:\n", code.realDispersion(i), t, mt);
            appendMatrix(sb, "    imag:\n", code.imagDispersion(i), t, mt);
        }
        return sb.toString();
    }

    private static void appendMatrix(StringBuilder sb, String head, double[] m, int t, int mt) {
        sb.append(head);
        for (int r = 0; r < t; r++) {
            sb.append("      - [");
            for (int c = 0; c < mt; c++) {
                sb.append(c == 0 ? "\"" : ", \"")
                        .append(formatEntry(m[2 * (r * mt + c)], m[2 * (r * mt + c) + 1])).append('"');
            }
            sb.append("]\n");
        }
    }

    /** An entry as "re", "imj" or "re±imj", each number in Java's shortest exact form. */
    static String formatEntry(double re, double im) {
        if (im == 0) {
            return number(re);
        }
        if (re == 0) {
            return number(im) + "j";
        }
        return number(re) + (im < 0 ? "-" : "+") + number(Math.abs(im)) + "j";
    }

    private static String number(double x) {
        if (x == 0) {
            return "0";
        }
        String s = Double.toString(x);
        return s.endsWith(".0") ? s.substring(0, s.length() - 2) : s;
    }

    /**
     * Parses a string entry "re", "imj" or "re±imj" (spaces ignored; a lone "j" or "-j" is ±1);
     * returns {re, im}, or null when the text is not of that form.
     */
    static double[] parseComplex(String text) {
        String s = text.replaceAll("\\s+", "");
        if (!s.endsWith("j")) {
            return REAL.matcher(s).matches() ? new double[] {Double.parseDouble(s), 0.0} : null;
        }
        String body = s.substring(0, s.length() - 1);
        int split = -1;
        for (int i = body.length() - 1; i > 0 && split < 0; i--) {
            char c = body.charAt(i);
            char before = body.charAt(i - 1);
            if ((c == '+' || c == '-') && before != 'e' && before != 'E') {
                split = i;
            }
        }
        String re = split < 0 ? "0" : body.substring(0, split);
        String im = split < 0 ? body : body.substring(split);
        if (im.isEmpty() || im.equals("+") || im.equals("-")) {
            im = im + "1";
        }
        if (!REAL.matcher(re).matches() || !REAL.matcher(im).matches()) {
            return null;
        }
        return new double[] {Double.parseDouble(re), Double.parseDouble(im)};
    }

    private static Object load(String text, String source) {
        LoaderOptions options = new LoaderOptions();
        options.setAllowDuplicateKeys(false);
        // JSON allows tabs as whitespace, SnakeYAML does not. Outside strings they are insignificant
        // and inside JSON strings they are not allowed, so turning them into spaces is exact for JSON.
        String yaml = text.stripLeading().startsWith("{") ? text.replace('\t', ' ') : text;
        try {
            return new Yaml(new SafeConstructor(options)).load(yaml);
        } catch (MarkedYAMLException e) {
            Mark mark = e.getProblemMark();
            String where = mark == null ? "" : " at line " + (mark.getLine() + 1) + ", column " + (mark.getColumn() + 1);
            throw new IllegalArgumentException("code file " + source + ": not valid YAML or JSON: "
                    + oneLine(e.getProblem()) + where + "; valid: " + layout());
        } catch (YAMLException e) {
            throw new IllegalArgumentException("code file " + source + ": not valid YAML or JSON: "
                    + oneLine(e.getMessage()) + "; valid: " + layout());
        }
    }

    private static String oneLine(String s) {
        return s == null ? "unreadable" : s.replaceAll("\\s+", " ").trim();
    }

    private static String layout() {
        return "a mapping with keys " + String.join(", ", KEYS) + " (see SpaceTimeCodeFile)";
    }

    /** Walks the loaded tree for one file, failing with messages that name it. */
    private static final class Parser {

        private final String source;

        Parser(String source) {
            this.source = source;
        }

        private IllegalArgumentException fail(String problem, String valid) {
            return new IllegalArgumentException("code file " + source + ": " + problem + "; valid: " + valid);
        }

        SpaceTimeCode code(Object root) {
            if (root == null) {
                throw fail("is empty", layout());
            }
            Map<?, ?> top = mapping(root, "the top level", KEYS);
            String name = name(top.get("name"));
            int mt = positive(top.get("tx"), "tx");
            int t = positive(top.get("slots"), "slots");
            if (!(top.get("symbols") instanceof List) || ((List<?>) top.get("symbols")).isEmpty()) {
                throw fail("'symbols' must be a non-empty list, got " + describe(top.get("symbols")),
                        "one entry {real: [...], imag: [...]} per symbol");
            }
            List<?> symbols = (List<?>) top.get("symbols");
            int k = symbols.size();
            if (k > MAX_SIZE) {
                throw fail("'symbols' has " + k + " entries, more than " + MAX_SIZE, "1 to " + MAX_SIZE + " symbols per block");
            }
            double[][] a = new double[k][];
            double[][] b = new double[k][];
            for (int i = 0; i < k; i++) {
                String where = "symbol " + (i + 1);
                Map<?, ?> sym = mapping(symbols.get(i), where, SYMBOL_KEYS);
                a[i] = matrix(sym.get("real"), where + " real", t, mt);
                b[i] = matrix(sym.get("imag"), where + " imag", t, mt);
            }
            return normalised(name, mt, k, t, a, b);
        }

        private SpaceTimeCode normalised(String name, int mt, int k, int t, double[][] a, double[][] b) {
            double energy = SpaceTimeCode.averageSlotEnergy(a, b, t);
            double scale = SpaceTimeCode.unitEnergyScale(a, b, t);
            if (scale == 0) {
                throw fail("every dispersion matrix is zero", "at least one nonzero entry");
            }
            if (!(scale >= Double.MIN_NORMAL && scale < Double.POSITIVE_INFINITY)) {
                throw fail("the entries are too " + (scale > 1 ? "small" : "large")
                        + " to be scaled to unit energy per slot (the factor would be " + sixDigits(scale) + ")",
                        "entries whose largest magnitude lies between about 1e-300 and 1e300");
            }
            String note;
            if (Math.abs(energy - 1) <= UNIT_ENERGY_TOLERANCE) {
                note = "as written: the file's average energy per slot is 1";
            } else {
                for (int i = 0; i < k; i++) {
                    for (int c = 0; c < a[i].length; c++) {
                        a[i][c] *= scale;
                        b[i][c] *= scale;
                    }
                }
                // E = 1/scale², which may lie beyond the range of a double when the entries are huge or tiny
                String was = energy > 0 && energy < Double.POSITIVE_INFINITY ? sixDigits(energy)
                        : BigDecimal.ONE.divide(new BigDecimal(scale).pow(2), new MathContext(6)).toString();
                note = "scaled by " + sixDigits(scale) + " on load: the file's average energy per slot was " + was;
            }
            for (int i = 0; i < k; i++) {
                if (allZero(a[i]) && allZero(b[i])) {
                    throw fail("symbol " + (i + 1) + " is never sent: its real and imag matrices are all zero",
                            "at least one nonzero entry per symbol");
                }
            }
            return new SpaceTimeCode(name, mt, k, t, a, b, note, SpaceTimeCode.Kernel.GENERAL);
        }

        /** x to six significant digits, without trailing zeros: 2, 0.707107, 1.5e-20. */
        private static String sixDigits(double x) {
            String s = String.format(Locale.ROOT, "%.6g", x);
            return s.replaceAll("(\\.\\d*?)0+(?=$|e)", "$1").replaceAll("\\.(?=$|e)", "");
        }

        private static boolean allZero(double[] m) {
            for (double v : m) {
                if (v != 0) {
                    return false;
                }
            }
            return true;
        }

        /** A mapping with exactly the given keys. */
        private Map<?, ?> mapping(Object node, String where, List<String> keys) {
            String valid = "keys " + String.join(", ", keys);
            if (!(node instanceof Map)) {
                throw fail(where + " is " + describe(node) + ", not a mapping", valid);
            }
            Map<?, ?> map = (Map<?, ?>) node;
            for (Object key : map.keySet()) {
                if (!keys.contains(key)) {
                    throw fail(where + " has unknown key '" + key + "'", valid);
                }
            }
            for (String key : keys) {
                if (!map.containsKey(key)) {
                    throw fail(where + " lacks key '" + key + "'", valid);
                }
            }
            return map;
        }

        private String name(Object value) {
            if (!(value instanceof String) || !NAME.matcher((String) value).matches()) {
                throw fail("'name' is " + describe(value), "1 to 64 letters, digits or . _ + - (quote it if it looks like a number)");
            }
            return (String) value;
        }

        private int positive(Object value, String key) {
            if (!(value instanceof Integer) || (Integer) value < 1 || (Integer) value > MAX_SIZE) {
                throw fail("'" + key + "' is " + describe(value) + ", not a whole number from 1 to " + MAX_SIZE,
                        "1 to " + MAX_SIZE);
            }
            return (Integer) value;
        }

        /** A T x Mt complex matrix given as T rows of Mt entries. */
        private double[] matrix(Object node, String where, int t, int mt) {
            String shape = "one row per slot (" + t + "), each with one entry per transmit antenna (" + mt + ")";
            if (!(node instanceof List) || ((List<?>) node).size() != t) {
                throw fail(where + " is " + describe(node), shape);
            }
            List<?> rows = (List<?>) node;
            for (int r = 0; r < t; r++) {
                Object row = rows.get(r);
                if (!(row instanceof List) || ((List<?>) row).size() != mt) {
                    throw fail(where + " row " + (r + 1) + " is " + describe(row), shape);
                }
            }
            // the shape now matches entries present in the file, so its size is safe to allocate
            double[] m = new double[2 * t * mt];
            for (int r = 0; r < t; r++) {
                Object row = rows.get(r);
                for (int c = 0; c < mt; c++) {
                    double[] z = entry(((List<?>) row).get(c), where + " row " + (r + 1) + " entry " + (c + 1));
                    m[2 * (r * mt + c)] = z[0];
                    m[2 * (r * mt + c) + 1] = z[1];
                }
            }
            return m;
        }

        private double[] entry(Object node, String where) {
            double[] z = null;
            if (node instanceof Number) {
                z = new double[] {((Number) node).doubleValue(), 0.0};
            } else if (node instanceof String) {
                z = parseComplex((String) node);
            } else if (node instanceof List && ((List<?>) node).size() == 2
                    && ((List<?>) node).get(0) instanceof Number && ((List<?>) node).get(1) instanceof Number) {
                List<?> pair = (List<?>) node;
                z = new double[] {((Number) pair.get(0)).doubleValue(), ((Number) pair.get(1)).doubleValue()};
            }
            if (z == null) {
                throw fail(where + " is " + describe(node) + ", not a complex number", ENTRY_FORMS);
            }
            if (!Double.isFinite(z[0]) || !Double.isFinite(z[1])) {
                throw fail(where + " is " + describe(node) + ", not finite", "finite numbers");
            }
            return z;
        }

        /** Short description of a node for messages: its value for scalars, its kind otherwise. */
        private static String describe(Object node) {
            if (node == null) {
                return "missing or null";
            }
            if (node instanceof List) {
                return "a list of " + ((List<?>) node).size();
            }
            if (node instanceof Map) {
                return "a mapping";
            }
            if (node instanceof String) {
                String s = oneLine((String) node);
                return "'" + (s.length() > 40 ? s.substring(0, 40) + "..." : s) + "'";
            }
            if (node instanceof Number || node instanceof Boolean) {
                return node + " (" + node.getClass().getSimpleName().toLowerCase(Locale.ROOT) + ")";
            }
            return "a " + node.getClass().getSimpleName();
        }
    }
}
