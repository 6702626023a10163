package org.ringsweep.runner.sweep;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.AbstractList;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.RandomAccess;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Point;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.runner.check.PointRunner.PointSpec;
import org.ringsweep.runner.input.InputException;
import org.ringsweep.runner.input.PointParser;

/**
 * Resolves a {@link SweepFile} for one net into the points to run.
 *
 * <p>Per entry: an {@code ID/param} whose ID the net lacks is skipped for that net with one
 * warning (a sweep file serves a whole board); a known ID with an unknown param is an input
 * error. Values are parsed with the parameter's dimension through {@link PointParser#value}, so
 * {@code 2ns} works and the net file's sign and range rules apply; sweeps vary numbers only. A
 * corner entry selects the net's corners ({@code typ} is the file's own values); names the net
 * lacks are skipped with one warning naming the corners it has, and when it has none of them the
 * entry is skipped.
 *
 * <p>Points: {@link Combine#GRID} is the cartesian product in the order the entries are listed,
 * the last varying fastest; {@link Combine#ZIP} takes the i-th value of every entry (a pair with
 * a corner the net lacks is dropped). With no entry left for a net it runs once at {@code typ}.
 * Each point's overrides are its corner's values followed by the swept values
 * ({@code cornerPoint.then(values)}, the swept values win).
 *
 * <p><b>Lazily.</b> A plan holds only the resolved axes (one list of values per entry); its
 * {@link Plan#points()} is a read-only list view that builds the point at an index when asked
 * (grid: the index read as a mixed-radix number, the last entry its lowest digit; zip: the i-th
 * kept position). So a plan of a million points costs what its value lists cost, and the count
 * is arithmetic (grid: the product of the list lengths; zip: the kept positions). Immutable and
 * thread-safe.
 */
public final class SweepPlanner {
    /**
     * The most points one net may have unless told otherwise: far beyond any sweep that can
     * finish (a billion points at a millisecond each is eleven days), so only a plan made absurd
     * by a slip (a {@code steps} with three zeros too many) is refused before it starts.
     */
    public static final long DEFAULT_MAX_POINTS = 1_000_000_000L;
    private static final String TYP = "typ";

    private final long maxPoints;

    /** A planner allowing {@value #DEFAULT_MAX_POINTS} points per net. */
    public SweepPlanner() {
        this(DEFAULT_MAX_POINTS);
    }

    /** @param maxPoints the most points one net may have, at most {@value #DEFAULT_MAX_POINTS}; more is an input error */
    public SweepPlanner(long maxPoints) {
        if (maxPoints < 1 || maxPoints > DEFAULT_MAX_POINTS) {
            throw new IllegalArgumentException("maxPoints must be 1.." + DEFAULT_MAX_POINTS + ", found " + maxPoints);
        }
        this.maxPoints = maxPoints;
    }

    /**
     * The points of one net.
     *
     * @param net      the net
     * @param points   the points in run order, built on demand (see the class comment): a
     *                 read-only random-access view; {@link PointSpec#index()} is 1-based,
     *                 {@link PointSpec#corner()} the corner name ({@code typ} without a corner
     *                 entry), {@link PointSpec#swept()} the swept {@code ID/param} → SI value in
     *                 entry order (corners are not in it)
     * @param warnings what was skipped for this net, each naming the sweep file position and the net
     */
    public record Plan(Net net, List<PointSpec> points, List<String> warnings) {
        /** Keeps a lazy view as it is (it is immutable); copies any other list. */
        public Plan {
            Objects.requireNonNull(net, "net");
            points = points instanceof LazyPoints ? points : List.copyOf(points);
            warnings = List.copyOf(warnings);
        }
    }

    /** One value of an axis: a corner (name and point) or a swept number. */
    private record Item(String corner, Point cornerPoint, Value.Number value, boolean known) {
    }

    /** One entry resolved for the net. */
    private record Axis(Vary vary, ValuePath path, List<Item> items) {
        boolean isCorner() {
            return path == null;
        }
    }

    private record Resolved(List<Axis> axes, List<String> warnings) {
    }

