package org.ringsweep.runner.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.generators.deck.BatchEntry;
import org.ringsweep.generators.deck.DeckWriter;

/** Several decks in one ngspice process, against ngspice itself and against textbook RC charging. */
class NgspiceBatchTests {
    private static final Duration TIMEOUT = Duration.ofSeconds(60);

    @TempDir
    Path out;

    /** An RC step: 1 V through R into 1 nF, 3 us; the cards without any control block. */
    private static String rcCards(String resistance) {
        return "* batch test\nV1 in 0 PULSE(0 1 0 1p 1p 1 2)\nR1 in a " + resistance + "\nC1 a 0 1n\n"
                + ".options reltol=1e-4\n.tran 1n 3u 0 1n\n";
    }

    private static String standalone(String cards, String raw) {
        return cards + ".control\nset filetype=binary\nrun\nwrite " + raw + " v(a)\nquit\n.endc\n.end\n";
    }

    private NgspiceBatch.Point point(int k, String cards, double stop, Map<String, String> probes, Duration stall) {
        String raw = "p" + k + ".raw";
        String deck = cards.endsWith(".end\n") ? cards : standalone(cards, raw);
        String circuit = cards.endsWith(".end\n") ? cards.substring(0, cards.indexOf(".control")) + ".end\n" : cards + ".end\n";
        SimulationJob job = new SimulationJob(deck, out, "p" + k + ".cir", raw, stop, TIMEOUT, probes).withStallTimeout(stall);
        return new NgspiceBatch.Point(job, "p" + k + "_circuit.cir", circuit);
    }

    private NgspiceBatch.Point rc(int k, String resistance) {
        return point(k, rcCards(resistance), 3e-6, Map.of("a", "A"), SimulationJob.DEFAULT_STALL_TIMEOUT);
    }

    private static NgspiceBatch batch(List<NgspiceBatch.Point> points) {
        List<BatchEntry> entries = new ArrayList<>();
        for (NgspiceBatch.Point p : points) {
            entries.add(new BatchEntry(p.circuitDeckFileName(), p.job().rawFileName(), new ArrayList<>(p.job().probes().keySet())));
        }
        return new NgspiceBatch(points, "batch_p0.cir", new DeckWriter().renderBatch(entries, true));
    }

    private static Waveforms waveforms(SimulationOutcome o) {
        return assertInstanceOf(SimulationOutcome.Success.class, o, o::toString).waveforms();
    }

    /** Whether the point was run again alone: a one-point run leaves its own console logs. */
    private static boolean ranAlone(NgspiceBatch.Point p) {
        return Files.exists(p.job().stdoutFile());
    }

    @Test
    void pointsOfABatchGiveWhatTheirOwnRunsGive() {
        NgspiceEngine engine = NgspiceEngineTests.engine();
        List<NgspiceBatch.Point> points = List.of(rc(0, "1k"), rc(1, "500"), rc(2, "2k"));
        List<SimulationOutcome> outcomes = engine.runBatch(batch(points));
        assertEquals(3, outcomes.size());
        double[] tau = {1e-6, 0.5e-6, 2e-6};
        for (int k = 0; k < 3; k++) {
            Waveforms w = waveforms(outcomes.get(k));
            assertFalse(ranAlone(points.get(k)), "point " + k + " was proven by the batch, not re-run");
            // RC charging, v = 1 - exp(-t/RC) (any circuits textbook): 0.632 V at one time constant.
            assertEquals(1 - Math.exp(-1), NgspiceEngineTests.at(w, "a", tau[k]), 0.005, "point " + k);
            // ngspice alone as the reference: the same deck in its own process gives the same samples.
            Waveforms alone = waveforms(engine.run(new SimulationJob(points.get(k).job().deckText(), out.resolve("alone" + k),
                    "p.cir", "p" + k + ".raw", 3e-6, TIMEOUT, Map.of("a", "A"))));
            assertEquals(alone.size(), w.size());
            for (int i = 0; i < w.size(); i += 97) {
                assertEquals(alone.time(i), w.time(i), 0.0);
                assertEquals(alone.value("a", i), w.value("a", i), 0.0);
            }
        }
        assertTrue(Files.exists(out.resolve("p1.cir")), "the standalone deck is written for the record");
    }

