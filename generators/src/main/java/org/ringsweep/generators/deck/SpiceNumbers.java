package org.ringsweep.generators.deck;

import java.util.Locale;

/**
 * Numbers for a deck: plain Java exponent form in {@link Locale#ROOT} ({@code 1.25e-09},
 * {@code 2.2e+01}, {@code 0}), 15 significant digits, trailing zeros of the mantissa removed.
 * Never SPICE suffixes: ngspice reads {@code M} as milli (ngspice.md §6).
 */
final class SpiceNumbers {
    private SpiceNumbers() {
    }

    static String format(double v) {
        if (!Double.isFinite(v)) {
            throw new DeckWriteException("a deck value must be finite, found " + v);
        }
        if (v == 0) {
            return "0";
        }
        String s = String.format(Locale.ROOT, "%.14e", v);
        int e = s.indexOf('e');
        String mantissa = s.substring(0, e);
        if (mantissa.indexOf('.') >= 0) {
            mantissa = mantissa.replaceAll("0+$", "");
            if (mantissa.endsWith(".")) {
                mantissa = mantissa.substring(0, mantissa.length() - 1);
            }
        }
        return mantissa + s.substring(e);
    }
}
