package org.ringsweep.runner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.plugins.TestPluginJars;
import org.ringsweep.runner.testing.Ngspice;

/** --plugins through the command line: load errors, and plugins that throw during a batch. */
class CliPluginTests {
    @TempDir
    Path dir;

    private Path net(String name, String driverModel) throws Exception {
        Path file = dir.resolve(name + ".yaml");
        Files.writeString(file, "format: ringsweep/net-1\nnet: " + name + "\nrails: { VCC: 3.3 }\n"
                + "drivers:\n  - { pin: U1.1, model: " + driverModel + ", v_high: VCC, rise: 1ns, r_out: 50 }\n"
                + "receivers:\n  - { pin: U2.1, model: cmos, c_in: 1pF, vih: 2.0, vil: 0.8 }\n"
                + "segments:\n  - { from: U1.1, to: U2.1, z0: 50, delay: 1ns }\n");
        return file;
    }

    @Test
    void aPluginModelThatThrowsMakesItsPointAnErrorNamingThePluginAndTheOtherNetsRun() throws Exception {
        Ngspice.require();
        Path plugins = TestPluginJars.brokenDriver(dir.resolve("plugins"));
        CliRun run = CliRun.of("check", "--json", "--out", dir.resolve("out").toString(), "--plugins", plugins.toString(),
                net("BROKEN", "broken-io").toString(), net("FINE", "ramp").toString());
        assertEquals(ExitCodes.SIMULATION, run.exitCode(), run.err() + run.out());
        List<JsonNode> records = run.records();
        assertEquals(2, records.size(), run.out());
        assertEquals("error", records.get(0).get("verdict").asText());
        String error = records.get(0).get("error").asText();
        assertTrue(error.contains("plugin `test-broken-driver` 0.0.1") && error.contains("driver model `broken-io` (elaborate)")
                && error.endsWith("(net BROKEN, point typ)"), error);
        // A 50 ohm source into a matched 50 ohm line and a 1 pF load: no overshoot, passes (lines-and-terminations.md §2 ex. 2).
        assertEquals("pass", records.get(1).get("verdict").asText(), records.get(1).toString());
        assertTrue(run.err().contains("ringsweep: loaded plugin `test-broken-driver` 0.0.1 ("), run.err());
    }

    @Test
    void aPluginCheckThatThrowsMakesEachPointAnErrorNamingThePluginAndThePoint() throws Exception {
        Ngspice.require();
        Path plugins = TestPluginJars.brokenCheck(dir.resolve("plugins"));
        CliRun run = CliRun.of("check", "--json", "--quiet", "--out", dir.resolve("out").toString(), "--plugins", plugins.toString(),
                net("FINE", "ramp").toString());
        assertEquals(ExitCodes.SIMULATION, run.exitCode(), run.err() + run.out());
        JsonNode r = run.records().get(0);
        assertEquals("error", r.get("verdict").asText());
        String error = r.get("error").asText();
        assertTrue(error.contains("plugin `test-broken-check` 0.0.2") && error.contains("check `broken-check`")
                && error.contains("java.lang.ArithmeticException: division by zero") && error.endsWith("(net FINE, point typ)"), error);
        assertTrue(Files.exists(Path.of(r.get("deck").asText())), "the deck of the point was written");
        assertTrue(run.err().isEmpty(), "--quiet keeps the load log off stderr: " + run.err());
    }

    @Test
    void aPluginBuiltForAnotherApiVersionStopsTheRunWithExit2NamingIt() throws Exception {
        Path plugins = TestPluginJars.future(dir.resolve("plugins"));
        CliRun run = CliRun.of("check", "--out", dir.resolve("out").toString(), "--plugins", plugins.toString(), net("FINE", "ramp").toString());
        assertEquals(ExitCodes.INPUT, run.exitCode(), run.err());
        assertTrue(run.err().contains("ringsweep: plugin `test-future` 9.0 (") && run.err().contains("plugin API version 2")
                && run.err().contains("provides version 1"), run.err());
    }

    @Test
    void modelsListsPluginModelsAndChecksWithTheirOrigin() throws Exception {
        Path plugins = TestPluginJars.brokenDriver(dir.resolve("plugins"));
        TestPluginJars.brokenCheck(plugins);
        CliRun run = CliRun.of("models", "--plugins", plugins.toString());
        assertEquals(ExitCodes.OK, run.exitCode(), run.err());
        assertTrue(run.out().contains("driver ramp (built-in)"), run.out());
        assertTrue(run.out().contains("driver broken-io (plugin `test-broken-driver` 0.0.1 ("), run.out());
        assertTrue(run.out().contains("check broken-check (plugin `test-broken-check` 0.0.2 (") && run.out().contains("limit key broken_max"),
                run.out());
    }
}
