package org.ringsweep.runner.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.ringsweep.runner.measure.Vectors.NS;
import static org.ringsweep.runner.measure.Vectors.W1_T;
import static org.ringsweep.runner.measure.Vectors.W1_V;
import static org.ringsweep.runner.measure.Vectors.W2_V;
import static org.ringsweep.runner.measure.Vectors.W3_T;
import static org.ringsweep.runner.measure.Vectors.W3_V;
import static org.ringsweep.runner.measure.Vectors.W4_V;
import static org.ringsweep.runner.measure.Vectors.ns;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.ringsweep.api.net.Stimulus.Edge;

class EdgeMeasurerTests {
    /** §5 numbers are given to 6 decimals in ns. */
    private static final double T_TOL = 1e-6 * NS;
    private static final double V_TOL = 1e-9;

    /** waveform-metrics.md §5 conditions: rails 0 / 3.3 V, VIL 0.8, VIH 2.0, band 2 % = 0.066 V, h = 1 mV. */
    private static final Levels SECTION5 = new Levels(0, 3.3, 0.8, 2.0, 0.066, 0.001);

    /** W1's own 50 % instant is 2.5 ns (§5 W1 t50), used as the source's 50 % point. */
    private static final EdgeWindow W1_RISE = new EdgeWindow(Edge.RISE, 0, 2.5 * NS, 20 * NS);
    private static final EdgeWindow W4_FALL = new EdgeWindow(Edge.FALL, 0, 2.5 * NS, 20 * NS);

    @Test
    void w1CrossesVilAndVihWhereTheReferenceSaysAndOnce() {
        EdgeMetrics m = EdgeMeasurer.measure(W1_T, W1_V, W1_RISE, SECTION5);
        // waveform-metrics.md §5 W1: first VIH crossing 2.606061 ns (ngspice: 2.606061e-9)
        assertEquals(2.606061 * NS, m.firstCrossingS(), T_TOL);
        // waveform-metrics.md §5 W1: VIL crossing 2.242424 ns (ngspice: 2.242424e-9)
        assertEquals(2.242424 * NS, m.nearThresholdCrossingS(), T_TOL);
        // W1 crosses VIH only once (its ring-back min 2.9 V stays above VIH, §5 W1)
        assertEquals(1, m.crossings());
        assertEquals(m.firstCrossingS(), m.lastCrossingS(), 0);
        // delay = first VIH crossing − source 50 %: 2.606061 − 2.5 ns (§5 W1 values)
        assertEquals(0.106061 * NS, m.delayS(), T_TOL);
        assertEquals(2.0, m.thresholdV(), 0);
    }

    @Test
    void w1OvershootsTheRailBySixHundredMillivoltsAndKeepsPointNineVoltsRingbackMargin() {
        EdgeMetrics m = EdgeMeasurer.measure(W1_T, W1_V, W1_RISE, SECTION5);
        // waveform-metrics.md §5 W1: max 3.9 V @ 3.5 ns; absolute overshoot above rail 0.6 V
        assertEquals(3.9, m.vMax(), V_TOL);
        assertEquals(0.6, m.overshootV(), V_TOL);
        assertTrue(Double.isNaN(m.undershootV()));
        // waveform-metrics.md §5 W1: ringback min 2.9 V -> margin +0.9 V; the first peak is the 3.9 V at 3.5 ns
        assertEquals(0.9, m.ringbackMarginV(), V_TOL);
        assertEquals(2.9, m.ringbackExtremeV(), V_TOL);
        assertEquals(3.5 * NS, m.ringbackPeakS(), 0);
        // W1's points rise without a reversal through 0.8..2.0 V (§5 W1 data: 0, 1.65, 3.3)
        assertTrue(m.monotonic());
        assertEquals(0, m.nonMonotonicDepthV(), 0);
    }

