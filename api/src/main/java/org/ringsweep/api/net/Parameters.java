package org.ringsweep.api.net;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.apiguardian.api.API;

/**
 * An element's parameters by key, in file order. Immutable: {@link #with} returns a copy.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class Parameters {
    /** No parameters. */
    public static final Parameters EMPTY = new Parameters(Map.of(), Map.of());

    private final Map<String, Value> values;
    private final Map<String, Location> locations;

    private Parameters(Map<String, Value> values, Map<String, Location> locations) {
        this.values = Collections.unmodifiableMap(new LinkedHashMap<>(values));
        this.locations = Collections.unmodifiableMap(new LinkedHashMap<>(locations));
    }

    /** Parameters from a map (copied; iteration order kept). */
    public static Parameters of(Map<String, Value> values) {
        return new Parameters(values, Map.of());
    }

    /** Parameters with the location each came from (copied). */
    public static Parameters of(Map<String, Value> values, Map<String, Location> locations) {
        return new Parameters(values, locations);
    }

    /** The keys, in file order. */
    public Set<String> keys() {
        return values.keySet();
    }

    /** All values, read-only, in file order. */
    public Map<String, Value> asMap() {
        return values;
    }

    /** Whether {@code key} is set. */
    public boolean has(String key) {
        return values.containsKey(key);
    }

    /** The value of {@code key}, if set. */
    public Optional<Value> get(String key) {
        return Optional.ofNullable(values.get(key));
    }

    /** Where {@code key} was written, or {@link Location#UNKNOWN}. */
    public Location locationOf(String key) {
        return locations.getOrDefault(key, Location.UNKNOWN);
    }

    /**
     * The number under {@code key}.
     *
     * @throws IllegalArgumentException if it is absent or not a number
     */
    public double number(String key) {
        Value v = values.get(key);
        if (v instanceof Value.Number n) {
            return n.si();
        }
        throw new IllegalArgumentException("parameter `" + key + "` is " + (v == null ? "missing" : "not a number: " + v.display()));
    }

    /** The number under {@code key}, or {@code fallback} when absent. */
    public double number(String key, double fallback) {
        return has(key) ? number(key) : fallback;
    }

    /** A copy with {@code key} set to {@code value} (its location kept when it had one). */
    public Parameters with(String key, Value value) {
        Map<String, Value> copy = new LinkedHashMap<>(values);
        copy.put(key, java.util.Objects.requireNonNull(value, "value"));
        return new Parameters(copy, locations);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Parameters p && p.values.equals(values);
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
