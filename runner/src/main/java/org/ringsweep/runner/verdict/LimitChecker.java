package org.ringsweep.runner.verdict;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.ringsweep.api.net.LimitName;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.runner.measure.EdgeMeasurer;
import org.ringsweep.runner.measure.EdgeMetrics;

/**
 * Checks one edge's measurements against the effective limits. A value exactly at its limit
 * passes. Violations, in this order (measured and limit values in brackets):
 * <ul>
 *   <li>{@code overshoot_max}: rising edge, {@code overshootV} above the limit (V, V);</li>
 *   <li>{@code undershoot_max}: falling edge, {@code undershootV} above the limit (V, V);</li>
 *   <li>{@code threshold_not_reached}: the threshold (VIH rising, VIL falling) was never crossed,
 *       so there is no ringback margin, delay or double-clock count to judge (highest value
 *       reached rising / lowest falling, V; the threshold, V);</li>
 *   <li>{@code ringback_margin_min}: margin below the limit (V, V);</li>
 *   <li>{@code crossings_max}: more threshold crossings than allowed (count, count);</li>
 *   <li>{@code monotonic}: monotonic edges required and the edge reverses inside VIL..VIH by more
 *       than the hysteresis (reversal depth, V; hysteresis, V);</li>
 *   <li>{@code settle_max}, only when set: a settled edge taking longer (s, s);</li>
 *   <li>{@code delay_max}, only when set: delay to the threshold longer (s, s);</li>
 *   <li>{@code rise_max}, only when set, rising edges: a rise time from VIL to VIH
 *       ({@link EdgeMetrics#thresholdTransitionS()}) longer than the limit (s, s); an edge whose
 *       rise time was not found is not judged here (it is reported as not reaching VIH, or it
 *       started above VIL);</li>
 *   <li>{@code settled}: always, when the edge did not settle in its window (see
 *       {@link EdgeMeasurer}): the largest distance from the final level over the last 20 % of the
 *       window (V) against the settle band half-width (V).</li>
 * </ul>
 * Messages add "(defaulted)" where the limit is a default rather than set by the net or receiver.
 */
public final class LimitChecker {
    private LimitChecker() {
    }

