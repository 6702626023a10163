package org.ringsweep.runner.screen;

/**
 * How a net behaves for its edge, by the ratio of its longest one-way path delay TD to the 10–90 %
 * rise time t_r.
 *
 * <p>Rule: Johnson &amp; Graham, <i>High-Speed Digital Design</i> (1993) ch. 1: a trace is lumped
 * while its length is under 1/6 of the edge's spatial length (TD &lt; t_r/6) and must be treated
 * as a transmission line above that. Between t_r/6 and t_r/2 the round trip 2·TD is still shorter
 * than the edge, so reflections merge into the edge (the MECL System Design Handbook criterion
 * 2·TD &gt; t_r for separate reflections): borderline. Above t_r/2 the reflections stand apart
 * from the edge: a transmission line (see lines-and-terminations.md §3).
 */
public enum LineClass {
    /** TD ≤ t_r/6: lumped. */
    LUMPED("lumped"),
    /** t_r/6 &lt; TD ≤ t_r/2: a line by Johnson &amp; Graham, reflections still inside the edge. */
    BORDERLINE("borderline"),
    /** TD &gt; t_r/2: a transmission line, reflections separate from the edge. */
    LINE("transmission line");

    /** The rule in words, for reports. */
    public static final String RULE = "Johnson & Graham (1993) ch. 1: lumped while TD <= tr/6;"
            + " borderline up to TD = tr/2 (round trip within the edge, MECL handbook); transmission line above";

    private final String word;

    LineClass(String word) {
        this.word = word;
    }

    /** The word used in tables and records. */
    public String word() {
        return word;
    }

    /** The class of a delay-to-rise ratio TD/t_r. */
    public static LineClass of(double ratio) {
        if (ratio <= 1.0 / 6) {
            return LUMPED;
        }
        return ratio <= 0.5 ? BORDERLINE : LINE;
    }
}
