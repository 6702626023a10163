package org.ringsweep.runner.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.ringsweep.runner.measure.Vectors.HYST_T;
import static org.ringsweep.runner.measure.Vectors.HYST_V;
import static org.ringsweep.runner.measure.Vectors.NS;
import static org.ringsweep.runner.measure.Vectors.ns;

import java.util.List;
import org.junit.jupiter.api.Test;

class CrossingsTests {
    private static final double TOL = 1e-6 * NS;

    @Test
    void zeroHysteresisReportsEveryCrossingOfTheHysteresisVector() {
        List<Crossing> c = Crossings.withHysteresis(HYST_T, HYST_V, 1.65, 0);
        assertEquals(3, c.size());
        // waveform-metrics.md §5 Hysteresis: h = 0 gives rising 1.5, falling 2.5, rising 3.5 (ns)
        assertEquals(1.5 * NS, c.get(0).time(), TOL);
        assertTrue(c.get(0).rising());
        assertEquals(2.5 * NS, c.get(1).time(), TOL);
        assertTrue(!c.get(1).rising());
        assertEquals(3.5 * NS, c.get(2).time(), TOL);
        assertTrue(c.get(2).rising());
    }

    @Test
    void hysteresisBandIgnoresWigglesThatOnlyTouchTheLevel() {
        List<Crossing> c = Crossings.withHysteresis(HYST_T, HYST_V, 1.65, 0.2);
        // waveform-metrics.md §5 Hysteresis: h = 0.2 gives a single rising event at 3.5 ns
        assertEquals(1, c.size());
        assertEquals(3.5 * NS, c.get(0).time(), TOL);
        assertTrue(c.get(0).rising());
    }

    @Test
    void rawCrossingsOfTheHysteresisVectorAreTheSameThree() {
        List<Crossing> c = Crossings.raw(HYST_T, HYST_V, 1.65);
        // waveform-metrics.md §5 Hysteresis (h = 0): 1.5, 2.5, 3.5 ns
        assertEquals(3, c.size());
        assertEquals(1.5 * NS, c.get(0).time(), TOL);
        assertEquals(2.5 * NS, c.get(1).time(), TOL);
        assertEquals(3.5 * NS, c.get(2).time(), TOL);
    }

    @Test
    void aSampleExactlyOnTheLevelIsOneCrossing() {
        // Both segments next to the 2.0 V sample find it (waveform-metrics.md §4.2): one crossing, at the sample.
        double[] t = ns(0, 1, 2, 3, 10);
        double[] v = {0, 1, 2, 3, 3};
        List<Crossing> raw = Crossings.raw(t, v, 2.0);
        assertEquals(1, raw.size());
        assertEquals(2 * NS, raw.get(0).time(), 0);
        List<Crossing> events = Crossings.withHysteresis(t, v, 2.0, 0);
        assertEquals(1, events.size());
        assertEquals(2 * NS, events.get(0).time(), 0);
    }

    @Test
    void aWaveThatTouchesTheLevelAndTurnsBackDoesNotCrossIt() {
        // Up to exactly 2.0 V and back down: a touch, by inspection of the points.
        double[] t = ns(0, 1, 2, 3, 4);
        double[] v = {0, 1, 2, 1, 0};
        assertEquals(List.of(), Crossings.raw(t, v, 2.0));
        assertEquals(List.of(), Crossings.withHysteresis(t, v, 2.0, 0));
    }

    @Test
    void aFlatStretchOnTheLevelIsOneCrossingWhereTheWaveFirstReachesIt() {
        // waveform-metrics.md §4.2: flat segments lying on L yield no crossing of their own.
        double[] t = ns(0, 1, 2, 3);
        double[] v = {1, 2, 2, 3};
        List<Crossing> raw = Crossings.raw(t, v, 2.0);
        assertEquals(1, raw.size());
        assertEquals(1 * NS, raw.get(0).time(), 0);
    }

    @Test
    void malformedSeriesAreRejected() {
        assertThrows(IllegalArgumentException.class, () -> Crossings.raw(ns(0, 2, 1), new double[] {0, 1, 2}, 1));
        assertThrows(IllegalArgumentException.class, () -> Crossings.raw(ns(0, 1), new double[] {0, Double.NaN}, 1));
        assertThrows(IllegalArgumentException.class, () -> Crossings.raw(ns(0, 1), new double[] {0}, 1));
        assertThrows(IllegalArgumentException.class, () -> Crossings.withHysteresis(ns(0, 1), new double[] {0, 1}, 1, -0.1));
    }
}
