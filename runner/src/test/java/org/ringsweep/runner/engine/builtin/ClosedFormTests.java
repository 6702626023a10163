package org.ringsweep.runner.engine.builtin;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.Duration;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.ringsweep.api.circuit.DiodeModel;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.Transient;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.runner.engine.FailureKind;
import org.ringsweep.runner.engine.SimulationOutcome;

/** The built-in engine against closed-form circuit results, each source named beside its check. */
class ClosedFormTests {
    private static final double Z0 = 50;

    @Test
    void parallelTerminationToVttSettlesAtTheDividerValue() {
        double vs = 3.3;
        double rs = 20;
        double rt = 50;
        double vtt = 1.65;
        Waveforms w = Circuits.solve(Circuits.of(List.of(
                Circuits.step("vs", "src", 1e-9, 0.5e-9, vs),
                new Primitive.Resistor("rs", "src", "near", rs),
                new Primitive.LosslessLine("t1", "near", "0", "far", "0", Z0, 1e-9),
                new Primitive.Resistor("rt", "far", "vtt", rt),
                new Primitive.DcVoltage("vt", "vtt", "0", vtt)),
                new Transient(10e-12, 60e-9, 10e-12), "far", "near"));
        // Superposition of the two sources over the divider Rs–RT (the line is a wire at DC;
        // lines-and-terminations.md §2 "final value = DC divider"): before the edge the source is 0 V.
        assertEquals(vtt * rs / (rs + rt), w.value("far", 0), 1e-6);
        assertEquals(vtt * rs / (rs + rt), w.value("near", 0), 1e-6);
        double fin = (vs / rs + vtt / rt) / (1 / rs + 1 / rt);
        assertEquals(fin, w.value("far", w.size() - 1), 0.001 * vs);
        assertEquals(fin, w.value("near", w.size() - 1), 0.001 * vs);
    }

    @Test
    void theveninTerminationSettlesAtTheDividerValue() {
        double vdd = 3.3;
        double rs = 33;
        Waveforms w = Circuits.solve(Circuits.of(List.of(
                Circuits.step("vs", "src", 1e-9, 0.5e-9, vdd),
                new Primitive.Resistor("rs", "src", "near", rs),
                new Primitive.LosslessLine("t1", "near", "0", "far", "0", Z0, 0.7e-9),
                new Primitive.Resistor("r1", "far", "vdd", 100),
                new Primitive.Resistor("r2", "far", "0", 100),
                new Primitive.DcVoltage("vd", "vdd", "0", vdd)),
                new Transient(10e-12, 60e-9, 10e-12), "far"));
        // Nodal equation of the far node at DC (Millman's theorem): (Vs/Rs + VDD/R1)/(1/Rs + 1/R1 + 1/R2).
        double fin = (vdd / rs + vdd / 100) / (1 / rs + 1 / 100.0 + 1 / 100.0);
        assertEquals(fin, w.value("far", w.size() - 1), 0.001 * vdd);
        assertEquals((vdd / 100) / (1 / rs + 1 / 100.0 + 1 / 100.0), w.value("far", 0), 1e-6);
    }

    @Test
    void rcStepFollowsTheExponential() {
        double r = 1000;
        double c = 1e-12;
        double tau = r * c;
        double t0 = 1e-9;
        Waveforms w = Circuits.solve(Circuits.of(List.of(
                Circuits.step("vs", "src", t0, 1e-15, 1),
                new Primitive.Resistor("r", "src", "out", r),
                new Primitive.Capacitor("c", "out", "0", c)),
                new Transient(10e-12, 8e-9, 10e-12), "out"));
        // Textbook first-order step response v(t) = 1 − e^(−t/RC).
        for (double k : new double[] {0.25, 0.5, 1, 2, 4, 6}) {
            assertEquals(1 - Math.exp(-k), Circuits.at(w, "out", t0 + k * tau), 1e-3, "at " + k + " RC");
        }
        assertEquals(0, Circuits.at(w, "out", t0 * 0.9), 1e-12);
    }

    @Test
    void seriesRlcStepOvershootsBy60Percent() {
        Waveforms w = Circuits.solve(Circuits.of(List.of(
                Circuits.step("vs", "src", 0.5e-9, 1e-12, 1),
                new Primitive.Resistor("r", "src", "mid", 10),
                new Primitive.Inductor("l", "mid", "out", 10e-9),
                new Primitive.Capacitor("c", "out", "0", 10e-12)),
                new Transient(1e-12, 10e-9, 1e-12), "out"));
        // lines-and-terminations.md §2 lumped check: ζ = 0.158, overshoot exp(−πζ/√(1−ζ²)) = 60.47 %,
        // ngspice peak 1.6047 V; 0.5 % of the 1 V swing.
        assertEquals(1.6047, Circuits.max(w, "out"), 0.005);
    }

