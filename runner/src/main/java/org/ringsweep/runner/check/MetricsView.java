package org.ringsweep.runner.check;

import java.util.LinkedHashMap;
import java.util.Map;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.runner.measure.EdgeMetrics;
import org.ringsweep.runner.results.EdgeResult;

/** Turns measured edge metrics into a record's edge object, with the keys of formats.md. */
final class MetricsView {
    private MetricsView() {
    }

    static EdgeResult of(EdgeMetrics m) {
        Map<String, Object> o = new LinkedHashMap<>();
        o.put("v_max", m.vMax());
        o.put("v_min", m.vMin());
        o.put("v_final", m.vFinal());
        if (m.direction() == Stimulus.Edge.RISE) {
            o.put("overshoot_v", m.overshootV());
        } else {
            o.put("undershoot_v", m.undershootV());
        }
        o.put("ringback_margin_v", m.ringbackMarginV());
        o.put("settle_s", m.settleS());
        o.put("settled", m.settled());
        o.put("delay_s", m.delayS());
        o.put("crossings", m.crossings());
        o.put("monotonic", m.monotonic());
        o.put("slew_v_per_s", m.slewVPerS());
        o.put(m.direction() == Stimulus.Edge.RISE ? "rise_time_s" : "fall_time_s", m.thresholdTransitionS());
        return new EdgeResult(o);
    }
}
