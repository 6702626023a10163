package org.ringsweep.runner.measure;

import java.util.List;
import java.util.Objects;
import org.ringsweep.api.net.Stimulus;

/**
 * Measures one edge of a receiver waveform: the definitions of {@code formats.md} "Results"
 * computed with the algorithms of {@code waveform-metrics.md} §4 on a sampled, possibly
 * non-uniform time series with linear interpolation between samples.
 *
 * <p>The window is {@code [start, end]} of the {@link EdgeWindow}, with interpolated values at
 * both ends included as samples, so a window may start and end between samples and may hold no
 * sample of its own. The value at the start is the level before the edge; the value at the end
 * is the final level {@code vFinal}.
 *
 * <p>A falling edge is measured as the mirror image of a rising one: its threshold is VIL and
 * its ringback margin {@code VIL − max(v)} after the first trough, and so on (see
 * {@link EdgeMetrics} for every field).
 *
 * <p><b>The settled rule</b> (a choice of this project): because {@code vFinal} is taken at the
 * window end, a waveform still moving at the end would look settled by construction (it is always
 * inside a band around its own last value). An edge therefore counts as settled only if it stays
 * inside {@code [vFinal ± settleBand]} over at least the last 20 % of the window
 * ({@link #SETTLED_TAIL_FRACTION}); otherwise {@code settled} is false and
 * {@code settleS} is NaN, never a number measured as if it had settled. Choose windows (settle
 * times) long enough for the net to come to rest.
 */
public final class EdgeMeasurer {
    /** The fraction of the window at its end in which the wave must stay inside the band to count as settled. */
    public static final double SETTLED_TAIL_FRACTION = 0.2;
    /** The lower slew level as a fraction of the way from the level before the edge to {@code vFinal}. */
    public static final double SLEW_FROM_FRACTION = 0.2;
    /** The upper slew level as a fraction of the way from the level before the edge to {@code vFinal}. */
    public static final double SLEW_TO_FRACTION = 0.8;

    private EdgeMeasurer() {
    }

    /**
     * Measures one edge.
     *
     * @param t      sample times (s), strictly increasing (equal times are tolerated: the later
     *               sample wins)
     * @param v      sample values (V), same length
     * @param w      the edge's window; it must lie inside {@code [t[0], t[n−1]]}
     * @param levels rails, thresholds, settle band and hysteresis (V)
     * @return the edge's metrics; metrics that could not be found are NaN
     * @throws IllegalArgumentException if the series is malformed (lengths, fewer than two samples,
     *                                  non-finite values, decreasing times) or the window is not
     *                                  inside the data
     */
    public static EdgeMetrics measure(double[] t, double[] v, EdgeWindow w, Levels levels) {
        Objects.requireNonNull(w, "window");
        Objects.requireNonNull(levels, "levels");
        Samples s = Samples.window(t, v, w.start(), w.end());
        boolean rising = w.direction() == Stimulus.Edge.RISE;
        double h = levels.hysteresis();
        double threshold = rising ? levels.vih() : levels.vil();
        double near = rising ? levels.vil() : levels.vih();

        double vMax = Double.NEGATIVE_INFINITY;
        double vMin = Double.POSITIVE_INFINITY;
        for (double x : s.v) {
            vMax = Math.max(vMax, x);
            vMin = Math.min(vMin, x);
        }
        double overshoot = rising ? vMax - levels.highRail() : Double.NaN;
        double undershoot = rising ? Double.NaN : levels.lowRail() - vMin;

        // In "directed" values u a falling edge rises, so one set of algorithms serves both.
        Samples u = rising ? s : s.negated();
        double sign = rising ? 1 : -1;
        double uThreshold = sign * threshold;

        List<Crossing> forward = forwardCrossings(u, uThreshold, h);
        int crossings = forward.size();
        double first = crossings == 0 ? Double.NaN : forward.get(0).time();
        double last = crossings == 0 ? Double.NaN : forward.get(crossings - 1).time();
        List<Crossing> nearCrossings = forwardCrossings(u, sign * near, h);
        double nearFirst = nearCrossings.isEmpty() ? Double.NaN : nearCrossings.get(0).time();
        double transition = first - lastAtOrBefore(nearCrossings, first);

        double peak = Double.NaN;
        double margin = Double.NaN;
        if (crossings > 0) {
            double[] pm = ringback(u, uThreshold, h, first);
            peak = pm[0];
            margin = pm[1];
        }

        double lower = rising ? levels.vil() : -levels.vih();
        double upper = rising ? levels.vih() : -levels.vil();
        double depth = reversalDepth(u, lower, upper);
        boolean monotonic = !(depth > h);

        double[] slew = slew(u, h);

        double band = levels.settleBand();
        double vFinal = s.last();
        double instant = lastEntry(s, vFinal, band);
        double tailStart = w.end() - SETTLED_TAIL_FRACTION * w.span();
        double tail = tailDeviation(s, vFinal, tailStart);
        boolean settled = tail <= band;
        double settleInstant = settled ? instant : Double.NaN;

        return new EdgeMetrics(w.direction(), w.start(), w.end(), threshold, h,
                s.first(), vMax, vMin, vFinal, overshoot, undershoot,
                crossings, first, last, nearFirst, first - w.source50(),
                peak, margin, monotonic, depth,
                slew[0], slew[1], slew[2],
                band, settleInstant, settleInstant - w.source50(), settled, tail, transition);
    }

