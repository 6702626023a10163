package org.ringsweep.generators.deck;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.Transient;
import org.ringsweep.generators.NgspiceCheck;

/**
 * The table-driven current source in the deck. ngspice 39 is the reference: a table current into
 * a known resistor must give v = i·R with i the table's value (linear between points, held
 * outside, times the scale), checked at instants where the hand-computed value is exact.
 */
class TableCurrentDeckTests {
    private static final DeckWriter WRITER = new DeckWriter();
    private static final double R = 100;

    /** Control c ramps −5 V → +5 V over 0..20 ns (0.5 V/ns), then holds; scale 0.5 until 25 ns, 1 from 30 ns. */
    private static Circuit circuit() {
        return new Circuit("table", List.of(
                new Primitive.PwlVoltage("vc", "c", "0", new double[] {0, 20e-9}, new double[] {-5, 5}),
                // from ground through the element into `out`: v(out) = +i·R
                new Primitive.TableCurrent("t", "0", "out", "c", "0", new double[] {-1, 0, 1, 2},
                        new double[] {-0.02, 0, 0.01, 0.015}, new double[] {0, 25e-9, 30e-9}, new double[] {0.5, 0.5, 1}),
                new Primitive.Resistor("load", "out", "0", R)),
                new Transient(1e-11, 40e-9, 5e-11), Map.of("out", "out"), Map.of());
    }

    @Test
    void rendersAsAScaledPwlOfTheControlVoltageWithFlatGuards() {
        String deck = WRITER.render(circuit(), DeckOptions.of("t.raw"));
        assertTrue(deck.contains("\nBt 0 out I = pwl(time, -1e+00, 5e-01, 0, 5e-01, 2.5e-08, 5e-01, 3e-08, 1e+00, 1.00000004e+00, 1e+00)"
                + " * pwl(v(c,0), -1.001e+03, -2e-02, -1e+00, -2e-02, 0, 0, 1e+00, 1e-02, 2e+00, 1.5e-02, 1.002e+03, 1.5e-02)\n"), deck);
    }

    @Test
    void withoutScalePointsTheTimeFactorIsLeftOut() {
        Circuit c = new Circuit("table", List.of(new Primitive.DcVoltage("vc", "c", "0", 1),
                new Primitive.TableCurrent("t", "0", "out", "c", "0", new double[] {0, 1}, new double[] {0, 1e-3},
                        new double[0], new double[0]),
                new Primitive.Resistor("load", "out", "0", R)), new Transient(1e-11, 1e-9, 1e-10), Map.of("out", "out"), Map.of());
        assertTrue(WRITER.render(c, DeckOptions.of("t.raw")).contains("\nBt 0 out I = pwl(v(c,0), "));
    }

    @Test
    void ngspiceGivesTheTableCurrentTimesTheScaleHeldBeyondTheTable(@TempDir Path dir) throws Exception {
        String deck = WRITER.render(circuit(), new DeckOptions("t.raw", false, false));
        StringBuilder meas = new StringBuilder();
        // inside the straight pieces (the kinks at 8, 10, 12, 14, 20, 25 and 30 ns are avoided: `find at=`
        // interpolates between the solver's time points)
        double[] at = {4e-9, 9e-9, 10.5e-9, 11e-9, 13e-9, 13.5e-9, 18e-9, 27.5e-9, 35e-9};
        for (int i = 0; i < at.length; i++) {
            meas.append("meas tran m").append(i).append(" find v(out) at=").append(at[i]).append('\n');
        }
        String out = NgspiceCheck.assertRuns(deck.replace("quit 0", meas + "quit 0"), "t.raw", dir);
        // expected = scale(t) · y(vc(t)) · R with vc = −5 + 0.5 V/ns · t, by hand from the definition
        double[] expected = {
            0.5 * -0.02 * R,   // 4 ns: vc = −3 V, below the table: held at y(−1)
            0.5 * -0.01 * R,   // 9 ns: vc = −0.5 V, half-way between −20 mA and 0
            0.5 * 0.0025 * R,  // 10.5 ns: vc = 0.25 V
            0.5 * 0.005 * R,   // 11 ns: vc = 0.5 V, half-way between 0 and 10 mA
            0.5 * 0.0125 * R,  // 13 ns: vc = 1.5 V
            0.5 * 0.01375 * R, // 13.5 ns: vc = 1.75 V
            0.5 * 0.015 * R,   // 18 ns: vc = 4 V, above the table: held at y(2), not extrapolated
            0.75 * 0.015 * R,  // 27.5 ns: scale half-way from 0.5 to 1
            1.0 * 0.015 * R};  // 35 ns: scale 1
        for (int i = 0; i < at.length; i++) {
            assertEquals(expected[i], measured(out, "m" + i), 1e-6, "v(out) at " + at[i] + " s");
        }
    }

    @Test
    void invalidTablesAreRejected() {
        assertThrows(IllegalArgumentException.class, () -> new Primitive.TableCurrent("t", "a", "0", "a", "0",
                new double[] {0, 0}, new double[] {0, 1}, new double[0], new double[0]));
        assertThrows(IllegalArgumentException.class, () -> new Primitive.TableCurrent("t", "a", "0", "a", "0",
                new double[] {0}, new double[] {0}, new double[0], new double[0]));
        assertThrows(IllegalArgumentException.class, () -> new Primitive.TableCurrent("t", "a", "0", "a", "0",
                new double[] {0, 1}, new double[] {0, 1}, new double[] {1, 0.5}, new double[] {0, 1}));
    }

    static double measured(String stdout, String name) {
        for (String line : stdout.split("\n")) {
            String t = line.trim();
            if (t.startsWith(name + " ")) {
                return Double.parseDouble(t.split("=")[1].trim().split("\\s+")[0]);
            }
        }
        throw new AssertionError("no measurement " + name + " in:\n" + stdout);
    }
}
