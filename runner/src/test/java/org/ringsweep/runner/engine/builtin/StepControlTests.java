package org.ringsweep.runner.engine.builtin;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.Transient;
import org.ringsweep.api.wave.Waveforms;

/**
 * The built-in engine's step control: an explicit maximum step is never exceeded, an automatic
 * one may grow where the waveform is flat, and the waveform stays right either way.
 */
class StepControlTests {
    private static final double TD = 1e-9;
    private static final double T0 = 1e-9;
    private static final double RAMP = 0.2e-9;
    private static final double STEP = 10e-12;

    /** lines-and-terminations.md §2, worked example 1: 3.3 V through 15 Ω into a 50 Ω, 1 ns line, open far end. */
    private static Circuit example1(boolean stepAuto) {
        return Circuits.of(List.of(
                Circuits.step("vs", "src", T0, RAMP, 3.3),
                new Primitive.Resistor("rs", "src", "near", 15),
                new Primitive.LosslessLine("t1", "near", "0", "far", "0", 50, TD),
                new Primitive.Resistor("rl", "far", "0", 1e9)),
                new Transient(STEP, 14e-9, STEP, stepAuto), "far");
    }

    private static double largestStep(Waveforms w) {
        double largest = 0;
        for (int i = 1; i < w.size(); i++) {
            largest = Math.max(largest, w.time(i) - w.time(i - 1));
        }
        return largest;
    }

    @Test
    void anExplicitStepIsNeverExceeded() {
        Waveforms w = Circuits.solve(example1(false));
        // Transient.maxStep is the largest internal step (SPICE's TMAX, ngspice.md); 1e-9 s of slack for rounding.
        assertTrue(largestStep(w) <= STEP * (1 + 1e-9), "largest step " + largestStep(w));
    }

    @Test
    void anAutomaticStepGrowsOnThePlateausAndKeepsTheBounceLevels() {
        Waveforms w = Circuits.solve(example1(true));
        double largest = largestStep(w);
        // It grows (common practice for error-controlled steps), but an edge keeps ten steps or more
        // (common practice): under a tenth of the source ramp while the source moves, and where a
        // step is longer than that, it moves the far end by at most a tenth of the 3.3 V swing.
        assertTrue(largest > 1.5 * STEP, "largest step " + largest);
        for (int i = 1; i < w.size(); i++) {
            double dt = w.time(i) - w.time(i - 1);
            if (w.time(i) > T0 && w.time(i - 1) < T0 + RAMP) {
                assertTrue(dt <= RAMP / 10 * (1 + 1e-9), "step " + dt + " during the source ramp at t = " + w.time(i));
            }
            if (dt > RAMP / 10 * (1 + 1e-9)) {
                double moved = Math.abs(w.value("far", i) - w.value("far", i - 1));
                assertTrue(moved <= 3.3 / 10 + 1e-9, "step " + dt + " at t = " + w.time(i) + " moves the far end " + moved + " V");
            }
        }
        // lines-and-terminations.md §2, worked example 1: far-end plateaus 5.07692, 2.34320, 3.81520, 3.02258 V
        // on ((2n+1)·TD, (2n+3)·TD) after the edge; read mid-plateau, within 0.2 % of the 3.3 V swing.
        double[] far = {5.07692, 2.34320, 3.81520, 3.02258};
        for (int n = 0; n < far.length; n++) {
            double t = T0 + RAMP / 2 + (2 * n + 2) * TD;
            assertEquals(far[n], Circuits.at(w, "far", t), 0.002 * 3.3, "far end on plateau " + n);
        }
    }

