package org.ringsweep.api.net;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.stream.Collectors;
import org.apiguardian.api.API;
import org.jgrapht.Graph;
import org.jgrapht.graph.AsUnmodifiableGraph;
import org.jgrapht.graph.Pseudograph;

/**
 * The one validating way to make a {@link Net}. Not thread-safe; {@link #build()} may be called
 * more than once.
 *
 * <p>{@link #build()} rejects, naming the element and its location: no driver, no receiver, an
 * id used twice (ids are unique across segments, parts, drivers and receivers so that every
 * {@link ValuePath} is unambiguous), two drivers or a driver and a receiver on one pin, a driver
 * or receiver or segment end on a rail, a segment from a point to itself, a point not declared
 * as a rail that is named like one, and any point that does not connect to a driver through
 * segments and parts (rails do not count as connections).
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class NetBuilder {
    final String name;
    String source = "<code>";
    String sourceHash = "";
    final Map<String, Double> rails = new LinkedHashMap<>();
    final List<Driver> drivers = new ArrayList<>();
    final List<Receiver> receivers = new ArrayList<>();
    final List<Segment> segments = new ArrayList<>();
    final List<Part> parts = new ArrayList<>();
    Stimulus stimulus = Stimulus.DEFAULT;
    SimulationSettings simulation = SimulationSettings.AUTO;
    Limits limits = Limits.NONE;
    final Map<String, Point> corners = new LinkedHashMap<>();

    /** @param name the net name (any text; sanitised later where it reaches a deck or file name) */
    public NetBuilder(String name) {
        this.name = java.util.Objects.requireNonNull(name, "name");
        rails.put(NetPoint.GROUND, 0.0);
    }

    /** Where the net came from and a hash of that file's content. */
    public NetBuilder source(String file, String contentHash) {
        this.source = file;
        this.sourceHash = contentHash;
        return this;
    }

    /** Declares a DC rail. GND is always present at 0 V and cannot be redeclared. */
    public NetBuilder rail(String railName, double volts) {
        if (railName.equals(NetPoint.GROUND)) {
            throw new NetValidationException(Location.UNKNOWN, "rails." + railName, "GND is always 0 V and cannot be declared");
        }
        rails.put(railName, volts);
        return this;
    }

    /** Adds a driver. */
    public NetBuilder driver(Driver d) {
        drivers.add(d);
        return this;
    }

    /** Adds a receiver. */
    public NetBuilder receiver(Receiver r) {
        receivers.add(r);
        return this;
    }

    /** Adds a segment. */
    public NetBuilder segment(Segment s) {
        segments.add(s);
        return this;
    }

    /** Adds a part. */
    public NetBuilder part(Part p) {
        parts.add(p);
        return this;
    }

    /** Sets the stimulus. */
    public NetBuilder stimulus(Stimulus s) {
        this.stimulus = s;
        return this;
    }

    /** Sets the simulation settings. */
    public NetBuilder simulation(SimulationSettings s) {
        this.simulation = s;
        return this;
    }

    /** Sets the net-level limits. */
    public NetBuilder limits(Limits l) {
        this.limits = l;
        return this;
    }

    /** Adds a named corner. */
    public NetBuilder corner(String cornerName, Point overrides) {
        corners.put(cornerName, overrides);
        return this;
    }

    /**
     * Sets one value on the element that {@code path} names.
     *
     * @throws NetValidationException if no element has that id (the message lists the ids)
     */
    public NetBuilder set(ValuePath path, Value value) {
        if (replaceIn(drivers, path, value) || replaceIn(receivers, path, value)
                || replaceIn(segments, path, value) || replaceIn(parts, path, value)) {
            return this;
        }
        String ids = allIds().stream().sorted().collect(Collectors.joining(", "));
        throw new NetValidationException(Location.UNKNOWN, path.toString(),
                "no element `" + path.id() + "` on net " + name + "; expected one of: " + ids);
    }

    @SuppressWarnings("unchecked")
    private static <E extends Element> boolean replaceIn(List<E> list, ValuePath path, Value value) {
        for (int i = 0; i < list.size(); i++) {
            E e = list.get(i);
            if (e.id().equals(path.id())) {
                list.set(i, (E) e.withParameters(e.parameters().with(path.param(), value)));
                return true;
            }
        }
        return false;
    }

    private List<String> allIds() {
        List<String> ids = new ArrayList<>();
        drivers.forEach(d -> ids.add(d.id()));
        receivers.forEach(r -> ids.add(r.id()));
        segments.forEach(s -> ids.add(s.id()));
        parts.forEach(p -> ids.add(p.id()));
        return ids;
    }

    /**
     * Validates and builds the net.
     *
     * @throws NetValidationException naming the first problem found
     */
    public Net build() {
        Location netLoc = new Location(source, 0, 0);
        if (drivers.isEmpty()) {
            throw new NetValidationException(netLoc, "drivers", "net " + name + " has no driver; expected at least one entry under drivers");
        }
        if (receivers.isEmpty()) {
            throw new NetValidationException(netLoc, "receivers", "net " + name + " has no receiver; expected at least one entry under receivers");
        }
        checkUniqueIds();
        Pseudograph<NetPoint, Element> g = new Pseudograph<>(Element.class);
        Map<String, NetPoint> points = new HashMap<>();
        rails.keySet().forEach(r -> points.put(r, addVertex(g, new NetPoint(r, NetPoint.Kind.RAIL))));
        NetPoint gnd = points.get(NetPoint.GROUND);
        for (Segment s : segments) {
            if (s.from().equals(s.to())) {
                throw new NetValidationException(s.location(), "segments." + s.id(), "segment " + s.id() + " runs from " + s.from() + " to itself; expected two different points");
            }
            for (String p : s.points()) {
                if (rails.containsKey(p)) {
                    throw new NetValidationException(s.location(), "segments." + s.id(), "segment " + s.id() + " ends on rail " + p + "; a line's return is GND, so expected a pin or junction");
                }
            }
            g.addEdge(point(g, points, s.from()), point(g, points, s.to()), s);
        }
        for (Part p : parts) {
            if (p.a().equals(p.b())) {
                throw new NetValidationException(p.location(), "parts." + p.ref(), "part " + p.ref() + " has both terminals on " + p.a() + "; expected two different points");
            }
            g.addEdge(point(g, points, p.a()), point(g, points, p.b()), p);
        }
        for (Driver d : drivers) {
            requireNotRail(d.pin(), d.location(), "drivers." + d.pin());
            g.addEdge(point(g, points, d.pin()), gnd, d);
        }
        for (Receiver r : receivers) {
            requireNotRail(r.pin(), r.location(), "receivers." + r.pin());
            g.addEdge(point(g, points, r.pin()), gnd, r);
        }
        checkConnected(points);
        Graph<NetPoint, Element> view = new AsUnmodifiableGraph<>(g);
        return new Net(this, view);
    }

    private void requireNotRail(String pin, Location loc, String key) {
        if (rails.containsKey(pin)) {
            throw new NetValidationException(loc, key, "pin " + pin + " is a rail; expected a pin or junction");
        }
    }

    private static NetPoint addVertex(Graph<NetPoint, Element> g, NetPoint p) {
        g.addVertex(p);
        return p;
    }

    private static NetPoint point(Graph<NetPoint, Element> g, Map<String, NetPoint> points, String pointName) {
        return points.computeIfAbsent(pointName, n -> addVertex(g, new NetPoint(n,
                NetPoint.looksLikePin(n) ? NetPoint.Kind.PIN : NetPoint.Kind.JUNCTION)));
    }

    private void checkUniqueIds() {
        Map<String, Element> seen = new HashMap<>();
        Set<String> driverPins = new HashSet<>();
        for (Driver d : drivers) {
            if (!driverPins.add(d.pin())) {
                throw new NetValidationException(d.location(), "drivers." + d.pin(), "two drivers on pin " + d.pin() + "; expected one driver per pin");
            }
        }
        for (Element e : allElements()) {
            Element before = seen.putIfAbsent(e.id(), e);
            if (before != null) {
                throw new NetValidationException(e.location(), kindKey(e) + "." + e.id(),
                        "id " + e.id() + " is used twice (" + describe(before) + " and " + describe(e)
                                + "); expected ids unique across segments, parts, drivers and receivers");
            }
        }
    }

    private List<Element> allElements() {
        List<Element> all = new ArrayList<>();
        all.addAll(drivers);
        all.addAll(receivers);
        all.addAll(segments);
        all.addAll(parts);
        return all;
    }

    private static String kindKey(Element e) {
        if (e instanceof Driver) {
            return "drivers";
        } else if (e instanceof Receiver) {
            return "receivers";
        } else if (e instanceof Segment) {
            return "segments";
        }
        return "parts";
    }

    private static String describe(Element e) {
        return kindKey(e).substring(0, kindKey(e).length() - 1) + " at " + e.location();
    }

    /** Every non-rail point must reach a driver pin through segments and parts, not through rails. */
    private void checkConnected(Map<String, NetPoint> points) {
        Map<String, List<String>> adjacency = new HashMap<>();
        for (Element e : allElements()) {
            if (e instanceof Segment || e instanceof Part) {
                String a = e.points().get(0);
                String b = e.points().get(1);
                adjacency.computeIfAbsent(a, k -> new ArrayList<>()).add(b);
                adjacency.computeIfAbsent(b, k -> new ArrayList<>()).add(a);
            }
        }
        Set<String> reached = new HashSet<>();
        Deque<String> todo = new ArrayDeque<>();
        drivers.forEach(d -> todo.add(d.pin()));
        while (!todo.isEmpty()) {
            String p = todo.poll();
            if (!reached.add(p) || rails.containsKey(p)) {
                continue;
            }
            todo.addAll(adjacency.getOrDefault(p, List.of()));
        }
        for (Element e : allElements()) {
            for (String p : e.points()) {
                if (!rails.containsKey(p) && !reached.contains(p)) {
                    throw new NetValidationException(e.location(), kindKey(e) + "." + e.id(),
                            "point " + p + " (on " + describe(e) + ") does not connect to any driver of net " + name
                                    + "; expected every point to reach a driver through segments and parts");
                }
            }
        }
    }
}
