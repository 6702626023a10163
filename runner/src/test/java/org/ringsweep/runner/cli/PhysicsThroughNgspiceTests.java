package org.ringsweep.runner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.raw.RawFileReader;
import org.ringsweep.runner.raw.RawPlot;
import org.ringsweep.runner.testing.Ngspice;

/**
 * The whole pipeline (net file → deck → ngspice → raw → measurements) against closed-form line
 * theory: the bounce (lattice) diagram from the telegrapher's equations and the termination
 * rules, values from shared/reference/lines-and-terminations.md §2 and §4.
 */
class PhysicsThroughNgspiceTests {
    private static final double SWING = 3.3;
    /** Tolerance: 0.5 % of the swing (the lattice-diagram tolerance the project uses). */
    private static final double TOL = 0.005 * SWING;

    @TempDir
    Path out;

    @BeforeEach
    void needsNgspice() {
        Ngspice.require();
    }

    private JsonNode checkOne(String resource) {
        CliRun run = CliRun.of("check", "--json", "--out", out.toString(), CliRun.resource(resource).toString());
        assertTrue(run.exitCode() == 0 || run.exitCode() == 1, () -> "exit " + run.exitCode() + "\n" + run.err() + run.out());
        List<JsonNode> records = run.records();
        assertEquals(1, records.size(), run.out());
        return records.get(0);
    }

    /** The receiver waveform of the record's raw file, sampled at time t. */
    private static double sampleAt(JsonNode record, String node, double t) {
        Path raw = PointRunner.rawFileOf(Path.of(record.get("deck").asText()));
        RawPlot plot = RawFileReader.read(raw).get(0);
        double[] time = plot.column("time").orElseThrow();
        double[] v = plot.column("v(" + node + ")").orElseThrow();
        for (int i = 1; i < time.length; i++) {
            if (time[i] >= t) {
                return v[i - 1] + (v[i] - v[i - 1]) * (t - time[i - 1]) / (time[i] - time[i - 1]);
            }
        }
        throw new AssertionError("time " + t + " beyond the raw file");
    }

    @Test
    void openLineDrivenThrough15OhmsFollowsTheBounceDiagram() {
        JsonNode r = checkOne("physics/bounce-15ohm-open.yaml");
        JsonNode rise = r.get("receivers").get(0).get("rise");
        // lines-and-terminations.md §2 example 1: first far-end plateau 2·3.3·50/65 = 5.07692 V.
        assertEquals(5.07692, rise.get("v_max").asDouble(), TOL);
        assertEquals(5.07692 - 3.3, rise.get("overshoot_v").asDouble(), TOL);
        // The ringing decays to the DC level, the source voltage (open load): 3.3 V.
        assertEquals(3.3, rise.get("v_final").asDouble(), TOL);
        // Plateaus between arrivals: far end holds Vfar(n) on ((2n+1)TD, (2n+3)TD) after the
        // edge reaches the line; probe mid-plateau (2n+2)·TD after the ramp's midpoint.
        double t50 = firstEdge50(r);
        String node = nodeOf(r);
        double[] far = {5.07692, 2.34320, 3.81520, 3.02258, 3.44937, 3.21957}; // §2 example 1, far-end column
        for (int n = 0; n < far.length; n++) {
            double t = t50 + (2 * n + 2) * 1e-9;
            assertEquals(far[n], sampleAt(r, node, t), TOL, "far-end plateau " + n + " at " + t);
        }
        // Ringback: the lowest point after the first peak is the second plateau, 2.34320 V (§2 example 1),
        // so the margin above VIH = 2.0 V is 0.34320 V and VIH is crossed once.
        assertEquals(2.34320 - 2.0, rise.get("ringback_margin_v").asDouble(), TOL);
        assertEquals(1, rise.get("crossings").asInt());
    }