    /**
     * Plans {@code sweep} for {@code net}. Nothing per point is built here.
     *
     * @throws InputException for values that do not fit the net's parameters, unequal zip
     *                        lengths, or more than the allowed number of points (naming the
     *                        sweep file, its {@code vary} key and the net)
     */
    public Plan plan(SweepFile sweep, Net net, PointParser parser) {
        Resolved r = resolve(sweep, net, parser);
        long n = count(sweep.combine(), r.axes());
        if (n > maxPoints) {
            Vary first = sweep.vary().get(0);
            throw new InputException(first.location(), "vary", "the sweep makes "
                    + (n == Long.MAX_VALUE ? "more than " + Long.MAX_VALUE : String.valueOf(n)) + " points for net " + net.name()
                    + ", more than the limit of " + maxPoints + "; expected fewer values or steps");
        }
        checkSteps(r.axes());
        List<PointSpec> points = sweep.combine() == Combine.GRID ? new GridPoints(r.axes(), (int) n) : new ZipPoints(r.axes());
        List<String> warnings = new ArrayList<>(r.warnings());
        if (r.axes().isEmpty()) {
            warnings.add(sweep.file() + ": nothing in the sweep applies to net " + net.name() + "; it runs once at typ");
        }
        return new Plan(net, points, warnings);
    }

    /**
     * The number of points {@link #plan} gives for {@code net}, by arithmetic (for a plan print
     * or a size check before running); {@link Long#MAX_VALUE} when the product overflows.
     *
     * @throws InputException as {@link #plan} does for values that do not fit the net
     */
    public static long count(SweepFile sweep, Net net, PointParser parser) {
        List<Axis> axes = resolve(sweep, net, parser).axes();
        long n = count(sweep.combine(), axes);
        if (n <= DEFAULT_MAX_POINTS) {
            checkSteps(axes);
        }
        return n;
    }

    /**
     * Parses every step of every range entry once (and forgets it), so a step the parameter
     * refuses is an input error before the run, not a failure in the middle of it. Done after
     * the size check, so an absurd {@code steps} is refused at once.
     */
    private static void checkSteps(List<Axis> axes) {
        for (Axis a : axes) {
            if (a.items() instanceof RangeItems steps) {
                steps.forEach(checked -> { });
            }
        }
    }

    private static long count(Combine combine, List<Axis> axes) {
        if (combine == Combine.ZIP) {
            return keptZipPositions(axes).length;
        }
        long n = 1;
        for (Axis a : axes) {
            try {
                n = Math.multiplyExact(n, a.items().size());
            } catch (ArithmeticException e) {
                return Long.MAX_VALUE;
            }
        }
        return n;
    }

    private static Resolved resolve(SweepFile sweep, Net net, PointParser parser) {
        List<Axis> axes = new ArrayList<>();
        List<String> warnings = new ArrayList<>();
        for (Vary v : sweep.vary()) {
            Axis a = v.isCorner() ? corners(v, net, sweep.combine(), warnings) : values(v, net, parser, warnings);
            if (a != null) {
                axes.add(a);
            }
        }
        if (sweep.combine() == Combine.ZIP) {
            SweepChecks.zipLengths(axes.stream().map(Axis::vary).toList(), axes.stream().map(a -> a.items().size()).toList(),
                    sweep.combineLocation());
        }
        return new Resolved(List.copyOf(axes), List.copyOf(warnings));
    }

    private static Axis corners(Vary v, Net net, Combine combine, List<String> warnings) {
        List<Item> items = new ArrayList<>();
        List<String> unknown = new ArrayList<>();
        for (Vary.Text name : ((Vary.Corners) v.values()).names()) {
            Point p = name.text().equals(TYP) ? Point.NONE : net.corners().get(name.text());
            if (p == null) {
                unknown.add("`" + name.text() + "`");
            }
            items.add(new Item(name.text(), p == null ? Point.NONE : p, null, p != null));
        }
        if (unknown.isEmpty()) {
            return new Axis(v, null, items);
        }
        List<String> has = new ArrayList<>(List.of(TYP));
        has.addAll(net.corners().keySet()); // typ first, then the file's corners in file order
        boolean none = items.stream().noneMatch(Item::known);
        String effect = none ? "the entry is skipped for this net"
                : combine == Combine.ZIP ? "the points with " + (unknown.size() == 1 ? "it" : "them") + " are skipped for this net"
                : (unknown.size() == 1 ? "it is" : "they are") + " skipped for this net";
        warnings.add(where(v) + ": net " + net.name() + " has no corner " + String.join(", ", unknown) + " (it has "
                + String.join(", ", has) + "); " + effect);
        if (none) {
            return null;
        }
        return new Axis(v, null, combine == Combine.GRID ? items.stream().filter(Item::known).toList() : items);
    }

