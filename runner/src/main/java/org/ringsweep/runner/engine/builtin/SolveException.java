package org.ringsweep.runner.engine.builtin;

import org.ringsweep.runner.engine.FailureKind;

/** A solve that cannot finish: why, in one word, and what happened, for the user. */
final class SolveException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    private final FailureKind kind;

    SolveException(FailureKind kind, String message) {
        super(message);
        this.kind = kind;
    }

    FailureKind kind() {
        return kind;
    }
}
