package org.ringsweep.generators.deck;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.ringsweep.generators.TestNets.cmos;
import static org.ringsweep.generators.TestNets.ramp;
import static org.ringsweep.generators.TestNets.segment;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.generators.NgspiceCheck;
import org.ringsweep.generators.elaborate.EdgeEvent;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;

/** The whole path net → circuit → deck → ngspice reproduces textbook reflection values. */
class LatticeTests {
    @Test
    void elaboratedDeckReproducesTheWorkedBounceExample(@TempDir Path dir) throws Exception {
        // lines-and-terminations.md §2 Ex. 1: 3.3 V, Rs 15 Ω, Z0 50 Ω, TD 1 ns, open far end (c_in 0)
        Net net = new NetBuilder("lattice").rail("VCC", 3.3)
                .driver(ramp("U1.1", "v_high", "VCC", "rise", 10e-12, "edge_ref", "0-100", "r_out", 15.0))
                .receiver(cmos("U2.1", "c_in", 0.0, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-9))
                .build();
        Elaboration e = new Elaborator().elaborate(net, "typ");
        EdgeEvent rise = e.edges().get(0);
        double t0 = rise.start() + 5e-12;
        String deck = new DeckWriter().render(e.circuit(), DeckOptions.of("l.raw")).replace("quit 0",
                "meas tran far1 find v(u2_1) at=" + (t0 + 2e-9) + "\n"
                        + "meas tran far3 find v(u2_1) at=" + (t0 + 4e-9) + "\n"
                        + "meas tran near0 find v(u1_1) at=" + (t0 + 1e-9) + "\n"
                        + "quit 0");
        String out = NgspiceCheck.assertRuns(deck, "l.raw", dir);
        // far end after arrivals at 1 TD and 3 TD; near end before the first return (table, Ex. 1)
        assertEquals(5.07692, measured(out, "far1"), 1e-3);
        assertEquals(2.34320, measured(out, "far3"), 1e-3);
        assertEquals(2.53846, measured(out, "near0"), 1e-3);
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
