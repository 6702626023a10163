package org.ringsweep.api.circuit;

/** Preconditions for circuit values; messages name the value and what was expected. */
final class Checks {
    private Checks() {
    }

    static void names(String... names) {
        for (String n : names) {
            SafeName.require(n, "name");
        }
    }

    static double finite(double v, String what) {
        if (!Double.isFinite(v)) {
            throw new IllegalArgumentException(what + " must be finite, found " + v);
        }
        return v;
    }

    static double positive(double v, String what) {
        if (!(v > 0) || !Double.isFinite(v)) {
            throw new IllegalArgumentException(what + " must be positive and finite, found " + v);
        }
        return v;
    }

    static double nonNegative(double v, String what) {
        if (!(v >= 0) || !Double.isFinite(v)) {
            throw new IllegalArgumentException(what + " must be zero or positive and finite, found " + v);
        }
        return v;
    }
}
