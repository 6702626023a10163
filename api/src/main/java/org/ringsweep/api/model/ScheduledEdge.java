package org.ringsweep.api.model;

import org.apiguardian.api.API;
import org.ringsweep.api.net.Stimulus;

/**
 * One edge of the stimulus schedule: its direction and the time its transition starts at the
 * driver's ideal source. Every driver of a net switches at these times.
 *
 * @param direction rising or falling
 * @param start     start of the transition (s), ≥ 0
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record ScheduledEdge(Stimulus.Edge direction, double start) {
    /** Validates. */
    public ScheduledEdge {
        java.util.Objects.requireNonNull(direction, "direction");
        if (!(start >= 0) || !Double.isFinite(start)) {
            throw new IllegalArgumentException("edge start must be finite and ≥ 0, found " + start);
        }
    }
}
