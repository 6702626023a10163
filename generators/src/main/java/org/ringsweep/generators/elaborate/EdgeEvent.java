package org.ringsweep.generators.elaborate;

import org.ringsweep.api.net.Stimulus;

/**
 * One measured edge of the stimulus.
 *
 * @param direction rising or falling at the driver
 * @param start     start of the transition at the ideal source (s)
 * @param source50  the instant the ideal source passes 50 % of the swing (s)
 * @param end       end of the measurement window: the start of the next edge, or the stop time (s)
 */
public record EdgeEvent(Stimulus.Edge direction, double start, double source50, double end) {
    /** Validates the order {@code start ≤ source50}, {@code start < end}. */
    public EdgeEvent {
        java.util.Objects.requireNonNull(direction, "direction");
        if (!(start <= source50) || !(start < end)) {
            throw new IllegalArgumentException("edge times out of order: start " + start + ", 50 % " + source50 + ", end " + end);
        }
    }
}
