package org.ringsweep.runner.verdict;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.ringsweep.api.net.LimitName;
import org.ringsweep.api.net.Limits;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.quantity.Dimension;

/**
 * The defaults of limits a net does not set ({@code formats.md} "Results"), and the resolution
 * of a {@link Limits} into {@link EffectiveLimits}.
 */
public final class LimitDefaults {
    /**
     * Default {@code overshoot_max} (V). Common practice: many CMOS inputs are rated to 0.3 V beyond
     * their rails; take the real figure from the receiver's datasheet.
     */
    public static final double OVERSHOOT_MAX_V = 0.3;
    /** Default {@code undershoot_max} (V), the same common-practice 0.3 V below the low rail. */
    public static final double UNDERSHOOT_MAX_V = 0.3;
    /** Default {@code ringback_margin_min} (V): the wave must not ring back past the threshold. */
    public static final double RINGBACK_MARGIN_MIN_V = 0.0;
    /** Default {@code monotonic}. */
    public static final boolean MONOTONIC = true;
    /** Default {@code crossings_max}: one threshold crossing per edge (more is a double clock). */
    public static final int CROSSINGS_MAX = 1;
    /** Default {@code settle_band} as a fraction of the swing. */
    public static final double SETTLE_BAND_FRACTION = 0.05;

    private LimitDefaults() {
    }

    /**
     * Resolves limits into numbers, defaulting what is not set. {@code settle_max},
     * {@code delay_max} and {@code rise_max} have no default (NaN: not checked).
     *
     * @param limits     the net's limits already layered with the receiver's
     *                   ({@code Net.limitsFor})
     * @param swingVolts the driver's swing {@code v_high − v_low} (V), positive; a
     *                   {@code settle_band} given as a fraction (dimensionless, {@code 5%}) is
     *                   multiplied by it
     * @return the effective limits, with the defaulted ones listed
     * @throws IllegalArgumentException if the swing is not positive, or a limit has the wrong kind
     *                                  of value (e.g. a time for {@code overshoot_max}), a negative
     *                                  or zero settle band or time limit, or a {@code crossings_max}
     *                                  that is not a whole number of at least 1
     */
    public static EffectiveLimits resolve(Limits limits, double swingVolts) {
        Objects.requireNonNull(limits, "limits");
        if (!(swingVolts > 0) || !Double.isFinite(swingVolts)) {
            throw new IllegalArgumentException("swing must be positive and finite, found " + swingVolts + " V");
        }
        List<LimitName> defaulted = new ArrayList<>();
        double overshoot = number(limits, LimitName.OVERSHOOT_MAX, Dimension.VOLTAGE, OVERSHOOT_MAX_V, defaulted);
        double undershoot = number(limits, LimitName.UNDERSHOOT_MAX, Dimension.VOLTAGE, UNDERSHOOT_MAX_V, defaulted);
        double ringback = number(limits, LimitName.RINGBACK_MARGIN_MIN, Dimension.VOLTAGE, RINGBACK_MARGIN_MIN_V,
                defaulted);
        double settleMax = number(limits, LimitName.SETTLE_MAX, Dimension.TIME, Double.NaN, defaulted);
        double band = settleBand(limits, swingVolts, defaulted);
        boolean monotonic = flag(limits, LimitName.MONOTONIC, MONOTONIC, defaulted);
        double delayMax = number(limits, LimitName.DELAY_MAX, Dimension.TIME, Double.NaN, defaulted);
        int crossingsMax = crossingsMax(limits, defaulted);
        double riseMax = number(limits, LimitName.RISE_MAX, Dimension.TIME, Double.NaN, defaulted);
        if (!Double.isNaN(settleMax) && !(settleMax > 0)) {
            throw wrong(LimitName.SETTLE_MAX, "a positive time", limits);
        }
        if (!Double.isNaN(delayMax) && !(delayMax > 0)) {
            throw wrong(LimitName.DELAY_MAX, "a positive time", limits);
        }
        if (!Double.isNaN(riseMax) && !(riseMax > 0)) {
            throw wrong(LimitName.RISE_MAX, "a positive time", limits);
        }
        defaulted.sort(null);
        return new EffectiveLimits(overshoot, undershoot, ringback, settleMax, band, monotonic, delayMax,
                crossingsMax, riseMax, defaulted);
    }

    private static double number(Limits limits, LimitName name, Dimension dimension, double fallback,
                                 List<LimitName> defaulted) {
        Optional<Value> value = limits.get(name);
        if (value.isEmpty()) {
            if (!Double.isNaN(fallback)) {
                defaulted.add(name);
            }
            return fallback;
        }
        if (value.get() instanceof Value.Number n && n.dimension() == dimension) {
            return n.si();
        }
        throw wrong(name, "a " + dimension.displayName() + " (in " + dimension.unitSymbol() + ")", limits);
    }

    private static double settleBand(Limits limits, double swing, List<LimitName> defaulted) {
        Optional<Value> value = limits.get(LimitName.SETTLE_BAND);
        if (value.isEmpty()) {
            defaulted.add(LimitName.SETTLE_BAND);
            return SETTLE_BAND_FRACTION * swing;
        }
        if (value.get() instanceof Value.Number n && n.si() > 0) {
            if (n.dimension() == Dimension.DIMENSIONLESS) {
                return n.si() * swing;
            }
            if (n.dimension() == Dimension.VOLTAGE) {
                return n.si();
            }
        }
        throw wrong(LimitName.SETTLE_BAND, "a positive fraction of the swing (e.g. `5%`) or a voltage (e.g. `0.1V`)",
                limits);
    }

    private static boolean flag(Limits limits, LimitName name, boolean fallback, List<LimitName> defaulted) {
        Optional<Value> value = limits.get(name);
        if (value.isEmpty()) {
            defaulted.add(name);
            return fallback;
        }
        if (value.get() instanceof Value.Flag f) {
            return f.on();
        }
        throw wrong(name, "`true` or `false`", limits);
    }

    private static int crossingsMax(Limits limits, List<LimitName> defaulted) {
        Optional<Value> value = limits.get(LimitName.CROSSINGS_MAX);
        if (value.isEmpty()) {
            defaulted.add(LimitName.CROSSINGS_MAX);
            return CROSSINGS_MAX;
        }
        if (value.get() instanceof Value.Number n && n.dimension() == Dimension.DIMENSIONLESS
                && n.si() >= 1 && n.si() <= Integer.MAX_VALUE && n.si() == Math.rint(n.si())) {
            return (int) n.si();
        }
        throw wrong(LimitName.CROSSINGS_MAX, "a whole number of at least 1", limits);
    }

    private static IllegalArgumentException wrong(LimitName name, String expected, Limits limits) {
        String found = limits.get(name).map(Value::display).orElse("");
        return new IllegalArgumentException("limit `" + name.key() + "` must be " + expected + ", found `" + found + "`");
    }
}
