package org.ringsweep.runner.measure;

/**
 * The voltages an edge is judged against.
 *
 * @param lowRail    the driver's low level (V), the reference for undershoot
 * @param highRail   the driver's high level (V), the reference for overshoot; swing =
 *                   {@code highRail − lowRail}
 * @param vil        the receiver's input-low threshold (V): the threshold of falling edges
 * @param vih        the receiver's input-high threshold (V): the threshold of rising edges
 * @param settleBand the half-width of the settling band around the final level (V), e.g. 5 % of
 *                   the swing
 * @param hysteresis the half-width of the crossing detector's band around a level (V), also the
 *                   largest reversal still counted as monotonic and the smallest fall that makes a
 *                   peak; 0 gives raw crossings ({@code waveform-metrics.md} §4.3 suggests 1–2 % of
 *                   the swing or 10–50 mV)
 */
public record Levels(double lowRail, double highRail, double vil, double vih, double settleBand, double hysteresis) {
    /**
     * The hysteresis {@link #of} uses, as a fraction of the swing: 1 %, the low end of the
     * "typical h = 1–2 % of A" of {@code waveform-metrics.md} §4.3.
     */
    public static final double DEFAULT_HYSTERESIS_FRACTION = 0.01;

    /**
     * Checks the levels.
     *
     * @throws IllegalArgumentException if a level is not finite, the high rail is not above the
     *                                  low rail, VIL is above VIH, the band is not positive or the
     *                                  hysteresis is negative
     */
    public Levels {
        for (double x : new double[] {lowRail, highRail, vil, vih, settleBand, hysteresis}) {
            if (!Double.isFinite(x)) {
                throw new IllegalArgumentException("levels must be finite, found " + x);
            }
        }
        if (!(highRail > lowRail)) {
            throw new IllegalArgumentException("high rail (" + highRail + " V) must be above the low rail ("
                    + lowRail + " V)");
        }
        if (vil > vih) {
            throw new IllegalArgumentException("VIL (" + vil + " V) must not be above VIH (" + vih + " V)");
        }
        if (!(settleBand > 0)) {
            throw new IllegalArgumentException("settle band must be positive, found " + settleBand + " V");
        }
        if (hysteresis < 0) {
            throw new IllegalArgumentException("hysteresis must not be negative, found " + hysteresis + " V");
        }
    }

    /**
     * Levels with the default hysteresis, {@link #DEFAULT_HYSTERESIS_FRACTION} of the swing.
     *
     * @param lowRail    the driver's low level (V)
     * @param highRail   the driver's high level (V)
     * @param vil        the receiver's VIL (V)
     * @param vih        the receiver's VIH (V)
     * @param settleBand the settling band's half-width (V), e.g. {@code EffectiveLimits.settleBandV()}
     * @return the levels
     * @throws IllegalArgumentException as the canonical constructor
     */
    public static Levels of(double lowRail, double highRail, double vil, double vih, double settleBand) {
        return new Levels(lowRail, highRail, vil, vih, settleBand, DEFAULT_HYSTERESIS_FRACTION * (highRail - lowRail));
    }

    /** The swing {@code highRail − lowRail} (V). */
    public double swing() {
        return highRail - lowRail;
    }
}
