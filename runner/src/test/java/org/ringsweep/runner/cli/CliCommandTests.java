package org.ringsweep.runner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.File;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.testing.Ngspice;

/** The commands' contract (formats.md "Commands" and "Results"): outputs, files and exit codes. */
class CliCommandTests {
    @TempDir
    Path out;

    private static String net(String name) {
        return CliRun.resource("physics/" + name).toString();
    }

    @Test
    void jsonRecordCarriesTheFieldsOfTheResultContract() {
        Ngspice.require();
        CliRun run = CliRun.of("check", "--json", "--out", out.toString(), net("matched-series.yaml"));
        assertEquals(ExitCodes.OK, run.exitCode(), run.err());
        List<JsonNode> records = run.records();
        assertEquals(1, records.size());
        JsonNode r = records.get(0);
        assertEquals("ringsweep/result-1", r.get("format").asText());
        assertEquals("MATCHED_SERIES", r.get("net").asText());
        assertEquals("typ", r.get("corner").asText());
        assertTrue(r.get("point").isObject());
        assertEquals("ngspice", r.get("engine").get("name").asText());
        assertTrue(r.get("engine").get("version").asText().matches("\\d+(\\.\\d+)*"), r.toString());
        assertEquals("pass", r.get("verdict").asText());
        JsonNode rx = r.get("receivers").get(0);
        assertEquals("U2.1", rx.get("pin").asText());
        for (String key : List.of("v_max", "v_min", "v_final", "overshoot_v", "ringback_margin_v", "settle_s", "delay_s",
                "crossings", "monotonic", "slew_v_per_s")) {
            assertTrue(rx.get("rise").has(key), "rise." + key);
        }
        assertTrue(rx.get("fall").has("undershoot_v"));
        assertTrue(rx.get("violations").isArray());
        assertTrue(Files.exists(Path.of(r.get("deck").asText())), "deck path in the record exists");
        // The same record goes to results.jsonl under --out.
        assertTrue(Files.exists(out.resolve("results.jsonl")));
    }

    @Test
    void failingNetExitsOneAndListsTheViolationInWordsWithoutColour() {
        Ngspice.require();
        CliRun run = CliRun.of("check", "--out", out.toString(), net("bounce-15ohm-open.yaml"));
        assertEquals(ExitCodes.VIOLATION, run.exitCode(), run.err() + run.out());
        assertTrue(run.out().contains("FAIL <<"), run.out());
        assertTrue(run.out().contains("overshoots the high rail"), run.out());
        assertFalse(run.out().contains("\u001b["), "no ANSI colour codes");
        assertTrue(run.out().contains("Caution"), "the caution is printed");
    }

    @Test
    void deckCommandWritesDecksOnlyUnderTheOutputFolder() throws Exception {
        CliRun run = CliRun.of("deck", "--out", out.toString(), net("parallel-vtt.yaml"));
        assertEquals(ExitCodes.OK, run.exitCode(), run.err());
        Path deck = Path.of(run.out().strip());
        assertTrue(deck.startsWith(out) && Files.exists(deck), run.out());
        assertFalse(Files.exists(out.resolve("results.jsonl")), "nothing simulated");
        try (var s = Files.walk(out)) {
            assertEquals(1, s.filter(Files::isRegularFile).count(), "only the deck");
        }
    }

    @Test
    void setOverridesAValueInTheDeck() throws Exception {
        CliRun run = CliRun.of("deck", "--out", out.toString(), "--set", "R1/value=4k7", net("matched-series.yaml"));
        assertEquals(ExitCodes.OK, run.exitCode(), run.err());
        String deck = Files.readString(Path.of(run.out().strip()));
        // IEC 60062: 4k7 = 4700 ohm; decks carry plain numbers only (ngspice would read 4k7 as 4000, ngspice.md §6).
        assertTrue(deck.contains(" 4.7e+03"), deck);
    }

    @Test
    void modelsListsTheBuiltInModelsWithUnits() {
        CliRun run = CliRun.of("models");
        assertEquals(ExitCodes.OK, run.exitCode());
        assertTrue(run.out().contains("driver ramp"), run.out());
        assertTrue(run.out().contains("receiver cmos"), run.out());
        assertTrue(run.out().contains("r_out") && run.out().contains("ohm"), run.out());
    }

    private Process childWithoutNgspice(String... args) throws Exception {
        List<String> cmd = new java.util.ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-cp", System.getProperty("java.class.path"), Main.class.getName()));
        cmd.addAll(List.of(args));
        ProcessBuilder pb = new ProcessBuilder(cmd);
        pb.environment().put("PATH", out.toString());
        pb.environment().remove("RINGSWEEP_NGSPICE");
        pb.redirectErrorStream(true);
        pb.redirectOutput(out.resolve("log.txt").toFile());
        Process p = pb.start();
        assertTrue(p.waitFor(120, TimeUnit.SECONDS));
        return p;
    }

    @Test
    void ngspiceAskedForButMissingExitsThreeWithAHint() throws Exception {
        Process p = childWithoutNgspice("check", "--engine", "ngspice", "--out", out.toString(), net("matched-series.yaml"));
        String text = Files.readString(out.resolve("log.txt"));
        assertEquals(ExitCodes.SIMULATION, p.exitValue(), text);
        assertTrue(text.contains("ngspice"), text);
    }

    @Test
    void withoutNgspiceAutoRunsTheBuiltInEngine() throws Exception {
        Process p = childWithoutNgspice("check", "--json", "--out", out.toString(), net("matched-series.yaml"));
        String text = Files.readString(out.resolve("log.txt"));
        assertEquals(ExitCodes.OK, p.exitValue(), text);
        JsonNode r = new com.fasterxml.jackson.databind.ObjectMapper().readTree(
                text.lines().filter(l -> l.startsWith("{")).findFirst().orElseThrow());
        assertEquals("builtin", r.get("engine").get("name").asText());
        // lines-and-terminations.md §2 example 2: r_out + R = Z0 reaches the 3.3 V rail without overshoot.
        assertEquals(3.3, r.get("receivers").get(0).get("rise").get("v_final").asDouble(), 0.005 * 3.3);
        assertTrue(r.get("receivers").get(0).get("rise").get("overshoot_v").asDouble() < 0.03 * 3.3);
    }
}
