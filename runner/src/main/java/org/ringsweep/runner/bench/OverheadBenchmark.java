package org.ringsweep.runner.bench;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Stream;
import org.ringsweep.runner.cli.Main;

/**
 * Orchestration overhead: {@code check} over N generated nets (load, elaborate, write decks, run
 * ngspice, read raw files, measure, write records) against running the very same decks with bare
 * {@code ngspice -n -b} one after another. Goal: check ≤ 1.10 × bare.
 *
 * <p>Both sides run one ngspice process at a time ({@code check} has no parallel runs; its
 * pipeline only overlaps its own work with the running process), on the same decks, in the same
 * JVM. The first {@code check} is reported on its own (a cold JVM, as a command line run is);
 * then {@value #ROUNDS} rounds each time both, alternating which goes first so drift of the
 * machine's load hits both alike, and the best and the median of each side are compared.
 * Last, {@code check} runs in fresh JVMs as a command line would (with the launcher's class-data
 * archive as well, when this JVM was started with one), against the median bare time.
 */
public final class OverheadBenchmark {
    /** Measured rounds after the cold one. */
    static final int ROUNDS = 5;
    /** Fresh-JVM runs of each kind (they are slow: a JVM start each). */
    static final int COMMAND_LINE_ROUNDS = 3;

    private OverheadBenchmark() {
    }

    /**
     * Runs the benchmark.
     *
     * @param workDir a scratch folder (nets and outputs go below it)
     * @param ngspice the ngspice binary
     * @param nets    how many nets
     * @return a report line with both times, their ratios and the time per point
     */
    public static String run(Path workDir, Path ngspice, int nets) {
        try {
            Path netDir = workDir.resolve("nets");
            Files.createDirectories(netDir);
            List<String> netFiles = new ArrayList<>();
            for (int i = 0; i < nets; i++) {
                Path f = netDir.resolve(String.format(Locale.ROOT, "net%03d.yaml", i));
                Files.writeString(f, netText(i), StandardCharsets.UTF_8);
                netFiles.add(f.toString());
            }
            Path coldOut = workDir.resolve("out-cold");
            long t0 = System.nanoTime();
            int code = quietCheck(checkArgs(coldOut, netFiles, true));
            double coldCheck = (System.nanoTime() - t0) / 1e9;
            List<Path> deckFiles;
            try (Stream<Path> s = Files.walk(coldOut)) {
                deckFiles = s.filter(p -> p.toString().endsWith(".cir")).sorted().toList();
            }
            double[] check = new double[ROUNDS];
            double[] bare = new double[ROUNDS];
            for (int round = 0; round < ROUNDS; round++) {
                if (round % 2 == 1) {
                    bare[round] = bare(ngspice, deckFiles);
                }
                long t1 = System.nanoTime();
                code = quietCheck(checkArgs(workDir.resolve("out-" + round), netFiles, true));
                check[round] = (System.nanoTime() - t1) / 1e9;
                if (round % 2 == 0) {
                    bare[round] = bare(ngspice, deckFiles);
                }
            }
            // Loading, elaborating and writing the decks alone (`deck`): the part of the orchestration
            // that check overlaps with the running ngspice.
            List<String> deckArgs = new ArrayList<>(List.of("deck", "--quiet", "--out", workDir.resolve("out-decks").toString()));
            deckArgs.addAll(netFiles);
            long t2 = System.nanoTime();
            quietCheck(deckArgs);
            double deckOnly = (System.nanoTime() - t2) / 1e9;
            // The same check writing report.html and junit.xml as well (an output of its own, not orchestration).
            long t3 = System.nanoTime();
            quietCheck(checkArgs(workDir.resolve("out-reports"), netFiles, false));
            double reportSeconds = (System.nanoTime() - t3) / 1e9;
            // As a user runs it: a fresh JVM per check, with and without the launcher's class-data archive.
            Optional<String> archive = ManagementFactory.getRuntimeMXBean().getInputArguments().stream()
                    .filter(a -> a.startsWith("-XX:SharedArchiveFile=")).findFirst();
            double[] fresh = new double[COMMAND_LINE_ROUNDS];
            double[] freshArchived = new double[COMMAND_LINE_ROUNDS];
            for (int round = 0; round < COMMAND_LINE_ROUNDS; round++) {
                fresh[round] = freshJvmCheck(Optional.empty(), checkArgs(workDir.resolve("out-jvm-" + round), netFiles, true));
                if (archive.isPresent()) {
                    freshArchived[round] = freshJvmCheck(archive, checkArgs(workDir.resolve("out-cds-" + round), netFiles, true));
                }
            }
            String commandLine = String.format(Locale.ROOT, "; check in a fresh JVM (as on the command line), median of %d: %.2f s, ratio %.3f",
                    COMMAND_LINE_ROUNDS, median(fresh), median(fresh) / median(bare))
                    + (archive.isEmpty() ? " (no class-data archive: run through ./ringsweep to measure it)"
                            : String.format(Locale.ROOT, "; with the launcher's class-data archive %.2f s, ratio %.3f",
                                    median(freshArchived), median(freshArchived) / median(bare)));
            int decks = deckFiles.size();
            double bestCheck = Arrays.stream(check).min().orElseThrow();
            double bestBare = Arrays.stream(bare).min().orElseThrow();
            double medianCheck = median(check);
            double medianBare = median(bare);
            return String.format(Locale.ROOT,
                    "overhead: %d nets (%d decks), %d rounds after a cold one: check --no-report best %.2f s, median %.2f s (exit %d);"
                            + " bare ngspice best %.2f s, median %.2f s; ratio of bests %.3f, of medians %.3f (goal <= 1.10);"
                            + " per point (medians): ngspice %.1f ms, orchestration %+.1f ms (deck-only pass %.1f ms);"
                            + " first check in a cold JVM %.2f s, ratio %.3f;"
                            + " check writing report.html and junit.xml too %.2f s, ratio %.3f",
                    nets, decks, ROUNDS, bestCheck, medianCheck, code, bestBare, medianBare, bestCheck / bestBare,
                    medianCheck / medianBare, 1e3 * medianBare / decks, 1e3 * (medianCheck - medianBare) / decks,
                    1e3 * deckOnly / decks, coldCheck, coldCheck / medianBare, reportSeconds, reportSeconds / medianBare)
                    + commandLine;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted", e);
        }
    }

