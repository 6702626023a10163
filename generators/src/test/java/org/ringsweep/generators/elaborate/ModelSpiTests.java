package org.ringsweep.generators.elaborate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.ringsweep.generators.TestNets.cmos;
import static org.ringsweep.generators.TestNets.ramp;
import static org.ringsweep.generators.TestNets.segment;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.model.DriverContext;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.model.ScheduledEdge;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.generators.TestNets;
import org.ringsweep.generators.models.BuiltinModels;

class ModelSpiTests {
    /** A plugin-style driver: a fixed 2 ns full transition behind 33 Ω, complaining about key `bad` when set. */
    static final class FixedDriver implements DriverModel {
        final List<List<ScheduledEdge>> seen = new ArrayList<>();

        @Override
        public String id() {
            return "fixed";
        }

        @Override
        public Role role() {
            return Role.DRIVER;
        }

        @Override
        public String description() {
            return "test driver";
        }

        @Override
        public List<ParameterSpec> parameters() {
            return List.of();
        }

        @Override
        public Swing swing(Driver d, NetRails rails) {
            return new Swing(0, 1.8);
        }

        @Override
        public double fullTransition(Driver d, Stimulus.Edge e, NetRails rails) {
            return 2e-9;
        }

        @Override
        public double sourceResistance(Driver d, NetRails rails) {
            return 33;
        }

        @Override
        public void elaborate(Driver d, DriverContext ctx) {
            if (d.parameters().has("bad")) {
                throw new ModelParameterException("bad", "expected no `bad`");
            }
            seen.add(ctx.edges());
            String src = ctx.newNode("src");
            ctx.add(new Primitive.PwlVoltage(ctx.newName("v"), src, ctx.groundNode(), new double[] {0, 1e-9}, new double[] {0, 1.8}));
            ctx.add(new Primitive.Resistor(ctx.newName("r"), src, ctx.pinNode(), 33));
        }
    }

    @Test
    void pluginDriverIsScheduledAndElaboratedThroughTheContext() {
        FixedDriver fixed = new FixedDriver();
        Elaborator el = new Elaborator(List.of(fixed), BuiltinModels.receivers());
        Net net = new NetBuilder("plug").driver(new Driver("U1.1", "fixed", TestNets.params(), TestNets.at(4)))
                .receiver(cmos("U2.1", "c_in", 1e-12, "vih", 1.2, "vil", 0.6))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-9)).build();
        Elaboration e = el.elaborate(net, "typ");
        // lead-in max(1 ns, 2 × 2 ns) = 4 ns
        assertEquals(4e-9, fixed.seen.get(0).get(0).start(), 1e-18);
        assertEquals(Stimulus.Edge.RISE, fixed.seen.get(0).get(0).direction());
        assertEquals(5e-9, e.edges().get(0).source50(), 1e-18);
        assertEquals(1.8, e.vHigh());
        assertEquals(1.8, e.receivers().get(0).highRail());
        assertTrue(e.circuit().primitives().stream().anyMatch(p -> p instanceof Primitive.Resistor r && r.ohms() == 33));
    }

    @Test
    void pluginComplaintIsLocatedAtItsKey() {
        Elaborator el = new Elaborator(List.of(new FixedDriver()), BuiltinModels.receivers());
        Net net = new NetBuilder("plug").driver(new Driver("U1.1", "fixed", TestNets.params("bad", 1.0), TestNets.at(4)))
                .receiver(cmos("U2.1", "c_in", 1e-12, "vih", 1.2, "vil", 0.6))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-9)).build();
        ElaborationException x = assertThrows(ElaborationException.class, () -> el.elaborate(net, "typ"));
        assertEquals("nets/test.yaml:10:7: U1.1/bad: expected no `bad`", x.getMessage());
    }

    @Test
    void fallingFirstEdgeStartsTheSourceHigh() {
        Net net = TestNets.pointToPoint(20, 50, 1e-9)
                .stimulus(new Stimulus(List.of(Stimulus.Edge.FALL, Stimulus.Edge.RISE), 20e-9, Double.NaN, 0)).build();
        Elaboration e = new Elaborator().elaborate(net, "typ");
        Primitive.PwlVoltage src = e.circuit().primitives().stream().filter(p -> p instanceof Primitive.PwlVoltage)
                .map(p -> (Primitive.PwlVoltage) p).findFirst().orElseThrow();
        assertEquals(3.3, src.valueAt(0));
        assertEquals(Stimulus.Edge.FALL, e.edges().get(0).direction());
        assertEquals(3.3, src.valueAt(e.edges().get(1).start() + 2e-9));
    }

    @Test
    void repeatedEdgeDirectionIsAnError() {
        Net net = TestNets.pointToPoint(20, 50, 1e-9)
                .stimulus(new Stimulus(List.of(Stimulus.Edge.RISE, Stimulus.Edge.RISE), 20e-9, Double.NaN, 0)).build();
        ElaborationException x = assertThrows(ElaborationException.class, () -> new Elaborator().elaborate(net, "typ"));
        assertTrue(x.getMessage().contains("stimulus.edges: two `rise` edges in a row"), x.getMessage());
    }

    @Test
    void severalDriversSwitchTogetherAndTheFirstSetsTheSwing() {
        Net net = new NetBuilder("multi").rail("VCC", 3.3)
                .driver(ramp("U1.1", "v_high", "VCC", "rise", 1e-9, "r_out", 20.0))
                .driver(ramp("U3.1", "v_high", 2.5, "rise", 2e-9, "r_out", 20.0, "delay", 1e-9))
                .receiver(cmos("U2.1", "c_in", 1e-12, "vih", 2.0, "vil", 0.8, "supply", "VCC"))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-9))
                .segment(segment("TL2", "U3.1", "U2.1", "z0", 50.0, "delay", 1e-9)).build();
        Elaboration e = new Elaborator().elaborate(net, "typ");
        List<Primitive.PwlVoltage> sources = e.circuit().primitives().stream().filter(p -> p instanceof Primitive.PwlVoltage)
                .map(p -> (Primitive.PwlVoltage) p).toList();
        assertEquals(2, sources.size());
        assertEquals(sources.get(0).times()[1], sources.get(1).times()[1]);
        assertEquals(3.3, e.vHigh());
        // lead-in from the longest full ramp, 2 ns / 0.8 = 2.5 ns, times two
        assertEquals(5e-9, e.edges().get(0).start(), 1e-18);
        assertTrue(e.warnings().stream().anyMatch(w -> w.contains("U3.1")), e.warnings().toString());
        assertEquals(3, e.circuit().probes().size());
    }
}
