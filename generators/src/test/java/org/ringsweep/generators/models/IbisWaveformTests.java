package org.ringsweep.generators.models;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.ringsweep.generators.TestNets.at;
import static org.ringsweep.generators.TestNets.cmos;
import static org.ringsweep.generators.TestNets.params;
import static org.ringsweep.generators.TestNets.part;
import static org.ringsweep.generators.TestNets.segment;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.generators.NgspiceCheck;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.ibis.IbisCorner;
import org.ringsweep.generators.ibis.IbisModel;
import org.ringsweep.generators.ibis.IbisParser;

/**
 * Switching coefficients solved from {@code [Rising Waveform]}/{@code [Falling Waveform]}, on a
 * test part of our own whose V–I tables are resistors (pull-down 20 Ω, pull-up 25 Ω), switched
 * by coefficients chosen here: ku and kd are smoothsteps of different lengths, so kd ≠ 1 − ku
 * and only the two-equation method recovers both. The waveforms are built independently of the
 * code under test: with {@code C_comp = 0} by KCL at the pad (a resistive divider, closed form);
 * with {@code C_comp > 0} by ngspice 39 (the reference simulator) running behavioural sources
 * with the chosen coefficients. Rows every 20 ps, 50 Ω fixtures to GND and to Vcc.
 */
class IbisWaveformTests {
    static final double RD = 20;
    static final double RU = 25;
    static final double R_FIX = 50;
    static final double T_ON = 1e-9;
    static final double LEAD = 0.2e-9;
    static final double ROW = 20e-12;
    static final int ROWS = 101;
    /** [Voltage Range] 3.3 3.0 3.6 of the test part, typ/min/max. */
    static final Map<IbisCorner, Double> VCC = Map.of(IbisCorner.TYP, 3.3, IbisCorner.MIN, 3.0, IbisCorner.MAX, 3.6);

    static double smooth(double x) {
        double c = Math.max(0, Math.min(1, x));
        return c * c * (3 - 2 * c);
    }

    /** The pull-up coefficient the part is built with: on over 1 ns, off over 0.6 ns, after a 0.2 ns lead-in. */
    static double ku(boolean rising, double t) {
        return rising ? smooth((t - LEAD) / T_ON) : 1 - smooth((t - LEAD) / (0.6 * T_ON));
    }

    /** The pull-down coefficient the part is built with (break before make: the stage turning off is faster). */
    static double kd(boolean rising, double t) {
        return rising ? 1 - smooth((t - LEAD) / (0.6 * T_ON)) : smooth((t - LEAD) / T_ON);
    }

    /** The pad voltage with C_comp = 0: KCL ku·(V − Vcc)/Ru + kd·V/Rd + (V − Vfix)/R = 0 solved for V. */
    static double divider(double ku, double kd, double vcc, double vFix) {
        return (ku * vcc / RU + vFix / R_FIX) / (ku / RU + kd / RD + 1 / R_FIX);
    }

    /** The test part: linear tables from −5 V to 10 V (currents into the pin, pull-up Vcc-relative). */
    static String ibisText(double cComp, String waveforms) {
        return "[IBIS Ver] 4.2\n[File Name] lin.ibs\n"
                + "[Model] lin\nModel_type I/O\nVinl = 0.8\nVinh = 2.0\nC_comp " + cComp + " NA NA\n[Voltage Range] 3.3 3.0 3.6\n"
                + "[Pulldown]\n-5 " + (-5 / RD) + " " + (-5 / RD) + " " + (-5 / RD) + "\n10 " + (10 / RD) + " " + (10 / RD) + " " + (10 / RD) + "\n"
                + "[Pullup]\n-5 " + (5 / RU) + " " + (5 / RU) + " " + (5 / RU) + "\n10 " + (-10 / RU) + " " + (-10 / RU) + " " + (-10 / RU) + "\n"
                + waveforms + "[End]\n";
    }

