package org.ringsweep.runner.raw;

/** A raw file that cannot be read: the message names the file, where and what was expected. */
public final class RawFormatException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** @param message file, position, found and expected */
    public RawFormatException(String message) {
        super(message);
    }

    /** @param message file, position, found and expected; @param cause the I/O failure */
    public RawFormatException(String message, Throwable cause) {
        super(message, cause);
    }
}
