package org.ringsweep.runner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 3: "a sweep of a million points must run in a 256 MB heap". In CI time: a 10 000-point
 * sweep through the real sweep command (lazy plan, bounded batch runner, store, results.jsonl,
 * report, summary) and both exports, in a child JVM with a 32 MB heap. Keeping anything of every
 * point would not fit: the records alone are some 1.8 KB each in results.jsonl (18 MB), and the
 * code before this test loaded them all twice (summary and report). The child's engine replays
 * one solved waveform ({@link OrchestrationMemoryEngine}, used by this test only), so the time
 * goes to what is measured here, the orchestration. The million-point figure itself is the
 * {@code bench --only sweep-memory} benchmark's.
 */
class SweepMemoryTests {
    private static final int R_VALUES = 100;
    private static final int RISE_VALUES = 100;

    @TempDir
    Path dir;

    @Test
    void tenThousandPointsRunSummariseAndExportInAThirtyTwoMegabyteHeap() throws Exception {
        String java = ProcessHandle.current().info().command().orElseThrow();
        Path err = dir.resolve("child.err");
        Process child = new ProcessBuilder(java, "-Xmx32m", "-XX:+UseSerialGC", "-cp", System.getProperty("java.class.path"),
                SweepMemoryProbe.class.getName(), dir.resolve("work").toString(), "" + R_VALUES, "" + RISE_VALUES)
                .redirectError(err.toFile()).redirectOutput(dir.resolve("child.out").toFile()).start();
        assertTrue(child.waitFor(5, TimeUnit.MINUTES), "the child sweep did not end within 5 minutes");
        String out = Files.readString(dir.resolve("child.out"));
        String errors = Files.readString(err);
        assertFalse(errors.contains("OutOfMemoryError"), errors.lines().filter(l -> !l.matches("\\d+/\\d+ points.*")).toList().toString());
        assertEquals(0, child.exitValue(), out + errors);
        // every point fails: the replayed waveform overshoots the 0.3 V default limit (formats.md "Results": exit code 1)
        assertTrue(out.contains("exit sweep 1"), out);
        assertTrue(out.contains("exit results--csv 0"), out);
        assertTrue(out.contains("exit results--json 0"), out);

        int points = R_VALUES * RISE_VALUES; // grid = cartesian product (formats.md "Sweep file")
        Path work = dir.resolve("work");
        assertEquals(points, lines(work.resolve("export.json")), "results --json: one record per point");
        assertEquals(points, lines(work.resolve("out").resolve("results.jsonl")), "results.jsonl: one record per point");
        // one line per point, receiver and edge after the header (docs/results-store.md "Exports"): 1 receiver, rise and fall
        assertEquals(1 + 2L * points, lines(work.resolve("export.csv")));
        String summary = Files.readString(work.resolve("summary.txt"));
        assertTrue(summary.contains("TINY: " + points + " point(s), 0 pass, " + points + " fail, 0 error"), summary);
        assertTrue(summary.contains("  total " + points + " point(s), " + points + " to run"), summary);
    }

    private static long lines(Path file) throws Exception {
        try (Stream<String> s = Files.lines(file, StandardCharsets.UTF_8)) {
            return s.count();
        }
    }
}
