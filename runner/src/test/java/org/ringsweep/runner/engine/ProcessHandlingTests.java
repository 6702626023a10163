package org.ringsweep.runner.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.time.Duration;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.condition.DisabledOnOs;
import org.junit.jupiter.api.condition.OS;
import org.junit.jupiter.api.io.TempDir;

/**
 * How the engine starts, watches and stops its process, checked with small shell scripts in the
 * place of ngspice (so exit statuses and child processes are under the test's control).
 */
@DisabledOnOs(OS.WINDOWS)
class ProcessHandlingTests {
    @TempDir
    Path tmp;

    /** A stand-in for ngspice: prints a banner for {@code -v}, else runs {@code body}. */
    Path fakeNgspice(String body) throws IOException {
        Path script = tmp.resolve("bin").resolve("ngspice");
        Files.createDirectories(script.getParent());
        Files.writeString(script, "#!/bin/sh\nif [ \"$2\" = \"-v\" ]; then echo '** ngspice-42.1 : fake'; exit 0; fi\n"
                + body + "\n");
        Files.setPosixFilePermissions(script, PosixFilePermissions.fromString("rwxr-xr-x"));
        return script;
    }

    SimulationOutcome.Failure run(Path binary, Duration timeout) {
        return run(NgspiceEngine.at(binary), timeout);
    }

    SimulationOutcome.Failure run(NgspiceEngine engine, Duration timeout) {
        return run(engine, timeout, SimulationJob.DEFAULT_STALL_TIMEOUT);
    }

    /** Runs a job with a stop time of 1 ns. */
    SimulationOutcome.Failure run(NgspiceEngine engine, Duration timeout, Duration stallTimeout) {
        SimulationJob job = new SimulationJob("* fake\n.end\n", tmp.resolve("work"), "point.cir", "out.raw", 1e-9,
                timeout, Map.of("a", "a")).withStallTimeout(stallTimeout);
        SimulationOutcome o = engine.run(job);
        return assertInstanceOf(SimulationOutcome.Failure.class, o, o::toString);
    }

    /** A shell loop that keeps a CPU busy and prints ngspice's ticker token {@code ticker} every 20000 rounds. */
    static String busyTicker(String ticker) {
        return "i=0; while true; do i=$((i+1)); if [ $((i % 20000)) -eq 0 ]; then printf ' Reference value :  "
                + ticker + "\\r' >&2; fi; done";
    }

    static void assertDead(Path pidFile) throws Exception {
        long child = Long.parseLong(Files.readString(pidFile).strip());
        Optional<ProcessHandle> handle = ProcessHandle.of(child);
        for (int i = 0; i < 40 && handle.map(ProcessHandle::isAlive).orElse(false); i++) {
            Thread.sleep(50); // the killed child may take a moment to be reaped
        }
        assertTrue(handle.isEmpty() || !handle.get().isAlive(), "child " + child + " still alive");
    }

    @Test
    void runsInTheWorkFolderWithHomeThereNoStartupFileAndStdinAtEnd() throws IOException {
        // `cat` returns only when stdin is at its end: an open stdin would run into the timeout instead.
        Path bin = fakeNgspice("printf '%s\\n' \"$*\" > args.txt; echo \"$HOME\" > home.txt; pwd > pwd.txt; cat > stdin.txt");
        SimulationOutcome.Failure f = run(bin, Duration.ofSeconds(10));
        Path work = tmp.resolve("work");
        assertEquals(FailureKind.MISSING_OUTPUT, f.kind(), f.message());
        assertEquals("-n -b point.cir", Files.readString(work.resolve("args.txt")).strip());
        assertEquals(work.toAbsolutePath().toString(), Files.readString(work.resolve("home.txt")).strip());
        assertEquals(work.toRealPath().toString(), Files.readString(work.resolve("pwd.txt")).strip());
        assertEquals("* fake\n.end\n", Files.readString(work.resolve("point.cir")));
        assertEquals("42.1", NgspiceEngine.at(bin).version());
    }

    @Test
    void nonZeroExitWithoutAKnownMessageIsACrashQuotingStderr() throws IOException {
        SimulationOutcome.Failure f = run(fakeNgspice("echo 'something odd happened' >&2; exit 7"), Duration.ofSeconds(10));
        assertEquals(FailureKind.CRASH, f.kind());
        assertEquals("ngspice ended with exit status 7: something odd happened", f.message());
    }

    @Test
    void deathBySignalIsACrashNamingTheSignal() throws IOException {
        SimulationOutcome.Failure f = run(fakeNgspice("kill -SEGV $$"), Duration.ofSeconds(10));
        assertEquals(FailureKind.CRASH, f.kind());
        // POSIX shells report death by signal N as status 128 + N; SIGSEGV is 11.
        assertTrue(f.message().contains("exit status 139 (killed by signal 11)"), f.message());
    }

