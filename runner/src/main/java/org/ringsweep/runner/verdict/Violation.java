package org.ringsweep.runner.verdict;

import java.util.Objects;
import org.ringsweep.api.net.Stimulus;

/**
 * One broken limit on one edge.
 *
 * @param limit    the limit's key: a {@link org.ringsweep.api.net.LimitName#key()} such as
 *                 {@code overshoot_max}, or {@link #THRESHOLD_NOT_REACHED} or {@link #NOT_SETTLED}
 * @param edge     the edge's direction at the source
 * @param measured the measured value, in the limit's unit (V, s, or a count); see each key in
 *                 {@link LimitChecker}
 * @param limitValue the limit it broke, same unit (named so because a record cannot have two
 *                 components called {@code limit})
 * @param message  a sentence for a board engineer, e.g. "rising edge overshoots the high rail by
 *                 0.62 V; limit 0.30 V (defaulted)"
 */
public record Violation(String limit, Stimulus.Edge edge, double measured, double limitValue, String message) {
    /** The key of the violation "the edge never crossed its threshold (VIH rising, VIL falling)". */
    public static final String THRESHOLD_NOT_REACHED = "threshold_not_reached";
    /** The key of the violation "the edge did not settle in its window". */
    public static final String NOT_SETTLED = "settled";

    /** Rejects nulls. */
    public Violation {
        Objects.requireNonNull(limit, "limit");
        Objects.requireNonNull(edge, "edge");
        Objects.requireNonNull(message, "message");
    }
}
