package org.ringsweep.runner.tune;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.TreeMap;
import java.util.function.DoubleFunction;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Point;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.results.ViolationRecord;
import org.ringsweep.runner.verdict.EffectiveLimits;
import org.ringsweep.runner.verdict.LimitDefaults;

/**
 * Finds the best value of one parameter among sorted candidates (e.g. the E24 values in a
 * range) without simulating all of them: a coarse pass over every k-th candidate
 * (k = ⌊√n⌋), a fine pass over the candidates between the best coarse one's coarse neighbours,
 * then a hill climb that stops only when the best has both neighbours simulated and neither is
 * better. The ranking is {@link Objective}. The recommendation is then re-checked at every
 * corner of the net and at both ends of the part tolerance ({@code value·(1 ± tol)}).
 *
 * <p>The search trusts the objective to be unimodal around its best (true of the series
 * resistor of a point-to-point net, where too little resistance rings and too much slows
 * the edge); with several separated optima the coarse pass picks the region.
 */
public final class TuneSearch {
    private final PointRunner runner;

    /** @param runner runs one point */
    public TuneSearch(PointRunner runner) {
        this.runner = runner;
    }

    /**
     * Runs the search.
     *
     * @param net        the net (typ values)
     * @param target     the path to vary
     * @param dimension  the target's dimension (for the override values)
     * @param candidates candidate values in SI, ascending
     * @param tolerance  the part tolerance as a fraction (0.01 for 1 %), 0 for none
     */
    public TuneResult tune(Net net, ValuePath target, Dimension dimension, List<Double> candidates, double tolerance) {
        int n = candidates.size();
        if (n == 0) {
            throw new IllegalArgumentException("no candidate values in the range");
        }
        Map<Integer, ResultRecord> done = new TreeMap<>();
        int[] counter = {0};
        DoubleFunction<Point> point = v -> Point.of(Map.of(target, Value.of(v, dimension)));
        java.util.function.IntFunction<ResultRecord> eval = i -> done.computeIfAbsent(i, k -> {
            double v = candidates.get(k);
            counter[0]++;
            return runner.run(net, new PointRunner.PointSpec("typ", point.apply(v), Map.of(target.toString(), v), counter[0]));
        });
        int stride = Math.max(1, (int) Math.floor(Math.sqrt(n)));
        for (int i = 0; i < n; i += stride) {
            eval.apply(i);
        }
        eval.apply(n - 1);
        int best = bestIndex(done);
        for (int i = Math.max(0, best - stride + 1); i <= Math.min(n - 1, best + stride - 1); i++) {
            eval.apply(i);
        }
        while (true) {
            best = bestIndex(done);
            boolean grew = false;
            for (int i : new int[] {best - 1, best + 1}) {
                if (i >= 0 && i < n && !done.containsKey(i)) {
                    eval.apply(i);
                    grew = true;
                }
            }
            if (!grew) {
                break;
            }
        }
        best = bestIndex(done);
        List<TuneResult.Evaluation> evaluated = new ArrayList<>();
        done.forEach((i, r) -> evaluated.add(new TuneResult.Evaluation(candidates.get(i), r)));
        ResultRecord bestRecord = done.get(best);
        if (bestRecord.verdict() != Verdict.PASS) {
            return new TuneResult(net.name(), target, OptionalDouble.empty(), evaluated, List.of(), Map.of(),
                    failingEverywhere(done.values()), n);
        }
        double value = candidates.get(best);
        List<TuneResult.Check> checks = new ArrayList<>();
        Set<Double> values = new LinkedHashSet<>(List.of(value));
        if (tolerance > 0) {
            values.add(value * (1 - tolerance));
            values.add(value * (1 + tolerance));
        }
        Map<String, Point> corners = new LinkedHashMap<>();
        corners.put("typ", Point.NONE);
        corners.putAll(net.corners());
        int index = 1000;
        for (Map.Entry<String, Point> c : corners.entrySet()) {
            for (double v : values) {
                index++;
                ResultRecord r = c.getKey().equals("typ") && v == value ? bestRecord
                        : runner.run(net, new PointRunner.PointSpec(c.getKey(), c.getValue().then(point.apply(v)),
                                Map.of(target.toString(), v), index));
                checks.add(new TuneResult.Check(c.getKey(), v, r));
            }
        }
        return new TuneResult(net.name(), target, OptionalDouble.of(value), evaluated, checks, margins(net, checks), List.of(), n);
    }