    /** A waveform keyword into R_fixture 50 Ω to GND ({@code toVcc} false) or to Vcc of each column. */
    static String waveform(boolean rising, boolean toVcc, double[] times, Map<IbisCorner, double[]> v) {
        StringBuilder s = new StringBuilder(rising ? "[Rising Waveform]\n" : "[Falling Waveform]\n");
        s.append("R_fixture = 50\n");
        s.append(toVcc ? "V_fixture = 3.3\nV_fixture_min = 3.0\nV_fixture_max = 3.6\n" : "V_fixture = 0\n");
        for (int i = 0; i < times.length; i++) {
            s.append(String.format(Locale.ROOT, "%.6e %.9f %.9f %.9f%n", times[i], v.get(IbisCorner.TYP)[i],
                    v.get(IbisCorner.MIN)[i], v.get(IbisCorner.MAX)[i]));
        }
        return s.toString();
    }

    static double[] rows() {
        double[] t = new double[ROWS];
        for (int i = 0; i < ROWS; i++) {
            t[i] = i * ROW;
        }
        return t;
    }

    /** Closed-form waveform of one edge into one fixture, every column. */
    static Map<IbisCorner, double[]> closedForm(boolean rising, boolean toVcc, boolean oneEquation) {
        Map<IbisCorner, double[]> out = new HashMap<>();
        double[] t = rows();
        for (IbisCorner c : IbisCorner.values()) {
            double vcc = VCC.get(c);
            double[] v = new double[ROWS];
            for (int i = 0; i < ROWS; i++) {
                double u = ku(rising, t[i]);
                double d = oneEquation ? 1 - u : kd(rising, t[i]);
                v[i] = divider(u, d, vcc, toVcc ? vcc : 0);
            }
            out.put(c, v);
        }
        return out;
    }

    static IbisModel parse(String text) {
        return IbisParser.parse(text, "lin.ibs").model("lin").orElseThrow();
    }

    @Test
    void twoWaveformsPerEdgeGiveBackBothCoefficientsInEveryColumn() {
        StringBuilder w = new StringBuilder();
        for (boolean rising : new boolean[] {true, false}) {
            w.append(waveform(rising, false, rows(), closedForm(rising, false, false)));
            w.append(waveform(rising, true, rows(), closedForm(rising, true, false)));
        }
        IbisModel m = parse(ibisText(0, w.toString()));
        for (IbisCorner c : IbisCorner.values()) {
            for (boolean rising : new boolean[] {true, false}) {
                List<String> warnings = new ArrayList<>();
                IbisSwitching k = IbisSwitching.fromWaveforms(new IbisBuffer(m, c), rising, warnings::add).orElseThrow();
                assertTrue(warnings.isEmpty(), warnings.toString());
                assertTrue(k.fromTable());
                // only the quiet lead-in is removed: the coefficients have not yet moved there
                assertTrue(k.leadIn() >= LEAD - 1e-15 && k.leadIn() < LEAD + 0.2e-9, "lead-in " + k.leadIn());
                double[] t = k.times();
                assertEquals(0, t[0], 0);
                for (int i = 0; i < t.length; i++) {
                    double at = t[i] + k.leadIn();
                    // the coefficients the closed-form waveforms were built with (exact at the rows: C_comp = 0)
                    assertEquals(ku(rising, at), k.ku()[i], 1e-6, c + " " + rising + " ku at " + at);
                    assertEquals(kd(rising, at), k.kd()[i], 1e-6, c + " " + rising + " kd at " + at);
                }
                assertEquals(1, rising ? k.ku()[t.length - 1] : k.kd()[t.length - 1], 1e-6, "the stage ends fully on");
            }
        }
    }

