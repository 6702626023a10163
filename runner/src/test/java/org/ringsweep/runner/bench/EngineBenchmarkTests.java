package org.ringsweep.runner.bench;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.testing.Ngspice;

/** Runs the engine benchmark; tagged {@code bench}, so excluded from the normal build. */
@Tag("bench")
class EngineBenchmarkTests {
    @Test
    void reportsPerPointTimesOfBothEngines(@TempDir Path dir) {
        String report = EngineBenchmark.run(dir, Ngspice.require());
        System.out.println(report);
        assertTrue(report.contains("faster"), report);
    }
}
