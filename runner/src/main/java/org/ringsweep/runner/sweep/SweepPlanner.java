package org.ringsweep.runner.sweep;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
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
 * ({@code cornerPoint.then(values)}, the swept values win). Immutable and thread-safe.
 */
public final class SweepPlanner {
    /** The most points one net may have unless told otherwise. */
    public static final long DEFAULT_MAX_POINTS = 100_000;
    private static final String TYP = "typ";

    private final long maxPoints;

    /** A planner allowing {@value #DEFAULT_MAX_POINTS} points per net. */
    public SweepPlanner() {
        this(DEFAULT_MAX_POINTS);
    }

    /** @param maxPoints the most points one net may have; more is an input error */
    public SweepPlanner(long maxPoints) {
        if (maxPoints < 1) {
            throw new IllegalArgumentException("maxPoints must be at least 1");
        }
        this.maxPoints = maxPoints;
    }

    /**
     * The points of one net.
     *
     * @param net      the net
     * @param points   the points in run order; {@link PointSpec#index()} is 1-based, {@link PointSpec#corner()}
     *                 the corner name ({@code typ} without a corner entry), {@link PointSpec#swept()} the
     *                 swept {@code ID/param} → SI value in entry order (corners are not in it)
     * @param warnings what was skipped for this net, each naming the sweep file position and the net
     */
    public record Plan(Net net, List<PointSpec> points, List<String> warnings) {
        /** Copies the lists. */
        public Plan {
            Objects.requireNonNull(net, "net");
            points = List.copyOf(points);
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
     * Plans {@code sweep} for {@code net}.
     *
     * @throws InputException for values that do not fit the net's parameters, unequal zip
     *                        lengths, or more than the allowed number of points
     */
    public Plan plan(SweepFile sweep, Net net, PointParser parser) {
        Resolved r = resolve(sweep, net, parser);
        long n = count(sweep.combine(), r.axes());
        if (n > maxPoints) {
            Vary first = sweep.vary().get(0);
            throw new InputException(first.location(), "vary", "the sweep makes " + n + " points for net " + net.name()
                    + ", more than the limit of " + maxPoints + "; expected fewer values or steps");
        }
        List<List<Item>> tuples = sweep.combine() == Combine.GRID ? grid(r.axes()) : zip(r.axes());
        List<PointSpec> points = new ArrayList<>(tuples.size());
        for (List<Item> tuple : tuples) {
            points.add(spec(r.axes(), tuple, points.size() + 1));
        }
        List<String> warnings = new ArrayList<>(r.warnings());
        if (r.axes().isEmpty()) {
            warnings.add(sweep.file() + ": nothing in the sweep applies to net " + net.name() + "; it runs once at typ");
        }
        return new Plan(net, points, warnings);
    }

    /**
     * The number of points {@link #plan} gives for {@code net}, without building them (for a
     * plan print or a size check before running).
     *
     * @throws InputException as {@link #plan} does for values that do not fit the net
     */
    public static long count(SweepFile sweep, Net net, PointParser parser) {
        return count(sweep.combine(), resolve(sweep, net, parser).axes());
    }

    private static long count(Combine combine, List<Axis> axes) {
        if (combine == Combine.ZIP) {
            return axes.isEmpty() ? 1 : zip(axes).size();
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
            for (double si : r.log() ? geometric(from, to, r.steps()) : linear(from, to, r.steps())) {
                numbers.add(number(parser, net, path, new Vary.Text(Double.toString(si), v.location(), v.key())));
            }
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
        BigDecimal a = BigDecimal.valueOf(from);
        BigDecimal span = BigDecimal.valueOf(to).subtract(a);
        BigDecimal intervals = BigDecimal.valueOf(steps - 1L);
        List<Double> out = new ArrayList<>(steps);
        for (int k = 0; k < steps; k++) {
            out.add(k == steps - 1 ? to : a.add(span.multiply(BigDecimal.valueOf(k)).divide(intervals, MathContext.DECIMAL128)).doubleValue());
        }
        return out;
    }

    /** {@code steps} values from {@code from} to {@code to} in the constant ratio (to/from)^(1/(steps−1)); both ends exact. */
    static List<Double> geometric(double from, double to, int steps) {
        double lnRatio = Math.log(to / from);
        List<Double> out = new ArrayList<>(steps);
        for (int k = 0; k < steps; k++) {
            out.add(k == 0 ? from : k == steps - 1 ? to : from * Math.exp(lnRatio * k / (steps - 1)));
        }
        return out;
    }

    private static List<List<Item>> grid(List<Axis> axes) {
        List<List<Item>> out = new ArrayList<>();
        out.add(List.of());
        for (Axis a : axes) {
            List<List<Item>> next = new ArrayList<>(out.size() * a.items().size());
            for (List<Item> prefix : out) {
                for (Item item : a.items()) {
                    List<Item> t = new ArrayList<>(prefix);
                    t.add(item);
                    next.add(t);
                }
            }
            out = next;
        }
        return out;
    }

    private static List<List<Item>> zip(List<Axis> axes) {
        List<List<Item>> out = new ArrayList<>();
        int n = axes.isEmpty() ? 1 : axes.get(0).items().size();
        for (int i = 0; i < n; i++) {
            final int at = i;
            List<Item> t = axes.stream().map(a -> a.items().get(at)).toList();
            if (t.stream().allMatch(Item::known)) {
                out.add(t);
            }
        }
        return out;
    }

    private static PointSpec spec(List<Axis> axes, List<Item> tuple, int index) {
        String corner = TYP;
        Point cornerPoint = Point.NONE;
        Map<ValuePath, Value> values = new LinkedHashMap<>();
        Map<String, Double> swept = new LinkedHashMap<>();
        for (int i = 0; i < axes.size(); i++) {
            Item item = tuple.get(i);
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
