package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import org.ringsweep.runner.report.ReportException;
import org.ringsweep.runner.report.Reports;
import org.ringsweep.runner.store.StoreException;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code ringsweep report OUT_DIR}: rebuild {@code report.html} and {@code junit.xml} from a run's results. */
@Command(name = "report", mixinStandardHelpOptions = true,
        description = {"Rebuild OUT_DIR/report.html and OUT_DIR/junit.xml from OUT_DIR/results.sqlite (a sweep's store) when present,",
                "else from OUT_DIR/results.jsonl (a check or tune run). Waveforms come from the raw files under OUT_DIR;",
                "rails, thresholds and limits from the net files, when they are unchanged since the run."})
public final class ReportCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "OUT_DIR", description = "The --out folder of a check, sweep or tune run.")
    Path outDir;

    @Option(names = "--set", paramLabel = "ID/param=value",
            description = "The --set options the check run was given (records do not keep them), so the plots use the same levels.")
    List<String> sets = new ArrayList<>();

    @Option(names = "--quiet", description = "Print nothing but errors.")
    boolean quiet;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        if (!Files.isDirectory(outDir)) {
            err.println("ringsweep: report: `" + outDir + "` is not a folder; expected the --out folder of a run");
            return ExitCodes.INPUT;
        }
        try {
            Reports.Written w = Reports.rebuild(outDir, sets);
            if (!quiet) {
                w.notes().forEach(n -> err.println("ringsweep: report: " + n));
                out.println(w.html());
                out.println(w.junit());
            }
            return ExitCodes.OK;
        } catch (ReportException | StoreException e) {
            err.println("ringsweep: report: " + e.getMessage());
            return ExitCodes.INPUT;
        }
    }
}
