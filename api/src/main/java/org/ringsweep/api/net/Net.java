package org.ringsweep.api.net;

import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.apiguardian.api.API;
import org.jgrapht.Graph;

/**
 * One net: its rails, drivers, receivers, line segments and parts, the stimulus, simulation
 * settings, limits and named corners, and the topology as a read-only JGraphT graph.
 *
 * <p>Immutable and thread-safe. Made by {@link NetBuilder}, which validates the topology;
 * {@link #with(Point)} returns a copy with overrides applied.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class Net {
    private final String name;
    private final String source;
    private final String sourceHash;
    private final Map<String, Double> rails;
    private final List<Driver> drivers;
    private final List<Receiver> receivers;
    private final List<Segment> segments;
    private final List<Part> parts;
    private final Stimulus stimulus;
    private final SimulationSettings simulation;
    private final Limits limits;
    private final Map<String, Point> corners;
    private final Graph<NetPoint, Element> graph;

    Net(NetBuilder b, Graph<NetPoint, Element> graph) {
        this.name = b.name;
        this.source = b.source;
        this.sourceHash = b.sourceHash;
        this.rails = Collections.unmodifiableMap(new LinkedHashMap<>(b.rails));
        this.drivers = List.copyOf(b.drivers);
        this.receivers = List.copyOf(b.receivers);
        this.segments = List.copyOf(b.segments);
        this.parts = List.copyOf(b.parts);
        this.stimulus = b.stimulus;
        this.simulation = b.simulation;
        this.limits = b.limits;
        this.corners = Collections.unmodifiableMap(new LinkedHashMap<>(b.corners));
        this.graph = graph;
    }

    /** The net's name as the user wrote it (not sanitised). */
    public String name() {
        return name;
    }

    /** The file (or label) the net came from. */
    public String source() {
        return source;
    }

    /** A hash of the source file's content (hex), or empty when the net was made in code. */
    public String sourceHash() {
        return sourceHash;
    }

    /** DC rails by name in volts, GND (0 V) included. */
    public Map<String, Double> rails() {
        return rails;
    }

    /** The drivers in file order. */
    public List<Driver> drivers() {
        return drivers;
    }

    /** The receivers in file order. */
    public List<Receiver> receivers() {
        return receivers;
    }

    /** The segments in file order. */
    public List<Segment> segments() {
        return segments;
    }

    /** The lumped parts in file order. */
    public List<Part> parts() {
        return parts;
    }

    /** The stimulus. */
    public Stimulus stimulus() {
        return stimulus;
    }

    /** Stop time and step settings. */
    public SimulationSettings simulation() {
        return simulation;
    }

    /** The net-level limits (receivers may override them). */
    public Limits limits() {
        return limits;
    }

    /** Named corners in file order (not including {@code typ}, which is the file's own values). */
    public Map<String, Point> corners() {
        return corners;
    }

    /** The topology, read-only: points as vertices, elements as edges (drivers and receivers join their pin to GND). */
    public Graph<NetPoint, Element> graph() {
        return graph;
    }

    /** Every element in the order: drivers, receivers, segments, parts. */
    public List<Element> elements() {
        List<Element> all = new ArrayList<>(drivers.size() + receivers.size() + segments.size() + parts.size());
        all.addAll(drivers);
        all.addAll(receivers);
        all.addAll(segments);
        all.addAll(parts);
        return all;
    }

    /** The element with the given id (ids are unique across kinds). */
    public Optional<Element> element(String id) {
        return elements().stream().filter(e -> e.id().equals(id)).findFirst();
    }

    /** The receiver's limits layered over the net's. */
    public Limits limitsFor(Receiver receiver) {
        return limits.overriddenBy(receiver.limits());
    }

    /**
     * A copy of this net with each value of {@code point} set. A path may name a parameter the
     * element does not yet set (e.g. {@code U1.14/fall}); whether the key is meaningful for the
     * element's model is checked by the caller, which knows the model.
     *
     * @throws NetValidationException if a path names an element this net does not have, or the
     *                                result is not a valid net
     */
    public Net with(Point point) {
        if (point.isEmpty()) {
            return this;
        }
        NetBuilder b = toBuilder();
        for (Map.Entry<ValuePath, Value> e : point.values().entrySet()) {
            b.set(e.getKey(), e.getValue());
        }
        return b.build();
    }

    /** A builder holding this net's content. */
    public NetBuilder toBuilder() {
        NetBuilder b = new NetBuilder(name).source(source, sourceHash);
        rails.forEach((k, v) -> {
            if (!k.equals(NetPoint.GROUND)) {
                b.rail(k, v);
            }
        });
        drivers.forEach(b::driver);
        receivers.forEach(b::receiver);
        segments.forEach(b::segment);
        parts.forEach(b::part);
        b.stimulus(stimulus).simulation(simulation).limits(limits);
        corners.forEach(b::corner);
        return b;
    }

    @Override
    public String toString() {
        return "Net[" + name + ", " + drivers.size() + " driver(s), " + receivers.size() + " receiver(s), "
                + segments.size() + " segment(s), " + parts.size() + " part(s)]";
    }
}
