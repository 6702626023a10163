package org.ringsweep.runner.engine;

import java.nio.file.Path;
import java.time.Duration;
import java.util.Map;

/**
 * A program for {@link ShutdownTests}: runs a deck that takes far longer than the test, so the
 * test can stop this JVM mid-run and check that the shutdown hook took ngspice with it.
 */
final class ShutdownHookProbe {
    private ShutdownHookProbe() {
    }

    /** @param args the ngspice binary, the work folder */
    public static void main(String[] args) {
        String deck = NgspiceEngineTests.deck("v(a)", "V1 in 0 PULSE(0 1 0 1n 1n 5n 10n)", "R1 in a 1k", "C1 a 0 1p",
                ".tran 1f 1 0 1f");
        NgspiceEngine.at(Path.of(args[0]))
                .run(new SimulationJob(deck, Path.of(args[1]), "long.cir", "out.raw", 1, Duration.ofMinutes(5), Map.of()));
    }
}
