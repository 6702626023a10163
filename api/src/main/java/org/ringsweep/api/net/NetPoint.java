package org.ringsweep.api.net;

import org.apiguardian.api.API;

/**
 * A vertex of the net graph: a pin ({@code U1.14}), a junction ({@code J1}) or a rail
 * ({@code VCC}, {@code GND}). Identity is the name, compared exactly.
 *
 * @param name the user's name for it
 * @param kind what it is
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record NetPoint(String name, Kind kind) {
    /** The name of the ground rail, which always exists at 0 V. */
    public static final String GROUND = "GND";

    /** What a point is. */
    public enum Kind {
        /** A component pin, written {@code REFDES.PIN}. */
        PIN,
        /** A named join of segments and parts that is not a pin. */
        JUNCTION,
        /** A DC rail (including GND). */
        RAIL
    }

    /** Validates the fields. */
    public NetPoint {
        java.util.Objects.requireNonNull(name, "name");
        java.util.Objects.requireNonNull(kind, "kind");
    }

    /** Whether the name has the {@code REFDES.PIN} form. */
    public static boolean looksLikePin(String name) {
        int dot = name.indexOf('.');
        return dot > 0 && dot < name.length() - 1;
    }
}
