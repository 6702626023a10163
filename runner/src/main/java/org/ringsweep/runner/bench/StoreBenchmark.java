package org.ringsweep.runner.bench;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.results.ViolationRecord;
import org.ringsweep.runner.store.PointKey;
import org.ringsweep.runner.store.ResultStore;

/**
 * Cost per finished point of the results store: {@value #POINTS} realistic records (a net with
 * three receivers, rising and falling edges, two swept values, a fail with violations on every
 * third point) committed one by one, as a sweep does, each its own WAL transaction synced to the
 * disk ({@code synchronous=FULL}). The time includes writing the record's JSON. Goal: well under
 * 1 ms per point.
 */
public final class StoreBenchmark {
    /** Points committed in the timed run. */
    static final int POINTS = 20_000;
    /** Untimed points first, to warm up the JIT and the driver. */
    static final int WARM_UP = 500;

    private StoreBenchmark() {
    }

    /**
     * Runs the benchmark in {@code workDir/store-benchmark} (deleted afterwards).
     *
     * @param workDir an existing, writable directory
     * @return one line: points, mean, median and 99th-percentile cost per point (µs), file size (MB)
     * @throws UncheckedIOException when the files cannot be written or deleted
     * @throws IllegalStateException when the store does not hold every point afterwards
     */
    public static String run(Path workDir) {
        Path dir = workDir.resolve("store-benchmark");
        try {
            deleteStore(dir);
            long[] nanos = new long[POINTS];
            long total;
            try (ResultStore store = ResultStore.open(dir)) {
                for (int i = 0; i < WARM_UP; i++) {
                    ResultRecord r = record(i, "warm-up");
                    store.put(r, PointKey.of(r));
                }
                long start = System.nanoTime();
                for (int i = 0; i < POINTS; i++) {
                    ResultRecord r = record(i, "bench");
                    long t0 = System.nanoTime();
                    store.put(r, PointKey.of(r));
                    nanos[i] = System.nanoTime() - t0;
                }
                total = System.nanoTime() - start;
                if (store.finishedKeys(hash("bench")).size() != POINTS) {
                    throw new IllegalStateException("the store does not hold every benchmark point");
                }
            }
            long bytes = Files.size(dir.resolve(ResultStore.FILE_NAME));
            Arrays.sort(nanos);
            double meanUs = total / 1e3 / POINTS; // includes building each record
            return String.format(Locale.ROOT,
                    "results store: %d points committed one by one (WAL, synchronous=FULL): mean %.1f us/point"
                            + " (including building the record), put median %.1f us, p99 %.1f us; file %.1f MB"
                            + " (%d bytes/point, with %d warm-up points); goal < 1000 us/point",
                    POINTS, meanUs, nanos[POINTS / 2] / 1e3, nanos[(int) (POINTS * 0.99)] / 1e3, bytes / 1e6,
                    bytes / (POINTS + WARM_UP), WARM_UP);
        } catch (IOException e) {
            throw new UncheckedIOException("results store benchmark in `" + workDir + "`: " + e.getMessage(), e);
        } finally {
            try {
                deleteStore(dir);
            } catch (IOException e) {
                throw new UncheckedIOException("cannot delete `" + dir + "`: " + e.getMessage(), e);
            }
        }
    }

    private static void deleteStore(Path dir) throws IOException {
        for (String suffix : List.of("", "-wal", "-shm")) {
            Files.deleteIfExists(dir.resolve(ResultStore.FILE_NAME + suffix));
        }
    }

    /** A stand-in for a 64-hex-digit SHA-256 of a net file. */
    private static String hash(String file) {
        return String.format(Locale.ROOT, "%064x", file.hashCode() & 0xffffffffL);
    }

    /** Point i of a 2-D sweep (series resistor × driver rise time) of a three-receiver net. */
    private static ResultRecord record(int i, String file) {
        double r = 10 + (i % 100) * 0.5;
        double rise = 0.5e-9 + (i / 100) * 1e-12;
        Map<String, Double> point = new LinkedHashMap<>();
        point.put("R5/value", r);
        point.put("U1.14/rise", rise);
        boolean fail = i % 3 == 0;
        List<ReceiverResult> receivers = new ArrayList<>();
        for (int k = 0; k < 3; k++) {
            String pin = "U" + (7 + k) + ".6";
            List<ViolationRecord> violations = fail && k == 0
                    ? List.of(new ViolationRecord("overshoot_max", "rise", 0.41, 0.3, true,
                            "overshoot 0.41 V exceeds overshoot_max 0.3 V (default)"))
                    : List.of();
            Map<String, EdgeResult> edges = new LinkedHashMap<>();
            edges.put("rise", edge(true, 0.1 + 0.003 * (i % 97) + 0.01 * k, r));
            edges.put("fall", edge(false, 0.08 + 0.002 * (i % 89) + 0.01 * k, r));
            receivers.add(new ReceiverResult(pin, violations.isEmpty() ? Verdict.PASS : Verdict.FAIL, edges, violations));
        }
        return new ResultRecord("SPI0_SCK", "typ", point, "ngspice", "39", fail ? Verdict.FAIL : Verdict.PASS, receivers,
                "out/SPI0_SCK/typ-" + i + ".cir", "", "nets/" + file + "/SPI0_SCK.yaml", hash(file),
                List.of("overshoot_max", "undershoot_max", "ringback_margin_min"), List.of());
    }

    private static EdgeResult edge(boolean rising, double excursion, double r) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("v_max", rising ? 3.3 + excursion : 3.31);
        m.put("v_min", rising ? -0.02 : -excursion);
        m.put("v_final", rising ? 3.3 : 0.0);
        m.put(rising ? "overshoot_v" : "undershoot_v", excursion);
        m.put("ringback_margin_v", 0.9 - excursion);
        m.put("settle_s", 4.1e-9 + r * 1e-11);
        m.put("settled", true);
        m.put("delay_s", 6.2e-10);
        m.put("crossings", 1);
        m.put("monotonic", true);
        m.put("slew_v_per_s", 1.9e9);
        return new EdgeResult(m);
    }
}
