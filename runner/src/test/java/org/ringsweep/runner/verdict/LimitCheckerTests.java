package org.ringsweep.runner.verdict;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ringsweep.api.net.LimitName;
import org.ringsweep.api.net.Limits;
import org.ringsweep.api.net.Stimulus.Edge;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.runner.measure.EdgeMeasurer;
import org.ringsweep.runner.measure.EdgeMetrics;
import org.ringsweep.runner.measure.EdgeWindow;
import org.ringsweep.runner.measure.Levels;

/**
 * Each check on hand-drawn waveforms (values chosen by hand just either side of each limit), the
 * §5 vectors of waveform-metrics.md where they fit.
 */
class LimitCheckerTests {
    private static final double NS = 1e-9;
    private static final EffectiveLimits DEFAULTS = LimitDefaults.resolve(Limits.NONE, 3.3);
    /** Rails 0 / 3.3 V, VIL 0.8, VIH 2.0, the default 5 % band (0.165 V), 10 mV hysteresis. */
    private static final Levels LEVELS = new Levels(0, 3.3, 0.8, 2.0, DEFAULTS.settleBandV(), 0.01);
    private static final EdgeWindow RISE = new EdgeWindow(Edge.RISE, 0, 1.5 * NS, 20 * NS);
    private static final EdgeWindow FALL = new EdgeWindow(Edge.FALL, 0, 1.5 * NS, 20 * NS);

    @Test
    void aCleanEdgePassesEveryDefaultLimit() {
        assertEquals(List.of(), check(RISE, ns(0, 1, 2, 20), new double[] {0, 0, 3.3, 3.3}, DEFAULTS));
        assertEquals(List.of(), check(FALL, ns(0, 1, 2, 20), new double[] {3.3, 3.3, 0, 0}, DEFAULTS));
    }

    @Test
    void overshootJustAboveTheDefaultFailsAndJustBelowPasses() {
        // hand-chosen peaks 3.61 V / 3.59 V: 0.31 V / 0.29 V above the 3.3 V rail vs the 0.3 V default
        List<Violation> fail = check(RISE, ns(0, 1, 2, 3, 20), new double[] {0, 0, 3.61, 3.3, 3.3}, DEFAULTS);
        assertEquals(List.of("overshoot_max"), keys(fail));
        assertEquals(0.31, fail.get(0).measured(), 1e-12);
        assertEquals(0.3, fail.get(0).limitValue(), 0);
        assertEquals(Edge.RISE, fail.get(0).edge());
        assertEquals("rising edge overshoots the high rail by 0.31 V; limit 0.30 V (defaulted)", fail.get(0).message());
        assertEquals(List.of(), check(RISE, ns(0, 1, 2, 3, 20), new double[] {0, 0, 3.59, 3.3, 3.3}, DEFAULTS));
    }

    @Test
    void aSetOvershootLimitReplacesTheDefaultAndIsNotCalledDefaulted() {
        EffectiveLimits half = limits(Map.of(LimitName.OVERSHOOT_MAX, Value.of(0.5, Dimension.VOLTAGE)));
        // hand-chosen: 0.31 V passes a 0.5 V limit, 0.62 V fails it
        assertEquals(List.of(), check(RISE, ns(0, 1, 2, 3, 20), new double[] {0, 0, 3.61, 3.3, 3.3}, half));
        List<Violation> fail = check(RISE, ns(0, 1, 2, 3, 20), new double[] {0, 0, 3.92, 3.3, 3.3}, half);
        assertEquals(List.of("overshoot_max"), keys(fail));
        assertEquals("rising edge overshoots the high rail by 0.62 V; limit 0.50 V", fail.get(0).message());
    }

    @Test
    void undershootJustBelowTheLowRailLimitFailsAndJustInsidePasses() {
        // hand-chosen troughs -0.31 V / -0.29 V vs the 0.3 V default
        List<Violation> fail = check(FALL, ns(0, 1, 2, 3, 20), new double[] {3.3, 3.3, -0.31, 0, 0}, DEFAULTS);
        assertEquals(List.of("undershoot_max"), keys(fail));
        assertEquals(0.31, fail.get(0).measured(), 1e-12);
        assertEquals("falling edge undershoots the low rail by 0.31 V; limit 0.30 V (defaulted)", fail.get(0).message());
        assertEquals(List.of(), check(FALL, ns(0, 1, 2, 3, 20), new double[] {3.3, 3.3, -0.29, 0, 0}, DEFAULTS));
    }

