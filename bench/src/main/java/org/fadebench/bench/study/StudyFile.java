package org.fadebench.bench.study;

import java.util.List;
import org.fadebench.bench.settings.Setting;
import org.fadebench.bench.settings.SettingValues;

/**
 * A study file as read ({@link StudyLoader}): the common settings, the designs it names or crosses,
 * and the study's own analysis keys. Nothing here is checked as a link yet; {@link StudyPlan} does that.
 *
 * @param source       the file name, for messages
 * @param title        the study's {@code title:}, or the file name when it has none
 * @param text         the file's text
 * @param common       the scenario sections' values shared by every design (origins name the file and line)
 * @param designs      the designs in file order
 * @param budgetDb     {@code analysis.budget_db}, NaN when not given
 * @param screen       {@code analysis.screen}
 * @param screenMargin {@code analysis.screen_margin}, the factor over the target FER (see {@link Screening})
 * @param grid         the values of {@code vary:}, each with its line, to name a value no design can use
 */
public record StudyFile(String source, String title, String text, SettingValues common, List<Design> designs, double budgetDb,
                        boolean screen, double screenMargin, List<GridValue> grid) {

    /**
     * One design: its name and the link settings it sets over the common ones.
     *
     * @param line     the line of its name in the file (or of its first grid value)
     * @param fromGrid true when {@code vary:} made it: it is skipped, not refused, when its
     *                 combination is impossible
     * @param values   the link values it sets (origins name the file and line)
     * @param grid     the values of {@code vary:} it takes
     */
    public record Design(String name, int line, boolean fromGrid, SettingValues values, List<GridValue> grid) {
    }

    /** One value of {@code vary:}: the setting, its text as written and its line. */
    public record GridValue(Setting setting, String text, int line) {
    }
}
