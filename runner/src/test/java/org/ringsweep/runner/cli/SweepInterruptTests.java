package org.ringsweep.runner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.testing.Ngspice;

/** Ctrl-C (SIGINT/SIGTERM) during a sweep: it stops, ends its simulations and keeps what finished. */
class SweepInterruptTests {
    @TempDir
    Path work;

    private static int rows(Path db, String where) throws Exception {
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + db);
             Statement s = c.createStatement();
             ResultSet rs = s.executeQuery("SELECT COUNT(*) FROM points" + where)) {
            return rs.next() ? rs.getInt(1) : 0;
        } catch (java.sql.SQLException e) {
            return 0;
        }
    }

    @Test
    void interruptedSweepKeepsFinishedPointsLeavesNoSimulatorAndResumes() throws Exception {
        Ngspice.require();
        Path out = work.resolve("out");
        Path db = out.resolve("results.sqlite");
        String sweep = CliRun.resource("sweeps/p2p-grid.yaml").toString();
        Process p = new ProcessBuilder(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-cp", System.getProperty("java.class.path"), Main.class.getName(),
                "sweep", sweep, "--out", out.toString(), "--jobs", "2", "--quiet")
                .redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (rows(db, "") < 10 && p.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(50);
        }
        assertTrue(p.isAlive(), "finished before it could be interrupted");
        List<ProcessHandle> simulators = p.descendants().toList();
        p.destroy(); // SIGTERM: the JVM runs its shutdown hooks, as on Ctrl-C
        assertTrue(p.waitFor(30, TimeUnit.SECONDS), "the sweep did not stop");
        Thread.sleep(200);
        for (ProcessHandle h : simulators) {
            assertTrue(!h.isAlive(), "a simulator survived the interrupt: " + h.info().command().orElse("?"));
        }
        int kept = rows(db, "");
        assertTrue(kept >= 10 && kept < 80, "finished points kept: " + kept);
        // Points cut short are not stored as errors: a resumed sweep runs them.
        assertEquals(0, rows(db, " WHERE verdict = 'error'"));
        CliRun resumed = CliRun.of("sweep", sweep, "--out", out.toString(), "--resume", "--quiet");
        assertTrue(resumed.exitCode() <= ExitCodes.VIOLATION, resumed.err());
        assertEquals(80, rows(db, ""));
        assertTrue(Files.exists(out.resolve("results.jsonl")));
    }
}
