package org.fadebench.bench.settings;

/**
 * A setting's value is not valid. Carries the setting, so that the command line can say
 * {@code --rx must be …} and a scenario file {@code FILE line 7, key link.rx: …} (see
 * {@link SettingValues#locate}).
 */
public final class InvalidSettingException extends IllegalArgumentException {

    private static final long serialVersionUID = 1L;

    private final transient Setting setting;
    private final String problem;

    /**
     * @param problem what is wrong, without the setting's name: "must be between 1 and 64, got 0"
     */
    public InvalidSettingException(Setting setting, String problem) {
        super(join(setting.display(), problem));
        this.setting = setting;
        this.problem = problem;
    }

    /** "--rx must be …", or "--mod: unknown …" for a problem that starts with a colon. */
    static String join(String name, String problem) {
        return name + (problem.startsWith(":") ? "" : " ") + problem;
    }

    public Setting setting() {
        return setting;
    }

    /** The message without the setting's name. */
    public String problem() {
        return problem;
    }
}
