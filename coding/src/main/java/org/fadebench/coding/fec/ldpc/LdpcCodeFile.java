package org.fadebench.coding.fec.ldpc;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;
import org.yaml.snakeyaml.nodes.Tag;

/**
 * A user's LDPC code: its parity-check matrix H read from a file, chosen by the file's extension.
 * <ul>
 * <li>{@code .mtx}: Matrix Market coordinate format, read by {@link MatrixMarketReader};</li>
 * <li>{@code .yaml} or {@code .yml}: a quasi-cyclic base matrix in a layout of our own, expanded by
 * {@link QcBaseMatrix}:
 * <pre>
 * lifting: 8            # Z, the size of each circulant block
 * base:                 # one list per base row, one shift per base column, all rows equally long
 *   - [0, 3, -1, 1, 0, -1]   # -1: the Z x Z zero block; s from 0 to Z-1: the identity shifted by s
 *   - [5, -1, 2, -1, 0, 0]
 * </pre>
 * Both keys are required and no other is allowed; a shift is a plain whole number.</li>
 * </ul>
 * Either way the matrix must be within one set of {@link MatrixLimits} (YAML files also within
 * {@link #YAML_FILE_BYTES}), every column must hold a one (a bit no check covers is refused), and H
 * must have full row rank over GF(2) with rank below n: a rank-deficient H (some rows sums of
 * others) is refused with its rank, so that k = n − m always, as the file's shape says; a rank
 * equal to n leaves no codeword but zero. Every problem is an {@link IllegalArgumentException} with
 * a one-line message naming the file (and the line where there is one) and what is valid.
 */
public final class LdpcCodeFile {

    /** The extensions read, each with its format. */
    public static final List<String> EXTENSIONS = List.of(".mtx", ".yaml", ".yml");

    /** Largest YAML file read, in bytes (the YAML parser's own limit on a document is 3 Mi characters). */
    public static final long YAML_FILE_BYTES = 3L << 20;

    private static final List<String> KEYS = List.of("lifting", "base");
    private static final Pattern WHOLE = Pattern.compile("[-+]?[0-9]{1,10}");
    private static final String LAYOUT = "a mapping with keys lifting (Z) and base (rows of shifts, -1 for a zero block)";

    private LdpcCodeFile() {
    }

    /** Reads and checks {@code file} within the {@link MatrixLimits#DEFAULT default limits}. */
    public static ParityCheckMatrix read(Path file) {
        return read(file, MatrixLimits.DEFAULT);
    }

    /** Reads and checks {@code file} within {@code limits}. */
    public static ParityCheckMatrix read(Path file, MatrixLimits limits) {
        String name = file.getFileName() == null ? "" : file.getFileName().toString().toLowerCase(Locale.ROOT);
        ParityCheckMatrix h;
        if (name.endsWith(".mtx")) {
            h = MatrixMarketReader.read(file, limits);
        } else if (name.endsWith(".yaml") || name.endsWith(".yml")) {
            h = readYaml(file, limits);
        } else {
            throw new IllegalArgumentException("parity-check file " + file + ": unknown extension; valid: "
                    + String.join(", ", EXTENSIONS) + " (Matrix Market, or a quasi-cyclic base matrix in YAML)");
        }
        Runtime rt = Runtime.getRuntime();
        check(h, file.toString(), rt.maxMemory() - (rt.totalMemory() - rt.freeMemory()));
        return h;
    }

    /** Parses YAML text in the layout above; {@code source} names it in messages. Not yet {@link #check checked}. */
    static ParityCheckMatrix parseYaml(String text, String source, MatrixLimits limits) {
        return new YamlParser(source, limits).base(compose(text, source)).expand();
    }

