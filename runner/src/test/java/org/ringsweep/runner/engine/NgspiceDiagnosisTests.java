package org.ringsweep.runner.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Standard-error signatures quoted from reference ngspice.md §1 (observed on ngspice-39.3). */
class NgspiceDiagnosisTests {

    static NgspiceDiagnosis.Finding diagnose(String stderr) {
        return NgspiceDiagnosis.diagnose(stderr, "net/typ-0001.cir").orElseThrow(() -> new AssertionError("no finding"));
    }

    @ParameterizedTest(name = "{0} -> {1}")
    @CsvSource(delimiter = '|', value = {
        "Error on line 3 or its substitute:                              | SYNTAX",
        "Error: circuit not parsed.                                      | SYNTAX",
        "Error: Could not find include file /x/f.inc                     | SYNTAX",
        "Undefined parameter [rx]                                        | SYNTAX",
        "foobar: no such command available in ngspice                    | SYNTAX",
        "Warning: r1: resistance to low, set to 1 mOhm                   | SYNTAX",
        "Warning: singular matrix: check node d                          | SINGULAR_MATRIX",
        "Error: Transient op failed, timestep too small                  | CONVERGENCE",
        "run simulation(s) aborted                                       | CONVERGENCE",
        "Fatal error: lmod: Nonzero G (except RG) line not supported yet | CRASH",
        "ERROR: fatal error in ngspice, exit(1)                          | CRASH",
        "Error: measure  X  when(WHEN) : out of interval                 | CRASH",
    })
    void eachSignatureOfTheReferenceTableIsAFailure(String line, FailureKind kind) {
        NgspiceDiagnosis.Finding f = diagnose("\nNote: something harmless\n" + line + "\n");
        assertEquals(kind, f.kind());
        assertTrue(f.message().contains(line.strip().replaceAll("\\s+", " ")), f.message());
    }

    @Test
    void harmlessNotesAndTheProgressTickerAreNoFailure() {
        String stderr = "Note: No compatibility mode selected!\n Reference value :  7.44173e-11\r Reference value :  1.5e-10\r\n"
                + "Note: Transient op finished successfully\n";
        assertEquals(Optional.empty(), NgspiceDiagnosis.diagnose(stderr, "p.cir"));
    }

    @Test
    void midRunConvergenceLossNamesTimeAndNode() {
        String stderr = "doAnalyses: TRAN:  Timestep too small; time = 2.5e-09, timestep = 1.25e-22: trouble with node \"a\"\n"
                + "\nrun simulation(s) aborted\n";
        NgspiceDiagnosis.Finding f = diagnose(stderr);
        assertEquals(FailureKind.CONVERGENCE, f.kind());
        assertTrue(f.message().startsWith("ngspice could not converge (Timestep too small at t = 2.5e-09 s near node a): "
                + "doAnalyses: TRAN: Timestep too small"), f.message());
        assertTrue(f.message().endsWith("| run simulation(s) aborted"), f.message());
    }

    @Test
    void parseErrorNamesTheDeckLineAndQuotesCardAndReason() {
        String stderr = "Error on line 3 or its substitute:\n  r1 in a 1k foo=3\n  unknown parameter (foo) \n"
                + "    Simulation interrupted due to error!\n";
        NgspiceDiagnosis.Finding f = diagnose(stderr);
        assertEquals("ngspice rejected the deck (line 3 of `net/typ-0001.cir`): Error on line 3 or its substitute:"
                + " | r1 in a 1k foo=3 | unknown parameter (foo)", f.message());
    }

    @Test
    void singularMatrixFoundInsideGminSteppingChatterNamesTheNode() {
        String stderr = "Trying gmin =   1.0000E-03 Warning: singular matrix:  check node d\n\nWarning: Further gmin increment\n";
        NgspiceDiagnosis.Finding f = diagnose(stderr);
        assertEquals(FailureKind.SINGULAR_MATRIX, f.kind());
        assertTrue(f.message().contains("(check node d): Warning: singular matrix: check node d"), f.message());
    }

    @Test
    void aParseProblemOutranksTheConvergenceFailureItCauses() {
        String stderr = "Warning: r1: resistance to low, set to 1 mOhm\nWarning: singular matrix: check node a\n"
                + "run simulation(s) aborted\n";
        assertEquals(FailureKind.SYNTAX, diagnose(stderr).kind());
    }

    @Test
    void quoteIsCappedToAFewHundredCharacters() {
        StringBuilder stderr = new StringBuilder();
        for (int i = 0; i < 100; i++) {
            stderr.append("Error: problem number ").append(i).append('\n');
        }
        String quote = NgspiceDiagnosis.quote(stderr.toString());
        assertEquals(NgspiceDiagnosis.MAX_QUOTE, quote.length());
        assertTrue(quote.startsWith("Error: problem number 0 | Error: problem number 1 |"), quote);
    }

    @ParameterizedTest(name = "{0} -> {1}")
    @CsvSource(delimiter = '|', value = {
        "** ngspice-39 : Circuit level simulation program | 39",
        "** ngspice-39.3 : Circuit level simulation program | 39.3",
        "** ngspice-42 : Circuit level simulation program | 42",
        "something else entirely | unknown",
    })
    void versionIsReadFromTheBanner(String banner, String version) {
        // ngspice.md §1: the `-v` banner contains `ngspice-39`.
        assertEquals(version, NgspiceEngine.parseVersion("******\n" + banner + "\n******\n"));
    }
}
