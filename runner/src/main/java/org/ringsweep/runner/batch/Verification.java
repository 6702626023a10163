package org.ringsweep.runner.batch;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;

/**
 * {@code sweep --verify P%}: re-simulates a share of the finished points with a reference engine
 * (ngspice) and compares each receiver edge. Tolerances are those the built-in engine is held to
 * against ngspice: v_max and v_min within 1 % of the swing, the first threshold crossing within
 * 10 ps + 1 %, equal crossing counts, equal verdicts. Which points are verified follows from the
 * point keys (a stable hash), so a resumed sweep verifies the same ones.
 */
public final class Verification {
    /** Voltage tolerance as a fraction of the swing. */
    public static final double VOLTAGE_FRACTION = 0.01;
    /** Fixed part of the time tolerance (s). */
    public static final double TIME_ABSOLUTE_S = 10e-12;
    /** Relative part of the time tolerance. */
    public static final double TIME_FRACTION = 0.01;

    /** The largest difference seen for one metric, and whether any point exceeded its tolerance. */
    public record Worst(String metric, double difference, boolean beyondTolerance) {
    }

    /**
     * What the verification found.
     *
     * @param compared     points re-simulated and compared
     * @param worst        metric → largest difference
     * @param flagged      point key → what differed beyond tolerance, the first {@value #LISTED} flagged points
     * @param flaggedCount all flagged points
     */
    public record Report(long compared, Map<String, Worst> worst, Map<String, String> flagged, long flaggedCount) {
    }

    /** Receives a flagged point as it is found: its task, its record as stored, and what differed. */
    @FunctionalInterface
    public interface Flagged {
        /** Called once per flagged point, on the calling thread. */
        void accept(BatchRunner.Task task, ResultRecord stored, String why);
    }

    /** The most flagged points a report lists by name (every one is handed to {@link Flagged}). */
    public static final int LISTED = 100;

    private Verification() {
    }

    /** Whether the point with this key is in the verified share (0 < share ≤ 1). */
    public static boolean chosen(String netHash, String pointKey, double share) {
        long h = Integer.toUnsignedLong((netHash + "|" + pointKey).hashCode());
        return (h % 10_000) < Math.round(share * 10_000);
    }

    /**
     * Compares a record with its reference.
     *
     * @param swing the driver swing (V) of the point
     * @return what differed beyond tolerance (empty when nothing did), and updates {@code worst}
     */
    public static List<String> compare(ResultRecord result, ResultRecord reference, double swing, Map<String, Worst> worst) {
        List<String> beyond = new ArrayList<>();
        if (reference.verdict() == Verdict.ERROR || result.verdict() == Verdict.ERROR) {
            if (reference.verdict() != result.verdict()) {
                beyond.add("verdict " + result.verdict().word() + " vs reference " + reference.verdict().word());
            }
            return beyond;
        }
        if (reference.verdict() != result.verdict()) {
            beyond.add("verdict " + result.verdict().word() + " vs reference " + reference.verdict().word());
        }
        for (ReceiverResult rr : result.receivers()) {
            ReceiverResult ref = reference.receivers().stream().filter(x -> x.pin().equals(rr.pin())).findFirst().orElse(null);
            if (ref == null) {
                beyond.add(rr.pin() + " missing in the reference");
                continue;
            }
            for (Map.Entry<String, EdgeResult> e : rr.edges().entrySet()) {
                EdgeResult re = ref.edges().get(e.getKey());
                if (re == null) {
                    continue;
                }
                String where = rr.pin() + " " + e.getKey();
                double vtol = VOLTAGE_FRACTION * swing;
                check(worst, beyond, where, "v_max_v", num(e.getValue(), "v_max"), num(re, "v_max"), vtol);
                check(worst, beyond, where, "v_min_v", num(e.getValue(), "v_min"), num(re, "v_min"), vtol);
                double refDelay = num(re, "delay_s");
                check(worst, beyond, where, "delay_s", num(e.getValue(), "delay_s"), refDelay,
                        TIME_ABSOLUTE_S + TIME_FRACTION * Math.abs(refDelay));
                check(worst, beyond, where, "crossings", num(e.getValue(), "crossings"), num(re, "crossings"), 0);
            }
        }
        return beyond;
    }

    private static void check(Map<String, Worst> worst, List<String> beyond, String where, String metric,
                              double value, double reference, double tolerance) {
        if (Double.isNaN(value) && Double.isNaN(reference)) {
            return;
        }
        double diff = Double.isNaN(value) || Double.isNaN(reference) ? Double.POSITIVE_INFINITY : Math.abs(value - reference);
        boolean over = diff > tolerance;
        worst.merge(metric, new Worst(metric, diff, over),
                (a, b) -> new Worst(metric, Math.max(a.difference(), b.difference()), a.beyondTolerance() || b.beyondTolerance()));
        if (over) {
            beyond.add(String.format(Locale.ROOT, "%s %s differs by %.4g (tolerance %.4g)", where, metric, diff, tolerance));
        }
    }

    private static double num(EdgeResult e, String key) {
        Object v = e.metrics().get(key);
        if (v instanceof Double d) {
            return d;
        }
        if (v instanceof Integer i) {
            return i;
        }
        return Double.NaN;
    }

    /**
     * Runs the chosen tasks with the reference runner and compares, one at a time: nothing per
     * point is kept but the first {@value #LISTED} flagged keys.
     *
     * @param chosen    the tasks to verify, read once
     * @param stored    a task's record as stored; empty when it is not in the store (it is skipped)
     * @param reference the reference runner (ngspice)
     * @param swing     a task's driver swing (V)
     * @param onFlagged told of each point beyond tolerance as it is found
     */
    public static Report run(java.util.Iterator<BatchRunner.Task> chosen,
                             java.util.function.Function<BatchRunner.Task, java.util.Optional<ResultRecord>> stored,
                             PointRunner reference, java.util.function.ToDoubleFunction<BatchRunner.Task> swing, Flagged onFlagged) {
        Map<String, Worst> worst = new LinkedHashMap<>();
        Map<String, String> flagged = new LinkedHashMap<>();
        long compared = 0;
        long flaggedCount = 0;
        while (chosen.hasNext()) {
            BatchRunner.Task t = chosen.next();
            ResultRecord result = stored.apply(t).orElse(null);
            if (result == null) {
                continue;
            }
            ResultRecord ref = reference.run(t.net(), t.spec());
            compared++;
            List<String> beyond = compare(result, ref, swing.applyAsDouble(t), worst);
            if (!beyond.isEmpty()) {
                String why = String.join("; ", beyond);
                flaggedCount++;
                if (flagged.size() < LISTED) {
                    flagged.put(t.pointKey(), why);
                }
                onFlagged.accept(t, result, why);
            }
        }
        return new Report(compared, worst, flagged, flaggedCount);
    }
}
