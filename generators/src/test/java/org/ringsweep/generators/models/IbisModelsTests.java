package org.ringsweep.generators.models;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.ringsweep.generators.TestNets.at;
import static org.ringsweep.generators.TestNets.cmos;
import static org.ringsweep.generators.TestNets.params;
import static org.ringsweep.generators.TestNets.part;
import static org.ringsweep.generators.TestNets.ramp;
import static org.ringsweep.generators.TestNets.segment;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ReceiverModel;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Limits;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.generators.NgspiceCheck;
import org.ringsweep.generators.deck.DeckOptions;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.ElaborationException;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.ibis.IbisCorner;
import org.ringsweep.generators.ibis.IbisModel;
import org.ringsweep.generators.ibis.IbisParser;
import org.ringsweep.generators.ibis.IbisTable;

/**
 * The {@code ibis} driver and receiver on the demo part examples/demo-board/parts/kx32.ibs.
 * References: the IBIS definition of the V–I tables (impedance-and-standards.md §7: currents into
 * the pin, pull-up and POWER clamp Vcc-relative), so a DC level is the intersection of the table
 * with the load line, found here by bisection on the file's own rows; {@code [Ramp]} as the
 * 20–80 % slew into R_load (lines-and-terminations.md §6); ngspice 39 as the simulator.
 */
class IbisModelsTests {
    /** The demo file relative to the test nets' file nets/test.yaml (resolved from the module folder). */
    static final String FILE = "../../examples/demo-board/parts/kx32.ibs";
    static final IbisModel IO33 = IbisParser.parse(Path.of("..", "examples", "demo-board", "parts", "kx32.ibs"), "kx32.ibs")
            .model("io33").orElseThrow();
    static final IbisModel IN33 = IbisParser.parse(Path.of("..", "examples", "demo-board", "parts", "kx32.ibs"), "kx32.ibs")
            .model("in33").orElseThrow();
    private static final DeckWriter WRITER = new DeckWriter();

    static Driver ibisDriver(String corner) {
        return new Driver("U1.1", "ibis", params("file", FILE, "ibis_model", "io33", "ibis_corner", corner), at(4));
    }

    /** Linear between the rows, held outside: the standard's reading of a table, written out here. */
    static double table(IbisTable t, IbisCorner c, double v) {
        double[] x = t.x();
        double[] y = t.column(c);
        if (v <= x[0]) {
            return y[0];
        }
        for (int i = 1; i < x.length; i++) {
            if (v <= x[i]) {
                return y[i - 1] + (y[i] - y[i - 1]) * (v - x[i - 1]) / (x[i] - x[i - 1]);
            }
        }
        return y[y.length - 1];
    }

