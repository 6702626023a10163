package org.ringsweep.runner.input;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.ringsweep.runner.testing.MalformedCase;
import org.ringsweep.generators.models.BuiltinModels;

/**
 * Every file under {@code malformed/} starts with three header lines that say what loading it
 * must report: {@code # expect: <message fragment>}, {@code # key: <key path>} (empty for YAML
 * syntax errors, which have no key) and {@code # line: <1-based line>}. Each file is a valid net
 * with one thing broken. The CLI tests use the same files for exit code 2.
 */
class MalformedNetFileTests {
    private final NetFileLoader loader = new NetFileLoader(new BuiltinModels());

    static Stream<MalformedCase> malformedFiles() {
        return MalformedCase.under("/malformed");
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("malformedFiles")
    void reportsFileLineKeyAndWhatWasExpected(MalformedCase x) {
        x.assertReportedBy(assertThrows(InputException.class, () -> loader.load(x.file())));
    }

    @Test
    void coversAtLeastTheAgreedCases() {
        assertTrue(malformedFiles().count() >= 24);
    }
}
