package org.ringsweep.runner.engine;

import java.io.File;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.channels.SeekableByteChannel;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import java.util.function.Supplier;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.runner.raw.RawFileReader;
import org.ringsweep.runner.raw.RawFormatException;
import org.ringsweep.runner.raw.RawPlot;

/**
 * Runs decks with ngspice as an external batch process ({@code ngspice -n -b deck}) and checks
 * its output the way reference ngspice.md §3 asks: a run succeeds only when no error signature
 * appears on standard error, the exit status is 0, and the raw file is complete, reaches the stop
 * time and holds every probe.
 *
 * <p>Each run happens in the job's work folder, which is also the process's current folder and
 * {@code HOME}, with {@code -n} so no {@code .spiceinit} start-up file is executed; standard input
 * is closed at once and the console output goes to files, never pipes. A run that outlives its
 * timeout is killed with all its child processes, and a JVM shutdown hook kills runs still going
 * when the program exits (Ctrl-C).
 *
 * <p>While it waits, the engine reads the end of ngspice's standard error four times a second for
 * the simulated time ngspice reports ({@code Reference value : …}). A transient whose simulated
 * time makes no progress for the job's {@link SimulationJob#stallTimeout() stall timeout}, counted
 * from the first time point reported, has collapsed its time step: it is killed like a timed-out
 * run and fails as {@link FailureKind#STALLED}, naming the simulated time where it stuck.
 * Instances are immutable and thread-safe; each run keeps its watch to its own thread.
 *
 * <p>{@link #runBatch} runs several points in one process ({@link NgspiceBatch}) and runs every
 * point it cannot prove good again alone with {@link #run}.
 */
public final class NgspiceEngine implements SimulationEngine {
    /** Environment variable naming the ngspice binary (a path); else the first {@code ngspice} on {@code PATH}. */
    public static final String BINARY_VARIABLE = "RINGSWEEP_NGSPICE";

    /** Relative tolerance on reaching the stop time (reference ngspice.md §3 rule 4). */
    static final double END_TIME_TOLERANCE = 1e-9;

    private static final Duration VERSION_TIMEOUT = Duration.ofSeconds(10);
    private static final Pattern VERSION = Pattern.compile("ngspice-(\\d+(?:\\.\\d+)*)");
    /** Characters of each console stream kept in {@link SimulationOutcome#engineLog()}. */
    private static final int LOG_EXCERPT = 16_000;
    /** Bytes of each console log read for diagnosis: the head and the tail of bigger files. */
    private static final int LOG_READ_HALF = 4 << 20;
    private static final Pattern TICKER = Pattern.compile("Reference value\\s*:\\s*\\S+\\s*");
    private static final Pattern VOLTAGE = Pattern.compile("v\\((.+)\\)", Pattern.CASE_INSENSITIVE);

    private final Path binary;
    private final String version;

    private NgspiceEngine(Path binary, String version) {
        this.binary = binary;
        this.version = version;
    }

    /**
     * Finds ngspice: the path in {@value #BINARY_VARIABLE} when that is set (and then only
     * there), else the first executable {@code ngspice} on {@code PATH}; reads its version once.
     *
     * @param env the environment to look in (normally {@link System#getenv()})
     * @return the engine, or empty when no executable binary is found ({@link #whyNotFound} says why)
     */
    public static Optional<NgspiceEngine> locate(Map<String, String> env) {
        return findBinary(env).map(NgspiceEngine::at);
    }

    /**
     * The engine for a given binary; reads its version with {@code ngspice -v}.
     *
     * @param binary path of the ngspice executable
     * @throws IllegalArgumentException when {@code binary} is not an executable file
     */
    public static NgspiceEngine at(Path binary) {
        if (!Files.isRegularFile(binary) || !Files.isExecutable(binary)) {
            throw new IllegalArgumentException("ngspice binary `" + binary + "` is not an executable file");
        }
        return new NgspiceEngine(binary, readVersion(binary));
    }

    /**
     * Explains why {@link #locate} found nothing in this environment, for the user.
     *
     * @param env the environment that was searched
     * @return one or two sentences naming what was looked at and how to fix it
     */
    public static String whyNotFound(Map<String, String> env) {
        String named = env.get(BINARY_VARIABLE);
        if (named != null && !named.isBlank()) {
            return BINARY_VARIABLE + " names `" + named + "`, which is not an executable file;"
                    + " point it at the ngspice program or unset it to search PATH";
        }
        return "no `ngspice` program on PATH; install ngspice (apt-get install ngspice) or set "
                + BINARY_VARIABLE + " to its path";
    }

