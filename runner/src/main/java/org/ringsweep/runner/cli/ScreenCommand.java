package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetValidationException;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.input.InputException;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.screen.LineClass;
import org.ringsweep.runner.screen.NetScreen;
import org.ringsweep.runner.screen.ScreenJson;
import org.ringsweep.runner.screen.ScreenResult;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code ringsweep screen NET.yaml...}: the analytic pre-screen, no simulation, nets ranked by risk. */
@Command(name = "screen", mixinStandardHelpOptions = true,
        description = {"Analytic pre-screen without simulation: edge rate, knee frequency (0.5/tr) and bandwidth (0.35/tr),",
                "path delays, TD/tr with its classification, the first bounce-diagram voltages and the series",
                "resistor Z0 - r_out, nets ranked by risk (worst first). A folder stands for its *.yaml files.",
                "Exit codes: 0 screened, 2 bad input (nothing screened)."})
public final class ScreenCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(arity = "1..*", paramLabel = "NET.yaml", description = "Net files (ringsweep/net-1) or folders of them.")
    List<Path> nets;

    @Option(names = "--json", description = "Print one ringsweep/screen-1 record per line instead of the table.")
    boolean json;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        BuiltinModels catalog = new BuiltinModels();
        NetFileLoader loader = new NetFileLoader(catalog);
        NetScreen screen = new NetScreen(catalog);
        List<ScreenResult> results = new ArrayList<>();
        List<String> problems = new ArrayList<>();
        List<Path> files;
        try {
            files = NetFiles.expand(nets);
        } catch (InputException e) {
            err.println("ringsweep: " + e.getMessage());
            return ExitCodes.INPUT;
        }
        for (Path f : files) {
            try {
                Net net = loader.load(f);
                results.add(screen.screen(net, f.toString()));
            } catch (InputException e) {
                problems.add(e.getMessage());
            } catch (NetValidationException | ModelParameterException e) {
                problems.add(f + ": " + e.getMessage());
            }
        }
        if (!problems.isEmpty()) {
            problems.forEach(p -> err.println("ringsweep: " + p));
            return ExitCodes.INPUT;
        }
        List<ScreenResult> ranked = NetScreen.rank(results);
        if (json) {
            for (int i = 0; i < ranked.size(); i++) {
                out.println(ScreenJson.line(ranked.get(i), i + 1));
            }
        } else {
            table(ranked, out);
        }
        return ExitCodes.OK;
    }

    static void table(List<ScreenResult> ranked, PrintWriter out) {
        out.println("Pre-screen (no simulation), most at risk first. tr: 10-90 % of the driver's ramp; TD: longest driver-to-receiver delay.");
        out.println("Rule: " + LineClass.RULE + ".");
        out.println("LAUNCH = Vs*Z0/(Rs+Z0); FAR1 = LAUNCH*(1+GL), GL = +1 (CMOS input); OVER1 = FAR1 - Vs; SERIES = Z0 - r_out (E24).");
        out.println();
        List<String[]> rows = new ArrayList<>();
        rows.add(new String[] {"RANK", "NET", "CLASS", "TD/tr", "tr", "KNEE", "dV/dt", "TD", "Z0", "Rs", "GS", "LAUNCH", "FAR1", "OVER1", "SERIES"});
        for (int i = 0; i < ranked.size(); i++) {
            ScreenResult r = ranked.get(i);
            rows.add(new String[] {String.valueOf(i + 1), r.net(), r.lineClass().word(), f("%.3f", r.ratio()),
                    f("%.3f ns", r.rise1090() * 1e9), f("%.0f MHz", r.knee() / 1e6), f("%.2f V/ns", r.slew() / 1e9),
                    f("%.3f ns", r.longestDelay() * 1e9), f("%.1f", r.z0()), f("%.1f", r.rOut() + r.rSeries()),
                    f("%+.3f", r.gammaSource()), f("%.3f V", r.launch()), f("%.3f V", r.farFirst()), f("%+.3f V", r.overshootFirst()),
                    Double.isNaN(r.suggestedSeries()) ? "none" : f("%.1f", r.suggestedSeries()) + " (" + f("%.0f", r.suggestedE24()) + ")"});
        }
        int[] w = new int[rows.get(0).length];
        rows.forEach(row -> {
            for (int i = 0; i < row.length; i++) {
                w[i] = Math.max(w[i], row[i].length());
            }
        });
        for (String[] row : rows) {
            StringBuilder b = new StringBuilder();
            for (int i = 0; i < row.length; i++) {
                boolean left = i == 1 || i == 2;
                String pad = " ".repeat(w[i] - row[i].length());
                b.append(left ? row[i] + pad : pad + row[i]).append("  ");
            }
            out.println(b.toString().stripTrailing());
        }
        for (ScreenResult r : ranked) {
            r.notes().forEach(n -> out.println("  note " + r.net() + ": " + n));
            r.pullUpWindow().forEach(n -> out.println("  pull-up " + r.net() + ": " + n));
        }
        out.println();
        out.println("Open-drain nets list their I2C pull-up window per mode above (UM10204 section 7.1: R_p(min) from V_DD, V_OL, I_OL;"
                + " R_p(max) from the rise-time limit and the bus capacitance).");
    }

    private static String f(String format, double v) {
        return Double.isFinite(v) ? String.format(Locale.ROOT, format, v) : "n/a";
    }
}
