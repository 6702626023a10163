package org.ringsweep.runner.importer;

import java.util.List;
import java.util.regex.Pattern;

/**
 * A name pattern of the board file: {@code *} any run of characters, {@code ?} one character,
 * everything else literal; matched case-insensitively over the whole name ({@code U1.*} matches
 * {@code u1.14}), because netlist exports differ in case.
 *
 * @param text the pattern as written
 */
public record Glob(String text) {
    /** The pattern as a regular expression. */
    public Pattern regex() {
        StringBuilder b = new StringBuilder();
        for (char c : text.toCharArray()) {
            if (c == '*') {
                b.append(".*");
            } else if (c == '?') {
                b.append('.');
            } else {
                b.append(Pattern.quote(String.valueOf(c)));
            }
        }
        return Pattern.compile(b.toString(), Pattern.CASE_INSENSITIVE | Pattern.UNICODE_CASE);
    }

    /** Whether the whole {@code name} matches. */
    public boolean matches(String name) {
        return regex().matcher(name).matches();
    }

    /** The first pattern of {@code globs} matching {@code name}, or null. */
    public static Glob first(List<Glob> globs, String name) {
        for (Glob g : globs) {
            if (g.matches(name)) {
                return g;
            }
        }
        return null;
    }

    @Override
    public String toString() {
        return text;
    }
}
