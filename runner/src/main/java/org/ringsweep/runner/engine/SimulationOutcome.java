package org.ringsweep.runner.engine;

import java.time.Duration;
import java.util.Objects;
import org.ringsweep.api.wave.Waveforms;

/** What a {@link SimulationEngine} run gave: waveforms, or a classified failure. */
public sealed interface SimulationOutcome permits SimulationOutcome.Success, SimulationOutcome.Failure {
    /** An excerpt of the engine's console output (the full logs stay in the work folder). */
    String engineLog();

    /** Wall-clock time of the engine run. */
    Duration elapsed();

    /** Whether this is a {@link Success}. */
    default boolean succeeded() {
        return this instanceof Success;
    }

    /**
     * The run completed and its output passed every check.
     *
     * @param waveforms time axis (s) and the voltages (V), named by safe node name
     * @param engineLog excerpt of the engine's console output
     * @param elapsed   wall-clock time of the run
     */
    record Success(Waveforms waveforms, String engineLog, Duration elapsed) implements SimulationOutcome {
        /** Checks for nulls. */
        public Success {
            Objects.requireNonNull(waveforms, "waveforms");
            Objects.requireNonNull(engineLog, "engineLog");
            Objects.requireNonNull(elapsed, "elapsed");
        }
    }

    /**
     * The run gave no usable waveforms.
     *
     * @param kind      why, in one word
     * @param message   what it means, quoting the engine's own error lines
     * @param engineLog excerpt of the engine's console output (may be empty)
     * @param elapsed   wall-clock time of the run ({@link Duration#ZERO} when it never started)
     */
    record Failure(FailureKind kind, String message, String engineLog, Duration elapsed) implements SimulationOutcome {
        /** Checks for nulls. */
        public Failure {
            Objects.requireNonNull(kind, "kind");
            Objects.requireNonNull(message, "message");
            Objects.requireNonNull(engineLog, "engineLog");
            Objects.requireNonNull(elapsed, "elapsed");
        }
    }
}
