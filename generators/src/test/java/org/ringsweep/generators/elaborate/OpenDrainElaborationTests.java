package org.ringsweep.generators.elaborate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.ringsweep.generators.TestNets.cmos;
import static org.ringsweep.generators.TestNets.params;
import static org.ringsweep.generators.TestNets.part;
import static org.ringsweep.generators.TestNets.segment;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.generators.TestNets;
import org.ringsweep.generators.models.OpenDrainDriverModel;

/** The open-drain driver and the I²C window warnings of an open-drain net. */
class OpenDrainElaborationTests {
    private final Elaborator elaborator = new Elaborator();

    private static Driver openDrain(Object... kv) {
        return new Driver("U1.1", "open-drain", params(kv), TestNets.at(4));
    }

    private static Value ohms(double x) {
        return Value.of(x, Dimension.RESISTANCE);
    }

    private static Net bus(Driver driver, double cIn, double pullUp) {
        return new NetBuilder("SDA").rail("VDD", 3.3)
                .driver(driver)
                .receiver(cmos("U2.1", "c_in", cIn, "vih", 2.31, "vil", 0.99))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-15))
                .part(part("R1", Part.Kind.RESISTOR, pullUp, "U2.1", "VDD"))
                .stimulus(new Stimulus(List.of(Stimulus.Edge.FALL, Stimulus.Edge.RISE), 3e-6, Double.NaN, 0))
                .build();
    }

    private static Primitive.TimedResistor sw(Elaboration e) {
        return e.circuit().primitives().stream().filter(Primitive.TimedResistor.class::isInstance)
                .map(Primitive.TimedResistor.class::cast).findFirst().orElseThrow();
    }

    @Test
    void onResistanceFromTheDatasheetLowLevelIsVolOverIol() {
        // r_on = V_OL / I_OL: 0.4 V at 3 mA → 133.33 Ω (Ohm's law)
        Driver d = openDrain("v_high", "VDD", "v_ol", 0.4, "i_ol", Value.of(3e-3, Dimension.CURRENT));
        assertEquals(0.4 / 3e-3, OpenDrainDriverModel.INSTANCE.onResistance(d), 1e-9);
        Elaboration e = elaborator.elaborate(bus(d, 100e-12, 4700), "typ");
        Primitive.TimedResistor r = sw(e);
        EdgeEvent fall = e.edges().get(0);
        EdgeEvent rise = e.edges().get(1);
        // released before the first (falling) edge: the documented 100 MΩ; on after it: r_on
        assertEquals(100e6, r.ohmsAt(0), 1e-3);
        assertEquals(0.4 / 3e-3, r.ohmsAt(fall.start() + 10e-9), 1e-9);
        assertEquals(0.4 / 3e-3, r.ohmsAt(rise.start()), 1e-9);
        assertEquals(100e6, r.ohmsAt(rise.start() + 1e-9), 1e-3);
        // the switch runs from the pin to GND
        assertEquals(e.driverNode(), r.a());
        assertEquals("0", r.b());
    }

    @Test
    void conductanceRisesLinearlyOverTheFallTime() {
        Driver d = openDrain("v_high", "VDD", "r_on", ohms(20), "fall", 16e-9);
        Elaboration e = elaborator.elaborate(bus(d, 100e-12, 4700), "typ");
        EdgeEvent fall = e.edges().get(0);
        // half-way through the 16 ns switch-on the conductance is half of 1/20 Ω plus half of 1/100 MΩ (linear ramp)
        double g = 0.5 / 20 + 0.5 / 100e6;
        assertEquals(1 / g, sw(e).ohmsAt(fall.start() + 8e-9), 1e-9);
        // source 50 %: the middle of the switch-on for the fall, the middle of the 1 ns release for the rise
        assertEquals(fall.start() + 8e-9, fall.source50(), 1e-18);
        assertEquals(e.edges().get(1).start() + 0.5e-9, e.edges().get(1).source50(), 1e-18);
        // the swing is GND to the pull-up supply
        assertEquals(0, e.vLow());
        assertEquals(3.3, e.vHigh());
    }

    @Test
    void rOnTogetherWithVolIsRejected() {
        Driver d = openDrain("v_high", "VDD", "r_on", ohms(20), "v_ol", 0.4);
        assertEquals("v_ol", OpenDrainDriverModel.INSTANCE.check(d.parameters()).get(0).key());
        Driver none = openDrain("v_high", "VDD");
        assertEquals("r_on", OpenDrainDriverModel.INSTANCE.check(none.parameters()).get(0).key());
        assertThrows(ElaborationException.class, () -> elaborator.elaborate(bus(none, 100e-12, 4700), "typ"));
    }

    @Test
    void fourPointSevenKilohmsOnTwoHundredPicofaradsIsFlaggedOutsideTheFastModeWindow() {
        // C_b = 200 pF of input capacitance (the 1 fs line adds 2e-5 pF). lines-and-terminations.md §7:
        // Fast-mode window [966.7 Ω, 1770.3 Ω] at 3.3 V and 200 pF.
        Driver d = openDrain("v_high", "VDD", "r_on", ohms(20), "i2c_mode", "fast");
        Elaboration e = elaborator.elaborate(bus(d, 200e-12, 4700), "typ");
        String all = String.join("\n", e.warnings());
        assertTrue(all.contains("pull-up R1 = 4.7 kΩ is outside the Fast-mode window [966.7 Ω, 1770.3 Ω]"), all);
        assertTrue(all.contains("C_b = 200.0 pF"), all);
        assertTrue(!all.contains("Standard-mode"), "only the chosen mode is reported: " + all);
        Elaboration inside = elaborator.elaborate(bus(d, 200e-12, 1500), "typ");
        assertTrue(String.join("\n", inside.warnings()).contains("R1 = 1.5 kΩ is inside the Fast-mode window"), inside.warnings().toString());
    }

    @Test
    void fastModeAtFourHundredPicofaradsIsReportedInfeasible() {
        // lines-and-terminations.md §7: Fm 400 pF 885.2 Ω < Rp(min) 966.7 Ω ⇒ no valid resistor
        Driver d = openDrain("v_high", "VDD", "r_on", ohms(20));
        Elaboration e = elaborator.elaborate(bus(d, 400e-12, 1000), "typ");
        String all = String.join("\n", e.warnings());
        assertTrue(all.contains("I²C Fast-mode: no pull-up fits (infeasible): R_p(max) 885.2 Ω is below R_p(min) 966.7 Ω"), all);
        // Standard-mode 400 pF: [966.7, 2950.5] holds 1 kΩ (the exact R_p(max) is 2950.55 Ω, at the rounding
        // edge of the quoted figure, so only its integer part is compared); Fast-mode Plus at 400 pF:
        // 120 ns / (0.8473 · 400 pF) = 354.1 Ω
        assertTrue(all.contains("R1 = 1 kΩ is inside the Standard-mode window [966.7 Ω, 2950."), all);
        assertTrue(!all.contains("exceeds"), "400 pF is at, not above, the Standard- and Fast-mode limit: " + all);
        assertTrue(all.contains("outside the Fast-mode Plus window [145.0 Ω, 354.1 Ω]"), all);
    }

    @Test
    void busCapacitanceCountsLinesAsTheirDelayOverImpedance() {
        // lines-and-terminations.md §1: C = TD/Z0; 1 ns / 50 Ω = 20 pF, plus c_out 10 pF, a 5 pF capacitor and c_in 50 pF
        Driver d = openDrain("v_high", "VDD", "r_on", ohms(20), "c_out", 10e-12, "i2c_mode", "fast");
        Net net = new NetBuilder("SDA").rail("VDD", 3.3)
                .driver(d)
                .receiver(cmos("U2.1", "c_in", 50e-12, "vih", 2.31, "vil", 0.99))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-9))
                .part(part("R1", Part.Kind.RESISTOR, 2200, "U2.1", "VDD"))
                .part(part("C1", Part.Kind.CAPACITOR, 5e-12, "U2.1", "GND"))
                .stimulus(new Stimulus(List.of(Stimulus.Edge.FALL, Stimulus.Edge.RISE), 3e-6, Double.NaN, 0))
                .build();
        String all = String.join("\n", elaborator.elaborate(net, "typ").warnings());
        assertTrue(all.contains("C_b = 85.0 pF (inputs 50.0 pF, capacitors 5.0 pF, lines 20.0 pF, driver pins 10.0 pF)"), all);
    }

    @Test
    void aNetWithoutPullUpIsWarned() {
        Driver d = openDrain("v_high", "VDD", "r_on", ohms(20));
        Net net = new NetBuilder("SDA").rail("VDD", 3.3)
                .driver(d)
                .receiver(cmos("U2.1", "c_in", 50e-12, "vih", 2.31, "vil", 0.99))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-9))
                .stimulus(new Stimulus(List.of(Stimulus.Edge.FALL, Stimulus.Edge.RISE), 3e-6, Double.NaN, 0))
                .build();
        assertTrue(String.join("\n", elaborator.elaborate(net, "typ").warnings()).contains("has no pull-up"));
    }

    @Test
    void automaticSettleCoversFiveTimeConstantsOfThePullUp() {
        // 5 RC for 1 % settling (e^-5 < 1 %, the class's documented rule): 2.2 kΩ × 100 pF = 220 ns → ≥ 1.1 µs
        Driver d = openDrain("v_high", "VDD", "r_on", ohms(20));
        Net net = new NetBuilder("SDA").rail("VDD", 3.3)
                .driver(d)
                .receiver(cmos("U2.1", "c_in", 100e-12, "vih", 2.31, "vil", 0.99))
                .part(part("R1", Part.Kind.RESISTOR, 2200, "U1.1", "VDD"))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-12))
                .stimulus(new Stimulus(List.of(Stimulus.Edge.FALL, Stimulus.Edge.RISE), Double.NaN, Double.NaN, 0))
                .build();
        Elaboration e = elaborator.elaborate(net, "typ");
        EdgeEvent rise = e.edges().get(1);
        assertTrue(rise.end() - rise.start() >= 5 * 2200 * 100e-12, () -> "window " + (rise.end() - rise.start()));
    }
}
