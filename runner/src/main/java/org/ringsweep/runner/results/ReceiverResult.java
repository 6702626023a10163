package org.ringsweep.runner.results;

import java.util.List;
import java.util.Map;

/**
 * One receiver's verdict and per-edge measurements.
 *
 * @param pin        the receiver pin as the user wrote it
 * @param verdict    pass or fail
 * @param edges      edge word ({@code rise}, {@code fall}) → measured values, in stimulus order
 * @param violations the violated limits
 */
public record ReceiverResult(String pin, Verdict verdict, Map<String, EdgeResult> edges, List<ViolationRecord> violations) {
    /** Copies. */
    public ReceiverResult {
        edges = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(edges));
        violations = List.copyOf(violations);
    }
}