    @Test
    void matchedSeriesTerminationReachesTheRailWithoutOvershoot() {
        JsonNode r = checkOne("physics/matched-series.yaml");
        JsonNode rise = r.get("receivers").get(0).get("rise");
        // lines-and-terminations.md §2 example 2: Rs = Z0 gives a far-end plateau at the rail, 3.3 V.
        assertEquals(3.3, rise.get("v_final").asDouble(), TOL);
        assertEquals(3.3, rise.get("v_max").asDouble(), 0.03 * SWING); // overshoot under 3 % of the swing (issue acceptance)
        assertTrue(rise.get("overshoot_v").asDouble() < 0.03 * SWING, rise.toString());
        assertEquals(1, rise.get("crossings").asInt());
        assertTrue(rise.get("monotonic").asBoolean());
        assertEquals("pass", r.get("verdict").asText(), r.toString());
    }

    @Test
    void parallelTerminationToVttSettlesAtTheResistiveDivider() {
        JsonNode r = checkOne("physics/parallel-vtt.yaml");
        JsonNode rx = r.get("receivers").get(0);
        // lines-and-terminations.md §2 "final value = DC divider": (3.3·50 + 1.65·15)/65 = 2.91923 V high,
        // (0·50 + 1.65·15)/65 = 0.38077 V low.
        assertEquals(2.91923, rx.get("rise").get("v_final").asDouble(), TOL);
        assertEquals(0.38077, rx.get("fall").get("v_final").asDouble(), TOL);
        // Matched far end (R = Z0): no reflection, so the first arrival is already the final level (§2, ΓL = 0).
        assertEquals(2.91923, rx.get("rise").get("v_max").asDouble(), TOL);
    }

    @Test
    void pointWhoseFirstRunStallsIsRetriedWithConservativeOptions() {
        JsonNode r = checkOne("physics/stall-retry.yaml");
        assertTrue(!r.get("verdict").asText().equals("error"), r.toString());
        assertTrue(r.get("warnings").toString().contains("retried with conservative options"), r.toString());
        assertTrue(r.get("deck").asText().endsWith("-conservative.cir"), r.toString());
        // Rs = 15 + 35 = Z0 (lines-and-terminations.md §2 example 2): the far end settles at the rail.
        assertEquals(3.3, r.get("receivers").get(0).get("rise").get("v_final").asDouble(), TOL);
    }

    private static double firstEdge50(JsonNode record) {
        // The deck's header names the schedule; the rise edge's source 50 % point is the record's
        // settle reference: settle_s + the settling instant is not recoverable, so we read the
        // driver-pin waveform instead: the near end first reaches the launch level Vi at t50.
        Path raw = PointRunner.rawFileOf(Path.of(record.get("deck").asText()));
        RawPlot plot = RawFileReader.read(raw).get(0);
        double[] time = plot.column("time").orElseThrow();
        double[] v = plot.column("v(" + driverNodeOf(plot) + ")").orElseThrow();
        // Launch voltage Vi = 3.3·50/65 = 2.53846 V (§2 example 1); its half is crossed at the ramp's midpoint.
        double half = 2.53846 / 2;
        for (int i = 1; i < time.length; i++) {
            if (v[i - 1] < half && v[i] >= half) {
                return time[i - 1] + (half - v[i - 1]) * (time[i] - time[i - 1]) / (v[i] - v[i - 1]);
            }
        }
        throw new AssertionError("no rising edge at the driver");
    }

    private static String nodeOf(JsonNode record) {
        Path raw = PointRunner.rawFileOf(Path.of(record.get("deck").asText()));
        RawPlot plot = RawFileReader.read(raw).get(0);
        return plot.variables().stream().filter(n -> n.startsWith("v(u2")).findFirst()
                .map(n -> n.substring(2, n.length() - 1)).orElseThrow();
    }

    private static String driverNodeOf(RawPlot plot) {
        return plot.variables().stream().filter(n -> n.startsWith("v(u1")).findFirst()
                .map(n -> n.substring(2, n.length() - 1)).orElseThrow();
    }
}
