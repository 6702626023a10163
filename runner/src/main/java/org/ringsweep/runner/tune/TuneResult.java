package org.ringsweep.runner.tune;

import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.runner.results.ResultRecord;

/**
 * What {@code tune} found.
 *
 * @param net             the net name
 * @param target          the tuned path
 * @param recommended     the recommended value (SI), empty when no candidate passes every limit
 * @param evaluated       every candidate simulated at the file's own values, in candidate order
 * @param checks          the recommended value re-checked at every corner and at the tolerance ends
 * @param margins         limit key → the smallest margin to it over all checks (positive: inside the limit)
 * @param failingEverywhere limit keys violated by every evaluated candidate (when none passes)
 * @param candidates      how many candidates the range held (more than were simulated, usually)
 */
public record TuneResult(String net, ValuePath target, OptionalDouble recommended, List<Evaluation> evaluated,
                         List<Check> checks, Map<String, Double> margins, List<String> failingEverywhere, int candidates) {
    /** One candidate simulated at typ. */
    public record Evaluation(double value, ResultRecord record) {
    }

    /** The recommended value checked at a corner and/or a tolerance end. */
    public record Check(String corner, double value, ResultRecord record) {
    }

    /** Copies. */
    public TuneResult {
        evaluated = List.copyOf(evaluated);
        checks = List.copyOf(checks);
        margins = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(margins));
        failingEverywhere = List.copyOf(failingEverywhere);
    }

    /** Whether the recommendation exists and passes at every corner and tolerance end. */
    public boolean robust() {
        return recommended.isPresent() && checks.stream().allMatch(c -> c.record().verdict() == org.ringsweep.runner.results.Verdict.PASS);
    }
}
