package org.ringsweep.api.model;

import java.util.Optional;
import org.apiguardian.api.API;

/**
 * An extra check on every measured edge: a measurement plus its limit. The host calls
 * {@link #check} once per receiver and edge of every simulated point, after its own
 * measurements; a {@link Finding} becomes a violation with {@link #limitKey()} as the limit's
 * name, and the point fails.
 *
 * <p>The limit is the check's own (a constant, documented in {@link #description()}); the net
 * file's {@code limits:} block does not set it. Implementations must be stateless and
 * thread-safe. Throwing makes the point an error record naming the plugin and the point.
 *
 * <p>Example, a check that the edge stays below an absolute ceiling:
 * <pre>{@code
 * public final class CeilingCheck implements EdgeCheck {
 *     public String id() { return "acme-ceiling"; }
 *     public String limitKey() { return "acme_ceiling_max"; }
 *     public String description() { return "highest voltage in the window at most 4.0 V"; }
 *     public Optional<Finding> check(EdgeSample s) {
 *         double max = java.util.Arrays.stream(s.volts()).max().orElse(Double.NaN);
 *         return max > 4.0 ? Optional.of(new Finding(max, 4.0, "peak " + max + " V above 4.0 V"))
 *                          : Optional.empty();
 *     }
 * }
 * }</pre>
 *
 * @since 0.1
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public interface EdgeCheck {
    /**
     * A limit the edge violates.
     *
     * @param measured the measured value (SI units), NaN when there is none
     * @param limit    the limit's value (SI units)
     * @param message  the violation in words, one line
     */
    record Finding(double measured, double limit, String message) {
        /** Validates. */
        public Finding {
            java.util.Objects.requireNonNull(message, "message");
        }
    }

    /** The check's id: {@link RingsweepPlugin#ID_PATTERN}, unique among all checks. */
    String id();

    /**
     * The key its violations carry in result records, e.g. {@code acme_slew_min}: lower-case
     * letters, digits and {@code _}; it must not be one of the built-in limit keys
     * ({@link org.ringsweep.api.net.LimitName}) nor another check's.
     */
    String limitKey();

    /** One line for {@code ringsweep models}: what it measures and its limit (with units). */
    String description();

    /**
     * Checks one edge.
     *
     * @param sample the receiver's waveform in the edge's window, with thresholds and rails
     * @return a finding when the limit is violated, else empty
     */
    Optional<Finding> check(EdgeSample sample);
}
