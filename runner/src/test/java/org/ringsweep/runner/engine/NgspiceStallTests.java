package org.ringsweep.runner.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Map;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.wave.Waveforms;

/**
 * Stall detection against the real ngspice: a deck whose transient collapses its time step
 * under ngspice 39's default trapezoidal integration, the same deck with gear integration, and
 * a long run that keeps advancing.
 */
class NgspiceStallTests {
    /** Stop time of {@code engine/stall-1ff.cir} (its {@code .tran} card). */
    private static final double STALL_DECK_STOP = 4.12e-8;
    private static final Map<String, String> STALL_DECK_PROBES = Map.of("u1_1", "U1.1", "u2_1", "U2.1");

    @TempDir
    Path out;

    static String stallDeck() throws IOException {
        try (InputStream in = NgspiceStallTests.class.getResourceAsStream("/engine/stall-1ff.cir")) {
            return new String(in.readAllBytes(), StandardCharsets.UTF_8);
        }
    }

    SimulationJob stallDeckJob(String deck, Duration stallTimeout) {
        return new SimulationJob(deck, out, "typ_0001.cir", "typ_0001.raw", STALL_DECK_STOP, Duration.ofSeconds(60),
                STALL_DECK_PROBES).withStallTimeout(stallTimeout);
    }

    @Test
    void collapsingTransientIsStoppedAsStalledWithNoProcessLeft() throws IOException {
        long start = System.nanoTime();
        SimulationOutcome outcome = NgspiceEngineTests.engine().run(stallDeckJob(stallDeck(), Duration.ofSeconds(2)));
        double seconds = (System.nanoTime() - start) / 1e9;

        SimulationOutcome.Failure f = NgspiceEngineTests.failed(outcome);
        assertEquals(FailureKind.STALLED, f.kind(), f.message());
        // ngspice 39 on this deck sticks at about 1.049e-8 s (seen by hand with `ngspice -n -b`).
        assertTrue(f.message().startsWith("ngspice stopped advancing at t = 1.04"), f.message());
        assertTrue(f.message().contains(" s of 4.12e-08 s (time step collapse) and was stopped after "), f.message());
        // 2 s without progress plus a poll and the kill; far below the 60 s timeout.
        assertTrue(seconds < 8, "took " + seconds + " s");
        assertEquals(0, ProcessTrees.running());
        List<String> left = ProcessHandle.current().descendants()
                .filter(ProcessHandle::isAlive)
                .map(p -> p.info().commandLine().orElse(""))
                .filter(c -> c.contains("ngspice") || c.contains("typ_0001.cir"))
                .collect(Collectors.toList());
        assertEquals(List.of(), left);
    }

    @Test
    void sameDeckWithGearIntegrationSucceeds() throws IOException {
        String deck = stallDeck().replace(".tran ", ".options method=gear\n.tran ");
        SimulationOutcome outcome = NgspiceEngineTests.engine().run(stallDeckJob(deck, Duration.ofSeconds(2)));

        Waveforms w = assertInstanceOf(SimulationOutcome.Success.class, outcome, outcome::toString).waveforms();
        assertTrue(w.endTime() >= STALL_DECK_STOP * (1 - 1e-9));
        // Series-terminated open line (reference lines-and-terminations.md §2, worked example 2): 15 ohm driver
        // plus 35 ohm series resistor = Z0 = 50 ohm, so the far end steps straight to the full 3.3 V one TD
        // (1 ns, plus the 10 ps stub) after the driver's edge at 1.0-1.1 ns, and stays there without ringing.
        assertEquals(0.0, NgspiceEngineTests.at(w, "u2_1", 1.9e-9), 0.01 * 3.3);
        assertEquals(3.3, NgspiceEngineTests.at(w, "u2_1", 5e-9), 0.01 * 3.3);
        assertEquals(3.3, NgspiceEngineTests.at(w, "u2_1", 20e-9), 0.01 * 3.3);
    }

    /** A 400-section RC ladder over 100k time points: some seconds of steady work for ngspice. */
    static String rcLadder(int sections) {
        StringBuilder cards = new StringBuilder("V1 n0 0 PULSE(0 1 0 1n 1n 50n 100n)\n");
        for (int i = 1; i <= sections; i++) {
            cards.append("R").append(i).append(" n").append(i - 1).append(" n").append(i).append(" 10\n");
            cards.append("C").append(i).append(" n").append(i).append(" 0 1p\n");
        }
        cards.append(".save v(n").append(sections).append(")\n"); // keep ngspice's memory small
        cards.append(".tran 1p 100n 0 1p");
        return NgspiceEngineTests.deck("v(n" + sections + ")", cards.toString());
    }

    @Test
    void longRunThatKeepsAdvancingIsNotStoppedByAShortStallTimeout() {
        Duration stall = Duration.ofSeconds(1);
        SimulationJob job = new SimulationJob(rcLadder(400), out, "ladder.cir", "out.raw", 100e-9, Duration.ofSeconds(60),
                Map.of("n400", "far")).withStallTimeout(stall);
        SimulationOutcome outcome = NgspiceEngineTests.engine().run(job);

        SimulationOutcome.Success ok = assertInstanceOf(SimulationOutcome.Success.class, outcome, outcome::toString);
        assertTrue(ok.waveforms().endTime() >= 100e-9 * (1 - 1e-9));
        // The check means something only when the run outlasted several stall periods (about 4 s on a 2-core CI box).
        assumeTrue(ok.elapsed().compareTo(stall.multipliedBy(2)) > 0, () -> "run took only " + ok.elapsed());
    }
}
