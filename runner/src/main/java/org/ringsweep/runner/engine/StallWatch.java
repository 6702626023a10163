package org.ringsweep.runner.engine;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.SeekableByteChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.function.Supplier;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Watches one running transient for a stall: the solver keeps cutting its time step and the
 * simulated time stops advancing while the process runs on (time step collapse).
 *
 * <p>ngspice reports the simulated time on standard error as a ticker of
 * {@code Reference value :  1.04914e-08} tokens separated by carriage returns, a few per second
 * of its CPU time. Each {@link #check} reads only the last {@value #TAIL_BYTES} bytes of that
 * file, and only when it has grown. The stall clock starts with the first token, so parsing and
 * the operating point (which print none) are left to the wall-clock timeout. Progress means the
 * simulated time rose by at least {@value #MIN_ADVANCE} of the stop time: ngspice's ticker may
 * still creep forward in a collapse, at a pace that would need thousands of stall periods to
 * finish. Once the ticker reaches the stop time, or the raw file appears (the deck writes it
 * right after {@code run}), the transient is over and the watch stays quiet.
 *
 * <p>One instance per run, used only by the thread that waits for that run: it needs no locks.
 */
final class StallWatch {
    /** How often the engine looks at the ticker while it waits. */
    static final Duration POLL = Duration.ofMillis(250);
    /** Bytes of the end of standard error read per look: several ticker tokens of 32 bytes. */
    static final int TAIL_BYTES = 512;
    /** Least rise of the simulated time that counts as progress, as a fraction of the stop time. */
    static final double MIN_ADVANCE = 1e-3;
    /**
     * Least share of the stall period that ngspice must have spent on the CPU before it is called
     * stalled: a run starved by a busy machine ticks slowly but has not collapsed.
     */
    static final double MIN_CPU_SHARE = 0.5;
    /** Relative slack on the ticker reaching the stop time (the ticker prints six digits). */
    private static final double END_SLACK = 1e-5;
    /** A complete token: the number must be followed by its carriage return (or a line break). */
    private static final Pattern TOKEN = Pattern.compile(
            "Reference value\\s*:\\s*([-+]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][-+]?\\d+)?)[ \\t]*[\\r\\n]");

    /**
     * A run found stalled.
     *
     * @param simulatedTime   the last simulated time ngspice reported (s)
     * @param withoutProgress wall-clock time since the simulated time last made progress
     */
    record Stall(double simulatedTime, Duration withoutProgress) {
    }

    private final Path stderrFile;
    private final Path rawFile;
    private final double stopTime;
    private final long stallNanos;
    private final long ignoreBefore;

    private long seenSize = -1;
    private boolean over;
    private double latest = Double.NaN;
    private double progressValue = Double.NaN;
    private long progressAt;
    private Optional<Duration> cpuAtProgress = Optional.empty();

    /**
     * A watch for one run.
     *
     * @param stderrFile   the file ngspice's standard error goes to
     * @param rawFile      the raw file the deck writes once the transient is over
     * @param stopTime     the transient's stop time (s)
     * @param stallTimeout wall-clock time without progress after which the run counts as stalled
     */
    StallWatch(Path stderrFile, Path rawFile, double stopTime, Duration stallTimeout) {
        this(stderrFile, rawFile, stopTime, stallTimeout, 0);
    }

    /**
     * A watch for one point of a batch, which shares its standard error with the points before it.
     *
     * @param ignoreBefore bytes at the start of {@code stderrFile} that belong to earlier points
     *                     and are never read; the other parameters as for the one-run watch
     */
    StallWatch(Path stderrFile, Path rawFile, double stopTime, Duration stallTimeout, long ignoreBefore) {
        this.stderrFile = Objects.requireNonNull(stderrFile, "stderrFile");
        this.rawFile = Objects.requireNonNull(rawFile, "rawFile");
        this.stopTime = stopTime;
        this.stallNanos = stallTimeout.toNanos();
        this.ignoreBefore = ignoreBefore;
    }

    /**
     * Looks at the ticker once.
     *
     * @param nowNanos a {@link System#nanoTime()} reading taken now
     * @param cpuTime  the process's CPU time so far, when the platform tells it; asked only on
     *                 progress and when a stall is near, so a run costs a few calls per second at most
     * @return the stall, when the simulated time has made no progress for the stall timeout
     */
    Optional<Stall> check(long nowNanos, Supplier<Optional<Duration>> cpuTime) {
        if (over) {
            return Optional.empty();
        }
        if (Files.exists(rawFile)) {
            over = true; // ngspice is writing its output: the transient has ended
            return Optional.empty();
        }
        readTicker(nowNanos, cpuTime);
        if (Double.isNaN(progressValue)) {
            return Optional.empty(); // no ticker yet: parsing or the operating point
        }
        if (latest >= stopTime * (1 - END_SLACK)) {
            over = true;
            return Optional.empty();
        }
        long idle = nowNanos - progressAt;
        if (idle < stallNanos) {
            return Optional.empty();
        }
        Optional<Duration> cpu = cpuTime.get();
        if (cpu.isPresent() && cpuAtProgress.isPresent()
                && cpu.get().minus(cpuAtProgress.get()).toNanos() < stallNanos * MIN_CPU_SHARE) {
            return Optional.empty();
        }
        return Optional.of(new Stall(latest, Duration.ofNanos(idle)));
    }

    private void readTicker(long nowNanos, Supplier<Optional<Duration>> cpuTime) {
        OptionalDouble value;
        try {
            long size = Files.size(stderrFile);
            if (size == seenSize || size <= ignoreBefore) {
                return; // nothing new printed (for this point)
            }
            seenSize = size;
            value = lastReferenceValue(tail(stderrFile, size, ignoreBefore));
        } catch (NoSuchFileException e) {
            return;
        } catch (IOException e) {
            return; // an unreadable log tells nothing; the timeout still covers the run
        }
        if (value.isEmpty()) {
            return;
        }
        latest = value.getAsDouble();
        boolean restarted = latest < progressValue; // a further analysis starts its time axis again
        if (Double.isNaN(progressValue) || restarted || latest >= progressValue + MIN_ADVANCE * stopTime) {
            progressValue = latest;
            progressAt = nowNanos;
            cpuAtProgress = cpuTime.get();
        }
    }

    /** The last {@value #TAIL_BYTES} bytes of a file of {@code size} bytes, none before {@code from}, one char per byte. */
    private static String tail(Path file, long size, long from) throws IOException {
        int n = (int) Math.min(TAIL_BYTES, size - from);
        ByteBuffer buffer = ByteBuffer.allocate(n);
        try (SeekableByteChannel ch = Files.newByteChannel(file)) {
            ch.position(size - n);
            while (buffer.hasRemaining() && ch.read(buffer) >= 0) {
                // keep reading until full or end of file
            }
        }
        // Latin-1 maps each byte to one char, so a tail cut inside a multi-byte character cannot fail.
        return new String(buffer.array(), 0, buffer.position(), StandardCharsets.ISO_8859_1);
    }

    /**
     * The simulated time in the last complete ticker token of a piece of ngspice's standard error.
     * A token cut off at the start of the piece, or still being written at its end (no carriage
     * return after the number yet), does not count.
     *
     * @param text the end of standard error, tokens separated by {@code \r}
     * @return the time (s), or empty when the text holds no complete token
     */
    static OptionalDouble lastReferenceValue(CharSequence text) {
        Matcher m = TOKEN.matcher(text);
        OptionalDouble last = OptionalDouble.empty();
        while (m.find()) {
            double v = Double.parseDouble(m.group(1));
            if (Double.isFinite(v)) {
                last = OptionalDouble.of(v);
            }
        }
        return last;
    }
}
