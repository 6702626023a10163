package org.ringsweep.runner.engine.builtin;

/**
 * A piecewise-linear function held flat beyond its end points, split into segments for
 * Newton–Raphson: segment 0 is {@code (−∞, x₀]} (slope 0), segment k (1 … n−1) is
 * {@code [x₍k−1₎, x_k]}, segment n is {@code [x₍n−1₎, ∞)} (slope 0). This is the semantics of
 * {@link org.ringsweep.api.circuit.Primitive.TableCurrent} and of the deck writer's
 * {@code pwl()} with flat guard points (ngspice.md §4). Immutable; thread-safe.
 */
final class PwlTable {
    private final double[] x;
    private final double[] y;
    /** Slope of each segment, 0 for the two unbounded ones. */
    private final double[] slope;

    /** A table over strictly increasing {@code x} (at least two points) with values {@code y}. */
    PwlTable(double[] x, double[] y) {
        this.x = x.clone();
        this.y = y.clone();
        slope = new double[x.length + 1];
        for (int k = 1; k < x.length; k++) {
            slope[k] = (y[k] - y[k - 1]) / (x[k] - x[k - 1]);
        }
    }

    /** The number of segments (points + 1). */
    int segments() {
        return slope.length;
    }

    /**
     * The segment holding {@code v}, searched from segment {@code hint} (the previous one, so a
     * look-up is O(1) while the voltage moves little). A point on a boundary belongs to the lower segment.
     */
    int segmentOf(double v, int hint) {
        int k = Math.max(0, Math.min(slope.length - 1, hint));
        while (k > 0 && v <= x[k - 1]) {
            k--;
        }
        while (k < x.length && v > x[k]) {
            k++;
        }
        return k;
    }

    /** The slope of segment {@code k} (value units per abscissa unit). */
    double slope(int k) {
        return slope[k];
    }

    /** The lower boundary of segment {@code k} (−∞ for segment 0). */
    double lower(int k) {
        return k == 0 ? Double.NEGATIVE_INFINITY : x[k - 1];
    }

    /** The upper boundary of segment {@code k} (+∞ for the last). */
    double upper(int k) {
        return k == x.length ? Double.POSITIVE_INFINITY : x[k];
    }

    /** The value at {@code v}, evaluated on segment {@code k}, which must hold {@code v} (its ends included). */
    double value(double v, int k) {
        if (k == 0) {
            return y[0];
        }
        if (k == x.length) {
            return y[y.length - 1];
        }
        return y[k - 1] + slope[k] * (v - x[k - 1]);
    }
}
