package org.ringsweep.runner.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.check.PointRunner.PointSpec;
import org.ringsweep.runner.input.InputException;
import org.ringsweep.runner.input.PointParser;

class SweepPlannerTests {
    private static final ValuePath R5 = new ValuePath("R5", "value");
    private static final ValuePath RISE = new ValuePath("U1.14", "rise");
    private static final ValuePath R_OUT = new ValuePath("U1.14", "r_out");

    private final PointParser parser = new PointParser(new BuiltinModels());
    private final SweepPlanner planner = new SweepPlanner();
    private final Net spi = SweepFixture.net("spi-sck.yaml");
    private final Net reset = SweepFixture.net("reset.yaml");

    @TempDir
    Path dir;

    private SweepFile sweep(String... varyAndCombine) {
        String[] lines = new String[varyAndCombine.length + 3];
        lines[0] = "format: ringsweep/sweep-1";
        lines[1] = "nets: [nets/*.yaml]";
        lines[2] = "vary:";
        System.arraycopy(varyAndCombine, 0, lines, 3, varyAndCombine.length);
        return new SweepFileLoader().load(SweepFixture.write(dir, lines));
    }

    private SweepPlanner.Plan plan(Net net, String... varyAndCombine) {
        return planner.plan(sweep(varyAndCombine), net, parser);
    }

    private static List<Double> swept(SweepPlanner.Plan p, String path) {
        return p.points().stream().map(s -> s.swept().get(path)).toList();
    }

    @Test
    void gridIsTheProductInListedOrderWithTheLastEntryFastest() {
        SweepPlanner.Plan p = plan(spi,
                "  - { target: R5/value, values: [10, 22, 33] }",
                "  - { target: U1.14/rise, values: [1ns, 2ns] }");
        // cartesian product: 3 × 2 points, the last entry varying fastest (formats.md "Sweep file", issue 3)
        assertEquals(6, p.points().size());
        assertEquals(List.of(10.0, 10.0, 22.0, 22.0, 33.0, 33.0), swept(p, "R5/value"));
        assertEquals(List.of(1e-9, 2e-9, 1e-9, 2e-9, 1e-9, 2e-9), swept(p, "U1.14/rise"));
        assertEquals(List.of(1, 2, 3, 4, 5, 6), p.points().stream().map(PointSpec::index).toList());
        assertTrue(p.points().stream().allMatch(s -> s.corner().equals("typ")));
        PointSpec third = p.points().get(2);
        assertEquals(List.of("R5/value", "U1.14/rise"), List.copyOf(third.swept().keySet()));
        assertEquals(Value.of(22, Dimension.RESISTANCE), third.overrides().values().get(R5));
        assertEquals(Value.of(1e-9, Dimension.TIME), third.overrides().values().get(RISE));
        assertEquals(List.of(), p.warnings());
    }

    @Test
    void gridOfThreeEntriesHasTheProductOfTheirSizes() {
        SweepPlanner.Plan p = plan(spi,
                "  - { target: R5/value, values: [10, 22, 33] }",
                "  - { target: U1.14/rise, values: [1ns, 2ns] }",
                "  - { target: corner, values: [typ, slow, fast, typ] }");
        // 3 × 2 × 4 (a listed name is kept even when repeated)
        assertEquals(24, p.points().size());
        assertEquals(24, SweepPlanner.count(sweep(
                "  - { target: R5/value, values: [10, 22, 33] }",
                "  - { target: U1.14/rise, values: [1ns, 2ns] }",
                "  - { target: corner, values: [typ, slow, fast, typ] }"), spi, parser));
        assertEquals(List.of("typ", "slow", "fast", "typ"), p.points().subList(0, 4).stream().map(PointSpec::corner).toList());
    }

    @Test
    void zipPairsTheValuesOneToOne() {
        SweepPlanner.Plan p = plan(spi,
                "  - { target: R5/value, values: [10, 22, 33] }",
                "  - { target: U1.14/rise, values: [1ns, 2ns, 3ns] }",
                "combine: zip");
        assertEquals(List.of(10.0, 22.0, 33.0), swept(p, "R5/value"));
        assertEquals(List.of(1e-9, 2e-9, 3e-9), swept(p, "U1.14/rise"));
    }

