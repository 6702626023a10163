package org.ringsweep.generators.models;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.ringsweep.generators.TestNets.at;
import static org.ringsweep.generators.TestNets.cmos;
import static org.ringsweep.generators.TestNets.params;
import static org.ringsweep.generators.TestNets.part;
import static org.ringsweep.generators.TestNets.ramp;
import static org.ringsweep.generators.TestNets.segment;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Limits;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;

/**
 * The package parasitics of the ibis models on the demo part examples/demo-board/parts/kx32.ibs
 * ({@code [Package]} R_pkg 0.25/0.20/0.35 Ω, L_pkg 3.0/2.5/3.8 nH, C_pkg 0.6/0.5/0.8 pF; pin 2's
 * own row 0.30 Ω, 3.5 nH, 0.7 pF). References: the file's values; Ohm's law for the DC drop
 * across R_pkg; the series-LC resonance 1/(2π√(LC)) (textbook); ngspice 39 as the simulator.
 */
class IbisPackageTests {
    private static final String FILE = IbisModelsTests.FILE;

    static Driver driver(Object... extra) {
        Object[] kv = new Object[extra.length + 4];
        kv[0] = "file";
        kv[1] = FILE;
        kv[2] = "component";
        kv[3] = "KX32";
        System.arraycopy(extra, 0, kv, 4, extra.length);
        return new Driver("U1.1", "ibis", params(kv), at(4));
    }

    static List<Primitive> primitives(Driver d, String corner) {
        Net net = IbisModelsTests.loaded(d, 50, "VTT", List.of(Stimulus.Edge.RISE)).build();
        return new Elaborator().elaborate(net, corner).circuit().primitives();
    }

    static <T extends Primitive> Optional<T> named(List<Primitive> ps, Class<T> type, String stem) {
        return ps.stream().filter(type::isInstance).map(type::cast).filter(p -> p.name().startsWith(stem)).findFirst();
    }

    @Test
    void thePinRowOverridesThePackageAndTheCornerPicksItsColumn() {
        List<Primitive> pin2 = primitives(driver("ibis_pin", "2"), "typ");
        // kx32.ibs [Pin] 2: R_pin 0.30, L_pin 3.5nH, C_pin 0.7pF
        assertEquals(0.30, named(pin2, Primitive.Resistor.class, "rpkg").orElseThrow().ohms(), 1e-15);
        assertEquals(3.5e-9, named(pin2, Primitive.Inductor.class, "lpkg").orElseThrow().henries(), 1e-21);
        assertEquals(0.7e-12, named(pin2, Primitive.Capacitor.class, "cpkg").orElseThrow().farads(), 1e-24);
        List<Primitive> pin1 = primitives(driver("ibis_pin", "1", "ibis_corner", "max"), "max");
        // kx32.ibs [Package] max column: 0.35 Ω, 3.8 nH, 0.8 pF
        assertEquals(0.35, named(pin1, Primitive.Resistor.class, "rpkg").orElseThrow().ohms(), 1e-15);
        assertEquals(3.8e-9, named(pin1, Primitive.Inductor.class, "lpkg").orElseThrow().henries(), 1e-21);
        assertEquals(0.8e-12, named(pin1, Primitive.Capacitor.class, "cpkg").orElseThrow().farads(), 1e-24);
        // the tables and C_comp sit at the die end of R_pkg, the pin end of L_pkg is the pin
        Primitive.Resistor r = named(pin1, Primitive.Resistor.class, "rpkg").orElseThrow();
        Primitive.Inductor l = named(pin1, Primitive.Inductor.class, "lpkg").orElseThrow();
        assertEquals(r.a(), named(pin1, Primitive.Capacitor.class, "ccomp").orElseThrow().a());
        assertEquals(r.a(), named(pin1, Primitive.TableCurrent.class, "ipd").orElseThrow().plus());
        assertEquals(r.b(), l.a());
        assertEquals(l.b(), named(pin1, Primitive.Capacitor.class, "cpkg").orElseThrow().a());
    }

