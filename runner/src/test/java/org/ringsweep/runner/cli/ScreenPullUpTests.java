package org.ringsweep.runner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/** {@code screen} on an open-drain net reports the I²C pull-up window. */
class ScreenPullUpTests {
    @Test
    void openDrainNetGetsItsPullUpWindow() {
        Path net = Path.of("..", "examples", "demo-board", "nets", "i2c-sensor-sda.yaml");
        CliRun run = CliRun.of("screen", "--json", net.toString());
        assertEquals(ExitCodes.OK, run.exitCode(), run.err());
        JsonNode r = run.records().get(0);
        assertTrue(r.get("pull_up").isArray(), r.toString());
        // UM10204 §7.1 Eq. 2 (lines-and-terminations.md §7): R_p(min) = (3.3 V − 0.4 V) / 3 mA = 966.7 Ω for Fast-mode.
        assertTrue(r.get("pull_up").toString().contains("966.7"), r.toString());
        assertTrue(r.get("pull_up").toString().contains("Fast-mode"), r.toString());
    }
}
