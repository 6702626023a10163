package org.ringsweep.runner.report;

/** A report cannot be written or rebuilt: the message names the file and what went wrong. */
public final class ReportException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** @param message what went wrong, naming the file */
    public ReportException(String message) {
        super(message);
    }

    /**
     * @param message what went wrong, naming the file
     * @param cause   the underlying failure
     */
    public ReportException(String message, Throwable cause) {
        super(message, cause);
    }
}
