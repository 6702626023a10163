package org.ringsweep.generators.ibis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The IBIS reader. Expected values are read off the file text given in each test (or off
 * examples/demo-board/parts/kx32.ibs); the rules checked are those of impedance-and-standards.md
 * §7 (syntax, suffixes, typ/min/max, NA) and lines-and-terminations.md §6 ({@code [Ramp]}).
 */
class IbisParserTests {
    static final Path DEMO = Path.of("..", "examples", "demo-board", "parts", "kx32.ibs");

    /** A minimal valid model around the given extra lines. */
    static String withModel(String... extra) {
        return String.join("\n", List.of(
                "[IBIS Ver] 4.2",
                "[Model] m1",
                "Model_type Output",
                "C_comp 2p 1p 3p",
                "[Voltage Range] 3.3 3.0 3.6")) + "\n" + String.join("\n", extra) + "\n[End]\n";
    }

    @Test
    void readsTheDemoPartsHeaderComponentPackageAndPins() {
        IbisFile f = IbisParser.parse(DEMO, "parts/kx32.ibs");
        assertEquals("3.2", f.version());
        assertEquals("kx32.ibs", f.fileName());
        IbisComponent kx = f.component("KX32").orElseThrow();
        assertEquals("Invented Demo Devices", kx.manufacturer());
        // [Package] L_pkg 3.0nH 2.5nH 3.8nH (kx32.ibs)
        assertEquals(3.0e-9, kx.lPkg().typ(), 1e-21);
        assertEquals(3.8e-9, kx.lPkg().max(), 1e-21);
        assertEquals(0.25, kx.rPkg().typ(), 1e-12);
        assertEquals(6, kx.pins().size());
        IbisPin pa1 = kx.pin("2").orElseThrow();
        assertEquals("PA1", pa1.signal());
        assertEquals("io33_drive", pa1.model()); // the [Model Selector] of kx32.ibs
        assertEquals(3.5e-9, pa1.lPin(), 1e-21);
        assertTrue(Double.isNaN(kx.pin("1").orElseThrow().rPin()), "a pin row without R_pin L_pin C_pin");
        assertTrue(f.warnings().isEmpty(), f.warnings().toString());
    }

    @Test
    void readsTheDemoModelsSubParametersTablesAndRamp() {
        IbisFile f = IbisParser.parse(DEMO, "parts/kx32.ibs");
        IbisModel io = f.model("io33").orElseThrow();
        assertEquals("I/O", io.modelType());
        assertEquals("Non-Inverting", io.polarity());
        assertEquals(0.8, io.vinl(), 1e-12);
        assertEquals(2.0, io.vinh(), 1e-12);
        assertEquals(1.65, io.vmeas(), 1e-12);
        assertEquals(50, io.rref(), 1e-12);
        // C_comp 3.0pF 2.6pF 3.5pF
        assertEquals(2.6e-12, io.cComp().get(IbisCorner.MIN), 1e-24);
        assertEquals(3.3, io.voltageRange().typ(), 1e-12);
        assertEquals(3.0, io.pullupReference(IbisCorner.MIN), 1e-12);
        assertEquals(0, io.pulldownReference(IbisCorner.MAX), 0);
        assertEquals(100.0, io.temperatureRange().min(), 1e-12);
        // [Pulldown] row `0.20   9.9482e-03  7.1030e-03  1.3268e-02`
        IbisTable pd = io.pulldownTable().orElseThrow();
        assertEquals(9.9482e-3, pd.valueAt(IbisCorner.TYP, 0.2), 1e-12);
        assertEquals(1.3268e-2, pd.valueAt(IbisCorner.MAX, 0.2), 1e-12);
        assertEquals(-3.3, pd.x()[0], 0);
        assertTrue(io.pullupTable().isPresent() && io.gndClampTable().isPresent() && io.powerClampTable().isPresent());
        IbisRamp ramp = io.rampData().orElseThrow();
        // dV/dt_r 1.244/1.000n ...; R_load = 50
        assertEquals(1.244, ramp.riseDv().typ(), 1e-12);
        assertEquals(1.0e-9, ramp.riseDt().typ(), 1e-21);
        assertEquals(0.65e-9, ramp.fallDt().max(), 1e-21);
        assertEquals(50, ramp.rLoad(), 0);
        IbisModel in = f.model("in33").orElseThrow();
        assertTrue(in.isInputOnly());
        // `C_comp 2.5pF 2.2pF NA`: NA takes typ
        assertEquals(2.5e-12, in.cComp().max(), 1e-24);
        assertTrue(in.rampData().isEmpty());
    }

