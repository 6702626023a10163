package org.ringsweep.runner.screen;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.input.NetFileLoader;

/**
 * Screen figures against the published formulas; "LT" is shared/reference/lines-and-terminations.md.
 */
class NetScreenTests {
    private static final BuiltinModels CATALOG = new BuiltinModels();

    @TempDir
    Path dir;

    private ScreenResult screen(String driver, String segments, String parts) throws IOException {
        Path f = dir.resolve("n" + System.nanoTime() + ".yaml");
        Files.writeString(f, String.join("\n", "format: ringsweep/net-1", "net: N", "rails: { VCC: 3.3 }",
                "drivers:", "  - { pin: U1.1, model: ramp, v_high: VCC, " + driver + " }",
                "receivers:", "  - { pin: U2.1, model: cmos, c_in: 4pF, vih: 2.0, vil: 0.8 }",
                "  - { pin: U3.1, model: cmos, c_in: 4pF, vih: 2.0, vil: 0.8 }",
                "segments:", segments, parts.isEmpty() ? "" : "parts:\n" + parts, ""));
        return new NetScreen(CATALOG).screen(new NetFileLoader(CATALOG).load(f), f.toString());
    }

    private ScreenResult line(String driver, double mm, double erEff) throws IOException {
        return screen(driver, "  - { from: U1.1, to: U2.1, z0: 50, length: " + mm + "mm, er_eff: " + erEff + " }\n"
                + "  - { from: U2.1, to: U3.1, z0: 50, length: 0.1mm, er_eff: " + erEff + " }", "");
    }

    @Test
    void kneeFrequencyAndBandwidthFollowTheRiseTime() throws IOException {
        ScreenResult r = line("rise: 1ns, r_out: 20", 50, 3.4);
        // LT §3: tr = 1 ns → F_knee = 0.5/tr = 500 MHz [Johnson & Graham ch. 1], BW = 0.35/tr = 350 MHz [Bogatin].
        assertEquals(500e6, r.knee(), 1e-3);
        assertEquals(350e6, r.bandwidth(), 1e-3);
        assertEquals("10-90", r.edgeRef());
    }

    @Test
    void aRiseGivenBetweenOtherLevelsIsConvertedToTenToNinety() throws IOException {
        // A linear ramp: 20-80 % is 0.6 of the swing, 10-90 % is 0.8 (LT §6 arithmetic). 0.6 ns at
        // 20-80 → full ramp 1 ns → tr(10-90) 0.8 ns → knee 0.5/0.8 ns = 625 MHz.
        ScreenResult r = line("rise: 0.6ns, edge_ref: 20-80, r_out: 20", 50, 3.4);
        assertEquals("20-80", r.edgeRef());
        assertEquals(0.6e-9, r.riseGiven(), 1e-21);
        assertEquals(0.8e-9, r.rise1090(), 1e-21);
        assertEquals(625e6, r.knee(), 1e-3);
    }

    @Test
    void edgeRateIsTheSlopeOverTheStatedInterval() throws IOException {
        // LT §6: 3.3 V with a 10 ns 10-90 % time: 0.8·3.3/10 = 0.264 V/ns.
        ScreenResult r = line("rise: 10ns, r_out: 20", 50, 3.4);
        assertEquals(0.264e9, r.slew(), 1e-3);
        assertEquals(3.3, r.swing(), 1e-12);
    }

    @Test
    void launchAndFirstFarEndVoltagesMatchTheBounceDiagramWorkedExample() throws IOException {
        // LT §2 worked example 1: 3.3 V, Rs 15 ohm, Z0 50 ohm, open end: Vi = Vs·Z0/(Rs+Z0) = 2.53846 V,
        // Γs = (Rs−Z0)/(Rs+Z0) = −0.53846, first far-end Vi·(1+ΓL) = 5.07692 V with ΓL = +1 [Johnson & Graham ch. 4].
        ScreenResult r = line("rise: 0.5ns, r_out: 15", 150, 3.4);
        assertEquals(2.53846, r.launch(), 5e-6);
        assertEquals(-0.53846, r.gammaSource(), 5e-6);
        assertEquals(1, r.gammaLoad(), 0);
        assertEquals(5.07692, r.farFirst(), 5e-6);
        assertEquals(5.07692 - 3.3, r.overshootFirst(), 5e-6);
    }

