package org.ringsweep.runner.tune;

import java.util.Comparator;
import java.util.Map;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;

/**
 * The default objective for "the best point": first a point that passes every limit, then the
 * smallest worst excursion beyond the rails (the largest {@code overshoot_v} of any rising edge
 * or {@code undershoot_v} of any falling edge over all receivers), then the shortest settling
 * (the longest {@code settle_s} over all receivers and edges; not settled counts as infinite).
 * Error points rank last. Ties keep the earlier point (callers sort stably).
 *
 * <p>Design choices: an excursion that stays inside the rails counts as zero (a wave that only
 * approaches the rail is not better for approaching it more slowly), and excursions are compared
 * in steps of {@link #EXCURSION_STEP_V} so that a fraction of a millivolt does not outweigh a
 * much shorter settle.
 */
public final class Objective {
    /** A one-line description for records and reports. */
    public static final String DESCRIPTION = "passes every limit, then smallest worst excursion beyond the rails, then shortest settle";

    /** Resolution of the excursion comparison: 10 mV (V). */
    public static final double EXCURSION_STEP_V = 0.010;

    /** Orders records from best to worst. */
    public static final Comparator<ResultRecord> BEST_FIRST = Comparator
            .comparingInt((ResultRecord r) -> rank(r.verdict()))
            .thenComparingDouble(Objective::excursionSteps)
            .thenComparingDouble(Objective::longestSettle);

    /** The worst excursion beyond the rails, none counting as 0, in whole steps of 10 mV (rounded up). */
    static double excursionSteps(ResultRecord r) {
        return excursionSteps(worstExcursion(r));
    }

    /**
     * An excursion (V) as the objective compares it: none (negative) counts as 0, then whole steps
     * of {@link #EXCURSION_STEP_V}, rounded up; NaN and infinities are kept.
     */
    public static double excursionSteps(double worstExcursionV) {
        if (!Double.isFinite(worstExcursionV)) {
            return worstExcursionV;
        }
        return Math.ceil(Math.max(0, worstExcursionV) / EXCURSION_STEP_V - 1e-9);
    }

    private Objective() {
    }

    private static int rank(Verdict v) {
        return switch (v) {
            case PASS -> 0;
            case FAIL -> 1;
            case ERROR -> 2;
        };
    }

    /** The largest excursion beyond the rails over every receiver and edge (V); +∞ for errors. */
    public static double worstExcursion(ResultRecord r) {
        if (r.verdict() == Verdict.ERROR || r.receivers().isEmpty()) {
            return Double.POSITIVE_INFINITY;
        }
        double worst = Double.NEGATIVE_INFINITY;
        for (ReceiverResult rr : r.receivers()) {
            for (double x : new double[] {metric(rr.edges().get("rise"), "overshoot_v"), metric(rr.edges().get("fall"), "undershoot_v")}) {
                if (!Double.isNaN(x)) {
                    worst = Math.max(worst, x);
                }
            }
        }
        return worst == Double.NEGATIVE_INFINITY ? Double.POSITIVE_INFINITY : worst;
    }

    /** The longest settling time over every receiver and edge (s); +∞ when any edge did not settle. */
    public static double longestSettle(ResultRecord r) {
        if (r.verdict() == Verdict.ERROR || r.receivers().isEmpty()) {
            return Double.POSITIVE_INFINITY;
        }
        double longest = 0;
        for (ReceiverResult rr : r.receivers()) {
            for (EdgeResult e : rr.edges().values()) {
                double s = metric(e, "settle_s");
                longest = Math.max(longest, Double.isNaN(s) ? Double.POSITIVE_INFINITY : s);
            }
        }
        return longest;
    }

    private static double metric(EdgeResult e, String key) {
        if (e == null) {
            return Double.NEGATIVE_INFINITY;
        }
        Object v = e.metrics().get(key);
        return v instanceof Double d ? d : Double.NaN;
    }

    /** The metrics map of an edge, for callers that need more than the objective. */
    static Map<String, Object> metrics(EdgeResult e) {
        return e.metrics();
    }
}