    private static Axis values(Vary v, Net net, PointParser parser, List<String> warnings) {
        ValuePath path = ValuePath.parse(v.target());
        if (net.element(path.id()).isEmpty()) {
            warnings.add(where(v) + ": net " + net.name() + " has no element `" + path.id() + "`, so `" + v.target()
                    + "` is not varied for it");
            return null;
        }
        List<String> params = parser.parametersOf(net, path.id());
        if (!params.contains(path.param())) {
            throw new InputException(v.location(), v.key("target"), "unknown parameter `" + path.param() + "` for `" + path.id()
                    + "` on net " + net.name() + "; expected one of: " + String.join(", ", params));
        }
        List<Value.Number> numbers = new ArrayList<>();
        if (v.values() instanceof Vary.Listed l) {
            for (Vary.Text t : l.texts()) {
                numbers.add(number(parser, net, path, t));
            }
        } else if (v.values() instanceof Vary.Range r) {
            double from = number(parser, net, path, r.from()).si();
            double to = number(parser, net, path, r.to()).si();
            SweepChecks.bounds(r, from, to);
            List<Item> steps = new RangeItems(r.steps(), k -> new Item(null, null,
                    number(parser, net, path, new Vary.Text(Double.toString(r.log() ? geometricAt(from, to, r.steps(), k)
                            : linearAt(from, to, r.steps(), k)), v.location(), v.key())), true));
            return new Axis(v, path, steps);
        } else {
            Vary.SeriesRange s = (Vary.SeriesRange) v.values();
            double from = number(parser, net, path, s.from()).si();
            double to = number(parser, net, path, s.to()).si();
            SweepChecks.bounds(s, from, to);
            List<BigDecimal> exact = ESeries.betweenExact(s.series(), from, to);
            if (exact.isEmpty()) {
                throw new InputException(s.from().location(), v.key(), "no " + s.series() + " value lies between `" + s.from().text()
                        + "` and `" + s.to().text() + "`; expected a range that holds at least one preferred value");
            }
            for (BigDecimal d : exact) {
                numbers.add(number(parser, net, path, new Vary.Text(d.toString(), v.location(), v.key())));
            }
        }
        return new Axis(v, path, numbers.stream().map(n -> new Item(null, null, n, true)).toList());
    }

    /**
     * The steps of a {@code from}/{@code to}/{@code steps} entry, each built (and parsed, as a
     * listed value would be) when asked, so a range of a million steps is not held in memory.
     */
    private static final class RangeItems extends AbstractList<Item> implements RandomAccess {
        private final int steps;
        private final java.util.function.IntFunction<Item> step;

        RangeItems(int steps, java.util.function.IntFunction<Item> step) {
            this.steps = steps;
            this.step = step;
        }

        @Override
        public int size() {
            return steps;
        }

        @Override
        public Item get(int k) {
            Objects.checkIndex(k, steps);
            return step.apply(k);
        }
    }

    private static Value.Number number(PointParser parser, Net net, ValuePath path, Vary.Text t) {
        Value value = parser.value(net, path, t.text(), t.location(), t.key());
        if (value instanceof Value.Number n) {
            return n;
        }
        throw new InputException(t.location(), t.key(), "expected a number to sweep, found `" + t.text() + "` (a sweep varies"
                + " numbers only; set words such as rail names in the net file or with a corner)");
    }

    /**
     * {@code steps} evenly spaced values from {@code from} to {@code to}: computed in decimal from
     * the shortest decimal form of each bound, so 10 to 100 in 10 steps is exactly 10, 20 … 100.
     */
    static List<Double> linear(double from, double to, int steps) {
        List<Double> out = new ArrayList<>(steps);
        for (int k = 0; k < steps; k++) {
            out.add(linearAt(from, to, steps, k));
        }
        return out;
    }

