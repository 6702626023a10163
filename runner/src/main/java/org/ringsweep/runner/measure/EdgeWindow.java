package org.ringsweep.runner.measure;

import java.util.Objects;
import org.ringsweep.api.net.Stimulus;

/**
 * The part of a receiver waveform that belongs to one edge of the driver.
 *
 * @param direction the edge's direction at the source
 * @param start     when this edge starts at the source (s); the waveform's value here is the
 *                  level before the edge
 * @param source50  the instant the ideal source passes 50 % of its swing (s); the reference for
 *                  delay and settling time
 * @param end       the start of the next edge, or the end of the simulation (s); the waveform's
 *                  value here is the edge's final level
 */
public record EdgeWindow(Stimulus.Edge direction, double start, double source50, double end) {
    /**
     * Checks the window.
     *
     * @throws IllegalArgumentException if a time is not finite or {@code end} is not after {@code start}
     */
    public EdgeWindow {
        Objects.requireNonNull(direction, "direction");
        if (!Double.isFinite(start) || !Double.isFinite(source50) || !Double.isFinite(end)) {
            throw new IllegalArgumentException("edge window times must be finite, found start " + start
                    + " s, source50 " + source50 + " s, end " + end + " s");
        }
        if (!(end > start)) {
            throw new IllegalArgumentException("edge window must end after it starts, found start " + start
                    + " s, end " + end + " s");
        }
    }

    /** The window length (s). */
    public double span() {
        return end - start;
    }
}
