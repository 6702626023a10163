package org.ringsweep.generators.ibis;

/**
 * A typ/min/max triple of one quantity in SI units. A min or max written {@code NA} takes the
 * typical value (the reader documents this as its fallback: the standard allows NA where a corner
 * value is not available).
 *
 * @param typ the typical value
 * @param min the minimum-corner value
 * @param max the maximum-corner value
 */
public record IbisRange(double typ, double min, double max) {
    /** Replaces NaN (NA) in min and max by typ; typ must be finite. */
    public IbisRange {
        if (!Double.isFinite(typ)) {
            throw new IllegalArgumentException("the typ value must be a finite number, found " + typ);
        }
        min = Double.isNaN(min) ? typ : min;
        max = Double.isNaN(max) ? typ : max;
    }

    /** The same value in all three columns. */
    public static IbisRange of(double value) {
        return new IbisRange(value, value, value);
    }

    /** The value of one corner's column. */
    public double get(IbisCorner corner) {
        return switch (corner) {
            case TYP -> typ;
            case MIN -> min;
            case MAX -> max;
        };
    }
}
