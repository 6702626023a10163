package org.ringsweep.runner.engine.builtin;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.Transient;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.generators.deck.DeckOptions;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.runner.engine.NgspiceEngine;
import org.ringsweep.runner.engine.SimulationJob;
import org.ringsweep.runner.engine.SimulationOutcome;
import org.ringsweep.runner.testing.Ngspice;

/**
 * The lossy line (lossless sections with lumped loss) against ngspice's LTRA line, the reference
 * simulator's exact RLC model: the whole far-end and near-end waveforms, point by point, within
 * 1 % of the swing. The case is a board trace of 2.9 Ω series loss (17 Ω/m, 171 mm, Z0 47 Ω, 1 ns)
 * driven unterminated into 6.3 pF, the one that ringed furthest below ground in the random nets.
 */
class LossyLineAgainstNgspiceTests {
    @TempDir
    Path dir;

    @Test
    void lossyLineFollowsNgspiceLtraWithinOnePercentOfTheSwing() {
        Path ngspice = Ngspice.require();
        double len = 0.1708;
        double td = len * Math.sqrt(3.4) / 299_792_458.0;
        double z0 = 47;
        // lines-and-terminations.md §1: L = Z0·TD/len, C = TD/(Z0·len).
        Primitive.LossyLine line = new Primitive.LossyLine("tl1", "near", "0", "far", "0",
                17.18, z0 * td / len, 0, td / (z0 * len), len);
        Circuit c = Circuits.of(List.of(
                new Primitive.PwlVoltage("vs", "src", "0", new double[] {2e-9, 3e-9, 12e-9, 13e-9}, new double[] {0, 2.5, 2.5, 0}),
                new Primitive.Resistor("rs", "src", "near", 13.34),
                line,
                new Primitive.Capacitor("cl", "far", "0", 6.344e-12)),
                new Transient(25e-12, 25e-9, 25e-12), "near", "far");
        Waveforms mine = Circuits.solve(c);
        String deck = new DeckWriter().render(c, DeckOptions.of("x.raw"));
        SimulationOutcome o = NgspiceEngine.at(ngspice).run(new SimulationJob(deck, dir, "x.cir", "x.raw",
                c.analysis().stop(), Duration.ofSeconds(120), c.probes()));
        Waveforms ref = ((SimulationOutcome.Success) o).waveforms();
        for (String node : List.of("near", "far")) {
            double worst = 0;
            for (int i = 0; i < ref.size(); i++) {
                double t = ref.time(i);
                if (t > 0 && t < mine.endTime()) {
                    worst = Math.max(worst, Math.abs(ref.value(node, i) - Circuits.at(mine, node, t)));
                }
            }
            // ngspice as reference simulator; 1 % of the 2.5 V swing.
            assertTrue(worst <= 0.025, node + ": largest difference from ngspice " + worst + " V");
            System.out.println("lossy line, " + node + ": largest difference from ngspice LTRA " + worst + " V");
        }
    }
}
