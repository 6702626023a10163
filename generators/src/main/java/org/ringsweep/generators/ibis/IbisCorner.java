package org.ringsweep.generators.ibis;

import java.util.Locale;

/**
 * One of the three data columns of an IBIS file. By the standard's convention {@code min} is the
 * slow, weak corner and {@code max} the fast, strong one (impedance-and-standards.md §7).
 */
public enum IbisCorner {
    /** The typical column. */
    TYP,
    /** The minimum (slow, weak) column. */
    MIN,
    /** The maximum (fast, strong) column. */
    MAX;

    /** The word used in net files: {@code typ}, {@code min} or {@code max}. */
    public String word() {
        return name().toLowerCase(Locale.ROOT);
    }

    /**
     * The corner for a word.
     *
     * @throws IllegalArgumentException if the word is not typ, min or max
     */
    public static IbisCorner of(String word) {
        for (IbisCorner c : values()) {
            if (c.word().equals(word)) {
                return c;
            }
        }
        throw new IllegalArgumentException("expected typ, min or max, found `" + word + "`");
    }
}
