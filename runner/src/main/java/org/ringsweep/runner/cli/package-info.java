/**
 * The picocli command line. Commands are {@code Callable<Integer>} returning an exit code from
 * {@link org.ringsweep.runner.cli.ExitCodes}; only {@link org.ringsweep.runner.cli.Main} exits.
 *
 * <p>Tier: internal.
 */
package org.ringsweep.runner.cli;
