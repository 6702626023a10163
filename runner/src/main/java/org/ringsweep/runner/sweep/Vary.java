package org.ringsweep.runner.sweep;

import java.util.List;
import java.util.Objects;
import org.ringsweep.api.net.Location;

/**
 * One {@code vary} entry of a sweep file as written: its target and its values, not yet resolved
 * against a net (units and ranges depend on the target's parameter).
 *
 * @param index    its zero-based position under {@code vary}
 * @param target   {@code ID/param} such as {@code R5/value}, or {@link #CORNER}
 * @param location where the entry's target is written
 * @param values   the values it takes
 */
public record Vary(int index, String target, Location location, Values values) {
    /** The target word that takes corner names. */
    public static final String CORNER = "corner";

    /** Rejects nulls. */
    public Vary {
        Objects.requireNonNull(target, "target");
        Objects.requireNonNull(location, "location");
        Objects.requireNonNull(values, "values");
    }

    /** Whether this entry varies the corner. */
    public boolean isCorner() {
        return target.equals(CORNER);
    }

    /** The key path of the entry, {@code vary[2]}. */
    public String key() {
        return "vary[" + index + "]";
    }

    /** The key path of one of its keys, {@code vary[2].steps}. */
    public String key(String sub) {
        return key() + "." + sub;
    }

    /**
     * A text as written, with where it is and its key path, so that a value found wrong for a net
     * is reported at its place in the sweep file.
     *
     * @param text     the text, stripped (e.g. {@code 0.5ns})
     * @param location where it is written
     * @param key      its key path, e.g. {@code vary[0].values[2]}
     */
    public record Text(String text, Location location, String key) {
        /** Rejects nulls. */
        public Text {
            Objects.requireNonNull(text, "text");
            Objects.requireNonNull(location, "location");
            Objects.requireNonNull(key, "key");
        }
    }

    /** The values of an entry, in one of four forms. */
    public sealed interface Values permits Listed, Range, SeriesRange, Corners {
    }

    /**
     * {@code values: [...]} for an {@code ID/param} target: each parsed with the parameter's
     * dimension, so {@code 2ns} and {@code 4k7} work.
     *
     * @param texts the values in order, at least one
     */
    public record Listed(List<Text> texts) implements Values {
        /** Copies the list. */
        public Listed {
            texts = List.copyOf(texts);
        }
    }

    /**
     * {@code from}/{@code to}/{@code steps}: {@code steps} values from {@code from} to
     * {@code to}, both included, evenly spaced (linear) or in a constant ratio ({@code log: true}).
     *
     * @param from  the first value as written (units of the target's parameter allowed)
     * @param to    the last value as written
     * @param steps the count of values, at least 2
     * @param log   geometric spacing (then from and to are positive)
     */
    public record Range(Text from, Text to, int steps, boolean log) implements Values {
        /** Checks the count. */
        public Range {
            Objects.requireNonNull(from, "from");
            Objects.requireNonNull(to, "to");
            if (steps < 2) {
                throw new IllegalArgumentException("a range has at least 2 steps");
            }
        }
    }

    /**
     * {@code series: E24} with {@code from}/{@code to}: the series' preferred values in
     * [from, to] over all decades ({@link ESeries#between}).
     *
     * @param series the E series
     * @param from   the lower bound as written
     * @param to     the upper bound as written
     */
    public record SeriesRange(ESeries.Series series, Text from, Text to) implements Values {
        /** Rejects nulls. */
        public SeriesRange {
            Objects.requireNonNull(series, "series");
            Objects.requireNonNull(from, "from");
            Objects.requireNonNull(to, "to");
        }
    }

    /**
     * {@code target: corner, values: [...]}: corner names of the net, {@code typ} for its own values.
     *
     * @param names the names in order, at least one
     */
    public record Corners(List<Text> names) implements Values {
        /** Copies the list. */
        public Corners {
            names = List.copyOf(names);
        }
    }
}