    @Test
    void scaleSuffixesFollowIbisWhereCapitalMIsMega() {
        // impedance-and-standards.md §7: T G M k m u n p f, M = mega, m = milli (unlike SPICE)
        assertEquals(1e6, IbisParser.number("1M"), 0);
        assertEquals(1e-3, IbisParser.number("1m"), 0);
        assertEquals(2e12, IbisParser.number("2T"), 0);
        assertEquals(1.5e9, IbisParser.number("1.5G"), 0);
        assertEquals(4.7e3, IbisParser.number("4.7k"), 1e-9);
        assertEquals(3e-6, IbisParser.number("3u"), 1e-21);
        assertEquals(2.2e-9, IbisParser.number("2.2n"), 1e-24);
        assertEquals(5e-12, IbisParser.number("5pF"), 1e-27);
        assertEquals(7e-15, IbisParser.number("7f"), 1e-30);
        assertEquals(-1e-2, IbisParser.number("-10mA"), 1e-17);
        assertEquals(3.3, IbisParser.number("3.3V"), 0);
        assertEquals(1.5e-3, IbisParser.number("1.5e-3"), 0);
        assertTrue(Double.isNaN(IbisParser.number("NA")));
        assertThrows(IllegalArgumentException.class, () -> IbisParser.number("1.2.3"));
        assertThrows(IllegalArgumentException.class, () -> IbisParser.number("abc"));
    }

    @Test
    void rampFractionsAreUnreducedVoltageOverTime() {
        IbisFile f = IbisParser.parse(withModel("[Ramp]", "dV/dt_r 2.20/1.06n 1.5/2n NA", "dV/dt_f 2.0/1.0n NA NA",
                "R_load = 100"), "t.ibs");
        IbisRamp r = f.model("m1").orElseThrow().ramp();
        // lines-and-terminations.md §6: 2.20/1.06n = 2.075 V/ns, 0-100 % ramp dt/0.6 = 1.767 ns
        assertEquals(2.075e9, r.slope(true, IbisCorner.TYP), 0.001e9);
        assertEquals(1.767e-9, r.fullTime(true, IbisCorner.TYP), 0.001e-9);
        assertEquals(0.75e9, r.slope(true, IbisCorner.MIN), 1);
        assertEquals(2.075e9, r.slope(true, IbisCorner.MAX), 0.001e9); // NA takes typ
        assertEquals(100, r.rLoad(), 0);
    }

    @Test
    void rLoadDefaultsToFiftyOhms() {
        IbisFile f = IbisParser.parse(withModel("[Ramp]", "dV/dt_r 1/1n 1/1n 1/1n", "dV/dt_f 1/1n 1/1n 1/1n"), "t.ibs");
        // impedance-and-standards.md §7: R_load default 50 ohm
        assertEquals(50, f.model("m1").orElseThrow().ramp().rLoad(), 0);
    }

    @Test
    void naInMinAndMaxColumnsTakesTheTypValue() {
        IbisFile f = IbisParser.parse(withModel("[Pulldown]", "-1 -0.01 NA NA", "0 0 0 0", "1 0.02 0.01 NA"), "t.ibs");
        IbisTable t = f.model("m1").orElseThrow().pulldown();
        assertEquals(-0.01, t.valueAt(IbisCorner.MIN, -1), 0);
        assertEquals(0.02, t.valueAt(IbisCorner.MAX, 1), 0);
        assertEquals(0.01, t.valueAt(IbisCorner.MIN, 1), 0);
    }

    @Test
    void tableValuesAreLinearBetweenRowsAndHeldOutside() {
        IbisFile f = IbisParser.parse(withModel("[Pulldown]", "0 0 0 0", "1 0.02 0.01 0.03", "2 0.03 0.02 0.04"), "t.ibs");
        IbisTable t = f.model("m1").orElseThrow().pulldown();
        assertEquals(0.025, t.valueAt(IbisCorner.TYP, 1.5), 1e-15);
        assertEquals(0.03, t.valueAt(IbisCorner.TYP, 9), 0);
        assertEquals(0, t.valueAt(IbisCorner.TYP, -9), 0);
    }

