package org.ringsweep.runner.store;

import java.time.Instant;
import java.util.Map;
import org.ringsweep.runner.results.Verdict;

/**
 * One row of the store: a finished point with its summary columns and its whole record. Summary
 * values are NaN where the column is SQL {@code NULL} (see {@code docs/results-store.md}).
 *
 * @param id                   the row id; ascending in the order the rows were written
 * @param net                  the net name
 * @param netHash              SHA-256 of the net file (the record's {@code source_hash})
 * @param source               the net file
 * @param corner               the corner
 * @param pointKey             the point key ({@link PointKey})
 * @param point                swept path → value (SI units), as in the record; NaN for a JSON null
 * @param verdict              pass, fail or error
 * @param worstOvershootV      max {@code overshoot_v} over all receivers' rising edges (V)
 * @param worstUndershootV     max {@code undershoot_v} over all receivers' falling edges (V)
 * @param worstExcursionV      the larger of the two (V): the worst excursion beyond the rails
 * @param worstRingbackMarginV min {@code ringback_margin_v} over all receivers and edges (V)
 * @param longestSettleS       max {@code settle_s} over all receivers and edges (s)
 * @param error                why the point is an error; empty otherwise
 * @param finishedAt           when the point was committed (UTC)
 * @param recordJson           the whole {@code ringsweep/result-1} record, one line of JSON
 */
public record StoredRow(long id, String net, String netHash, String source, String corner, String pointKey,
                        Map<String, Double> point, Verdict verdict, double worstOvershootV, double worstUndershootV,
                        double worstExcursionV, double worstRingbackMarginV, double longestSettleS, String error,
                        Instant finishedAt, String recordJson) {
    /** Copies the point, keeping its order. */
    public StoredRow {
        point = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(point));
    }
}
