package com.acme.ringsweep;

import java.util.Optional;
import org.ringsweep.api.model.EdgeCheck;
import org.ringsweep.api.model.EdgeSample;
import org.ringsweep.api.net.Stimulus;

/**
 * The {@code acme-input-transition} check: Acme's (invented) input cells want each edge to pass
 * through the undefined region between VIL and VIH in at most {@link #LIMIT_S} = 1 ns. Measured
 * on a rising edge from the first crossing of VIL to the first crossing of VIH after it (falling:
 * VIH down to VIL), with linear interpolation between samples. An edge that never reaches the
 * second threshold in its window is reported with a measured value of NaN.
 */
public final class InputTransitionCheck implements EdgeCheck {
    /** The shared instance. */
    public static final InputTransitionCheck INSTANCE = new InputTransitionCheck();
    /** The limit (s): 1 ns, invented. */
    public static final double LIMIT_S = 1e-9;

    private InputTransitionCheck() {
    }

    @Override
    public String id() {
        return "acme-input-transition";
    }

    @Override
    public String limitKey() {
        return "acme_transition_max";
    }

    @Override
    public String description() {
        return "time from VIL to VIH (falling: VIH to VIL) at each receiver at most 1 ns (invented Acme input rule)";
    }

    @Override
    public Optional<Finding> check(EdgeSample s) {
        boolean rising = s.direction() == Stimulus.Edge.RISE;
        double[] t = s.times();
        double[] v = s.volts();
        double first = crossing(t, v, 0, rising ? s.vil() : s.vih(), rising);
        if (Double.isNaN(first)) {
            return Optional.empty(); // the edge never arrived: the host's own checks report that
        }
        int from = 0;
        while (from < t.length - 1 && t[from + 1] <= first) {
            from++;
        }
        double second = crossing(t, v, from, rising ? s.vih() : s.vil(), rising);
        double took = second - first;
        if (Double.isNaN(second)) {
            return Optional.of(new Finding(Double.NaN, LIMIT_S, "the " + s.direction().word() + " edge at " + s.receiverPin()
                    + " never leaves the VIL..VIH region in its window"));
        }
        if (took > LIMIT_S) {
            return Optional.of(new Finding(took, LIMIT_S, String.format(java.util.Locale.ROOT,
                    "%s edge at %s takes %.3f ns from %s to %s, above the 1 ns Acme input rule",
                    s.direction().word(), s.receiverPin(), took * 1e9, rising ? "VIL" : "VIH", rising ? "VIH" : "VIL")));
        }
        return Optional.empty();
    }

    /** The first time from index {@code from} on at which v reaches the level going up (or down), or NaN. */
    private static double crossing(double[] t, double[] v, int from, double level, boolean up) {
        for (int i = Math.max(1, from + 1); i < t.length; i++) {
            boolean before = up ? v[i - 1] < level : v[i - 1] > level;
            boolean after = up ? v[i] >= level : v[i] <= level;
            if (before && after) {
                return t[i - 1] + (level - v[i - 1]) * (t[i] - t[i - 1]) / (v[i] - v[i - 1]);
            }
        }
        return Double.NaN;
    }
}
