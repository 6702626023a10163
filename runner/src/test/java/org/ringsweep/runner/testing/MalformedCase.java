package org.ringsweep.runner.testing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.ringsweep.runner.input.InputException;

/**
 * One malformed input file of the test resources and what loading it must report, read from its
 * three header lines: {@code # expect: <message fragment>}, {@code # key: <key path>} (empty for
 * YAML syntax errors, which have no key) and {@code # line: <1-based line>}.
 *
 * @param file     the file
 * @param fragment a fragment the message must contain
 * @param key      the key the error names, or empty
 * @param line     the line the error names
 */
public record MalformedCase(Path file, String fragment, String key, int line) {
    /** Reads the headers of one file. */
    public static MalformedCase of(Path file) {
        try {
            List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
            return new MalformedCase(file, header(lines.get(0), "# expect:"), header(lines.get(1), "# key:"),
                    Integer.parseInt(header(lines.get(2), "# line:")));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** Every {@code *.yaml} file directly in a test-resource folder (e.g. {@code /malformed}), sorted. */
    public static Stream<MalformedCase> under(String resourceDir) {
        try {
            Path dir = Path.of(MalformedCase.class.getResource(resourceDir).toURI());
            try (Stream<Path> files = Files.list(dir)) {
                return files.filter(f -> f.toString().endsWith(".yaml")).sorted().map(MalformedCase::of).toList().stream();
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    private static String header(String line, String prefix) {
        if (!line.startsWith(prefix)) {
            throw new IllegalStateException("header line `" + line + "` should start with `" + prefix + "`");
        }
        return line.substring(prefix.length()).strip();
    }

    /** Asserts that a loader's error names this file, its line, key and fragment. */
    public void assertReportedBy(InputException e) {
        String m = e.getMessage();
        assertTrue(m.contains(file.getFileName().toString()), m);
        assertTrue(m.contains(":" + line + ":"), m);
        assertTrue(m.contains(fragment), m);
        assertEquals(line, e.line(), m);
        assertEquals(key, e.key(), m);
        if (!key.isEmpty()) {
            assertTrue(m.contains(": " + key + ": "), m);
        }
        assertTrue(e.column() > 0, m);
    }

    @Override
    public String toString() {
        return file.getFileName().toString();
    }
}