    static Optional<Path> findBinary(Map<String, String> env) {
        String named = env.get(BINARY_VARIABLE);
        if (named != null && !named.isBlank()) {
            Path p = Path.of(named.strip());
            return Files.isRegularFile(p) && Files.isExecutable(p) ? Optional.of(p) : Optional.empty();
        }
        boolean windows = System.getProperty("os.name", "").toLowerCase(Locale.ROOT).startsWith("windows");
        for (String dir : env.getOrDefault("PATH", "").split(Pattern.quote(File.pathSeparator))) {
            if (dir.isBlank()) {
                continue; // an empty PATH entry means the current folder: never run a program from there
            }
            for (String name : windows ? List.of("ngspice.exe", "ngspice") : List.of("ngspice")) {
                Path p = Path.of(dir, name);
                if (Files.isRegularFile(p) && Files.isExecutable(p)) {
                    return Optional.of(p);
                }
            }
        }
        return Optional.empty();
    }

    /** The version from the {@code ngspice -v} banner ({@code ** ngspice-39 : …} → {@code 39}), or {@code unknown}. */
    private static String readVersion(Path binary) {
        Process p = null;
        try {
            Path dir = Path.of(System.getProperty("java.io.tmpdir"));
            Optional<Process> started = ProcessTrees.start(new ProcessBuilder(binary.toString(), "-n", "-v")
                    .directory(dir.toFile()).redirectErrorStream(true));
            if (started.isEmpty()) {
                return "unknown";
            }
            p = started.get();
            p.getOutputStream().close();
            // The banner is a few hundred bytes: it fits the pipe, so waiting before reading cannot block.
            if (!p.waitFor(VERSION_TIMEOUT.toMillis(), TimeUnit.MILLISECONDS)) {
                ProcessTrees.kill(p);
                return "unknown";
            }
            ProcessTrees.release(p);
            try (InputStream in = p.getInputStream()) {
                return parseVersion(new String(in.readNBytes(64 * 1024), StandardCharsets.UTF_8));
            }
        } catch (IOException e) {
            if (p != null) {
                ProcessTrees.kill(p);
            }
            return "unknown";
        } catch (InterruptedException e) {
            ProcessTrees.kill(p);
            Thread.currentThread().interrupt();
            return "unknown";
        }
    }

    static String parseVersion(String banner) {
        Matcher m = VERSION.matcher(banner);
        return m.find() ? m.group(1) : "unknown";
    }

    /** The ngspice executable this engine runs. */
    public Path binary() {
        return binary;
    }

    @Override
    public String name() {
        return "ngspice";
    }

    @Override
    public String version() {
        return version;
    }

