package org.ringsweep.runner.engine;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import java.util.function.Supplier;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Several points run by one ngspice process: a master deck {@code source}s each point's
 * circuit-only deck, runs it, writes its raw file and prints {@code RSW_DONE <k> <last time>} on
 * standard output (the deck writer's {@code renderBatch}). It saves the start of one ngspice
 * process per point (about 8 ms).
 *
 * <p>Files: every point's job must have the same work folder, where ngspice runs; the master deck,
 * its console logs ({@code <master stem>.stdout.txt}, {@code .stderr.txt}), each point's
 * circuit-only deck and each point's standalone deck ({@link SimulationJob#deckText()}, written
 * so the deck a record names exists and can be re-run by hand) all go there, and each point's raw
 * file is the one its job names. Raw files left from before are deleted first.
 *
 * <p>Limits: each point has its own job's timeout, counted from the moment the previous point's
 * raw file appeared (from the start for the first), and the whole batch at most the sum of the
 * points' timeouts. The stall watch follows the point now running: when its raw file appears the
 * watch moves to the next point and reads only what standard error gains from then on, since
 * ngspice's simulated time starts again at each point.
 *
 * <p>Conservative by design, because the points share one standard error: a point counts as a
 * success only when the process showed no error or warning text at all and the point's raw file
 * passes every check of a single run (exists, parses, holds every probe, reaches the stop time,
 * not truncated, finite), and, when ngspice ended by itself with exit status 0, its
 * {@code RSW_DONE} marker was printed. Every other point is run again alone with
 * {@link NgspiceEngine#run}, so its outcome is exactly that of a one-point run and a bad point can
 * make its neighbours neither fail nor pass. A batch interrupted (Ctrl-C) gives failures for the
 * points not proven good and starts no further runs.
 */
public final class NgspiceBatch {
    /** The marker the master deck prints after each point: {@code RSW_DONE <k> <last time>}. */
    static final Pattern MARKER = Pattern.compile("(?m)^RSW_DONE (\\d+) (\\S+)\\s*$");
    /** Text on standard error that makes every point of the batch unproven (ngspice.md §3 rule 3, widened). */
    private static final Pattern TROUBLE = Pattern.compile(
            "(?i)error|warning|fatal|abort|no such|not parsed|singular|too small|to low|not available|exit\\(");
    private static final Pattern TICKER = Pattern.compile("Reference value\\s*:\\s*\\S+\\s*");
    private static final Pattern PLAIN = Pattern.compile("[a-z0-9_]+\\.cir");

    /**
     * One point of a batch.
     *
     * @param job                 the point's standalone job (its deck is also the fall-back run's)
     * @param circuitDeckFileName the circuit-only deck the master sources; {@code [a-z0-9_]+\.cir}
     * @param circuitDeckText     its text (the deck writer's {@code renderCircuitOnly})
     */
    public record Point(SimulationJob job, String circuitDeckFileName, String circuitDeckText) {
        /**
         * Checks the values.
         *
         * @throws IllegalArgumentException for a deck name outside the pattern or equal to the job's deck
         */
        public Point {
            Objects.requireNonNull(job, "job");
            Objects.requireNonNull(circuitDeckText, "circuitDeckText");
            if (circuitDeckFileName == null || !PLAIN.matcher(circuitDeckFileName).matches()) {
                throw new IllegalArgumentException("circuit-only deck name `" + circuitDeckFileName + "` must match " + PLAIN.pattern());
            }
            if (circuitDeckFileName.equals(job.deckFileName())) {
                throw new IllegalArgumentException("the circuit-only deck must not replace the standalone deck `" + circuitDeckFileName + "`");
            }
        }
    }

    private final List<Point> points;
    private final String masterFileName;
    private final String masterDeckText;
    private final Path workDir;

    /**
     * A batch.
     *
     * @param points         the points, in the master deck's order (its {@code RSW_DONE} indexes); at least one
     * @param masterFileName the master deck's file name; {@code [a-z0-9_]+\.cir}, no point's deck name
     * @param masterDeckText the master deck (the deck writer's {@code renderBatch} of the points' names)
     * @throws IllegalArgumentException for no points, points in different work folders, or clashing names
     */
    public NgspiceBatch(List<Point> points, String masterFileName, String masterDeckText) {
        this.points = List.copyOf(points);
        this.masterDeckText = Objects.requireNonNull(masterDeckText, "masterDeckText");
        if (this.points.isEmpty()) {
            throw new IllegalArgumentException("a batch needs at least one point");
        }
        if (masterFileName == null || !PLAIN.matcher(masterFileName).matches()) {
            throw new IllegalArgumentException("master deck name `" + masterFileName + "` must match " + PLAIN.pattern());
        }
        this.masterFileName = masterFileName;
        this.workDir = this.points.get(0).job().workDir();
        Set<String> names = new HashSet<>();
        names.add(masterFileName);
        for (Point p : this.points) {
            if (!p.job().workDir().equals(workDir)) {
                throw new IllegalArgumentException("every point of a batch must run in one folder; `" + p.job().workDir()
                        + "` differs from `" + workDir + "`");
            }
            for (String n : List.of(p.circuitDeckFileName(), p.job().deckFileName(), p.job().rawFileName())) {
                if (!names.add(n.toLowerCase(Locale.ROOT))) {
                    throw new IllegalArgumentException("file name `" + n + "` is used twice in a batch");
                }
            }
        }
    }

    /** The points, in order. */
    public List<Point> points() {
        return points;
    }

    /** The master deck's path in the work folder. */
    public Path masterFile() {
        return workDir.resolve(masterFileName);
    }

    private String stem() {
        return masterFileName.substring(0, masterFileName.length() - 4);
    }

    /** Where the master's standard output goes. */
    public Path stdoutFile() {
        return workDir.resolve(stem() + ".stdout.txt");
    }

    /** Where the master's standard error goes. */
    public Path stderrFile() {
        return workDir.resolve(stem() + ".stderr.txt");
    }

    List<SimulationOutcome> runOn(NgspiceEngine engine) {
        int n = points.size();
        try {
            Files.createDirectories(workDir);
            for (Point p : points) {
                Files.deleteIfExists(p.job().rawFile());
                Files.writeString(p.job().deckFile(), p.job().deckText(), StandardCharsets.UTF_8);
                Files.writeString(workDir.resolve(p.circuitDeckFileName()), p.circuitDeckText(), StandardCharsets.UTF_8);
            }
            Files.writeString(masterFile(), masterDeckText, StandardCharsets.UTF_8);
        } catch (IOException | UncheckedIOException e) {
            return fallBack(engine, new SimulationOutcome[n]);
        }
        long start = System.nanoTime();
        Process process;
        try {
            Optional<Process> started = ProcessTrees.start(engine.builder(workDir, masterFileName, stdoutFile(), stderrFile()));
            if (started.isEmpty()) {
                return interrupted(new SimulationOutcome[n], "the program is stopping; ngspice was not started", Duration.ZERO);
            }
            process = started.get();
        } catch (IOException e) {
            return fallBack(engine, new SimulationOutcome[n]);
        }
        boolean finished = false;
        boolean interrupted = false;
        try {
            NgspiceEngine.closeInput(process);
            await(process, start);
            finished = !process.isAlive();
        } catch (InterruptedException e) {
            interrupted = true;
        } finally {
            if (finished) {
                ProcessTrees.release(process);
            } else {
                ProcessTrees.kill(process);
            }
        }
        Duration elapsed = Duration.ofNanos(System.nanoTime() - start);
        SimulationOutcome[] outcomes = new SimulationOutcome[n];
        String stdout;
        String stderr;
        try {
            stdout = NgspiceEngine.readLog(stdoutFile());
            stderr = NgspiceEngine.readLog(stderrFile());
        } catch (IOException e) {
            stdout = null;
            stderr = null;
        }
        if (stdout != null && !troubled(stderr)) {
            boolean needMarker = finished && process.exitValue() == 0;
            Set<Integer> marked = markers(stdout);
            String log = NgspiceEngine.excerpt(stdout, stderr);
            Duration share = elapsed.dividedBy(n);
            for (int k = 0; k < n; k++) {
                if (needMarker && !marked.contains(k)) {
                    continue;
                }
                SimulationJob job = points.get(k).job();
                if (Files.isRegularFile(job.rawFile())) {
                    SimulationOutcome o = NgspiceEngine.readOutput(job, log, share);
                    if (o.succeeded()) {
                        outcomes[k] = o;
                    }
                }
            }
        }
        if (interrupted) {
            Thread.currentThread().interrupt();
            return interrupted(outcomes, "the batch was interrupted after " + NgspiceEngine.seconds(elapsed)
                    + " and ngspice was stopped; the raw output is incomplete", elapsed);
        }
        return fallBack(engine, outcomes);
    }

    /** Fills every missing outcome with a run of the point alone. */
    private List<SimulationOutcome> fallBack(NgspiceEngine engine, SimulationOutcome[] outcomes) {
        List<SimulationOutcome> list = new ArrayList<>();
        for (int k = 0; k < outcomes.length; k++) {
            SimulationOutcome o = outcomes[k];
            if (o == null) {
                o = Thread.currentThread().isInterrupted()
                        ? new SimulationOutcome.Failure(FailureKind.TIMEOUT, "the run was interrupted before it started", "", Duration.ZERO)
                        : engine.run(points.get(k).job());
            }
            list.add(o);
        }
        return List.copyOf(list);
    }

    private static List<SimulationOutcome> interrupted(SimulationOutcome[] outcomes, String why, Duration elapsed) {
        List<SimulationOutcome> list = new ArrayList<>();
        for (SimulationOutcome o : outcomes) {
            list.add(o != null ? o : new SimulationOutcome.Failure(FailureKind.TIMEOUT, why, "", elapsed));
        }
        return List.copyOf(list);
    }

    /** Whether standard error holds anything but the ticker that looks like an error or a warning. */
    static boolean troubled(String stderr) {
        return TROUBLE.matcher(TICKER.matcher(stderr).replaceAll("")).find();
    }

    /** The indexes of the points whose marker standard output shows. */
    static Set<Integer> markers(String stdout) {
        Set<Integer> done = new HashSet<>();
        Matcher m = MARKER.matcher(stdout);
        while (m.find()) {
            done.add(Integer.parseInt(m.group(1)));
        }
        return done;
    }

    /**
     * Waits until ngspice ends, the running point passes its timeout or stalls, or the batch its
     * total timeout; the process may still run when this returns.
     */
    private void await(Process process, long start) throws InterruptedException {
        Supplier<Optional<Duration>> cpuTime = () -> process.info().totalCpuDuration();
        long total = 0;
        for (Point p : points) {
            total = saturatedAdd(total, p.job().timeout().toNanos());
        }
        long cap = start + total;
        int k = 0;
        StallWatch watch = watch(k);
        long deadline = Math.min(cap, start + points.get(0).job().timeout().toNanos());
        long poll = StallWatch.POLL.toNanos();
        while (true) {
            long left = deadline - System.nanoTime();
            if (left <= 0 || process.waitFor(Math.min(left, poll), TimeUnit.NANOSECONDS)) {
                return;
            }
            long now = System.nanoTime();
            while (k < points.size() - 1 && Files.exists(points.get(k).job().rawFile())) {
                k++; // point k is writing its output: the next one is (or soon will be) running
                watch = watch(k);
                deadline = Math.min(cap, saturatedAdd(now, points.get(k).job().timeout().toNanos()));
            }
            if (watch.check(now, cpuTime).isPresent()) {
                return;
            }
        }
    }

    private StallWatch watch(int k) {
        SimulationJob job = points.get(k).job();
        long seen;
        try {
            seen = Files.exists(stderrFile()) ? Files.size(stderrFile()) : 0;
        } catch (IOException e) {
            seen = 0;
        }
        return new StallWatch(stderrFile(), job.rawFile(), job.stopTime(), job.stallTimeout(), seen);
    }

    private static long saturatedAdd(long a, long b) {
        long r = a + b;
        return ((a ^ r) & (b ^ r)) < 0 ? Long.MAX_VALUE : r;
    }
}
