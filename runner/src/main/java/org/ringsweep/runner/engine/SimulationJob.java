package org.ringsweep.runner.engine;

import java.nio.file.Path;
import java.time.Duration;
import java.util.Map;
import java.util.Objects;
import java.util.regex.Pattern;

/**
 * One deck to simulate and where.
 *
 * <p>The engine writes the deck as {@code workDir/deckFileName}, runs it with {@code workDir} as
 * the current folder, and leaves there the raw file and its console logs
 * {@code <deck stem>.stdout.txt} and {@code <deck stem>.stderr.txt}; it writes nothing elsewhere.
 * The deck must itself write its raw output ({@code write <rawFileName> v(a) v(b) …} in a
 * {@code .control} block ending in {@code quit}).
 *
 * <p>Two limits guard a run: the wall-clock {@code timeout} of the whole run, and the
 * {@code stallTimeout}, the wall-clock time the transient may go without progress once ngspice
 * has reported a first simulated time point. Progress means the simulated time rose by at least
 * 0.1 % of the stop time; a run without progress that long is killed as
 * {@link FailureKind#STALLED}. A stall timeout not shorter than the timeout leaves only the
 * timeout in effect.
 *
 * @param deckText     the complete deck, as rendered by the deck writer
 * @param workDir      the folder to run in (created when missing), under the user's output folder
 * @param deckFileName plain file name of the deck, e.g. {@code typ-0001.cir}
 * @param rawFileName  plain file name the deck writes its raw output to, e.g. {@code typ-0001.raw}
 * @param stopTime     the transient's stop time (s): the raw output must reach it
 * @param timeout      wall-clock limit of the run, after which the engine is killed
 * @param stallTimeout wall-clock limit without progress of the simulated time, after which the
 *                     engine is killed as stalled ({@link #DEFAULT_STALL_TIMEOUT} unless set)
 * @param probes       safe node name → user's name, for every voltage the run must deliver
 *                     (the raw file must hold {@code v(<safe name>)})
 */
public record SimulationJob(String deckText, Path workDir, String deckFileName, String rawFileName,
                            double stopTime, Duration timeout, Duration stallTimeout,
                            Map<String, String> probes) {
    /** The stall timeout of a job that sets none: 5 s of wall clock. */
    public static final Duration DEFAULT_STALL_TIMEOUT = Duration.ofSeconds(5);

    /** A plain file name: no folders, no leading dot, no characters a shell or ngspice treats specially. */
    private static final Pattern FILE_NAME = Pattern.compile("[A-Za-z0-9_][A-Za-z0-9_.-]{0,99}");

    /**
     * Checks the values and copies the probes.
     *
     * @throws IllegalArgumentException for a file name that is not plain, equal deck and raw names,
     *                                  a stop time that is not positive and finite, or a timeout or stall timeout
     *                                  that is not positive
     */
    public SimulationJob {
        Objects.requireNonNull(deckText, "deckText");
        Objects.requireNonNull(workDir, "workDir");
        requirePlainName("deckFileName", deckFileName);
        requirePlainName("rawFileName", rawFileName);
        if (deckFileName.equalsIgnoreCase(rawFileName)) {
            throw new IllegalArgumentException("deck and raw file must differ, both are `" + deckFileName + "`");
        }
        if (!(stopTime > 0) || !Double.isFinite(stopTime)) {
            throw new IllegalArgumentException("stopTime must be a positive number of seconds, got `" + stopTime + "`");
        }
        Objects.requireNonNull(timeout, "timeout");
        if (timeout.isNegative() || timeout.isZero()) {
            throw new IllegalArgumentException("timeout must be positive, got `" + timeout + "`");
        }
        Objects.requireNonNull(stallTimeout, "stallTimeout");
        if (stallTimeout.isNegative() || stallTimeout.isZero()) {
            throw new IllegalArgumentException("stallTimeout must be positive, got `" + stallTimeout + "`");
        }
        probes = Map.copyOf(probes);
    }

    /**
     * A job with the {@link #DEFAULT_STALL_TIMEOUT}; the parameters are those of the canonical constructor.
     *
     * @throws IllegalArgumentException as the canonical constructor
     */
    public SimulationJob(String deckText, Path workDir, String deckFileName, String rawFileName,
                         double stopTime, Duration timeout, Map<String, String> probes) {
        this(deckText, workDir, deckFileName, rawFileName, stopTime, timeout, DEFAULT_STALL_TIMEOUT, probes);
    }

    /**
     * This job with another stall timeout.
     *
     * @param stallTimeout wall-clock limit without progress of the simulated time; positive
     * @return a copy differing only in its stall timeout
     * @throws IllegalArgumentException when {@code stallTimeout} is not positive
     */
    public SimulationJob withStallTimeout(Duration stallTimeout) {
        return new SimulationJob(deckText, workDir, deckFileName, rawFileName, stopTime, timeout, stallTimeout, probes);
    }

    /** The deck's path: {@code workDir/deckFileName}. */
    public Path deckFile() {
        return workDir.resolve(deckFileName);
    }

    /** The raw file's path: {@code workDir/rawFileName}. */
    public Path rawFile() {
        return workDir.resolve(rawFileName);
    }

    /** The deck file name without its last extension ({@code typ-0001.cir} → {@code typ-0001}). */
    public String deckStem() {
        int dot = deckFileName.lastIndexOf('.');
        return dot > 0 ? deckFileName.substring(0, dot) : deckFileName;
    }

    /** Where the engine's standard output goes: {@code workDir/<deck stem>.stdout.txt}. */
    public Path stdoutFile() {
        return workDir.resolve(deckStem() + ".stdout.txt");
    }

    /** Where the engine's standard error goes: {@code workDir/<deck stem>.stderr.txt}. */
    public Path stderrFile() {
        return workDir.resolve(deckStem() + ".stderr.txt");
    }

    private static void requirePlainName(String what, String name) {
        Objects.requireNonNull(name, what);
        if (!FILE_NAME.matcher(name).matches()) {
            throw new IllegalArgumentException(what + " must be a plain file name of letters, digits, `_`, `.` and `-`"
                    + " (at most 100, not starting with `.` or `-`), got `" + name + "`");
        }
    }
}
