package org.ringsweep.runner.engine.builtin;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.circuit.DiodeModel;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.Transient;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.runner.testing.Ngspice;

/**
 * Diodes with junction capacitance (CJO &gt; 0) in the built-in engine: the depletion capacitance
 * of the SPICE diode model, {@code Cj = CJO/(1 − V/VJ)^M} with the defaults VJ = 1 V, M = 0.5,
 * FC = 0.5 (ngspice manual, diode model parameters), checked through the time constant of an RC,
 * through charge conservation, and against ngspice on a clamped line.
 */
class JunctionCapacitanceTests {
    @TempDir
    Path dir;

    @ParameterizedTest(name = "reverse bias {0} V, CJO {1} F")
    @CsvSource({"3, 10e-12", "0.5, 4e-12", "8, 20e-12"})
    void aReverseBiasedJunctionChargesWithTheTimeConstantOfRTimesCj(double bias, double cjo) {
        double r = 1000;
        double dv = 0.01;
        // Cathode at +bias through R, anode on ground: the junction voltage is −bias.
        Circuit c = Circuits.of(List.of(
                new Primitive.PwlVoltage("vs", "in", "0", new double[] {1e-9, 1.001e-9}, new double[] {bias, bias + dv}),
                new Primitive.Resistor("r1", "in", "k", r),
                new Primitive.Diode("d1", "0", "k", new DiodeModel("dc", 1e-14, 1, 0, cjo))),
                new Transient(5e-12, 1e-9 + 6 * r * cjo, 5e-12), "k");
        Waveforms w = Circuits.solve(c);
        // SPICE depletion capacitance at V = −bias (ngspice manual, diode model), small signal: dv moves it by < 0.2 %.
        double cj = cjo / Math.sqrt(1 + (bias + dv / 2) / 1.0);
        double tau = r * cj;
        double start = Circuits.at(w, "k", 1e-9);
        double reached = Circuits.crossing(w, "k", start + dv * (1 - Math.exp(-1)), true) - 1.0005e-9;
        // RC charging: 63.2 % of the step after one time constant (first-order step response).
        assertEquals(tau, reached, 0.01 * tau, "time constant");
    }

    @Test
    void theChargeDeliveredThroughTheResistorIsTheChangeOfTheDepletionCharge() {
        // A large step (3 V → 0.2 V reverse bias): the capacitance changes by 2× on the way. The current
        // through R integrated over time equals Q(−0.2) − Q(−3), Q(V) = VJ·CJO·(1 − (1 − V/VJ)^(1−M))/(1 − M)
        // (the SPICE depletion charge, the integral of Cj).
        double cjo = 10e-12;
        double r = 500;
        Circuit c = Circuits.of(List.of(
                new Primitive.PwlVoltage("vs", "in", "0", new double[] {1e-9, 1.2e-9}, new double[] {3, 0.2}),
                new Primitive.Resistor("r1", "in", "k", r),
                new Primitive.Diode("d1", "0", "k", new DiodeModel("dc", 1e-14, 1, 0, cjo))),
                new Transient(5e-12, 60e-9, 5e-12), "in", "k");
        Waveforms w = Circuits.solve(c);
        double delivered = 0;
        for (int i = 1; i < w.size(); i++) {
            double i0 = (w.value("in", i - 1) - w.value("k", i - 1)) / r;
            double i1 = (w.value("in", i) - w.value("k", i)) / r;
            delivered += 0.5 * (i0 + i1) * (w.time(i) - w.time(i - 1));
        }
        // The junction voltage Vd = v(anode) − v(cathode) goes from −3 V to −0.2 V; the current into the
        // cathode is −dQ(Vd)/dt, so the charge through R is −(Q(−0.2) − Q(−3)).
        double expected = -(charge(cjo, -0.2) - charge(cjo, -3));
        assertEquals(expected, delivered, 0.005 * Math.abs(expected), "charge through R (C)");
    }

    @Test
    void aClampWithJunctionCapacitanceAgreesWithNgspice() {
        Path ngspice = Ngspice.require();
        DiodeModel clamp = new DiodeModel("dcl", 1e-14, 1, 5, 3e-12);
        // 0 → 3.3 V into a 50 ohm, 1 ns line, unterminated: the far end overshoots into both clamps.
        Circuit c = Circuits.of(List.of(
                new Primitive.DcVoltage("vdd", "vdd", "0", 3.3),
                new Primitive.PwlVoltage("vs", "src", "0", new double[] {1e-9, 1.4e-9, 8e-9, 8.4e-9}, new double[] {0, 3.3, 3.3, 0}),
                new Primitive.Resistor("rs", "src", "near", 12),
                new Primitive.LosslessLine("t1", "near", "0", "far", "0", 50, 1e-9),
                new Primitive.Capacitor("cin", "far", "0", 1e-12),
                new Primitive.Diode("dgnd", "0", "far", clamp),
                new Primitive.Diode("dvdd", "far", "vdd", clamp)),
                new Transient(10e-12, 16e-9, 10e-12), "near", "far");
        Waveforms mine = Circuits.solve(c);
        Waveforms ref = Circuits.ngspice(ngspice, c, dir);
        double swing = 3.3;
        // ngspice as reference simulator: extremes within 1 % of the swing, 50 % crossings within 10 ps + 1 % of the delay.
        assertEquals(Circuits.max(ref, "far"), Circuits.max(mine, "far"), 0.01 * swing, "v_max");
        assertEquals(-Circuits.max(negated(ref), "far"), -Circuits.max(negated(mine), "far"), 0.01 * swing, "v_min");
        double rise = Circuits.crossing(ref, "far", swing / 2, true);
        double fall = Circuits.crossing(ref, "far", swing / 2, false);
        assertEquals(rise, Circuits.crossing(mine, "far", swing / 2, true), 10e-12 + 0.01 * (rise - 1.2e-9), "rising 50 %");
        assertEquals(fall, Circuits.crossing(mine, "far", swing / 2, false), 10e-12 + 0.01 * (fall - 8.2e-9), "falling 50 %");
        assertTrue(Circuits.worstDifference(ref, mine, "far") <= 0.05 * swing, "whole wave within 5 % of the swing");
    }

    private static Waveforms negated(Waveforms w) {
        double[] v = new double[w.size()];
        double[] t = new double[w.size()];
        for (int i = 0; i < w.size(); i++) {
            t[i] = w.time(i);
            v[i] = -w.value("far", i);
        }
        return Waveforms.of(t, java.util.Map.of("far", v), false);
    }

    private static double charge(double cjo, double v) {
        return 1.0 * cjo * (1 - Math.pow(1 - v / 1.0, 0.5)) / 0.5;
    }
}
