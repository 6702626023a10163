package org.ringsweep.runner.sweep;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.stream.IntStream;

/**
 * IEC 60063 preferred numbers (E series) as exact decimals. E3 to E24 use the standard's
 * two-digit table, which differs from rounding {@code 10^(i/n)} in places (E24 at eight, E12 at
 * five); E48 and E96 use its three-digit table; E192 is generated (see {@link Series#E192}).
 * See {@code impedance-and-standards.md} §5. Values are positive; all methods are pure.
 */
public final class ESeries {
    /** The series, each with its count of values per decade. */
    public enum Series {
        /** 3 values per decade (every 2nd E6). */
        E3(3),
        /** 6 values per decade (every 2nd E12). */
        E6(6),
        /** 12 values per decade. */
        E12(12),
        /** 24 values per decade. */
        E24(24),
        /** 48 values per decade (every 2nd E96). */
        E48(48),
        /** 96 values per decade. */
        E96(96),
        /**
         * 192 values per decade: {@code round(100·10^(i/192))}, except 920 where the formula gives
         * 919. The exception is from memory, as the reference marks it; every 2nd value is E96,
         * which the tests check against the table.
         */
        E192(192);

        private final int perDecade;

        Series(int perDecade) {
            this.perDecade = perDecade;
        }

        /** Values per decade. */
        public int perDecade() {
            return perDecade;
        }

        /**
         * The series named {@code name} (case-insensitive, e.g. {@code E24} or {@code e24}).
         *
         * @return the series, or empty for an unknown name
         */
        public static Optional<Series> named(String name) {
            return Arrays.stream(values()).filter(s -> s.name().equalsIgnoreCase(name.strip())).findFirst();
        }
    }

    // IEC 60063:2015 Table 1, as listed in impedance-and-standards.md §5.
    private static final int[] E24 = {10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91};
    // IEC 60063:2015 Table 2, as listed in impedance-and-standards.md §5.
    private static final int[] E96 = {100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150,
        154, 158, 162, 165, 169, 174, 178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243, 249, 255, 261, 267,
        274, 280, 287, 294, 301, 309, 316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412, 422, 432, 442, 453, 464, 475,
        487, 499, 511, 523, 536, 549, 562, 576, 590, 604, 619, 634, 649, 665, 681, 698, 715, 732, 750, 768, 787, 806, 825, 845,
        866, 887, 909, 931, 953, 976};

    private static final Map<Series, List<BigDecimal>> DECADES = new EnumMap<>(Series.class);

    static {
        for (Series s : Series.values()) {
            DECADES.put(s, mantissas(s));
        }
    }

    private ESeries() {
    }

    /**
     * The mantissas of one decade, ascending, in [1, 10): E24 gives 1.0 1.1 1.2 … 9.1 (scale 1),
     * E96 gives 1.00 1.02 … 9.76 (scale 2).
     */
    public static List<BigDecimal> decade(Series s) {
        return DECADES.get(s);
    }

    private static List<BigDecimal> mantissas(Series s) {
        int[] digits = switch (s) {
            case E3 -> everyNth(E24, 8);
            case E6 -> everyNth(E24, 4);
            case E12 -> everyNth(E24, 2);
            case E24 -> E24;
            case E48 -> everyNth(E96, 2);
            case E96 -> E96;
            case E192 -> e192();
        };
        int scale = s.perDecade() <= 24 ? 1 : 2;
        return Arrays.stream(digits).mapToObj(d -> BigDecimal.valueOf(d, scale)).toList();
    }

    /** Every n-th entry starting with the first (E12 is every 2nd E24, E6 every 2nd E12...). */
    private static int[] everyNth(int[] table, int n) {
        return IntStream.range(0, table.length / n).map(i -> table[i * n]).toArray();
    }

    private static int[] e192() {
        int[] v = IntStream.range(0, 192).map(i -> (int) Math.round(100 * Math.pow(10, i / 192.0))).toArray();
        for (int i = 0; i < v.length; i++) {
            if (v[i] == 919) {
                v[i] = 920;
            }
        }
        return v;
    }

