package org.ringsweep.api.model;

import java.util.Set;
import org.apiguardian.api.API;
import org.ringsweep.api.quantity.Dimension;

/**
 * One parameter a model takes.
 *
 * @param key         the key in net files ({@code r_out})
 * @param type        what kind of value it takes
 * @param dimension   the dimension of numbers (ignored for WORD, FLAG and TEXT)
 * @param words       the allowed words for WORD (empty otherwise)
 * @param defaultText the default as a user would write it, or empty when there is none
 * @param required    whether it must be given
 * @param description one line for {@code ringsweep models}
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record ParameterSpec(String key, Type type, Dimension dimension, Set<String> words,
                            String defaultText, boolean required, String description) {
    /** What kind of value a parameter takes. */
    public enum Type {
        /** A quantity of the given dimension. */
        NUMBER,
        /** A voltage or the name of a rail of the net ({@code VCC}). */
        VOLTAGE_OR_RAIL,
        /** The name of a rail of the net. */
        RAIL,
        /** One of {@link ParameterSpec#words()}. */
        WORD,
        /** true or false. */
        FLAG,
        /**
         * Free text on one line, such as a file path or a model name inside a file; kept as a
         * {@link org.ringsweep.api.net.Value.Word}. Added in 0.1 for file-based models.
         */
        TEXT
    }

    /** Copies the word set. */
    public ParameterSpec {
        words = Set.copyOf(words);
    }

    /** A number parameter. */
    public static ParameterSpec number(String key, Dimension d, String defaultText, boolean required, String description) {
        return new ParameterSpec(key, Type.NUMBER, d, Set.of(), defaultText, required, description);
    }

    /** A voltage-or-rail parameter. */
    public static ParameterSpec voltageOrRail(String key, String defaultText, boolean required, String description) {
        return new ParameterSpec(key, Type.VOLTAGE_OR_RAIL, Dimension.VOLTAGE, Set.of(), defaultText, required, description);
    }

    /** A rail-name parameter. */
    public static ParameterSpec rail(String key, String defaultText, boolean required, String description) {
        return new ParameterSpec(key, Type.RAIL, Dimension.VOLTAGE, Set.of(), defaultText, required, description);
    }

    /** A free-text parameter (a file path, a name inside a file). */
    public static ParameterSpec text(String key, String defaultText, boolean required, String description) {
        return new ParameterSpec(key, Type.TEXT, Dimension.DIMENSIONLESS, Set.of(), defaultText, required, description);
    }

    /** A word parameter from a fixed set. */
    public static ParameterSpec word(String key, Set<String> words, String defaultText, String description) {
        return new ParameterSpec(key, Type.WORD, Dimension.DIMENSIONLESS, words, defaultText, false, description);
    }
}
