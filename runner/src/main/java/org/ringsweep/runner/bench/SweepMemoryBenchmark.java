package org.ringsweep.runner.bench;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Issue 3's memory requirement at full size: {@code ringsweep sweep} of a one-receiver net (a
 * grid of series resistor × rise time, {@value #DEFAULT_POINTS} points by default) with the
 * built-in engine, in a child JVM limited to {@value #HEAP}, as a user runs it (the real
 * {@code Main}: plan, batch, store, results.jsonl, report, summary). Reports the wall time,
 * points per second (the sweep's own progress line), the heap from the child's GC log
 * ({@code -Xlog:gc}: the largest heap after a collection, and the largest before one), the store
 * size and the decks' disk use. Goal: it finishes in the heap, and the heap does not grow with
 * the number of points.
 */
public final class SweepMemoryBenchmark {
    /** Points of the full-size run. */
    public static final long DEFAULT_POINTS = 1_000_000;
    /** The child's heap limit: the 256 MB. */
    public static final String HEAP = "-Xmx256m";
    private static final Pattern GC_LINE = Pattern.compile("(\\d+)([KMG])->(\\d+)([KMG])\\((\\d+)([KMG])\\)");
    private static final Pattern RATE = Pattern.compile("([\\d.]+) points/s");

    private SweepMemoryBenchmark() {
    }

    /**
     * Runs the benchmark in {@code workDir/sweep-memory} (its output folder is deleted afterwards,
     * the GC log and the child's messages are kept).
     *
     * @param workDir a writable folder
     * @param points  the sweep's points, at least 2
     * @param jobs    {@code --jobs} of the sweep
     * @return the report, one line
     * @throws IllegalStateException when the child fails or runs out of heap
     */
    public static String run(Path workDir, long points, int jobs) {
        if (points < 2 || points > Integer.MAX_VALUE) {
            throw new IllegalArgumentException("points must be 2.." + Integer.MAX_VALUE + ", found " + points);
        }
        Path dir = workDir.resolve("sweep-memory");
        try {
            delete(dir);
            boolean grid = points >= 2000 && points % 1000 == 0;
            writeInputs(dir, grid ? (int) (points / 1000) : (int) points, grid ? 1000 : 0);
            Path out = dir.resolve("out");
            List<String> command = ChildJvm.ringsweep(List.of(HEAP, "-Xlog:gc:file=" + dir.resolve("gc.log")),
                    List.of("sweep", dir.resolve("sweep.yaml").toString(), "--engine", "builtin",
                            "--out", out.toString(), "--jobs", String.valueOf(jobs)));
            long start = System.nanoTime();
            Process child = new ProcessBuilder(command).redirectOutput(dir.resolve("sweep.out").toFile())
                    .redirectError(dir.resolve("sweep.err").toFile()).start();
            child.waitFor(7, TimeUnit.DAYS);
            double wall = (System.nanoTime() - start) / 1e9;
            String err = Files.readString(dir.resolve("sweep.err"), StandardCharsets.UTF_8);
            if (err.contains("OutOfMemoryError")) {
                throw new IllegalStateException("sweep-memory: the sweep ran out of its " + HEAP + " heap; see " + dir.resolve("sweep.err"));
            }
            if (child.exitValue() > 1) { // 0 every point passes, 1 some fail: both are finished sweeps
                throw new IllegalStateException("sweep-memory: the sweep exited with " + child.exitValue() + "; see " + dir.resolve("sweep.err"));
            }
            double rate = Double.NaN;
            Matcher m = RATE.matcher(err);
            while (m.find()) {
                rate = Double.parseDouble(m.group(1)); // the last progress line: the whole run's rate
            }
            long[] heap = heap(dir.resolve("gc.log"));
            long store = size(out.resolve("results.sqlite")) + size(out.resolve("results.sqlite-wal"));
            long all = treeSize(out);
            long jsonl = size(out.resolve("results.jsonl"));
            delete(out);
            return String.format(Locale.ROOT, "sweep-memory: %d points, built-in engine, --jobs %d, %s: %.0f s wall (%.1f points/s while"
                            + " running; %.1f overall), heap after GC at most %.1f MB, before GC at most %.1f MB (%d collections);"
                            + " results.sqlite %.1f MB (%.0f bytes/point), results.jsonl %.1f MB, whole --out %.1f MB",
                    points, jobs, HEAP, wall, rate, points / wall, heap[0] / 1e6, heap[1] / 1e6, heap[2], store / 1e6,
                    (double) store / points, jsonl / 1e6, all / 1e6);
        } catch (IOException e) {
            throw new UncheckedIOException("sweep-memory: " + e.getMessage(), e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("sweep-memory: interrupted", e);
        }
    }

    /**
     * Writes {@code dir/nets/tiny.yaml} (a 20 ohm driver, a 33 ohm series resistor R1 between 50
     * and 200 ps of 50 ohm line, one 3 pF CMOS receiver) and {@code dir/sweep.yaml}: a grid of
     * {@code rValues} steps of R1 from 10 to 60 ohm × {@code riseValues} steps of the rise time
     * from 0.5 to 2 ns (no rise entry when {@code riseValues} is 0).
     *
     * @throws UncheckedIOException when the files cannot be written
     */
    public static void writeInputs(Path dir, int rValues, int riseValues) {
        try {
            Files.createDirectories(dir.resolve("nets"));
            Files.writeString(dir.resolve("nets/tiny.yaml"), String.join("\n",
                    "format: ringsweep/net-1",
                    "net: TINY",
                    "rails: { VCC: 3.3 }",
                    "drivers:",
                    "  - { pin: U1.1, model: ramp, v_high: VCC, rise: 1ns, r_out: 20 }",
                    "receivers:",
                    "  - { pin: U2.1, model: cmos, c_in: 3pF, vih: 2.0, vil: 0.8 }",
                    "segments:",
                    "  - { from: U1.1, to: R1.1, z0: 50, delay: 50ps }",
                    "  - { from: R1.2, to: U2.1, z0: 50, delay: 200ps }",
                    "parts:",
                    "  - { ref: R1, kind: resistor, value: 33, between: [R1.1, R1.2] }",
                    ""), StandardCharsets.UTF_8);
            List<String> sweep = new ArrayList<>(List.of("format: ringsweep/sweep-1", "nets: [nets/tiny.yaml]", "vary:",
                    "  - { target: R1/value, from: 10, to: 60, steps: " + rValues + " }"));
            if (riseValues > 0) {
                sweep.add("  - { target: U1.1/rise, from: 0.5ns, to: 2ns, steps: " + riseValues + " }");
            }
            Files.write(dir.resolve("sweep.yaml"), sweep, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write the sweep-memory inputs in `" + dir + "`: " + e.getMessage(), e);
        }
    }

    /** From a {@code -Xlog:gc} file: the largest heap after a collection, before one (bytes), and the number of collections. */
    static long[] heap(Path gcLog) throws IOException {
        long after = 0;
        long before = 0;
        long count = 0;
        for (String line : Files.readAllLines(gcLog, StandardCharsets.UTF_8)) {
            Matcher m = GC_LINE.matcher(line);
            if (m.find()) {
                before = Math.max(before, bytes(m.group(1), m.group(2)));
                after = Math.max(after, bytes(m.group(3), m.group(4)));
                count++;
            }
        }
        return new long[] {after, before, count};
    }

    private static long bytes(String n, String unit) {
        long v = Long.parseLong(n);
        return switch (unit) {
            case "K" -> v << 10;
            case "M" -> v << 20;
            default -> v << 30;
        };
    }

    private static long size(Path file) throws IOException {
        return Files.isRegularFile(file) ? Files.size(file) : 0;
    }

    private static long treeSize(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return 0;
        }
        try (Stream<Path> s = Files.walk(dir)) {
            return s.filter(Files::isRegularFile).mapToLong(p -> p.toFile().length()).sum();
        }
    }

    private static void delete(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                Files.delete(p);
            }
        }
    }
}
