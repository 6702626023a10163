package org.ringsweep.api.net;

import org.apiguardian.api.API;
import org.ringsweep.api.quantity.Dimension;

/**
 * One parameter value of an element: a number with its dimension, a word (a rail name, a mode
 * such as {@code rails}) or a flag. Values are immutable.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public sealed interface Value {

    /** The value as the user could write it again, for messages and deck comments. */
    String display();

    /**
     * A finite number in SI base units.
     *
     * @param si        the value in SI base units
     * @param dimension its kind
     */
    record Number(double si, Dimension dimension) implements Value {
        /** Rejects NaN and infinities. */
        public Number {
            if (!Double.isFinite(si)) {
                throw new IllegalArgumentException("value must be finite, found " + si);
            }
            java.util.Objects.requireNonNull(dimension, "dimension");
        }

        @Override
        public String display() {
            String unit = dimension.unitSymbol();
            return Double.toString(si) + (unit.isEmpty() ? "" : " " + unit);
        }
    }

    /**
     * A name: a rail ({@code VCC}), a mode ({@code rails}, {@code 10-90}) or a model id.
     *
     * @param text the word as given
     */
    record Word(String text) implements Value {
        /** Rejects null. */
        public Word {
            java.util.Objects.requireNonNull(text, "text");
        }

        @Override
        public String display() {
            return text;
        }
    }

    /**
     * A yes/no setting such as {@code monotonic: true}.
     *
     * @param on the setting
     */
    record Flag(boolean on) implements Value {
        @Override
        public String display() {
            return Boolean.toString(on);
        }
    }

    /** Shorthand for a {@link Number}. */
    static Value.Number of(double si, Dimension dimension) {
        return new Number(si, dimension);
    }
}
