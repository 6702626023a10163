package org.ringsweep.runner.engine.builtin;

import java.nio.file.Path;
import java.time.Duration;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.Transient;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.generators.deck.DeckOptions;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.runner.engine.NgspiceEngine;
import org.ringsweep.runner.engine.SimulationJob;
import org.ringsweep.runner.engine.SimulationOutcome;

/** Small circuits and waveform look-ups for the built-in engine's tests. */
final class Circuits {
    private Circuits() {
    }

    /** A circuit probing the given nodes. */
    static Circuit of(List<Primitive> primitives, Transient analysis, String... probes) {
        Map<String, String> p = new LinkedHashMap<>();
        for (String n : probes) {
            p.put(n, n);
        }
        return new Circuit("test", primitives, analysis, p, Map.of());
    }

    /** A step source: 0 V until {@code at}, then {@code volts} after a ramp of {@code edge} seconds. */
    static Primitive.PwlVoltage step(String name, String node, double at, double edge, double volts) {
        return new Primitive.PwlVoltage(name, node, "0", new double[] {at, at + edge}, new double[] {0, volts});
    }

    /** Solves with the built-in engine and fails the test when it does not succeed. */
    static Waveforms solve(Circuit c) {
        SimulationOutcome o = new BuiltinEngine().solve(c, Duration.ofSeconds(60));
        if (o instanceof SimulationOutcome.Failure f) {
            throw new AssertionError(f.kind() + ": " + f.message());
        }
        return ((SimulationOutcome.Success) o).waveforms();
    }

    /** A signal's value at time t, linear between samples. */
    static double at(Waveforms w, String node, double t) {
        for (int i = 1; i < w.size(); i++) {
            if (w.time(i) >= t) {
                double t0 = w.time(i - 1);
                double v0 = w.value(node, i - 1);
                return v0 + (w.value(node, i) - v0) * (t - t0) / (w.time(i) - t0);
            }
        }
        throw new AssertionError("time " + t + " beyond the waveform's end " + w.endTime());
    }

    /** The largest value of a signal. */
    static double max(Waveforms w, String node) {
        double m = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < w.size(); i++) {
            m = Math.max(m, w.value(node, i));
        }
        return m;
    }

    /** Runs the circuit on ngspice (the real deck writer and engine) and fails the test when it does not succeed. */
    static Waveforms ngspice(Path ngspice, Circuit c, Path dir) {
        String deck = new DeckWriter().render(c, DeckOptions.of("x.raw"));
        SimulationOutcome o = NgspiceEngine.at(ngspice).run(new SimulationJob(deck, dir, "x.cir", "x.raw",
                c.analysis().stop(), Duration.ofSeconds(120), c.probes()));
        if (o instanceof SimulationOutcome.Failure f) {
            throw new AssertionError("ngspice: " + f.kind() + ": " + f.message());
        }
        return ((SimulationOutcome.Success) o).waveforms();
    }

    /** The largest difference of a node's voltage between two solutions, at the reference's time points. */
    static double worstDifference(Waveforms ref, Waveforms mine, String node) {
        double worst = 0;
        for (int i = 0; i < ref.size(); i++) {
            double t = ref.time(i);
            if (t > 0 && t < mine.endTime()) {
                worst = Math.max(worst, Math.abs(ref.value(node, i) - at(mine, node, t)));
            }
        }
        return worst;
    }

    /** The first time a node's voltage crosses {@code level} in the given direction, linear between samples; NaN if never. */
    static double crossing(Waveforms w, String node, double level, boolean rising) {
        for (int i = 1; i < w.size(); i++) {
            double a = w.value(node, i - 1) - level;
            double b = w.value(node, i) - level;
            if (rising ? a < 0 && b >= 0 : a > 0 && b <= 0) {
                return w.time(i - 1) + (w.time(i) - w.time(i - 1)) * a / (a - b);
            }
        }
        return Double.NaN;
    }
}
