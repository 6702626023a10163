package org.ringsweep.runner.report;

import java.util.Arrays;

/**
 * Thins a long waveform for plotting without losing its peaks: the time span is cut into equal
 * buckets (about one per horizontal pixel of the plot) and each bucket keeps its lowest and its
 * highest sample, in time order; the first and last samples are always kept. Every kept point is
 * a sample of the waveform (nothing is averaged or interpolated), so overshoot and ringback
 * extremes appear in the plot at their true values. A waveform with no more than
 * {@code 2 × buckets} samples is kept whole.
 */
final class Decimator {
    private Decimator() {
    }

    /**
     * The indices to plot, ascending.
     *
     * @param t       sample times, ascending
     * @param v       sample values, same length
     * @param from    first index of the range (inclusive)
     * @param to      end of the range (exclusive)
     * @param buckets number of buckets, at least 1
     */
    static int[] keep(double[] t, double[] v, int from, int to, int buckets) {
        int n = to - from;
        if (n <= 0) {
            return new int[0];
        }
        if (n <= 2L * buckets) {
            int[] all = new int[n];
            for (int i = 0; i < n; i++) {
                all[i] = from + i;
            }
            return all;
        }
        double t0 = t[from];
        double span = t[to - 1] - t0;
        int[] out = new int[2 * buckets + 2];
        int count = 0;
        out[count++] = from;
        int i = from;
        for (int b = 0; b < buckets && i < to; b++) {
            double bucketEnd = b == buckets - 1 ? Double.POSITIVE_INFINITY : t0 + span * (b + 1) / buckets;
            int min = -1;
            int max = -1;
            for (; i < to && t[i] < bucketEnd; i++) {
                if (min < 0 || v[i] < v[min]) {
                    min = i;
                }
                if (max < 0 || v[i] > v[max]) {
                    max = i;
                }
            }
            if (min < 0) {
                continue;
            }
            int first = Math.min(min, max);
            int second = Math.max(min, max);
            if (first != out[count - 1]) {
                out[count++] = first;
            }
            if (second != first) {
                out[count++] = second;
            }
        }
        if (out[count - 1] != to - 1) {
            out[count++] = to - 1;
        }
        return Arrays.copyOf(out, count);
    }
}
