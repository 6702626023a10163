package org.ringsweep.api.net;

import java.util.List;
import org.apiguardian.api.API;

/**
 * A lumped two-terminal part on the net: a resistor, capacitor or inductor with parameter
 * {@code value} (ohm, F or H).
 *
 * @param ref        the reference designator ({@code R5})
 * @param kind       what it is
 * @param a          first terminal point
 * @param b          second terminal point
 * @param parameters its parameters ({@code value})
 * @param location   where it was written
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record Part(String ref, Kind kind, String a, String b, Parameters parameters, Location location) implements Element {

    /** The kinds of lumped part. */
    public enum Kind {
        /** Value in ohms. */
        RESISTOR,
        /** Value in farads. */
        CAPACITOR,
        /** Value in henries. */
        INDUCTOR;

        /** The word used in net files ({@code resistor}). */
        public String word() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    @Override
    public String id() {
        return ref;
    }

    @Override
    public List<String> points() {
        return List.of(a, b);
    }

    @Override
    public Part withParameters(Parameters p) {
        return new Part(ref, kind, a, b, p, location);
    }

    /** The part's value in SI units. */
    public double value() {
        return parameters.number("value");
    }
}
