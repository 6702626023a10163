package org.ringsweep.api.net;

import java.util.List;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.apiguardian.api.API;

/**
 * What the driver does: a sequence of single edges each followed by a settle time, or a
 * periodic clock.
 *
 * @param edges         the edge directions in order (for single edges); for a clock, the first
 *                      edge's direction
 * @param settleSeconds time after each edge before the next, or NaN for {@code auto}
 * @param periodSeconds the clock period, or NaN for single edges
 * @param cycles        the number of clock cycles (0 for single edges)
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record Stimulus(List<Edge> edges, double settleSeconds, double periodSeconds, int cycles) {
    /** One rising then one falling edge, settle time chosen automatically. */
    public static final Stimulus DEFAULT = new Stimulus(List.of(Edge.RISE, Edge.FALL), Double.NaN, Double.NaN, 0);

    /** An edge direction at the driver. */
    public enum Edge {
        /** Low to high. */
        RISE,
        /** High to low. */
        FALL;

        /** The word used in files and results ({@code rise}). */
        public String word() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /** Copies the list. */
    public Stimulus {
        edges = List.copyOf(edges);
    }

    /** Whether this is a periodic clock. */
    public boolean isPeriodic() {
        return !Double.isNaN(periodSeconds);
    }

    /** Whether the settle time is to be chosen automatically. */
    public boolean isSettleAuto() {
        return Double.isNaN(settleSeconds);
    }

    /** The settle time, when given. */
    public OptionalDouble settle() {
        return isSettleAuto() ? OptionalDouble.empty() : OptionalDouble.of(settleSeconds);
    }

    /** The clock cycle count, when periodic. */
    public OptionalInt cycleCount() {
        return isPeriodic() ? OptionalInt.of(cycles) : OptionalInt.empty();
    }
}
