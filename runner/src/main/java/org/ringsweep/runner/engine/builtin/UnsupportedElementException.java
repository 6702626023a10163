package org.ringsweep.runner.engine.builtin;

/** The circuit holds an element the built-in engine cannot simulate; the message names it. */
final class UnsupportedElementException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    UnsupportedElementException(String message) {
        super(message);
    }
}