    /**
     * Refuses a matrix with a column of no ones, one whose dense copy for GF(2) elimination would
     * not fit in three quarters of {@code freeHeapBytes}, one whose rank over GF(2) is below its
     * rows, and one whose rank equals its columns (no codeword but zero).
     */
    static void check(ParityCheckMatrix h, String source, long freeHeapBytes) {
        for (int j = 0; j < h.columns(); j++) {
            if (h.columnDegree(j) == 0) {
                throw new IllegalArgumentException("parity-check file " + source + ": column " + (j + 1)
                        + " (counting from 1) has no ones, so no check covers its bit; valid: at least one one in"
                        + " every column");
            }
        }
        long denseBytes = h.rows() * (16 + 8L * ((h.columns() + 63) >>> 6)); // one long[] per row, with its header
        if (denseBytes > freeHeapBytes / 4 * 3) {
            throw new IllegalArgumentException("parity-check file " + source + ": the GF(2) elimination that derives the"
                    + " encoder of its " + h.rows() + " x " + h.columns() + " matrix needs about " + mebibytes(denseBytes)
                    + " MiB, but the Java heap has " + mebibytes(freeHeapBytes) + " MiB free; valid: a smaller matrix,"
                    + " or a larger heap (java -Xmx...)");
        }
        int rank = Gf2Elimination.rank(h);
        if (rank == h.columns()) {
            throw new IllegalArgumentException("parity-check file " + source + ": rank " + rank + " over GF(2) equals its "
                    + h.columns() + " columns, so the only codeword is zero; valid: rank below the number of columns");
        }
        if (rank < h.rows()) {
            throw new IllegalArgumentException("parity-check file " + source + ": rank " + rank + " over GF(2) is below its "
                    + h.rows() + " rows: " + (h.rows() - rank) + " row(s) are sums of others; valid: a matrix of full row"
                    + " rank (remove the redundant rows)");
        }
    }

    private static long mebibytes(long bytes) {
        return (bytes + (1 << 20) - 1) >> 20;
    }

    private static ParityCheckMatrix readYaml(Path file, MatrixLimits limits) {
        String text;
        try {
            MatrixMarketReader.checkFile(file, Math.min(limits.fileBytes(), YAML_FILE_BYTES), "a YAML base matrix");
            text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new IllegalArgumentException("parity-check file " + file + ": cannot be read ("
                    + e.getClass().getSimpleName() + "); valid: a readable UTF-8 YAML file");
        }
        return parseYaml(text, file.toString(), limits);
    }

    /** The YAML node tree (no Java object is built from it). */
    private static Node compose(String text, String source) {
        try {
            Node root = new Yaml(new SafeConstructor(new LoaderOptions())).compose(new StringReader(text));
            if (root == null) {
                throw new IllegalArgumentException("parity-check file " + source + ": is empty; valid: " + LAYOUT);
            }
            return root;
        } catch (MarkedYAMLException e) {
            Mark mark = e.getProblemMark();
            throw new IllegalArgumentException("parity-check file " + source
                    + (mark == null ? "" : " line " + (mark.getLine() + 1)) + ": not valid YAML: "
                    + oneLine(e.getProblem()) + "; valid: " + LAYOUT);
        } catch (YAMLException e) {
            throw new IllegalArgumentException("parity-check file " + source + ": not valid YAML: "
                    + oneLine(e.getMessage()) + "; valid: " + LAYOUT);
        }
    }

    private static String oneLine(String s) {
        return s == null ? "unreadable" : s.replaceAll("\\s+", " ").trim();
    }

    /** Walks the node tree of one file, failing with messages that name it and the line. */
    private static final class YamlParser {

        private final String source;
        private final MatrixLimits limits;

        YamlParser(String source, MatrixLimits limits) {
            this.source = source;
            this.limits = limits;
        }

        private IllegalArgumentException fail(Node at, String problem, String valid) {
            return fail(at, problem + "; valid: " + valid);
        }

        private IllegalArgumentException fail(Node at, String message) {
            return new IllegalArgumentException("parity-check file " + source + " line "
                    + (at.getStartMark().getLine() + 1) + ": " + message);
        }

