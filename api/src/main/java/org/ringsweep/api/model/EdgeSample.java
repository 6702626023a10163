package org.ringsweep.api.model;

import java.util.Arrays;
import java.util.Objects;
import org.apiguardian.api.API;
import org.ringsweep.api.net.Stimulus;

/**
 * One receiver's simulated waveform in the measurement window of one edge, as an
 * {@link EdgeCheck} sees it. The window runs from the start of the edge at the driver's ideal
 * source to the start of the next edge (or the end of the simulation).
 *
 * <p>Immutable: the arrays are copied in and out.
 *
 * @param receiverPin the receiver pin as the user wrote it ({@code U7.6})
 * @param direction   the edge at the driver: rising or falling
 * @param start       start of the transition at the ideal source (s)
 * @param source50    the instant the ideal source passes 50 % of the swing (s)
 * @param end         end of the window (s), after start
 * @param times       sample times inside the window (s), increasing, at least one
 * @param volts       the receiver voltage at each time (V), as many as times
 * @param vil         input low threshold (V)
 * @param vih         input high threshold (V)
 * @param lowRail     the low rail undershoot is measured from (V)
 * @param highRail    the high rail overshoot is measured from (V)
 * @since 0.1
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record EdgeSample(String receiverPin, Stimulus.Edge direction, double start, double source50, double end,
                         double[] times, double[] volts, double vil, double vih, double lowRail, double highRail) {
    /** Validates and copies the arrays. */
    public EdgeSample {
        Objects.requireNonNull(receiverPin, "receiverPin");
        Objects.requireNonNull(direction, "direction");
        if (times.length == 0 || times.length != volts.length) {
            throw new IllegalArgumentException("an edge sample needs equal, non-empty time and voltage arrays, found "
                    + times.length + " and " + volts.length);
        }
        if (!(end > start)) {
            throw new IllegalArgumentException("window end " + end + " s must be after its start " + start + " s");
        }
        times = times.clone();
        volts = volts.clone();
    }

    /** A copy of the sample times (s). */
    @Override
    public double[] times() {
        return times.clone();
    }

    /** A copy of the voltages (V). */
    @Override
    public double[] volts() {
        return volts.clone();
    }

    /** The swing the driver makes: {@code highRail − lowRail} (V). */
    public double swing() {
        return highRail - lowRail;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof EdgeSample s && s.receiverPin.equals(receiverPin) && s.direction == direction
                && s.start == start && s.source50 == source50 && s.end == end
                && Arrays.equals(s.times, times) && Arrays.equals(s.volts, volts)
                && s.vil == vil && s.vih == vih && s.lowRail == lowRail && s.highRail == highRail;
    }

    @Override
    public int hashCode() {
        return Objects.hash(receiverPin, direction, start, end) * 31 + Arrays.hashCode(volts);
    }

    @Override
    public String toString() {
        return "EdgeSample[" + receiverPin + " " + direction + ", " + start + ".." + end + " s, " + times.length + " samples]";
    }
}
