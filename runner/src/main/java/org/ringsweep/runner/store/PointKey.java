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

    private static String escape(String s) {
        if (s.indexOf('%') < 0 && s.indexOf(';') < 0 && s.indexOf('=') < 0) {
            return s;
        }
        return s.replace("%", "%25").replace(";", "%3B").replace("=", "%3D");
    }
}
