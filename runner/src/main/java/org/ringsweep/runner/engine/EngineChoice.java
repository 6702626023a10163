package org.ringsweep.runner.engine;

import java.util.Locale;

/** The {@code --engine} option's values. */
public enum EngineChoice {
    /** ngspice when it is found, else the built-in engine once it exists. */
    AUTO,
    /** ngspice only. */
    NGSPICE,
    /** The in-process engine (runner.engine.builtin). */
    BUILTIN;

    /**
     * Reads the option's text, ignoring case.
     *
     * @param text {@code auto}, {@code ngspice} or {@code builtin}
     * @throws IllegalArgumentException naming the value and the accepted ones
     */
    public static EngineChoice parse(String text) {
        for (EngineChoice c : values()) {
            if (c.name().equalsIgnoreCase(text == null ? "" : text.strip())) {
                return c;
            }
        }
        throw new IllegalArgumentException("unknown engine `" + text + "`; expected `auto`, `ngspice` or `builtin`");
    }

    /** The option's spelling, e.g. {@code ngspice}. */
    @Override
    public String toString() {
        return name().toLowerCase(Locale.ROOT);
    }
}
