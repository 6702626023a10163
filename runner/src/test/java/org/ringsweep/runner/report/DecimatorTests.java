package org.ringsweep.runner.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Min/max decimation keeps real samples, peaks and both ends. */
class DecimatorTests {
    @Test
    void shortWaveformIsKeptWhole() {
        double[] t = {0, 1, 2, 3, 4};
        double[] v = {0, 1, 0, 1, 0};
        assertArrayEquals(new int[] {0, 1, 2, 3, 4}, Decimator.keep(t, v, 0, 5, 3));
    }

    @Test
    void longWaveformKeepsItsSinglePeakAndTroughAndBothEnds() {
        int n = 100_000;
        double[] t = new double[n];
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * 1e-12;
            v[i] = Math.sin(i * 0.001);
        }
        v[31_337] = 9.0; // a one-sample spike (a glitch a plot must not hide)
        v[77_777] = -9.0;
        int[] keep = Decimator.keep(t, v, 0, n, 500);
        assertTrue(keep.length <= 2 * 500 + 2, "at most two per bucket plus the ends: " + keep.length);
        assertEquals(0, keep[0]);
        assertEquals(n - 1, keep[keep.length - 1]);
        boolean spike = false;
        boolean trough = false;
        for (int i = 0; i < keep.length; i++) {
            if (i > 0) {
                assertTrue(keep[i] > keep[i - 1], "ascending, no duplicates");
            }
            spike |= keep[i] == 31_337;
            trough |= keep[i] == 77_777;
        }
        assertTrue(spike && trough, "the extremes survive");
    }

    @Test
    void everyBucketKeepsItsOwnMinimumAndMaximum() {
        // A ramp: in each bucket the minimum is its first sample and the maximum its last.
        int n = 10_000;
        double[] t = new double[n];
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i;
            v[i] = i;
        }
        int[] keep = Decimator.keep(t, v, 0, n, 10);
        double width = (n - 1) / 10.0;
        for (int b = 0; b < 10; b++) {
            int lo = (int) Math.ceil(b * width);
            int hi = b == 9 ? n - 1 : (int) Math.ceil((b + 1) * width) - 1;
            final int first = lo;
            final int last = hi;
            assertTrue(java.util.Arrays.stream(keep).anyMatch(k -> k == first), "bucket " + b + " min at " + first);
            assertTrue(java.util.Arrays.stream(keep).anyMatch(k -> k == last), "bucket " + b + " max at " + last);
        }
    }
}