    @Override
    public SimulationOutcome run(SimulationJob job) {
        try {
            Files.createDirectories(job.workDir());
            Files.deleteIfExists(job.rawFile()); // a stale raw file must never pass for this run's output
            Files.writeString(job.deckFile(), job.deckText(), StandardCharsets.UTF_8);
        } catch (IOException | UncheckedIOException e) {
            return failure(FailureKind.IO, "could not write the deck `" + job.deckFile() + "`: " + e.getMessage(),
                    "", Duration.ZERO);
        }
        ProcessBuilder builder = builder(job.workDir(), job.deckFileName(), job.stdoutFile(), job.stderrFile());

        long start = System.nanoTime();
        Process process;
        try {
            Optional<Process> started = ProcessTrees.start(builder);
            if (started.isEmpty()) {
                return failure(FailureKind.TIMEOUT, "the program is stopping; ngspice was not started", "", Duration.ZERO);
            }
            process = started.get();
        } catch (IOException e) {
            return failure(FailureKind.ENGINE_NOT_FOUND, "could not start ngspice `" + binary + "`: " + e.getMessage(),
                    "", Duration.ZERO);
        }
        boolean finished = false;
        boolean interrupted = false;
        Optional<StallWatch.Stall> stall = Optional.empty();
        try {
            closeInput(process);
            stall = await(process, job, start);
            finished = !process.isAlive(); // a run that ends just as its limit passes has still ended
        } catch (InterruptedException e) {
            interrupted = true;
        } finally {
            if (finished) {
                ProcessTrees.release(process);
            } else {
                ProcessTrees.kill(process);
            }
        }
        if (interrupted) {
            Thread.currentThread().interrupt();
        }
        Duration elapsed = Duration.ofNanos(System.nanoTime() - start);

        String stdout;
        String stderr;
        try {
            stdout = readLog(job.stdoutFile());
            stderr = readLog(job.stderrFile());
        } catch (IOException e) {
            return failure(FailureKind.IO, "could not read ngspice's console log in `" + job.workDir() + "`: "
                    + e.getMessage(), "", elapsed);
        }
        String log = excerpt(stdout, stderr);
        if (!finished && stall.isPresent()) {
            StallWatch.Stall st = stall.get();
            return failure(FailureKind.STALLED, "ngspice stopped advancing at t = " + number(st.simulatedTime())
                    + " s of " + number(job.stopTime()) + " s (time step collapse) and was stopped after "
                    + seconds(st.withoutProgress()) + " without progress; the raw output is incomplete", log, elapsed);
        }
        if (!finished) {
            String why = interrupted
                    ? "the run was interrupted after " + seconds(elapsed) + " and ngspice was stopped"
                    : "ngspice did not finish within its timeout of " + seconds(job.timeout()) + " and was stopped";
            return failure(FailureKind.TIMEOUT, why + "; the raw output is incomplete", log, elapsed);
        }
        return classify(job, process.exitValue(), stderr, log, elapsed);
    }

    /** The ngspice command for one deck in {@code dir}: closed-off environment, console to files. */
    ProcessBuilder builder(Path dir, String deckFileName, Path stdoutFile, Path stderrFile) {
        ProcessBuilder builder = new ProcessBuilder(binary.toString(), "-n", "-b", deckFileName)
                .directory(dir.toFile())
                .redirectInput(ProcessBuilder.Redirect.PIPE)
                .redirectOutput(stdoutFile.toFile())
                .redirectError(stderrFile.toFile());
        Map<String, String> env = builder.environment();
        String home = dir.toAbsolutePath().toString();
        env.put("HOME", home); // ngspice looks for .spiceinit in HOME too; -n skips it, HOME keeps it private anyway
        env.put("USERPROFILE", home);
        env.put("LC_ALL", "C"); // numbers in ngspice's messages with a decimal point, whatever the user's locale
        return builder;
    }

    /**
     * Runs several points in one ngspice process and falls back to one process per point for
     * every point the batch does not prove good; see {@link NgspiceBatch} for the rules.
     *
     * @param batch the points, their circuit-only decks and the master deck
     * @return one outcome per point, in the batch's order; each is what {@link #run} gives for
     *         the point's job alone, or the batch's own success for a point proven good
     */
    public List<SimulationOutcome> runBatch(NgspiceBatch batch) {
        return batch.runOn(this);
    }

    private static SimulationOutcome classify(SimulationJob job, int exit, String stderr, String log, Duration elapsed) {
        Optional<NgspiceDiagnosis.Finding> finding = NgspiceDiagnosis.diagnose(stderr, job.deckFile().toString());
        if (finding.isPresent()) {
            return failure(finding.get().kind(), finding.get().message(), log, elapsed);
        }
        if (exit == 3) {
            return failure(FailureKind.TRUNCATED_OUTPUT, "the deck's own end-time check stopped ngspice (exit status 3):"
                    + " the transient ended before its stop time of " + number(job.stopTime()) + " s", log, elapsed);
        }
        if (exit == 124 || exit == 137 || exit == 143) {
            return failure(FailureKind.TIMEOUT, "ngspice was stopped from outside (exit status " + exit + ")"
                    + quoteOrNothing(stderr), log, elapsed);
        }
        if (exit != 0) {
            String signal = exit > 128 ? " (killed by signal " + (exit - 128) + ")" : "";
            return failure(FailureKind.CRASH, "ngspice ended with exit status " + exit + signal
                    + quoteOrNothing(stderr), log, elapsed);
        }
        return readOutput(job, log, elapsed);
    }

