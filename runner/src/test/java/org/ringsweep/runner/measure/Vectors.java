package org.ringsweep.runner.measure;

/** The test vectors of {@code waveform-metrics.md} §5, converted from ns to s. */
final class Vectors {
    static final double NS = 1e-9;

    /** §5 W1 (rising) times. */
    static final double[] W1_T = ns(0, 1, 2, 2.5, 3, 3.5, 4, 4.5, 5, 6, 8, 10, 15, 20);
    /** §5 W1 values (V). */
    static final double[] W1_V = {0, 0, 0, 1.65, 3.3, 3.9, 2.9, 3.45, 3.25, 3.3, 3.3, 3.3, 3.3, 3.3};
    /** §5 W2 = W1 with v(4.0 ns) = 1.9 V. */
    static final double[] W2_V = {0, 0, 0, 1.65, 3.3, 3.9, 1.9, 3.45, 3.25, 3.3, 3.3, 3.3, 3.3, 3.3};
    /** §5 W4 (falling) = 3.3 − W1. */
    static final double[] W4_V = mirror(W1_V);
    /** §5 W3 (non-monotonic) times. */
    static final double[] W3_T = ns(0, 2, 2.4, 2.5, 2.7, 3, 10);
    /** §5 W3 values (V). */
    static final double[] W3_V = {0, 0, 1.5, 1.2, 2.5, 3.3, 3.3};
    /** §5 Hysteresis vector times, 0..6 ns step 1. */
    static final double[] HYST_T = ns(0, 1, 2, 3, 4, 5, 6);
    /** §5 Hysteresis vector values (V), level 1.65 V. */
    static final double[] HYST_V = {0, 1.6, 1.7, 1.6, 1.7, 3.3, 3.3};

    private Vectors() {
    }

    static double[] ns(double... x) {
        double[] out = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            out[i] = x[i] * NS;
        }
        return out;
    }

    private static double[] mirror(double[] v) {
        double[] out = new double[v.length];
        for (int i = 0; i < v.length; i++) {
            out[i] = 3.3 - v[i];
        }
        return out;
    }
}
