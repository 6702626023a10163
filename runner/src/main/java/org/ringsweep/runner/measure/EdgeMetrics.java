package org.ringsweep.runner.measure;

import org.ringsweep.api.net.Stimulus;

/**
 * What one edge did at one receiver, as defined in {@code formats.md} "Results". Times are in
 * seconds (absolute simulation time unless the name says otherwise), voltages in volts. NaN means
 * "not found" (for example no threshold crossing), which is distinct from zero.
 *
 * <p>The threshold of an edge is VIH for a rising edge and VIL for a falling edge; the near
 * threshold is the other one. All crossings use the hysteresis detector of
 * {@code waveform-metrics.md} §4.3 with band ±{@code hysteresisV}.
 *
 * @param direction              the edge's direction at the source
 * @param windowStartS           start of the window measured (s); the edge's start at the source
 * @param windowEndS             end of the window measured (s); the next edge's start or the end of
 *                               the simulation
 * @param thresholdV             the threshold used (V): VIH rising, VIL falling
 * @param hysteresisV            the crossing detector's band half-width used (V)
 * @param vBefore                the value at the window start (V): the level before the edge
 * @param vMax                   the highest value in the window (V)
 * @param vMin                   the lowest value in the window (V)
 * @param vFinal                 the value at the window end (V): the settled level, if it settled
 * @param overshootV             rising: {@code vMax − highRail} (V; negative when the wave stays
 *                               below the rail); NaN for a falling edge
 * @param undershootV            falling: {@code lowRail − vMin} (V; negative when the wave stays
 *                               above the rail); NaN for a rising edge
 * @param crossings              the number of threshold crossings in the edge's direction inside
 *                               the window; more than one means a double clock edge, 0 that the
 *                               threshold was never reached
 * @param firstCrossingS         the first threshold crossing in the edge's direction (s); NaN if none
 * @param lastCrossingS          the last threshold crossing in the edge's direction (s), after
 *                               which the wave stays past the threshold unless it rings back; the
 *                               reference of the maximum ("settling") flight time; NaN if none
 * @param nearThresholdCrossingS the first crossing of the near threshold (VIL rising, VIH falling)
 *                               in the edge's direction (s): where the receiver may begin to switch,
 *                               the reference of the minimum ("switching") flight time in board
 *                               practice; NaN if none
 * @param delayS                 {@code firstCrossingS − source50} (s): the delay until the valid
 *                               level is reached (VIH rising, VIL falling). Board practice
 *                               sometimes takes the near threshold instead for the minimum flight
 *                               time of a rising edge (first VIL crossing): use
 *                               {@code nearThresholdCrossingS} for that. NaN if never crossed
 * @param ringbackPeakS          the first peak after the first threshold crossing of a rising edge
 *                               (first trough for falling) (s): the first local extremum the wave
 *                               then turns back from by more than the hysteresis, or the highest
 *                               (lowest) point after the crossing if it never turns back that far;
 *                               NaN if the threshold was never crossed
 * @param ringbackMarginV        rising: {@code min(v − VIH)} from {@code ringbackPeakS} to the
 *                               window end; falling: {@code VIL − max(v)} over the same span after
 *                               the trough (V); negative: the wave rang back past the threshold
 *                               into the undefined band; NaN if the threshold was never crossed
 * @param monotonic              no reversal deeper than the hysteresis inside the VIL..VIH band
 *                               ({@code waveform-metrics.md} §4.9): from where the wave first
 *                               enters the band until it first reaches the far side
 * @param nonMonotonicDepthV     the deepest reversal in that span (V): for a rising edge the
 *                               largest fall below the running maximum; 0 for a monotonic edge;
 *                               NaN if the wave never entered the band
 * @param slewFromS              the first crossing of 20 % of the way from {@code vBefore} to
 *                               {@code vFinal} (s); NaN if none
 * @param slewToS                the first crossing of 80 % of that way (s); NaN if none
 * @param slewVPerS              {@code 0.6·|vFinal − vBefore| / (slewToS − slewFromS)} (V/s, positive
 *                               for both directions); NaN if a crossing is missing or the wave
 *                               ended on the wrong side of where it started
 * @param settleBandV            the settling band's half-width used (V)
 * @param settleInstantS         where the wave enters {@code [vFinal ± settleBandV]} for the last
 *                               time (s), interpolated ({@code waveform-metrics.md} §4.7); the
 *                               window start if the wave never leaves the band; NaN if not settled
 * @param settleS                {@code settleInstantS − source50} (s); NaN if not settled
 * @param settled                whether the wave stays inside the band over at least the last 20 %
 *                               of the window (see {@link EdgeMeasurer})
 * @param tailDeviationV         the largest {@code |v − vFinal|} over the last 20 % of the window
 *                               (V): at most {@code settleBandV} exactly when settled, and the
 *                               spread still left when not
 * @param thresholdTransitionS   the transition time between the receiver's thresholds (s):
 *                               rising, the first VIH crossing minus the last rising VIL crossing
 *                               before it (the rise time, {@code rise_time_s}); falling, the first
 *                               VIL crossing minus the last falling VIH crossing before it (the
 *                               fall time, {@code fall_time_s}). With I²C input thresholds
 *                               (VIL = 0.3·VDD, VIH = 0.7·VDD) these are exactly the I²C
 *                               specification's 30–70 % t_r and 70–30 % t_f. NaN when either
 *                               crossing is missing (e.g. the edge started past the near threshold)
 */
public record EdgeMetrics(
        Stimulus.Edge direction,
        double windowStartS,
        double windowEndS,
        double thresholdV,
        double hysteresisV,
        double vBefore,
        double vMax,
        double vMin,
        double vFinal,
        double overshootV,
        double undershootV,
        int crossings,
        double firstCrossingS,
        double lastCrossingS,
        double nearThresholdCrossingS,
        double delayS,
        double ringbackPeakS,
        double ringbackMarginV,
        boolean monotonic,
        double nonMonotonicDepthV,
        double slewFromS,
        double slewToS,
        double slewVPerS,
        double settleBandV,
        double settleInstantS,
        double settleS,
        boolean settled,
        double tailDeviationV,
        double thresholdTransitionS) {

    /** Whether the threshold (VIH rising, VIL falling) was crossed in the edge's direction. */
    public boolean thresholdReached() {
        return crossings > 0;
    }

    /**
     * The ringback extreme (V): the lowest value after the first peak of a rising edge, the
     * highest after the first trough of a falling edge; NaN if the threshold was never crossed.
     */
    public double ringbackExtremeV() {
        return direction == Stimulus.Edge.RISE ? thresholdV + ringbackMarginV : thresholdV - ringbackMarginV;
    }
}