    static SimulationOutcome readOutput(SimulationJob job, String log, Duration elapsed) {
        Path raw = job.rawFile();
        if (!Files.isRegularFile(raw)) {
            return failure(FailureKind.MISSING_OUTPUT, "ngspice finished without writing the raw file `" + raw
                    + "`; the deck's .control block must `write " + job.rawFileName() + " …`", log, elapsed);
        }
        List<RawPlot> plots;
        try {
            plots = RawFileReader.read(raw);
        } catch (RawFormatException e) {
            return failure(FailureKind.MISSING_OUTPUT, "the raw file is not readable: " + e.getMessage(), log, elapsed);
        } catch (UncheckedIOException e) {
            return failure(FailureKind.IO, "could not read the raw file `" + raw + "`: " + e.getMessage(), log, elapsed);
        }
        Optional<RawPlot> found = plots.stream()
                .filter(p -> p.plotName().toLowerCase(Locale.ROOT).startsWith("transient")).findFirst();
        if (found.isEmpty()) {
            List<String> names = plots.stream().map(RawPlot::plotName).toList();
            return failure(FailureKind.MISSING_OUTPUT, "the raw file `" + raw + "` holds no transient analysis (plots: "
                    + names + ")", log, elapsed);
        }
        RawPlot plot = found.get();
        if (plot.truncated()) {
            return failure(FailureKind.TRUNCATED_OUTPUT, "the raw file `" + raw + "` is incomplete: it declares "
                    + plot.declaredPoints() + " points and holds " + plot.points() + " complete ones", log, elapsed);
        }
        if (plot.points() < 2) {
            return failure(FailureKind.TRUNCATED_OUTPUT, "the raw file `" + raw + "` holds " + plot.points()
                    + " time points; a transient needs at least 2", log, elapsed);
        }
        Optional<double[]> time = plot.column("time");
        if (time.isEmpty()) {
            return failure(FailureKind.MISSING_OUTPUT, "the raw file `" + raw + "` has no `time` vector (it has "
                    + plot.variables() + ")", log, elapsed);
        }
        List<String> missing = new ArrayList<>();
        new TreeMap<>(job.probes()).forEach((safe, user) -> {
            if (plot.column("v(" + safe + ")").isEmpty()) {
                missing.add("`v(" + safe + ")` (" + user + ")");
            }
        });
        if (!missing.isEmpty()) {
            return failure(FailureKind.MISSING_OUTPUT, "the raw file `" + raw + "` lacks the probed voltage"
                    + (missing.size() > 1 ? "s " : " ") + String.join(", ", missing) + "; it has "
                    + plot.variables(), log, elapsed);
        }
        double[] t = time.get();
        double end = t[t.length - 1];
        if (end < job.stopTime() * (1 - END_TIME_TOLERANCE)) {
            return failure(FailureKind.TRUNCATED_OUTPUT, "the transient ends at t = " + number(end) + " s, before its stop time "
                    + number(job.stopTime()) + " s", log, elapsed);
        }
        Map<String, double[]> signals = signals(plot, job.probes());
        for (Map.Entry<String, double[]> e : signals.entrySet()) {
            double[] v = e.getValue();
            for (int i = 0; i < v.length; i++) {
                if (!Double.isFinite(v[i])) {
                    return failure(FailureKind.CONVERGENCE, "the solution is not finite: `" + e.getKey() + "` is "
                            + v[i] + " at t = " + number(t[i]) + " s", log, elapsed);
                }
            }
        }
        try {
            return new SimulationOutcome.Success(Waveforms.of(t, signals, false), log, elapsed);
        } catch (IllegalArgumentException e) {
            return failure(FailureKind.MISSING_OUTPUT, "the raw file `" + raw + "` holds unusable data: "
                    + e.getMessage(), log, elapsed);
        }
    }

    /** Every vector but the time axis; {@code v(x)} is named {@code x}, spelled as the probe spells it. */
    private static Map<String, double[]> signals(RawPlot plot, Map<String, String> probes) {
        Map<String, String> probeByFolded = new LinkedHashMap<>();
        probes.keySet().forEach(k -> probeByFolded.put(k.toLowerCase(Locale.ROOT), k));
        Map<String, double[]> signals = new LinkedHashMap<>();
        for (int i = 0; i < plot.variables().size(); i++) {
            String name = plot.variables().get(i);
            if (name.equalsIgnoreCase("time")) {
                continue;
            }
            Matcher m = VOLTAGE.matcher(name);
            String key = m.matches() ? m.group(1) : name;
            signals.putIfAbsent(probeByFolded.getOrDefault(key.toLowerCase(Locale.ROOT), key), plot.columns().get(i));
        }
        return signals;
    }

