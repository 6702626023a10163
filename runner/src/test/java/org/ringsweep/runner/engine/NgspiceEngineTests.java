package org.ringsweep.runner.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.runner.testing.Ngspice;

/** Runs hand-written decks (recipe of reference ngspice.md §2) through the real ngspice. */
class NgspiceEngineTests {
    private static final Duration TIMEOUT = Duration.ofSeconds(30);

    @TempDir
    Path out;

    /** A deck following ngspice.md §2: title, elements, .tran, then a .control block that writes and quits. */
    static String deck(String writeVectors, String... cards) {
        return "* engine test\n" + String.join("\n", cards) + "\n"
                + ".control\nset filetype=binary\nrun\nwrite out.raw " + writeVectors + "\nquit\n.endc\n.end\n";
    }

    static SimulationJob job(Path dir, String deck, double stopTime, Map<String, String> probes) {
        return new SimulationJob(deck, dir, "point.cir", "out.raw", stopTime, TIMEOUT, probes);
    }

    static NgspiceEngine engine() {
        return NgspiceEngine.at(Ngspice.require());
    }

    static SimulationOutcome.Failure failed(SimulationOutcome outcome) {
        return assertInstanceOf(SimulationOutcome.Failure.class, outcome, () -> "expected a failure, got " + outcome);
    }

    /** Linear interpolation of a signal at time t (s). */
    static double at(Waveforms w, String name, double t) {
        for (int i = 1; i < w.size(); i++) {
            if (w.time(i) >= t) {
                double f = (t - w.time(i - 1)) / (w.time(i) - w.time(i - 1));
                return w.value(name, i - 1) + f * (w.value(name, i) - w.value(name, i - 1));
            }
        }
        throw new AssertionError("t = " + t + " beyond the waveform end " + w.endTime());
    }

    static String rcDeck(String resistance) {
        return deck("v(a)",
                "V1 in 0 PULSE(0 1 0 1p 1p 1 2)",
                "R1 in a " + resistance,
                "C1 a 0 1n",
                ".options reltol=1e-4",
                ".tran 1n 3u 0 1n");
    }

    @Test
    void rcStepReachesOneMinusOneOverEOfTheStepAtOneTimeConstant() throws IOException {
        Path dir = out.resolve("rc");
        SimulationOutcome outcome = engine().run(job(dir, rcDeck("1k"), 3e-6, Map.of("a", "U7.6")));

        SimulationOutcome.Success ok = assertInstanceOf(SimulationOutcome.Success.class, outcome, outcome::toString);
        Waveforms w = ok.waveforms();
        assertTrue(w.has("a"), () -> "signals " + w.names());
        assertTrue(w.endTime() >= 3e-6 * (1 - 1e-9));
        // Textbook RC charging: v(t) = V (1 - e^(-t/RC)); RC = 1 kOhm * 1 nF = 1 us, so v(RC) = 1 - 1/e.
        double expected = 1 - Math.exp(-1);
        assertEquals(expected, at(w, "a", 1e-6), 0.005 * expected);
        // Three time constants: 1 - e^-3 (same formula).
        assertEquals(1 - Math.exp(-3), at(w, "a", 2.999e-6), 0.005);
        // The engine writes the deck, the raw file and its two logs in the work folder, nothing else.
        try (Stream<Path> files = Files.list(dir)) {
            assertEquals(Set.of("point.cir", "out.raw", "point.stdout.txt", "point.stderr.txt"),
                    files.map(p -> p.getFileName().toString()).collect(Collectors.toSet()));
        }
        assertTrue(ok.engineLog().contains("No. of Data Rows"), ok::engineLog);
    }