    @Test
    void timedResistorFollowsItsRampInADivider() {
        Primitive.TimedResistor rt = new Primitive.TimedResistor("rt", "src", "out",
                new double[] {1e-9, 2e-9}, new double[] {100, 50});
        Waveforms w = Circuits.solve(Circuits.of(List.of(
                new Primitive.DcVoltage("vs", "src", "0", 1),
                rt,
                new Primitive.Resistor("rl", "out", "0", 50)),
                new Transient(10e-12, 3e-9, 10e-12), "out"));
        // Divider formula RL/(R(t) + RL) with R linear between its breakpoints: 100 Ω, 75 Ω, 50 Ω.
        assertEquals(50.0 / 150, Circuits.at(w, "out", 0.5e-9), 1e-9);
        assertEquals(50.0 / 125, Circuits.at(w, "out", 1.5e-9), 1e-9);
        assertEquals(50.0 / 100, Circuits.at(w, "out", 2.5e-9), 1e-9);
    }

    @Test
    void forwardBiasedDiodeCarriesTheShockleyCurrent() {
        DiodeModel m = new DiodeModel("dm", 1e-14, 1, 5, 0);
        double vs = 2;
        double r = 100;
        Waveforms w = Circuits.solve(Circuits.of(List.of(
                new Primitive.DcVoltage("vs", "src", "0", vs),
                new Primitive.Resistor("r", "src", "a", r),
                new Primitive.Diode("d", "a", "0", m)),
                new Transient(10e-12, 1e-9, 10e-12), "a"));
        // Shockley diode equation I = IS·(e^(Vj/(N·Vt)) − 1), Vt = kT/q at 300.15 K (SPICE nominal 27 °C),
        // in series with RS: solve (vs − Va)/R = I(Va − I·RS) by bisection on the current.
        double vt = 1.380649e-23 * 300.15 / 1.602176634e-19;
        double lo = 0;
        double hi = vs / r;
        for (int i = 0; i < 200; i++) {
            double i0 = (lo + hi) / 2;
            double vj = vt * Math.log(i0 / 1e-14 + 1);
            double va = vj + i0 * 5;
            if ((vs - va) / r > i0) {
                lo = i0;
            } else {
                hi = i0;
            }
        }
        double expected = vs - lo * r;
        assertEquals(expected, w.value("a", 0), 1e-4);
        assertEquals(expected, w.value("a", w.size() - 1), 1e-4);
    }

    @Test
    void inductorIsAShortAtTheOperatingPoint() {
        Waveforms w = Circuits.solve(Circuits.of(List.of(
                new Primitive.DcVoltage("vs", "src", "0", 1),
                new Primitive.Resistor("r1", "src", "a", 10),
                new Primitive.Inductor("l", "a", "b", 1e-9),
                new Primitive.Resistor("r2", "b", "0", 30)),
                new Transient(10e-12, 1e-9, 10e-12), "a", "b"));
        // Ohm's law on the divider 10 Ω + 30 Ω with the inductor a short at DC.
        assertEquals(0.75, w.value("a", 0), 1e-9);
        assertEquals(0.75, w.value("b", w.size() - 1), 1e-9);
    }

    @Test
    void subcircuitTextIsRefusedNamingTheElement() {
        SimulationOutcome o = new BuiltinEngine().solve(Circuits.of(List.of(
                new Primitive.DcVoltage("vs", "src", "0", 1),
                new Primitive.SubcircuitText("xibis", List.of("src", "0"), "R1 src 0 50")),
                new Transient(10e-12, 1e-9, 10e-12), "src"), Duration.ofSeconds(5));
        SimulationOutcome.Failure f = assertInstanceOf(SimulationOutcome.Failure.class, o);
        assertEquals(FailureKind.UNSUPPORTED, f.kind());
        assertTrue(f.message().contains("`xibis`"), f.message());
    }

    @Test
    void aLoopOfVoltageSourcesIsReportedAsSingular() {
        SimulationOutcome o = new BuiltinEngine().solve(Circuits.of(List.of(
                new Primitive.DcVoltage("v1", "a", "0", 1),
                new Primitive.DcVoltage("v2", "a", "0", 2)),
                new Transient(10e-12, 1e-9, 10e-12), "a"), Duration.ofSeconds(5));
        SimulationOutcome.Failure f = assertInstanceOf(SimulationOutcome.Failure.class, o);
        assertEquals(FailureKind.SINGULAR_MATRIX, f.kind());
    }

