package org.ringsweep.runner.cli;

import java.time.Duration;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.runner.engine.CircuitEngine;
import org.ringsweep.runner.engine.FailureKind;
import org.ringsweep.runner.engine.SimulationEngine;
import org.ringsweep.runner.engine.SimulationJob;
import org.ringsweep.runner.engine.SimulationOutcome;
import org.ringsweep.runner.engine.builtin.BuiltinEngine;

/**
 * FOR THE ORCHESTRATION MEMORY TEST ONLY ({@link SweepMemoryTests}): solves the first point with
 * the real built-in engine and hands every later point that same outcome, so a sweep of 10^5
 * points runs in CI time. Everything else a point costs runs for real (elaboration, the deck
 * file, the measurements of the waveform, the limit checks, the JSON record, the store commit),
 * and that is what the memory test is about: what the planner, the batch runner, the store and
 * the summary keep per point. Its records are not physics: never use it for anything else.
 */
final class OrchestrationMemoryEngine implements SimulationEngine, CircuitEngine {
    private final BuiltinEngine real = new BuiltinEngine();
    private volatile SimulationOutcome first;

    @Override
    public String name() {
        return "orchestration-memory-replay";
    }

    @Override
    public String version() {
        return "test";
    }

    @Override
    public SimulationOutcome run(SimulationJob job) {
        return new SimulationOutcome.Failure(FailureKind.UNSUPPORTED, "solves circuits only", "", Duration.ZERO);
    }

    @Override
    public SimulationOutcome solve(Circuit circuit, Duration timeout) {
        SimulationOutcome o = first;
        if (o == null) {
            synchronized (this) {
                if (first == null) {
                    first = real.solve(circuit, timeout);
                }
                o = first;
            }
        }
        return o;
    }
}