    @Test
    void jobsRunInParallelEachGetTheirOwnWaveforms() throws Exception {
        NgspiceEngine engine = engine();
        String[] resistances = {"500", "1k", "2k", "250", "4k", "1.5k"};
        double[] ohms = {500, 1000, 2000, 250, 4000, 1500};
        ExecutorService pool = Executors.newFixedThreadPool(resistances.length);
        try {
            List<Future<SimulationOutcome>> runs = new ArrayList<>();
            for (int i = 0; i < resistances.length; i++) {
                SimulationJob j = job(out.resolve("p" + i), rcDeck(resistances[i]), 3e-6, Map.of("a", "a"));
                runs.add(pool.submit(() -> engine.run(j)));
            }
            for (int i = 0; i < runs.size(); i++) {
                SimulationOutcome o = runs.get(i).get();
                Waveforms w = assertInstanceOf(SimulationOutcome.Success.class, o, o::toString).waveforms();
                // Textbook RC charging at t = 0.5 us: 1 - e^(-0.5us / (R * 1nF)).
                double expected = 1 - Math.exp(-0.5e-6 / (ohms[i] * 1e-9));
                assertEquals(expected, at(w, "a", 0.5e-6), 0.005 * expected, "R = " + resistances[i]);
            }
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void unknownParameterIsASyntaxErrorQuotingNgspice() {
        String deck = deck("v(a)", "V1 in 0 1", "R1 in a 1k foo=3", "C1 a 0 1p", ".tran 1n 10n");
        SimulationOutcome.Failure f = failed(engine().run(job(out, deck, 10e-9, Map.of("a", "a"))));
        assertEquals(FailureKind.SYNTAX, f.kind(), f.message());
        // ngspice.md §1: a parse error prints `Error on line N or its substitute:`; line 3 holds R1 here.
        assertTrue(f.message().contains("Error on line 3"), f.message());
        assertTrue(f.message().contains("unknown parameter (foo)"), f.message());
    }

    @Test
    void resistorWithoutValueFailsAlthoughNgspiceExitsWithZero() {
        // ngspice.md §1: `R1 a b` exits 0 with `resistance to low, set to 1 mOhm`: a wrong circuit, not a result.
        String deck = deck("v(a)", "V1 in 0 1", "R1 in a", "R2 a 0 1k", ".tran 1n 10n");
        SimulationOutcome.Failure f = failed(engine().run(job(out, deck, 10e-9, Map.of("a", "a"))));
        assertEquals(FailureKind.SYNTAX, f.kind(), f.message());
        assertTrue(f.message().contains("resistance to low"), f.message());
    }

    @Test
    void floatingNodeIsASingularMatrix() {
        // Node d sits between two capacitors: no DC path to ground (ngspice.md §1, `check node d`).
        String deck = deck("v(a) v(d)", "V1 in 0 1", "R1 in a 1k", "C1 a d 1p", "C2 d 0 1p", ".tran 1n 10n");
        SimulationOutcome.Failure f = failed(engine().run(job(out, deck, 10e-9, Map.of("a", "a"))));
        assertEquals(FailureKind.SINGULAR_MATRIX, f.kind(), f.message());
        assertTrue(f.message().contains("check node d"), f.message());
    }

    @Test
    void switchWithHysteresisAndNoCapacitanceLosesConvergenceMidRun() {
        // A switch that shorts its own control node has no solution once it closes: ngspice shrinks the
        // step to nothing (`Timestep too small`, ngspice.md §1 mid-run convergence loss) yet exits 0.
        String deck = deck("v(a)", "V1 in 0 PULSE(0 1 1n 1n 1n 10n 20n)", "R1 in a 1k", "S1 a 0 a 0 sw",
                ".model sw sw vt=0.5 vh=0.2 ron=1m roff=1e12", ".tran 10p 10n");
        SimulationOutcome.Failure f = failed(engine().run(job(out, deck, 10e-9, Map.of("a", "a"))));
        assertEquals(FailureKind.CONVERGENCE, f.kind(), f.message());
        assertTrue(f.message().contains("Timestep too small at t = "), f.message());
    }

    @Test
    void conflictingIdealSourcesGiveNoOperatingPoint() {
        // Two ideal sources of different voltage in parallel: no DC solution (ngspice.md §1 "no DC operating point").
        String deck = deck("v(a)", "V1 a 0 1", "V2 a 0 2", "R1 a 0 1k", ".tran 1n 10n");
        SimulationOutcome.Failure f = failed(engine().run(job(out, deck, 10e-9, Map.of("a", "a"))));
        assertEquals(FailureKind.CONVERGENCE, f.kind(), f.message());
        assertTrue(f.message().contains("Transient op failed"), f.message());
    }

    @Test
    void runLongerThanItsTimeoutIsKilledWithNoProcessLeft() {
        // A 1 fs maximum step over 1 s would take days.
        String deck = deck("v(a)", "V1 in 0 PULSE(0 1 0 1n 1n 5n 10n)", "R1 in a 1k", "C1 a 0 1p", ".tran 1f 1 0 1f");
        SimulationJob j = new SimulationJob(deck, out.resolve("slow"), "slow.cir", "out.raw", 1, Duration.ofSeconds(2),
                Map.of("a", "a"));
        long start = System.nanoTime();
        SimulationOutcome.Failure f = failed(engine().run(j));
        double seconds = (System.nanoTime() - start) / 1e9;

        assertEquals(FailureKind.TIMEOUT, f.kind(), f.message());
        assertTrue(seconds < 8, "took " + seconds + " s");
        assertEquals(0, ProcessTrees.running());
        List<String> left = ProcessHandle.current().descendants()
                .filter(ProcessHandle::isAlive)
                .map(p -> p.info().commandLine().orElse(""))
                .filter(c -> c.contains("ngspice") || c.contains("slow.cir"))
                .collect(Collectors.toList());
        assertEquals(List.of(), left);
    }

    @Test
    void rawFileWithoutAProbeIsMissingOutput() {
        String deck = deck("v(a)", "V1 in 0 1", "R1 in a 1k", "R2 a b 1k", "R3 b 0 1k", ".tran 1n 10n");
        SimulationOutcome.Failure f = failed(engine().run(job(out, deck, 10e-9, Map.of("a", "a", "b", "U2.1"))));
        assertEquals(FailureKind.MISSING_OUTPUT, f.kind(), f.message());
        assertTrue(f.message().contains("`v(b)` (U2.1)"), f.message());
    }

    @Test
    void deckThatWritesNoRawFileIsMissingOutputEvenWithAnOldRawFileThere() throws IOException {
        Files.writeString(out.resolve("out.raw"), "left over from an earlier run");
        String deck = "* engine test\nV1 in 0 1\nR1 in 0 1k\n.tran 1n 10n\n.control\nrun\nquit\n.endc\n.end\n";
        SimulationOutcome.Failure f = failed(engine().run(job(out, deck, 10e-9, Map.of())));
        assertEquals(FailureKind.MISSING_OUTPUT, f.kind(), f.message());
    }

    @Test
    void transientShorterThanTheJobsStopTimeIsTruncated() {
        String deck = deck("v(a)", "V1 in 0 1", "R1 in a 1k", "C1 a 0 1p", ".tran 1n 10n");
        SimulationOutcome.Failure f = failed(engine().run(job(out, deck, 20e-9, Map.of("a", "a"))));
        assertEquals(FailureKind.TRUNCATED_OUTPUT, f.kind(), f.message());
        assertTrue(f.message().endsWith("before its stop time 2e-08 s"), f.message());
    }

    @Test
    void decksOwnEndTimeCheckExitingWithThreeIsTruncated() {
        // ngspice.md §3 rule 4: `if tlast < …` → `quit 3` in the deck.
        String deck = "* engine test\nV1 in 0 1\nR1 in a 1k\nC1 a 0 1p\n.tran 1n 10n\n.control\nset filetype=binary\n"
                + "run\nlet tlast = time[length(time)-1]\nwrite out.raw v(a)\nif tlast < 19.99n\nquit 3\nend\n"
                + "quit 0\n.endc\n.end\n";
        SimulationOutcome.Failure f = failed(engine().run(job(out, deck, 20e-9, Map.of("a", "a"))));
        assertEquals(FailureKind.TRUNCATED_OUTPUT, f.kind(), f.message());
        assertTrue(f.message().contains("exit status 3"), f.message());
    }

    @Test
    void versionOfTheInstalledBinaryIsANumber() {
        // ngspice.md §1: the `-v` banner contains `ngspice-39` on the tested install.
        String version = engine().version();
        assertTrue(version.matches("\\d+(\\.\\d+)*"), version);
    }

    @Test
    void locateUsesTheBinaryNamedByTheEnvironment() {
        Path binary = Ngspice.require();
        NgspiceEngine found = NgspiceEngine.locate(Map.of(NgspiceEngine.BINARY_VARIABLE, binary.toString())).orElseThrow();
        assertEquals(binary, found.binary());
        NgspiceEngine onPath = NgspiceEngine.locate(Map.of("PATH", "/nonexistent:" + binary.getParent())).orElseThrow();
        assertEquals(binary, onPath.binary());
    }
}
