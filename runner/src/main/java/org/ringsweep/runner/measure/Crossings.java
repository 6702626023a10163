package org.ringsweep.runner.measure;

import java.util.ArrayList;
import java.util.List;

/**
 * Level crossings of a sampled waveform ({@code waveform-metrics.md} §4.2 and §4.3): raw crossings
 * by linear interpolation, and a hysteresis detector that ignores noise or ringing merely
 * touching the level.
 */
public final class Crossings {
    /** Raw crossings closer than this (s) are one crossing: a sample exactly on the level (§4.2). */
    public static final double DUPLICATE_S = 1e-18;

    private static final int UNKNOWN = 0;
    private static final int LOW = -1;
    private static final int HIGH = 1;

    private Crossings() {
    }

    /**
     * Raw crossings of {@code level} (§4.2): segment i−1→i crosses when
     * {@code (v[i-1] − L)·(v[i] − L) ≤ 0} and {@code v[i-1] ≠ v[i]}; the instant is linearly
     * interpolated. A sample exactly on the level, found by both its segments at the same instant,
     * is reported once when the waveform goes through it, and not at all when it only touches
     * the level and turns back; a flat segment lying on the level yields none (the crossing is
     * timed where the wave first reaches the level). The direction is that of the segment.
     *
     * @param t     times (s), not decreasing (equal times: the later sample wins)
     * @param v     values (V)
     * @param level the level (V)
     * @return the crossings in time order
     * @throws IllegalArgumentException if the series is malformed
     */
    public static List<Crossing> raw(double[] t, double[] v, double level) {
        Samples.check(t, v);
        List<Crossing> out = new ArrayList<>();
        for (int i = 1; i < t.length; i++) {
            double tc = rawCrossing(t, v, i, level);
            if (Double.isNaN(tc)) {
                continue;
            }
            boolean rising = v[i] > v[i - 1];
            Crossing last = out.isEmpty() ? null : out.get(out.size() - 1);
            if (last != null && last.rising() == rising) {
                continue; // two crossings the same way in a row: the wave sat on the level in between
            }
            if (last != null && Math.abs(tc - last.time()) <= DUPLICATE_S) {
                out.remove(out.size() - 1); // up to the level and straight back: a touch, not a crossing
                continue;
            }
            out.add(new Crossing(tc, rising));
        }
        return List.copyOf(out);
    }

    /**
     * Crossings of {@code level} through the band {@code [level − h, level + h]} (§4.3). The
     * detector is LOW below the band and HIGH above it; a change LOW→HIGH is a rising crossing
     * and HIGH→LOW a falling one, each timed at the most recent raw crossing of the level. The
     * initial state comes from the first sample outside the band, which is not itself a crossing.
     * With {@code h = 0} this reduces to raw crossings (samples exactly on the level are skipped
     * as "inside the band").
     *
     * @param t          times (s), not decreasing
     * @param v          values (V)
     * @param level      the level (V)
     * @param hysteresis the band half-width h (V), not negative
     * @return the crossings in time order
     * @throws IllegalArgumentException if the series is malformed or h is negative
     */
    public static List<Crossing> withHysteresis(double[] t, double[] v, double level, double hysteresis) {
        Samples.check(t, v);
        return detect(t, v, level, hysteresis, false);
    }

    /**
     * The §4.3 detector; with {@code startLowBelowLevel}, a series whose first sample lies inside
     * the band but below the level starts in the LOW state (the state before an edge), so that
     * an edge starting just under its threshold is still counted when it crosses.
     */
    static List<Crossing> detect(double[] t, double[] v, double level, double hysteresis, boolean startLowBelowLevel) {
        if (!(hysteresis >= 0) || !Double.isFinite(hysteresis)) {
            throw new IllegalArgumentException("hysteresis must be zero or positive, found " + hysteresis + " V");
        }
        List<Crossing> out = new ArrayList<>();
        int state = UNKNOWN;
        if (startLowBelowLevel && v[0] < level) {
            state = LOW;
        }
        double lastRaw = Double.NaN;
        for (int i = 0; i < t.length; i++) {
            if (i > 0) {
                double tc = rawCrossing(t, v, i, level);
                if (!Double.isNaN(tc)) {
                    lastRaw = tc;
                }
            }
            int s = v[i] < level - hysteresis ? LOW : v[i] > level + hysteresis ? HIGH : UNKNOWN;
            if (s != UNKNOWN && s != state) {
                if (state != UNKNOWN) {
                    // Going from one side of the band to the other passes the level, so lastRaw is set.
                    out.add(new Crossing(Double.isNaN(lastRaw) ? t[i] : lastRaw, s == HIGH));
                }
                state = s;
            }
        }
        return out;
    }

    /** The raw crossing instant of segment i−1→i, or NaN (§4.2). */
    static double rawCrossing(double[] t, double[] v, int i, double level) {
        double a = v[i - 1] - level;
        double b = v[i] - level;
        if ((a > 0 && b > 0) || (a < 0 && b < 0) || v[i - 1] == v[i] || t[i] == t[i - 1]) {
            return Double.NaN;
        }
        return t[i - 1] + (level - v[i - 1]) * (t[i] - t[i - 1]) / (v[i] - v[i - 1]);
    }
}
