package org.ringsweep.runner.results;

import java.util.Map;

/**
 * One edge's measured values as they appear in a result record: metric key (e.g.
 * {@code overshoot_v}) → value in SI units, in the order of {@code formats.md}. A NaN value is
 * written as JSON {@code null} ("not found", distinct from zero).
 *
 * @param metrics metric key → value
 */
public record EdgeResult(Map<String, Object> metrics) {
    /** Copies the map, keeping its order. */
    public EdgeResult {
        metrics = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(metrics));
    }
}
