package org.ringsweep.runner.measure;

import java.util.Arrays;
import java.util.Objects;

/**
 * A piece of a sampled waveform: times and values, linear between samples. Also the checks and
 * the interpolation used by every measurement ({@code waveform-metrics.md} §4.1).
 */
final class Samples {
    final double[] t;
    final double[] v;

    private Samples(double[] t, double[] v) {
        this.t = t;
        this.v = v;
    }

    int size() {
        return t.length;
    }

    double first() {
        return v[0];
    }

    double last() {
        return v[v.length - 1];
    }

    /** The same times with every value negated: turns a falling edge into a rising one. */
    Samples negated() {
        double[] u = new double[v.length];
        for (int i = 0; i < u.length; i++) {
            u[i] = -v[i];
        }
        return new Samples(t, u);
    }

    /**
     * Checks a time series: same lengths, at least two samples, finite, times not decreasing.
     * (Equal times are allowed; the later sample wins, §4.)
     */
    static void check(double[] t, double[] v) {
        Objects.requireNonNull(t, "t");
        Objects.requireNonNull(v, "v");
        if (t.length != v.length) {
            throw new IllegalArgumentException("time and value arrays differ in length: " + t.length + " vs " + v.length);
        }
        if (t.length < 2) {
            throw new IllegalArgumentException("a waveform needs at least two samples, found " + t.length);
        }
        for (int i = 0; i < t.length; i++) {
            if (!Double.isFinite(t[i]) || !Double.isFinite(v[i])) {
                throw new IllegalArgumentException("waveform sample " + i + " is not finite (t " + t[i] + " s, v "
                        + v[i] + " V)");
            }
            if (i > 0 && t[i] < t[i - 1]) {
                throw new IllegalArgumentException("time axis decreases at sample " + i + " (" + t[i - 1] + " s then "
                        + t[i] + " s)");
            }
        }
    }

    /**
     * The samples of {@code [start, end]} with interpolated end points included; samples with
     * equal times collapse to the later one.
     *
     * @throws IllegalArgumentException if the interval is not inside the data or not ordered
     */
    static Samples window(double[] t, double[] v, double start, double end) {
        check(t, v);
        if (!(end > start) || !Double.isFinite(start) || !Double.isFinite(end)) {
            throw new IllegalArgumentException("window must end after it starts, found [" + start + ", " + end + "] s");
        }
        if (start < t[0] || end > t[t.length - 1]) {
            throw new IllegalArgumentException("window [" + start + ", " + end + "] s is outside the simulated time ["
                    + t[0] + ", " + t[t.length - 1] + "] s");
        }
        double[] wt = new double[t.length + 2];
        double[] wv = new double[t.length + 2];
        int n = 0;
        wt[n] = start;
        wv[n++] = valueAt(t, v, start);
        int i = lastAtOrBefore(t, start) + 1;
        for (; i < t.length && t[i] < end; i++) {
            if (t[i] == wt[n - 1]) {
                wv[n - 1] = v[i];
            } else {
                wt[n] = t[i];
                wv[n++] = v[i];
            }
        }
        wt[n] = end;
        wv[n++] = valueAt(t, v, end);
        return new Samples(Arrays.copyOf(wt, n), Arrays.copyOf(wv, n));
    }

    /** The linearly interpolated value at {@code tq}, which must lie inside the data (§4.1). */
    static double valueAt(double[] t, double[] v, double tq) {
        int j = lastAtOrBefore(t, tq);
        if (t[j] == tq || j == t.length - 1) {
            return v[j];
        }
        return v[j] + (v[j + 1] - v[j]) * (tq - t[j]) / (t[j + 1] - t[j]);
    }

    /** This piece's interpolated value at {@code tq} inside it. */
    double valueAt(double tq) {
        return valueAt(t, v, tq);
    }

    /** The largest index j with {@code t[j] <= tq} (0 when tq is before every sample). */
    static int lastAtOrBefore(double[] t, double tq) {
        int lo = 0;
        int hi = t.length - 1;
        if (tq < t[0]) {
            return 0;
        }
        while (lo < hi) {
            int mid = (lo + hi + 1) >>> 1;
            if (t[mid] <= tq) {
                lo = mid;
            } else {
                hi = mid - 1;
            }
        }
        return lo;
    }
}
