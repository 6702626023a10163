package org.ringsweep.runner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.batch.Verification;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.testing.Ngspice;

/** {@code sweep --engine builtin --verify P%}: the built-in engine checked against ngspice. */
class SweepVerifyTests {
    @TempDir
    Path out;

    @Test
    void builtInSweepVerifiedAgainstNgspiceAgreesWithinTolerance() {
        Ngspice.require();
        CliRun run = CliRun.of("sweep", CliRun.resource("sweeps/p2p-small.yaml").toString(), "--engine", "builtin",
                "--verify", "100%", "--out", out.toString(), "--no-report");
        assertTrue(run.exitCode() <= ExitCodes.VIOLATION, run.err() + run.out());
        assertTrue(run.out().contains("Verification against ngspice: 6 point(s)"), run.out());
        // The built-in engine is held to 1 % of the swing and 10 ps + 1 % against ngspice (issue 4's tolerance).
        assertFalse(run.out().contains("BEYOND TOLERANCE"), run.out());
        assertFalse(run.out().contains("FLAGGED"), run.out());
    }

    private static ResultRecord record(double vMax, double delay, int crossings) {
        Map<String, Object> rise = new LinkedHashMap<>();
        rise.put("v_max", vMax);
        rise.put("v_min", 0.0);
        rise.put("delay_s", delay);
        rise.put("crossings", crossings);
        Map<String, EdgeResult> edges = Map.of("rise", new EdgeResult(rise));
        return new ResultRecord("N", "typ", Map.of(), "x", "1", Verdict.PASS,
                List.of(new ReceiverResult("U2.1", Verdict.PASS, edges, List.of())), "d.cir", "", "n.yaml", "h", List.of(), List.of());
    }

    @Test
    void differencesBeyondTheToleranceAreFlaggedAndWithinAreNot() {
        Map<String, Verification.Worst> worst = new LinkedHashMap<>();
        // Hand-chosen values: 1 % of a 3.3 V swing is 33 mV; 10 ps + 1 % of 1 ns is 20 ps.
        assertTrue(Verification.compare(record(3.50, 1.000e-9, 1), record(3.48, 1.015e-9, 1), 3.3, worst).isEmpty());
        List<String> beyond = Verification.compare(record(3.50, 1.000e-9, 2), record(3.45, 1.030e-9, 1), 3.3, worst);
        assertEquals(3, beyond.size(), beyond.toString());
        assertTrue(worst.get("v_max_v").beyondTolerance());
        assertEquals(0.05, worst.get("v_max_v").difference(), 1e-12);
    }
}