    private static List<String> checkArgs(Path out, List<String> netFiles, boolean noReport) {
        List<String> args = new ArrayList<>(List.of("check", "--quiet", "--out", out.toString()));
        if (noReport) {
            args.add("--no-report");
        }
        args.addAll(netFiles);
        return args;
    }

    /** Seconds to run every deck with bare ngspice, one after another, its output discarded. */
    private static double bare(Path ngspice, List<Path> deckFiles) throws IOException, InterruptedException {
        long t = System.nanoTime();
        for (Path deck : deckFiles) {
            Process p = new ProcessBuilder(ngspice.toString(), "-n", "-b", deck.getFileName().toString())
                    .directory(deck.getParent().toFile())
                    .redirectOutput(ProcessBuilder.Redirect.DISCARD)
                    .redirectError(ProcessBuilder.Redirect.DISCARD)
                    .start();
            p.waitFor();
        }
        return (System.nanoTime() - t) / 1e9;
    }

    /**
     * Seconds for one {@code check} in a child JVM on this JVM's class path, output discarded: the
     * start-up, class loading and JIT warm-up a command-line run pays.
     */
    private static double freshJvmCheck(Optional<String> archiveOption, List<String> args) throws IOException, InterruptedException {
        List<String> command = ChildJvm.ringsweep(archiveOption.stream().toList(), args);
        long t = System.nanoTime();
        Process p = new ProcessBuilder(command)
                .redirectOutput(ProcessBuilder.Redirect.DISCARD)
                .redirectError(ProcessBuilder.Redirect.DISCARD)
                .start();
        p.waitFor();
        return (System.nanoTime() - t) / 1e9;
    }

    private static double median(double[] values) {
        double[] s = values.clone();
        Arrays.sort(s);
        int n = s.length;
        return n % 2 == 1 ? s[n / 2] : (s[n / 2 - 1] + s[n / 2]) / 2;
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
