package org.ringsweep.api.model;

import org.apiguardian.api.API;

/**
 * The version of the plugin API that this ringsweep provides. A {@link RingsweepPlugin} declares
 * the version it was compiled against in {@link RingsweepPlugin#apiVersion()}; the host loads it
 * only when that equals {@link #CURRENT} and otherwise stops with an error naming the plugin and
 * both versions.
 *
 * <p>The number goes up whenever a change to the {@code org.ringsweep.api} types would make a
 * compiled plugin misbehave (a method removed or its meaning changed); purely additive changes
 * (a new default method, a new record) keep it.
 *
 * @since 0.1
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class ApiVersion {
    /** The plugin API version of this ringsweep: 1. */
    public static final int CURRENT = 1;

    private ApiVersion() {
    }
}
