package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import picocli.CommandLine;

/** Entry point of the ringsweep command line; the only place that calls System.exit. */
public final class Main {
    private Main() {
    }

    /** Runs the command line and exits with its code. */
    public static void main(String[] args) {
        System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /**
     * Runs the command line with the given writers and returns the exit code (for tests).
     *
     * @param args the arguments
     * @param out  standard output
     * @param err  standard error
     * @return an exit code from {@link ExitCodes}
     */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        CommandLine cl = new CommandLine(new RingsweepCommand());
        cl.setOut(out);
        cl.setErr(err);
        cl.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
            // Bad input was already reported by the commands; anything reaching here is unexpected.
            commandLine.getErr().println("ringsweep: internal error: " + ex);
            if (System.getenv("RINGSWEEP_DEBUG") != null) {
                ex.printStackTrace(commandLine.getErr());
            } else {
                commandLine.getErr().println("ringsweep: set RINGSWEEP_DEBUG=1 for details, and please report it");
            }
            return ExitCodes.SIMULATION;
        });
        int code = cl.execute(args);
        out.flush();
        err.flush();
        return code;
    }
}
