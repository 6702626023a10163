package org.ringsweep.runner.engine.builtin;

import java.util.Arrays;

/**
 * The recorded port voltages and currents of one lossless line at every accepted time point,
 * for the method of characteristics: each end's history source needs the other end's values
 * one delay earlier, linearly interpolated between the stored points. Before the first point
 * (t ≤ 0) the line holds its DC operating point. Queries come in increasing time, so a cursor
 * makes each look-up O(1) on average. Owned by one solve; not thread-safe.
 */
final class LineHistory {
    private double[] time = new double[256];
    /** Per point: v1, i1, v2, i2 (port voltages and currents into the line). */
    private double[] values = new double[4 * 256];
    private int size;
    private int cursor;

    /** Appends a point; {@code t} must exceed the last one. */
    void add(double t, double v1, double i1, double v2, double i2) {
        if (size == time.length) {
            time = Arrays.copyOf(time, size * 2);
            values = Arrays.copyOf(values, size * 8);
        }
        time[size] = t;
        int k = 4 * size;
        values[k] = v1;
        values[k + 1] = i1;
        values[k + 2] = v2;
        values[k + 3] = i2;
        size++;
    }

    /**
     * The four values at time {@code t}, linear between stored points, held before the first and
     * after the last.
     *
     * @param out receives v1, i1, v2, i2
     */
    void at(double t, double[] out) {
        if (t <= time[0] || size == 1) {
            System.arraycopy(values, 0, out, 0, 4);
            return;
        }
        if (t >= time[size - 1]) {
            System.arraycopy(values, 4 * (size - 1), out, 0, 4);
            return;
        }
        while (cursor > 0 && time[cursor] > t) {
            cursor--;
        }
        while (cursor + 1 < size && time[cursor + 1] <= t) {
            cursor++;
        }
        int j = cursor;
        double f = (t - time[j]) / (time[j + 1] - time[j]);
        int k = 4 * j;
        for (int q = 0; q < 4; q++) {
            out[q] = values[k + q] + f * (values[k + 4 + q] - values[k + q]);
        }
    }
}
