package org.ringsweep.runner.engine.builtin;

import java.time.Duration;
import java.util.Objects;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.runner.engine.CircuitEngine;
import org.ringsweep.runner.engine.FailureKind;
import org.ringsweep.runner.engine.SimulationEngine;
import org.ringsweep.runner.engine.SimulationJob;
import org.ringsweep.runner.engine.SimulationOutcome;

/**
 * The in-process transient engine: solves a {@link Circuit} directly (no deck, no process) by
 * modified nodal analysis with fixed-step trapezoidal integration, lossless lines by the method
 * of characteristics, lossy lines as lossless sections with lumped loss, level-1 diodes (with
 * depletion capacitance) and table-driven current sources by Newton–Raphson. The method and its limits are described on {@code TransientSolver} and
 * {@code Netlist} (this package).
 *
 * <p>Supported: resistors, capacitors, inductors, DC and PWL voltage sources, timed resistors,
 * table-driven current sources (IBIS V–I tables), lossless and lossy lines, diodes (IS, N, RS,
 * CJO with the SPICE defaults VJ = 1 V, M = 0.5, FC = 0.5). Sub-circuit text is refused as
 * {@link FailureKind#UNSUPPORTED}, naming the element.
 *
 * <p>Stateless and thread-safe: every solve builds its own matrices.
 */
public final class BuiltinEngine implements SimulationEngine, CircuitEngine {
    /** The engine name results report. */
    public static final String NAME = "builtin";

    /** An engine; it needs no configuration. */
    public BuiltinEngine() {
    }

    /** {@value #NAME}. */
    @Override
    public String name() {
        return NAME;
    }

    /** The jar's {@code Implementation-Version}, or {@code dev} when run from classes. */
    @Override
    public String version() {
        String v = BuiltinEngine.class.getPackage().getImplementationVersion();
        return v == null || v.isBlank() ? "dev" : v;
    }

    /**
     * A deck cannot be run by this engine: always a {@link FailureKind#UNSUPPORTED} failure
     * saying to call {@link #solve(Circuit, Duration)} with the circuit instead.
     */
    @Override
    public SimulationOutcome run(SimulationJob job) {
        Objects.requireNonNull(job, "job");
        return new SimulationOutcome.Failure(FailureKind.UNSUPPORTED, "the built-in engine solves circuits, not decks:"
                + " the point runner must call solve(circuit, timeout) for `" + job.deckFileName() + "`", "", Duration.ZERO);
    }

    /**
     * Solves the circuit's transient analysis from its DC operating point at t = 0.
     *
     * @param circuit the circuit (its probes are the returned signals, by safe node name)
     * @param timeout wall-clock limit, checked every few dozen time steps
     * @return a Success with the time axis (every accepted step, 0 to the stop time) and the
     *         probes' voltages (V); or a Failure: UNSUPPORTED (naming the element),
     *         SINGULAR_MATRIX, CONVERGENCE or TIMEOUT
     */
    @Override
    public SimulationOutcome solve(Circuit circuit, Duration timeout) {
        Objects.requireNonNull(circuit, "circuit");
        Objects.requireNonNull(timeout, "timeout");
        long start = System.nanoTime();
        // Durations beyond a year would overflow nanoseconds: treat them as no limit.
        long limit = timeout.compareTo(Duration.ofDays(365)) > 0 ? Long.MAX_VALUE / 4 : Math.max(0, timeout.toNanos());
        long deadline = start + limit;
        try {
            Netlist net = new Netlist(circuit);
            TransientSolver solver = new TransientSolver(circuit, net, deadline);
            Waveforms w = solver.solve();
            String log = "builtin: " + net.size() + " unknowns, step " + solver.step() + " s, " + w.size()
                    + " time points, " + solver.solveCount() + " solves, " + solver.factorCount() + " factorisations, " + solver.rejectedSteps() + " steps redone smaller";
            return new SimulationOutcome.Success(w, log, elapsed(start));
        } catch (UnsupportedElementException e) {
            return new SimulationOutcome.Failure(FailureKind.UNSUPPORTED, e.getMessage(), "", elapsed(start));
        } catch (SolveException e) {
            return new SimulationOutcome.Failure(e.kind(), e.getMessage(), "", elapsed(start));
        } catch (RuntimeException e) {
            // A defect of this engine, not of the circuit: report it as a crash rather than throw.
            return new SimulationOutcome.Failure(FailureKind.CRASH, "the built-in engine failed: " + e, "", elapsed(start));
        }
    }

    private static Duration elapsed(long start) {
        return Duration.ofNanos(System.nanoTime() - start);
    }
}