    @Test
    void anEdgeKeepsTenStepsAtTheSourceAndWhereItArrives() {
        // A straight ramp has no truncation error to speak of, so only the edge rule keeps the step
        // short on it: ten steps or more per edge (common practice), while the source ramps and where
        // the edge arrives through the line (the far end, one delay later, with every input constant).
        double ramp = 0.4e-9;
        Circuit c = Circuits.of(List.of(
                Circuits.step("vs", "src", T0, ramp, 3.3),
                new Primitive.Resistor("rs", "src", "near", 15),
                new Primitive.LosslessLine("t1", "near", "0", "far", "0", 50, TD),
                new Primitive.Resistor("rl", "far", "0", 1e9)),
                new Transient(STEP, 6e-9, STEP, true), "near", "far");
        Waveforms w = Circuits.solve(c);
        assertTrue(largestStep(w) > ramp / 10 * (1 + 1e-9), "the step grows beyond the edge's tenth somewhere: " + largestStep(w));
        for (int i = 1; i < w.size(); i++) {
            double dt = w.time(i) - w.time(i - 1);
            if (w.time(i) > T0 && w.time(i - 1) < T0 + ramp) {
                assertTrue(dt <= ramp / 10 * (1 + 1e-9), "step " + dt + " s during the source ramp at t = " + w.time(i));
            }
            if (dt > ramp / 10 * (1 + 1e-9)) {
                for (String node : new String[] {"near", "far"}) {
                    double moved = Math.abs(w.value(node, i) - w.value(node, i - 1));
                    assertTrue(moved <= 3.3 / 10 + 1e-9, "step " + dt + " s at t = " + w.time(i) + " moves " + node + " by " + moved + " V");
                }
            }
        }
    }

    @Test
    void theNextStepFollowsTheCubeRootRuleInQuarterOctaves() {
        // Error-controlled step selection h_new = h·0.9·(tol/err)^(1/(p+1)), p = 2 for the trapezoidal
        // rule (Hairer, Nørsett & Wanner, Solving ODEs I, §II.4; from memory), rounded down to
        // quarter octaves and capped at one octave up.
        for (double ratio : new double[] {1e-6, 0.01, 0.1, 0.2, 0.3, 0.43, 0.5, 0.729, 0.9, 1.0, 1.44, 3, 8, 100}) {
            double factor = 0.9 * Math.cbrt(1 / ratio);
            int expected = (int) Math.min(4, Math.floor(4 * Math.log(factor) / Math.log(2) + 1e-12));
            assertEquals(expected, TransientSolver.levelsFor(ratio), "ratio " + ratio);
        }
        assertEquals(4, TransientSolver.levelsFor(0), "no error estimate: one octave up");
    }

    @Test
    void atRestTheStepReachesPastTheLineDelayAndTheValueStays() {
        // Worked example 1 again, run long: the reflection coefficient at the source is
        // (15 − 50)/(15 + 50) = −0.54 per round trip (lines-and-terminations.md §2), so after some
        // 30 round trips the far end is within microvolts of 3.3 V and nothing changes any more.
        Circuit c = Circuits.of(List.of(
                Circuits.step("vs", "src", T0, RAMP, 3.3),
                new Primitive.Resistor("rs", "src", "near", 15),
                new Primitive.LosslessLine("t1", "near", "0", "far", "0", 50, TD),
                new Primitive.Resistor("rl", "far", "0", 1e9)),
                new Transient(STEP, 200e-9, STEP, true), "far");
        Waveforms w = Circuits.solve(c);
        // Ordinary steps stay under one line delay (the method of characteristics); at rest one step may go further.
        assertTrue(largestStep(w) > 2 * TD, "largest step " + largestStep(w));
        // DC: an open line passes the source voltage, less the 1 GΩ load's divider (15/(15 + 1e9) of it).
        double dc = 3.3 * 1e9 / (1e9 + 15);
        assertEquals(dc, w.value("far", w.size() - 1), 1e-4);
        for (int i = 0; i < w.size(); i++) {
            if (w.time(i) > 80e-9) {
                assertEquals(dc, w.value("far", i), 1e-3, "at rest at t = " + w.time(i));
            }
        }
    }
}