    @Test
    void ringbackJustIntoTheUndefinedBandFailsAndJustShortOfItPasses() {
        // hand-chosen: peak 3.5 V then a trough at 1.995 V / 2.005 V against VIH 2.0 V; both stay inside
        // the 10 mV hysteresis band, so VIH is crossed only once
        List<Violation> fail = check(RISE, ns(0, 1, 2, 3, 4, 20), new double[] {0, 0, 3.5, 1.995, 3.3, 3.3}, DEFAULTS);
        assertEquals(List.of("ringback_margin_min"), keys(fail));
        assertEquals(-0.005, fail.get(0).measured(), 1e-12);
        assertEquals("rising edge rings back to 1.995 V after its first peak: margin above VIH (2.00 V) is -0.005 V;"
                + " limit 0.000 V (defaulted)", fail.get(0).message());
        assertEquals(List.of(), check(RISE, ns(0, 1, 2, 3, 4, 20), new double[] {0, 0, 3.5, 2.005, 3.3, 3.3}, DEFAULTS));
    }

    @Test
    void fallingRingbackIsJudgedAgainstVil() {
        // hand-chosen: trough -0.2 V then a ring back to 0.805 V / 0.795 V against VIL 0.8 V
        List<Violation> fail = check(FALL, ns(0, 1, 2, 3, 4, 20), new double[] {3.3, 3.3, -0.2, 0.805, 0, 0}, DEFAULTS);
        assertEquals(List.of("ringback_margin_min"), keys(fail));
        assertEquals(-0.005, fail.get(0).measured(), 1e-12);
        assertEquals(List.of(), check(FALL, ns(0, 1, 2, 3, 4, 20), new double[] {3.3, 3.3, -0.2, 0.795, 0, 0}, DEFAULTS));
    }

    @Test
    void anEdgeThatNeverReachesItsThresholdIsItsOwnViolation() {
        // hand-chosen: a ramp to 1.99 V never reaches VIH 2.0 V
        List<Violation> low = check(RISE, ns(0, 1, 2, 20), new double[] {0, 0, 1.99, 1.99}, DEFAULTS);
        assertEquals(List.of("threshold_not_reached"), keys(low));
        assertEquals(1.99, low.get(0).measured(), 0);
        assertEquals(2.0, low.get(0).limitValue(), 0);
        assertEquals("rising edge never reaches VIH (2.00 V) at the receiver: highest level 1.99 V", low.get(0).message());
        // hand-chosen: 2.005 V passes VIH but not by the 10 mV hysteresis: still not a crossing
        List<Violation> touch = check(RISE, ns(0, 1, 2, 20), new double[] {0, 0, 2.005, 2.005}, DEFAULTS);
        assertEquals(List.of("threshold_not_reached"), keys(touch));
        assertTrue(touch.get(0).message().contains("hysteresis"), touch.get(0).message());
        // and 2.02 V does cross
        assertEquals(List.of(), check(RISE, ns(0, 1, 2, 20), new double[] {0, 0, 2.02, 2.02}, DEFAULTS));
    }

    @Test
    void aRisingEdgeThatStartsAboveVihCannotClockTheReceiver() {
        // hand-made: the previous fall never got below 2.5 V, so this rise starts above VIH 2.0 V
        List<Violation> v = check(RISE, ns(0, 1, 2, 20), new double[] {2.5, 2.5, 3.3, 3.3}, DEFAULTS);
        assertEquals(List.of("threshold_not_reached"), keys(v));
        assertEquals("rising edge starts at 2.50 V, already at or above VIH (2.00 V), so the receiver sees no rising"
                + " crossing", v.get(0).message());
    }

