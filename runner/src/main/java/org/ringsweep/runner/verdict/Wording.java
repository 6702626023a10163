package org.ringsweep.runner.verdict;

import java.util.Locale;

/** Numbers for messages: a measured value and its limit printed so that they visibly differ. */
final class Wording {
    private static final int MIN_DECIMALS = 2;
    private static final int MAX_DECIMALS = 6;

    private Wording() {
    }

    /** One voltage, e.g. {@code 2.00 V} or {@code 1.755 V}. */
    static String volts(double x) {
        String s = fixed(x, 3);
        if (s.endsWith("0")) {
            s = s.substring(0, s.length() - 1);
        }
        return s + " V";
    }

    /** A measured voltage and its limit, with enough decimals (at least two) to tell them apart. */
    static String[] volts(double measured, double limit) {
        return apart(measured, limit, 1, " V");
    }

    /** A measured time and its limit in one SI prefix chosen by the larger, e.g. {@code 2.35 ns}. */
    static String[] seconds(double measured, double limit) {
        double m = Math.max(Math.abs(measured), Math.abs(limit));
        if (m >= 1) {
            return apart(measured, limit, 1, " s");
        } else if (m >= 1e-3) {
            return apart(measured, limit, 1e-3, " ms");
        } else if (m >= 1e-6) {
            return apart(measured, limit, 1e-6, " µs");
        } else if (m >= 1e-9) {
            return apart(measured, limit, 1e-9, " ns");
        }
        return apart(measured, limit, 1e-12, " ps");
    }

    private static String[] apart(double measured, double limit, double scale, String unit) {
        String a = "";
        String b = "";
        for (int d = MIN_DECIMALS; d <= MAX_DECIMALS; d++) {
            a = fixed(measured / scale, d);
            b = fixed(limit / scale, d);
            if (Double.parseDouble(a) != Double.parseDouble(b)) {
                break;
            }
        }
        return new String[] {a + unit, b + unit};
    }

    private static String fixed(double x, int decimals) {
        String s = String.format(Locale.ROOT, "%." + decimals + "f", x + 0.0);
        // "-0.00" reads as a sign error; a value that rounds to zero is printed as zero.
        return Double.parseDouble(s) == 0 ? s.replace("-", "") : s;
    }
}
