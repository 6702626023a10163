package org.ringsweep.runner.report;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.raw.RawFileReader;
import org.ringsweep.runner.raw.RawPlot;
import org.ringsweep.runner.results.ResultRecord;

/**
 * The waveforms of a record: the raw file beside its deck ({@link PointRunner#rawFileOf}). The
 * deck path in a record is relative to the working directory of the run; when the report is
 * rebuilt from elsewhere, the same file is looked for under the output folder
 * ({@code OUT/<net folder>/<file>}).
 */
final class WaveformFile {
    /** The transient plot of a record's raw file, or why there is none. */
    record Loaded(RawPlot plot, Path file, String problem) {
        boolean found() {
            return plot != null;
        }

        /** A node's voltage column ({@code v(<node>)}), if the file has it. */
        Optional<double[]> voltage(String node) {
            return plot.column("v(" + node + ")");
        }

        double[] time() {
            return plot.column("time").orElseThrow();
        }
    }

    private WaveformFile() {
    }

    static Loaded load(ResultRecord r, Path outDir) {
        if (r.deck().isEmpty()) {
            return new Loaded(null, null, "the record names no deck");
        }
        Path deck = Path.of(r.deck());
        Path raw = PointRunner.rawFileOf(deck);
        if (!Files.isRegularFile(raw) && deck.getParent() != null) {
            raw = PointRunner.rawFileOf(outDir.resolve(deck.getParent().getFileName()).resolve(deck.getFileName()));
        }
        if (!Files.isRegularFile(raw)) {
            return new Loaded(null, raw, "raw file `" + PointRunner.rawFileOf(deck) + "` is not there");
        }
        try {
            List<RawPlot> plots = RawFileReader.read(raw);
            for (RawPlot p : plots) {
                if (p.column("time").isPresent()) {
                    return new Loaded(p, raw, null);
                }
            }
            return new Loaded(null, raw, "raw file `" + raw + "` has no transient plot (no `time` vector)");
        } catch (RuntimeException e) {
            return new Loaded(null, raw, e.getMessage());
        }
    }
}
