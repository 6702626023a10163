package org.ringsweep.api.model;

import org.apiguardian.api.API;

/**
 * A model's complaint about one of its parameters during elaboration. The host adds the element
 * id and the location the key was written at before it reaches the user.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public class ModelParameterException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;
    private final String key;

    /**
     * @param key     the parameter key concerned ({@code v_high}), or empty
     * @param message what is wrong and what was expected, values in backticks
     */
    public ModelParameterException(String key, String message) {
        super(message);
        this.key = java.util.Objects.requireNonNull(key, "key");
    }

    /** The parameter key concerned, or empty. */
    public String key() {
        return key;
    }
}
