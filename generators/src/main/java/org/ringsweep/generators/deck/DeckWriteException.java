package org.ringsweep.generators.deck;

/** A deck could not be written: a template is missing or broken, or the circuit has text the deck may not hold. */
public final class DeckWriteException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** @param message what went wrong, naming the template or element */
    public DeckWriteException(String message) {
        super(message);
    }

    /** @param message what went wrong; @param cause the template engine's error */
    public DeckWriteException(String message, Throwable cause) {
        super(message, cause);
    }
}
