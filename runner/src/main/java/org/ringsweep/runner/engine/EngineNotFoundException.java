package org.ringsweep.runner.engine;

/**
 * No engine is available for the {@code --engine} choice; the message says what was looked for
 * and how to fix it. The command line reports it with exit code 3 (formats.md, Commands).
 */
public final class EngineNotFoundException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** @param message what was looked for and how to fix it */
    public EngineNotFoundException(String message) {
        super(message);
    }

    /** This failure as an outcome of kind {@link FailureKind#ENGINE_NOT_FOUND}, for result records. */
    public SimulationOutcome.Failure asFailure() {
        return new SimulationOutcome.Failure(FailureKind.ENGINE_NOT_FOUND, getMessage(), "", java.time.Duration.ZERO);
    }
}
