package org.ringsweep.runner.engine.builtin;

/**
 * The recorded port voltages and currents of one lossless line over its last delay, for the
 * method of characteristics: each end's history source needs the other end's values one delay
 * earlier, linearly interpolated between the stored points. Before the first point (t ≤ 0) the
 * line holds its DC operating point. A ring buffer: a point is dropped once a later point is at
 * least one delay old, since every later query (at {@code t − delay} for a t beyond the last
 * point) lies after it; it grows only when a delay holds more points than it has room for.
 * Queries come in (nearly) increasing time, so a cursor makes each look-up O(1) on average.
 * Owned by one solve; not thread-safe.
 */
final class LineHistory {
    private final double delay;
    private double[] time = new double[64];
    /** Per point: v1, i1, v2, i2 (port voltages and currents into the line). */
    private double[] values = new double[4 * 64];
    /** Capacity − 1 (the capacity is a power of two). */
    private int mask = 63;
    /** Physical index of the oldest kept point, and the number kept. */
    private int head;
    private int size;
    /** Logical index (0 = oldest kept) of the last look-up's lower point. */
    private int cursor;

    /** A history for a line of this one-way delay (s). */
    LineHistory(double delay) {
        this.delay = delay;
    }

    /** Appends a point; {@code t} must exceed the last one. */
    void add(double t, double v1, double i1, double v2, double i2) {
        // Drop the oldest point while the next one is already a delay old.
        while (size >= 2 && time[physical(1)] <= t - delay) {
            head = physical(1);
            size--;
            cursor = Math.max(0, cursor - 1);
        }
        if (size == time.length) {
            grow();
        }
        int p = physical(size);
        time[p] = t;
        int k = 4 * p;
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
        if (size == 1 || t <= time[head]) {
            System.arraycopy(values, 4 * head, out, 0, 4);
            return;
        }
        int last = physical(size - 1);
        if (t >= time[last]) {
            System.arraycopy(values, 4 * last, out, 0, 4);
            return;
        }
        int j = Math.min(cursor, size - 2);
        int a = physical(j);
        int b = (a + 1) & mask;
        if (!(time[a] <= t && t < time[b])) {
            while (j > 0 && time[physical(j)] > t) {
                j--;
            }
            while (j + 2 < size && time[physical(j + 1)] <= t) {
                j++;
            }
            a = physical(j);
            b = (a + 1) & mask;
        }
        cursor = j;
        double f = (t - time[a]) / (time[b] - time[a]);
        int ka = 4 * a;
        int kb = 4 * b;
        for (int q = 0; q < 4; q++) {
            out[q] = values[ka + q] + f * (values[kb + q] - values[ka + q]);
        }
    }

    /** The four values of the last point (v1, i1, v2, i2) into {@code out}. */
    void last(double[] out) {
        System.arraycopy(values, 4 * physical(size - 1), out, 0, 4);
    }

    private int physical(int logical) {
        return (head + logical) & mask;
    }

    private void grow() {
        int n = time.length;
        double[] t2 = new double[2 * n];
        double[] v2 = new double[8 * n];
        for (int i = 0; i < size; i++) {
            int p = physical(i);
            t2[i] = time[p];
            System.arraycopy(values, 4 * p, v2, 4 * i, 4);
        }
        time = t2;
        values = v2;
        head = 0;
        mask = 2 * n - 1;
    }
}