    /**
     * The area beyond a level ({@code waveform-metrics.md} §4.11): {@code ∫ max(0, v − level) dt}
     * when {@code above}, {@code ∫ max(0, level − v) dt} otherwise, over {@code [start, end]}
     * with the interpolated end points, by trapezoids on linear segments split at their crossing
     * of the level (exact for the piecewise-linear wave). Used for memory-interface overshoot
     * area limits.
     *
     * @param t     sample times (s), strictly increasing
     * @param v     sample values (V)
     * @param start start of the interval (s), inside the data
     * @param end   end of the interval (s), after {@code start} and inside the data
     * @param level the level (V), e.g. the high rail
     * @param above whether to integrate the excursion above the level (else below it)
     * @return the area (V·s), zero or positive
     * @throws IllegalArgumentException if the series is malformed or the interval not inside the data
     */
    public static double areaBeyond(double[] t, double[] v, double start, double end, double level, boolean above) {
        Samples s = Samples.window(t, v, start, end);
        double sign = above ? 1 : -1;
        double area = 0;
        for (int i = 1; i < s.size(); i++) {
            double dt = s.t[i] - s.t[i - 1];
            double a = sign * (s.v[i - 1] - level);
            double b = sign * (s.v[i] - level);
            if (a >= 0 && b >= 0) {
                area += 0.5 * (a + b) * dt;
            } else if (a > 0) {
                area += 0.5 * a * (dt * a / (a - b)); // triangle up to the crossing
            } else if (b > 0) {
                area += 0.5 * b * (dt * b / (b - a)); // triangle from the crossing
            }
        }
        return area;
    }

    /** Rising crossings of {@code level} in directed values, the detector starting LOW below the level. */
    private static List<Crossing> forwardCrossings(Samples u, double level, double h) {
        return Crossings.detect(u.t, u.v, level, h, true).stream().filter(Crossing::rising).toList();
    }

