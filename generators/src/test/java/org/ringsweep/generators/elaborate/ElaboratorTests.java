package org.ringsweep.generators.elaborate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.ringsweep.generators.TestNets.cmos;
import static org.ringsweep.generators.TestNets.part;
import static org.ringsweep.generators.TestNets.ramp;
import static org.ringsweep.generators.TestNets.segment;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.SimulationSettings;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.generators.TestNets;

class ElaboratorTests {
    private final Elaborator elaborator = new Elaborator();

    private static <T extends Primitive> List<T> all(Elaboration e, Class<T> type) {
        return e.circuit().primitives().stream().filter(type::isInstance).map(type::cast).toList();
    }

    private static Net p2pWithDriver(Object... driverParams) {
        return new NetBuilder("p2p").rail("VCC", 3.3)
                .driver(ramp("U1.1", driverParams))
                .receiver(cmos("U2.1", "c_in", 1e-12, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-9))
                .stimulus(new Stimulus(List.of(Stimulus.Edge.RISE, Stimulus.Edge.FALL), 20e-9, Double.NaN, 0))
                .build();
    }

    private static double rampLength(Elaboration e, int edge) {
        Primitive.PwlVoltage src = all(e, Primitive.PwlVoltage.class).get(0);
        double[] t = src.times();
        return t[2 + 2 * edge] - t[1 + 2 * edge];
    }

    @Test
    void tenToNinetyRiseOfOneNanosecondIsAFullRampOfOnePointTwoFiveNanoseconds() {
        Elaboration e = elaborator.elaborate(p2pWithDriver("v_high", "VCC", "rise", 1e-9, "r_out", 20.0), "typ");
        // a straight ramp covers 80 % of the swing between the 10 % and 90 % levels: 1 ns / 0.8
        assertEquals(1.25e-9, rampLength(e, 0), 1e-21);
        // fall defaults to rise (formats.md, Net file)
        assertEquals(1.25e-9, rampLength(e, 1), 1e-21);
        // the 50 % instant of a straight ramp is its middle
        EdgeEvent rise = e.edges().get(0);
        assertEquals(rise.start() + 0.625e-9, rise.source50(), 1e-21);
    }

    @Test
    void twentyToEightyAndZeroToHundredRefsScaleByPointSixAndOne() {
        Elaboration e = elaborator.elaborate(p2pWithDriver("v_high", "VCC", "rise", 1e-9, "fall", 2e-9,
                "edge_ref", "20-80", "r_out", 20.0), "typ");
        // 20 %→80 % is 60 % of a straight ramp (lines-and-terminations.md §6: IBIS dt/0.6)
        assertEquals(1e-9 / 0.6, rampLength(e, 0), 1e-21);
        assertEquals(2e-9 / 0.6, rampLength(e, 1), 1e-21);
        Elaboration full = elaborator.elaborate(p2pWithDriver("v_high", "VCC", "rise", 1e-9, "edge_ref", "0-100", "r_out", 20.0), "typ");
        assertEquals(1e-9, rampLength(full, 0), 1e-21);
    }

    @Test
    void sourceRampsBetweenTheRailLevels() {
        Elaboration e = elaborator.elaborate(p2pWithDriver("v_high", "VCC", "v_low", 0.5, "rise", 1e-9, "r_out", 20.0), "typ");
        Primitive.PwlVoltage src = all(e, Primitive.PwlVoltage.class).get(0);
        EdgeEvent rise = e.edges().get(0);
        assertEquals(0.5, src.valueAt(0), 0);
        assertEquals(0.5, src.valueAt(rise.start()), 0);
        // 50 % of the swing at the 50 % instant: (0.5 + 3.3) / 2
        assertEquals(1.9, src.valueAt(rise.source50()), 1e-12);
        assertEquals(3.3, src.valueAt(rise.end() - 1e-12), 1e-12);
        assertEquals(0.5, e.vLow());
        assertEquals(3.3, e.vHigh());
    }