    /** The {@code k}-th (0-based) of {@link #linear}. */
    static double linearAt(double from, double to, int steps, int k) {
        if (k == steps - 1) {
            return to;
        }
        BigDecimal a = BigDecimal.valueOf(from);
        BigDecimal span = BigDecimal.valueOf(to).subtract(a);
        return a.add(span.multiply(BigDecimal.valueOf(k)).divide(BigDecimal.valueOf(steps - 1L), MathContext.DECIMAL128)).doubleValue();
    }

    /** {@code steps} values from {@code from} to {@code to} in the constant ratio (to/from)^(1/(steps−1)); both ends exact. */
    static List<Double> geometric(double from, double to, int steps) {
        List<Double> out = new ArrayList<>(steps);
        for (int k = 0; k < steps; k++) {
            out.add(geometricAt(from, to, steps, k));
        }
        return out;
    }

    /** The {@code k}-th (0-based) of {@link #geometric}. */
    static double geometricAt(double from, double to, int steps, int k) {
        return k == 0 ? from : k == steps - 1 ? to : from * Math.exp(Math.log(to / from) * k / (steps - 1));
    }

    /** The plan's points as a list view; {@link #get} builds the point. */
    private abstract static class LazyPoints extends AbstractList<PointSpec> implements RandomAccess {
        final List<Axis> axes;

        LazyPoints(List<Axis> axes) {
            this.axes = axes;
        }
    }

    /** Grid: index {@code i} read as a mixed-radix number whose lowest digit is the last axis. */
    private static final class GridPoints extends LazyPoints {
        private final int size;

        GridPoints(List<Axis> axes, int size) {
            super(axes);
            this.size = size;
        }

        @Override
        public int size() {
            return size;
        }

        @Override
        public PointSpec get(int index) {
            Objects.checkIndex(index, size);
            Item[] tuple = new Item[axes.size()];
            int rest = index;
            for (int a = axes.size() - 1; a >= 0; a--) {
                List<Item> items = axes.get(a).items();
                tuple[a] = items.get(rest % items.size());
                rest /= items.size();
            }
            return spec(axes, tuple, index + 1);
        }
    }

    /** Zip: the i-th position at which every axis has a known value. */
    private static final class ZipPoints extends LazyPoints {
        private final int[] kept;

        ZipPoints(List<Axis> axes) {
            super(axes);
            this.kept = keptZipPositions(axes);
        }

        @Override
        public int size() {
            return kept.length;
        }

        @Override
        public PointSpec get(int index) {
            Objects.checkIndex(index, kept.length);
            Item[] tuple = new Item[axes.size()];
            for (int a = 0; a < axes.size(); a++) {
                tuple[a] = axes.get(a).items().get(kept[index]);
            }
            return spec(axes, tuple, index + 1);
        }
    }

    /** The zip positions whose values are all known (a corner the net lacks drops its pair); {@code [0]} without axes. */
    private static int[] keptZipPositions(List<Axis> axes) {
        int n = axes.isEmpty() ? 1 : axes.get(0).items().size();
        int[] kept = new int[n];
        int k = 0;
        for (int i = 0; i < n; i++) {
            final int at = i;
            if (axes.stream().allMatch(a -> a.items().get(at).known())) {
                kept[k++] = i;
            }
        }
        return java.util.Arrays.copyOf(kept, k);
    }

    private static PointSpec spec(List<Axis> axes, Item[] tuple, int index) {
        String corner = TYP;
        Point cornerPoint = Point.NONE;
        Map<ValuePath, Value> values = new LinkedHashMap<>();
        Map<String, Double> swept = new LinkedHashMap<>();
        for (int i = 0; i < axes.size(); i++) {
            Item item = tuple[i];
            if (axes.get(i).isCorner()) {
                corner = item.corner();
                cornerPoint = item.cornerPoint();
            } else {
                values.put(axes.get(i).path(), item.value());
                swept.put(axes.get(i).path().toString(), item.value().si());
            }
        }
        return new PointSpec(corner, cornerPoint.then(Point.of(values)), Collections.unmodifiableMap(swept), index);
    }

    private static String where(Vary v) {
        Location l = v.location();
        return l + ": " + v.key();
    }
}
