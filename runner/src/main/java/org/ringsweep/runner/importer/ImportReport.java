package org.ringsweep.runner.importer;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/**
 * What an import made and left out.
 *
 * @param made     the net files written, in netlist order
 * @param skipped  the nets not written, each with the reason
 * @param unknown  pins on included nets that no rule of the board file classifies, by refdes
 *                 (sorted); their nets are skipped, never guessed
 * @param errors   generated files that did not load (a bad value in the board file), with the
 *                 loader's message; such files are removed
 * @param notes    what the netlist reader and the importer left out or assumed
 */
public record ImportReport(List<Made> made, List<Skipped> skipped, Map<String, List<String>> unknown,
        List<String> errors, List<String> notes) {
    /** Copies the collections. */
    public ImportReport {
        made = List.copyOf(made);
        skipped = List.copyOf(skipped);
        unknown = Map.copyOf(unknown);
        errors = List.copyOf(errors);
        notes = List.copyOf(notes);
    }

    /**
     * A net file written.
     *
     * @param net       the net name in the file
     * @param file      the file
     * @param pieces    the netlist nets joined into it (one unless joined through series parts)
     * @param pins      how many pins it models (driver, receivers, series-part pins)
     * @param estimated whether segment lengths are estimates from coordinates (else from the length table)
     * @param netClass  the class pattern that gave z0, er_eff and limits
     */
    public record Made(String net, Path file, List<String> pieces, int pins, boolean estimated, String netClass) {
        /** Copies the pieces. */
        public Made {
            pieces = List.copyOf(pieces);
        }
    }

    /**
     * A net not written.
     *
     * @param net    the netlist net name (or the pieces joined with {@code +})
     * @param reason why, in words
     */
    public record Skipped(String net, String reason) {
    }
}
