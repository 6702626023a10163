package org.ringsweep.runner.engine.builtin;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The ring-buffer line history: over many delays, with steps of very different sizes (so the
 * buffer must grow while points are dropped), a query one delay back returns the stored
 * piecewise-linear data. Data linear in time make the expected value exact: linear
 * interpolation reproduces a linear function (common practice), whatever points were kept.
 */
class LineHistoryTests {
    private static double f(int q, double t) {
        return (q + 1) * 1e9 * t - q;
    }

    @Test
    void aQueryOneDelayBackInterpolatesTheStoredPointsAfterDropsAndGrowth() {
        double delay = 1e-9;
        LineHistory h = new LineHistory(delay);
        h.add(0, f(0, 0), f(1, 0), f(2, 0), f(3, 0));
        Random r = new Random(7);
        double t = 0;
        double[] out = new double[4];
        for (int i = 0; i < 20_000; i++) {
            // Mostly 10-50 ps steps, now and then a burst of 0.1 ps steps (a few hundred points inside one delay).
            double step = i % 3000 < 400 ? 1e-13 : (10 + 40 * r.nextDouble()) * 1e-12;
            double next = t + step;
            double query = next - delay;
            h.at(query, out);
            for (int q = 0; q < 4; q++) {
                double expected = query <= 0 ? f(q, 0) : f(q, query);
                assertEquals(expected, out[q], 1e-9 * Math.max(1, Math.abs(expected)), "value " + q + " at " + query);
            }
            t = next;
            h.add(t, f(0, t), f(1, t), f(2, t), f(3, t));
            h.last(out);
            for (int q = 0; q < 4; q++) {
                // The last point, the one a step longer than the delay starts from, after any growth or drop.
                assertEquals(f(q, t), out[q], 1e-12 * Math.max(1, Math.abs(f(q, t))), "last value " + q + " at " + t);
            }
        }
    }

    @Test
    void beforeTheFirstPointTheHistoryHoldsTheOperatingPoint() {
        LineHistory h = new LineHistory(1e-9);
        h.add(0, 1, 2, 3, 4);
        h.add(1e-11, 5, 6, 7, 8);
        double[] out = new double[4];
        h.at(-5e-10, out);
        // The line holds its DC operating point for t ≤ 0 (method of characteristics from a DC start).
        assertEquals(1, out[0]);
        assertEquals(4, out[3]);
    }
}