    @Test
    void oneWaveformPerEdgeUsesTheComplementaryHandOver() {
        String w = waveform(true, false, rows(), closedForm(true, false, true))
                + waveform(false, true, rows(), closedForm(false, true, true));
        IbisModel m = parse(ibisText(0, w));
        for (boolean rising : new boolean[] {true, false}) {
            IbisSwitching k = IbisSwitching.fromWaveforms(new IbisBuffer(m, IbisCorner.TYP), rising, x -> { }).orElseThrow();
            for (int i = 0; i < k.times().length; i++) {
                double at = k.times()[i] + k.leadIn();
                // built with kd = 1 − ku (the one-equation assumption), closed form
                assertEquals(ku(rising, at), k.ku()[i], 1e-6, "ku at " + at);
                assertEquals(1 - k.ku()[i], k.kd()[i], 1e-12, "kd = 1 − ku");
            }
        }
    }

    @Test
    void theFullTransitionPutsTheHostsFiftyPercentPointOnTheFixtureWaveformsOwn() {
        String w = waveform(true, false, rows(), closedForm(true, false, false)) + waveform(true, true, rows(), closedForm(true, true, false))
                + waveform(false, false, rows(), closedForm(false, false, false)) + waveform(false, true, rows(), closedForm(false, true, false));
        IbisModel m = parse(ibisText(0, w));
        IbisSwitching k = IbisSwitching.fromWaveforms(new IbisBuffer(m, IbisCorner.TYP), true, x -> { }).orElseThrow();
        // the 50 % crossing of the closed-form rising waveform into 50 Ω to GND, by bisection on the formula
        double v0 = divider(0, 1, 3.3, 0);
        double v1 = divider(1, 0, 3.3, 0);
        double lo = LEAD;
        double hi = LEAD + T_ON;
        for (int i = 0; i < 100; i++) {
            double mid = (lo + hi) / 2;
            if (divider(ku(true, mid), kd(true, mid), 3.3, 0) > (v0 + v1) / 2) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        // rows are 20 ps apart and the wave is linear between them: a few ps of interpolation error
        assertEquals(2 * (lo - k.leadIn()), k.fullTime(), 10e-12);
    }

    @Test
    void unusableWaveformsFallBackToTheRampWithAWarning() {
        double[] flat = new double[ROWS];
        java.util.Arrays.fill(flat, 0.1);
        String w = waveform(true, false, rows(), Map.of(IbisCorner.TYP, flat, IbisCorner.MIN, flat, IbisCorner.MAX, flat));
        String text = ibisText(1e-12, w + "[Ramp]\ndV/dt_r 1.5/0.8n NA NA\ndV/dt_f 1.5/0.7n NA NA\n");
        List<String> warnings = new ArrayList<>();
        IbisSwitching k = IbisSwitching.of(new IbisBuffer(parse(text), IbisCorner.TYP), true, warnings::add);
        assertFalse(k.fromTable());
        // [Ramp] dt/0.6 (lines-and-terminations.md §6)
        assertEquals(0.8e-9 / 0.6, k.fullTime(), 1e-21);
        assertTrue(warnings.stream().anyMatch(s -> s.contains("[Rising Waveform]") && s.contains("does not move")
                && s.contains("using [Ramp]")), warnings.toString());
    }

    @Test
    void aWaveformTheTablesCannotReachFallsBackToTheRampWithAWarning() {
        // 0 → 3.3 V into 50 Ω to GND: a 25 Ω pull-up from 3.3 V reaches at most 3.3·50/75 = 2.2 V (Ohm's law),
        // so no coefficients between 0 and 1 can give it
        double[] t = rows();
        double[] v = new double[ROWS];
        for (int i = 0; i < ROWS; i++) {
            v[i] = 3.3 * Math.min(1, t[i] / 1e-9);
        }
        String w = waveform(true, false, t, Map.of(IbisCorner.TYP, v, IbisCorner.MIN, v, IbisCorner.MAX, v));
        String text = ibisText(0, w + "[Ramp]\ndV/dt_r 1.5/0.8n NA NA\ndV/dt_f 1.5/0.7n NA NA\n");
        List<String> warnings = new ArrayList<>();
        assertFalse(IbisSwitching.of(new IbisBuffer(parse(text), IbisCorner.TYP), true, warnings::add).fromTable());
        assertTrue(warnings.stream().anyMatch(s -> s.contains("disagree with the V–I tables") && s.contains("using [Ramp]")),
                warnings.toString());
    }

    @Test
    void ignoredFixtureInductanceIsAWarning() {
        String w = waveform(true, false, rows(), closedForm(true, false, true)).replace("R_fixture = 50\n", "R_fixture = 50\nL_fixture = 2n\n");
        List<String> warnings = new ArrayList<>();
        IbisSwitching.fromWaveforms(new IbisBuffer(parse(ibisText(0, w)), IbisCorner.TYP), true, warnings::add).orElseThrow();
        assertTrue(warnings.stream().anyMatch(s -> s.contains("L_fixture") && s.contains("ignored")), warnings.toString());
    }

    /** A behavioural buffer with the chosen coefficients into one fixture, for ngspice. */
    static String fixture(String pad, boolean rising, double vFix, double cComp) {
        String tag = pad;
        return "vku_" + tag + " ku_" + tag + " 0 pwl(" + pwl(t -> ku(rising, t)) + ")\n"
                + "vkd_" + tag + " kd_" + tag + " 0 pwl(" + pwl(t -> kd(rising, t)) + ")\n"
                + "bpu_" + tag + " " + pad + " vcc i = v(ku_" + tag + ") * (v(" + pad + ") - v(vcc)) / " + RU + "\n"
                + "bpd_" + tag + " " + pad + " 0 i = v(kd_" + tag + ") * v(" + pad + ") / " + RD + "\n"
                + "cc_" + tag + " " + pad + " 0 " + cComp + "\n"
                + "rf_" + tag + " " + pad + " vf_" + tag + " " + R_FIX + "\n"
                + "vf_" + tag + " vf_" + tag + " 0 " + vFix + "\n";
    }

    static String pwl(java.util.function.DoubleUnaryOperator k) {
        StringBuilder s = new StringBuilder();
        for (int i = 0; i <= 480; i++) {
            double t = i * 5e-12;
            s.append(String.format(Locale.ROOT, "%s%.4e %.8f", i % 6 == 0 ? "\n+ " : " ", t, k.applyAsDouble(t)));
        }
        return s.toString();
    }

    /** Runs the deck and reads back `meas` results by name. */
    static Map<String, Double> measured(String deck, Path dir) throws Exception {
        String out = NgspiceCheck.assertRuns(deck, "w.raw", dir);
        Map<String, Double> values = new HashMap<>();
        for (String line : out.split("\n")) {
            String[] t = line.trim().split("\\s*=\\s*");
            if (t.length >= 2 && t[0].matches("[a-z0-9_]+")) {
                values.put(t[0], Double.parseDouble(t[1].trim().split("\\s+")[0]));
            }
        }
        return values;
    }

    @Test
    void withCcompTheCoefficientsAndTheFixtureWaveformComeBackOnNgspice(@TempDir Path dir) throws Exception {
        double cComp = 3e-12;
        // 1. ngspice makes the four waveforms of the part (rise/fall into 50 Ω to GND and to Vcc)
        StringBuilder deck = new StringBuilder("* waveforms of the test part\nvcc vcc 0 3.3\n");
        String[] pads = {"rg", "rv", "fg", "fv"};
        for (String p : pads) {
            deck.append(fixture(p, p.charAt(0) == 'r', p.charAt(1) == 'v' ? 3.3 : 0, cComp));
        }
        deck.append(".control\ntran 1p 2.1n\n");
        double[] rows = rows();
        for (String p : pads) {
            for (int i = 0; i < ROWS; i++) {
                deck.append("meas tran ").append(p).append(i).append(" find v(").append(p).append(") at=").append(rows[i]).append('\n');
            }
        }
        deck.append("write w.raw v(rg)\nquit 0\n.endc\n.end\n");
        Map<String, Double> wv = measured(deck.toString(), dir);
        StringBuilder tables = new StringBuilder();
        Map<String, double[]> byPad = new HashMap<>();
        for (String p : pads) {
            double[] v = new double[ROWS];
            for (int i = 0; i < ROWS; i++) {
                v[i] = wv.get(p + i);
            }
            byPad.put(p, v);
            tables.append(waveform(p.charAt(0) == 'r', p.charAt(1) == 'v', rows, Map.of(IbisCorner.TYP, v, IbisCorner.MIN, v, IbisCorner.MAX, v)));
        }
        String text = ibisText(cComp, tables.toString()).replace("V_fixture_min = 3.0\nV_fixture_max = 3.6\n", "");
        Path ibs = dir.resolve("lin.ibs");
        Files.writeString(ibs, text);

        // 2. the solved coefficients are the chosen ones (dV/dt by differences on 20 ps rows: a small error)
        IbisModel m = parse(text);
        for (boolean rising : new boolean[] {true, false}) {
            List<String> warnings = new ArrayList<>();
            IbisSwitching k = IbisSwitching.fromWaveforms(new IbisBuffer(m, IbisCorner.TYP), rising, warnings::add).orElseThrow();
            assertTrue(warnings.isEmpty(), warnings.toString());
            for (int i = 0; i < k.times().length; i++) {
                double at = k.times()[i] + k.leadIn();
                assertEquals(ku(rising, at), k.ku()[i], 0.02, rising + " ku at " + at);
                assertEquals(kd(rising, at), k.kd()[i], 0.02, rising + " kd at " + at);
            }
        }

        // 3. the ibis driver built from the file drives the rising waveform's fixture (50 Ω to GND) on ngspice
        Driver d = new Driver("U1.1", "ibis", params("file", "lin.ibs", "ibis_model", "lin"),
                new Location(dir.resolve("net.yaml").toString(), 4, 3));
        Net net = new NetBuilder("fixture").source(dir.resolve("net.yaml").toString(), "0").rail("VCC", 3.3).driver(d)
                .receiver(cmos("U2.1", "c_in", 0.0, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 1e-12))
                .part(part("RF", Part.Kind.RESISTOR, R_FIX, "U2.1", "GND"))
                .stimulus(new Stimulus(List.of(Stimulus.Edge.RISE, Stimulus.Edge.FALL), 10e-9, Double.NaN, 0)).build();
        Elaboration e = new Elaborator().elaborate(net, "typ");
        double start = e.edges().get(0).start();
        double lead = IbisSwitching.fromWaveforms(new IbisBuffer(m, IbisCorner.TYP), true, x -> { }).orElseThrow().leadIn();
        List<String> meas = new ArrayList<>();
        List<Integer> checked = new ArrayList<>();
        for (int i = 0; i < ROWS; i++) {
            if (rows[i] >= lead) {
                meas.add("meas tran s" + i + " find v(" + e.driverNode() + ") at=" + (start + rows[i] - lead));
                checked.add(i);
            }
        }
        String sim = new org.ringsweep.generators.deck.DeckWriter().render(e.circuit(),
                new org.ringsweep.generators.deck.DeckOptions("w.raw", false, false));
        Map<String, Double> got = measured(sim.replace("quit 0", String.join("\n", meas) + "\nquit 0"), dir);
        double worst = 0;
        for (int i : checked) {
            worst = Math.max(worst, Math.abs(got.get("s" + i) - byPad.get("rg")[i]));
        }
        // ngspice's own waveform of step 1 is the reference; 1 % of the 3.3 V supply
        assertTrue(worst < 0.033, "worst difference from the [Rising Waveform] table " + worst + " V");
    }
}
