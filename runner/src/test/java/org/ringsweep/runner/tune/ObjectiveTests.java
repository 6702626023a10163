package org.ringsweep.runner.tune;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;

/**
 * The default objective on hand-made records (invented values; each expected order follows from
 * the rule documented on {@link Objective} and in the README).
 */
class ObjectiveTests {
    private static ResultRecord record(String name, Verdict v, double overshoot, double undershoot, double settle) {
        Map<String, Object> rise = new LinkedHashMap<>();
        rise.put("overshoot_v", overshoot);
        rise.put("settle_s", settle);
        Map<String, Object> fall = new LinkedHashMap<>();
        fall.put("undershoot_v", undershoot);
        fall.put("settle_s", settle);
        Map<String, EdgeResult> edges = new LinkedHashMap<>();
        edges.put("rise", new EdgeResult(rise));
        edges.put("fall", new EdgeResult(fall));
        List<ReceiverResult> rx = v == Verdict.ERROR ? List.of() : List.of(new ReceiverResult("U2.1", v, edges, List.of()));
        return new ResultRecord(name, "typ", Map.of(), "ngspice", "39", v, rx, "d.cir", "", "n.yaml", "h", List.of(), List.of());
    }

    private static List<String> ranked(ResultRecord... records) {
        List<ResultRecord> list = new ArrayList<>(List.of(records));
        list.sort(Objective.BEST_FIRST);
        return list.stream().map(ResultRecord::net).toList();
    }

    @Test
    void passingBeatsFailingBeatsError() {
        assertEquals(List.of("pass", "fail", "error"), ranked(
                record("error", Verdict.ERROR, 0, 0, 1e-9),
                record("fail", Verdict.FAIL, 0.0, 0.0, 1e-9),
                record("pass", Verdict.PASS, 0.25, 0.1, 9e-9)));
    }

    @Test
    void worstExcursionIsTheLargerOfOvershootAndUndershoot() {
        assertEquals(0.12, Objective.worstExcursion(record("a", Verdict.PASS, 0.05, 0.12, 1e-9)), 1e-15);
    }

    @Test
    void insideTheRailsCountsAsZeroSoSettleDecides() {
        assertEquals(List.of("fast", "deep"), ranked(
                record("deep", Verdict.PASS, -0.004, -0.003, 6e-9),
                record("fast", Verdict.PASS, 0.0, -0.001, 2e-9)));
    }

    @Test
    void excursionsAreComparedInTenMillivoltSteps() {
        // 4 mV and 9 mV share the first step; 12 mV is in the second.
        assertEquals(List.of("b", "a", "c"), ranked(
                record("a", Verdict.PASS, 0.004, 0, 5e-9),
                record("b", Verdict.PASS, 0.009, 0, 3e-9),
                record("c", Verdict.PASS, 0.012, 0, 1e-9)));
        assertEquals(1.0, Objective.excursionSteps(0.010), 0.0, "exactly one step is one step");
    }

    @Test
    void notSettledRanksAfterSettled() {
        assertEquals(List.of("settled", "ringing"), ranked(
                record("ringing", Verdict.PASS, 0.0, 0.0, Double.NaN),
                record("settled", Verdict.PASS, 0.0, 0.0, 9e-9)));
    }
}
