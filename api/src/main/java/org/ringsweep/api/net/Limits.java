package org.ringsweep.api.net;

import java.util.Collections;
import java.util.EnumMap;
import java.util.Map;
import java.util.Optional;
import org.apiguardian.api.API;

/**
 * A set of limits, each optional. Immutable; {@link #overriddenBy} layers a receiver's limits
 * over the net's. Defaults for what nobody sets are the runner's business (it reports which
 * limits were defaulted).
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class Limits {
    /** No limit set. */
    public static final Limits NONE = new Limits(Map.of());

    private final Map<LimitName, Value> values;

    private Limits(Map<LimitName, Value> values) {
        EnumMap<LimitName, Value> copy = new EnumMap<>(LimitName.class);
        copy.putAll(values);
        this.values = Collections.unmodifiableMap(copy);
    }

    /** Limits from a map (copied). */
    public static Limits of(Map<LimitName, Value> values) {
        return values.isEmpty() ? NONE : new Limits(values);
    }

    /** The value set for {@code name}, if any. */
    public Optional<Value> get(LimitName name) {
        return Optional.ofNullable(values.get(name));
    }

    /** Every limit that is set, read-only. */
    public Map<LimitName, Value> asMap() {
        return values;
    }

    /** These limits with each limit set in {@code over} replacing this one's. */
    public Limits overriddenBy(Limits over) {
        EnumMap<LimitName, Value> merged = new EnumMap<>(LimitName.class);
        merged.putAll(values);
        merged.putAll(over.values);
        return new Limits(merged);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Limits l && l.values.equals(values);
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
