package org.ringsweep.runner.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.store.PointKey;
import org.ringsweep.runner.store.ResultStore;

/** A sweep report of more points than it draws: the HTML samples and says so, junit.xml keeps every point. */
class SampledSweepReportTests {
    private static final int POINTS = 2_500;

    @TempDir
    Path out;

    private static EdgeResult edge(String excursionKey, double excursion) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put(excursionKey, excursion);
        m.put("settle_s", 4e-9);
        return new EdgeResult(m);
    }

    /** Invented test data: point i overshoots by i µV, point 1234 by 0.2 V (the worst). */
    private static ResultRecord record(int i) {
        double overshoot = i == 1234 ? 0.2 : i * 1e-6;
        Map<String, EdgeResult> edges = new LinkedHashMap<>();
        edges.put("rise", edge("overshoot_v", overshoot));
        edges.put("fall", edge("undershoot_v", 0.01));
        return new ResultRecord("BIG_NET", "typ", Map.of("R1/value", 10.0 + i), "builtin", "1", Verdict.PASS,
                List.of(new ReceiverResult("U2.1", Verdict.PASS, edges, List.of())), "out/BIG_NET/typ-" + i + ".cir", "",
                "nets/big.yaml", "c".repeat(64), List.of(), List.of());
    }

    @Test
    void theHtmlDrawsASampleWithTheWorstPointAndJunitXmlHasEveryPoint() throws Exception {
        try (ResultStore store = ResultStore.open(out)) {
            for (int i = 0; i < POINTS; i++) {
                ResultRecord r = record(i);
                store.put(r, PointKey.of(r));
            }
            Reports.afterSweep(out, store);
        }
        String html = Files.readString(out.resolve(Reports.HTML_FILE));
        // 2 500 points over at most 1 000 drawn: one in every 3 (0, 3, ... 2 499: 834), the worst overshoot (1 234,
        // not a multiple of 3) and the best point (point 0: the least excursion, already drawn)
        assertTrue(html.contains("Net BIG_NET has 2500 points: this report draws 835 of them (one in every 3 in run order"), html);
        String junit = Files.readString(out.resolve(Reports.JUNIT_FILE));
        // one test case per point, receiver and edge (JunitXml): 2 500 × 1 × 2
        Matcher m = Pattern.compile("<testsuite name=\"BIG_NET\" tests=\"(\\d+)\" failures=\"0\"").matcher(junit);
        assertTrue(m.find(), junit.substring(0, 400));
        assertEquals(2 * POINTS, Integer.parseInt(m.group(1)));
        assertEquals(2 * POINTS, junit.split("<testcase ", -1).length - 1);
    }
}
