package org.ringsweep.runner.bench;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Runs the results store benchmark; tagged {@code bench}, so excluded from the normal build. */
@Tag("bench")
class StoreBenchmarkTests {
    @Test
    void reportsCostPerPoint(@TempDir Path dir) {
        String report = StoreBenchmark.run(dir);
        System.out.println(report);
        assertTrue(report.contains("us/point"), report);
    }
}
