package org.ringsweep.runner.bench;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.ringsweep.runner.raw.RawFileReader;
import org.ringsweep.runner.raw.RawFileWriter;
import org.ringsweep.runner.raw.RawPlot;

/**
 * Read throughput of {@link RawFileReader} on a binary raw file of about 106 MB (6 variables ×
 * 2.2 M points, the size of a long transient of a wide net) from the page cache. Goal: at least
 * 1 GB/s.
 */
public final class RawReaderBenchmark {
    /** Points of the synthetic transient. */
    static final int POINTS = 2_200_000;
    /** Timed reads after the warm-up read. */
    static final int READS = 7;

    private RawReaderBenchmark() {
    }

    /**
     * Writes the synthetic raw file into {@code workDir}, reads it once to fill the page cache and
     * warm the JIT, then times {@value #READS} reads; the file is deleted afterwards.
     *
     * @param workDir an existing, writable directory with about 110 MB free
     * @return one line: file size, best and median read time (ms), throughput (MB/s, GB/s; 1 MB = 10⁶ bytes)
     * @throws UncheckedIOException when the file cannot be written or deleted
     * @throws IllegalStateException when a read does not return what was written
     */
    public static String run(Path workDir) {
        Path file = workDir.resolve("raw-reader-benchmark.raw");
        RawPlot plot = syntheticTransient();
        try {
            RawFileWriter.write(file, RawFileWriter.Encoding.BINARY, List.of(plot));
            long bytes = Files.size(file);
            check(plot, RawFileReader.read(file)); // page cache and JIT warm-up
            long[] nanos = new long[READS];
            for (int i = 0; i < READS; i++) {
                long start = System.nanoTime();
                List<RawPlot> read = RawFileReader.read(file);
                nanos[i] = System.nanoTime() - start;
                check(plot, read);
            }
            Arrays.sort(nanos);
            double best = nanos[0] / 1e9;
            double median = nanos[READS / 2] / 1e9;
            return String.format(Locale.ROOT,
                    "raw reader: %.1f MB binary (%d variables x %d points), %d reads from the page cache:"
                            + " best %.1f ms (%.0f MB/s, %.2f GB/s), median %.1f ms (%.0f MB/s, %.2f GB/s); goal >= 1 GB/s",
                    bytes / 1e6, plot.variables().size(), plot.points(), READS,
                    best * 1e3, bytes / best / 1e6, bytes / best / 1e9,
                    median * 1e3, bytes / median / 1e6, bytes / median / 1e9);
        } catch (IOException e) {
            throw new UncheckedIOException("raw reader benchmark in `" + workDir + "`: " + e.getMessage(), e);
        } finally {
            try {
                Files.deleteIfExists(file);
            } catch (IOException e) {
                throw new UncheckedIOException("cannot delete `" + file + "`: " + e.getMessage(), e);
            }
        }
    }

    /** A 10 ps-step transient: time, a driver edge and four ringing receiver nodes and a current. */
    private static RawPlot syntheticTransient() {
        double[] time = new double[POINTS];
        List<double[]> columns = new ArrayList<>();
        columns.add(time);
        for (int k = 0; k < POINTS; k++) {
            time[k] = k * 1e-11;
        }
        List<String> names = List.of("time", "v(drv)", "v(rx1)", "v(rx2)", "v(rx3)", "i(vdd)");
        for (int v = 1; v < names.size(); v++) {
            double[] column = new double[POINTS];
            double f = 0.4e9 * v;
            for (int k = 0; k < POINTS; k++) {
                double t = time[k];
                column[k] = 3.3 * (1 - Math.exp(-t / 2e-10) * Math.cos(2 * Math.PI * f * t));
            }
            columns.add(column);
        }
        return new RawPlot("raw reader benchmark", "Transient Analysis", "real", names, POINTS, columns, false);
    }

    private static void check(RawPlot written, List<RawPlot> read) {
        RawPlot r = read.get(0);
        int last = written.points() - 1;
        if (read.size() != 1 || r.points() != written.points() || r.truncated()
                || r.columns().get(5)[last] != written.columns().get(5)[last]) {
            throw new IllegalStateException("the benchmark file did not read back as written");
        }
    }
}
