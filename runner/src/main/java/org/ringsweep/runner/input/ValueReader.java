package org.ringsweep.runner.input;

import java.util.Collection;
import java.util.stream.Collectors;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Segment;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.api.quantity.Quantities;
import org.ringsweep.api.quantity.QuantityFormatException;

/** Turns the text of one value into a {@link Value} by its {@link ValueRule}, or an {@link InputException}. */
final class ValueReader {
    private ValueReader() {
    }

    /**
     * Reads {@code text} by {@code rule}.
     *
     * @param rails the rail names of the net, GND included (for rail rules)
     * @throws InputException at {@code location} and {@code key} when the text does not fit the rule
     */
    static Value read(ValueRule rule, String text, Collection<String> rails, Location location, String key) {
        String t = text == null ? "" : text.strip();
        if (rule instanceof ValueRule.Quantity q) {
            return quantity(q, t, location, key);
        } else if (rule instanceof ValueRule.VoltageOrRail) {
            if (!t.isEmpty() && "0123456789+-.".indexOf(t.charAt(0)) >= 0) {
                return quantity(ValueRule.Quantity.of(Dimension.VOLTAGE, ValueRule.Bound.ANY), t, location, key);
            }
            if (rails.contains(t)) {
                return new Value.Word(t);
            }
            throw new InputException(location, key, "expected a voltage such as `3.3V` or `3.3`, or a rail declared under rails ("
                    + String.join(", ", rails) + "), found " + found(t));
        } else if (rule instanceof ValueRule.Rail) {
            if (rails.contains(t)) {
                return new Value.Word(t);
            }
            throw new InputException(location, key, "expected the name of a rail declared under rails ("
                    + String.join(", ", rails) + "), found " + found(t));
        } else if (rule instanceof ValueRule.Word w) {
            if (w.words().contains(t)) {
                return new Value.Word(t);
            }
            throw new InputException(location, key, "expected one of " + quotedSorted(w.words()) + ", found " + found(t));
        } else if (rule instanceof ValueRule.Flag) {
            if (t.equals("true") || t.equals("false")) {
                return new Value.Flag(t.equals("true"));
            }
            throw new InputException(location, key, "expected `true` or `false`, found " + found(t));
        } else if (rule instanceof ValueRule.Text) {
            if (!t.isEmpty() && t.chars().noneMatch(ch -> ch < 0x20 || ch == 0x7f)) {
                return new Value.Word(t);
            }
            throw new InputException(location, key, "expected text on one line such as `parts/demo.ibs`, found "
                    + (t.isEmpty() ? "nothing" : "text with control characters"));
        } else if (rule instanceof ValueRule.Count c) {
            if (t.matches("\\+?\\d{1,9}") && Integer.parseInt(t.replace("+", "")) >= c.min()) {
                return Value.of(Integer.parseInt(t.replace("+", "")), Dimension.DIMENSIONLESS);
            }
            throw new InputException(location, key, "expected a whole number of at least " + c.min() + " such as `3`, found " + found(t));
        } else {
            return settleBand(t, location, key);
        }
    }

    private static Value quantity(ValueRule.Quantity q, String t, Location location, String key) {
        double si;
        try {
            si = Quantities.parse(t, q.dimension());
        } catch (QuantityFormatException e) {
            throw new InputException(location, key, e.getMessage(), e);
        }
        boolean ok = switch (q.bound()) {
            case ANY -> true;
            case POSITIVE -> si > 0;
            case NON_NEGATIVE -> si >= 0;
            case AT_LEAST_ONE -> si >= 1;
            case UP_TO_LIGHT -> si > 0 && si <= Segment.SPEED_OF_LIGHT;
        };
        if (!ok) {
            throw new InputException(location, key, "expected " + q.phrase() + ", found " + found(t));
        }
        return Value.of(si, q.dimension());
    }

    private static Value settleBand(String t, Location location, String key) {
        String expected = "expected a fraction of the swing such as `5%`, or a positive voltage such as `0.1V`, found " + found(t);
        try {
            if (t.endsWith("%")) {
                double fraction = Quantities.parse(t, Dimension.DIMENSIONLESS);
                if (fraction > 0 && fraction < 1) {
                    return Value.of(fraction, Dimension.DIMENSIONLESS);
                }
                throw new InputException(location, key, expected + " (a percentage must lie between 0 and 100 %)");
            }
            double volts = Quantities.parse(t, Dimension.VOLTAGE);
            if (volts > 0) {
                return Value.of(volts, Dimension.VOLTAGE);
            }
        } catch (QuantityFormatException e) {
            throw new InputException(location, key, expected, e);
        }
        throw new InputException(location, key, expected);
    }

    /** The text quoted for a message, or "nothing" when empty. */
    static String found(String t) {
        return t.isEmpty() ? "nothing" : "`" + t + "`";
    }

    /** Words sorted and quoted: {@code `a`, `b`}. */
    static String quotedSorted(Collection<String> words) {
        return words.stream().sorted().map(w -> "`" + w + "`").collect(Collectors.joining(", "));
    }
}
