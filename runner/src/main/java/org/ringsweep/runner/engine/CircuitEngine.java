package org.ringsweep.runner.engine;

import java.time.Duration;
import org.ringsweep.api.circuit.Circuit;

/**
 * An engine that solves a {@link Circuit} directly, in-process, without a deck. The point runner
 * prefers this over {@link SimulationEngine#run(SimulationJob)} when the engine offers it; the
 * deck is still written for the record.
 */
public interface CircuitEngine {
    /**
     * Solves the circuit's transient analysis.
     *
     * @param circuit the circuit (its probes are the signals to return)
     * @param timeout wall-clock limit; a longer solve is stopped and reported as a TIMEOUT failure
     * @return a Success with the probes' waveforms, or a Failure (e.g. UNSUPPORTED element) — never throws for the circuit's sake
     */
    SimulationOutcome solve(Circuit circuit, Duration timeout);
}
