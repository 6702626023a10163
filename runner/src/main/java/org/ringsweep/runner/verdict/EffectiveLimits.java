package org.ringsweep.runner.verdict;

import java.util.List;
import org.ringsweep.api.net.LimitName;

/**
 * The limits that apply to one receiver, as numbers: what the net and receiver set, and the
 * documented default for the rest (see {@link LimitDefaults}).
 *
 * @param overshootMaxV      highest allowed {@code v_max − high rail} on a rising edge (V)
 * @param undershootMaxV     highest allowed {@code low rail − v_min} on a falling edge (V)
 * @param ringbackMarginMinV smallest allowed ringback margin (V); negative allows a ring back past
 *                           the threshold
 * @param settleMaxS         longest allowed settling time from the source's 50 % point (s); NaN:
 *                           no limit
 * @param settleBandV        the settling band's half-width (V), already multiplied by the swing
 *                           when it was given as a fraction
 * @param monotonic          whether edges must be monotonic inside VIL..VIH
 * @param delayMaxS          longest allowed delay from the source's 50 % point to the threshold
 *                           (s); NaN: no limit
 * @param crossingsMax       most threshold crossings allowed per edge
 * @param riseMaxS           longest allowed rise time at the receiver, VIL to VIH (s); NaN: no
 *                           limit
 * @param defaulted          the limits that took their default value, in {@link LimitName} order
 *                           (limits without a default, {@code settle_max}, {@code delay_max} and
 *                           {@code rise_max}, are never listed)
 */
public record EffectiveLimits(double overshootMaxV, double undershootMaxV, double ringbackMarginMinV,
                              double settleMaxS, double settleBandV, boolean monotonic, double delayMaxS,
                              int crossingsMax, double riseMaxS, List<LimitName> defaulted) {
    /** Copies the list. */
    public EffectiveLimits {
        defaulted = List.copyOf(defaulted);
    }

    /** Whether {@code name} took its default value. */
    public boolean isDefaulted(LimitName name) {
        return defaulted.contains(name);
    }

    /** The file and result keys of the defaulted limits, e.g. {@code overshoot_max}. */
    public List<String> defaultedKeys() {
        return defaulted.stream().map(LimitName::key).toList();
    }

    /** Whether a settling-time limit is set. */
    public boolean hasSettleMax() {
        return !Double.isNaN(settleMaxS);
    }

    /** Whether a rise-time limit is set. */
    public boolean hasRiseMax() {
        return !Double.isNaN(riseMaxS);
    }

    /** Whether a delay limit is set. */
    public boolean hasDelayMax() {
        return !Double.isNaN(delayMaxS);
    }
}