    @Test
    void zipOfUnequalListsIsAnInputErrorNamingTheEntriesAndLengths() {
        InputException e = assertThrows(InputException.class, () -> sweep(
                "  - { target: R5/value, values: [10, 22, 33] }",
                "  - { target: U1.14/rise, values: [1ns, 2ns] }",
                "combine: zip"));
        assertEquals("combine", e.key());
        assertEquals(6, e.line());
        assertTrue(e.getMessage().contains("vary[0] (`R5/value`) 3 values, vary[1] (`U1.14/rise`) 2 values"), e.getMessage());
    }

    @Test
    void zipLengthsOfASeriesWithUnitsAreCheckedAgainstTheNet() {
        SweepFile s = sweep(
                "  - { target: R5/value, series: E6, from: 10ohm, to: 100ohm }",
                "  - { target: U1.14/rise, values: [1ns, 2ns] }",
                "combine: zip");
        InputException e = assertThrows(InputException.class, () -> planner.plan(s, spi, parser));
        // E6 from 10 to 100: 10 15 22 33 47 68 100 (IEC 60063, impedance-and-standards.md §5) = 7 values
        assertTrue(e.getMessage().contains("vary[0] (`R5/value`) 7 values, vary[1] (`U1.14/rise`) 2 values"), e.getMessage());
    }

    @Test
    void linearStepsAreEvenlySpacedWithExactEnds() {
        SweepPlanner.Plan p = plan(spi, "  - { target: R5/value, from: 10, to: 100, steps: 10 }");
        List<Double> v = swept(p, "R5/value");
        // linear spacing (to − from)/(steps − 1) = 90/9 = 10
        assertEquals(10, v.size());
        assertEquals(10.0, v.get(0));
        assertEquals(100.0, v.get(9));
        for (int i = 1; i < v.size(); i++) {
            assertEquals(10.0, v.get(i) - v.get(i - 1), 1e-12);
        }
    }

    @Test
    void logStepsKeepAConstantRatio() {
        SweepPlanner.Plan p = plan(spi, "  - { target: R5/value, from: 1, to: 1000, steps: 7, log: true }");
        List<Double> v = swept(p, "R5/value");
        // geometric spacing: ratio (to/from)^(1/(steps−1)) = 1000^(1/6) = √10
        double ratio = Math.pow(1000.0 / 1.0, 1.0 / 6);
        assertEquals(Math.sqrt(10), ratio, 1e-15);
        assertEquals(1.0, v.get(0));
        assertEquals(1000.0, v.get(6));
        assertEquals(10.0, v.get(2), 1e-12);
        for (int i = 1; i < v.size(); i++) {
            assertEquals(ratio, v.get(i) / v.get(i - 1), 1e-12);
        }
    }

    @Test
    void readsUnitsWithTheTargetsDimension() {
        SweepPlanner.Plan p = plan(spi,
                "  - { target: U1.14/rise, from: 0.5ns, to: 3ns, steps: 6 }",
                "  - { target: TL2/length, values: [500mil] }");
        // SI prefix n = 1e-9 (formats.md "Quantities"): 0.5 ns … 3 ns in 0.5 ns steps (the formats.md example)
        List<Double> rise = swept(p, "U1.14/rise");
        assertEquals(List.of(0.5e-9, 1e-9, 1.5e-9, 2e-9, 2.5e-9, 3e-9), rise);
        // 1 mil = 25.4 µm exactly, so 500 mil = 12.7 mm
        assertEquals(0.0127, p.points().get(0).swept().get("TL2/length"), 1e-15);
        assertEquals(Value.of(0.5e-9, Dimension.TIME), p.points().get(0).overrides().values().get(RISE));
    }

    @Test
    void aSingleValueWithAUnitParses() {
        SweepPlanner.Plan p = plan(spi, "  - { target: U1.14/rise, values: [0.5ns] }");
        // 0.5 ns = 5e-10 s (SI prefix n = 1e-9)
        assertEquals(5e-10, p.points().get(0).swept().get("U1.14/rise"));
    }