    /**
     * Checks one edge.
     *
     * @param m the edge's measurements, made with the settle band of {@code l}
     * @param l the effective limits of its receiver
     * @return the violations, empty when the edge passes
     */
    public static List<Violation> check(EdgeMetrics m, EffectiveLimits l) {
        Objects.requireNonNull(m, "metrics");
        Objects.requireNonNull(l, "limits");
        boolean rising = m.direction() == Stimulus.Edge.RISE;
        Stimulus.Edge edge = m.direction();
        String name = rising ? "rising edge" : "falling edge";
        String threshold = (rising ? "VIH (" : "VIL (") + Wording.volts(m.thresholdV()) + ")";
        List<Violation> out = new ArrayList<>();

        if (rising && m.overshootV() > l.overshootMaxV()) {
            String[] s = Wording.volts(m.overshootV(), l.overshootMaxV());
            out.add(new Violation(LimitName.OVERSHOOT_MAX.key(), edge, m.overshootV(), l.overshootMaxV(),
                    name + " overshoots the high rail by " + s[0] + "; limit " + s[1]
                            + defaulted(l, LimitName.OVERSHOOT_MAX)));
        }
        if (!rising && m.undershootV() > l.undershootMaxV()) {
            String[] s = Wording.volts(m.undershootV(), l.undershootMaxV());
            out.add(new Violation(LimitName.UNDERSHOOT_MAX.key(), edge, m.undershootV(), l.undershootMaxV(),
                    name + " undershoots the low rail by " + s[0] + "; limit " + s[1]
                            + defaulted(l, LimitName.UNDERSHOOT_MAX)));
        }

        if (!m.thresholdReached()) {
            out.add(notReached(m, rising, name, threshold));
        } else if (m.ringbackMarginV() < l.ringbackMarginMinV()) {
            String[] s = Wording.volts(m.ringbackMarginV(), l.ringbackMarginMinV());
            out.add(new Violation(LimitName.RINGBACK_MARGIN_MIN.key(), edge, m.ringbackMarginV(),
                    l.ringbackMarginMinV(),
                    name + " rings back to " + Wording.volts(m.ringbackExtremeV()) + " after its first "
                            + (rising ? "peak" : "trough") + ": margin " + (rising ? "above " : "below ")
                            + threshold + " is " + s[0] + "; limit " + s[1]
                            + defaulted(l, LimitName.RINGBACK_MARGIN_MIN)));
        }

        if (m.crossings() > l.crossingsMax()) {
            out.add(new Violation(LimitName.CROSSINGS_MAX.key(), edge, m.crossings(), l.crossingsMax(),
                    name + " crosses " + threshold + " " + m.crossings() + " times (a double clock edge); limit "
                            + l.crossingsMax() + defaulted(l, LimitName.CROSSINGS_MAX)));
        }

        if (l.monotonic() && !m.monotonic()) {
            String[] s = Wording.volts(m.nonMonotonicDepthV(), m.hysteresisV());
            out.add(new Violation(LimitName.MONOTONIC.key(), edge, m.nonMonotonicDepthV(), m.hysteresisV(),
                    name + " is not monotonic: it turns back by " + s[0] + " between VIL and VIH; allowed "
                            + s[1] + " (the detector's hysteresis)" + defaulted(l, LimitName.MONOTONIC)));
        }

        if (l.hasSettleMax() && m.settled() && m.settleS() > l.settleMaxS()) {
            String[] s = Wording.seconds(m.settleS(), l.settleMaxS());
            out.add(new Violation(LimitName.SETTLE_MAX.key(), edge, m.settleS(), l.settleMaxS(),
                    name + " takes " + s[0] + " from the source's 50 % point to settle within ±"
                            + Wording.volts(m.settleBandV()) + " of " + Wording.volts(m.vFinal()) + "; limit "
                            + s[1]));
        }

        if (l.hasDelayMax() && m.thresholdReached() && m.delayS() > l.delayMaxS()) {
            String[] s = Wording.seconds(m.delayS(), l.delayMaxS());
            out.add(new Violation(LimitName.DELAY_MAX.key(), edge, m.delayS(), l.delayMaxS(),
                    name + " reaches " + threshold + " " + s[0] + " after the source's 50 % point; limit " + s[1]));
        }

        if (rising && l.hasRiseMax() && m.thresholdTransitionS() > l.riseMaxS()) {
            String[] s = Wording.seconds(m.thresholdTransitionS(), l.riseMaxS());
            out.add(new Violation(LimitName.RISE_MAX.key(), edge, m.thresholdTransitionS(), l.riseMaxS(),
                    name + " takes " + s[0] + " to rise from VIL to " + threshold + " at the receiver; limit " + s[1]));
        }

        if (!m.settled()) {
            String[] s = Wording.volts(m.tailDeviationV(), m.settleBandV());
            out.add(new Violation(Violation.NOT_SETTLED, edge, m.tailDeviationV(), m.settleBandV(),
                    name + " does not settle before the next edge: over the last 20 % of its window it is still up"
                            + " to " + s[0] + " away from its final level " + Wording.volts(m.vFinal())
                            + "; settle band ±" + s[1] + defaulted(l, LimitName.SETTLE_BAND)
                            + " (lengthen the settle time or damp the ringing)"));
        }
        return List.copyOf(out);
    }

    private static Violation notReached(EdgeMetrics m, boolean rising, String name, String threshold) {
        double reached = rising ? m.vMax() : m.vMin();
        boolean alreadyPast = rising ? m.vBefore() >= m.thresholdV() : m.vBefore() <= m.thresholdV();
        boolean passed = rising ? reached > m.thresholdV() : reached < m.thresholdV();
        String message;
        if (alreadyPast) {
            message = name + " starts at " + Wording.volts(m.vBefore()) + ", already " + (rising ? "at or above " : "at or below ")
                    + threshold + ", so the receiver sees no " + (rising ? "rising" : "falling") + " crossing";
        } else if (passed) {
            message = name + " reaches only " + Wording.volts(reached) + ", not past " + threshold
                    + " by more than the hysteresis " + Wording.volts(m.hysteresisV());
        } else {
            message = name + " never reaches " + threshold + " at the receiver: " + (rising ? "highest " : "lowest ")
                    + "level " + Wording.volts(reached);
        }
        return new Violation(Violation.THRESHOLD_NOT_REACHED, m.direction(), reached, m.thresholdV(), message);
    }

    private static String defaulted(EffectiveLimits l, LimitName name) {
        return l.isDefaulted(name) ? " (defaulted)" : "";
    }
}
