package org.fadebench.bench.scenario;

import org.fadebench.bench.settings.SettingValues;

/**
 * A loaded scenario: the values it sets, each with the line it came from.
 *
 * @param source the file name (or built-in name) for messages
 * @param text   the file's text, kept for archives
 * @param values the settings the file sets (origins name the file and line)
 */
public record Scenario(String source, String text, SettingValues values) {
}
