package org.ringsweep.runner.sweep;

import java.math.BigDecimal;
import java.util.List;
import java.util.Optional;
import java.util.regex.Pattern;
import org.ringsweep.api.net.Location;
import org.ringsweep.runner.input.InputException;

/**
 * Checks shared by the loader (when numbers are plain, so no unit is needed) and the planner
 * (after the numbers are parsed with the target's dimension), so both report alike.
 */
final class SweepChecks {
    private static final Pattern PLAIN_NUMBER = Pattern.compile("[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?");

    private SweepChecks() {
    }

    /** The value of a plain number written without a unit ({@code 10}, {@code 1e-9}), if it is one. */
    static Optional<Double> plain(String text) {
        if (!PLAIN_NUMBER.matcher(text).matches()) {
            return Optional.empty();
        }
        double v = new BigDecimal(text).doubleValue();
        // an overflowing number is left to the planner, whose quantity parser reports it
        return Double.isFinite(v) ? Optional.of(v) : Optional.empty();
    }

    /**
     * {@code from < to}; and both positive for a geometric range or a series.
     *
     * @param from the lower bound in SI units
     * @param to   the upper bound in SI units
     */
    static void bounds(Vary.Values values, double from, double to) {
        Vary.Text fromText;
        Vary.Text toText;
        String positiveWhy;
        if (values instanceof Vary.Range r) {
            fromText = r.from();
            toText = r.to();
            positiveWhy = r.log() ? "`log: true` spaces values by a constant ratio, so it needs a positive `from`" : null;
        } else if (values instanceof Vary.SeriesRange s) {
            fromText = s.from();
            toText = s.to();
            positiveWhy = "series values are positive, so `from` must be positive";
        } else {
            return;
        }
        if (positiveWhy != null && !(from > 0)) {
            throw new InputException(fromText.location(), fromText.key(), positiveWhy + "; found `" + fromText.text() + "`");
        }
        if (!(from < to)) {
            throw new InputException(toText.location(), toText.key(), "expected `to` greater than `from` (`" + fromText.text()
                    + "`), found `" + toText.text() + "`");
        }
    }

    /**
     * All lengths equal, for {@code combine: zip}.
     *
     * @param entries the entries whose value counts are known
     * @param lengths their value counts, same order
     */
    static void zipLengths(List<Vary> entries, List<Integer> lengths, Location combineAt) {
        if (lengths.stream().distinct().count() <= 1) {
            return;
        }
        StringBuilder found = new StringBuilder();
        for (int i = 0; i < entries.size(); i++) {
            Vary v = entries.get(i);
            found.append(i == 0 ? "" : ", ").append(v.key()).append(" (`").append(v.target()).append("`) ")
                    .append(lengths.get(i)).append(lengths.get(i) == 1 ? " value" : " values");
        }
        throw new InputException(combineAt, "combine", "`zip` pairs the entries' values one to one, so their lists must have"
                + " equal lengths; found " + found + " (use `grid` for every combination)");
    }
}
