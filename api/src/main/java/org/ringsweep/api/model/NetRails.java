package org.ringsweep.api.model;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import org.apiguardian.api.API;
import org.ringsweep.api.net.NetPoint;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Value;

/**
 * The DC rails of a net by the user's names, in volts, GND (0 V) always included. Models use it to
 * resolve parameters that take a voltage or a rail name ({@code v_high: VCC}).
 *
 * <p>Immutable.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class NetRails {
    private final Map<String, Double> volts;

    /** @param volts rail voltages by name (copied; GND is added at 0 V when absent) */
    public NetRails(Map<String, Double> volts) {
        Map<String, Double> copy = new LinkedHashMap<>(volts);
        copy.putIfAbsent(NetPoint.GROUND, 0.0);
        this.volts = Collections.unmodifiableMap(copy);
    }

    /** Every rail, read-only, in declaration order. */
    public Map<String, Double> asMap() {
        return volts;
    }

    /** The voltage of a rail (V), if declared. */
    public Optional<Double> volts(String rail) {
        return Optional.ofNullable(volts.get(rail));
    }

    /**
     * Resolves a voltage-or-rail parameter: a number is taken as volts, a word as a rail name.
     *
     * @param parameters the element's parameters
     * @param key        the key to read
     * @param fallback   the rail name or number text to use when the key is absent (e.g. {@code GND})
     * @return the voltage (V)
     * @throws ModelParameterException if the word is not a declared rail or the value is neither
     */
    public double voltageOrRail(Parameters parameters, String key, String fallback) {
        Value v = parameters.get(key).orElse(null);
        if (v == null) {
            if (fallback == null || fallback.isEmpty()) {
                throw new ModelParameterException(key, "`" + key + "` is missing; expected a voltage or a rail name");
            }
            v = new Value.Word(fallback);
        }
        if (v instanceof Value.Number n) {
            return n.si();
        }
        if (v instanceof Value.Word w) {
            Double rail = volts.get(w.text());
            if (rail != null) {
                return rail;
            }
            throw new ModelParameterException(key, "rail `" + w.text() + "` is not declared under rails; expected one of "
                    + String.join(", ", volts.keySet()) + " or a voltage");
        }
        throw new ModelParameterException(key, "expected a voltage or a rail name, found `" + v.display() + "`");
    }
}