    /** A root of an increasing function by bisection. */
    static double bisect(DoubleUnaryOperator f, double lo, double hi) {
        for (int i = 0; i < 200; i++) {
            double mid = (lo + hi) / 2;
            if (f.applyAsDouble(mid) > 0) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return (lo + hi) / 2;
    }

    /** io33's clamp currents into the pin at pad voltage v (no clamp references in the file: 0 V and Vcc). */
    static double clamps(IbisModel m, IbisCorner c, double v) {
        double vcc = m.voltageRange().get(c);
        return table(m.gndClamp(), c, v) + table(m.powerClamp(), c, vcc - v);
    }

    /** The DC pad voltage with the pull-up on (high) or the pull-down on, into r to vTerm. */
    static double loadLine(IbisCorner c, boolean high, double r, double vTerm) {
        double vcc = IO33.voltageRange().get(c);
        return bisect(v -> (high ? table(IO33.pullup(), c, vcc - v) : table(IO33.pulldown(), c, v)) + clamps(IO33, c, v)
                + (v - vTerm) / r, -10, 10);
    }

    /** Runs the deck with `meas` lines; returns the measured values by name. */
    static Map<String, Double> run(Elaboration e, Path dir, String... meas) throws Exception {
        String deck = WRITER.render(e.circuit(), new DeckOptions("i.raw", false, false));
        String out = NgspiceCheck.assertRuns(deck.replace("quit 0", String.join("\n", meas) + "\nquit 0"), "i.raw", dir);
        Map<String, Double> values = new java.util.HashMap<>();
        for (String line : out.split("\n")) {
            String t = line.trim();
            int eq = t.indexOf('=');
            if (eq > 0 && !t.contains("failed")) {
                String name = t.substring(0, eq).trim();
                if (name.matches("[a-z0-9_]+")) {
                    values.put(name, Double.parseDouble(t.substring(eq + 1).trim().split("\\s+")[0]));
                }
            }
        }
        return values;
    }

    /** Driver, a 1 ps line (a tiny pi section), an input with no capacitance and a load resistor to `to`. */
    static NetBuilder loaded(Driver d, double ohms, String to, List<Stimulus.Edge> edges) {
        return new NetBuilder("ibisload").source("nets/test.yaml", "0").rail("VTT", 1.65).rail("VCC", 3.3).rail("VCCMAX", 3.6).rail("VCCMIN", 3.0)
                .driver(d)
                .receiver(cmos("U2.1", "c_in", 0.0, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-12))
                .part(part("RL", Part.Kind.RESISTOR, ohms, "U2.1", to))
                .stimulus(new Stimulus(edges, 30e-9, Double.NaN, 0));
    }

    @Test
    void dcLevelsIntoAResistiveLoadAreTheTablesIntersectionWithTheLoadLineInEveryColumn(@TempDir Path dir) throws Exception {
        List<Double> highs = new ArrayList<>();
        for (IbisCorner c : IbisCorner.values()) {
            Net net = loaded(ibisDriver(c.word()), 50, "VTT", List.of(Stimulus.Edge.RISE, Stimulus.Edge.FALL)).build();
            Elaboration e = new Elaborator().elaborate(net, c.word());
            double tHigh = e.edges().get(0).end() - 0.1e-9;
            double tLow = e.edges().get(1).end() - 0.1e-9;
            Map<String, Double> m = run(e, dir, "meas tran vhigh find v(" + e.driverNode() + ") at=" + tHigh,
                    "meas tran vlow find v(" + e.driverNode() + ") at=" + tLow);
            // IBIS V–I tables against the 50 Ω load line to 1.65 V, bisection on the file's rows
            double high = loadLine(c, true, 50, 1.65);
            double low = loadLine(c, false, 50, 1.65);
            assertEquals(high, m.get("vhigh"), 2e-3, c + " high level");
            assertEquals(low, m.get("vlow"), 2e-3, c + " low level");
            assertTrue(high > 2.2 && low < 1.0, "the levels are far from the termination voltage: " + high + ", " + low);
            highs.add(m.get("vhigh"));
        }
        // typ, min, max columns are different curves: weak min, strong max (impedance-and-standards.md §7)
        assertTrue(highs.get(1) < highs.get(0) && highs.get(0) < highs.get(2), highs.toString());
    }

    @Test
    void risingAndFallingSlewIntoRloadMatchesTheRampKeyword(@TempDir Path dir) throws Exception {
        for (IbisCorner c : IbisCorner.values()) {
            double vcc = IO33.voltageRange().get(c);
            // rising: R_load to GND; falling: R_load to Vcc (see IbisDriverModel)
            for (boolean rising : new boolean[] {true, false}) {
                String to = rising ? "GND" : c == IbisCorner.TYP ? "VCC" : c == IbisCorner.MAX ? "VCCMAX" : "VCCMIN";
                double vFix = rising ? 0 : vcc;
                Net net = loaded(ibisDriver(c.word()), IO33.ramp().rLoad(), to,
                        List.of(rising ? Stimulus.Edge.RISE : Stimulus.Edge.FALL)).build();
                Elaboration e = new Elaborator().elaborate(net, c.word());
                double vHigh = loadLine(c, true, IO33.ramp().rLoad(), vFix);
                double vLow = loadLine(c, false, IO33.ramp().rLoad(), vFix);
                double v20 = vLow + 0.2 * (vHigh - vLow);
                double v80 = vLow + 0.8 * (vHigh - vLow);
                String dirWord = rising ? "rise" : "fall";
                String node = e.driverNode();
                Map<String, Double> m = run(e, dir, "meas tran t2080 trig v(" + node + ") val=" + (rising ? v20 : v80) + " " + dirWord
                        + "=1 targ v(" + node + ") val=" + (rising ? v80 : v20) + " " + dirWord + "=1");
                double measured = 0.6 * (vHigh - vLow) / m.get("t2080");
                // [Ramp] dV/dt_r / dV/dt_f of kx32.ibs in this column
                double expected = IO33.ramp().slope(rising, c);
                assertEquals(expected, measured, 0.01 * expected, c + " " + dirWord + " slew (V/s)");
            }
        }
    }

    @Test
    void theHalfDriveModelIsSwitchedByItsWaveformsAndKeepsItsRampSlewIntoRload(@TempDir Path dir) throws Exception {
        IbisModel half = IbisParser.parse(Path.of("..", "examples", "demo-board", "parts", "kx32.ibs"), "kx32.ibs")
                .model("io33_half").orElseThrow();
        for (IbisCorner c : IbisCorner.values()) {
            List<String> warnings = new ArrayList<>();
            assertTrue(IbisSwitching.of(new IbisBuffer(half, c), true, warnings::add).fromTable(), "waveforms used");
            assertTrue(warnings.isEmpty(), warnings.toString());
        }
        // through the selector: kx32.ibs pin 1 uses [Model Selector] io33_drive
        Driver d = new Driver("U1.1", "ibis", params("file", FILE, "component", "KX32", "ibis_pin", "1", "ibis_select", "io33_half",
                "package", new org.ringsweep.api.net.Value.Flag(false)), at(4));
        for (boolean rising : new boolean[] {true, false}) {
            double vcc = half.voltageRange().get(IbisCorner.TYP);
            Net net = loaded(d, 50, rising ? "GND" : "VCC", List.of(rising ? Stimulus.Edge.RISE : Stimulus.Edge.FALL)).build();
            Elaboration e = new Elaborator().elaborate(net, "typ");
            String node = e.driverNode();
            // its own DC levels into R_load 50 Ω (GND when rising, Vcc when falling): the last rows of the waveforms
            double vStart = rising ? 0 : vcc;
            double vEnd = rising ? half.rising().get(0).table().valueAt(IbisCorner.TYP, 1)
                    : half.falling().get(1).table().valueAt(IbisCorner.TYP, 1);
            double v20 = vStart + 0.2 * (vEnd - vStart);
            double v80 = vStart + 0.8 * (vEnd - vStart);
            String w = rising ? "rise" : "fall";
            Map<String, Double> m = run(e, dir, "meas tran t2080 trig v(" + node + ") val=" + v20 + " " + w + "=1 targ v(" + node
                    + ") val=" + v80 + " " + w + "=1");
            // [Ramp] of io33_half states the 20–80 % time of those same waveforms (lines-and-terminations.md §6)
            double expected = half.ramp().riseDt().typ();
            if (!rising) {
                expected = half.ramp().fallDt().typ();
            }
            assertEquals(expected, m.get("t2080"), 0.02 * expected, w + " 20-80 % time");
        }
    }

    @Test
    void clampsConductAsTheirTablesSayBeyondEitherRail(@TempDir Path dir) throws Exception {
        // A stiff source (10 Ω) forces the pad of the in33 input 1.2 V beyond each rail.
        double rOut = 10;
        Net net = new NetBuilder("clamp").source("nets/test.yaml", "0").rail("VHI", 4.5).rail("VNEG", -1.2)
                .driver(ramp("U1.1", "v_high", "VHI", "v_low", "VNEG", "rise", 1e-9, "r_out", rOut))
                .receiver(new Receiver("U2.1", "ibis", params("file", FILE, "ibis_model", "in33"), Limits.NONE, at(12)))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-12))
                .stimulus(new Stimulus(List.of(Stimulus.Edge.RISE, Stimulus.Edge.FALL), 20e-9, Double.NaN, 0)).build();
        Elaboration e = new Elaborator().elaborate(net, "typ");
        String pad = e.receivers().get(0).node();
        Map<String, Double> m = run(e, dir, "meas tran vhigh find v(" + pad + ") at=" + (e.edges().get(0).end() - 0.1e-9),
                "meas tran vlow find v(" + pad + ") at=" + (e.edges().get(1).end() - 0.1e-9));
        double vHigh = m.get("vhigh");
        double vLow = m.get("vlow");
        // current into the pin through the source resistor, against the clamp tables at the simulated pad voltage
        double intoPinHigh = (4.5 - vHigh) / rOut;
        double intoPinLow = (-1.2 - vLow) / rOut;
        assertTrue(intoPinHigh > 10e-3 && intoPinLow < -10e-3, "the clamps carry real current: " + intoPinHigh + ", " + intoPinLow);
        assertEquals(clamps(IN33, IbisCorner.TYP, vHigh), intoPinHigh, 0.02 * Math.abs(intoPinHigh), "POWER clamp at " + vHigh + " V");
        assertEquals(clamps(IN33, IbisCorner.TYP, vLow), intoPinLow, 0.02 * Math.abs(intoPinLow), "GND clamp at " + vLow + " V");
    }

    @Test
    void theCornerChoosesTheTableColumn() {
        for (IbisCorner c : IbisCorner.values()) {
            Net net = loaded(ibisDriver(c.word()), 50, "VTT", List.of(Stimulus.Edge.RISE)).build();
            List<Primitive> ps = new Elaborator().elaborate(net, c.word()).circuit().primitives();
            Primitive.TableCurrent pd = ps.stream().filter(p -> p instanceof Primitive.TableCurrent t && t.name().startsWith("ipd"))
                    .map(p -> (Primitive.TableCurrent) p).findFirst().orElseThrow();
            // the kx32.ibs [Pulldown] column of that corner
            assertArrayEquals(IO33.pulldown().column(c), pd.y());
            Primitive.DcVoltage vpu = ps.stream().filter(p -> p instanceof Primitive.DcVoltage v && v.name().startsWith("vpu"))
                    .map(p -> (Primitive.DcVoltage) p).findFirst().orElseThrow();
            assertEquals(IO33.voltageRange().get(c), vpu.volts(), 0, "[Voltage Range] " + c);
            Primitive.Capacitor cc = ps.stream().filter(p -> p instanceof Primitive.Capacitor k && k.name().startsWith("ccomp"))
                    .map(p -> (Primitive.Capacitor) p).findFirst().orElseThrow();
            assertEquals(IO33.cComp().get(c), cc.farads(), 0, "C_comp " + c);
        }
        assertFalse(java.util.Arrays.equals(IO33.pulldown().column(IbisCorner.MIN), IO33.pulldown().column(IbisCorner.MAX)));
    }

    @Test
    void theTimingQuestionsComeFromTheFile() {
        Driver d = ibisDriver("min");
        NetRails rails = new NetRails(Map.of());
        // [Ramp] dt/0.6 (lines-and-terminations.md §6): min column dV/dt_r .../1.400n
        assertEquals(1.4e-9 / 0.6, IbisDriverModel.INSTANCE.fullTransition(d, Stimulus.Edge.RISE, rails), 1e-18);
        assertEquals(1.25e-9 / 0.6, IbisDriverModel.INSTANCE.fullTransition(d, Stimulus.Edge.FALL, rails), 1e-18);
        assertEquals(3.0, IbisDriverModel.INSTANCE.swing(d, rails).high(), 0); // [Voltage Range] min
        assertEquals(0, IbisDriverModel.INSTANCE.swing(d, rails).low(), 0);
        double r = IbisDriverModel.INSTANCE.sourceResistance(d, rails);
        // the invented stages are 28 Ω and 35 Ω near 0 V (make_kx32.py); the estimate sits near their mean
        assertTrue(r > 28 && r < 40, "source resistance " + r);
    }

    @Test
    void receiverThresholdsComeFromVinhAndVinlUnlessTheNetGivesThem() {
        NetRails rails = new NetRails(Map.of());
        Receiver plain = new Receiver("U2.1", "ibis", params("file", FILE, "ibis_model", "in33"), Limits.NONE, at(12));
        ReceiverModel.Thresholds th = IbisReceiverModel.INSTANCE.thresholds(plain, rails);
        // kx32.ibs in33: Vinl = 0.8V, Vinh = 2.0V
        assertEquals(0.8, th.vil(), 0);
        assertEquals(2.0, th.vih(), 0);
        Receiver given = new Receiver("U2.1", "ibis", params("file", FILE, "ibis_model", "in33", "vih", 2.2), Limits.NONE, at(12));
        assertEquals(2.2, IbisReceiverModel.INSTANCE.thresholds(given, rails).vih(), 0);
        Receiver max = new Receiver("U2.1", "ibis", params("file", FILE, "ibis_model", "in33", "ibis_corner", "max"), Limits.NONE, at(12));
        // `C_comp 2.5pF 2.2pF NA`: the max column falls back to typ
        assertEquals(2.5e-12, IbisReceiverModel.INSTANCE.inputCapacitance(max), 1e-24);
    }

    @Test
    void aComponentPinNamesTheModel() {
        Driver d = new Driver("U1.1", "ibis", params("file", FILE, "component", "KX32", "ibis_pin", "2"), at(4));
        assertEquals("io33", IbisSelection.of(d).model().name());
    }

    private static ElaborationException elaborationError(Driver d) {
        Net net = loaded(d, 50, "VTT", List.of(Stimulus.Edge.RISE)).build();
        return assertThrows(ElaborationException.class, () -> new Elaborator().elaborate(net, "typ"));
    }

    @Test
    void badSelectionsAreErrorsThatNameTheKeyAndWhatWasExpected() {
        String missing = elaborationError(new Driver("U1.1", "ibis", params("file", "parts/none.ibs", "ibis_model", "io33"), at(4)))
                .getMessage();
        assertTrue(missing.contains("file") && missing.contains("nets/parts/none.ibs") && missing.contains("does not exist"), missing);
        String unknown = elaborationError(new Driver("U1.1", "ibis", params("file", FILE, "ibis_model", "io18"), at(4))).getMessage();
        assertTrue(unknown.contains("ibis_model") && unknown.contains("`io18`") && unknown.contains("io33, in33"), unknown);
        String power = elaborationError(new Driver("U1.1", "ibis", params("file", FILE, "component", "KX32", "ibis_pin", "4"), at(4)))
                .getMessage();
        assertTrue(power.contains("ibis_pin") && power.contains("POWER"), power);
        String input = elaborationError(new Driver("U1.1", "ibis", params("file", FILE, "ibis_model", "in33"), at(4))).getMessage();
        assertTrue(input.contains("cannot drive"), input);
        assertEquals("ibis_model", IbisDriverModel.INSTANCE.check(params("file", FILE)).get(0).key());
        assertEquals("ibis_pin", IbisDriverModel.INSTANCE.check(params("file", FILE, "component", "KX32")).get(0).key());
        assertTrue(IbisDriverModel.INSTANCE.check(params("file", FILE, "component", "KX32", "ibis_pin", "1")).isEmpty());
    }

    @Test
    void anInvalidIbisFileIsReportedWithItsOwnLine(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("bad.ibs"), "[IBIS Ver] 3.2\n[Model] x\nModel_type Output\nC_comp 1p 1p 1p\n"
                + "[Voltage Range] 3.3 3 3.6\n[Pulldown]\n0 0 0\n");
        Driver d = new Driver("U1.1", "ibis", params("file", "bad.ibs", "ibis_model", "x"),
                new Location(dir.resolve("net.yaml").toString(), 4, 3));
        String msg = elaborationError(d).getMessage();
        assertTrue(msg.contains("bad.ibs:7: [Pulldown]: expected four columns"), msg);
    }

    @Test
    void anEclDriverIsRejectedRatherThanBuiltWithTheWrongReference(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("ecl.ibs"), "[IBIS Ver] 3.2\n[Model] e\nModel_type Output_ECL\nC_comp 1p 1p 1p\n"
                + "[Voltage Range] 3.3 3 3.6\n[Pulldown]\n-1 0 0 0\n0 0.01 NA NA\n[Ramp]\ndV/dt_r 1/1n NA NA\ndV/dt_f 1/1n NA NA\n[End]\n");
        Driver d = new Driver("U1.1", "ibis", params("file", "ecl.ibs", "ibis_model", "e"),
                new Location(dir.resolve("net.yaml").toString(), 4, 3));
        String msg = elaborationError(d).getMessage();
        assertTrue(msg.contains("ECL") && msg.contains("ibis_model"), msg);
    }

    @Test
    void anOpenDrainModelWithoutASupplyIsAnErrorNamingWhatIsMissing(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("od.ibs"), "[IBIS Ver] 3.2\n[Model] od\nModel_type Open_drain\nC_comp 1p 1p 1p\n"
                + "[Pulldown]\n-1 0 0 0\n0 0 NA NA\n1 0.01 NA NA\n[Ramp]\ndV/dt_r 1/1n NA NA\ndV/dt_f 1/1n NA NA\n[End]\n");
        Driver d = new Driver("U1.1", "ibis", params("file", "od.ibs", "ibis_model", "od"),
                new Location(dir.resolve("net.yaml").toString(), 4, 3));
        String msg = elaborationError(d).getMessage();
        assertTrue(msg.contains("[Voltage Range]") && msg.contains("[Pullup Reference]"), msg);
    }

    @Test
    void parsedFilesAreCachedUntilTheyChange(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("c.ibs");
        Files.writeString(f, "[IBIS Ver] 3.2\n[End]\n");
        assertSame(IbisSelection.load(f), IbisSelection.load(f));
        var first = IbisSelection.load(f);
        Files.writeString(f, "[IBIS Ver] 4.0\n[End]\n| longer now\n");
        var second = IbisSelection.load(f);
        assertNotSame(first, second);
        assertEquals("4.0", second.version());
    }

    @Test
    void manyThreadsReadingOneFileAllGetTheSameContent(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("kx32.ibs");
        Files.copy(Path.of("..", "examples", "demo-board", "parts", "kx32.ibs"), f);
        var pool = java.util.concurrent.Executors.newFixedThreadPool(8);
        try {
            List<java.util.concurrent.Future<org.ringsweep.generators.ibis.IbisFile>> all = new ArrayList<>();
            for (int i = 0; i < 32; i++) {
                all.add(pool.submit(() -> IbisSelection.load(f)));
            }
            var first = all.get(0).get();
            for (var r : all) {
                assertEquals(first, r.get());
            }
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void theFileIsRelativeToTheNetFile() {
        assertEquals(Path.of("boards/parts/a.ibs"), IbisSelection.resolve(new Location("boards/net.yaml", 1, 1), "parts/a.ibs"));
        assertEquals(Path.of("/abs/a.ibs"), IbisSelection.resolve(new Location("boards/net.yaml", 1, 1), "/abs/a.ibs"));
        assertEquals(Path.of("parts/a.ibs"), IbisSelection.resolve(Location.UNKNOWN, "parts/a.ibs"));
    }
}
