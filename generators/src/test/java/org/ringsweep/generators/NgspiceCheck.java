package org.ringsweep.generators;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assertions;
import org.junit.jupiter.api.Assumptions;

/**
 * Runs a deck through ngspice 39 (the reference simulator) and checks it is valid input: exit 0,
 * no {@code Error}/{@code Warning} on stderr, the raw file written. Skips when ngspice is absent,
 * unless {@code -Dringsweep.requireNgspice=true}. (The runner module's
 * {@code Ngspice.require()} is out of reach here: runner depends on generators.)
 */
public final class NgspiceCheck {
    private NgspiceCheck() {
    }

    static Path binary() {
        String env = System.getenv("RINGSWEEP_NGSPICE");
        if (env != null && !env.isBlank() && Files.isExecutable(Path.of(env))) {
            return Path.of(env);
        }
        for (String dir : System.getenv().getOrDefault("PATH", "/usr/bin").split(java.io.File.pathSeparator)) {
            Path p = Path.of(dir.isEmpty() ? "." : dir, "ngspice");
            if (Files.isExecutable(p)) {
                return p;
            }
        }
        if (Boolean.getBoolean("ringsweep.requireNgspice")) {
            Assertions.fail("ngspice is required (ringsweep.requireNgspice=true) but was not found");
        }
        Assumptions.abort("ngspice not found; install it to run the deck validity checks");
        return null;
    }

    /** Runs the deck in {@code dir}; returns stdout. */
    public static String assertRuns(String deck, String rawName, Path dir) throws IOException, InterruptedException {
        Path ngspice = binary();
        Files.writeString(dir.resolve("deck.cir"), deck, StandardCharsets.UTF_8);
        Process p = new ProcessBuilder(ngspice.toString(), "-n", "-b", "deck.cir").directory(dir.toFile())
                .redirectOutput(dir.resolve("stdout.txt").toFile()).redirectError(dir.resolve("stderr.txt").toFile()).start();
        assertTrue(p.waitFor(60, TimeUnit.SECONDS), "ngspice timed out");
        String err = Files.readString(dir.resolve("stderr.txt"));
        assertEquals(0, p.exitValue(), "ngspice exit status; stderr:\n" + err + "\ndeck:\n" + deck);
        assertFalse(err.contains("Error") || err.contains("error"), "stderr has an error:\n" + err);
        assertFalse(err.contains("Warning") || err.contains("warning"), "stderr has a warning:\n" + err);
        assertTrue(Files.size(dir.resolve(rawName)) > 0, "raw file written");
        return Files.readString(dir.resolve("stdout.txt"));
    }
}
