package org.ringsweep.runner.store;

import java.util.ArrayList;
import java.util.List;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;

/**
 * The queryable summary columns of a point, over every receiver and edge of its record. A
 * summary is NaN (stored as SQL {@code NULL}) when no edge carries the metric or when some edge
 * carries it as "not found" (NaN or null): the worst case is then unknown, and the objective
 * ranks it as the worst possible value.
 *
 * @param worstOvershootV      max {@code overshoot_v} over rising edges (V)
 * @param worstUndershootV     max {@code undershoot_v} over falling edges (V)
 * @param worstExcursionV      max of both (V): the worst excursion beyond the rails
 * @param worstRingbackMarginV min {@code ringback_margin_v} over all edges (V)
 * @param longestSettleS       max {@code settle_s} over all edges (s); NaN if an edge did not settle
 */
record PointSummary(double worstOvershootV, double worstUndershootV, double worstExcursionV,
                    double worstRingbackMarginV, double longestSettleS) {

    static PointSummary of(ResultRecord r) {
        List<Double> over = values(r, "overshoot_v");
        List<Double> under = values(r, "undershoot_v");
        List<Double> both = new ArrayList<>(over);
        both.addAll(under);
        return new PointSummary(max(over), max(under), max(both),
                -max(values(r, "ringback_margin_v").stream().map(v -> -v).toList()),
                max(values(r, "settle_s")));
    }

    /** The metric's value on every edge that has the key; NaN for a null or non-numeric value. */
    private static List<Double> values(ResultRecord r, String key) {
        List<Double> out = new ArrayList<>();
        for (ReceiverResult rr : r.receivers()) {
            for (EdgeResult er : rr.edges().values()) {
                if (er.metrics().containsKey(key)) {
                    Object v = er.metrics().get(key);
                    out.add(v instanceof Number n ? n.doubleValue() : Double.NaN);
                }
            }
        }
        return out;
    }

    /** The maximum; NaN when empty or when any value is NaN or infinite. */
    private static double max(List<Double> values) {
        if (values.isEmpty()) {
            return Double.NaN;
        }
        double m = Double.NEGATIVE_INFINITY;
        for (double v : values) {
            if (!Double.isFinite(v)) {
                return Double.NaN;
            }
            m = Math.max(m, v);
        }
        return m;
    }
}
