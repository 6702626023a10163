package org.ringsweep.runner.results;

import java.util.Locale;

/** The outcome of a point, a receiver or an edge. Ordered from best to worst. */
public enum Verdict {
    /** Every limit holds. */
    PASS,
    /** Some limit is violated. */
    FAIL,
    /** No usable waveform: the simulation (or the model) failed. */
    ERROR;

    /** The word used in records ({@code pass}). */
    public String word() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** The worse of two verdicts. */
    public Verdict worst(Verdict other) {
        return other.ordinal() > ordinal() ? other : this;
    }
}