    private static int bestIndex(Map<Integer, ResultRecord> done) {
        int best = -1;
        ResultRecord bestRecord = null;
        for (Map.Entry<Integer, ResultRecord> e : done.entrySet()) {
            if (bestRecord == null || Objective.BEST_FIRST.compare(e.getValue(), bestRecord) < 0) {
                best = e.getKey();
                bestRecord = e.getValue();
            }
        }
        return best;
    }

    private static List<String> failingEverywhere(java.util.Collection<ResultRecord> records) {
        Set<String> common = null;
        for (ResultRecord r : records) {
            Set<String> limits = new LinkedHashSet<>();
            r.receivers().forEach(rr -> rr.violations().forEach(v -> limits.add(v.limit())));
            if (r.verdict() == Verdict.ERROR) {
                limits.add("error");
            }
            if (common == null) {
                common = limits;
            } else {
                common.retainAll(limits);
            }
        }
        return common == null ? List.of() : List.copyOf(common);
    }

    /**
     * The smallest margin to each limit over all checks: for maximum limits {@code limit − measured},
     * for minimum limits {@code measured − limit}, so a positive margin is inside the limit.
     */
    private Map<String, Double> margins(Net net, List<TuneResult.Check> checks) {
        Map<String, Double> m = new LinkedHashMap<>();
        double swing = runner.elaborate(net, new PointRunner.PointSpec("typ", Point.NONE, Map.of(), 0)).swing();
        for (TuneResult.Check c : checks) {
            ResultRecord r = c.record();
            if (r.verdict() == Verdict.ERROR) {
                continue;
            }
            for (ReceiverResult rr : r.receivers()) {
                Receiver receiver = net.receivers().stream().filter(x -> x.pin().equals(rr.pin())).findFirst().orElseThrow();
                EffectiveLimits l = LimitDefaults.resolve(net.limitsFor(receiver), swing);
                EdgeResult rise = rr.edges().get("rise");
                EdgeResult fall = rr.edges().get("fall");
                if (rise != null) {
                    min(m, "overshoot_max", l.overshootMaxV() - num(rise, "overshoot_v"));
                    min(m, "ringback_margin_min", num(rise, "ringback_margin_v") - l.ringbackMarginMinV());
                    min(m, "crossings_max", l.crossingsMax() - num(rise, "crossings"));
                    edgeTimeMargins(m, l, rise);
                    if (l.hasRiseMax()) {
                        min(m, "rise_max", l.riseMaxS() - num(rise, "rise_time_s"));
                    }
                }
                if (fall != null) {
                    min(m, "undershoot_max", l.undershootMaxV() - num(fall, "undershoot_v"));
                    min(m, "ringback_margin_min", num(fall, "ringback_margin_v") - l.ringbackMarginMinV());
                    min(m, "crossings_max", l.crossingsMax() - num(fall, "crossings"));
                    edgeTimeMargins(m, l, fall);
                }
            }
        }
        return m;
    }

    private static void edgeTimeMargins(Map<String, Double> m, EffectiveLimits l, EdgeResult e) {
        if (l.hasSettleMax()) {
            min(m, "settle_max", l.settleMaxS() - num(e, "settle_s"));
        }
        if (l.hasDelayMax()) {
            min(m, "delay_max", l.delayMaxS() - num(e, "delay_s"));
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

    private static void min(Map<String, Double> m, String key, double margin) {
        if (Double.isNaN(margin)) {
            return;
        }
        m.merge(key, margin, Math::min);
    }

    /** The violations of a record, for reports. */
    static List<ViolationRecord> violations(ResultRecord r) {
        List<ViolationRecord> all = new ArrayList<>();
        r.receivers().forEach(rr -> all.addAll(rr.violations()));
        return all;
    }
}
