package org.ringsweep.runner.sweep;

/** How a sweep's vary entries are combined into points. */
public enum Combine {
    /** Every combination (cartesian product), in the listed order; the last entry varies fastest. */
    GRID,
    /** The i-th values of every entry together; all lists have the same length. */
    ZIP;

    /** The word used in the file: {@code grid} or {@code zip}. */
    public String word() {
        return name().toLowerCase(java.util.Locale.ROOT);
    }
}
