package org.ringsweep.examples;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.ringsweep.runner.cli.Main;
import org.ringsweep.runner.testing.Ngspice;

/**
 * The example plugin ({@code examples/acme-driver-plugin}) loaded from its own jar with
 * {@code --plugins DIR}, as a user would, and simulated through ngspice. It is not on this
 * module's test class path (see the pom), so only {@code --plugins} can find it.
 */
class AcmePluginTests {
    private static final double SWING = 3.3;
    /** 0.5 % of the swing: the lattice-diagram tolerance the project uses (PhysicsThroughNgspiceTests). */
    private static final double TOL = 0.005 * SWING;

    @TempDir
    Path dir;

    private record Run(int code, String out, String err) {
        List<JsonNode> records() throws Exception {
            List<JsonNode> list = new ArrayList<>();
            for (String line : out.split("\n")) {
                if (line.startsWith("{")) {
                    list.add(new ObjectMapper().readTree(line));
                }
            }
            return list;
        }
    }

    private static Run main(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }

    /** An acme-io driver into an open 50 ohm, 1 ns line (c_in 0: the ideal open end of the textbook case). */
    private Path openLine(String drive, String slew) throws Exception {
        Path file = dir.resolve("acme-" + drive + "-" + slew + ".yaml");
        Files.writeString(file, "format: ringsweep/net-1\n"
                + "net: ACME_" + drive + "_" + slew + "\n"
                + "rails: { VCC: 3.3 }\n"
                + "drivers:\n"
                + "  - { pin: U1.1, model: acme-io, v_high: VCC, drive: " + drive + ", slew: " + slew + " }\n"
                + "receivers:\n"
                + "  - { pin: U2.1, model: cmos, c_in: 0, vih: 2.0, vil: 0.8 }\n"
                + "segments:\n"
                + "  - { from: U1.1, to: U2.1, z0: 50, delay: 1ns }\n"
                + "stimulus: { edges: [rise, fall], settle: 40ns }\n"
                + "simulation: { step: 5ps }\n");
        return file;
    }

    private JsonNode checkOne(Path net) throws Exception {
        Run run = main("check", "--json", "--out", dir.resolve("out").toString(), "--plugins", AcmePluginFolder.create(dir).toString(),
                net.toString());
        assertTrue(run.code() == 0 || run.code() == 1, () -> "exit " + run.code() + "\n" + run.err() + run.out());
        assertTrue(run.err().contains("ringsweep: loaded plugin `acme-instruments`"), run.err());
        List<JsonNode> records = run.records();
        assertEquals(1, records.size(), run.out());
        return records.get(0);
    }

    private static List<String> violations(JsonNode record, String limit) {
        List<String> edges = new ArrayList<>();
        for (JsonNode v : record.get("receivers").get(0).get("violations")) {
            if (v.get("limit").asText().equals(limit)) {
                edges.add(v.get("edge").asText());
            }
        }
        return edges;
    }

    @ParameterizedTest(name = "drive {0}: {1} ohm")
    @CsvSource({"4mA, 50", "8mA, 28", "12mA, 18"})
    void eachDriveStrengthGivesTheBounceDiagramsFirstFarEndPlateau(String drive, double ohms) throws Exception {
        Ngspice.require();
        JsonNode rise = checkOne(openLine(drive, "fast")).get("receivers").get(0).get("rise");
        // lines-and-terminations.md §2: launched Vi = Vs·Z0/(Rs + Z0), open end doubles it (ΓL = +1), so the
        // first far-end plateau is 2·Vs·Z0/(Rs + Z0); the fast ramp (1 ns full) is shorter than 2·TD, so it is reached.
        // Rs from the plugin's documented (invented) drive table.
        double plateau = 2 * SWING * 50 / (ohms + 50);
        assertEquals(plateau, rise.get("v_max").asDouble(), TOL, "first far-end plateau for " + drive);
        // Open load: the DC level is the source voltage (§2, final value).
        assertEquals(SWING, rise.get("v_final").asDouble(), TOL);
    }

    @Test
    void slowSlewFailsTheAcmeTransitionCheckByTheRampArithmetic() throws Exception {
        Ngspice.require();
        JsonNode slow = checkOne(openLine("4mA", "slow"));
        // 4mA is 50 ohm = Z0: Γs = 0, so the open far end sees exactly the doubled launched ramp, 0 to 3.3 V
        // over the full ramp 2.5 ns / 0.8 = 3.125 ns, with no re-reflection (lines-and-terminations.md §2 ex. 2).
        // VIL 0.8 V to VIH 2.0 V on that straight line takes (2.0 - 0.8)/3.3 · 3.125 ns = 1.13636 ns > the 1 ns rule.
        double expected = (2.0 - 0.8) / SWING * 3.125e-9;
        assertEquals("fail", slow.get("verdict").asText(), slow.toString());
        assertEquals(List.of("rise", "fall"), violations(slow, "acme_transition_max"), slow.toString());
        for (JsonNode v : slow.get("receivers").get(0).get("violations")) {
            if (v.get("limit").asText().equals("acme_transition_max")) {
                // 1 % of the value: linear interpolation between 5 ps samples of a straight line.
                assertEquals(expected, v.get("measured").asDouble(), 0.01 * expected, v.toString());
                assertEquals(1e-9, v.get("value").asDouble(), 1e-15);
            }
        }
        // The same net with the fast setting: (1.2/3.3) · 1.0 ns = 0.364 ns, inside the rule, and no overshoot
        // (the matched source gives a flat 3.3 V plateau, §2 ex. 2): the point passes.
        JsonNode fast = checkOne(openLine("4mA", "fast"));
        assertTrue(violations(fast, "acme_transition_max").isEmpty(), fast.toString());
        assertEquals("pass", fast.get("verdict").asText(), fast.toString());
    }

    @Test
    void modelsListsTheAcmeDriverWithUnitsDefaultsAndItsJar() {
        Path plugins = AcmePluginFolder.create(dir);
        Run run = main("models", "--plugins", plugins.toString());
        assertEquals(0, run.code(), run.err());
        Path jar = plugins.resolve("acme-driver-plugin.jar");
        assertTrue(run.out().contains("driver acme-io (plugin `acme-instruments` "), run.out());
        assertTrue(run.out().contains(jar.toString()), run.out());
        assertTrue(run.out().matches("(?s).*\\n    drive\\s+12mA\\|4mA\\|8mA\\s+default 8mA\\s.*"), run.out());
        assertTrue(run.out().matches("(?s).*\\n    slew\\s+fast\\|slow\\s+default fast\\s.*"), run.out());
        assertTrue(run.out().contains("check acme-input-transition (plugin `acme-instruments`"), run.out());
        assertTrue(run.out().contains("driver ramp (built-in)"), run.out());
        assertFalse(run.out().contains("version unknown"), run.out());
    }

    @Test
    void withoutPluginsTheAcmeModelIsAnInputErrorListingTheKnownModels() throws Exception {
        Run run = main("check", "--out", dir.resolve("out").toString(), openLine("8mA", "fast").toString());
        assertEquals(2, run.code(), run.err());
        assertTrue(run.err().contains("acme-io") && run.err().contains("ramp"), run.err());
    }
}