    @Test
    void aSeriesGivesThePreferredValuesInRange() {
        SweepPlanner.Plan p = plan(spi, "  - { target: C9/value, series: E6, from: 1p, to: 10p }");
        // IEC 60063 E6 (impedance-and-standards.md §5): 1.0 1.5 2.2 3.3 4.7 6.8 10 pF, exact decimals
        assertEquals(List.of(1e-12, 1.5e-12, 2.2e-12, 3.3e-12, 4.7e-12, 6.8e-12, 1e-11), swept(p, "C9/value"));
    }

    @Test
    void aTargetTheNetLacksIsSkippedWithOneWarning() {
        SweepFile s = sweep(
                "  - { target: R5/value, values: [10, 22] }",
                "  - { target: U3.2/rise, values: [1ns, 2ns, 3ns] }");
        SweepPlanner.Plan forSpi = planner.plan(s, spi, parser);
        assertEquals(2, forSpi.points().size());
        assertEquals(1, forSpi.warnings().size());
        String w = forSpi.warnings().get(0);
        assertTrue(w.contains("vary[1]") && w.contains("SPI0_SCK") && w.contains("`U3.2`") && w.contains(":5:"), w);
        SweepPlanner.Plan forReset = planner.plan(s, reset, parser);
        assertEquals(List.of(1e-9, 2e-9, 3e-9), swept(forReset, "U3.2/rise"));
        assertEquals(1, forReset.warnings().size());
        assertTrue(forReset.warnings().get(0).contains("no element `R5`"), forReset.warnings().get(0));
    }

    @Test
    void aNetNothingAppliesToRunsOnceAtTyp() {
        SweepPlanner.Plan p = plan(reset, "  - { target: R5/value, values: [10, 22] }");
        assertEquals(1, p.points().size());
        assertEquals("typ", p.points().get(0).corner());
        assertTrue(p.points().get(0).overrides().isEmpty());
        assertEquals(Map.of(), p.points().get(0).swept());
        assertEquals(2, p.warnings().size());
    }

    @Test
    void anUnknownParameterOfAKnownElementIsAnError() {
        SweepFile s = sweep("  - { target: R5/resistance, values: [10] }");
        InputException e = assertThrows(InputException.class, () -> planner.plan(s, spi, parser));
        assertEquals("vary[0].target", e.key());
        assertEquals(4, e.line());
        assertTrue(e.getMessage().contains("unknown parameter `resistance`") && e.getMessage().contains("expected one of: value"),
                e.getMessage());
    }

    @Test
    void aValueThatDoesNotFitTheParameterIsAnErrorAtItsPlace() {
        SweepFile s = sweep("  - { target: U1.14/rise, values: [1ns, 3pF] }");
        InputException e = assertThrows(InputException.class, () -> planner.plan(s, spi, parser));
        assertEquals("vary[0].values[1]", e.key());
        assertEquals(4, e.line());
        assertTrue(e.getMessage().contains("`3pF`"), e.getMessage());
    }

    @Test
    void aRangeWhoseUnitBoundsAreReversedIsAnError() {
        SweepFile s = sweep("  - { target: U1.14/rise, from: 3ns, to: 500ps, steps: 3 }");
        InputException e = assertThrows(InputException.class, () -> planner.plan(s, spi, parser));
        assertEquals("vary[0].to", e.key());
    }

    @Test
    void wordsAreNotSwept() {
        SweepFile s = sweep("  - { target: U1.14/v_high, values: [VCC] }");
        InputException e = assertThrows(InputException.class, () -> planner.plan(s, spi, parser));
        assertTrue(e.getMessage().contains("expected a number to sweep"), e.getMessage());
    }

    @Test
    void cornersSelectTheNetsCornersAndSweptValuesWin() {
        SweepPlanner.Plan p = plan(spi,
                "  - { target: corner, values: [typ, slow] }",
                "  - { target: U1.14/rise, values: [1ns] }");
        assertEquals(List.of("typ", "slow"), p.points().stream().map(PointSpec::corner).toList());
        PointSpec slow = p.points().get(1);
        // the corner slow sets rise 2.5ns and r_out 25 (formats.md example); the swept rise replaces its rise
        assertEquals(Value.of(1e-9, Dimension.TIME), slow.overrides().values().get(RISE));
        assertEquals(Value.of(25, Dimension.RESISTANCE), slow.overrides().values().get(R_OUT));
        assertEquals(Map.of("U1.14/rise", 1e-9), slow.swept());
        assertEquals(1, p.points().get(0).overrides().values().size());
    }

