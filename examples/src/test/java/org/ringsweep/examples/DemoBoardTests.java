package org.ringsweep.examples;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.cli.Main;
import org.ringsweep.runner.testing.Ngspice;

/** The demo board through {@code ringsweep demo}: the README's first command. */
class DemoBoardTests {
    private static final Path BOARD = Path.of("demo-board", "nets");

    @TempDir
    static Path out;
    private static List<JsonNode> records;
    private static final StringWriter STDOUT = new StringWriter();

    /** Runs the demo once for all tests of this class. */
    private static synchronized List<JsonNode> runDemo(StringWriter ignored) throws Exception {
        if (records == null) {
            records = runDemoOnce(STDOUT);
        }
        return records;
    }

    private static List<JsonNode> runDemoOnce(StringWriter stdout) throws Exception {
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"demo", "--board", BOARD.toString(), "--out", out.toString()},
                new PrintWriter(stdout), new PrintWriter(err));
        assertEquals(0, code, () -> stdout + "\n" + err);
        List<JsonNode> list = new ArrayList<>();
        ObjectMapper json = new ObjectMapper();
        for (String line : Files.readAllLines(out.resolve("results.jsonl"))) {
            list.add(json.readTree(line));
        }
        return list;
    }

    @Test
    void demoRunsEveryNetAndCornerAndOnlyTheUnterminatedSyncNetFails() throws Exception {
        Ngspice.require();
        List<JsonNode> records = runDemo(null);
        StringWriter stdout = STDOUT;
        // 7 nets; SPI0_SCK and SPI0_MOSI have two corners each besides typ: 7 + 2 + 2 points.
        assertEquals(11, records.size(), stdout.toString());
        for (JsonNode r : records) {
            String expected = r.get("net").asText().equals("SYNC_OUT_REVA") ? "fail" : "pass";
            assertEquals(expected, r.get("verdict").asText(), r.toString());
        }
        assertTrue(stdout.toString().contains("Demo results are under"), stdout.toString());
        assertTrue(stdout.toString().contains("Caution"), "the caution is printed");
    }

    @Test
    void unterminatedSyncNetOvershootsAsTheLatticeDiagramPredicts() throws Exception {
        Ngspice.require();
        JsonNode reva = runDemo(null).stream()
                .filter(r -> r.get("net").asText().equals("SYNC_OUT_REVA")).findFirst().orElseThrow();
        JsonNode rise = reva.get("receivers").get(0).get("rise");
        // lines-and-terminations.md §2: far-end first arrival 2·Vs·Z0/(Rs + Z0) = 2·3.3·50/62 = 5.3226 V
        // (the ramp, 1.25 ns full, is shorter than the round trip 2·0.737 ns, so the plateau is reached);
        // the 5 pF input rounds the edge, hence a 0.1 V tolerance.
        assertEquals(5.3226 - 3.3, rise.get("overshoot_v").asDouble(), 0.1);
        boolean overshootViolated = false;
        for (JsonNode v : reva.get("receivers").get(0).get("violations")) {
            overshootViolated |= v.get("limit").asText().equals("overshoot_max");
        }
        assertTrue(overshootViolated, reva.toString());
    }

    @Test
    void seriesTerminationBySeriesRuleKeepsTheSyncNetWithinFivePercent() throws Exception {
        Ngspice.require();
        JsonNode revb = runDemo(null).stream()
                .filter(r -> r.get("net").asText().equals("SYNC_OUT_REVB")).findFirst().orElseThrow();
        JsonNode rise = revb.get("receivers").get(0).get("rise");
        // Series termination R = Z0 − r_out (Johnson & Graham ch. 6; lines-and-terminations.md §4):
        // 39 ohm + 12 ohm ≈ 50 ohm leaves only a small excursion; 5 % of the 3.3 V swing as a bound.
        assertTrue(rise.get("overshoot_v").asDouble() < 0.05 * 3.3, rise.toString());
        assertEquals(1, rise.get("crossings").asInt());
    }

    @Test
    void i2cDataLineRisesAsThePullUpChargesTheBusCapacitance() throws Exception {
        Ngspice.require();
        JsonNode sda = runDemo(null).stream()
                .filter(r -> r.get("net").asText().equals("I2C1_SDA")).findFirst().orElseThrow();
        assertEquals("pass", sda.get("verdict").asText(), sda.toString());
        // lines-and-terminations.md §7: 30–70 % rise = 0.8473·Rp·Cb. Cb = 2 × 6 pF inputs + 5 pF pin + the
        // 150 mm of 60 ohm line, TD/Z0 = (0.15 m · √3.4 / c) / 60 ohm = 15.38 pF (§1): 32.38 pF; with 4.7 kΩ
        // 128.9 ns. The line is far shorter than the rise (TD 0.92 ns, §3), so lumping it is fair; 3 % tolerance.
        double cb = 12e-12 + 5e-12 + 0.15 * Math.sqrt(3.4) / 299_792_458.0 / 60;
        double expected = Math.log(7.0 / 3.0) * 4700 * cb;
        for (JsonNode rx : sda.get("receivers")) {
            assertEquals(expected, rx.get("rise").get("rise_time_s").asDouble(), 0.03 * expected, rx.toString());
        }
        // lines-and-terminations.md §7: Fast-mode R_p(min) at 3.3 V is 966.7 Ω; R_p(max) = 300 ns / (0.8473 · Cb)
        String warnings = sda.get("warnings").toString();
        assertTrue(warnings.contains("R20 = 4.7 kΩ is inside the Fast-mode window [966.7 Ω, "), warnings);
    }

    @Test
    void builtInEngineGivesTheSameVerdictsAsNgspiceOnTheDemoBoard(@TempDir Path builtinOut) throws Exception {
        Ngspice.require();
        StringWriter stdout = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"demo", "--board", BOARD.toString(), "--out", builtinOut.toString(), "--engine", "builtin"},
                new PrintWriter(stdout), new PrintWriter(err));
        assertEquals(0, code, () -> stdout + "\n" + err);
        ObjectMapper json = new ObjectMapper();
        Map<String, JsonNode> reference = new java.util.HashMap<>();
        for (JsonNode r : runDemo(null)) {
            reference.put(r.get("net").asText() + "/" + r.get("corner").asText(), r);
        }
        for (String line : Files.readAllLines(builtinOut.resolve("results.jsonl"))) {
            JsonNode r = json.readTree(line);
            assertEquals("builtin", r.get("engine").get("name").asText());
            JsonNode ref = reference.get(r.get("net").asText() + "/" + r.get("corner").asText());
            assertEquals(ref.get("verdict").asText(), r.get("verdict").asText(), r.get("net").asText());
            // ngspice as the reference simulator: peaks within 1 % of the 3.3 V (or 1.8 V) swing.
            for (int i = 0; i < r.get("receivers").size(); i++) {
                double swing = r.get("net").asText().contains("1V8") ? 1.8 : 3.3;
                assertEquals(ref.get("receivers").get(i).get("rise").get("v_max").asDouble(),
                        r.get("receivers").get(i).get("rise").get("v_max").asDouble(), 0.01 * swing, r.get("net").asText());
                assertEquals(ref.get("receivers").get(i).get("fall").get("v_min").asDouble(),
                        r.get("receivers").get(i).get("fall").get("v_min").asDouble(), 0.01 * swing, r.get("net").asText());
            }
        }
    }
}
