package org.ringsweep.runner.bench;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Runs the raw reader benchmark; tagged {@code bench}, so excluded from the normal build. */
@Tag("bench")
class RawReaderBenchmarkTests {
    @Test
    void reportsReadThroughput(@TempDir Path dir) {
        String report = RawReaderBenchmark.run(dir);
        System.out.println(report);
        assertTrue(report.contains("GB/s"), report);
    }
}