    @Test
    void aCornerTheNetLacksIsSkippedWithAWarningNamingItsCorners() {
        SweepFile s = sweep(
                "  - { target: corner, values: [slow, fast] }",
                "  - { target: R7/value, values: [22, 33] }");
        SweepPlanner.Plan p = planner.plan(s, reset, parser);
        assertEquals(List.of("slow", "slow"), p.points().stream().map(PointSpec::corner).toList());
        assertEquals(1, p.warnings().size());
        String w = p.warnings().get(0);
        assertTrue(w.contains("RESET_N") && w.contains("no corner `fast`") && w.contains("(it has typ, slow)"), w);
    }

    @Test
    void zipDropsThePairsWithACornerTheNetLacks() {
        SweepFile s = sweep(
                "  - { target: corner, values: [slow, fast, typ] }",
                "  - { target: R7/value, values: [22, 33, 47] }",
                "combine: zip");
        SweepPlanner.Plan p = planner.plan(s, reset, parser);
        assertEquals(List.of("slow", "typ"), p.points().stream().map(PointSpec::corner).toList());
        assertEquals(List.of(22.0, 47.0), swept(p, "R7/value"));
        assertEquals(List.of(1, 2), p.points().stream().map(PointSpec::index).toList());
    }

    @Test
    void zipKeepsPairingTheEntriesANetHas() {
        SweepFile s = sweep(
                "  - { target: R5/value, values: [10, 22] }",
                "  - { target: R7/value, values: [33, 47] }",
                "  - { target: U3.2/rise, values: [1ns, 2ns] }",
                "combine: zip");
        SweepPlanner.Plan p = planner.plan(s, reset, parser);
        assertEquals(List.of(33.0, 47.0), swept(p, "R7/value"));
        assertEquals(List.of(1e-9, 2e-9), swept(p, "U3.2/rise"));
        assertEquals(1, p.warnings().size());
    }

    @Test
    void moreThanTheAllowedPointsIsAnError() {
        SweepFile s = sweep(
                "  - { target: R5/value, from: 1, to: 100, steps: 100 }",
                "  - { target: U1.14/rise, from: 1ns, to: 2ns, steps: 100 }");
        assertEquals(10_000, SweepPlanner.count(s, spi, parser));
        InputException e = assertThrows(InputException.class, () -> new SweepPlanner(9_999).plan(s, spi, parser));
        assertTrue(e.getMessage().contains("10000 points"), e.getMessage());
    }

    /** The values a plan of one entry gives, in order: the oracle for the entries' own order. */
    private List<Double> valuesOf(String entry, String path) {
        return swept(plan(spi, entry), path);
    }

    @Test
    void aLazyGridIsTheNestedLoopOfItsEntriesWithTheLastFastest() {
        String corner = "  - { target: corner, values: [slow, typ, fast] }";
        String series = "  - { target: R5/value, series: E6, from: 10, to: 47 }";
        String log = "  - { target: U1.14/rise, from: 0.5ns, to: 2ns, steps: 3, log: true }";
        String listed = "  - { target: U1.14/r_out, values: [12, 18] }";
        SweepPlanner.Plan p = plan(spi, corner, series, log, listed);
        List<String> corners = List.of("slow", "typ", "fast");
        List<Double> r5 = valuesOf(series, "R5/value");
        List<Double> rise = valuesOf(log, "U1.14/rise");
        List<Double> rOut = valuesOf(listed, "U1.14/r_out");
        // grid = cartesian product in the listed order, the last entry fastest (formats.md "Sweep file"),
        // as the materialised list this planner replaced built it: nested loops, outermost first
        assertEquals(List.of(10.0, 15.0, 22.0, 33.0, 47.0), r5, "IEC 60063 E6 values from 10 to 47");
        assertEquals(corners.size() * r5.size() * rise.size() * rOut.size(), p.points().size());
        int index = 0;
        for (String c : corners) {
            for (double r : r5) {
                for (double t : rise) {
                    for (double o : rOut) {
                        PointSpec got = p.points().get(index++);
                        assertEquals(index, got.index(), "1-based run order");
                        assertEquals(c, got.corner());
                        assertEquals(Map.of("R5/value", r, "U1.14/rise", t, "U1.14/r_out", o), got.swept());
                        assertEquals(List.of("R5/value", "U1.14/rise", "U1.14/r_out"), List.copyOf(got.swept().keySet()), "entry order");
                        assertEquals(Value.of(t, Dimension.TIME), got.overrides().values().get(RISE), "swept values win over the corner's");
                        assertEquals(Value.of(o, Dimension.RESISTANCE), got.overrides().values().get(R_OUT));
                    }
                }
            }
        }
        assertEquals(p.points().get(17), p.points().get(17), "a point built twice is the same point");
        assertEquals(p.points(), p.points().stream().toList(), "iteration and indexing agree");
    }

