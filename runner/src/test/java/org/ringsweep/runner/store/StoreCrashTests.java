package org.ringsweep.runner.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.DisabledOnOs;
import org.junit.jupiter.api.condition.OS;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.results.ResultJson;
import org.ringsweep.runner.results.ResultRecord;

/** A writer killed with SIGKILL mid-sweep leaves every committed point intact and nothing partial. */
@DisabledOnOs(OS.WINDOWS)
class StoreCrashTests {
    /** Points the parent waits to see committed before it kills the writer. */
    private static final int SEEN_BEFORE_KILL = 150;

    @TempDir
    Path out;

    @Test
    void killingTheWriterKeepsEveryCommittedPointAndNoPartialOne() throws Exception {
        String java = ProcessHandle.current().info().command().orElseThrow();
        Process jvm = new ProcessBuilder(java, "-cp", System.getProperty("java.class.path"),
                StoreWriterProbe.class.getName(), out.toString())
                .redirectError(ProcessBuilder.Redirect.DISCARD).start();
        int lastSeen = -1;
        try (BufferedReader lines = new BufferedReader(new InputStreamReader(jvm.getInputStream(), StandardCharsets.UTF_8))) {
            String line;
            while (lastSeen + 1 < SEEN_BEFORE_KILL && (line = lines.readLine()) != null) {
                lastSeen = Integer.parseInt(line.trim());
            }
            jvm.destroyForcibly(); // SIGKILL: no shutdown hook, no close, the WAL is left as it is
            assertTrue(jvm.waitFor(20, TimeUnit.SECONDS), "the writer JVM did not die");
        } finally {
            jvm.destroyForcibly();
        }
        assertEquals(SEEN_BEFORE_KILL - 1, lastSeen, "the writer stopped before committing enough points");
        assertTrue(Files.exists(out.resolve(ResultStore.FILE_NAME + "-wal")), "the killed writer left no write-ahead log");

        // SQLite's own consistency check (sqlite.org/pragma.html#pragma_integrity_check answers "ok").
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + out.resolve(ResultStore.FILE_NAME));
             Statement s = c.createStatement(); ResultSet rs = s.executeQuery("PRAGMA integrity_check")) {
            assertTrue(rs.next());
            assertEquals("ok", rs.getString(1));
        }
        try (ResultStore store = ResultStore.open(out)) {
            List<String> lines = store.recordLines();
            // Every point whose commit the parent saw is there; a few more may have been committed
            // after the last line the parent read, but each one whole, in order, none twice.
            assertTrue(lines.size() >= SEEN_BEFORE_KILL, "only " + lines.size() + " of " + SEEN_BEFORE_KILL + " committed points");
            for (int i = 0; i < lines.size(); i++) {
                ResultRecord expected = Records.numbered(i);
                assertEquals(ResultJson.line(expected), lines.get(i), "point " + i);
                assertTrue(store.has(Records.HASH_A, PointKey.of(expected)));
            }
            assertEquals(lines.size(), store.finishedKeys(Records.HASH_A).size());
            ResultRecord next = Records.numbered(lines.size());
            store.put(next, PointKey.of(next)); // a resumed run goes on writing
            assertEquals(lines.size() + 1, store.recordLines().size());
        }
    }
}
