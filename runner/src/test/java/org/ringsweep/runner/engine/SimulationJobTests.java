package org.ringsweep.runner.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.Duration;
import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.junit.jupiter.api.Test;

class SimulationJobTests {
    private static final Path DIR = Path.of("out", "net");

    static SimulationJob job(String deck, String raw, double stop, Duration timeout) {
        return new SimulationJob("* t\n.end\n", DIR, deck, raw, stop, timeout, Map.of("a", "A"));
    }

    @Test
    void logsAreNamedAfterTheDeckStem() {
        SimulationJob j = job("typ-0001.cir", "typ-0001.raw", 1e-8, Duration.ofSeconds(1));
        assertEquals(DIR.resolve("typ-0001.cir"), j.deckFile());
        assertEquals(DIR.resolve("typ-0001.raw"), j.rawFile());
        assertEquals(DIR.resolve("typ-0001.stdout.txt"), j.stdoutFile());
        assertEquals(DIR.resolve("typ-0001.stderr.txt"), j.stderrFile());
    }

    @ParameterizedTest
    @ValueSource(strings = {"../x.cir", "/tmp/x.cir", "a b.cir", ".spiceinit", "-b.cir", "x;shell.cir", "", "x`y`.cir"})
    void fileNamesThatAreNotPlainAreRejected(String name) {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> job(name, "out.raw", 1e-8, Duration.ofSeconds(1)));
        assertTrue(e.getMessage().contains("`" + name + "`"), e.getMessage());
    }

    @Test
    void deckAndRawMustDiffer() {
        assertThrows(IllegalArgumentException.class, () -> job("x.cir", "X.cir", 1e-8, Duration.ofSeconds(1)));
    }

    @Test
    void stopTimeAndTimeoutMustBePositive() {
        assertThrows(IllegalArgumentException.class, () -> job("x.cir", "x.raw", 0, Duration.ofSeconds(1)));
        assertThrows(IllegalArgumentException.class, () -> job("x.cir", "x.raw", Double.NaN, Duration.ofSeconds(1)));
        assertThrows(IllegalArgumentException.class, () -> job("x.cir", "x.raw", 1e-8, Duration.ZERO));
    }

    @Test
    void jobWithoutAStallTimeoutGetsTheDefaultOfFiveSeconds() {
        SimulationJob j = job("x.cir", "x.raw", 1e-8, Duration.ofSeconds(120));
        assertEquals(Duration.ofSeconds(5), j.stallTimeout());
        assertEquals(SimulationJob.DEFAULT_STALL_TIMEOUT, j.stallTimeout());
    }

    @Test
    void withStallTimeoutChangesOnlyTheStallTimeout() {
        SimulationJob j = job("x.cir", "x.raw", 1e-8, Duration.ofSeconds(120));
        SimulationJob k = j.withStallTimeout(Duration.ofSeconds(2));
        assertEquals(Duration.ofSeconds(2), k.stallTimeout());
        assertEquals(new SimulationJob(j.deckText(), j.workDir(), j.deckFileName(), j.rawFileName(), j.stopTime(),
                j.timeout(), Duration.ofSeconds(2), j.probes()), k);
        assertEquals(Duration.ofSeconds(5), j.stallTimeout());
    }

    @Test
    void stallTimeoutMustBePositive() {
        SimulationJob j = job("x.cir", "x.raw", 1e-8, Duration.ofSeconds(1));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> j.withStallTimeout(Duration.ZERO));
        assertTrue(e.getMessage().contains("stallTimeout"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> j.withStallTimeout(Duration.ofSeconds(-1)));
        assertThrows(NullPointerException.class, () -> j.withStallTimeout(null));
    }

    @Test
    void probesAreCopied() {
        Map<String, String> probes = new HashMap<>(Map.of("a", "U1.1"));
        SimulationJob j = new SimulationJob("", DIR, "x.cir", "x.raw", 1e-8, Duration.ofSeconds(1), probes);
        probes.put("b", "U2.1");
        assertEquals(Map.of("a", "U1.1"), j.probes());
    }
}