    @Test
    void keywordsAndSubParametersAreCaseInsensitiveAndUnderscoresAreSpaces() {
        String text = String.join("\n", "[ibis ver] 5.0", "[MODEL] m1", "MODEL_TYPE i/o", "c_comp 1p 1p 1p",
                "[Pullup_Reference] 3.3 3.0 3.6", "[power_clamp_reference] 3.3 3.0 3.6", "[GND_CLAMP_REFERENCE] 0 0 0",
                "[pulldown reference] 0 0 0", "[PULLUP]", "0 0 0 0", "1 -0.01 -0.01 -0.01", "[gnd clamp]",
                "-1 -0.1 -0.1 -0.1", "0 0 0 0", "[END]");
        IbisModel m = IbisParser.parse(text, "t.ibs").model("m1").orElseThrow();
        assertEquals("i/o", m.modelType());
        assertEquals(3.6, m.pullupReference(IbisCorner.MAX), 0);
        assertEquals(3.0, m.powerClampReference(IbisCorner.MIN), 0);
        assertNull(m.voltageRange());
        assertEquals(-0.1, m.gndClamp().valueAt(IbisCorner.TYP, -1), 0);
        assertEquals(-0.005, m.pullup().valueAt(IbisCorner.TYP, 0.5), 1e-15);
    }

    @Test
    void commentsRunFromTheCommentCharacterAndItCanBeChanged() {
        String text = String.join("\n", "[IBIS Ver] 3.2  | a comment", "|[Model] hidden", "[Comment Char] #_char",
                "[Model] m1 # the model", "Model_type Output", "C_comp 1p 1p 1p", "[Voltage Range] 3.3 3 3.6",
                "# [Model] hidden2", "[End]");
        IbisFile f = IbisParser.parse(text, "t.ibs");
        assertEquals("3.2", f.version());
        assertEquals(List.of("m1"), List.copyOf(f.models().keySet()));
    }

    @Test
    void readsWaveformTablesWithTheirFixtures() {
        IbisFile f = IbisParser.parse(withModel("[Rising Waveform]", "R_fixture = 50", "V_fixture = 0", "V_fixture_max = 0.1",
                "C_fixture = 2p", "0 0 0 0", "1n 1.0 0.8 NA", "2n 2.0 1.9 2.1",
                "[Falling Waveform]", "R_fixture = 50", "V_fixture = 3.3", "V_fixture_min = 3.0", "V_fixture_max = 3.6",
                "0 3.3 3.0 3.6", "2n 1.3 1.2 1.4"), "t.ibs");
        IbisModel m = f.model("m1").orElseThrow();
        IbisWaveform r = m.rising().get(0);
        assertEquals(50, r.rFixture(), 0);
        assertEquals(0, r.vFixture().min(), 0); // V_fixture_min defaults to V_fixture
        assertEquals(0.1, r.vFixture().max(), 0);
        assertEquals(2e-12, r.cFixture(), 1e-24);
        assertTrue(Double.isNaN(r.lFixture()));
        assertEquals(1.0, r.table().valueAt(IbisCorner.MAX, 1e-9), 0); // NA takes typ
        assertEquals(3.0, m.falling().get(0).vFixture().min(), 0);
        assertEquals(1.3, m.falling().get(0).table().valueAt(IbisCorner.TYP, 5e-9), 0);
    }

    @Test
    void unsupportedKeywordsAndSubParametersAreListedAsWarningsWithTheirLines() {
        String text = String.join("\n", "[IBIS Ver] 5.0", "[Component] C1", "[Manufacturer] Acme", "[Pin] signal model",
                "1 A m1", "[Diff Pin] inv_pin vdiff", "1 2 0.2", "[Model Selector] sel", "m1 the only one",
                "[Model] m1", "Model_type Output", "C_comp 1p 1p 1p", "Vinh_ac = 2.2", "[Voltage Range] 3.3 3 3.6",
                "[Model Spec]", "Vinh 2.0 2.0 2.0", "[End]");
        IbisFile f = IbisParser.parse(text, "t.ibs");
        List<String> w = f.warnings();
        assertTrue(w.stream().anyMatch(s -> s.contains("t.ibs:6") && s.contains("[Diff Pin]")), w.toString());
        assertFalse(w.stream().anyMatch(s -> s.contains("[Model Selector]")), "the selector is read now: " + w);
        assertEquals(List.of("m1"), f.selector("sel").orElseThrow().modelNames());
        assertTrue(w.stream().anyMatch(s -> s.contains("t.ibs:13") && s.contains("Vinh_ac")), w.toString());
        assertTrue(w.stream().anyMatch(s -> s.contains("t.ibs:15") && s.contains("[Model Spec]")), w.toString());
        assertTrue(w.stream().anyMatch(s -> s.contains("no [Ramp]")), w.toString());
        assertEquals(1, f.component("C1").orElseThrow().pins().size(), "the [Diff Pin] row is not read as a pin");
    }

