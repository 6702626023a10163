package org.ringsweep.runner.store;

/** The results store cannot be opened, read or written; the message names the file and why. */
public final class StoreException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /**
     * @param message what failed, naming the file
     * @param cause   the driver's exception, or null
     */
    public StoreException(String message, Throwable cause) {
        super(message, cause);
    }
}
