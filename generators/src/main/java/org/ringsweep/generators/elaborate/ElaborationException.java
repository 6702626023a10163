package org.ringsweep.generators.elaborate;

import org.ringsweep.api.net.Location;

/**
 * A net that cannot be turned into a circuit. The message reads
 * {@code file:line:column: ID/key: what is wrong and what was expected}, e.g.
 * {@code nets/a.yaml:14:7: U1.14/v_high: rail `VDDQ` is not declared under rails}.
 */
public final class ElaborationException extends RuntimeException {
    private static final long serialVersionUID = 1L;
    private final transient Location location;
    private final String elementId;
    private final String key;

    /**
     * @param location  where the offending value was written (may be {@link Location#UNKNOWN})
     * @param elementId the element id ({@code U1.14}), or empty for net-level settings
     * @param key       the parameter key ({@code v_high}), or empty
     * @param detail    what is wrong and what was expected
     */
    public ElaborationException(Location location, String elementId, String key, String detail) {
        super(location + ": " + path(elementId, key) + detail);
        this.location = location;
        this.elementId = elementId;
        this.key = key;
    }

    private static String path(String id, String key) {
        if (id.isEmpty() && key.isEmpty()) {
            return "";
        }
        return (id.isEmpty() ? key : key.isEmpty() ? id : id + "/" + key) + ": ";
    }

    /** Where the offending value was written. */
    public Location location() {
        return location;
    }

    /** The element id, or empty. */
    public String elementId() {
        return elementId;
    }

    /** The parameter key, or empty. */
    public String key() {
        return key;
    }
}