    @Test
    void w1SlewIsThreePointThreeVoltsPerNanosecond() {
        EdgeMetrics m = EdgeMeasurer.measure(W1_T, W1_V, W1_RISE, SECTION5);
        // waveform-metrics.md §5 W1: slew VIL->VIH 3.3 V/ns, 10->90 % also 3.3 V/ns (one straight
        // segment 2..3 ns holds 20 % and 80 % too: 0.66 V at 2.2 ns, 2.64 V at 2.8 ns)
        assertEquals(3.3e9, m.slewVPerS(), 1e-3);
        assertEquals(2.2 * NS, m.slewFromS(), T_TOL);
        assertEquals(2.8 * NS, m.slewToS(), T_TOL);
        assertEquals(0, m.vBefore(), 0);
        assertEquals(3.3, m.vFinal(), 0);
    }

    @Test
    void w1SettlesAtFourPointSevenOneNanoseconds() {
        EdgeMetrics m = EdgeMeasurer.measure(W1_T, W1_V, W1_RISE, SECTION5);
        // waveform-metrics.md §5 W1: enters the band at 4.71 ns -> settling duration 2.21 ns from t50.
        // The window runs to 20 ns, so its last 20 % (16..20 ns) is flat at 3.3 V: settled by our rule.
        assertTrue(m.settled());
        assertEquals(4.71 * NS, m.settleInstantS(), T_TOL);
        assertEquals(2.21 * NS, m.settleS(), T_TOL);
        assertEquals(0, m.tailDeviationV(), V_TOL);
        assertEquals(0.066, m.settleBandV(), 0);
    }