    @Test
    void aModelSelectorListsItsEntriesInFileOrderWithTheirDescriptions() {
        String text = withModel("[Model Selector] io_sel", "| model_name  description", "m1  Full drive, the default",
                "m2  Half drive", "[Model] m2", "Model_type Output", "C_comp 2p 1p 3p", "[Voltage Range] 3.3 3.0 3.6");
        IbisModelSelector sel = IbisParser.parse(text, "t.ibs").selector("io_sel").orElseThrow();
        // the text above: entries m1 then m2, the first the default (IBIS [Model Selector] rule)
        assertEquals(List.of("m1", "m2"), sel.modelNames());
        assertEquals("Full drive, the default", sel.entries().get(0).description());
        assertEquals(6, sel.line());
    }

    @Test
    void aBadModelSelectorIsAnErrorNamingFileLineAndKeyword() {
        IbisFormatException empty = assertThrows(IbisFormatException.class,
                () -> IbisParser.parse(withModel("[Model Selector] s"), "t.ibs"));
        assertEquals("t.ibs", empty.file());
        assertEquals(6, empty.line());
        assertEquals("[Model Selector]", empty.keyword());
        assertTrue(empty.getMessage().contains("expected at least one row"), empty.getMessage());
        IbisFormatException twice = assertThrows(IbisFormatException.class,
                () -> IbisParser.parse(withModel("[Model Selector] s", "m1 a", "m1 b"), "t.ibs"));
        assertEquals(8, twice.line());
        assertTrue(twice.getMessage().contains("`m1` is listed twice"), twice.getMessage());
        IbisFormatException clash = assertThrows(IbisFormatException.class,
                () -> IbisParser.parse(withModel("[Model Selector] m1", "m1 a"), "t.ibs"));
        assertTrue(clash.getMessage().startsWith("t.ibs:6: [Model Selector]: `m1` is also the name of a [Model]"), clash.getMessage());
    }

    @Test
    void aMissingEndIsAWarning() {
        IbisFile f = IbisParser.parse("[IBIS Ver] 3.2\n", "t.ibs");
        assertTrue(f.warnings().stream().anyMatch(s -> s.contains("no [End]")));
    }

    @Test
    void contentAfterEndIsIgnored() {
        IbisFile f = IbisParser.parse("[IBIS Ver] 3.2\n[End]\nanything at all\n[Model] x\n", "t.ibs");
        assertTrue(f.models().isEmpty());
        assertTrue(f.warnings().isEmpty());
    }

    private static IbisFormatException error(String text) {
        return assertThrows(IbisFormatException.class, () -> IbisParser.parse(text, "parts/t.ibs"));
    }

    @Test
    void aTableRowWithTooFewColumnsNamesFileLineKeywordAndExpectation() {
        // line 7 is the bad row: 5 lines of withModel, [Pulldown], then the row
        IbisFormatException e = error(withModel("[Pulldown]", "0 0 0"));
        assertEquals("parts/t.ibs", e.file());
        assertEquals(7, e.line());
        assertEquals("[Pulldown]", e.keyword());
        assertTrue(e.getMessage().startsWith("parts/t.ibs:7: [Pulldown]: expected four columns (voltage, typ, min, max), found 3"),
                e.getMessage());
    }

    @Test
    void voltagesThatDoNotIncreaseAreAnError() {
        IbisFormatException e = error(withModel("[Pullup]", "0 0 0 0", "1 -0.01 NA NA", "0.5 0 0 0"));
        assertEquals(9, e.line());
        assertTrue(e.getMessage().contains("increasing order"), e.getMessage());
    }

