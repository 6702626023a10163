package org.ringsweep.api.net;

import java.util.List;
import org.apiguardian.api.API;

/**
 * A transmission-line piece between two points. Parameters: {@code z0} (ohm), and either
 * {@code delay} (s), or {@code length} (m) with {@code er_eff} or {@code velocity} (m/s);
 * optional losses {@code r_per_m} (ohm/m) and {@code g_per_m} (S/m).
 *
 * @param id         the segment id
 * @param from       the first point
 * @param to         the second point
 * @param parameters its parameters
 * @param location   where it was written
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record Segment(String id, String from, String to, Parameters parameters, Location location) implements Element {
    /** Speed of light in vacuum, exact by the SI definition of the metre (m/s). */
    public static final double SPEED_OF_LIGHT = 299_792_458.0;

    @Override
    public List<String> points() {
        return List.of(from, to);
    }

    @Override
    public Segment withParameters(Parameters p) {
        return new Segment(id, from, to, p, location);
    }

    /**
     * The one-way delay in seconds: {@code delay}, or {@code length·√er_eff / c}, or
     * {@code length / velocity}.
     *
     * @throws IllegalStateException if the parameters give no delay (the builder rejects such
     *                               segments, so this only happens for hand-made ones)
     */
    public double delaySeconds() {
        Parameters p = parameters;
        if (p.has("delay")) {
            return p.number("delay");
        }
        if (p.has("length") && p.has("er_eff")) {
            return p.number("length") * Math.sqrt(p.number("er_eff")) / SPEED_OF_LIGHT;
        }
        if (p.has("length") && p.has("velocity")) {
            return p.number("length") / p.number("velocity");
        }
        throw new IllegalStateException("segment " + id + " has no delay, nor length with er_eff or velocity");
    }

    /** Characteristic impedance in ohms. */
    public double z0() {
        return parameters.number("z0");
    }

    /** Whether losses are given (then the deck uses a lossy line). */
    public boolean isLossy() {
        return parameters.number("r_per_m", 0) > 0 || parameters.number("g_per_m", 0) > 0;
    }
}
