package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.util.function.Supplier;
import org.ringsweep.runner.report.ReportException;
import org.ringsweep.runner.report.Reports;

/**
 * The last step of {@code check}, {@code sweep} and {@code tune}: write {@code report.html} and
 * {@code junit.xml} under {@code --out}. A report that cannot be written is reported on stderr
 * and does not change the run's exit code (its results are already in {@code results.jsonl} or
 * the store, and {@code ringsweep report OUT_DIR} can write it again).
 */
final class ReportStep {
    private ReportStep() {
    }

    /** Runs {@code write} and prints its notes (unless quiet) or its failure to {@code err}. */
    static void run(PrintWriter err, boolean quiet, Supplier<Reports.Written> write) {
        try {
            Reports.Written w = write.get();
            if (!quiet) {
                w.notes().forEach(n -> err.println("ringsweep: report: " + n));
            }
        } catch (ReportException e) {
            err.println("ringsweep: report: " + e.getMessage());
        } catch (RuntimeException e) {
            // A defect in the report code must not hide the run's own verdict and exit code.
            err.println("ringsweep: report: report.html and junit.xml could not be written (internal error: " + e
                    + "); the results are in --out, and `ringsweep report OUT_DIR` can try again");
        }
        err.flush();
    }
}
