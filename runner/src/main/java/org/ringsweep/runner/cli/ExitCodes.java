package org.ringsweep.runner.cli;

/** The exit codes of every command, in one place (formats.md, "Commands"). */
public final class ExitCodes {
    /** Every checked point passes. */
    public static final int OK = 0;
    /** Some point violates a limit. */
    public static final int VIOLATION = 1;
    /** Bad input or usage: nothing was simulated; the message names file, line and key. */
    public static final int INPUT = 2;
    /** A simulation failed, or no engine was found. */
    public static final int SIMULATION = 3;

    private ExitCodes() {
    }
}
