package org.ringsweep.runner.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;

/** The store's bounded-memory reads: what a million-point sweep's resume, summary and exports use. */
class StreamingStoreTests {
    @TempDir
    Path out;

    private ResultStore filled(int n) {
        ResultStore store = ResultStore.open(out);
        for (int i = 0; i < n; i++) {
            ResultRecord r = i % 7 == 3 ? Records.failing("SPI0_SCK", Records.HASH_A, 10 + i, 0.4 + 0.001 * i, 5e-9)
                    : i % 11 == 5 ? Records.error("SPI0_SCK", Records.HASH_A, 10 + i)
                    : Records.point("SPI0_SCK", Records.HASH_A, 10 + i, 0.001 * (i % 50), 0.002 * (i % 30), 4e-9 + i * 1e-12);
            store.put(r, PointKey.of(r));
        }
        return store;
    }

    @Test
    void finishedPointsAnswerExactlyWhatTheStoreHolds() {
        try (ResultStore store = filled(300)) {
            FinishedPoints done = store.finished(Records.HASH_A);
            assertEquals(300, done.size());
            for (int i = 0; i < 300; i++) {
                assertTrue(done.contains(PointKey.of("typ", Map.of("R5/value", 10.0 + i))), "point " + i);
            }
            assertFalse(done.contains(PointKey.of("typ", Map.of("R5/value", 5.0))));
            assertFalse(done.contains(PointKey.of("slow", Map.of("R5/value", 10.0))));
            assertEquals(0, store.finished(Records.HASH_B).size(), "another net file has none");
        }
    }

    @Test
    void aHashCollisionCostsALookUpNeverASkippedPoint() {
        try (ResultStore store = filled(3)) {
            String absent = PointKey.of("typ", Map.of("R5/value", 99.0));
            // the hash array claims the absent key (as a colliding key would); the store's own index says no
            FinishedPoints colliding = new FinishedPoints(Records.HASH_A, new long[] {FinishedPoints.hash(absent)}, store);
            assertFalse(colliding.contains(absent));
        }
    }

    @Test
    void sqlCountsEqualTheVerdictsOfTheRows() {
        try (ResultStore store = filled(200)) {
            long pass = 0;
            long fail = 0;
            long error = 0;
            for (StoredRow r : store.rows()) {
                pass += r.verdict() == Verdict.PASS ? 1 : 0;
                fail += r.verdict() == Verdict.FAIL ? 1 : 0;
                error += r.verdict() == Verdict.ERROR ? 1 : 0;
            }
            // the fixture's own pattern: i % 7 == 3 fails (29 of 0..199); i % 11 == 5 errors (18 of 0..199)
            // except where it also fails (i = 38, 115, 192 by the Chinese remainder theorem): 15
            assertEquals(29, fail);
            assertEquals(15, error);
            assertEquals(new VerdictCounts(pass, fail, error), store.counts(Records.HASH_A).get("SPI0_SCK"));
            assertEquals(200, store.size());
            assertEquals(Map.of("SPI0_SCK", Records.HASH_A), store.latestFiles());
        }
    }

    @Test
    void theStreamedBestPointIsTheMinimumOfTheObjectiveOverEveryRow() {
        try (ResultStore store = filled(400)) {
            StoredRow expected = null;
            for (StoredRow r : store.rows()) {
                if (r.verdict() != Verdict.ERROR && (expected == null || BestPoint.ORDER.compare(r, expected) < 0)) {
                    expected = r;
                }
            }
            assertEquals(expected, store.bestPerNet().get("SPI0_SCK"));
        }
    }

    @Test
    void firstByPointKeyIsTheKeyOrderOfAllRowsCutShort() {
        try (ResultStore store = filled(120)) {
            List<String> all = new ArrayList<>(store.rows().stream().map(StoredRow::pointKey).toList());
            all.sort(String::compareTo);
            assertEquals(all.subList(0, 25), store.firstByPointKey("SPI0_SCK", Records.HASH_A, 25).stream().map(StoredRow::pointKey).toList());
        }
    }

    @Test
    void streamedExportsEqualTheExportsOfTheRowsInMemory() {
        try (ResultStore store = filled(150)) {
            StringBuilder listed = new StringBuilder();
            StoreExport.toCsv(store.rows(), listed);
            StringBuilder streamed = new StringBuilder();
            StoreExport.toCsv(store.allRows(), streamed);
            assertEquals(listed.toString(), streamed.toString());
            StringBuilder lines = new StringBuilder();
            store.forEachRecordLine(l -> lines.append(l).append('\n'));
            StringBuilder exported = new StringBuilder();
            StoreExport.toJsonLines(store.allRows(), exported);
            assertEquals(lines.toString(), exported.toString());
            assertEquals(150, exported.toString().lines().count());
        }
    }

    @Test
    void notableRowsAreTheWorstOfEachSummaryColumnAndTheFirstFailAndError() {
        try (ResultStore store = filled(100)) {
            Map<String, Long> worst = new LinkedHashMap<>();
            StoredRow maxOver = null;
            StoredRow firstFail = null;
            StoredRow firstError = null;
            for (StoredRow r : store.rows()) {
                if (!Double.isNaN(r.worstOvershootV()) && (maxOver == null || r.worstOvershootV() > maxOver.worstOvershootV())) {
                    maxOver = r;
                }
                firstFail = firstFail == null && r.verdict() == Verdict.FAIL ? r : firstFail;
                firstError = firstError == null && r.verdict() == Verdict.ERROR ? r : firstError;
            }
            worst.put("overshoot", maxOver.id());
            Set<Long> ids = store.notableIds("SPI0_SCK", Records.HASH_A);
            assertTrue(ids.contains(maxOver.id()), ids + " " + worst);
            assertTrue(ids.contains(firstFail.id()));
            assertTrue(ids.contains(firstError.id()));
            assertTrue(ids.size() <= 7, "one row per pick at most");
        }
    }
}
