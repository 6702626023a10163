package org.ringsweep.runner.store;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.results.ViolationRecord;

/** Hand-made result records for the store tests. The numbers are invented test data. */
final class Records {
    static final String HASH_A = "a".repeat(64);
    static final String HASH_B = "b".repeat(64);

    private Records() {
    }

    /** A rising edge's metrics with the given overshoot (V) and settling time (s; NaN: not settled). */
    static EdgeResult rise(double overshootV, double settleS) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("v_max", 3.3 + overshootV);
        m.put("v_min", -0.02);
        m.put("v_final", 3.3);
        m.put("overshoot_v", overshootV);
        m.put("ringback_margin_v", 0.9);
        m.put("settle_s", settleS);
        m.put("settled", !Double.isNaN(settleS));
        m.put("delay_s", 6.2e-10);
        m.put("crossings", 1);
        m.put("monotonic", true);
        m.put("slew_v_per_s", 1.9e9);
        return new EdgeResult(m);
    }

    /** A falling edge's metrics with the given undershoot (V), ringback margin (V) and settling time (s). */
    static EdgeResult fall(double undershootV, double ringbackMarginV, double settleS) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("v_max", 3.31);
        m.put("v_min", -undershootV);
        m.put("v_final", 0.0);
        m.put("undershoot_v", undershootV);
        m.put("ringback_margin_v", ringbackMarginV);
        m.put("settle_s", settleS);
        m.put("settled", !Double.isNaN(settleS));
        m.put("delay_s", 6.0e-10);
        m.put("crossings", 1);
        m.put("monotonic", true);
        m.put("slew_v_per_s", 2.0e9);
        return new EdgeResult(m);
    }

    static ReceiverResult receiver(String pin, EdgeResult rise, EdgeResult fall, ViolationRecord... violations) {
        Map<String, EdgeResult> edges = new LinkedHashMap<>();
        edges.put("rise", rise);
        edges.put("fall", fall);
        return new ReceiverResult(pin, violations.length == 0 ? Verdict.PASS : Verdict.FAIL, edges, List.of(violations));
    }

    static ResultRecord record(String net, String hash, double r5, List<ReceiverResult> receivers) {
        Verdict v = receivers.stream().map(ReceiverResult::verdict).reduce(Verdict.PASS, Verdict::worst);
        return new ResultRecord(net, "typ", Map.of("R5/value", r5), "ngspice", "39", v, receivers,
                "out/" + net + "/typ-0001.cir", "", "nets/" + net + ".yaml", hash, List.of("overshoot_max"), List.of());
    }

    /** A passing one-receiver point with the given overshoot, undershoot and settling times. */
    static ResultRecord point(String net, String hash, double r5, double overshootV, double undershootV, double settleS) {
        return record(net, hash, r5, List.of(receiver("U7.6", rise(overshootV, settleS), fall(undershootV, 0.7, settleS))));
    }

    /** A failing point: overshoot beyond the default 0.3 V limit. */
    static ResultRecord failing(String net, String hash, double r5, double overshootV, double settleS) {
        ViolationRecord v = new ViolationRecord("overshoot_max", "rise", overshootV, 0.3, true,
                "overshoot exceeds overshoot_max");
        return record(net, hash, r5, List.of(receiver("U7.6", rise(overshootV, settleS), fall(0.1, 0.7, settleS), v)));
    }

    /** An error point (no waveform). */
    static ResultRecord error(String net, String hash, double r5) {
        return new ResultRecord(net, "typ", Map.of("R5/value", r5), "ngspice", "39", Verdict.ERROR, List.of(),
                "out/" + net + "/typ-0009.cir", "ngspice: timestep too small", "nets/" + net + ".yaml", hash, List.of(), List.of());
    }

    /** Point i of the crash probe: deterministic from i. */
    static ResultRecord numbered(int i) {
        return point("CRASH_NET", HASH_A, 10 + i, 0.001 * (i % 300), 0.002 * (i % 150), 4e-9 + i * 1e-12);
    }
}
