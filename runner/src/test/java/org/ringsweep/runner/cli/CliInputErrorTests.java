package org.ringsweep.runner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.ringsweep.runner.testing.MalformedCase;

/** Bad input through the command line: exit 2, a message naming file, line and key, no stack trace, nothing simulated. */
class CliInputErrorTests {
    @TempDir
    Path out;

    static Stream<MalformedCase> malformedFiles() {
        return MalformedCase.under("/malformed");
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("malformedFiles")
    void malformedNetFileExitsTwoNamingFileLineAndKey(MalformedCase x) {
        CliRun run = CliRun.of("check", "--out", out.toString(), x.file().toString());
        assertEquals(ExitCodes.INPUT, run.exitCode(), run.err());
        assertTrue(run.err().contains(x.file().getFileName().toString()), run.err());
        assertTrue(run.err().contains(":" + x.line() + ":"), () -> "line " + x.line() + " not in: " + run.err());
        if (!x.key().isEmpty()) {
            assertTrue(run.err().contains(x.key()), () -> "key " + x.key() + " not in: " + run.err());
        }
        assertTrue(run.err().contains(x.fragment()), run.err());
        assertFalse(run.err().contains("\tat ") || run.err().contains("Exception"), "no stack trace: " + run.err());
        assertFalse(Files.exists(out.resolve("results.jsonl")), "nothing simulated");
    }

    @Test
    void problemsOfSeveralFilesComeInTheFilesOrderAndNothingIsSimulated() {
        // The files are loaded in parallel; the report must still follow the command line.
        java.util.List<MalformedCase> cases = malformedFiles().limit(6).toList();
        java.util.List<String> args = new java.util.ArrayList<>(java.util.List.of("check", "--out", out.toString()));
        for (int i = 0; i < cases.size(); i++) {
            args.add(cases.get(i).file().toString());
            if (i == 2) {
                args.add(CliRun.resource("physics/matched-series.yaml").toString()); // a good file among them
            }
        }
        CliRun run = CliRun.of(args.toArray(String[]::new));
        assertEquals(ExitCodes.INPUT, run.exitCode(), run.err());
        int last = -1;
        for (MalformedCase x : cases) {
            int at = run.err().indexOf(x.file().getFileName().toString());
            assertTrue(at > last, () -> x.file().getFileName() + " out of order in: " + run.err());
            last = at;
        }
        assertFalse(Files.exists(out.resolve("results.jsonl")), "nothing simulated");
    }

    @Test
    void missingNetFileIsAnInputError() {
        CliRun run = CliRun.of("check", "--out", out.toString(), out.resolve("nope.yaml").toString());
        assertEquals(ExitCodes.INPUT, run.exitCode());
        assertTrue(run.err().contains("nope.yaml"), run.err());
    }

    @Test
    void unknownOptionIsAUsageError() {
        CliRun run = CliRun.of("check", "--no-such-option", "x.yaml");
        assertEquals(ExitCodes.INPUT, run.exitCode());
        assertTrue(run.err().contains("--no-such-option"), run.err());
    }

    @Test
    void unknownSetPathListsTheValidIds() {
        CliRun run = CliRun.of("check", "--out", out.toString(), "--set", "R99/value=10",
                CliRun.resource("physics/matched-series.yaml").toString());
        assertEquals(ExitCodes.INPUT, run.exitCode(), run.err());
        assertTrue(run.err().contains("R99") && run.err().contains("R1"), run.err());
    }

    @Test
    void unknownEngineIsAUsageError() {
        CliRun run = CliRun.of("check", "--engine", "quantum", "--out", out.toString(),
                CliRun.resource("physics/matched-series.yaml").toString());
        assertEquals(ExitCodes.INPUT, run.exitCode(), run.err());
    }
}