    @Test
    void aSeriesResistorOnThePathCountsIntoTheSourceResistance() throws IOException {
        // LT §2 worked example 2: Rout + series R = Z0 = 50 ohm → Vi = 1.65 V, Γs = 0, far end 3.3 V.
        ScreenResult r = screen("rise: 0.5ns, r_out: 12",
                "  - { from: U1.1, to: R1.1, z0: 50, length: 3mm, er_eff: 3.4 }\n"
                        + "  - { from: R1.2, to: U2.1, z0: 50, length: 150mm, er_eff: 3.4 }\n"
                        + "  - { from: U2.1, to: U3.1, z0: 50, length: 1mm, er_eff: 3.4 }",
                "  - { ref: R1, kind: resistor, value: 38, between: [R1.1, R1.2] }");
        assertEquals(38, r.rSeries(), 0);
        assertEquals(1.65, r.launch(), 1e-12);
        assertEquals(0, r.gammaSource(), 1e-12);
        assertEquals(3.3, r.farFirst(), 1e-12);
    }

    @Test
    void suggestsZ0MinusROutAndTheNearestE24Value() throws IOException {
        // LT §4 series termination Rs_ext = Z0 − Rout [Johnson & Graham ch. 6]: 50 − 12 = 38 ohm;
        // nearest E24 value (IEC 60063, impedance-and-standards.md §5: ... 36, 39 ...) is 39.
        ScreenResult r = line("rise: 1ns, r_out: 12", 120, 3.4);
        assertEquals(38, r.suggestedSeries(), 1e-12);
        assertEquals(39, r.suggestedE24(), 0);
    }

    @ParameterizedTest(name = "{0} mm → {1}")
    @CsvSource({"24, LUMPED", "26, BORDERLINE", "74, BORDERLINE", "76, LINE"})
    void classifiesByTheDelayToRiseRule(double mm, LineClass expected) throws IOException {
        // LT §3 example, εeff = 4, tr = 1 ns: tr/6 is 25.0 mm of line, tr/2 is 74.9 mm.
        ScreenResult r = line("rise: 1ns, r_out: 20", mm - 0.1, 4.0);
        assertEquals(expected, r.lineClass());
    }

    @Test
    void totalAndLongestPathDelaysOfATee() throws IOException {
        // LT §1 table: εeff 4.0 → 6.6713 ps/mm. Tee: 60 mm to J1, then 18 mm to U2.1 and 25 mm to U3.1:
        // total 103 mm = 687.14 ps, longest path 85 mm = 567.06 ps (to U3.1).
        ScreenResult r = screen("rise: 1ns, r_out: 20",
                "  - { from: U1.1, to: J1, z0: 50, length: 60mm, er_eff: 4 }\n"
                        + "  - { from: J1, to: U2.1, z0: 55, length: 18mm, er_eff: 4 }\n"
                        + "  - { from: J1, to: U3.1, z0: 55, length: 25mm, er_eff: 4 }", "");
        assertEquals(687.14e-12, r.totalDelay(), 0.05e-12);
        assertEquals(567.06e-12, r.longestDelay(), 0.05e-12);
        assertEquals("U3.1", r.farthest());
        assertEquals(50, r.z0(), 0); // the longest segment on that path is the 60 mm trunk
    }

    @Test
    void ranksTransmissionLinesFirstThenByFirstArrivalOvershoot() throws IOException {
        ScreenResult lumped = line("rise: 1ns, r_out: 5", 10, 4.0);
        ScreenResult matched = line("rise: 1ns, r_out: 50", 150, 4.0);
        ScreenResult strong = line("rise: 1ns, r_out: 10", 150, 4.0);
        List<ScreenResult> ranked = NetScreen.rank(List.of(lumped, matched, strong));
        assertEquals(List.of(strong, matched, lumped), ranked);
        assertTrue(ScreenJson.line(strong, 1).startsWith("{\"format\":\"ringsweep/screen-1\",\"net\":\"N\""));
    }
}
