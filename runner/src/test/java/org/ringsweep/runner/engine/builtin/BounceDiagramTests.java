package org.ringsweep.runner.engine.builtin;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.Transient;
import org.ringsweep.api.wave.Waveforms;

/**
 * Lossless lines with resistive ends against the bounce (lattice) diagram from the telegrapher's
 * equations: the three worked examples of shared/reference/lines-and-terminations.md §2 (TD =
 * 1 ns, a 10 ps edge standing in for the ideal step, as the reference's own check did), each
 * plateau sampled in its middle, to 0.5 % of the swing.
 */
class BounceDiagramTests {
    private static final double TD = 1e-9;
    private static final double EDGE = 10e-12;
    private static final Transient RUN = new Transient(2e-12, 12e-9, 2e-12);

    private static Waveforms line(double vs, double rs, double z0, Primitive load) {
        List<Primitive> p = new java.util.ArrayList<>(List.of(
                Circuits.step("vs", "src", 0, EDGE, vs),
                new Primitive.Resistor("rs", "src", "near", rs),
                new Primitive.LosslessLine("t1", "near", "0", "far", "0", z0, TD)));
        if (load != null) {
            p.add(load);
        }
        return Circuits.solve(Circuits.of(p, RUN, "near", "far"));
    }

    /** Far-end plateau n holds on ((2n+1)TD, (2n+3)TD) after the edge's midpoint; near-end n on (2n·TD, (2n+2)TD). */
    private static void assertPlateaus(Waveforms w, double[] far, double[] near, double swing) {
        double t0 = EDGE / 2;
        for (int n = 0; n < far.length; n++) {
            double t = t0 + (2 * n + 2) * TD;
            assertEquals(far[n], Circuits.at(w, "far", t), 0.005 * swing, "far-end plateau " + n + " at " + t);
        }
        for (int n = 0; n < near.length; n++) {
            double t = t0 + (2 * n + 1) * TD;
            assertEquals(near[n], Circuits.at(w, "near", t), 0.005 * swing, "near-end plateau " + n + " at " + t);
        }
    }

    @Test
    void openLineDrivenThrough15OhmsRingsAsTheLatticeDiagramSays() {
        Waveforms w = line(3.3, 15, 50, null);
        // lines-and-terminations.md §2, worked example 1 (far-end 1,3,…,11 TD; near-end 0,2,…,10 TD).
        assertPlateaus(w,
                new double[] {5.07692, 2.34320, 3.81520, 3.02258, 3.44937},
                new double[] {2.53846, 3.71006, 3.07920, 3.41889, 3.23598, 3.33447}, 3.3);
    }

    @Test
    void seriesMatchedOpenLineShowsTheHalfSwingPlateauAtTheSource() {
        Waveforms w = line(3.3, 50, 50, null);
        // lines-and-terminations.md §2, worked example 2: far end 3.3 V from 1 TD on; near end 1.65 V until 2 TD, then 3.3 V.
        assertPlateaus(w, new double[] {3.3, 3.3, 3.3, 3.3, 3.3}, new double[] {1.65, 3.3, 3.3, 3.3, 3.3, 3.3}, 3.3);
    }

    @Test
    void lineIntoA25OhmLoadClimbsAMonotonicStaircase() {
        Waveforms w = line(5, 10, 75, new Primitive.Resistor("rl", "far", "0", 25));
        // lines-and-terminations.md §2, worked example 3.
        assertPlateaus(w,
                new double[] {2.20588, 3.04931, 3.37179, 3.49510, 3.54224},
                new double[] {4.41176, 3.89273, 3.69428, 3.61840, 3.58939, 3.57830}, 5);
        // Final value = DC divider 5·25/35 = 3.57143 V (§2), reached after many round trips.
    }
}