    @Test
    void nodesHeldByDcSourcesKeepTheirVoltageAndStackedSourcesAdd() {
        // The engine solves a node held by a DC source to ground as known, not as an unknown
        // (Netlist.eliminateFixedNodes); the results must be those of the circuit as drawn.
        Waveforms w = Circuits.solve(Circuits.of(List.of(
                new Primitive.DcVoltage("vcc", "vcc", "0", 3.3),
                new Primitive.DcVoltage("vup", "top", "vcc", 1.2),
                new Primitive.Resistor("rt", "top", "0", 1000),
                new Primitive.Resistor("r1", "vcc", "mid", 1000),
                new Primitive.Resistor("r2", "mid", "0", 2000),
                Circuits.step("vs", "src", 1e-9, 0.5e-9, 1),
                new Primitive.Resistor("rs", "src", "mid", 1000)),
                new Transient(10e-12, 5e-9, 10e-12), "vcc", "top", "mid"));
        for (int i = 0; i < w.size(); i++) {
            assertEquals(3.3, w.value("vcc", i), 1e-12, "the rail itself");
            assertEquals(4.5, w.value("top", i), 1e-9, "Kirchhoff's voltage law: 3.3 V + 1.2 V");
        }
        // Millman's theorem (textbook nodal analysis), with the source at 0 V before its step and 1 V after it.
        assertEquals((3.3 / 1000) / (1 / 1000.0 + 1 / 2000.0 + 1 / 1000.0), w.value("mid", 0), 1e-9);
        assertEquals((3.3 / 1000 + 1.0 / 1000) / (1 / 1000.0 + 1 / 2000.0 + 1 / 1000.0), w.value("mid", w.size() - 1), 1e-9);
    }

    @Test
    void aTableControlledByARailFollowsItsScaleExactly() {
        // A table current i = s(t)·(V(vcc) − V(out))/100 Ω from the rail into `out`, loaded by
        // 100 Ω: the divider gives V(out) = 3.3·s/(1 + s) at every time point. The scale moves at
        // every step, so the solver's low-rank table update runs with its controlling node fixed.
        Waveforms w = Circuits.solve(Circuits.of(List.of(
                new Primitive.DcVoltage("vcc", "vcc", "0", 3.3),
                new Primitive.TableCurrent("ipu", "vcc", "out", "vcc", "out", new double[] {-10, 10}, new double[] {-0.1, 0.1},
                        new double[] {1e-9, 2e-9}, new double[] {0, 1}),
                new Primitive.Resistor("rl", "out", "0", 100)),
                new Transient(10e-12, 3e-9, 10e-12), "out"));
        for (int i = 0; i < w.size(); i++) {
            double s = Math.max(0, Math.min(1, (w.time(i) - 1e-9) / 1e-9));
            assertEquals(3.3 * s / (1 + s), w.value("out", i), 1e-9, "at t = " + w.time(i));
        }
    }

    @Test
    void timeAxisIsStrictlyIncreasingAndEndsAtTheStopTime() {
        Waveforms w = Circuits.solve(Circuits.of(List.of(
                Circuits.step("vs", "src", 0.333e-9, 0.1e-9, 1),
                new Primitive.Resistor("r", "src", "out", 50),
                new Primitive.LosslessLine("t", "out", "0", "far", "0", 50, 0.37e-9)),
                new Transient(10e-12, 5e-9, 10e-12), "far"));
        for (int i = 1; i < w.size(); i++) {
            assertTrue(w.time(i) > w.time(i - 1), "time " + i);
        }
        assertEquals(5e-9, w.endTime(), 0);
    }

    @Test
    void aDeckJobIsRefusedAskingForTheCircuit() {
        var job = new org.ringsweep.runner.engine.SimulationJob("* deck", java.nio.file.Path.of("."), "a.cir", "a.raw",
                1e-9, Duration.ofSeconds(1), java.util.Map.of());
        SimulationOutcome.Failure f = assertInstanceOf(SimulationOutcome.Failure.class, new BuiltinEngine().run(job));
        assertEquals(FailureKind.UNSUPPORTED, f.kind());
    }

    @Test
    void aSolveOverItsTimeoutStopsAsTimeout() {
        SimulationOutcome o = new BuiltinEngine().solve(Circuits.of(List.of(
                Circuits.step("vs", "src", 1e-9, 1e-9, 1),
                new Primitive.Resistor("r", "src", "out", 50),
                new Primitive.Capacitor("c", "out", "0", 1e-12)),
                new Transient(1e-12, 1e-6, 1e-12), "out"), Duration.ofNanos(1));
        SimulationOutcome.Failure f = assertInstanceOf(SimulationOutcome.Failure.class, o);
        assertEquals(FailureKind.TIMEOUT, f.kind());
    }
}
