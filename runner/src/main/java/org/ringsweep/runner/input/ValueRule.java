package org.ringsweep.runner.input;

import java.util.Set;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.api.quantity.Quantities;

/** What one key accepts: the kind of value and, for numbers, the sign or range that makes sense. */
sealed interface ValueRule {

    /** The range a number must lie in. */
    enum Bound {
        /** Any finite value. */
        ANY(""),
        /** Greater than zero. */
        POSITIVE("positive "),
        /** Zero or more. */
        NON_NEGATIVE("non-negative "),
        /** 1 or more (relative permittivity). */
        AT_LEAST_ONE(""),
        /** Greater than zero and at most the speed of light in vacuum. */
        UP_TO_LIGHT("positive ");

        final String adjective;

        Bound(String adjective) {
            this.adjective = adjective;
        }
    }

    /**
     * A quantity of a dimension within a bound.
     *
     * @param dimension the kind of value
     * @param bound     the allowed range
     * @param noun      what it is, for messages ("impedance")
     * @param examples  backticked examples
     */
    record Quantity(Dimension dimension, Bound bound, String noun, String examples) implements ValueRule {
        /** A quantity described by its dimension's name and examples. */
        static Quantity of(Dimension d, Bound bound) {
            return new Quantity(d, bound, d.displayName(), Quantities.examples(d));
        }

        /** "a positive impedance such as `50` or `50ohm`". */
        String phrase() {
            String head = bound.adjective + noun;
            String range = switch (bound) {
                case AT_LEAST_ONE -> " of at least 1";
                case UP_TO_LIGHT -> " of at most 299792458 m/s (the speed of light)";
                default -> "";
            };
            return article(head) + " " + head + range + " such as " + examples;
        }
    }

    /** A voltage, or the name of a declared rail (GND always exists). */
    record VoltageOrRail() implements ValueRule {
    }

    /** The name of a declared rail. */
    record Rail() implements ValueRule {
    }

    /**
     * One of a fixed set of words.
     *
     * @param words the allowed words
     */
    record Word(Set<String> words) implements ValueRule {
    }

    /** {@code true} or {@code false}. */
    record Flag() implements ValueRule {
    }

    /** Free text on one line (a file path, a name inside a file): not empty, no control characters. */
    record Text() implements ValueRule {
    }

    /**
     * A whole number.
     *
     * @param min the smallest allowed value
     */
    record Count(int min) implements ValueRule {
    }

    /** A fraction of the swing written {@code 5%} (0 to 100 % exclusive), or a positive voltage. */
    record SettleBand() implements ValueRule {
    }

    /** "a" or "an" for a noun phrase. */
    static String article(String nounPhrase) {
        return "aeiou".indexOf(Character.toLowerCase(nounPhrase.charAt(0))) >= 0 ? "an" : "a";
    }

    /**
     * The rule for a model parameter. Physical sizes (time, resistance, capacitance, inductance,
     * length, frequency) must be positive, or non-negative when the model's default is 0 (which
     * shows that zero is meaningful, e.g. an extra delay); a capacitance may always be 0 (an ideal
     * input with no capacitance, the reference case of the textbook bounce diagrams); voltages and
     * other numbers may take any sign.
     */
    static ValueRule forSpec(ParameterSpec spec) {
        return switch (spec.type()) {
            case NUMBER -> Quantity.of(spec.dimension(), boundForModelNumber(spec));
            case VOLTAGE_OR_RAIL -> new VoltageOrRail();
            case RAIL -> new Rail();
            case WORD -> new Word(spec.words());
            case FLAG -> new Flag();
            case TEXT -> new Text();
        };
    }

    private static Bound boundForModelNumber(ParameterSpec spec) {
        return switch (spec.dimension()) {
            case CAPACITANCE -> Bound.NON_NEGATIVE;
            case TIME, RESISTANCE, INDUCTANCE, LENGTH, FREQUENCY ->
                    spec.defaultText().strip().equals("0") ? Bound.NON_NEGATIVE : Bound.POSITIVE;
            default -> Bound.ANY;
        };
    }
}
