package org.ringsweep.generators.deck;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.ringsweep.generators.TestNets.cmos;
import static org.ringsweep.generators.TestNets.part;
import static org.ringsweep.generators.TestNets.ramp;
import static org.ringsweep.generators.TestNets.segment;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.generators.NgspiceCheck;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;

/**
 * Regression: a 2 mm (12 ps) breakout line in front of a series resistor and a clamped 1.8 V
 * receiver made ngspice stall with ever smaller time steps when the short piece was a lossless
 * line; elaborated as a pi section the deck runs in well under a second.
 */
class ShortLineTests {
    @Test
    void clampedClockNetWithABreakoutStubRunsThroughNgspice(@TempDir Path dir) throws Exception {
        Net net = new NetBuilder("clk").rail("VDD18", 1.8)
                .driver(ramp("U3.4", "v_high", "VDD18", "rise", 0.9e-9, "r_out", 30.0))
                .receiver(cmos("U9.7", "c_in", 3e-12, "vih", 1.17, "vil", 0.63, "clamp", "rails", "supply", "VDD18"))
                .segment(segment("TL1", "U3.4", "R8.1", "z0", 50.0, "delay", 12.3012e-12))
                .segment(segment("TL2", "R8.2", "U9.7", "z0", 50.0, "delay", 0.29523e-9))
                .part(part("R8", Part.Kind.RESISTOR, 22, "R8.1", "R8.2"))
                .stimulus(new Stimulus(List.of(Stimulus.Edge.RISE), Double.NaN, 40e-9, 3))
                .build();
        Elaboration e = new Elaborator().elaborate(net, "typ");
        String deck = new DeckWriter().render(e.circuit(), DeckOptions.of("c.raw")).replace("quit 0",
                "meas tran vend find v(u9_7) at=" + (e.circuit().analysis().stop() - 1e-9) + "\nquit 0");
        String out = NgspiceCheck.assertRuns(deck, "c.raw", dir);
        // The last cycle ends low: the final level is the low rail, 0 V (DC divider, lines-and-terminations.md §2).
        assertEquals(0.0, LatticeTests.measured(out, "vend"), 0.01 * 1.8);
    }
}
