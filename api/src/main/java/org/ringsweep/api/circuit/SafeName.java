package org.ringsweep.api.circuit;

import java.util.regex.Pattern;
import org.apiguardian.api.API;

/**
 * The rule for node and element names in a {@link Circuit}: lower-case ASCII letter first, then
 * lower-case letters, digits or {@code _}, at most 31 characters, and never {@code gnd}. The
 * ground node is {@link #GROUND} ({@code 0}). Such a name cannot break a SPICE line, start a
 * comment, a dot-card or a continuation, or alias ground.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class SafeName {
    /** The ground node. */
    public static final String GROUND = "0";

    private static final Pattern RULE = Pattern.compile("[a-z][a-z0-9_]{0,30}");

    private SafeName() {
    }

    /** Whether {@code name} is a safe node or element name (or the ground node). */
    public static boolean isSafe(String name) {
        return GROUND.equals(name) || (RULE.matcher(name).matches() && !name.equals("gnd"));
    }

    /**
     * Returns {@code name} when safe.
     *
     * @throws IllegalArgumentException naming the rule otherwise
     */
    public static String require(String name, String what) {
        if (name == null || !isSafe(name)) {
            throw new IllegalArgumentException(what + " `" + name + "` is not a safe circuit name; expected [a-z][a-z0-9_]{0,30}, not gnd");
        }
        return name;
    }
}