    @Test
    void killedFromOutsideIsATimeout() throws IOException {
        SimulationOutcome.Failure f = run(fakeNgspice("kill -KILL $$"), Duration.ofSeconds(10));
        assertEquals(FailureKind.TIMEOUT, f.kind(), f.message());
    }

    @Test
    void timeoutKillsTheWholeProcessTree() throws Exception {
        Path bin = fakeNgspice("sleep 300 & echo $! > child.pid; sleep 300");
        long start = System.nanoTime();
        SimulationOutcome.Failure f = run(bin, Duration.ofSeconds(1));
        assertEquals(FailureKind.TIMEOUT, f.kind(), f.message());
        assertTrue((System.nanoTime() - start) / 1e9 < 6);
        long child = Long.parseLong(Files.readString(tmp.resolve("work").resolve("child.pid")).strip());
        Optional<ProcessHandle> handle = ProcessHandle.of(child);
        for (int i = 0; i < 40 && handle.map(ProcessHandle::isAlive).orElse(false); i++) {
            Thread.sleep(50); // the killed child may take a moment to be reaped
        }
        assertTrue(handle.isEmpty() || !handle.get().isAlive(), "child " + child + " still alive");
        assertEquals(0, ProcessTrees.running());
    }

    @Test
    void tickerStuckAtOneTimeIsAStallThatKillsTheWholeTree() throws Exception {
        Path bin = fakeNgspice("sleep 300 & echo $! > child.pid; " + busyTicker("5.00000e-10"));
        long start = System.nanoTime();
        SimulationOutcome.Failure f = run(NgspiceEngine.at(bin), Duration.ofSeconds(30), Duration.ofSeconds(1));
        double seconds = (System.nanoTime() - start) / 1e9;
        assertEquals(FailureKind.STALLED, f.kind(), f.message());
        assertTrue(f.message().startsWith("ngspice stopped advancing at t = 5e-10 s of 1e-09 s (time step collapse)"
                + " and was stopped after "), f.message());
        assertTrue(seconds < 6, "took " + seconds + " s");
        assertDead(tmp.resolve("work").resolve("child.pid"));
        assertEquals(0, ProcessTrees.running());
    }

    @Test
    void silenceBeforeTheFirstTimePointIsLeftToTheTimeout() throws IOException {
        // No ticker at all, as while ngspice parses or seeks the operating point: only the timeout applies.
        Path bin = fakeNgspice("i=0; while true; do i=$((i+1)); done");
        SimulationOutcome.Failure f = run(NgspiceEngine.at(bin), Duration.ofSeconds(2), Duration.ofMillis(500));
        assertEquals(FailureKind.TIMEOUT, f.kind(), f.message());
    }

    @Test
    void tickerThatKeepsAdvancingIsLeftToTheTimeout() throws IOException {
        // 2 ps per token, 0.2 % of the 1 ns stop time: progress every time, never the stop time within 2 s.
        Path bin = fakeNgspice("i=0; while true; do i=$((i+1)); printf ' Reference value :  %d.00000e-12\\r' $((2 * i)) >&2;"
                + " sleep 0.1; done");
        SimulationOutcome.Failure f = run(NgspiceEngine.at(bin), Duration.ofSeconds(2), Duration.ofMillis(500));
        assertEquals(FailureKind.TIMEOUT, f.kind(), f.message());
    }

    @Test
    void stuckTickerOfAProcessThatUsesNoCpuIsNotAStall() throws IOException {
        // A process that gets no CPU (a starved or sleeping one) has not collapsed its time step.
        assumeTrue(ProcessHandle.current().info().totalCpuDuration().isPresent(), "the platform tells no CPU time");
        Path bin = fakeNgspice("while true; do printf ' Reference value :  5.00000e-10\\r' >&2; sleep 0.2; done");
        SimulationOutcome.Failure f = run(NgspiceEngine.at(bin), Duration.ofSeconds(3), Duration.ofMillis(500));
        assertEquals(FailureKind.TIMEOUT, f.kind(), f.message());
    }

    @Test
    void interruptedRunStopsNgspiceAndKeepsTheInterrupt() throws IOException {
        NgspiceEngine engine = NgspiceEngine.at(fakeNgspice("sleep 300"));
        Thread.currentThread().interrupt();
        try {
            SimulationOutcome.Failure f = run(engine, Duration.ofSeconds(30));
            assertEquals(FailureKind.TIMEOUT, f.kind());
            assertTrue(f.message().contains("interrupted"), f.message());
            assertTrue(Thread.currentThread().isInterrupted());
            assertEquals(0, ProcessTrees.running());
        } finally {
            Thread.interrupted();
        }
    }
}