    private static SimulationOutcome.Failure failure(FailureKind kind, String message, String log, Duration elapsed) {
        return new SimulationOutcome.Failure(kind, message, log, elapsed);
    }

    private static String quoteOrNothing(String stderr) {
        String quote = NgspiceDiagnosis.quote(stderr);
        return quote.isEmpty() ? "" : ": " + quote;
    }

    /** Closes ngspice's standard input at once, so it can never wait for input. */
    static void closeInput(Process process) {
        try {
            process.getOutputStream().close();
        } catch (IOException e) {
            // The pipe is already gone: ngspice reads end of file all the same.
        }
    }

    /**
     * Waits until the process ends, its timeout passes or it stalls, looking at the ticker
     * every {@link StallWatch#POLL}; the process may still run when this returns.
     *
     * @param start the {@link System#nanoTime()} at the start of the run
     * @return the stall, when that ended the wait
     */
    private static Optional<StallWatch.Stall> await(Process process, SimulationJob job, long start)
            throws InterruptedException {
        StallWatch watch = new StallWatch(job.stderrFile(), job.rawFile(), job.stopTime(), job.stallTimeout());
        Supplier<Optional<Duration>> cpuTime = () -> process.info().totalCpuDuration();
        long deadline = start + job.timeout().toNanos();
        long poll = StallWatch.POLL.toNanos();
        while (true) {
            long left = deadline - System.nanoTime();
            if (left <= 0 || process.waitFor(Math.min(left, poll), TimeUnit.NANOSECONDS)) {
                return Optional.empty();
            }
            Optional<StallWatch.Stall> stall = watch.check(System.nanoTime(), cpuTime);
            if (stall.isPresent()) {
                return stall;
            }
        }
    }

    /** A console log as text; of a very big file only the head and the tail (where the verdict is). */
    static String readLog(Path file) throws IOException {
        if (!Files.exists(file)) {
            return "";
        }
        long size = Files.size(file);
        if (size <= 2L * LOG_READ_HALF) {
            return new String(Files.readAllBytes(file), StandardCharsets.UTF_8);
        }
        try (SeekableByteChannel ch = Files.newByteChannel(file)) {
            ByteBuffer head = ByteBuffer.allocate(LOG_READ_HALF);
            readFully(ch, head);
            ch.position(size - LOG_READ_HALF);
            ByteBuffer tail = ByteBuffer.allocate(LOG_READ_HALF);
            readFully(ch, tail);
            return new String(head.array(), 0, head.position(), StandardCharsets.UTF_8)
                    + "\n[… " + (size - 2L * LOG_READ_HALF) + " bytes left out …]\n"
                    + new String(tail.array(), 0, tail.position(), StandardCharsets.UTF_8);
        }
    }

    private static void readFully(SeekableByteChannel ch, ByteBuffer buffer) throws IOException {
        while (buffer.hasRemaining() && ch.read(buffer) >= 0) {
            // keep reading until full or end of file
        }
    }

    /** The start of both console streams without the progress ticker, for messages and reports. */
    static String excerpt(String stdout, String stderr) {
        return "--- ngspice stdout ---\n" + shorten(stdout) + "\n--- ngspice stderr ---\n"
                + shorten(TICKER.matcher(stderr).replaceAll("").replace('\r', '\n'));
    }

    private static String shorten(String text) {
        String s = text.strip();
        return s.length() <= LOG_EXCERPT ? s : s.substring(0, LOG_EXCERPT) + "\n[… " + (s.length() - LOG_EXCERPT)
                + " more characters in the log file]";
    }

    /** A number as a person reads it: six significant digits, no trailing zeros ({@code 3e-06}, {@code 2.5e-09}). */
    static String number(double x) {
        String s = String.format(Locale.ROOT, "%.6g", x);
        int e = s.indexOf('e');
        String mantissa = e < 0 ? s : s.substring(0, e);
        if (mantissa.contains(".")) {
            mantissa = mantissa.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return e < 0 ? mantissa : mantissa + s.substring(e);
    }

    static String seconds(Duration d) {
        return String.format(Locale.ROOT, "%.3g s", d.toNanos() / 1e9);
    }
}
