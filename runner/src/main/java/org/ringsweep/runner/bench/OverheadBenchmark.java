package org.ringsweep.runner.bench;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;
import org.ringsweep.runner.cli.Main;

/**
 * Orchestration overhead: {@code check} over N generated nets (load, elaborate, write decks, run
 * ngspice, read raw files, measure, write records) against running the very same decks with bare
 * {@code ngspice -n -b} one after another. Goal: check ≤ 1.10 × bare.
 */
public final class OverheadBenchmark {
    private static final int ROUNDS = 3;

    private OverheadBenchmark() {
    }

    /**
     * Runs the benchmark.
     *
     * @param workDir a scratch folder (nets and outputs go below it)
     * @param ngspice the ngspice binary
     * @param nets    how many nets
     * @return a report line with both times and their ratio
     */
    public static String run(Path workDir, Path ngspice, int nets) {
        try {
            Path netDir = workDir.resolve("nets");
            Files.createDirectories(netDir);
            List<String> args = new ArrayList<>(List.of("check", "--quiet", "--out", workDir.resolve("out").toString(), "--no-report"));
            for (int i = 0; i < nets; i++) {
                Path f = netDir.resolve(String.format(Locale.ROOT, "net%03d.yaml", i));
                Files.writeString(f, netText(i), StandardCharsets.UTF_8);
                args.add(f.toString());
            }
            // Rounds alternate check and bare ngspice so both see the same machine state; the best of
            // each is compared, and the first (cold JVM) check is reported too.
            double bestCheck = Double.MAX_VALUE;
            double bestBare = Double.MAX_VALUE;
            double coldCheck = 0;
            int decks = 0;
            int code = -1;
            for (int round = 0; round < ROUNDS; round++) {
                Path out = workDir.resolve("out-" + round);
                List<String> roundArgs = new ArrayList<>(args);
                roundArgs.set(3, out.toString());
                long t0 = System.nanoTime();
                code = quietCheck(roundArgs);
                double checkSeconds = (System.nanoTime() - t0) / 1e9;
                if (round == 0) {
                    coldCheck = checkSeconds;
                }
                bestCheck = Math.min(bestCheck, checkSeconds);
                List<Path> deckFiles;
                try (Stream<Path> s = Files.walk(out)) {
                    deckFiles = s.filter(p -> p.toString().endsWith(".cir")).sorted().toList();
                }
                decks = deckFiles.size();
                long t1 = System.nanoTime();
                for (Path deck : deckFiles) {
                    Process p = new ProcessBuilder(ngspice.toString(), "-n", "-b", deck.getFileName().toString())
                            .directory(deck.getParent().toFile())
                            .redirectOutput(ProcessBuilder.Redirect.DISCARD)
                            .redirectError(ProcessBuilder.Redirect.DISCARD)
                            .start();
                    p.waitFor();
                }
                bestBare = Math.min(bestBare, (System.nanoTime() - t1) / 1e9);
            }
            // The same check writing report.html and junit.xml as well (an output of its own, not orchestration).
            List<String> withReports = new ArrayList<>(args);
            withReports.remove("--no-report");
            withReports.set(3, workDir.resolve("out-reports").toString());
            long t2 = System.nanoTime();
            quietCheck(withReports);
            double reportSeconds = (System.nanoTime() - t2) / 1e9;
            return String.format(Locale.ROOT,
                    "overhead: %d nets (%d decks), best of %d rounds: check --no-report %.2f s (exit %d), bare ngspice %.2f s,"
                            + " ratio %.3f (goal <= 1.10); first check in a cold JVM %.2f s, ratio %.3f;"
                            + " check writing report.html and junit.xml too %.2f s, ratio %.3f",
                    nets, decks, ROUNDS, bestCheck, code, bestBare, bestCheck / bestBare, coldCheck, coldCheck / bestBare,
                    reportSeconds, reportSeconds / bestBare);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        }
    }

    private static int quietCheck(List<String> args) {
        StringWriter sink = new StringWriter();
        return Main.run(args.toArray(String[]::new), new PrintWriter(sink), new PrintWriter(sink));
    }

    /** A point-to-point net with a series resistor; lengths and values vary with i. */
    private static String netText(int i) {
        double length = 40 + (i % 10) * 12;
        int r = 10 + (i % 7) * 5;
        return "format: ringsweep/net-1\n"
                + "net: BENCH_" + i + "\n"
                + "rails: { VCC: 3.3 }\n"
                + "drivers:\n  - { pin: U1.1, model: ramp, v_high: VCC, rise: 1ns, r_out: 15 }\n"
                + "receivers:\n  - { pin: U2.1, model: cmos, c_in: 4pF, vih: 2.0, vil: 0.8, clamp: rails, supply: VCC }\n"
                + "  - { pin: U3.1, model: cmos, c_in: 4pF, vih: 2.0, vil: 0.8 }\n"
                + "segments:\n"
                + "  - { from: U1.1, to: R1.1, z0: 50, length: 3mm, er_eff: 3.4 }\n"
                + "  - { from: R1.2, to: J1, z0: 50, length: " + length + "mm, er_eff: 3.4 }\n"
                + "  - { from: J1, to: U2.1, z0: 50, length: 20mm, er_eff: 3.4 }\n"
                + "  - { from: J1, to: U3.1, z0: 50, length: 15mm, er_eff: 3.4 }\n"
                + "parts:\n  - { ref: R1, kind: resistor, value: " + r + ", between: [R1.1, R1.2] }\n";
    }
}