    @Test
    void aTypOfNaIsAnError() {
        IbisFormatException e = error(withModel("[Pulldown]", "0 NA 0 0", "1 1 1 1"));
        assertEquals(7, e.line());
        assertTrue(e.getMessage().contains("NA"), e.getMessage());
    }

    @Test
    void aBadNumberIsAnErrorQuotingIt() {
        IbisFormatException e = error(withModel("[Pulldown]", "0 0 0 0", "1 0.0x1 0 0"));
        assertEquals(8, e.line());
        assertTrue(e.getMessage().contains("`0.0x1` is not a number"), e.getMessage());
    }

    @Test
    void theFileMustStartWithIbisVer() {
        IbisFormatException e = error("[Component] x\n[End]\n");
        assertEquals(1, e.line());
        assertTrue(e.getMessage().contains("[IBIS Ver]"), e.getMessage());
        assertTrue(error("| nothing\n").getMessage().contains("[IBIS Ver]"));
    }

    @Test
    void tablesOutsideAModelAreAnError() {
        IbisFormatException e = error("[IBIS Ver] 3.2\n[Pulldown]\n0 0 0 0\n");
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("expected inside a [Model]"), e.getMessage());
    }

    @Test
    void aModelWithoutModelTypeOrCcompIsAnError() {
        IbisFormatException e = error("[IBIS Ver] 3.2\n[Model] m\nC_comp 1p 1p 1p\n[Voltage Range] 3 3 3\n[End]\n");
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("Model_type"), e.getMessage());
        e = error("[IBIS Ver] 3.2\n[Model] m\nModel_type Input\n[Voltage Range] 3 3 3\n[End]\n");
        assertTrue(e.getMessage().contains("C_comp"), e.getMessage());
    }

    @Test
    void aPullupWithoutVoltageRangeOrReferenceIsAnError() {
        IbisFormatException e = error("[IBIS Ver] 3.2\n[Model] m\nModel_type Output\nC_comp 1p 1p 1p\n[Pullup]\n0 0 0 0\n1 -1m NA NA\n[End]\n");
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("[Voltage Range]"), e.getMessage());
    }

    @Test
    void aRangeNeedsThreeValues() {
        IbisFormatException e = error("[IBIS Ver] 3.2\n[Model] m\nModel_type Input\nC_comp 1p 1p 1p\n[Voltage Range] 3.3 3.0\n");
        assertEquals(5, e.line());
        assertEquals("[Voltage Range]", e.keyword());
    }

    @Test
    void aRampWithoutBothEdgesOrWithABadFractionIsAnError() {
        assertTrue(error(withModel("[Ramp]", "dV/dt_r 1/1n 1/1n 1/1n")).getMessage().contains("dV/dt_f"));
        IbisFormatException e = error(withModel("[Ramp]", "dV/dt_r 1.2 1/1n 1/1n"));
        assertEquals(7, e.line());
        assertTrue(e.getMessage().contains("fraction"), e.getMessage());
    }

    @Test
    void aBadCommentCharAndDuplicatesAreErrors() {
        assertTrue(error("[IBIS Ver] 3.2\n[Comment Char] #\n").getMessage().contains("_char"));
        IbisFormatException e = error("[IBIS Ver] 3.2\n[Model] a\nModel_type Input\nC_comp 1p 1p 1p\n[Voltage Range] 3 3 3\n"
                + "[Model] a\n");
        assertEquals(6, e.line());
        assertTrue(e.getMessage().contains("twice"), e.getMessage());
        assertTrue(error(withModel("[Pulldown]", "0 0 0 0", "1 1 1 1", "[Pulldown]", "0 0 0 0", "1 1 1 1"))
                .getMessage().contains("twice"));
    }

    @Test
    void aWaveformNeedsItsFixture() {
        IbisFormatException e = error(withModel("[Rising Waveform]", "V_fixture = 0", "0 0 0 0", "1n 1 1 1"));
        assertEquals(6, e.line());
        assertTrue(e.getMessage().contains("R_fixture"), e.getMessage());
        assertFalse(e.getMessage().isEmpty());
    }

    @Test
    void strayTextWhereNoDataBelongsIsAnError() {
        IbisFormatException e = error("[IBIS Ver] 3.2\nstray text\n");
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("`stray text`"), e.getMessage());
    }
}
