package org.ringsweep.runner.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.ViolationRecord;

/**
 * The default objective on hand-made records. The values are invented test data; each expected
 * winner follows from the rule documented in docs/results-store.md ("Best point per net"):
 * passing first, then the smallest worst excursion, then the shortest settle, then point order;
 * errors never.
 */
class BestPerNetTests {
    @TempDir
    Path out;

    private Map<String, StoredRow> best(ResultRecord... records) {
        try (ResultStore store = ResultStore.open(out)) {
            for (ResultRecord r : records) {
                store.put(r, PointKey.of(r));
            }
            return store.bestPerNet();
        }
    }

    @Test
    void aPassingPointBeatsAFailingOneWithASmallerExcursion() {
        // The failing point rings back below VIL (margin -0.1 V < the 0.0 V default minimum) but
        // has the smaller excursion (0.05 V against 0.29 V): passing still comes first.
        ResultRecord ringsBack = Records.record("N", Records.HASH_A, 10, List.of(Records.receiver("U7.6",
                Records.rise(0.05, 1e-9), Records.fall(0.05, -0.1, 1e-9),
                new ViolationRecord("ringback_margin_min", "fall", -0.1, 0.0, true, "rings back past VIL"))));
        Map<String, StoredRow> best = best(ringsBack, Records.point("N", Records.HASH_A, 22, 0.29, 0.29, 9e-9));
        assertEquals("corner=typ;R5/value=22.0", best.get("N").pointKey());
    }

    @Test
    void aPassingPointBeatsAFailingOneThatSettlesSooner() {
        Map<String, StoredRow> best = best(
                Records.failing("N", Records.HASH_A, 10, 0.35, 1e-9),
                Records.point("N", Records.HASH_A, 22, 0.29, 0.29, 9e-9));
        assertEquals("corner=typ;R5/value=22.0", best.get("N").pointKey());
    }

    @Test
    void amongPassingPointsTheSmallestWorstExcursionWins() {
        // Worst excursions: 22 Ω → max(0.20, 0.05) = 0.20; 33 Ω → max(0.02, 0.12) = 0.12; 47 Ω → 0.15.
        Map<String, StoredRow> best = best(
                Records.point("N", Records.HASH_A, 22, 0.20, 0.05, 3e-9),
                Records.point("N", Records.HASH_A, 33, 0.02, 0.12, 8e-9),
                Records.point("N", Records.HASH_A, 47, 0.15, 0.01, 2e-9));
        assertEquals("corner=typ;R5/value=33.0", best.get("N").pointKey());
    }

    @Test
    void equalExcursionsAreDecidedByTheShortestSettle() {
        Map<String, StoredRow> best = best(
                Records.point("N", Records.HASH_A, 22, 0.10, 0.05, 6e-9),
                Records.point("N", Records.HASH_A, 33, 0.10, 0.05, 4e-9),
                Records.point("N", Records.HASH_A, 47, 0.10, 0.05, Double.NaN)); // did not settle: last
        assertEquals("corner=typ;R5/value=33.0", best.get("N").pointKey());
    }

    @Test
    void stayingFurtherInsideTheRailsIsNoBetterThanReachingThem() {
        // Both stay inside the rails (excursions −0.002 V and 0.0 V count as 0 by the documented
        // rule), so the shorter settle (2 ns) wins over the deeper "negative excursion".
        Map<String, StoredRow> best = best(
                Records.point("N", Records.HASH_A, 100, -0.002, -0.002, 7e-9),
                Records.point("N", Records.HASH_A, 36, 0.0, -0.001, 2e-9));
        assertEquals("corner=typ;R5/value=36.0", best.get("N").pointKey());
    }

    @Test
    void excursionsWithinOneTenMillivoltStepAreDecidedBySettle() {
        // 4 mV and 9 mV are the same 10 mV step (documented rule); 12 mV is the next step.
        Map<String, StoredRow> best = best(
                Records.point("N", Records.HASH_A, 33, 0.004, 0.0, 5e-9),
                Records.point("N", Records.HASH_A, 39, 0.009, 0.0, 3e-9),
                Records.point("N", Records.HASH_A, 30, 0.012, 0.0, 1e-9));
        assertEquals("corner=typ;R5/value=39.0", best.get("N").pointKey());
    }

    @Test
    void fullTiesGoToTheEarlierPointInNumericPointOrder() {
        // 100 Ω sorts before 22 Ω as text but after it as a number: point order is numeric.
        Map<String, StoredRow> best = best(
                Records.point("N", Records.HASH_A, 100, 0.10, 0.05, 4e-9),
                Records.point("N", Records.HASH_A, 22, 0.10, 0.05, 4e-9));
        assertEquals("corner=typ;R5/value=22.0", best.get("N").pointKey());
    }

    @Test
    void amongFailingPointsTheSmallestExcursionWins() {
        Map<String, StoredRow> best = best(
                Records.failing("N", Records.HASH_A, 10, 0.50, 1e-9),
                Records.failing("N", Records.HASH_A, 15, 0.40, 5e-9));
        assertEquals("corner=typ;R5/value=15.0", best.get("N").pointKey());
    }

    @Test
    void errorPointsAreNeverBest() {
        Map<String, StoredRow> best = best(
                Records.error("N", Records.HASH_A, 1),
                Records.failing("N", Records.HASH_A, 10, 0.9, 1e-9),
                Records.error("ONLY_ERRORS", Records.HASH_A, 2));
        assertEquals("corner=typ;R5/value=10.0", best.get("N").pointKey());
        assertFalse(best.containsKey("ONLY_ERRORS"));
    }

    @Test
    void eachNetGetsItsOwnBest() {
        Map<String, StoredRow> best = best(
                Records.point("A", Records.HASH_A, 22, 0.20, 0.05, 3e-9),
                Records.point("B", Records.HASH_B, 22, 0.01, 0.01, 3e-9),
                Records.point("A", Records.HASH_A, 33, 0.10, 0.05, 3e-9));
        assertEquals(List.of("A", "B"), List.copyOf(best.keySet()));
        assertEquals("corner=typ;R5/value=33.0", best.get("A").pointKey());
        assertEquals("corner=typ;R5/value=22.0", best.get("B").pointKey());
    }
}