    /**
     * All preferred values in [{@code from}, {@code to}] over every decade, ascending, as exact
     * decimals: {@code between(E24, 10, 100)} is 10 11 … 91 100.
     *
     * @throws IllegalArgumentException unless 0 &lt; from ≤ to, both finite
     */
    public static List<BigDecimal> betweenExact(Series s, double from, double to) {
        if (!(from > 0) || !(to >= from) || !Double.isFinite(to)) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, "expected 0 < from <= to, found %s and %s", from, to));
        }
        BigDecimal lo = BigDecimal.valueOf(from);
        BigDecimal hi = BigDecimal.valueOf(to);
        List<BigDecimal> out = new ArrayList<>();
        for (int d = decadeOf(from) - 1; d <= decadeOf(to) + 1; d++) {
            for (BigDecimal m : decade(s)) {
                BigDecimal c = m.scaleByPowerOfTen(d);
                if (c.compareTo(lo) >= 0 && c.compareTo(hi) <= 0) {
                    out.add(c);
                }
            }
        }
        return List.copyOf(out);
    }

    /**
     * As {@link #betweenExact}, each value the double nearest its decimal (4.7 is the double
     * {@code 4.7}, not 4.7000000001).
     */
    public static List<Double> between(Series s, double from, double to) {
        return betweenExact(s, from, to).stream().map(BigDecimal::doubleValue).toList();
    }

    /**
     * The preferred value nearest {@code x} on a logarithmic scale: the smallest
     * {@code |ln(candidate / x)|} over the decades around x (§5 snapping). An exact geometric tie
     * goes to the lower value.
     *
     * @throws IllegalArgumentException unless x is positive and finite
     */
    public static BigDecimal nearestExact(Series s, double x) {
        requirePositive(x);
        BigDecimal best = null;
        double bestDistance = Double.POSITIVE_INFINITY;
        for (BigDecimal c : candidates(s, x)) {
            double distance = Math.abs(Math.log(c.doubleValue() / x));
            if (distance < bestDistance) {
                best = c;
                bestDistance = distance;
            }
        }
        return best;
    }

    /** As {@link #nearestExact}, as a double. */
    public static double nearest(Series s, double x) {
        return nearestExact(s, x).doubleValue();
    }

    /** The smallest preferred value strictly above {@code x} (for a value that must exceed a bound). */
    public static double nextUp(Series s, double x) {
        BigDecimal bx = BigDecimal.valueOf(requirePositive(x));
        return candidates(s, x).stream().filter(c -> c.compareTo(bx) > 0).findFirst().orElseThrow().doubleValue();
    }

    /** The largest preferred value strictly below {@code x}. */
    public static double nextDown(Series s, double x) {
        BigDecimal bx = BigDecimal.valueOf(requirePositive(x));
        List<BigDecimal> below = candidates(s, x).stream().filter(c -> c.compareTo(bx) < 0).toList();
        return below.get(below.size() - 1).doubleValue();
    }

    /** The smallest preferred value at or above {@code x} (x itself when it is one). */
    public static double ceiling(Series s, double x) {
        BigDecimal bx = BigDecimal.valueOf(requirePositive(x));
        return candidates(s, x).stream().filter(c -> c.compareTo(bx) >= 0).findFirst().orElseThrow().doubleValue();
    }

    /** The largest preferred value at or below {@code x} (x itself when it is one). */
    public static double floor(Series s, double x) {
        BigDecimal bx = BigDecimal.valueOf(requirePositive(x));
        List<BigDecimal> below = candidates(s, x).stream().filter(c -> c.compareTo(bx) <= 0).toList();
        return below.get(below.size() - 1).doubleValue();
    }

    /** The values of the decades d−1, d and d+1 around x, ascending: they bracket x from both sides. */
    private static List<BigDecimal> candidates(Series s, double x) {
        int d = decadeOf(x);
        List<BigDecimal> out = new ArrayList<>();
        for (int k = d - 1; k <= d + 1; k++) {
            for (BigDecimal m : decade(s)) {
                out.add(m.scaleByPowerOfTen(k));
            }
        }
        return out;
    }

    /** floor(log10(x)) from the exact decimal, so 1000 is decade 3 even where log10 rounds. */
    private static int decadeOf(double x) {
        BigDecimal b = BigDecimal.valueOf(x).stripTrailingZeros();
        return b.precision() - b.scale() - 1;
    }

    private static double requirePositive(double x) {
        if (!(x > 0) || !Double.isFinite(x)) {
            throw new IllegalArgumentException("expected a positive finite value, found " + x);
        }
        return x;
    }
}
