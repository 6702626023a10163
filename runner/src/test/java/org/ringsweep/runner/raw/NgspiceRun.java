package org.ringsweep.runner.raw;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.ringsweep.runner.testing.Ngspice;

/** Runs ngspice on a deck in a test's temporary directory, with a timeout. */
final class NgspiceRun {
    private static final long TIMEOUT_SECONDS = 30;

    private NgspiceRun() {
    }

    /** Writes {@code deck.cir} into {@code dir}, runs {@code ngspice -n -b [extra] deck.cir} there, expects exit 0. */
    static void run(Path dir, String deck, String... extra) throws IOException, InterruptedException {
        Path ngspice = Ngspice.require();
        Files.writeString(dir.resolve("deck.cir"), deck, StandardCharsets.ISO_8859_1);
        List<String> command = new ArrayList<>(List.of(ngspice.toString(), "-n", "-b"));
        command.addAll(List.of(extra));
        command.add("deck.cir");
        Process p = new ProcessBuilder(command).directory(dir.toFile())
                .redirectOutput(dir.resolve("stdout.txt").toFile())
                .redirectError(dir.resolve("stderr.txt").toFile())
                .start();
        if (!p.waitFor(TIMEOUT_SECONDS, TimeUnit.SECONDS)) {
            p.destroyForcibly().waitFor(5, TimeUnit.SECONDS);
            fail("ngspice did not finish within " + TIMEOUT_SECONDS + " s");
        }
        assertEquals(0, p.exitValue(), () -> "ngspice exit status; stderr: " + stderr(dir));
    }

    private static String stderr(Path dir) {
        try {
            return Files.readString(dir.resolve("stderr.txt"), StandardCharsets.ISO_8859_1);
        } catch (IOException e) {
            return "(unreadable: " + e.getMessage() + ")";
        }
    }
}
