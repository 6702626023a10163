package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.ringsweep.runner.store.ResultStore;
import org.ringsweep.runner.store.StoreExport;
import org.ringsweep.runner.store.RowSource;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code ringsweep results OUT_DIR [--json|--csv] [--best]}: print the records of a results store. */
@Command(name = "results", mixinStandardHelpOptions = true,
        description = "Print the records of a sweep's results store: all of them, or the best point per net (--best).")
public final class ResultsCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "OUT_DIR", description = "The --out folder of a sweep.")
    Path outDir;

    static final class Format {
        @Option(names = "--json", description = "JSON Lines: one ringsweep/result-1 record per line (default).")
        boolean json;

        @Option(names = "--csv", description = "CSV: one row per point, receiver and edge.")
        boolean csv;
    }

    @ArgGroup(exclusive = true)
    Format format = new Format();

    @Option(names = "--best", description = "Only the best point of each net, by the default objective.")
    boolean best;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        Path file = outDir.resolve(ResultStore.FILE_NAME);
        if (!Files.isRegularFile(file)) {
            spec.commandLine().getErr().println("ringsweep: results: " + file + " does not exist; expected the --out folder of a sweep");
            return ExitCodes.INPUT;
        }
        try (ResultStore store = ResultStore.open(outDir)) {
            // streamed row by row from a cursor to the writer: a store of any size prints in bounded memory
            RowSource rows = best ? store.bestPerNet().values()::forEach : store.allRows();
            if (format.csv) {
                StoreExport.toCsv(rows, out);
            } else {
                StoreExport.toJsonLines(rows, out);
            }
            out.flush();
        }
        return ExitCodes.OK;
    }
}
