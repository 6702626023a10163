package org.ringsweep.api.wave;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.apiguardian.api.API;

/**
 * The result of one transient run: a time axis and named signals of the same length.
 *
 * <p>Immutable: arrays are copied in and out ({@link #signal} returns a copy); use
 * {@link #time(int)} and {@link #value(String, int)} in loops to avoid copies.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class Waveforms {
    private final double[] time;
    private final Map<String, double[]> signals;
    private final boolean truncated;

    private Waveforms(double[] time, Map<String, double[]> signals, boolean truncated) {
        this.time = time;
        this.signals = signals;
        this.truncated = truncated;
    }

    /**
     * Makes waveforms from a time axis and signals (all copied).
     *
     * @param time      strictly increasing times (s), finite
     * @param signals   signal name → values, each the same length as {@code time}
     * @param truncated whether the source data ended early (a killed or failed run)
     * @throws IllegalArgumentException if lengths differ, a time is not finite or times do not increase
     */
    public static Waveforms of(double[] time, Map<String, double[]> signals, boolean truncated) {
        for (int i = 0; i < time.length; i++) {
            if (!Double.isFinite(time[i]) || (i > 0 && time[i] <= time[i - 1])) {
                throw new IllegalArgumentException("time axis must be finite and strictly increasing (index " + i + ")");
            }
        }
        Map<String, double[]> copy = new LinkedHashMap<>();
        signals.forEach((k, v) -> {
            if (v.length != time.length) {
                throw new IllegalArgumentException("signal " + k + " has " + v.length + " samples, expected " + time.length);
            }
            copy.put(k, v.clone());
        });
        return new Waveforms(time.clone(), Collections.unmodifiableMap(copy), truncated);
    }

    /** Number of samples. */
    public int size() {
        return time.length;
    }

    /** The i-th time (s). */
    public double time(int i) {
        return time[i];
    }

    /** A copy of the time axis. */
    public double[] times() {
        return time.clone();
    }

    /** The signal names. */
    public Set<String> names() {
        return signals.keySet();
    }

    /** Whether a signal is present. */
    public boolean has(String name) {
        return signals.containsKey(name);
    }

    /** The i-th value of a signal. */
    public double value(String name, int i) {
        return require(name)[i];
    }

    /** A copy of a signal's values, if present. */
    public Optional<double[]> signal(String name) {
        double[] v = signals.get(name);
        return v == null ? Optional.empty() : Optional.of(v.clone());
    }

    /** Whether the data ended before the run did. */
    public boolean truncated() {
        return truncated;
    }

    /** The last time, or NaN when empty. */
    public double endTime() {
        return time.length == 0 ? Double.NaN : time[time.length - 1];
    }

    private double[] require(String name) {
        double[] v = signals.get(name);
        if (v == null) {
            throw new IllegalArgumentException("no signal " + name + "; have " + signals.keySet());
        }
        return v;
    }
}
