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
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.Transient;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.runner.testing.Ngspice;

/**
 * The table-driven current source ({@link Primitive.TableCurrent}) of the built-in engine: a
 * saturating pull-down-like table (kinks at every point, a negative branch) loading a source
 * through a resistor. Without capacitance every time point is a DC solution, so each is checked
 * against the intersection of the table with the load line, found by bisection on an
 * independently written interpolation of the table (the element's documented semantics: linear
 * between points, held beyond the ends, scale linear in time and held outside its points).
 */
class TableCurrentTests {
    private static final double[] X = {-1, 0, 0.4, 0.8, 1.5, 2.5, 3};
    private static final double[] Y = {-0.02, 0, 0.03, 0.045, 0.05, 0.051, 0.0515};
    private static final double[] SCALE_T = {1e-9, 2e-9, 4e-9, 5e-9};
    private static final double[] SCALE = {0.5, 1, 1, 0.2};

    @TempDir
    Path dir;

    /** The table's load: source {@code volts} through {@code ohms} into node out; the table pulls out to ground. */
    private static Circuit loaded(double volts, double ohms) {
        return Circuits.of(List.of(
                new Primitive.DcVoltage("vs", "src", "0", volts),
                new Primitive.Resistor("rl", "src", "out", ohms),
                new Primitive.TableCurrent("gt", "out", "0", "out", "0", X, Y, SCALE_T, SCALE)),
                new Transient(20e-12, 6e-9, 20e-12), "out");
    }

    @ParameterizedTest(name = "{0} V through {1} ohm")
    @CsvSource({"3.3, 50", "3.3, 20", "5, 10", "-1.5, 30", "0.5, 100", "-3, 5"})
    void everyTimePointIsTheIntersectionOfTableAndLoadLine(double volts, double ohms) {
        Waveforms w = Circuits.solve(loaded(volts, ohms));
        // The t = 0 point is the DC operating point (scale held at 0.5 before its first time), then
        // the ramp to 1, the plateau, the ramp down and the held end value 0.2.
        for (double t : new double[] {0, 0.5e-9, 1.5e-9, 3e-9, 4.5e-9, 5.8e-9}) {
            double expected = intersection(volts, ohms, scaleAt(t));
            // Bisection to 1e-12 V; the engine's Newton tolerance is reltol 1e-3 of the value plus vntol 1 µV.
            assertEquals(expected, Circuits.at(w, "out", t), 1e-3 * Math.abs(expected) + 1e-5, "v(out) at t = " + t);
        }
    }

    @Test
    void aLoadLineBeyondTheTableEndsMeetsTheHeldEndValues() {
        // Beyond x = 3 the table holds 0.0515 A: out = V − R·s·0.0515 (Ohm's law) when that is above 3 V.
        Waveforms w = Circuits.solve(loaded(8, 20));
        assertEquals(8 - 20 * 0.5 * 0.0515, Circuits.at(w, "out", 0), 1e-5);
        assertEquals(8 - 20 * 1 * 0.0515, Circuits.at(w, "out", 3e-9), 1e-5);
        // Below x = −1 it holds −0.02 A: out = V + R·s·0.02.
        Waveforms low = Circuits.solve(loaded(-8, 20));
        assertEquals(-8 + 20 * 0.2 * 0.02, Circuits.at(low, "out", 5.9e-9), 1e-5);
    }

    @Test
    void tableCurrentAgreesWithNgspiceOnALineIntoATable() {
        Path ngspice = Ngspice.require();
        // A ramp through 25 ohm and a 50 ohm, 0.8 ns line into the table and 2 pF: reflections move the
        // table's operating point across many of its segments and beyond both ends.
        Circuit c = Circuits.of(List.of(
                new Primitive.PwlVoltage("vs", "src", "0", new double[] {0.5e-9, 1e-9}, new double[] {-1.5, 5}),
                new Primitive.Resistor("rs", "src", "near", 25),
                new Primitive.LosslessLine("t1", "near", "0", "far", "0", 50, 0.8e-9),
                new Primitive.Capacitor("cl", "far", "0", 2e-12),
                new Primitive.TableCurrent("gt", "far", "0", "far", "0", X, Y, SCALE_T, SCALE)),
                new Transient(10e-12, 8e-9, 10e-12), "near", "far");
        Waveforms mine = Circuits.solve(c);
        Waveforms ref = Circuits.ngspice(ngspice, c, dir);
        for (String node : List.of("near", "far")) {
            double worst = Circuits.worstDifference(ref, mine, node);
            // ngspice as reference simulator; 1 % of the 6.5 V swing.
            assertTrue(worst <= 0.065, node + ": largest difference from ngspice " + worst + " V");
        }
    }

    /** The scale at time t: linear between its points, held outside (the element's contract). */
    private static double scaleAt(double t) {
        return interpolate(SCALE_T, SCALE, t);
    }

    /** Bisection on f(v) = (V − v)/R − s·y(v), which decreases strictly in v (y never decreases). */
    private static double intersection(double volts, double ohms, double s) {
        double lo = -100;
        double hi = 100;
        for (int i = 0; i < 200; i++) {
            double mid = 0.5 * (lo + hi);
            double f = (volts - mid) / ohms - s * interpolate(X, Y, mid);
            if (f > 0) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return 0.5 * (lo + hi);
    }

    private static double interpolate(double[] xs, double[] ys, double at) {
        if (at <= xs[0]) {
            return ys[0];
        }
        if (at >= xs[xs.length - 1]) {
            return ys[ys.length - 1];
        }
        int i = 1;
        while (xs[i] < at) {
            i++;
        }
        return ys[i - 1] + (ys[i] - ys[i - 1]) * (at - xs[i - 1]) / (xs[i] - xs[i - 1]);
    }
}