    @Test
    void aDoubleClockFailsOneCrossingAndPassesTwo() {
        EffectiveLimits lenient = limits(Map.of(LimitName.RINGBACK_MARGIN_MIN, Value.of(-1, Dimension.VOLTAGE)));
        // waveform-metrics.md §5 W2: VIH is crossed rising twice (2.606061 and 4.032258 ns)
        double[] t = ns(0, 1, 2, 2.5, 3, 3.5, 4, 4.5, 5, 6, 8, 10, 15, 20);
        double[] w2 = {0, 0, 0, 1.65, 3.3, 3.9, 1.9, 3.45, 3.25, 3.3, 3.3, 3.3, 3.3, 3.3};
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 2.5 * NS, 20 * NS);
        Levels l = new Levels(0, 3.3, 0.8, 2.0, 0.066, 0.001);
        List<Violation> fail = LimitChecker.check(EdgeMeasurer.measure(t, w2, w, l), lenient);
        // W2 also overshoots 0.6 V (§5 W1/W2 max 3.9 V) against the 0.3 V default
        assertEquals(List.of("overshoot_max", "crossings_max"), keys(fail));
        assertEquals(2, fail.get(1).measured(), 0);
        assertEquals("rising edge crosses VIH (2.00 V) 2 times (a double clock edge); limit 1 (defaulted)",
                fail.get(1).message());
        EffectiveLimits two = limits(Map.of(LimitName.RINGBACK_MARGIN_MIN, Value.of(-1, Dimension.VOLTAGE),
                LimitName.CROSSINGS_MAX, Value.of(2, Dimension.DIMENSIONLESS),
                LimitName.OVERSHOOT_MAX, Value.of(1, Dimension.VOLTAGE)));
        assertEquals(List.of(), LimitChecker.check(EdgeMeasurer.measure(t, w2, w, l), two));
    }

    @Test
    void aReversalDeeperThanTheHysteresisFailsAndAShallowerOnePasses() {
        // waveform-metrics.md §5 W3: a 0.3 V reversal inside 0.8..2.0 V; hand-chosen hysteresis 0.29 / 0.31 V
        double[] t = ns(0, 2, 2.4, 2.5, 2.7, 3, 10);
        double[] v = {0, 0, 1.5, 1.2, 2.5, 3.3, 3.3};
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 2.2 * NS, 10 * NS);
        EdgeMetrics tight = EdgeMeasurer.measure(t, v, w, new Levels(0, 3.3, 0.8, 2.0, 0.165, 0.29));
        List<Violation> fail = LimitChecker.check(tight, DEFAULTS);
        assertEquals(List.of("monotonic"), keys(fail));
        assertEquals(0.3, fail.get(0).measured(), 1e-12);
        assertEquals(0.29, fail.get(0).limitValue(), 0);
        EdgeMetrics loose = EdgeMeasurer.measure(t, v, w, new Levels(0, 3.3, 0.8, 2.0, 0.165, 0.31));
        assertEquals(List.of(), LimitChecker.check(loose, DEFAULTS));
        // monotonic: false switches the check off
        assertEquals(List.of(), LimitChecker.check(tight, limits(Map.of(LimitName.MONOTONIC, new Value.Flag(false)))));
    }

    @Test
    void settleTimeIsCheckedOnlyWhenSetAndAcrossItsValue() {
        // waveform-metrics.md §5 W1: settling duration 2.21 ns from t50 (band 0.066 V); hand-chosen limits 2.20 / 2.22 ns
        double[] t = ns(0, 1, 2, 2.5, 3, 3.5, 4, 4.5, 5, 6, 8, 10, 15, 20);
        double[] w1 = {0, 0, 0, 1.65, 3.3, 3.9, 2.9, 3.45, 3.25, 3.3, 3.3, 3.3, 3.3, 3.3};
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 2.5 * NS, 20 * NS);
        EdgeMetrics m = EdgeMeasurer.measure(t, w1, w, new Levels(0, 3.3, 0.8, 2.0, 0.066, 0.001));
        Map<LimitName, Value> base = Map.of(LimitName.OVERSHOOT_MAX, Value.of(1, Dimension.VOLTAGE));
        assertEquals(List.of(), LimitChecker.check(m, limits(base)));
        List<Violation> fail = LimitChecker.check(m, limits(with(base, LimitName.SETTLE_MAX, Value.of(2.2e-9, Dimension.TIME))));
        assertEquals(List.of("settle_max"), keys(fail));
        assertEquals(2.21e-9, fail.get(0).measured(), 1e-15);
        assertEquals("rising edge takes 2.21 ns from the source's 50 % point to settle within ±0.066 V of 3.30 V;"
                + " limit 2.20 ns", fail.get(0).message());
        assertEquals(List.of(), LimitChecker.check(m, limits(with(base, LimitName.SETTLE_MAX, Value.of(2.22e-9, Dimension.TIME)))));
    }

    @Test
    void delayIsCheckedOnlyWhenSetAndAcrossItsValue() {
        // analytic ramp 0 -> 3.3 V over 1..2 ns: VIH at 1 + 2.0/3.3 ns = 1.606 ns, 0.106 ns after the 1.5 ns
        // source 50 % point; hand-chosen limits 0.10 / 0.11 ns
        double[] t = ns(0, 1, 2, 20);
        double[] v = {0, 0, 3.3, 3.3};
        assertEquals(List.of(), check(RISE, t, v, DEFAULTS));
        List<Violation> fail = check(RISE, t, v, limits(Map.of(LimitName.DELAY_MAX, Value.of(0.1e-9, Dimension.TIME))));
        assertEquals(List.of("delay_max"), keys(fail));
        assertEquals((2.0 / 3.3 - 0.5) * NS, fail.get(0).measured(), 1e-21);
        assertEquals("rising edge reaches VIH (2.00 V) 106.06 ps after the source's 50 % point; limit 100.00 ps",
                fail.get(0).message());
        assertEquals(List.of(), check(RISE, t, v, limits(Map.of(LimitName.DELAY_MAX, Value.of(0.11e-9, Dimension.TIME)))));
    }

    @Test
    void riseTimeIsCheckedOnlyWhenSetAndAcrossItsValue() {
        // analytic ramp 0 -> 3.3 V over 1..2 ns: VIL 0.8 V at 1 + 0.8/3.3 ns, VIH 2.0 V at 1 + 2.0/3.3 ns,
        // so the VIL-to-VIH rise time is 1.2/3.3 ns = 363.64 ps; hand-chosen limits 360 / 370 ps
        double[] t = ns(0, 1, 2, 20);
        double[] v = {0, 0, 3.3, 3.3};
        assertEquals(List.of(), check(RISE, t, v, DEFAULTS));
        List<Violation> fail = check(RISE, t, v, limits(Map.of(LimitName.RISE_MAX, Value.of(0.36e-9, Dimension.TIME))));
        assertEquals(List.of("rise_max"), keys(fail));
        assertEquals(1.2 / 3.3 * NS, fail.get(0).measured(), 1e-21);
        assertEquals("rising edge takes 363.64 ps to rise from VIL to VIH (2.00 V) at the receiver; limit 360.00 ps",
                fail.get(0).message());
        assertEquals(List.of(), check(RISE, t, v, limits(Map.of(LimitName.RISE_MAX, Value.of(0.37e-9, Dimension.TIME)))));
        // a falling edge is not judged by rise_max
        assertEquals(List.of(), check(FALL, t, new double[] {3.3, 3.3, 0, 0},
                limits(Map.of(LimitName.RISE_MAX, Value.of(0.01e-9, Dimension.TIME)))));
    }

    @Test
    void anRcChargeAcrossI2cThresholdsFailsRiseMaxJustBelowPoint8473RcAndPassesJustAbove() {
        // lines-and-terminations.md §7: 30 %→70 % of an RC charge takes ln(7/3)·RC = 0.8473·RC;
        // 4.7 kΩ × 100 pF → 398.2 ns. Sampled every 0.1 ns, so linear interpolation is exact to ~1e-5.
        double rc = 4700 * 100e-12;
        int n = 30001;
        double[] t = new double[n];
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i * 0.1 * NS;
            v[i] = t[i] < 1 * NS ? 0 : 3.3 * (1 - Math.exp(-(t[i] - 1 * NS) / rc));
        }
        EdgeWindow w = new EdgeWindow(Edge.RISE, 0, 1 * NS, t[n - 1]);
        Levels i2c = new Levels(0, 3.3, 0.3 * 3.3, 0.7 * 3.3, DEFAULTS.settleBandV(), 0.01);
        EffectiveLimits tight = limits(Map.of(LimitName.RISE_MAX, Value.of(397e-9, Dimension.TIME)));
        EffectiveLimits loose = limits(Map.of(LimitName.RISE_MAX, Value.of(399.5e-9, Dimension.TIME)));
        EdgeMetrics m = EdgeMeasurer.measure(t, v, w, i2c);
        assertEquals(398.2e-9, m.thresholdTransitionS(), 0.05e-9);
        assertEquals(List.of("rise_max"), keys(LimitChecker.check(m, tight)));
        assertEquals(List.of(), LimitChecker.check(m, loose));
    }

    @Test
    void anEdgeStillRingingAtTheEndOfItsWindowAlwaysFailsAsNotSettled() {
        // W1 cut at 4.2 ns (waveform-metrics.md §5 points): 0.78 V from its final 3.12 V in the last 20 %
        double[] t = ns(0, 1, 2, 2.5, 3, 3.5, 4, 4.5, 5, 6, 8, 10, 15, 20);
        double[] w1 = {0, 0, 0, 1.65, 3.3, 3.9, 2.9, 3.45, 3.25, 3.3, 3.3, 3.3, 3.3, 3.3};
        EffectiveLimits loose = limits(Map.of(LimitName.OVERSHOOT_MAX, Value.of(1, Dimension.VOLTAGE),
                LimitName.SETTLE_BAND, Value.of(0.066, Dimension.VOLTAGE)));
        Levels l = new Levels(0, 3.3, 0.8, 2.0, loose.settleBandV(), 0.001);
        EdgeMetrics cut = EdgeMeasurer.measure(t, w1, new EdgeWindow(Edge.RISE, 0, 2.5 * NS, 4.2 * NS), l);
        List<Violation> fail = LimitChecker.check(cut, loose);
        assertEquals(List.of("settled"), keys(fail));
        assertEquals(0.78, fail.get(0).measured(), 1e-9);
        assertEquals(0.066, fail.get(0).limitValue(), 0);
        assertTrue(fail.get(0).message().startsWith("rising edge does not settle before the next edge"), fail.get(0).message());
        // the whole 20 ns window: settled, no violation
        EdgeMetrics whole = EdgeMeasurer.measure(t, w1, new EdgeWindow(Edge.RISE, 0, 2.5 * NS, 20 * NS), l);
        assertEquals(List.of(), LimitChecker.check(whole, loose));
    }

    @Test
    void aNotSettledEdgeIsNotAlsoJudgedOnItsSettleTime() {
        // a ramp still moving at its window end (analytic: 0.33 V/ns over 0..10 ns, window to 8 ns)
        EffectiveLimits withSettle = limits(Map.of(LimitName.SETTLE_MAX, Value.of(1e-9, Dimension.TIME)));
        EdgeMetrics m = EdgeMeasurer.measure(ns(0, 10), new double[] {0, 3.3},
                new EdgeWindow(Edge.RISE, 0, 1 * NS, 8 * NS), LEVELS);
        assertEquals(List.of("settled"), keys(LimitChecker.check(m, withSettle)));
    }

    private static List<Violation> check(EdgeWindow w, double[] t, double[] v, EffectiveLimits l) {
        return LimitChecker.check(EdgeMeasurer.measure(t, v, w, LEVELS), l);
    }

    private static EffectiveLimits limits(Map<LimitName, Value> set) {
        return LimitDefaults.resolve(Limits.of(set), 3.3);
    }

    private static Map<LimitName, Value> with(Map<LimitName, Value> base, LimitName name, Value value) {
        java.util.EnumMap<LimitName, Value> m = new java.util.EnumMap<>(LimitName.class);
        m.putAll(base);
        m.put(name, value);
        return m;
    }

    private static List<String> keys(List<Violation> vs) {
        return vs.stream().map(Violation::limit).toList();
    }

    private static double[] ns(double... x) {
        double[] out = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            out[i] = x[i] * NS;
        }
        return out;
    }
}
