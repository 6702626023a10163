package org.ringsweep.runner.testing;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import org.junit.jupiter.api.Assertions;
import org.junit.jupiter.api.Assumptions;

/**
 * Finds ngspice for tests that use it as the reference simulator. Where it is missing the test
 * is skipped, except when {@code -Dringsweep.requireNgspice=true} (CI sets it): then it fails, so
 * a CI run cannot pass by skipping the reference checks.
 */
public final class Ngspice {
    private Ngspice() {
    }

    /** The ngspice binary: {@code RINGSWEEP_NGSPICE}, else the first on PATH. */
    public static Optional<Path> find() {
        String env = System.getenv("RINGSWEEP_NGSPICE");
        if (env != null && !env.isBlank() && Files.isExecutable(Path.of(env))) {
            return Optional.of(Path.of(env));
        }
        String path = System.getenv().getOrDefault("PATH", "");
        for (String dir : path.split(java.io.File.pathSeparator)) {
            Path p = Path.of(dir.isEmpty() ? "." : dir, "ngspice");
            if (Files.isExecutable(p)) {
                return Optional.of(p);
            }
        }
        return Optional.empty();
    }

    /** The binary, or skip (fail under {@code ringsweep.requireNgspice}). */
    public static Path require() {
        Optional<Path> p = find();
        if (p.isEmpty()) {
            if (Boolean.getBoolean("ringsweep.requireNgspice")) {
                Assertions.fail("ngspice is required (ringsweep.requireNgspice=true) but is not on PATH nor in RINGSWEEP_NGSPICE");
            }
            Assumptions.abort("ngspice not found; install it (apt-get install ngspice) to run the reference checks");
        }
        return p.get();
    }
}
