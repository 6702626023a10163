package org.ringsweep.api.net;

import org.apiguardian.api.API;

/**
 * A net that is not a valid topology (floating piece, duplicate id, unknown path, ...). The
 * message names the offending element and what was expected; {@link #location()} says where.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class NetValidationException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;
    private final transient Location location;
    private final String key;

    /**
     * @param location where the problem is (may be {@link Location#UNKNOWN})
     * @param key      the key concerned (e.g. {@code segments[2].from}), or empty
     * @param message  what is wrong and what was expected
     */
    public NetValidationException(Location location, String key, String message) {
        super(message);
        this.location = java.util.Objects.requireNonNull(location, "location");
        this.key = java.util.Objects.requireNonNull(key, "key");
    }

    /** Where the problem is. */
    public Location location() {
        return location;
    }

    /** The key concerned, or empty. */
    public String key() {
        return key;
    }
}
