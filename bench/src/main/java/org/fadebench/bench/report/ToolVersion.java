package org.fadebench.bench.report;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Properties;

/**
 * The project version, from {@code version.properties}, which Maven fills in from the POM's version
 * when it builds (resource filtering): one source, for {@code --version} and results.json.
 */
public final class ToolVersion {

    private static final String VERSION = read();

    private ToolVersion() {
    }

    /** E.g. {@code 0.1.0-SNAPSHOT}. */
    public static String version() {
        return VERSION;
    }

    private static String read() {
        Properties p = new Properties();
        try (InputStream in = ToolVersion.class.getResourceAsStream("/org/fadebench/bench/version.properties")) {
            if (in == null) {
                throw new IllegalStateException("version.properties missing from the build");
            }
            p.load(in);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        String v = p.getProperty("version", "");
        if (v.isBlank() || v.contains("${")) {
            throw new IllegalStateException("version.properties was not filled in by the build: '" + v + "'");
        }
        return v;
    }
}