    /**
     * {peak instant, margin} of a directed (rising) wave: the first local maximum after
     * {@code first} that the wave then falls from by more than {@code h} (else the highest point
     * after {@code first}), and {@code min(u − level)} from that peak to the window end.
     */
    private static double[] ringback(Samples u, double level, double h, double first) {
        int i = Samples.lastAtOrBefore(u.t, first) + 1;
        double runMax = level;
        double runMaxT = first;
        int peakIndex = -1;
        for (; i < u.size(); i++) {
            if (u.v[i] > runMax) {
                runMax = u.v[i];
                runMaxT = u.t[i];
                peakIndex = i;
            } else if (u.v[i] < runMax - h) {
                break;
            }
        }
        double min = runMax;
        for (int j = Math.max(peakIndex, 0); j < u.size(); j++) {
            if (u.t[j] >= runMaxT) {
                min = Math.min(min, u.v[j]);
            }
        }
        return new double[] {runMaxT, min - level};
    }

    /**
     * The deepest reversal of a directed (rising) wave inside [lower, upper] (§4.9): from the first
     * sample above {@code lower} until the wave first reaches {@code upper}, the largest fall below
     * the running maximum. NaN if the wave never gets above {@code lower}. Extremes of a
     * piecewise-linear wave lie on samples, so samples suffice.
     */
    private static double reversalDepth(Samples u, double lower, double upper) {
        boolean entered = false;
        double runMax = Double.NEGATIVE_INFINITY;
        double depth = 0;
        for (int i = 0; i < u.size(); i++) {
            if (!entered) {
                if (!(u.v[i] > lower)) {
                    continue;
                }
                entered = true;
            }
            if (u.v[i] >= upper) {
                break;
            }
            runMax = Math.max(runMax, u.v[i]);
            depth = Math.max(depth, runMax - u.v[i]);
        }
        return entered ? depth : Double.NaN;
    }

    /** {t20, t80, slew} of a directed wave from its first to its last value; NaN where not found. */
    private static double[] slew(Samples u, double h) {
        double from = u.first();
        double step = u.last() - from;
        if (!(step > 0)) {
            return new double[] {Double.NaN, Double.NaN, Double.NaN};
        }
        double t20 = firstTime(forwardCrossings(u, from + SLEW_FROM_FRACTION * step, h));
        double t80 = firstTime(forwardCrossings(u, from + SLEW_TO_FRACTION * step, h));
        double rate = t80 > t20 ? (SLEW_TO_FRACTION - SLEW_FROM_FRACTION) * step / (t80 - t20) : Double.NaN;
        return new double[] {t20, t80, rate};
    }

    /** The last crossing at or before {@code t} (s); NaN if none or {@code t} is NaN. */
    private static double lastAtOrBefore(List<Crossing> crossings, double t) {
        double last = Double.NaN;
        for (Crossing c : crossings) {
            if (c.time() <= t) {
                last = c.time();
            }
        }
        return last;
    }

    private static double firstTime(List<Crossing> crossings) {
        return crossings.isEmpty() ? Double.NaN : crossings.get(0).time();
    }

    /**
     * The last entry into {@code [vFinal ± band]} (§4.7): after the last sample outside the band,
     * the interpolated point where the following segment reaches the band edge; the window start
     * if no sample is outside.
     */
    private static double lastEntry(Samples s, double vFinal, double band) {
        int k = -1;
        for (int i = s.size() - 1; i >= 0; i--) {
            if (Math.abs(s.v[i] - vFinal) > band) {
                k = i;
                break;
            }
        }
        if (k < 0) {
            return s.t[0];
        }
        // k + 1 exists: the last sample is vFinal itself, inside the band.
        double edge = s.v[k] > vFinal ? vFinal + band : vFinal - band;
        return s.t[k] + (edge - s.v[k]) * (s.t[k + 1] - s.t[k]) / (s.v[k + 1] - s.v[k]);
    }

    /** The largest |v − vFinal| from {@code tailStart} (interpolated) to the window end. */
    private static double tailDeviation(Samples s, double vFinal, double tailStart) {
        double dev = Math.abs(s.valueAt(tailStart) - vFinal);
        for (int i = 0; i < s.size(); i++) {
            if (s.t[i] > tailStart) {
                dev = Math.max(dev, Math.abs(s.v[i] - vFinal));
            }
        }
        return dev;
    }
}
