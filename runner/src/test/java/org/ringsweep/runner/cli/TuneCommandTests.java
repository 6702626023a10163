package org.ringsweep.runner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.testing.Ngspice;

/** {@code ringsweep tune}: the recommendation, its record and its exit codes. */
class TuneCommandTests {
    @TempDir
    Path out;

    private static String net() {
        return CliRun.resource("tune/p2p-15ohm.yaml").toString();
    }

    @Test
    void seriesResistorForA15OhmDriverOnA50OhmLineIsTheE24ValueBesideZ0MinusROut() throws Exception {
        Ngspice.require();
        CliRun run = CliRun.of("tune", net(), "--vary", "R1/value", "--series", "E24", "--from", "10", "--to", "100",
                "--json", "--out", out.toString());
        assertEquals(ExitCodes.OK, run.exitCode(), run.err() + run.out());
        JsonNode r = new com.fasterxml.jackson.databind.ObjectMapper().readTree(run.out().strip());
        assertEquals("ringsweep/tune-1", r.get("format").asText());
        assertEquals("R1/value", r.get("target").asText());
        // Series termination rule R = Z0 − r_out = 50 − 15 = 35 ohm (Johnson & Graham, High-Speed
        // Digital Design, 1993, ch. 6); the E24 values beside it are 33 and 36 (IEC 60063).
        double recommended = r.get("recommended").asDouble();
        assertTrue(recommended == 33.0 || recommended == 36.0, "recommended " + recommended);
        // Fewer simulations than candidates (25 E24 values from 10 to 100 inclusive, IEC 60063).
        assertEquals(25, r.get("candidates").asInt());
        assertTrue(r.get("evaluated").size() < 25, r.toString());
        assertTrue(r.get("margins").has("overshoot_max"), r.toString());
        // typ at the value and at both 5 % ends (the E24 series' usual tolerance).
        assertEquals(3, r.get("checks").size(), r.toString());
    }

    @Test
    void rangeWhereNothingPassesNamesTheLimitThatFailsEverywhere() throws Exception {
        Ngspice.require();
        CliRun run = CliRun.of("tune", net(), "--vary", "R1/value", "--series", "E12", "--from", "1", "--to", "4.7",
                "--json", "--out", out.toString());
        assertEquals(ExitCodes.VIOLATION, run.exitCode(), run.err() + run.out());
        JsonNode r = new com.fasterxml.jackson.databind.ObjectMapper().readTree(run.out().strip());
        assertTrue(r.get("recommended").isNull(), r.toString());
        // 15 + 4.7 ohm into 50 ohm still overshoots by about 3.3·2·50/69.7 − 3.3 = 1.43 V
        // (lattice first arrival, lines-and-terminations.md §2), beyond the 0.3 V default limit.
        List<String> failing = new java.util.ArrayList<>();
        r.get("failing_everywhere").forEach(n -> failing.add(n.asText()));
        assertTrue(failing.contains("overshoot_max"), failing.toString());
    }

    @Test
    void unknownSeriesIsAUsageError() {
        CliRun run = CliRun.of("tune", net(), "--vary", "R1/value", "--series", "E25", "--from", "10", "--to", "100");
        assertEquals(ExitCodes.INPUT, run.exitCode());
        assertTrue(run.err().contains("E25"), run.err());
    }
}
