package org.ringsweep.api.net;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import org.apiguardian.api.API;

/**
 * A set of overrides applied to a net: a corner's values and/or a sweep's values, each a
 * {@link ValuePath} with its already-parsed {@link Value}. Immutable and ordered.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class Point {
    /** No overrides: the net's own values. */
    public static final Point NONE = new Point(Map.of());

    private final Map<ValuePath, Value> values;

    private Point(Map<ValuePath, Value> values) {
        this.values = Collections.unmodifiableMap(new LinkedHashMap<>(values));
    }

    /** A point from a map (copied; order kept). */
    public static Point of(Map<ValuePath, Value> values) {
        return values.isEmpty() ? NONE : new Point(values);
    }

    /** The overrides, read-only, in order. */
    public Map<ValuePath, Value> values() {
        return values;
    }

    /** This point followed by {@code later}, whose values win where both set a path. */
    public Point then(Point later) {
        Map<ValuePath, Value> merged = new LinkedHashMap<>(values);
        merged.putAll(later.values);
        return of(merged);
    }

    /** Whether there are no overrides. */
    public boolean isEmpty() {
        return values.isEmpty();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Point p && p.values.equals(values);
    }

    @Override
    public int hashCode() {
        return values.hashCode();
    }

    @Override
    public String toString() {
        return values.toString();
    }
}