    @Test
    void aBrokenPointFailsAloneAndItsNeighboursAreRunAgainAndPass() {
        NgspiceEngine engine = NgspiceEngineTests.engine();
        // An unknown model name is a parse error (ngspice.md §1: `Error on line N or its substitute`).
        String broken = "* broken\nV1 in 0 PULSE(0 1 0 1p 1p 1 2)\nR1 in a 1k\nD1 a 0 nosuchmodel\n.tran 1n 3u 0 1n\n";
        List<NgspiceBatch.Point> points = List.of(rc(0, "1k"), point(1, broken, 3e-6, Map.of("a", "A"),
                SimulationJob.DEFAULT_STALL_TIMEOUT), rc(2, "1k"));
        List<SimulationOutcome> outcomes = engine.runBatch(batch(points));

        SimulationOutcome.Failure f = NgspiceEngineTests.failed(outcomes.get(1));
        SimulationOutcome.Failure aloneFailure = NgspiceEngineTests.failed(engine.run(
                new SimulationJob(points.get(1).job().deckText(), out.resolve("alone"), "p1.cir", "p1.raw", 3e-6, TIMEOUT, Map.of("a", "A"))));
        assertEquals(aloneFailure.kind(), f.kind(), "the batch gives the failure a run alone gives");
        for (int k : new int[] {0, 2}) {
            // The shared standard error shows an error: nobody is proven by the batch, everyone runs alone.
            assertTrue(ranAlone(points.get(k)), "point " + k + " re-run alone");
            assertEquals(1 - Math.exp(-1), NgspiceEngineTests.at(waveforms(outcomes.get(k)), "a", 1e-6), 0.005);
        }
    }

    @Test
    void aStalledPointIsCaughtInsideTheBatchAndTheOthersPass() throws IOException {
        NgspiceEngine engine = NgspiceEngineTests.engine();
        Duration stall = Duration.ofSeconds(1);
        String stallDeck = NgspiceStallTests.stallDeck().replace("typ_0001.raw", "p1.raw");
        List<NgspiceBatch.Point> points = List.of(rc(0, "1k"),
                point(1, stallDeck, 4.12e-8, Map.of("u1_1", "U1.1", "u2_1", "U2.1"), stall), rc(2, "1k"));
        long start = System.nanoTime();
        List<SimulationOutcome> outcomes = engine.runBatch(batch(points));
        double seconds = (System.nanoTime() - start) / 1e9;

        SimulationOutcome.Failure f = NgspiceEngineTests.failed(outcomes.get(1));
        assertEquals(FailureKind.STALLED, f.kind(), f.message());
        // ngspice 39 on this deck sticks at about 1.049e-8 s (NgspiceStallTests, seen by hand with `ngspice -n -b`).
        assertTrue(f.message().startsWith("ngspice stopped advancing at t = 1.04"), f.message());
        assertEquals(1 - Math.exp(-1), NgspiceEngineTests.at(waveforms(outcomes.get(0)), "a", 1e-6), 0.005);
        assertEquals(1 - Math.exp(-1), NgspiceEngineTests.at(waveforms(outcomes.get(2)), "a", 1e-6), 0.005);
        // Two stalls of 1 s (in the batch, then alone) and their polls; the 60 s timeouts never come into play.
        assertTrue(seconds < 15, "took " + seconds + " s");
        assertEquals(0, ProcessTrees.running());
    }

