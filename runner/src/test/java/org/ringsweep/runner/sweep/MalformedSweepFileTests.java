package org.ringsweep.runner.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.ringsweep.runner.input.InputException;

/**
 * Every file under {@code malformed-sweep/} starts with three header lines that say what loading
 * it must report, as under {@code malformed/}: {@code # expect: <message fragment>},
 * {@code # key: <key path>} (empty for YAML syntax errors) and {@code # line: <1-based line>}.
 * Each is a valid sweep file (over {@code malformed-sweep/nets/}) with one thing broken.
 */
class MalformedSweepFileTests {
    private final SweepFileLoader loader = new SweepFileLoader();

    /** The three header lines of a malformed file. */
    record Expectation(Path file, String fragment, String key, int line) {
        static Expectation of(Path file) {
            try {
                List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
                return new Expectation(file, header(lines.get(0), "# expect:"), header(lines.get(1), "# key:"),
                        Integer.parseInt(header(lines.get(2), "# line:")));
            } catch (IOException e) {
                throw new IllegalStateException(e);
            }
        }

        private static String header(String line, String prefix) {
            if (!line.startsWith(prefix)) {
                throw new IllegalStateException("header line `" + line + "` should start with `" + prefix + "`");
            }
            return line.substring(prefix.length()).strip();
        }

        @Override
        public String toString() {
            return file.getFileName().toString();
        }
    }

    static Stream<Expectation> malformedFiles() throws IOException, URISyntaxException {
        Path dir = Path.of(MalformedSweepFileTests.class.getResource("/malformed-sweep").toURI());
        try (Stream<Path> files = Files.list(dir)) {
            return files.filter(f -> f.toString().endsWith(".yaml")).sorted().map(Expectation::of).toList().stream();
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("malformedFiles")
    void reportsFileLineKeyAndWhatWasExpected(Expectation x) {
        InputException e = assertThrows(InputException.class, () -> loader.load(x.file()));
        String m = e.getMessage();
        assertTrue(m.contains(x.file().getFileName().toString()), m);
        assertTrue(m.contains(":" + x.line() + ":"), m);
        assertTrue(m.contains(x.fragment()), m);
        assertEquals(x.line(), e.line(), m);
        assertEquals(x.key(), e.key(), m);
        if (!x.key().isEmpty()) {
            assertTrue(m.contains(": " + x.key() + ": "), m);
        }
        assertTrue(e.column() > 0, m);
    }

    @Test
    void coversAtLeastTenCases() throws IOException, URISyntaxException {
        assertTrue(malformedFiles().count() >= 10);
    }

    @Test
    void theNetsTheFilesUseLoad() throws URISyntaxException {
        // guards the cases above: each must fail for its own reason, not for a broken net glob
        Path ok = Path.of(getClass().getResource("/malformed-sweep/nets/reset.yaml").toURI());
        assertTrue(Files.isRegularFile(ok));
    }
}