    @Test
    void packageFalseOrNoComponentPutsTheDieAtThePin() {
        List<Primitive> off = primitives(driver("ibis_pin", "2", "package", new org.ringsweep.api.net.Value.Flag(false)), "typ");
        assertTrue(named(off, Primitive.Resistor.class, "rpkg").isEmpty() && named(off, Primitive.Inductor.class, "lpkg").isEmpty());
        List<Primitive> byModel = primitives(IbisModelsTests.ibisDriver("typ"), "typ");
        assertTrue(named(byModel, Primitive.Capacitor.class, "cpkg").isEmpty(), "ibis_model alone names no component, so no package");
    }

    @Test
    void theDcDropFromDieToPinIsTheLoadCurrentThroughRpkg(@TempDir Path dir) throws Exception {
        Net net = IbisModelsTests.loaded(driver("ibis_pin", "2"), 25, "GND", List.of(Stimulus.Edge.RISE)).build();
        Elaboration e = new Elaborator().elaborate(net, "typ");
        String die = named(e.circuit().primitives(), Primitive.Resistor.class, "rpkg").orElseThrow().a();
        double t = e.edges().get(0).end() - 0.1e-9;
        Map<String, Double> m = IbisModelsTests.run(e, dir, "meas tran vdie find v(" + die + ") at=" + t,
                "meas tran vpin find v(" + e.driverNode() + ") at=" + t);
        double current = m.get("vpin") / 25;
        assertTrue(current > 0.05, "a real load current: " + current);
        // Ohm's law across R_pin 0.30 Ω of kx32.ibs pin 2 (the inductor carries DC without drop)
        assertEquals(current * 0.30, m.get("vdie") - m.get("vpin"), 1e-3 * current * 0.30 + 1e-6);
    }

    @Test
    void theReceiversDieRingsAtTheSeriesLcFrequencyOfLpkgAndCcomp(@TempDir Path dir) throws Exception {
        // A stiff 1 Ω source steps the pin; the die node (C_comp 2.5 pF of in33) rings through L_pkg 3.0 nH.
        Net net = new NetBuilder("pkg").source("nets/test.yaml", "0").rail("V15", 1.5)
                .driver(ramp("U1.1", "v_high", "V15", "rise", 30e-12, "r_out", 1.0))
                .receiver(new Receiver("U2.1", "ibis", params("file", FILE, "component", "KX32", "ibis_pin", "3"), Limits.NONE, at(12)))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-12))
                .stimulus(new Stimulus(List.of(Stimulus.Edge.RISE), 20e-9, Double.NaN, 0)).build();
        Elaboration e = new Elaborator().elaborate(net, "typ");
        String die = named(e.circuit().primitives(), Primitive.Capacitor.class, "ccomp").orElseThrow().a();
        assertTrue(!die.equals(e.receivers().get(0).node()), "the die is behind the package");
        Map<String, Double> m = IbisModelsTests.run(e, dir,
                "meas tran period trig v(" + die + ") val=1.5 rise=2 targ v(" + die + ") val=1.5 rise=4");
        // series LC: f = 1/(2π√(L·C)), L_pkg 3.0 nH, C_comp 2.5 pF (kx32.ibs typ); damping ζ ≈ 0.02 shifts it by 0.02 %
        double expected = 2 * Math.PI * Math.sqrt(3.0e-9 * 2.5e-12);
        assertEquals(expected, m.get("period") / 2, 0.02 * expected, "ringing period");
    }

    @Test
    void theReceiversInputCapacitanceIncludesCpkg() {
        Receiver r = new Receiver("U2.1", "ibis", params("file", FILE, "component", "KX32", "ibis_pin", "3"), Limits.NONE, at(12));
        // in33 C_comp 2.5 pF + [Package] C_pkg 0.6 pF (kx32.ibs typ)
        assertEquals(3.1e-12, IbisReceiverModel.INSTANCE.inputCapacitance(r), 1e-24);
    }
}
