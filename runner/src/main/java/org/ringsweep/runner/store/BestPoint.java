package org.ringsweep.runner.store;

import java.util.Comparator;
import java.util.Iterator;
import java.util.Map;
import java.util.TreeMap;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.tune.Objective;

/**
 * The default objective of "best point per net" ({@link Objective}, here over stored rows), in ranking order:
 * <ol>
 *   <li>a point that passes every limit before one that fails some (error points are never best);</li>
 *   <li>the smaller worst excursion beyond the rails ({@code worst_excursion_v}: the max of
 *       {@code overshoot_v} over rising edges and {@code undershoot_v} over falling edges, all
 *       receivers), counted as {@link Objective#excursionSteps(double)} does: none counts as 0,
 *       compared in 10 mV steps;</li>
 *   <li>the shorter longest settling time ({@code longest_settle_s});</li>
 *   <li>point order: corner name, then the swept values as a sequence of (path, value) pairs in
 *       ascending path order, paths by name and values as numbers (a sequence that is a prefix
 *       of the other comes first), then the point key.</li>
 * </ol>
 * An unknown value (NaN, SQL {@code NULL}: not measured, or an edge that did not settle) ranks
 * after every known one.
 */
final class BestPoint {
    /**
     * What the objective looks at of one row; {@code point} may be null, then it is read from
     * the point key when a tie needs it ({@link PointKey#values}).
     */
    record Candidate(long id, String corner, String pointKey, Verdict verdict, double worstExcursionV, double longestSettleS,
                     Map<String, Double> point) {
        Candidate(long id, String corner, String pointKey, Verdict verdict, double worstExcursionV, double longestSettleS) {
            this(id, corner, pointKey, verdict, worstExcursionV, longestSettleS, null);
        }

        static Candidate of(StoredRow r) {
            return new Candidate(r.id(), r.corner(), r.pointKey(), r.verdict(), r.worstExcursionV(), r.longestSettleS(), r.point());
        }

        Map<String, Double> values() {
            return point != null ? point : PointKey.values(pointKey);
        }
    }

    /** Best first. */
    static final Comparator<Candidate> CANDIDATE_ORDER = Comparator
            .comparingInt((Candidate r) -> r.verdict() == Verdict.PASS ? 0 : 1)
            .thenComparing((Candidate r) -> Objective.excursionSteps(r.worstExcursionV()), BestPoint::knownFirst)
            .thenComparing(Candidate::longestSettleS, BestPoint::knownFirst)
            .thenComparing(BestPoint::pointOrder);

    /** Best first, over whole rows. */
    static final Comparator<StoredRow> ORDER = Comparator.comparing(Candidate::of, CANDIDATE_ORDER);

    private BestPoint() {
    }

    private static int knownFirst(double a, double b) {
        boolean ua = Double.isNaN(a);
        boolean ub = Double.isNaN(b);
        if (ua || ub) {
            return Boolean.compare(ua, ub);
        }
        return Double.compare(a, b);
    }

    static int pointOrder(Candidate a, Candidate b) {
        int c = a.corner().compareTo(b.corner());
        if (c != 0) {
            return c;
        }
        Iterator<Map.Entry<String, Double>> ia = new TreeMap<>(a.values()).entrySet().iterator();
        Iterator<Map.Entry<String, Double>> ib = new TreeMap<>(b.values()).entrySet().iterator();
        while (ia.hasNext() && ib.hasNext()) {
            Map.Entry<String, Double> ea = ia.next();
            Map.Entry<String, Double> eb = ib.next();
            c = ea.getKey().compareTo(eb.getKey());
            if (c != 0) {
                return c;
            }
            c = Double.compare(ea.getValue(), eb.getValue());
            if (c != 0) {
                return c;
            }
        }
        c = Boolean.compare(ia.hasNext(), ib.hasNext());
        return c != 0 ? c : a.pointKey().compareTo(b.pointKey());
    }
}
