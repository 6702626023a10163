package org.ringsweep.runner.report;

import java.util.Locale;
import org.ringsweep.runner.results.ViolationRecord;

/** Numbers and violations in words for reports. Locale-independent (a dot as decimal mark). */
final class Format {
    private Format() {
    }

    /** A voltage with two decimals, e.g. {@code 0.62 V}; a dash for NaN. */
    static String volts(double v) {
        return Double.isFinite(v) ? fixed(v, 2) + " V" : "–";
    }

    /** A time in ns with two decimals, e.g. {@code 4.10 ns}; a dash for NaN. */
    static String ns(double seconds) {
        return Double.isFinite(seconds) ? fixed(seconds * 1e9, 2) + " ns" : "–";
    }

    /** A measured value and its limit with enough decimals (2 to 6) that they visibly differ. */
    static String[] apart(double measured, double limit, double scale, String unit) {
        String a = "";
        String b = "";
        for (int d = 2; d <= 6; d++) {
            a = fixed(measured / scale, d);
            b = fixed(limit / scale, d);
            if (Double.parseDouble(a) != Double.parseDouble(b)) {
                break;
            }
        }
        return new String[] {a + unit, b + unit};
    }

    /**
     * A violation as metric, value and limit, e.g. {@code overshoot_v 0.62 V exceeds overshoot_max
     * 0.30 V}: the JUnit failure message, one line a CI page can show.
     */
    static String violation(ViolationRecord v) {
        String[] volts = apart(v.measured(), v.value(), 1, " V");
        String[] ns = apart(v.measured(), v.value(), 1e-9, " ns");
        String d = v.defaulted() ? " (defaulted)" : "";
        return switch (v.limit()) {
            case "overshoot_max" -> "overshoot_v " + volts[0] + " exceeds overshoot_max " + volts[1] + d;
            case "undershoot_max" -> "undershoot_v " + volts[0] + " exceeds undershoot_max " + volts[1] + d;
            case "ringback_margin_min" -> "ringback_margin_v " + volts[0] + " is below ringback_margin_min " + volts[1] + d;
            case "crossings_max" -> "crossings " + Math.round(v.measured()) + " exceeds crossings_max " + Math.round(v.value()) + d;
            case "monotonic" -> "not monotonic: turns back by " + volts[0] + " between VIL and VIH, more than the hysteresis " + volts[1] + d;
            case "settle_max" -> "settle_s " + ns[0] + " exceeds settle_max " + ns[1];
            case "delay_max" -> "delay_s " + ns[0] + " exceeds delay_max " + ns[1];
            case "settled" -> "not settled: still " + volts[0] + " from the final level at the end of the window, settle band ±" + volts[1] + d;
            case "threshold_not_reached" -> "threshold not reached: the edge gets to " + volts[0] + ", threshold " + volts[1];
            default -> v.limit() + ": measured " + v.measured() + ", limit " + v.value();
        };
    }

    /** Plain decimal with {@code decimals} places; a value that rounds to zero prints without a minus sign. */
    static String fixed(double x, int decimals) {
        String s = String.format(Locale.ROOT, "%." + decimals + "f", x + 0.0);
        return Double.parseDouble(s) == 0 ? s.replace("-", "") : s;
    }

    /** A swept value with an SI prefix and up to 4 significant digits, e.g. {@code 22}, {@code 1.5n}, {@code 4.7k}. */
    static String si(double v) {
        if (!Double.isFinite(v)) {
            return "–";
        }
        if (v == 0) {
            return "0";
        }
        String[] prefixes = {"f", "p", "n", "µ", "m", "", "k", "M", "G"};
        int exp = (int) Math.floor(Math.log10(Math.abs(v)) / 3);
        exp = Math.max(-5, Math.min(3, exp));
        double scaled = v / Math.pow(10, exp * 3.0);
        String s = new java.math.BigDecimal(scaled).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
        return s + prefixes[exp + 5];
    }
}
