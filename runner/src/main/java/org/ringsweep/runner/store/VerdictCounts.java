package org.ringsweep.runner.store;

/**
 * How many stored points of a net have each verdict.
 *
 * @param pass  points that pass every limit
 * @param fail  points that violate some limit
 * @param error points without a usable waveform
 */
public record VerdictCounts(long pass, long fail, long error) {
    /** All points. */
    public long total() {
        return pass + fail + error;
    }
}
