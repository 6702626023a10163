package org.ringsweep.runner.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.results.ResultJson;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;

/** The store keeps what was committed, keyed by net file hash and point key. */
class ResultStoreTests {
    private static final ObjectMapper JSON = new ObjectMapper();

    @TempDir
    Path out;

    @Test
    void recordsReadBackAsTheSameJson() throws Exception {
        List<ResultRecord> records = List.of(Records.point("SPI0_SCK", Records.HASH_A, 22, 0.22, 0.31, 4.1e-9),
                Records.failing("SPI0_SCK", Records.HASH_A, 10, 0.45, Double.NaN), Records.error("SPI0_SCK", Records.HASH_A, 33));
        try (ResultStore store = ResultStore.open(out)) {
            for (ResultRecord r : records) {
                store.put(r, PointKey.of(r));
            }
            List<String> lines = store.recordLines();
            assertEquals(records.size(), lines.size());
            for (int i = 0; i < records.size(); i++) {
                // The stored record is the result-1 JSON of formats.md, whole: same tree as ResultJson writes.
                assertEquals(JSON.readTree(ResultJson.line(records.get(i))), JSON.readTree(lines.get(i)));
            }
            List<StoredRow> rows = store.rows();
            assertEquals(Map.of("R5/value", 10.0), rows.get(1).point());
            assertEquals(Verdict.FAIL, rows.get(1).verdict());
            assertEquals("ngspice: timestep too small", rows.get(2).error());
            assertEquals("", rows.get(0).error());
            assertEquals("nets/SPI0_SCK.yaml", rows.get(0).source());
        }
    }

    @Test
    void summaryColumnsTakeTheWorstOverEveryReceiverAndEdge() {
        // Invented values; the expected figures follow from the column definitions in
        // docs/results-store.md (max overshoot over rising edges, max undershoot over falling
        // edges, their max, min ringback margin, max settling time).
        ResultRecord r = Records.record("CLK", Records.HASH_A, 22, List.of(
                Records.receiver("U2.1", Records.rise(0.12, 3e-9), Records.fall(0.05, 0.8, 5e-9)),
                Records.receiver("U3.1", Records.rise(0.28, 4e-9), Records.fall(0.21, 0.4, 2e-9))));
        try (ResultStore store = ResultStore.open(out)) {
            store.put(r, PointKey.of(r));
            StoredRow row = store.rows().get(0);
            assertEquals(0.28, row.worstOvershootV());
            assertEquals(0.21, row.worstUndershootV());
            assertEquals(0.28, row.worstExcursionV());
            assertEquals(0.4, row.worstRingbackMarginV());
            assertEquals(5e-9, row.longestSettleS());
        }
    }

    @Test
    void anEdgeThatDidNotSettleLeavesTheLongestSettleUnknown() {
        ResultRecord r = Records.point("CLK", Records.HASH_A, 22, 0.1, 0.1, Double.NaN);
        try (ResultStore store = ResultStore.open(out)) {
            store.put(r, PointKey.of(r));
            assertTrue(Double.isNaN(store.rows().get(0).longestSettleS()));
        }
    }

    @Test
    void finishedPointsSurviveClosingAndReopening() {
        ResultRecord a = Records.point("SPI0_SCK", Records.HASH_A, 22, 0.2, 0.1, 4e-9);
        ResultRecord b = Records.point("SPI0_SCK", Records.HASH_A, 33, 0.1, 0.1, 4e-9);
        try (ResultStore store = ResultStore.open(out)) {
            store.put(a, PointKey.of(a));
            store.put(b, PointKey.of(b));
        }
        try (ResultStore store = ResultStore.open(out)) {
            assertTrue(store.has(Records.HASH_A, "corner=typ;R5/value=22.0"));
            assertTrue(store.has(Records.HASH_A, "corner=typ;R5/value=33.0"));
            assertFalse(store.has(Records.HASH_A, "corner=typ;R5/value=47.0"));
            assertEquals(List.of("corner=typ;R5/value=22.0", "corner=typ;R5/value=33.0"),
                    List.copyOf(store.finishedKeys(Records.HASH_A)));
        }
    }

    @Test
    void aChangedNetFileIsANewKeyAndKeepsTheOldRows() {
        ResultRecord old = Records.point("SPI0_SCK", Records.HASH_A, 22, 0.05, 0.05, 4e-9);
        ResultRecord changed = Records.point("SPI0_SCK", Records.HASH_B, 22, 0.25, 0.05, 4e-9);
        try (ResultStore store = ResultStore.open(out)) {
            store.put(old, PointKey.of(old));
            assertFalse(store.has(Records.HASH_B, PointKey.of(changed)));
            store.put(changed, PointKey.of(changed));
            assertEquals(2, store.rows().size());
            assertEquals(Set.of(PointKey.of(old)), store.finishedKeys(Records.HASH_A));
            assertEquals(Set.of(PointKey.of(changed)), store.finishedKeys(Records.HASH_B));
            // The old file's better point is not mixed into the best of the changed file.
            assertEquals(Records.HASH_B, store.bestPerNet().get("SPI0_SCK").netHash());
        }
    }

