package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.Callable;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.importer.BoardImporter;
import org.ringsweep.runner.importer.BoardMapping;
import org.ringsweep.runner.importer.BoardMappingLoader;
import org.ringsweep.runner.importer.ImportReport;
import org.ringsweep.runner.input.InputException;
import org.ringsweep.runner.netlist.LengthRow;
import org.ringsweep.runner.netlist.LengthTableReader;
import org.ringsweep.runner.netlist.Netlist;
import org.ringsweep.runner.netlist.NetlistReader;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code ringsweep import NETLIST --board BOARD.yaml --out DIR}: one net file per included net. */
@Command(name = "import", mixinStandardHelpOptions = true,
        description = {"Make net files (ringsweep/net-1) from a board netlist: IPC-D-356A or a CSV pin list",
                "(net,refdes,pin[,x,y]), detected automatically, with a board mapping file (ringsweep/board-1).",
                "Prints what it made, what it skipped and why, and the pins no rule classifies.",
                "Exit codes: 0 done (nets may be skipped), 2 bad netlist, board file or length table."})
public final class ImportCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "NETLIST", description = "IPC-D-356A netlist or CSV pin list.")
    Path netlist;

    @Option(names = "--board", required = true, paramLabel = "BOARD.yaml", description = "Board mapping file (ringsweep/board-1).")
    Path board;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "ringsweep-out",
            description = "Folder for the net files (default: ${DEFAULT-VALUE}).")
    Path out;

    @Override
    public Integer call() {
        PrintWriter o = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        BuiltinModels catalog = new BuiltinModels();
        ImportReport report;
        try {
            BoardMapping mapping = new BoardMappingLoader(catalog).load(board);
            Netlist nets = new NetlistReader().read(netlist, netlist.toString(), mapping.unit());
            Map<String, List<LengthRow>> lengths = mapping.lengths() == null ? Map.of()
                    : new LengthTableReader().read(mapping.lengths(), mapping.lengths().toString(), mapping.unit());
            report = new BoardImporter(catalog).run(nets, mapping, lengths, out);
            o.printf("%s: %s netlist, %d pin(s) on %d net(s)%n", netlist, nets.kind(), nets.pins().size(), nets.byNet().size());
        } catch (InputException e) {
            err.println("ringsweep: " + e.getMessage());
            return ExitCodes.INPUT;
        } catch (UncheckedIOException e) {
            err.println("ringsweep: --out " + out + ": cannot write (" + e.getCause().getMessage() + ")");
            return ExitCodes.INPUT;
        }
        print(report, o);
        if (!report.errors().isEmpty()) {
            report.errors().forEach(e -> err.println("ringsweep: " + e));
            return ExitCodes.INPUT;
        }
        if (!report.made().isEmpty()) {
            o.printf("next: ringsweep screen %s   (then: ringsweep check %s)%n", out, out);
        }
        return ExitCodes.OK;
    }

    static void print(ImportReport report, PrintWriter o) {
        o.printf("made %d net file(s) in the output folder:%n", report.made().size());
        for (ImportReport.Made m : report.made()) {
            o.printf("  %-28s %-24s %d pins, class %s, %s%s%n", m.file().getFileName(), m.net(), m.pins(), m.netClass(),
                    m.estimated() ? "lengths ESTIMATED from coordinates" : "lengths from the length table",
                    m.pieces().size() > 1 ? ", joined from " + String.join(" + ", m.pieces()) : "");
        }
        if (!report.skipped().isEmpty()) {
            o.printf("skipped %d net(s):%n", report.skipped().size());
            report.skipped().forEach(s -> o.printf("  %-28s %s%n", s.net(), s.reason()));
        }
        if (!report.unknown().isEmpty()) {
            o.println("unknown reference designators (add them to drivers, receivers, series or ignore in the board file):");
            report.unknown().forEach((ref, pins) -> o.printf("  %-8s %s%n", ref, String.join(", ", pins)));
        }
        if (!report.notes().isEmpty()) {
            o.println("notes:");
            report.notes().forEach(n -> o.println("  " + n));
        }
    }
}
