package org.ringsweep.generators.elaborate;

/**
 * The arithmetic behind {@code settle: auto} (see {@link Elaborator}), after the lattice
 * (bounce) diagram of a source with resistance Rs driving a line Z0 into a load with reflection
 * coefficient ΓL (reference: lines-and-terminations.md §2).
 */
final class AutoTiming {
    /** The settling band of the automatic settle time: 1 % of the swing. */
    static final double BAND = 0.01;
    /** RC time constants added after the reflections: e^-5 = 0.7 % &lt; 1 %. */
    static final double RC_CONSTANTS = 5;
    /** Shortest automatic settle time (s). */
    static final double FLOOR = 10e-9;
    /** Longest automatic settle time (s). */
    static final double CAP = 2e-6;

    private AutoTiming() {
    }

    /** The source reflection coefficient {@code Γs = (Rs − Z0)/(Rs + Z0)}. */
    static double gamma(double r, double z0) {
        return (r - z0) / (r + z0);
    }

    /**
     * The real-valued number of far-end arrivals after the first before the far end stays within
     * {@code band} (a fraction of the swing) of its final value:
     * {@code n = ln(e/|Vfar(0) − Vfinal|)/ln|ΓL·Γs|}, with a unit step, launched wave
     * {@code vi = Z0/(Rs + Z0)}, {@code Vfar(0) = vi·(1 + ΓL)} and the final value of an open
     * load, 1. Returns 0 when the first arrival is already inside the band or nothing reflects,
     * and positive infinity when the reflections never decay ({@code |ΓL·Γs| ≥ 1}).
     */
    static double arrivals(double gammaS, double gammaL, double vi, double band) {
        double first = Math.abs(vi * (1 + gammaL) - 1);
        double product = Math.abs(gammaS * gammaL);
        if (first <= band || product == 0) {
            return 0;
        }
        if (product >= 1) {
            return Double.POSITIVE_INFINITY;
        }
        return Math.max(0, Math.log(band / first) / Math.log(product));
    }
}