    @Test
    void puttingAFinishedPointAgainKeepsOneRowWithTheNewerRecord() {
        ResultRecord first = Records.point("SPI0_SCK", Records.HASH_A, 22, 0.2, 0.1, 4e-9);
        ResultRecord again = Records.point("SPI0_SCK", Records.HASH_A, 22, 0.3, 0.1, 4e-9);
        try (ResultStore store = ResultStore.open(out)) {
            store.put(first, PointKey.of(first));
            store.put(again, PointKey.of(again));
            store.put(again, PointKey.of(again));
            assertEquals(List.of(ResultJson.line(again)), store.recordLines());
        }
    }

    @Test
    void putFromFourThreadsKeepsEveryPointOnce() throws Exception {
        int perThread = 150;
        ExecutorService pool = Executors.newFixedThreadPool(4);
        try (ResultStore store = ResultStore.open(out)) {
            List<Callable<Void>> tasks = new ArrayList<>();
            for (int t = 0; t < 4; t++) {
                int thread = t;
                tasks.add(() -> {
                    for (int i = 0; i < perThread; i++) {
                        // Threads 0 and 1 write the same keys, as two workers finishing one point would.
                        int n = (thread < 2 ? 0 : thread) * perThread + i;
                        ResultRecord r = Records.numbered(n);
                        store.put(r, PointKey.of(r));
                        store.has(Records.HASH_A, PointKey.of(r));
                    }
                    return null;
                });
            }
            for (Future<Void> f : pool.invokeAll(tasks)) {
                f.get();
            }
            List<String> lines = store.recordLines();
            assertEquals(3 * perThread, lines.size());
            Set<String> distinct = new HashSet<>(lines);
            assertEquals(lines.size(), distinct.size());
            for (int n : List.of(0, perThread - 1, 2 * perThread, 4 * perThread - 1)) {
                assertTrue(distinct.contains(ResultJson.line(Records.numbered(n))), "point " + n);
            }
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void theFileIsInWalModeWithTheDocumentedSchemaVersion() throws Exception {
        try (ResultStore store = ResultStore.open(out)) {
            ResultRecord r = Records.numbered(1);
            store.put(r, PointKey.of(r));
            try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + store.file());
                 Statement s = c.createStatement()) {
                try (ResultSet rs = s.executeQuery("PRAGMA journal_mode")) {
                    assertTrue(rs.next());
                    assertEquals("wal", rs.getString(1));
                }
                try (ResultSet rs = s.executeQuery("SELECT version FROM schema_version")) {
                    assertTrue(rs.next());
                    assertEquals(1, rs.getInt(1));
                }
            }
        }
    }

    @Test
    void finishedAtIsTheCommitTimeAsIso8601Utc() throws Exception {
        try (ResultStore store = ResultStore.open(out)) {
            java.time.Instant before = java.time.Instant.now().truncatedTo(java.time.temporal.ChronoUnit.MILLIS);
            ResultRecord r = Records.numbered(1);
            store.put(r, PointKey.of(r));
            java.time.Instant after = java.time.Instant.now();
            java.time.Instant at = store.rows().get(0).finishedAt();
            assertTrue(!at.isBefore(before) && !at.isAfter(after), at + " not in [" + before + ", " + after + "]");
            try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + store.file());
                 Statement s = c.createStatement(); ResultSet rs = s.executeQuery("SELECT finished_at FROM points")) {
                assertTrue(rs.next());
                // ISO 8601 extended format, UTC designator Z, milliseconds.
                assertTrue(rs.getString(1).matches("\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}:\\d{2}\\.\\d{3}Z"), rs.getString(1));
            }
        }
    }

    @Test
    void aNewerSchemaVersionIsRefusedWithTheFileNamed() throws Exception {
        ResultStore.open(out).close();
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + out.resolve(ResultStore.FILE_NAME));
             Statement s = c.createStatement()) {
            s.executeUpdate("UPDATE schema_version SET version = 2");
        }
        StoreException e = assertThrows(StoreException.class, () -> ResultStore.open(out));
        assertTrue(e.getMessage().contains("results.sqlite") && e.getMessage().contains("`2`")
                && e.getMessage().contains("newer"), e.getMessage());
    }

    @Test
    void aFileThatIsNotADatabaseIsRefusedWithTheFileNamed() throws Exception {
        Files.writeString(out.resolve(ResultStore.FILE_NAME), "this is not a database, just some text that is long enough to matter\n".repeat(20));
        StoreException e = assertThrows(StoreException.class, () -> ResultStore.open(out));
        assertTrue(e.getMessage().contains("results.sqlite"), e.getMessage());
    }

    @Test
    void aRecordWithoutSourceHashIsRefused() {
        ResultRecord r = Records.point("SPI0_SCK", "", 22, 0.2, 0.1, 4e-9);
        try (ResultStore store = ResultStore.open(out)) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> store.put(r, PointKey.of(r)));
            assertTrue(e.getMessage().contains("`SPI0_SCK`"), e.getMessage());
        }
    }
}