    @Test
    void aHangingPointIsStoppedAtItsOwnTimeoutNotTheBatchTotal() throws IOException {
        NgspiceEngine engine = NgspiceEngineTests.engine();
        Path script = out.resolve("fake-ngspice");
        // A stand-in that hangs whenever the deck it runs (or a deck it sources) holds `R1 in a 7k`.
        Files.writeString(script, "#!/bin/bash\ndeck=\"${@: -1}\"\n"
                + "files=\"$deck $(sed -n 's/^source //p' \"$deck\" 2>/dev/null)\"\n"
                + "if cat $files 2>/dev/null | grep -q '^R1 in a 7k'; then sleep 60; fi\n"
                + "exec " + engine.binary() + " \"$@\"\n");
        Files.setPosixFilePermissions(script, java.nio.file.attribute.PosixFilePermissions.fromString("rwxr-xr-x"));
        NgspiceEngine fake = NgspiceEngine.at(script);
        List<NgspiceBatch.Point> points = new ArrayList<>();
        for (int k = 0; k < 6; k++) {
            NgspiceBatch.Point p = rc(k, k == 2 ? "7k" : "1k");
            points.add(new NgspiceBatch.Point(new SimulationJob(p.job().deckText(), out, p.job().deckFileName(),
                    p.job().rawFileName(), 3e-6, Duration.ofSeconds(1), Map.of("a", "A")), p.circuitDeckFileName(), p.circuitDeckText()));
        }
        long start = System.nanoTime();
        List<SimulationOutcome> outcomes = fake.runBatch(batch(points));
        double seconds = (System.nanoTime() - start) / 1e9;
        // The stand-in hangs the whole master deck, so no point is proven; each runs alone, point 2 times out.
        assertEquals(FailureKind.TIMEOUT, NgspiceEngineTests.failed(outcomes.get(2)).kind());
        for (int k : new int[] {0, 1, 3, 4, 5}) {
            assertEquals(1 - Math.exp(-1), NgspiceEngineTests.at(waveforms(outcomes.get(k)), "a", 1e-6), 0.005);
        }
        // The batch waits 1 s (point 0's own timeout: its raw file never appears), then point 2 alone 1 s;
        // the batch total (6 s) never comes into play.
        assertTrue(seconds < 5.5, "took " + seconds + " s");
    }

    @Test
    void markersAndTroubleAreReadFromTheConsole() {
        assertEquals(Set.of(0, 2), NgspiceBatch.markers("x\nRSW_DONE 0 3.525E-08\nNo. of Data Rows : 5\nRSW_DONE 2 1e-9\n"));
        assertEquals(Set.of(), NgspiceBatch.markers("echo RSW_DONE 0 1\n"));
        assertFalse(NgspiceBatch.troubled("Note: No compatibility mode selected!\nReference value :  1.00000e-09\r"));
        assertTrue(NgspiceBatch.troubled("Warning: singular matrix:  check node d\n"));
        assertTrue(NgspiceBatch.troubled("Error on line 4 or its substitute:\n"));
    }

    @Test
    void pointsOfABatchMustShareOneFolderAndDistinctNames() {
        NgspiceBatch.Point a = rc(0, "1k");
        SimulationJob elsewhere = new SimulationJob("x", out.resolve("other"), "p1.cir", "p1.raw", 1, TIMEOUT, Map.of("a", "A"));
        assertThrows(IllegalArgumentException.class,
                () -> new NgspiceBatch(List.of(a, new NgspiceBatch.Point(elsewhere, "p1_circuit.cir", "x")), "batch_p0.cir", "x"));
        assertThrows(IllegalArgumentException.class, () -> new NgspiceBatch(List.of(a, a), "batch_p0.cir", "x"));
        assertThrows(IllegalArgumentException.class, () -> new NgspiceBatch(List.of(a), "p0_circuit.cir", "x"));
        assertThrows(IllegalArgumentException.class, () -> new NgspiceBatch(List.of(), "batch_p0.cir", "x"));
    }
}
