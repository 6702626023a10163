package org.ringsweep.runner.store;

import java.util.Map;
import java.util.TreeMap;
import org.ringsweep.runner.results.ResultRecord;

/**
 * The canonical key of a point within one net file: the corner and the swept values, e.g.
 * {@code corner=typ;R5/value=22.0;U1.14/rise=1.5E-9}.
 *
 * <p>Rules: {@code corner=<corner>} first, then one {@code ;<path>=<value>} per swept path in
 * ascending {@link String#compareTo} order of the paths; values are printed by
 * {@link Double#toString(double)} (so {@code 22.0}, {@code 1.5E-9}, {@code -0.0}, {@code NaN}).
 * In the corner and the paths the characters {@code %}, {@code ;} and {@code =} are written as
 * {@code %25}, {@code %3B} and {@code %3D}, so the key is unambiguous. Two points have the same key
 * exactly when they have the same corner and the same swept values (bit for bit, as far as
 * {@code Double.toString} tells them apart, which it does for every distinct double).
 */
public final class PointKey {
    private PointKey() {
    }

    /**
     * The key of a point.
     *
     * @param corner the corner name ({@code typ} for the file's own values)
     * @param point  swept path → value (SI units); any order
     * @return the canonical key
     */
    public static String of(String corner, Map<String, Double> point) {
        StringBuilder b = new StringBuilder("corner=").append(escape(corner));
        for (Map.Entry<String, Double> e : new TreeMap<>(point).entrySet()) {
            b.append(';').append(escape(e.getKey())).append('=').append(Double.toString(e.getValue()));
        }
        return b.toString();
    }

    /** The key of a record's point: {@code of(r.corner(), r.point())}. */
    public static String of(ResultRecord r) {
        return of(r.corner(), r.point());
    }

    /**
     * The swept values a key holds (the inverse of {@link #of} for the values): path → value,
     * paths in key order. {@code Double.toString} text parses back to the same double, so the
     * values are the record's exactly.
     *
     * @throws IllegalArgumentException when the text is not a point key
     */
    public static Map<String, Double> values(String key) {
        if (!key.startsWith("corner=")) {
            throw new IllegalArgumentException("not a point key: `" + key + "`");
        }
        Map<String, Double> out = new java.util.LinkedHashMap<>();
        String[] parts = key.split(";", -1);
        for (int i = 1; i < parts.length; i++) {
            int eq = parts[i].lastIndexOf('=');
            if (eq < 0) {
                throw new IllegalArgumentException("not a point key: `" + key + "`");
            }
            out.put(unescape(parts[i].substring(0, eq)), Double.parseDouble(parts[i].substring(eq + 1)));
        }
        return out;
    }

    private static String unescape(String s) {
        if (s.indexOf('%') < 0) {
            return s;
        }
        StringBuilder b = new StringBuilder(s.length());
        for (int i = 0; i < s.length(); i++) {
            if (s.startsWith("%25", i) || s.startsWith("%3B", i) || s.startsWith("%3D", i)) {
                b.append(s.charAt(i + 2) == '5' ? '%' : s.charAt(i + 2) == 'B' ? ';' : '=');
                i += 2;
            } else {
                b.append(s.charAt(i));
            }
        }
        return b.toString();
    }

    private static String escape(String s) {
        if (s.indexOf('%') < 0 && s.indexOf(';') < 0 && s.indexOf('=') < 0) {
            return s;
        }
        return s.replace("%", "%25").replace(";", "%3B").replace("=", "%3D");
    }
}
