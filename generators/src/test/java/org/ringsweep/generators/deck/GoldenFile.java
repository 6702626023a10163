package org.ringsweep.generators.deck;

import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Golden-file comparison in the style of FreeMarker's {@code FileTestCase}: newlines normalised,
 * and on a mismatch the actual text is written beside the expected file as {@code <name>-actual}.
 */
final class GoldenFile {
    private GoldenFile() {
    }

    static Path folder() {
        return Path.of("src", "test", "resources", "golden");
    }

    static void assertMatches(String name, String actual) throws IOException {
        Path expected = folder().resolve(name);
        String want = Files.readString(expected, StandardCharsets.UTF_8).replace("\r\n", "\n");
        String got = actual.replace("\r\n", "\n");
        Path actualFile = folder().resolve(name + "-actual");
        if (!want.equals(got)) {
            Files.writeString(actualFile, got, StandardCharsets.UTF_8);
            fail("deck differs from golden file " + expected + "; the actual deck is in " + actualFile);
        }
        Files.deleteIfExists(actualFile);
    }
}
