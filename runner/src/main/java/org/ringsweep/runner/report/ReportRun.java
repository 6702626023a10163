package org.ringsweep.runner.report;

import java.util.List;
import java.util.Map;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.tune.TuneResult;

/**
 * What one report covers.
 *
 * @param kind    the command the records came from
 * @param records the records, in run order
 * @param best    net name → point key ({@link org.ringsweep.runner.store.PointKey}) of its best point
 *                (sweeps) or recommended value (tune); empty for checks
 * @param notes   remarks for the reader (e.g. rows left out), shown under the title
 * @param tune    the tune result, or null when the run was no tune
 */
record ReportRun(Kind kind, List<ResultRecord> records, Map<String, String> best, List<String> notes, TuneResult tune) {
    /** The command behind a report. */
    enum Kind {
        /** {@code check}: every point's waveforms are shown. */
        CHECK("check"),
        /** {@code sweep} (or a rebuilt report of swept points): metrics against swept values. */
        SWEEP("sweep"),
        /** {@code tune}: as a sweep over the tuned value, plus the recommendation and its re-checks. */
        TUNE("tune");

        final String word;

        Kind(String word) {
            this.word = word;
        }
    }

    ReportRun {
        records = List.copyOf(records);
        best = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(best));
        notes = List.copyOf(notes);
    }
}
