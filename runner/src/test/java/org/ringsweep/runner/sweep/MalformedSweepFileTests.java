package org.ringsweep.runner.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.ringsweep.runner.testing.MalformedCase;
import org.ringsweep.runner.input.InputException;

/**
 * Every file under {@code malformed-sweep/} starts with three header lines that say what loading
 * it must report, as under {@code malformed/}: {@code # expect: <message fragment>},
 * {@code # key: <key path>} (empty for YAML syntax errors) and {@code # line: <1-based line>}.
 * Each is a valid sweep file (over {@code malformed-sweep/nets/}) with one thing broken.
 */
class MalformedSweepFileTests {
    private final SweepFileLoader loader = new SweepFileLoader();

    static Stream<MalformedCase> malformedFiles() {
        return MalformedCase.under("/malformed-sweep");
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("malformedFiles")
    void reportsFileLineKeyAndWhatWasExpected(MalformedCase x) {
        x.assertReportedBy(assertThrows(InputException.class, () -> loader.load(x.file())));
    }

    @Test
    void coversAtLeastTenCases() {
        assertTrue(malformedFiles().count() >= 10);
    }

    @Test
    void theNetsTheFilesUseLoad() throws URISyntaxException {
        // guards the cases above: each must fail for its own reason, not for a broken net glob
        Path ok = Path.of(getClass().getResource("/malformed-sweep/nets/reset.yaml").toURI());
        assertTrue(Files.isRegularFile(ok));
    }
}
