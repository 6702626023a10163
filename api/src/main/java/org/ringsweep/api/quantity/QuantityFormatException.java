package org.ringsweep.api.quantity;

import org.apiguardian.api.API;

/**
 * User text that is not a valid quantity of the expected kind. The message says what was found
 * (quoted) and what was expected; callers add the file, line and key.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class QuantityFormatException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;

    /** @param message what was found and what was expected */
    public QuantityFormatException(String message) {
        super(message);
    }
}