    @Test
    void differentPullUpAndPullDownMakeATimedResistorThatFollowsTheDrivenState() {
        Elaboration e = elaborator.elaborate(p2pWithDriver("v_high", "VCC", "rise", 1e-9, "edge_ref", "0-100",
                "r_up", 30.0, "r_down", 10.0), "typ");
        assertTrue(all(e, Primitive.Resistor.class).isEmpty());
        Primitive.TimedResistor r = all(e, Primitive.TimedResistor.class).get(0);
        EdgeEvent rise = e.edges().get(0);
        EdgeEvent fall = e.edges().get(1);
        // driving low before the first rise: r_down; driving high after it: r_up; linear in between
        assertEquals(10, r.ohmsAt(0), 0);
        assertEquals(10, r.ohmsAt(rise.start()), 0);
        assertEquals(20, r.ohmsAt(rise.start() + 0.5e-9), 1e-9);
        assertEquals(30, r.ohmsAt(rise.start() + 1e-9), 1e-9);
        assertEquals(30, r.ohmsAt(fall.start()), 0);
        assertEquals(10, r.ohmsAt(fall.start() + 1e-9), 1e-9);
        assertEquals(e.driverNode(), r.b());
    }

    @Test
    void equalPullUpAndPullDownMakeAPlainResistor() {
        Elaboration e = elaborator.elaborate(p2pWithDriver("v_high", "VCC", "rise", 1e-9, "r_up", 25.0, "r_down", 25.0), "typ");
        assertTrue(all(e, Primitive.TimedResistor.class).isEmpty());
        assertEquals(25, all(e, Primitive.Resistor.class).get(0).ohms());
    }

