package org.ringsweep.runner.netlist;

import org.ringsweep.api.net.Location;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.api.quantity.Quantities;
import org.ringsweep.api.quantity.QuantityFormatException;
import org.ringsweep.runner.input.InputException;

/** Length text of CSV files: a number with a unit, or a plain number in a given unit. */
public final class LengthUnits {
    private LengthUnits() {
    }

    /**
     * Metres per unit for a unit name: {@code mm}, {@code um}, {@code m}, {@code in}, {@code mil}.
     *
     * @throws InputException at {@code at}/{@code key} for anything else
     */
    public static double metresPer(String unit, Location at, String key) {
        String u = unit.strip();
        if (!u.matches("[a-zA-Zµ]+")) {
            throw new InputException(at, key, "expected a length unit such as `mm`, `mil` or `in`, found `" + unit + "`");
        }
        try {
            return Quantities.parse("1" + u, Dimension.LENGTH);
        } catch (QuantityFormatException e) {
            throw new InputException(at, key, "expected a length unit such as `mm`, `mil` or `in`, found `" + unit + "`", e);
        }
    }

    /**
     * A length or coordinate in metres.
     *
     * @param text        {@code 45mm}, {@code 1.2in}, or a plain number
     * @param plainUnit   metres per unit for plain numbers; NaN when plain numbers are not allowed
     * @param allowNegative whether negative values are fine (coordinates) or not (lengths)
     */
    static double parse(String text, double plainUnit, boolean allowNegative, Location at, String key) {
        String t = text.strip();
        double v;
        if (t.matches("[+-]?(\\d+\\.?\\d*|\\.\\d+)([eE][+-]?\\d+)?")) {
            if (Double.isNaN(plainUnit)) {
                throw new InputException(at, key, "plain number `" + t + "` has no unit; expected a length such as `12.5mm`"
                        + " or `500mil`, or give the units (a `units` column, or `units:` in the board file)");
            }
            v = Double.parseDouble(t) * plainUnit;
        } else {
            try {
                v = Quantities.parse(t, Dimension.LENGTH);
            } catch (QuantityFormatException e) {
                throw new InputException(at, key, e.getMessage(), e);
            }
        }
        if (!allowNegative && !(v > 0)) {
            throw new InputException(at, key, "expected a positive length such as `45mm`, found `" + t + "`");
        }
        return v;
    }
}