        QcBaseMatrix base(Node root) {
            if (!(root instanceof MappingNode)) {
                throw fail(root, "the top level is " + describe(root) + ", not a mapping", LAYOUT);
            }
            Node lifting = null;
            Node base = null;
            for (NodeTuple t : ((MappingNode) root).getValue()) {
                String key = t.getKeyNode() instanceof ScalarNode ? ((ScalarNode) t.getKeyNode()).getValue() : null;
                if (key == null || !KEYS.contains(key)) {
                    throw fail(t.getKeyNode(), "unknown key " + describe(t.getKeyNode()), "keys " + String.join(", ", KEYS));
                }
                if ((key.equals("lifting") ? lifting : base) != null) {
                    throw fail(t.getKeyNode(), "key '" + key + "' given twice", "each key once");
                }
                if (key.equals("lifting")) {
                    lifting = t.getValueNode();
                } else {
                    base = t.getValueNode();
                }
            }
            for (String key : KEYS) {
                if ((key.equals("lifting") ? lifting : base) == null) {
                    throw fail(root, "the key '" + key + "' is missing", "keys " + String.join(", ", KEYS));
                }
            }
            int z = whole(lifting, "lifting", 1, limits.dimension());
            List<List<Node>> rows = rows(base);
            int baseRows = rows.size();
            int baseColumns = rows.get(0).size();
            long m = (long) baseRows * z;
            long n = (long) baseColumns * z;
            if (m > limits.dimension() || n > limits.dimension()) {
                throw fail(lifting, "lifting " + z + " with a " + baseRows + " x " + baseColumns + " base matrix gives "
                        + m + " x " + n, "rows and columns up to " + limits.dimension());
            }
            String dense = MatrixLimits.denseProblem(m, n);
            if (dense != null) {
                throw fail(lifting, dense);
            }
            int[][] shifts = new int[baseRows][baseColumns];
            long edges = 0;
            for (int i = 0; i < baseRows; i++) {
                for (int j = 0; j < baseColumns; j++) {
                    Node entry = rows.get(i).get(j);
                    String what = "base row " + (i + 1) + ", entry " + (j + 1);
                    shifts[i][j] = whole(entry, what, -1, z - 1);
                    edges += shifts[i][j] >= 0 ? z : 0;
                }
            }
            if (edges > limits.edges()) {
                throw fail(base, "the matrix has " + edges + " ones", "at most " + limits.edges());
            }
            for (int j = 0; j < baseColumns; j++) {
                boolean zero = true;
                for (int i = 0; i < baseRows && zero; i++) {
                    zero = shifts[i][j] < 0;
                }
                if (zero) {
                    throw fail(base, "base column " + (j + 1) + " is -1 in every row, so no check covers its " + z
                            + " bits", "at least one shift in every column");
                }
            }
            return new QcBaseMatrix(shifts, z);
        }

        /** The base matrix's rows, each a list of entry nodes, all of one length. */
        private List<List<Node>> rows(Node base) {
            String shape = "a list of rows, each a list of shifts, all rows of one length";
            if (!(base instanceof SequenceNode) || ((SequenceNode) base).getValue().isEmpty()) {
                throw fail(base, "base is " + describe(base), shape);
            }
            List<List<Node>> rows = new ArrayList<>();
            for (Node row : ((SequenceNode) base).getValue()) {
                if (!(row instanceof SequenceNode) || ((SequenceNode) row).getValue().isEmpty()) {
                    throw fail(row, "base row " + (rows.size() + 1) + " is " + describe(row), shape);
                }
                List<Node> entries = ((SequenceNode) row).getValue();
                if (!rows.isEmpty() && entries.size() != rows.get(0).size()) {
                    throw fail(row, "base row " + (rows.size() + 1) + " has " + entries.size() + " entries",
                            rows.get(0).size() + " entries in every row, as in row 1");
                }
                rows.add(entries);
            }
            return rows;
        }

        /** A plain whole number from {@code min} to {@code max}. */
        private int whole(Node node, String what, int min, int max) {
            String valid = min == -1 ? "-1 (a zero block) or a shift from 0 to " + max + " (lifting " + (max + 1) + ")"
                    : "a whole number from " + min + " to " + max;
            if (!(node instanceof ScalarNode) || !Tag.INT.equals(node.getTag())
                    || !WHOLE.matcher(((ScalarNode) node).getValue()).matches()) {
                throw fail(node, what + " is " + describe(node) + ", not a whole number", valid);
            }
            long v = Long.parseLong(((ScalarNode) node).getValue());
            if (v < min || v > max) {
                throw fail(node, what + " is " + v, valid);
            }
            return (int) v;
        }

        /** A node in a message: a scalar's text, or its kind. */
        private static String describe(Node node) {
            if (node instanceof SequenceNode) {
                return "a list of " + ((SequenceNode) node).getValue().size();
            }
            if (node instanceof MappingNode) {
                return "a mapping";
            }
            String s = oneLine(((ScalarNode) node).getValue());
            return Tag.NULL.equals(node.getTag()) ? "empty" : "'" + (s.length() > 40 ? s.substring(0, 40) + "..." : s) + "'";
        }
    }
}