    @Test
    void everyRailButGroundGetsADcSourceToGround() {
        Net net = new NetBuilder("rails").rail("VCC", 3.3).rail("VTT", 1.65)
                .driver(ramp("U1.1", "v_high", "VCC", "rise", 1e-9, "r_out", 20.0))
                .receiver(cmos("U2.1", "c_in", 1e-12, "vih", "VTT", "vil", 0.8))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-9))
                .part(part("R1", Part.Kind.RESISTOR, 50, "U2.1", "VTT"))
                .build();
        Elaboration e = elaborator.elaborate(net, "typ");
        List<Primitive.DcVoltage> dc = all(e, Primitive.DcVoltage.class);
        assertEquals(2, dc.size());
        assertEquals("vcc", dc.get(0).plus());
        assertEquals("0", dc.get(0).minus());
        assertEquals(3.3, dc.get(0).volts());
        assertEquals("vtt", dc.get(1).plus());
        assertEquals(1.65, dc.get(1).volts());
        // a rail name as threshold resolves to its voltage
        assertEquals(1.65, e.receivers().get(0).vih());
        Primitive.Resistor term = all(e, Primitive.Resistor.class).stream().filter(r -> r.name().equals("r1")).findFirst().orElseThrow();
        assertEquals("vtt", term.b());
    }

    @Test
    void segmentDelayFollowsLengthAndEffectivePermittivity() {
        Net net = new NetBuilder("len").driver(ramp("U1.1", "v_high", 3.3, "rise", 1e-9, "r_out", 20.0))
                .receiver(cmos("U2.1", "c_in", 1e-12, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "length", 0.1, "er_eff", 4.0)).build();
        Primitive.LosslessLine line = all(elaborator.elaborate(net, "typ"), Primitive.LosslessLine.class).get(0);
        // lines-and-terminations.md §1 table: εeff 4.0 → 6.6713 ps/mm, so 100 mm → 667.13 ps
        assertEquals(667.13e-12, line.delay(), 0.01e-12);
        assertEquals(50, line.z0());
        assertEquals("0", line.aRef());
        assertEquals("0", line.bRef());
    }

    @Test
    void lossySegmentGetsInductanceAndCapacitancePerMetreFromZ0AndDelay() {
        Net net = new NetBuilder("lossy").driver(ramp("U1.1", "v_high", 3.3, "rise", 1e-9, "r_out", 20.0))
                .receiver(cmos("U2.1", "c_in", 1e-12, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 0.5e-9, "length", 0.1, "r_per_m", 5.0)).build();
        Primitive.LossyLine line = all(elaborator.elaborate(net, "typ"), Primitive.LossyLine.class).get(0);
        // lines-and-terminations.md §1 [V]: L = 250 nH/m, C = 100 pF/m ↔ Z0 50 Ω, 5 ns/m, LEN 0.1 m → 0.5 ns
        assertEquals(250e-9, line.lPerM(), 1e-18);
        assertEquals(100e-12, line.cPerM(), 1e-21);
        assertEquals(5, line.rPerM());
        assertEquals(0.1, line.length());
    }

    @Test
    void lossySegmentWithoutLengthIsAnErrorNamingTheSegment() {
        NetBuilder b = new NetBuilder("lossy").driver(ramp("U1.1", "v_high", 3.3, "rise", 1e-9, "r_out", 20.0))
                .receiver(cmos("U2.1", "c_in", 1e-12, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 0.5e-9, "r_per_m", 5.0));
        ElaborationException x = assertThrows(ElaborationException.class, () -> elaborator.elaborate(b.build(), "typ"));
        assertTrue(x.getMessage().startsWith("nets/test.yaml:20:3: TL1/length: "), x.getMessage());
    }

    @Test
    void undeclaredRailIsAnErrorWithFileLineElementAndKey() {
        Net net = p2pWithDriver("v_high", "VDDQ", "rise", 1e-9, "r_out", 20.0);
        ElaborationException x = assertThrows(ElaborationException.class, () -> elaborator.elaborate(net, "typ"));
        // v_high is the first parameter: written at line 10, column 7 by TestNets
        assertTrue(x.getMessage().startsWith("nets/test.yaml:10:7: U1.1/v_high: rail `VDDQ` is not declared under rails"), x.getMessage());
        assertEquals("U1.1", x.elementId());
        assertEquals("v_high", x.key());
    }

    @Test
    void unknownModelIsAnErrorListingTheKnownOnes() {
        Net net = new NetBuilder("m").driver(new org.ringsweep.api.net.Driver("U1.1", "acme", TestNets.params(), TestNets.at(4)))
                .receiver(cmos("U2.1", "c_in", 1e-12, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-9)).build();
        ElaborationException x = assertThrows(ElaborationException.class, () -> elaborator.elaborate(net, "typ"));
        assertEquals("nets/test.yaml:4:3: U1.1/model: unknown driver model `acme`; expected one of ramp, open-drain, ibis", x.getMessage());
    }

    @Test
    void automaticMaxStepIsTheSmallerOfRampOverTwentyAndDelayOverFour() {
        // full ramp 1.25 ns / 20 = 62.5 ps < 1 ns / 4 (ngspice.md §5 rule, with twice its margin)
        Elaboration slow = elaborator.elaborate(p2pWithDriver("v_high", "VCC", "rise", 1e-9, "r_out", 20.0), "typ");
        assertEquals(62.5e-12, slow.circuit().analysis().maxStep(), 1e-24);
        assertEquals(slow.circuit().analysis().maxStep(), slow.circuit().analysis().step());
        assertTrue(slow.circuit().analysis().stepAuto(), "formats.md: `step: auto` is the tool's own choice");
        Net shortLine = TestNets.pointToPoint(20, 50, 100e-12).build();
        assertEquals(25e-12, elaborator.elaborate(shortLine, "typ").circuit().analysis().maxStep(), 1e-24);
    }

    @Test
    void givenStepAndStopOverrideTheAutomaticOnes() {
        Net net = TestNets.pointToPoint(20, 50, 1e-9).simulation(new SimulationSettings(30e-9, 10e-12)).build();
        Elaboration e = elaborator.elaborate(net, "typ");
        assertEquals(10e-12, e.circuit().analysis().maxStep());
        assertFalse(e.circuit().analysis().stepAuto(), "formats.md: an explicit `simulation.step` is the user's");
        assertEquals(30e-9, e.circuit().analysis().stop());
        assertEquals(30e-9, e.edges().get(e.edges().size() - 1).end());
    }

    @Test
    void arrivalFormulaReproducesTheWorkedBounceExample() {
        // lines-and-terminations.md §2 Ex. 1: Rs 15 Ω, Z0 50 Ω, open load; ±5 % needs n ≥ 3.84 → 4 arrivals
        double gammaS = AutoTiming.gamma(15, 50);
        assertEquals(-0.53846, gammaS, 1e-5);
        double n = AutoTiming.arrivals(gammaS, 1, 50.0 / 65.0, 0.05);
        assertEquals(3.84, n, 0.005);
        assertEquals(4, Math.ceil(n));
        // Ex. 2: a matched source (Rs = Z0) settles on the first arrival
        assertEquals(0, AutoTiming.arrivals(AutoTiming.gamma(50, 50), 1, 0.5, 0.05));
    }

    private static double settleOf(Elaboration e) {
        EdgeEvent rise = e.edges().get(0);
        return rise.end() - rise.start() - 1.25e-9;
    }

    @Test
    void automaticSettleTimeFollowsTheBounceArithmetic() {
        // Rs 15 Ω into 50 Ω, TD 5 ns, open end, 1 pF: n ≥ ln(0.01/0.53846)/ln(0.53846) = 6.44 → 7 arrivals
        // (lines-and-terminations.md §2), so (2·7 + 1)·TD, plus 5·(15 + 50)·1 pF, plus the 1.25 ns ramp
        Elaboration e = elaborator.elaborate(TestNets.pointToPoint(15, 50, 5e-9).build(), "typ");
        assertEquals(15 * 5e-9 + 5 * 65 * 1e-12 + 1.25e-9, settleOf(e), 1e-15);
    }

    @Test
    void automaticSettleGrowsWithTheMismatchAndIsBounded() {
        double matched = settleOf(elaborator.elaborate(TestNets.pointToPoint(50, 50, 5e-9).build(), "typ"));
        double mild = settleOf(elaborator.elaborate(TestNets.pointToPoint(30, 50, 5e-9).build(), "typ"));
        double strong = settleOf(elaborator.elaborate(TestNets.pointToPoint(5, 50, 5e-9).build(), "typ"));
        assertTrue(matched < mild && mild < strong, matched + " < " + mild + " < " + strong);
        // matched source: one flight (5 ns) + 5τ + ramp is under the 10 ns floor
        assertEquals(10e-9, matched, 1e-18);
        Elaboration capped = elaborator.elaborate(TestNets.pointToPoint(0.01, 50, 50e-9).build(), "typ");
        assertEquals(2e-6, settleOf(capped), 1e-15);
        assertTrue(capped.warnings().stream().anyMatch(w -> w.contains("capped")), capped.warnings().toString());
    }

    @Test
    void periodicClockMeasuresTheLastCycleOnly() {
        Net net = TestNets.pointToPoint(20, 50, 1e-9)
                .stimulus(new Stimulus(List.of(Stimulus.Edge.RISE), Double.NaN, 20e-9, 3)).build();
        Elaboration e = elaborator.elaborate(net, "typ");
        // lead-in max(1 ns, 2 × 1.25 ns) = 2.5 ns; edges every 10 ns; the last cycle starts at 2.5 + 40 ns
        assertEquals(2, e.edges().size());
        EdgeEvent rise = e.edges().get(0);
        EdgeEvent fall = e.edges().get(1);
        assertEquals(Stimulus.Edge.RISE, rise.direction());
        assertEquals(42.5e-9, rise.start(), 1e-18);
        assertEquals(43.125e-9, rise.source50(), 1e-18);
        assertEquals(52.5e-9, rise.end(), 1e-18);
        assertEquals(Stimulus.Edge.FALL, fall.direction());
        assertEquals(52.5e-9, fall.start(), 1e-18);
        assertEquals(62.5e-9, fall.end(), 1e-18);
        assertEquals(62.5e-9, e.circuit().analysis().stop(), 1e-18);
        // the source makes all six edges
        assertEquals(1 + 2 * 6, all(e, Primitive.PwlVoltage.class).get(0).times().length);
    }

    @Test
    void periodTooShortForTheRampIsAnError() {
        Net net = TestNets.pointToPoint(20, 50, 1e-9)
                .stimulus(new Stimulus(List.of(Stimulus.Edge.RISE), Double.NaN, 2e-9, 3)).build();
        ElaborationException x = assertThrows(ElaborationException.class, () -> elaborator.elaborate(net, "typ"));
        assertTrue(x.getMessage().contains("stimulus.period"), x.getMessage());
    }

    @Test
    void probesAreTheDriverAndEveryReceiverWithTheirUserNames() {
        Elaboration e = elaborator.elaborate(TestNets.formatsExample().build(), "typ");
        assertEquals(Map.of("u1_14", "U1.14", "u7_6", "U7.6", "u9_2", "U9.2"), e.circuit().probes());
        assertEquals("u1_14", e.driverNode());
        ReceiverProbe u7 = e.receivers().get(0);
        assertEquals(new ReceiverProbe("U7.6", "u7_6", 0.8, 2.0, 0, 3.3), u7);
        assertEquals(3.3, e.receivers().get(1).highRail());
    }

    @Test
    void clampsGoFromGroundToPinAndFromPinToSupply() {
        Elaboration e = elaborator.elaborate(TestNets.formatsExample().build(), "typ");
        List<Primitive.Diode> d = all(e, Primitive.Diode.class);
        assertEquals(2, d.size());
        assertEquals("0", d.get(0).anode());
        assertEquals("u7_6", d.get(0).cathode());
        assertEquals("u7_6", d.get(1).anode());
        assertEquals("vcc", d.get(1).cathode());
        Primitive.Capacitor c = all(e, Primitive.Capacitor.class).get(0);
        assertEquals(4e-12, c.farads());
        assertEquals("0", c.b());
    }

    @Test
    void zeroOhmResistorBecomesOneMicroohm() {
        Net net = TestNets.formatsExample().part(part("R8", Part.Kind.RESISTOR, 0, "J1", "J2"))
                .segment(segment("TL5", "J2", "U8.1", "z0", 50.0, "delay", 1e-10))
                .receiver(cmos("U8.1", "c_in", 1e-12, "vih", 2.0, "vil", 0.8)).build();
        Primitive.Resistor r = all(elaborator.elaborate(net, "typ"), Primitive.Resistor.class).stream()
                .filter(x -> x.name().equals("r8")).findFirst().orElseThrow();
        assertEquals(1e-6, r.ohms());
    }

    @Test
    void elaboratingTwiceGivesEqualResults() {
        Net net = TestNets.formatsExample().build();
        assertEquals(elaborator.elaborate(net, "typ"), elaborator.elaborate(net, "typ"));
    }

    @Test
    void notesCarryTheRawNetFacts() {
        Elaboration e = elaborator.elaborate(TestNets.formatsExample().build(), "slow");
        assertEquals(Map.of("net", "SPI0_SCK", "point", "slow", "source", "nets/spi0_sck.yaml", "source hash", "3f2a"),
                e.circuit().notes());
        assertEquals("SPI0_SCK", e.circuit().title());
        assertFalse(e.warnings().iterator().hasNext());
        assertInstanceOf(Primitive.PwlVoltage.class, e.circuit().primitives().get(1));
    }

    @Test
    void electricallyShortSegmentBecomesAPiSectionWithTheLinesTotalLAndC() {
        // 12.3 ps against a 1 ns (10-90) ramp = 1.25 ns full: 1/100 of the ramp, under the 1/20 rule.
        Net net = new NetBuilder("short").rail("VCC", 3.3)
                .driver(ramp("U1.1", "v_high", "VCC", "rise", 1e-9, "r_out", 30.0))
                .receiver(cmos("U2.1", "c_in", 3e-12, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.1", "J1", "z0", 50.0, "delay", 12.3e-12))
                .segment(segment("TL2", "J1", "U2.1", "z0", 50.0, "delay", 0.3e-9))
                .build();
        Elaboration e = elaborator.elaborate(net, "typ");
        // lines-and-terminations.md §1: L = Z0·TD, C = TD/Z0 for the whole line.
        Primitive.Inductor l = all(e, Primitive.Inductor.class).get(0);
        assertEquals(50.0 * 12.3e-12, l.henries(), 1e-24);
        double cTotal = all(e, Primitive.Capacitor.class).stream()
                .filter(c -> !c.a().startsWith("u2") && !c.b().startsWith("u2"))
                .mapToDouble(Primitive.Capacitor::farads).sum();
        assertEquals(12.3e-12 / 50.0, cTotal, 1e-27);
        assertEquals(1, all(e, Primitive.LosslessLine.class).size(), "the 0.3 ns segment stays a line");
        // The short piece no longer limits the step: min(1.25 ns / 20, 0.3 ns / 4) = 62.5 ps (class rules).
        assertEquals(62.5e-12, e.circuit().analysis().maxStep(), 1e-18);
    }
}
