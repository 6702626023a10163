package org.ringsweep.runner.batch;

import java.io.PrintWriter;
import java.time.Duration;
import java.util.Locale;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.LongSupplier;

/**
 * Progress of a batch on stderr: done/total, rate, estimated time left and failures so far.
 * On a terminal one line is redrawn in place (carriage return); otherwise a plain line is printed
 * at most every {@code interval}, so logs of overnight runs stay short. Thread-safe.
 */
public final class Progress {
    private final PrintWriter err;
    private final long total;
    private final boolean terminal;
    private final boolean quiet;
    private final Duration interval;
    private final LongSupplier clock;
    private final long start;
    private final AtomicLong done = new AtomicLong();
    private final AtomicLong failed = new AtomicLong();
    private final AtomicLong errors = new AtomicLong();
    private long lastPrint;

    /**
     * @param err      where to print
     * @param total    points planned
     * @param terminal whether err is a terminal (redraw in place)
     * @param quiet    print nothing
     * @param interval the least time between plain lines
     * @param clock    nanosecond clock (System::nanoTime outside tests)
     */
    public Progress(PrintWriter err, long total, boolean terminal, boolean quiet, Duration interval, LongSupplier clock) {
        this.err = err;
        this.total = total;
        this.terminal = terminal;
        this.quiet = quiet;
        this.interval = interval;
        this.clock = clock;
        this.start = clock.getAsLong();
        this.lastPrint = start;
    }

    /** Counts one finished point. */
    public synchronized void finished(boolean fail, boolean error) {
        long d = done.incrementAndGet();
        if (fail) {
            failed.incrementAndGet();
        }
        if (error) {
            errors.incrementAndGet();
        }
        long now = clock.getAsLong();
        boolean last = d == total;
        if (quiet || (!terminal && !last && now - lastPrint < interval.toNanos())) {
            return;
        }
        lastPrint = now;
        String line = line(now);
        if (terminal) {
            err.print("\r" + line + (last ? "\n" : ""));
        } else {
            err.println(line);
        }
        err.flush();
    }

    /** The status line at time {@code now}. */
    String line(long now) {
        long d = done.get();
        double seconds = Math.max(1e-9, (now - start) / 1e9);
        double rate = d / seconds;
        String eta = d == 0 ? "?" : formatDuration((total - d) / rate);
        return String.format(Locale.ROOT, "%d/%d points (%.0f %%), %.1f points/s, %s left, %d fail, %d error",
                d, total, 100.0 * d / Math.max(1, total), rate, eta, failed.get(), errors.get());
    }

    /** An estimate of the whole run's length once a few points have finished, or empty before. */
    public synchronized java.util.Optional<String> estimate() {
        long d = done.get();
        if (d < 3) {
            return java.util.Optional.empty();
        }
        double seconds = (clock.getAsLong() - start) / 1e9;
        return java.util.Optional.of(formatDuration(seconds / d * total));
    }

    static String formatDuration(double seconds) {
        long s = Math.round(seconds);
        if (s < 60) {
            return s + " s";
        }
        if (s < 3600) {
            return String.format(Locale.ROOT, "%d min %02d s", s / 60, s % 60);
        }
        return String.format(Locale.ROOT, "%d h %02d min", s / 3600, (s % 3600) / 60);
    }
}
