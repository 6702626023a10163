package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;

/**
 * The one-line-per-net summary that {@code check} prints after the table when it checked more than
 * one net (a board imported into a folder), worst first: by verdict (error, fail, pass), then by
 * the number of violations, then by the largest excursion past a rail (overshoot or undershoot, V).
 */
final class BatchSummary {
    private BatchSummary() {
    }

    /** One net's worst figures over its points. */
    record Row(String net, Verdict verdict, int points, int violations, double worstExcess, Set<String> limits) {
    }

    static List<Row> rows(List<ResultRecord> records) {
        Map<String, List<ResultRecord>> byNet = new LinkedHashMap<>();
        records.forEach(r -> byNet.computeIfAbsent(r.net(), k -> new ArrayList<>()).add(r));
        List<Row> rows = new ArrayList<>();
        byNet.forEach((net, rs) -> {
            Verdict v = Verdict.PASS;
            int violations = 0;
            double excess = Double.NEGATIVE_INFINITY;
            Set<String> limits = new LinkedHashSet<>();
            for (ResultRecord r : rs) {
                v = v.worst(r.verdict());
                for (ReceiverResult rr : r.receivers()) {
                    violations += rr.violations().size();
                    rr.violations().forEach(x -> limits.add(x.limit()));
                    for (EdgeResult e : rr.edges().values()) {
                        for (String k : List.of("overshoot_v", "undershoot_v")) {
                            if (e.metrics().get(k) instanceof Double d && Double.isFinite(d)) {
                                excess = Math.max(excess, d);
                            }
                        }
                    }
                }
            }
            rows.add(new Row(net, v, rs.size(), violations, excess, limits));
        });
        rows.sort(Comparator.comparing((Row r) -> r.verdict().ordinal()).reversed()
                .thenComparing(Comparator.comparingInt(Row::violations).reversed())
                .thenComparing(Comparator.comparingDouble(Row::worstExcess).reversed()));
        return rows;
    }

    static void print(List<ResultRecord> records, PrintWriter out) {
        List<Row> rows = rows(records);
        out.println();
        out.println("Summary by net, worst first (EXCESS: largest overshoot or undershoot past a rail):");
        int w = Math.max(3, rows.stream().mapToInt(r -> r.net().length()).max().orElse(3));
        out.printf(Locale.ROOT, "%-" + w + "s  %-7s  %6s  %10s  %9s  %s%n", "NET", "VERDICT", "POINTS", "VIOLATIONS", "EXCESS", "LIMITS");
        for (Row r : rows) {
            out.println(String.format(Locale.ROOT, "%-" + w + "s  %-7s  %6d  %10d  %9s  %s", r.net(),
                    r.verdict() == Verdict.PASS ? "pass" : r.verdict().word().toUpperCase(Locale.ROOT) + " <<", r.points(),
                    r.violations(), ResultTable.volts(Double.isFinite(r.worstExcess()) ? r.worstExcess() : Double.NaN),
                    String.join(", ", r.limits())).stripTrailing());
        }
    }
}