    @Test
    void windowsStartingAndEndingBetweenSamplesGiveTheSameW1Edge() {
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0.5 * NS, 2.5 * NS, 19.5 * NS);
        EdgeMetrics m = EdgeMeasurer.measure(W1_T, W1_V, w, SECTION5);
        // waveform-metrics.md §5 W1: VIH 2.606061 ns, margin +0.9 V, settling instant 4.71 ns
        assertEquals(2.606061 * NS, m.firstCrossingS(), T_TOL);
        assertEquals(0.9, m.ringbackMarginV(), V_TOL);
        assertEquals(4.71 * NS, m.settleInstantS(), T_TOL);
        assertEquals(0.5 * NS, m.windowStartS(), 0);
        assertEquals(19.5 * NS, m.windowEndS(), 0);
    }

    @Test
    void w2RingsBackBelowVihAndCountsAsADoubleClock() {
        EdgeMetrics m = EdgeMeasurer.measure(W1_T, W2_V, W1_RISE, SECTION5);
        // waveform-metrics.md §5 W2: ringback min 1.9 V, margin -0.1 V (violation)
        assertEquals(-0.1, m.ringbackMarginV(), V_TOL);
        // waveform-metrics.md §5 W2: VIH re-crossed falling at 3.975 and rising at 4.032258 ns,
        // so two rising VIH crossings: 2.606061 and 4.032258 ns (the max flight-time reference)
        assertEquals(2, m.crossings());
        assertEquals(2.606061 * NS, m.firstCrossingS(), T_TOL);
        assertEquals(4.032258 * NS, m.lastCrossingS(), T_TOL);
        // waveform-metrics.md §5 W2: min flight-time reference = first VIL crossing 2.242424 ns
        assertEquals(2.242424 * NS, m.nearThresholdCrossingS(), T_TOL);
    }

    @Test
    void w4FallingEdgeMirrorsW1() {
        EdgeMetrics m = EdgeMeasurer.measure(W1_T, W4_V, W4_FALL, SECTION5);
        // waveform-metrics.md §5 W4: first VIL crossing 2.757576 ns, first VIH crossing 2.393939 ns
        assertEquals(2.757576 * NS, m.firstCrossingS(), T_TOL);
        assertEquals(2.393939 * NS, m.nearThresholdCrossingS(), T_TOL);
        assertEquals(1, m.crossings());
        assertEquals(0.8, m.thresholdV(), 0);
        // waveform-metrics.md §5 W4: undershoot below S1 18.18182 % of A = 3.3 V, i.e. 0.6 V below the 0 V rail
        assertEquals(0.6, m.undershootV(), V_TOL);
        assertTrue(Double.isNaN(m.overshootV()));
        // waveform-metrics.md §5 W4: ringback max after VIL 0.4 V -> margin +0.4 V; the first trough is at 3.5 ns
        assertEquals(0.4, m.ringbackMarginV(), V_TOL);
        assertEquals(0.4, m.ringbackExtremeV(), V_TOL);
        assertEquals(3.5 * NS, m.ringbackPeakS(), 0);
        // waveform-metrics.md §5 W4: slew 3.3 V/ns, settling instant 4.71 ns
        assertEquals(3.3e9, m.slewVPerS(), 1e-3);
        assertTrue(m.settled());
        assertEquals(4.71 * NS, m.settleInstantS(), T_TOL);
        assertTrue(m.monotonic());
    }

    @Test
    void w3ReversalOfThreeHundredMillivoltsIsFlaggedOnlyWithTheSmallHysteresis() {
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 2.2 * NS, 10 * NS);
        EdgeMetrics small = EdgeMeasurer.measure(W3_T, W3_V, w, new Levels(0, 3.3, 0.8, 2.0, 0.066, 0.05));
        // waveform-metrics.md §5 W3: depth 0.3 V -> flagged with h = 0.05
        assertFalse(small.monotonic());
        assertEquals(0.3, small.nonMonotonicDepthV(), V_TOL);
        EdgeMetrics large = EdgeMeasurer.measure(W3_T, W3_V, w, new Levels(0, 3.3, 0.8, 2.0, 0.066, 0.5));
        // waveform-metrics.md §5 W3: not flagged with h = 0.5
        assertTrue(large.monotonic());
        assertEquals(0.3, large.nonMonotonicDepthV(), V_TOL);
    }

    @Test
    void hysteresisVectorCountsTwoClockEdgesWithoutHysteresisAndOneWithIt() {
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 3 * NS, 6 * NS);
        // VIH = 1.65 V is the level of the §5 Hysteresis vector
        EdgeMetrics raw = EdgeMeasurer.measure(Vectors.HYST_T, Vectors.HYST_V, w, new Levels(0, 3.3, 0.8, 1.65, 0.066, 0));
        // waveform-metrics.md §5 Hysteresis: h = 0 gives rising 1.5 and 3.5 ns (and falling 2.5 ns)
        assertEquals(2, raw.crossings());
        assertEquals(1.5 * NS, raw.firstCrossingS(), T_TOL);
        assertEquals(3.5 * NS, raw.lastCrossingS(), T_TOL);
        EdgeMetrics hyst = EdgeMeasurer.measure(Vectors.HYST_T, Vectors.HYST_V, w, new Levels(0, 3.3, 0.8, 1.65, 0.066, 0.2));
        // waveform-metrics.md §5 Hysteresis: h = 0.2 gives a single rising event at 3.5 ns
        assertEquals(1, hyst.crossings());
        assertEquals(3.5 * NS, hyst.firstCrossingS(), T_TOL);
    }

    @Test
    void aWindowEndingDuringTheRingingHasNotSettled() {
        // W1 cut at 4.2 ns: v_final = v(4.2) = 2.9 + 0.55 * 0.4 = 3.12 V; the last 20 % (3.36..4.2 ns)
        // holds the 3.9 V peak, 0.78 V away (hand interpolation of the §5 W1 points).
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 2.5 * NS, 4.2 * NS);
        EdgeMetrics m = EdgeMeasurer.measure(W1_T, W1_V, w, SECTION5);
        assertEquals(3.12, m.vFinal(), V_TOL);
        assertFalse(m.settled());
        assertTrue(Double.isNaN(m.settleS()));
        assertTrue(Double.isNaN(m.settleInstantS()));
        assertEquals(0.78, m.tailDeviationV(), V_TOL);
    }

    @Test
    void anExponentialCreepStillMovingAtTheWindowEndHasNotSettled() {
        double tau = 5 * NS;
        double[][] wave = exponential(tau, 10 * NS, 0.01 * NS);
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 0, 10 * NS);
        Levels levels = new Levels(0, 3.3, 0.8, 2.0, 0.165, 0.01);
        EdgeMetrics m = EdgeMeasurer.measure(wave[0], wave[1], w, levels);
        // analytic: v = 3.3 (1 - exp(-t/tau)); v_final = 3.3 (1 - e^-2); over 8..10 ns it still rises by
        // 3.3 (e^-1.6 - e^-2) = 0.2197 V > the 0.165 V band
        assertEquals(3.3 * (1 - Math.exp(-2)), m.vFinal(), 1e-9);
        assertEquals(3.3 * (Math.exp(-1.6) - Math.exp(-2)), m.tailDeviationV(), 1e-5);
        assertFalse(m.settled());
        assertTrue(Double.isNaN(m.settleS()));
    }

    @Test
    void anExponentialApproachGivenTimeSettlesWhereTheFormulaSays() {
        double tau = 5 * NS;
        double[][] wave = exponential(tau, 50 * NS, 0.01 * NS);
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 0, 50 * NS);
        Levels levels = new Levels(0, 3.3, 0.8, 2.0, 0.165, 0.01);
        EdgeMetrics m = EdgeMeasurer.measure(wave[0], wave[1], w, levels);
        // analytic: v_final - v(t) = 3.3 (e^(-t/tau) - e^-10) = 0.165 V at t = -tau ln(0.05 + e^-10)
        double expected = -tau * Math.log(0.05 + Math.exp(-10));
        assertTrue(m.settled());
        assertEquals(expected, m.settleInstantS(), 1e-4 * NS);
        assertEquals(expected, m.settleS(), 1e-4 * NS);
        // analytic: first VIH crossing where 3.3 (1 - e^(-t/tau)) = 2.0
        assertEquals(-tau * Math.log(1 - 2.0 / 3.3), m.firstCrossingS(), 1e-4 * NS);
    }

    @Test
    void slewOfALinearRampIsItsSlope() {
        // analytic ramp: 0 V until 1 ns, 3.3 V/ns to 3.3 V at 2 ns, flat to 10 ns
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 1.5 * NS, 10 * NS);
        EdgeMetrics m = EdgeMeasurer.measure(ns(0, 1, 2, 10), new double[] {0, 0, 3.3, 3.3}, w, SECTION5);
        assertEquals(3.3e9, m.slewVPerS(), 1e-3);
        assertEquals(1.2 * NS, m.slewFromS(), 1e-12 * NS);
        assertEquals(1.8 * NS, m.slewToS(), 1e-12 * NS);
        // analytic: VIH at 1 + 2.0 / 3.3 ns, VIL at 1 + 0.8 / 3.3 ns
        assertEquals((1 + 2.0 / 3.3) * NS, m.firstCrossingS(), 1e-12 * NS);
        assertEquals((1 + 0.8 / 3.3) * NS, m.nearThresholdCrossingS(), 1e-12 * NS);
        assertEquals((2.0 / 3.3 - 0.5) * NS, m.delayS(), 1e-12 * NS);
        // analytic: no peak after VIH; the highest point after it is the 3.3 V plateau
        assertEquals(1.3, m.ringbackMarginV(), V_TOL);
        assertEquals(0, m.overshootV(), V_TOL);
        assertTrue(m.settled());
    }

    @Test
    void uniformAndVeryNonUniformSamplingOfOneRampGiveTheSameCrossings() {
        // The same piecewise-linear ramp as above; linear interpolation is exact on it, so both
        // samplings must give the analytic crossing times (1 + L / 3.3 ns).
        List<Double> uniform = new ArrayList<>();
        for (int i = 0; i <= 1000; i++) {
            uniform.add(i * 0.01 * NS);
        }
        List<Double> irregular = new ArrayList<>();
        Random random = new Random(181);
        double t = 0;
        while (t < 10 * NS) {
            irregular.add(t);
            double step = Math.pow(10, -15 + 5 * random.nextDouble()); // 1 fs .. 100 ps
            double next = t + step;
            for (double corner : new double[] {1 * NS, 2 * NS}) {
                if (t < corner && next > corner) {
                    next = corner;
                }
            }
            t = next;
        }
        irregular.add(10 * NS);
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 1.5 * NS, 10 * NS);
        for (List<Double> times : List.of(uniform, irregular)) {
            double[] ts = times.stream().mapToDouble(Double::doubleValue).toArray();
            double[] vs = new double[ts.length];
            for (int i = 0; i < ts.length; i++) {
                vs[i] = ramp(ts[i]);
            }
            EdgeMetrics m = EdgeMeasurer.measure(ts, vs, w, SECTION5);
            assertEquals((1 + 2.0 / 3.3) * NS, m.firstCrossingS(), 1e-9 * NS);
            assertEquals((1 + 0.8 / 3.3) * NS, m.nearThresholdCrossingS(), 1e-9 * NS);
            assertEquals(1, m.crossings());
            assertEquals(3.3e9, m.slewVPerS(), 1e3);
        }
        assertTrue(irregular.size() > 500, "the irregular grid really has many tiny steps");
    }

    @Test
    void anEdgeThatNeverReachesVihHasNoCrossingDelayOrMargin() {
        // hand-made: a ramp to 1.8 V, below VIH = 2.0 V
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 1.5 * NS, 10 * NS);
        EdgeMetrics m = EdgeMeasurer.measure(ns(0, 1, 2, 10), new double[] {0, 0, 1.8, 1.8}, w, SECTION5);
        assertEquals(0, m.crossings());
        assertFalse(m.thresholdReached());
        assertTrue(Double.isNaN(m.firstCrossingS()));
        assertTrue(Double.isNaN(m.lastCrossingS()));
        assertTrue(Double.isNaN(m.delayS()));
        assertTrue(Double.isNaN(m.ringbackMarginV()));
        assertTrue(Double.isNaN(m.ringbackPeakS()));
        // 1.8 - 3.3: stays 1.5 V below the rail
        assertEquals(-1.5, m.overshootV(), V_TOL);
        // it did cross VIL: 0.8 / 1.8 of the way from 1 to 2 ns
        assertEquals((1 + 0.8 / 1.8) * NS, m.nearThresholdCrossingS(), 1e-12 * NS);
    }

    @Test
    void aWindowWithoutSamplesOfItsOwnIsMeasuredOnItsInterpolatedEnds() {
        // analytic: one straight segment 0 V at 0 -> 3.3 V at 10 ns (0.33 V/ns), window 2..8 ns
        EdgeWindow w = new EdgeWindow(Edge.RISE, 2 * NS, 5 * NS, 8 * NS);
        EdgeMetrics m = EdgeMeasurer.measure(ns(0, 10), new double[] {0, 3.3}, w, SECTION5);
        assertEquals(0.66, m.vBefore(), V_TOL);
        assertEquals(2.64, m.vFinal(), V_TOL);
        assertEquals(2.64, m.vMax(), V_TOL);
        assertEquals(0.66, m.vMin(), V_TOL);
        assertEquals(1, m.crossings());
        assertEquals(2.0 / 3.3 * 10 * NS, m.firstCrossingS(), 1e-12 * NS);
        // 20 % / 80 % of 0.66 -> 2.64 V are 1.056 V and 2.244 V, at 3.2 and 6.8 ns: the segment's slope
        assertEquals(3.2 * NS, m.slewFromS(), 1e-12 * NS);
        assertEquals(6.8 * NS, m.slewToS(), 1e-12 * NS);
        assertEquals(0.33e9, m.slewVPerS(), 1e-3);
        // our ringback rule: no peak in the window, so the highest point after VIH (the end, 2.64 V)
        assertEquals(0.64, m.ringbackMarginV(), V_TOL);
        // still ramping: over 6.8..8 ns it moves 0.396 V, more than the 0.066 V band
        assertFalse(m.settled());
        assertEquals(0.396, m.tailDeviationV(), V_TOL);
    }

    @Test
    void aSampleExactlyOnVihIsOneCrossingAtThatSample() {
        // hand-made: 1 V/ns ramp with a sample at exactly 2.0 V (2 ns)
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 1.5 * NS, 10 * NS);
        Levels noHysteresis = new Levels(0, 3.3, 0.8, 2.0, 0.165, 0);
        EdgeMetrics m = EdgeMeasurer.measure(ns(0, 1, 2, 3, 10), new double[] {0, 1, 2, 3, 3}, w, noHysteresis);
        assertEquals(1, m.crossings());
        assertEquals(2 * NS, m.firstCrossingS(), 0);
    }

    @Test
    void equalTimesKeepTheLaterSample() {
        // waveform-metrics.md §4: if two times are equal keep the later sample; a vertical step at 1 ns
        EdgeWindow w = new EdgeWindow(Edge.RISE, 1 * NS, 1 * NS, 10 * NS);
        EdgeMetrics m = EdgeMeasurer.measure(ns(0, 1, 1, 10), new double[] {0, 0, 3.3, 3.3}, w, SECTION5);
        assertEquals(3.3, m.vBefore(), 0);
        assertEquals(3.3, m.vMin(), 0);
    }

    @Test
    void areaAboveTheRailOfW1MatchesTheReference() {
        // waveform-metrics.md §5 W1: area above 3.3 V = 0.27835 V·ns
        assertEquals(0.27835e-9, EdgeMeasurer.areaBeyond(W1_T, W1_V, 0, 20 * NS, 3.3, true), 1e-5 * NS);
        // waveform-metrics.md §5 W4: area below 0 V = 0.27835 V·ns
        assertEquals(0.27835e-9, EdgeMeasurer.areaBeyond(W1_T, W4_V, 0, 20 * NS, 0, false), 1e-5 * NS);
        // W1 never goes below 0 V (§5 W1 data)
        assertEquals(0, EdgeMeasurer.areaBeyond(W1_T, W1_V, 0, 20 * NS, 0, false), 0);
    }

    @Test
    void areaOfAWindowEndingInsideTheOvershootCountsOnlyTheWindow() {
        // W1 from 3.0 to 3.5 ns: one triangle 0.5 ns x 0.6 V / 2 = 0.15 V·ns (hand computation on §5 W1 points)
        assertEquals(0.15e-9, EdgeMeasurer.areaBeyond(W1_T, W1_V, 3 * NS, 3.5 * NS, 3.3, true), 1e-12 * NS);
        // from 3.25 ns: v = 3.6 V there, trapezoid 0.25 ns x (0.3 + 0.6) V / 2 = 0.1125 V·ns
        assertEquals(0.1125e-9, EdgeMeasurer.areaBeyond(W1_T, W1_V, 3.25 * NS, 3.5 * NS, 3.3, true), 1e-12 * NS);
    }

    @Test
    void windowsOutsideTheDataAreRejected() {
        Levels l = SECTION5;
        assertThrows(IllegalArgumentException.class,
                () -> EdgeMeasurer.measure(W1_T, W1_V, new EdgeWindow(Edge.RISE, -1 * NS, 2.5 * NS, 20 * NS), l));
        assertThrows(IllegalArgumentException.class,
                () -> EdgeMeasurer.measure(W1_T, W1_V, new EdgeWindow(Edge.RISE, 0, 2.5 * NS, 21 * NS), l));
        assertThrows(IllegalArgumentException.class, () -> new EdgeWindow(Edge.RISE, 5 * NS, 5 * NS, 5 * NS));
        assertThrows(IllegalArgumentException.class,
                () -> EdgeMeasurer.areaBeyond(W1_T, W1_V, 0, 25 * NS, 3.3, true));
    }

    @Test
    void malformedLevelsAreRejected() {
        assertThrows(IllegalArgumentException.class, () -> new Levels(3.3, 0, 0.8, 2.0, 0.066, 0));
        assertThrows(IllegalArgumentException.class, () -> new Levels(0, 3.3, 2.0, 0.8, 0.066, 0));
        assertThrows(IllegalArgumentException.class, () -> new Levels(0, 3.3, 0.8, 2.0, 0, 0));
        assertThrows(IllegalArgumentException.class, () -> new Levels(0, 3.3, 0.8, 2.0, 0.066, -0.001));
        assertThrows(IllegalArgumentException.class, () -> new Levels(0, Double.NaN, 0.8, 2.0, 0.066, 0));
    }

    @Test
    void defaultHysteresisIsOnePercentOfTheSwing() {
        // waveform-metrics.md §4.3: typical h = 1-2 % of A; we take 1 %: 33 mV on a 3.3 V swing
        assertEquals(0.033, Levels.of(0, 3.3, 0.8, 2.0, 0.165).hysteresis(), 1e-15);
    }

    private static double ramp(double t) {
        if (t <= 1 * NS) {
            return 0;
        }
        if (t >= 2 * NS) {
            return 3.3;
        }
        return 3.3 * (t - 1 * NS) / NS;
    }

    private static double[][] exponential(double tau, double stop, double step) {
        int n = (int) Math.round(stop / step) + 1;
        double[] t = new double[n];
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i == n - 1 ? stop : i * step;
            v[i] = 3.3 * (1 - Math.exp(-t[i] / tau));
        }
        return new double[][] {t, v};
    }

    @Test
    void tenToNinetyThresholdsOnAnRcChargeGiveLnNineTimesRc() {
        // lines-and-terminations.md §5/§7: 10–90 % of a single-pole RC charge = ln 9·RC = 2.197·RC;
        // 4.7 kΩ × 100 pF → 1032.7 ns. Thresholds at 10 % and 90 % of 3.3 V, samples every 0.1 ns.
        double rc = 4700 * 100e-12;
        int n = 40001;
        double[] t = new double[n];
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * 0.1 * NS;
            v[i] = 3.3 * (1 - Math.exp(-t[i] / rc));
        }
        Levels tenNinety = new Levels(0, 3.3, 0.33, 2.97, 0.165, 0.01);
        EdgeMetrics m = EdgeMeasurer.measure(t, v, new EdgeWindow(Edge.RISE, 0, 0, t[n - 1]), tenNinety);
        assertEquals(Math.log(9) * rc, m.thresholdTransitionS(), 1e-13);
        assertEquals(1032.7e-9, m.thresholdTransitionS(), 0.05e-9);
    }

    @Test
    void fallTimeRunsFromTheLastVihCrossingToTheFirstVilCrossing() {
        // analytic ramp 3.3 -> 0 V over 1..2 ns: VIH 2.0 V at 1 + 1.3/3.3 ns, VIL 0.8 V at 1 + 2.5/3.3 ns,
        // 1.2/3.3 ns apart (arithmetic)
        Levels levels = new Levels(0, 3.3, 0.8, 2.0, 0.165, 0.01);
        EdgeMetrics m = EdgeMeasurer.measure(ns(0, 1, 2, 20), new double[] {3.3, 3.3, 0, 0},
                new EdgeWindow(Edge.FALL, 0, 1.5 * NS, 20 * NS), levels);
        assertEquals(1.2 / 3.3 * NS, m.thresholdTransitionS(), 1e-21);
    }

    @Test
    void riseTimeStartsAtTheLastVilCrossingBeforeVihAndIsNaNWithoutVih() {
        // hand-drawn: up through VIL 0.8 V at 1.5 ns, back below at 2.5 ns, up again through VIL at 3.5 ns
        // (samples 0.4 / 1.2 / 0.4 / 1.2 V around it) and VIH 2.0 V at 4.5 ns: the rise time counts from 3.5 ns.
        Levels levels = new Levels(0, 3.3, 0.8, 2.0, 0.165, 0.01);
        double[] t = ns(0, 1, 2, 3, 4, 5, 20);
        double[] v = {0, 0.4, 1.2, 0.4, 1.2, 2.8, 3.3};
        EdgeMetrics m = EdgeMeasurer.measure(t, v, new EdgeWindow(Edge.RISE, 0, 1 * NS, 20 * NS), levels);
        assertEquals(1 * NS, m.thresholdTransitionS(), 1e-21);
        EdgeMetrics low = EdgeMeasurer.measure(ns(0, 1, 2, 20), new double[] {0, 0, 1.5, 1.5},
                new EdgeWindow(Edge.RISE, 0, 1 * NS, 20 * NS), levels);
        assertTrue(Double.isNaN(low.thresholdTransitionS()));
    }
}