    @Test
    void aLazyZipTakesTheIthValueOfEveryEntry() {
        String range = "  - { target: U1.14/rise, from: 1ns, to: 3ns, steps: 5 }";
        SweepPlanner.Plan p = plan(spi, "  - { target: R5/value, values: [10, 22, 33, 47, 68] }", range, "combine: zip");
        List<Double> rise = valuesOf(range, "U1.14/rise");
        // linear: 1, 1.5, 2, 2.5, 3 ns, the ends exact (formats.md "Sweep file": from/to/steps)
        assertEquals(List.of(1e-9, 1.5e-9, 2e-9, 2.5e-9, 3e-9), rise);
        assertEquals(5, p.points().size());
        List<Double> r5 = List.of(10.0, 22.0, 33.0, 47.0, 68.0);
        for (int i = 0; i < 5; i++) {
            assertEquals(Map.of("R5/value", r5.get(i), "U1.14/rise", rise.get(i)), p.points().get(i).swept());
        }
    }

    @Test
    void aMillionPointGridIsCountedByArithmeticAndBuildsAnyPointOnDemand() {
        SweepFile s = sweep(
                "  - { target: R5/value, from: 1, to: 1000, steps: 1000 }",
                "  - { target: U1.14/rise, from: 1ns, to: 1000ns, steps: 1000 }");
        SweepPlanner.Plan p = planner.plan(s, spi, parser);
        // 1000 × 1000 (product of the entry sizes); linear steps of exactly 1 ohm and 1 ns
        assertEquals(1_000_000, p.points().size());
        assertEquals(1_000_000, SweepPlanner.count(s, spi, parser));
        assertEquals(Map.of("R5/value", 1.0, "U1.14/rise", 1e-9), p.points().get(0).swept());
        assertEquals(Map.of("R5/value", 2.0, "U1.14/rise", 1e-9), p.points().get(1000).swept(), "the rise time wraps first");
        assertEquals(Map.of("R5/value", 457.0, "U1.14/rise", 124e-9), p.points().get(456 * 1000 + 123).swept());
        assertEquals(Map.of("R5/value", 1000.0, "U1.14/rise", 1000e-9), p.points().get(999_999).swept());
        assertEquals(1_000_000, p.points().get(999_999).index());
        assertThrows(IndexOutOfBoundsException.class, () -> p.points().get(1_000_000));
        assertThrows(UnsupportedOperationException.class, () -> p.points().remove(0), "the plan is read-only");
    }

    @Test
    void anAbsurdPlanIsRefusedNamingTheSweepFileTheKeyAndTheNet() {
        SweepFile s = sweep(
                "  - { target: R5/value, from: 1, to: 100, steps: 100000 }",
                "  - { target: U1.14/rise, from: 1ns, to: 2ns, steps: 100000 }");
        InputException e = assertThrows(InputException.class, () -> planner.plan(s, spi, parser));
        // 10^5 × 10^5 = 10^10 points, beyond the 10^9 guard
        assertTrue(e.getMessage().contains("10000000000 points for net SPI0_SCK"), e.getMessage());
        assertTrue(e.getMessage().contains("sweep.yaml"), e.getMessage());
        assertEquals("vary", e.key());
    }
}
