package org.ringsweep.runner.input;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Element;
import org.ringsweep.api.net.LimitName;
import org.ringsweep.api.net.Limits;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.api.net.NetPoint;
import org.ringsweep.api.net.NetValidationException;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Point;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.net.Segment;
import org.ringsweep.api.net.SimulationSettings;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.api.quantity.Quantities;
import org.yaml.snakeyaml.nodes.Node;

/** Reads one composed net file into a {@link Net}. One instance per file; not thread-safe. */
final class NetReader {
    static final String FORMAT = "ringsweep/net-1";
    private static final List<String> TOP_KEYS = List.of("format", "net", "rails", "drivers", "receivers", "segments",
            "parts", "stimulus", "simulation", "limits", "corners");
    private static final List<String> SEGMENT_KEYS;
    private static final List<String> PART_KEYS = List.of("ref", "kind", "value", "between");
    private static final String POINT = "a point name such as `U1.14` or `J1`";
    private static final String IBIS_CORNER = "ibis_corner";
    private static final ValueRule.Quantity POSITIVE_TIME = ValueRule.Quantity.of(Dimension.TIME, ValueRule.Bound.POSITIVE);

    static {
        List<String> keys = new ArrayList<>(List.of("id", "from", "to"));
        keys.addAll(ElementRules.SEGMENT.keySet());
        SEGMENT_KEYS = List.copyOf(keys);
    }

    /** Where an element and its id were written, for errors found across elements. */
    private record Origin(String path, Location element, String idKey, Location id) {
    }

    private final String file;
    private final String hash;
    private final ModelCatalog catalog;
    private final Set<String> rails = new LinkedHashSet<>(List.of(NetPoint.GROUND));
    private final Map<Location, Origin> originsByLocation = new HashMap<>();
    private final List<Map.Entry<Element, Origin>> elementsInOrder = new ArrayList<>();
    private final Map<Part, List<Node>> partTerminals = new IdentityHashMap<>();

    NetReader(String file, String hash, ModelCatalog catalog) {
        this.file = file;
        this.hash = hash;
        this.catalog = catalog;
    }

    Net read(Node root) {
        if (root == null) {
            throw new InputException(new Location(file, 0, 0), "", "the file is empty; expected a net file starting with `format: " + FORMAT + "`");
        }
        YamlMap top = YamlMap.of(file, root, "", "a map of keys starting with `format: " + FORMAT + "`");
        checkFormat(top);
        top.allowOnly(TOP_KEYS, "a net file");
        NetBuilder b = new NetBuilder(top.text("net", "the net's name such as `net: SPI0_SCK`")).source(file, hash);
        top.get("rails").ifPresent(n -> readRails(b, YamlMap.of(file, n, "rails", "a map of rails such as `{ VCC: 3.3 }`")));
        List<Node> drivers = nonEmptyList(top, "drivers", "driver", "- { pin: U1.14, model: ramp, v_high: VCC, rise: 1.5ns, r_out: 18 }");
        for (int i = 0; i < drivers.size(); i++) {
            b.driver(readDriver(drivers.get(i), "drivers[" + i + "]"));
        }
        List<Node> receivers = nonEmptyList(top, "receivers", "receiver", "- { pin: U7.6, model: cmos, c_in: 4pF, vih: 2.0, vil: 0.8 }");
        for (int i = 0; i < receivers.size(); i++) {
            b.receiver(readReceiver(receivers.get(i), "receivers[" + i + "]"));
        }
        List<Node> segments = optionalList(top, "segments", "a list of segments such as `- { from: U1.14, to: U7.6, z0: 50, delay: 150ps }`");
        for (int i = 0; i < segments.size(); i++) {
            b.segment(readSegment(segments.get(i), i));
        }
        List<Node> parts = optionalList(top, "parts", "a list of parts such as `- { ref: R5, kind: resistor, value: 22, between: [R5.1, R5.2] }`");
        for (int i = 0; i < parts.size(); i++) {
            b.part(readPart(parts.get(i), "parts[" + i + "]"));
        }
        top.get("stimulus").ifPresent(n -> b.stimulus(readStimulus(YamlMap.of(file, n, "stimulus",
                "a map such as `{ edges: [rise, fall], settle: auto }`"))));
        top.get("simulation").ifPresent(n -> b.simulation(readSimulation(YamlMap.of(file, n, "simulation",
                "a map such as `{ stop: auto, step: auto }`"))));
        top.get("limits").ifPresent(n -> b.limits(readLimits(n, "limits")));
        checkAcrossElements();
        Net net = build(b);
        Optional<Node> corners = top.get("corners");
        if (corners.isEmpty()) {
            return net;
        }
        NetBuilder withCorners = net.toBuilder();
        readCorners(net, YamlMap.of(file, corners.get(), "corners", "a map of named corners such as `slow: { U1.14/rise: 2.5ns }`"))
                .forEach(withCorners::corner);
        return build(withCorners);
    }

    private void checkFormat(YamlMap top) {
        String format = top.text("format", "`format: " + FORMAT + "` as the first key");
        if (format.equals(FORMAT)) {
            return;
        }
        String hint = format.equals("ringsweep/sweep-1") ? " (that is a sweep file: run it with `ringsweep sweep`)"
                : format.equals("ringsweep/board-1") ? " (that is a board mapping file for `ringsweep import`)" : "";
        throw new InputException(YamlMap.location(file, top.get("format").orElseThrow()), "format",
                "expected `" + FORMAT + "`, found `" + format + "`" + hint);
    }

    private void readRails(NetBuilder b, YamlMap m) {
        for (String name : m.keys()) {
            String key = m.path(name);
            if (name.equals(NetPoint.GROUND)) {
                throw new InputException(YamlMap.location(file, m.keyNode(name)), key,
                        "GND is always 0 V and cannot be declared; expected other rail names such as `VCC`");
            }
            requireName(name, m.keyNode(name), key, "a rail name such as `VCC`");
            Node v = m.get(name).orElseThrow();
            String text = YamlMap.scalarOrEmpty(file, v, key, "a voltage such as `3.3` or `3.3V`");
            Value.Number volts = (Value.Number) ValueReader.read(ValueRule.Quantity.of(Dimension.VOLTAGE, ValueRule.Bound.ANY),
                    text, rails, YamlMap.location(file, v), key);
            b.rail(name, volts.si());
            rails.add(name);
        }
    }

    private List<Node> nonEmptyList(YamlMap top, String key, String what, String example) {
        Node n = top.require(key, "at least one " + what + " such as `" + example + "`");
        List<Node> items = YamlMap.list(file, n, key, "a list of " + what + "s such as `" + example + "`");
        if (items.isEmpty()) {
            throw new InputException(YamlMap.location(file, n), key, "net has no " + what + "; expected at least one such as `" + example + "`");
        }
        return items;
    }

    private List<Node> optionalList(YamlMap top, String key, String what) {
        return top.get(key).map(n -> YamlMap.list(file, n, key, what)).orElse(List.of());
    }

    private Driver readDriver(Node n, String path) {
        YamlMap m = YamlMap.of(file, n, path, "a driver such as `{ pin: U1.14, model: ramp, v_high: VCC, rise: 1.5ns, r_out: 18 }`");
        String pin = point(m, "pin");
        ModelDescriptor model = model(m, ModelDescriptor.Role.DRIVER);
        Parameters params = modelParameters(m, model, List.of("pin", "model"));
        Driver d = new Driver(pin, model.id(), params, m.location());
        remember(d, m, "pin");
        return d;
    }

    private Receiver readReceiver(Node n, String path) {
        YamlMap m = YamlMap.of(file, n, path, "a receiver such as `{ pin: U7.6, model: cmos, c_in: 4pF, vih: 2.0, vil: 0.8 }`");
        String pin = point(m, "pin");
        ModelDescriptor model = model(m, ModelDescriptor.Role.RECEIVER);
        Parameters params = modelParameters(m, model, List.of("pin", "model", "limits"));
        Limits limits = m.get("limits").map(l -> readLimits(l, m.path("limits"))).orElse(Limits.NONE);
        Receiver r = new Receiver(pin, model.id(), params, limits, m.location());
        remember(r, m, "pin");
        return r;
    }

    private ModelDescriptor model(YamlMap m, ModelDescriptor.Role role) {
        String word = role == ModelDescriptor.Role.DRIVER ? "driver" : "receiver";
        List<String> known = catalog.all().stream().filter(d -> d.role() == role).map(ModelDescriptor::id).toList();
        String id = m.text("model", "a " + word + " model: one of " + String.join(", ", known));
        return catalog.find(role, id).orElseThrow(() -> new InputException(YamlMap.location(file, m.get("model").orElseThrow()),
                m.path("model"), "unknown " + word + " model `" + id + "`; expected one of: " + String.join(", ", known)));
    }

    /** The model's parameters as given (no defaults), checked per key, for required keys and by the model. */
    private Parameters modelParameters(YamlMap m, ModelDescriptor model, List<String> ownKeys) {
        List<String> allowed = new ArrayList<>(ownKeys);
        model.parameters().forEach(p -> allowed.add(p.key()));
        String role = model.role() == ModelDescriptor.Role.DRIVER ? "driver" : "receiver";
        m.allowOnly(allowed, "a " + role + " with model " + model.id());
        Map<String, Value> values = new LinkedHashMap<>();
        Map<String, Location> locations = new LinkedHashMap<>();
        for (String key : m.keys()) {
            if (ownKeys.contains(key)) {
                continue;
            }
            ParameterSpec spec = model.parameter(key).orElseThrow();
            Node v = m.get(key).orElseThrow();
            Location at = YamlMap.location(file, v);
            String text = YamlMap.scalarOrEmpty(file, v, m.path(key), "a single value for " + key);
            values.put(key, ValueReader.read(ValueRule.forSpec(spec), text, rails, at, m.path(key)));
            locations.put(key, at);
        }
        for (ParameterSpec spec : model.parameters()) {
            if (spec.required() && !values.containsKey(spec.key())) {
                throw new InputException(m.location(), m.path(spec.key()), "missing `" + spec.key() + "` required by model "
                        + model.id() + " (" + spec.description() + "); expected e.g. `" + spec.key() + ": " + example(spec) + "`");
            }
        }
        Parameters params = Parameters.of(values, locations);
        List<ModelDescriptor.Problem> problems = model.check(params);
        if (!problems.isEmpty()) {
            ModelDescriptor.Problem p = problems.get(0);
            Location at = locations.getOrDefault(p.key(), m.location());
            throw new InputException(at, m.path(p.key()), "model " + model.id() + ": " + p.message());
        }
        return params;
    }

    private String example(ParameterSpec spec) {
        return switch (spec.type()) {
            case NUMBER -> {
                String ex = Quantities.examples(spec.dimension());
                yield ex.substring(1, ex.indexOf('`', 1));
            }
            case VOLTAGE_OR_RAIL -> "3.3";
            case RAIL -> rails.size() > 1 ? rails.stream().skip(1).findFirst().orElseThrow() : "VCC";
            case WORD -> spec.words().stream().sorted().findFirst().orElse("");
            case FLAG -> "true";
            case TEXT -> "parts/demo.ibs";
        };
    }

    private Segment readSegment(Node n, int index) {
        String path = "segments[" + index + "]";
        YamlMap m = YamlMap.of(file, n, path, "a segment such as `{ from: U1.14, to: J1, z0: 50, length: 4mm, er_eff: 3.4 }`");
        if (m.has("geometry")) {
            throw new InputException(YamlMap.location(file, m.keyNode("geometry")), m.path("geometry"),
                    "segment geometry is not supported yet; expected z0 with delay, or with length and er_eff or velocity");
        }
        m.allowOnly(SEGMENT_KEYS, "a segment");
        String id = m.has("id") ? name(m, "id", "a segment id such as `TL1`") : "TL" + (index + 1);
        String from = point(m, "from");
        String to = point(m, "to");
        m.require("z0", "the characteristic impedance such as `z0: 50`");
        Map<String, Value> values = new LinkedHashMap<>();
        Map<String, Location> locations = new LinkedHashMap<>();
        for (String key : m.keys()) {
            ValueRule rule = ElementRules.SEGMENT.get(key);
            if (rule == null) {
                continue;
            }
            Node v = m.get(key).orElseThrow();
            Location at = YamlMap.location(file, v);
            values.put(key, ValueReader.read(rule, YamlMap.scalarOrEmpty(file, v, m.path(key), "a single value"), rails, at, m.path(key)));
            locations.put(key, at);
        }
        checkSegmentTiming(m, values.keySet());
        Segment s = new Segment(id, from, to, Parameters.of(values, locations), m.location());
        remember(s, m, m.has("id") ? "id" : null);
        if (from.equals(to)) {
            throw new InputException(YamlMap.location(file, m.get("to").orElseThrow()), m.path("to"),
                    "segment " + id + " runs from " + from + " to itself; expected two different points");
        }
        return s;
    }

    /** formats.md: z0 and either delay, or length with er_eff or with velocity. */
    private void checkSegmentTiming(YamlMap m, Set<String> given) {
        boolean delay = given.contains("delay");
        boolean length = given.contains("length");
        boolean er = given.contains("er_eff");
        boolean velocity = given.contains("velocity");
        boolean lossy = given.contains("r_per_m") || given.contains("g_per_m");
        Location at = m.location();
        if (delay && (length || er || velocity)) {
            throw new InputException(at, m.path("delay"), "expected either delay, or length with er_eff or velocity, not both");
        }
        if (delay && lossy) {
            throw new InputException(at, m.path("length"), "losses (r_per_m, g_per_m) are per metre; expected length with er_eff or velocity instead of delay");
        }
        if (!delay && !length) {
            throw new InputException(at, m.path(er || velocity ? "length" : "delay"),
                    "expected delay such as `delay: 150ps`, or length with er_eff or velocity such as `length: 4mm, er_eff: 3.4`");
        }
        if (length && er && velocity) {
            throw new InputException(at, m.path("velocity"), "expected er_eff or velocity, not both");
        }
        if (length && !er && !velocity) {
            throw new InputException(at, m.path("er_eff"), "a length needs er_eff or velocity to give the delay; expected e.g. `er_eff: 3.4`");
        }
    }

    private Part readPart(Node n, String path) {
        YamlMap m = YamlMap.of(file, n, path, "a part such as `{ ref: R5, kind: resistor, value: 22, between: [R5.1, R5.2] }`");
        m.allowOnly(PART_KEYS, "a part");
        String ref = name(m, "ref", "a reference designator such as `R5`");
        String kindText = m.text("kind", "one of `capacitor`, `inductor`, `resistor`");
        Part.Kind kind = Arrays.stream(Part.Kind.values()).filter(k -> k.word().equals(kindText)).findFirst()
                .orElseThrow(() -> new InputException(YamlMap.location(file, m.get("kind").orElseThrow()), m.path("kind"),
                        "expected one of `capacitor`, `inductor`, `resistor`, found `" + kindText + "`"));
        Node valueNode = m.require("value", "the part's value such as `value: 22`");
        Location valueAt = YamlMap.location(file, valueNode);
        Value value = ValueReader.read(ElementRules.partValue(kind), YamlMap.scalarOrEmpty(file, valueNode, m.path("value"), "a single value"),
                rails, valueAt, m.path("value"));
        Node betweenNode = m.require("between", "the two points it joins such as `between: [R5.1, R5.2]`");
        List<Node> points = YamlMap.list(file, betweenNode, m.path("between"), "a list of two points such as `[R5.1, R5.2]`");
        if (points.size() != 2) {
            throw new InputException(YamlMap.location(file, betweenNode), m.path("between"),
                    "expected exactly two points such as `[R5.1, R5.2]`, found " + points.size());
        }
        String a = pointText(points.get(0), m.path("between") + "[0]");
        String b = pointText(points.get(1), m.path("between") + "[1]");
        if (a.equals(b)) {
            throw new InputException(YamlMap.location(file, betweenNode), m.path("between"),
                    "part " + ref + " has both terminals on " + a + "; expected two different points");
        }
        Part p = new Part(ref, kind, a, b, Parameters.of(Map.of("value", value), Map.of("value", valueAt)), m.location());
        remember(p, m, "ref");
        partTerminals.put(p, List.of(points.get(0), points.get(1)));
        return p;
    }

    private Stimulus readStimulus(YamlMap m) {
        m.allowOnly(List.of("edges", "settle", "period", "cycles"), "the stimulus");
        boolean periodic = m.has("period");
        if (periodic && m.has("settle")) {
            throw new InputException(YamlMap.location(file, m.keyNode("settle")), m.path("settle"),
                    "settle is for single edges; expected either edges with settle, or period with cycles, not both");
        }
        if (periodic && !m.has("cycles")) {
            throw new InputException(m.location(), m.path("cycles"), "a periodic stimulus needs cycles beside period; expected e.g. `cycles: 3`");
        }
        if (!periodic && m.has("cycles")) {
            throw new InputException(m.location(), m.path("period"), "cycles needs a period; expected e.g. `period: 100ns`");
        }
        List<Stimulus.Edge> edges = m.get("edges").map(n -> edges(n, m.path("edges"))).orElse(Stimulus.DEFAULT.edges());
        if (periodic) {
            if (m.has("edges") && edges.size() != 1) {
                throw new InputException(YamlMap.location(file, m.get("edges").orElseThrow()), m.path("edges"),
                        "with period, edges gives only the first edge; expected `[rise]` or `[fall]`");
            }
            double period = number(m, "period", POSITIVE_TIME);
            Value.Number cycles = (Value.Number) read(m, "cycles", new ValueRule.Count(1));
            return new Stimulus(List.of(edges.get(0)), Double.NaN, period, (int) cycles.si());
        }
        double settle = m.has("settle") ? autoOrTime(m, "settle") : Double.NaN;
        return new Stimulus(edges, settle, Double.NaN, 0);
    }

    private List<Stimulus.Edge> edges(Node n, String path) {
        List<Node> items = YamlMap.list(file, n, path, "a list of edges such as `[rise, fall]`");
        if (items.isEmpty()) {
            throw new InputException(YamlMap.location(file, n), path, "expected at least one edge such as `[rise, fall]`");
        }
        List<Stimulus.Edge> edges = new ArrayList<>();
        for (int i = 0; i < items.size(); i++) {
            String key = path + "[" + i + "]";
            String w = YamlMap.scalarOrEmpty(file, items.get(i), key, "`rise` or `fall`");
            Stimulus.Edge e = w.equals("rise") ? Stimulus.Edge.RISE : w.equals("fall") ? Stimulus.Edge.FALL : null;
            if (e == null) {
                throw new InputException(YamlMap.location(file, items.get(i)), key, "expected `rise` or `fall`, found " + ValueReader.found(w));
            }
            if (!edges.isEmpty() && edges.get(edges.size() - 1) == e) {
                throw new InputException(YamlMap.location(file, items.get(i)), key,
                        "two " + w + " edges in a row; expected edges that alternate rise and fall");
            }
            edges.add(e);
        }
        return edges;
    }

    private SimulationSettings readSimulation(YamlMap m) {
        m.allowOnly(List.of("stop", "step"), "the simulation settings");
        double stop = m.has("stop") ? autoOrTime(m, "stop") : Double.NaN;
        double step = m.has("step") ? autoOrTime(m, "step") : Double.NaN;
        if (!Double.isNaN(stop) && !Double.isNaN(step) && step >= stop) {
            throw new InputException(YamlMap.location(file, m.get("step").orElseThrow()), m.path("step"),
                    "expected a step shorter than the stop time " + Quantities.format(stop, Dimension.TIME) + ", found `"
                            + YamlMap.scalarOrEmpty(file, m.get("step").orElseThrow(), m.path("step"), "a time") + "`");
        }
        return new SimulationSettings(stop, step);
    }

    private double autoOrTime(YamlMap m, String key) {
        Node n = m.get(key).orElseThrow();
        String t = YamlMap.scalarOrEmpty(file, n, m.path(key), "`auto` or a time such as `10ns`");
        if (t.equals("auto")) {
            return Double.NaN;
        }
        ValueRule.Quantity rule = new ValueRule.Quantity(Dimension.TIME, ValueRule.Bound.POSITIVE, "time",
                "`10ns` or `1e-8` (or `auto`)");
        return ((Value.Number) ValueReader.read(rule, t, rails, YamlMap.location(file, n), m.path(key))).si();
    }

    private Limits readLimits(Node n, String path) {
        YamlMap m = YamlMap.of(file, n, path, "a map of limits such as `{ overshoot_max: 0.5V, settle_max: 10ns }`");
        List<String> keys = Arrays.stream(LimitName.values()).map(LimitName::key).toList();
        m.allowOnly(keys, "limits");
        Map<LimitName, Value> values = new EnumMap<>(LimitName.class);
        for (String key : m.keys()) {
            LimitName name = LimitName.byKey(key).orElseThrow();
            values.put(name, read(m, key, limitRule(name)));
        }
        return Limits.of(values);
    }

    private static ValueRule limitRule(LimitName name) {
        return switch (name) {
            case OVERSHOOT_MAX, UNDERSHOOT_MAX -> ValueRule.Quantity.of(Dimension.VOLTAGE, ValueRule.Bound.NON_NEGATIVE);
            case RINGBACK_MARGIN_MIN -> ValueRule.Quantity.of(Dimension.VOLTAGE, ValueRule.Bound.ANY);
            case SETTLE_MAX, DELAY_MAX, RISE_MAX -> POSITIVE_TIME;
            case SETTLE_BAND -> new ValueRule.SettleBand();
            case MONOTONIC -> new ValueRule.Flag();
            case CROSSINGS_MAX -> new ValueRule.Count(1);
        };
    }

    private Map<String, Point> readCorners(Net net, YamlMap m) {
        PointParser parser = new PointParser(catalog);
        Map<String, Point> corners = new LinkedHashMap<>();
        for (String name : m.keys()) {
            String key = m.path(name);
            if (name.equals("typ")) {
                throw new InputException(YamlMap.location(file, m.keyNode(name)), key,
                        "`typ` is the file's own values and cannot be redefined; expected another corner name such as `slow`");
            }
            requireName(name, m.keyNode(name), key, "a corner name such as `slow`");
            YamlMap c = YamlMap.of(file, m.get(name).orElseThrow(), key, "a map of overrides such as `{ U1.14/rise: 2.5ns }`");
            List<PointParser.Assignment> assignments = new ArrayList<>();
            for (String path : c.keys()) {
                Node v = c.get(path).orElseThrow();
                assignments.add(new PointParser.Assignment(path, YamlMap.scalarOrEmpty(file, v, c.path(path), "a single value"),
                        YamlMap.location(file, v)));
            }
            corners.put(name, ibisColumns(net, name).then(parser.parse(net, assignments, key)));
        }
        return corners;
    }

    /**
     * formats.md "Driver and receiver models by file": corners named slow and fast select the
     * IBIS min and max columns. For every driver and receiver whose model takes
     * {@code ibis_corner}, the corner sets it unless the corner's own values set it (they are
     * applied after these).
     */
    private Point ibisColumns(Net net, String cornerName) {
        String column = switch (cornerName) {
            case "slow" -> "min";
            case "fast" -> "max";
            default -> "";
        };
        if (column.isEmpty()) {
            return Point.NONE;
        }
        Map<ValuePath, Value> values = new LinkedHashMap<>();
        List<Element> elements = new ArrayList<>(net.drivers());
        elements.addAll(net.receivers());
        for (Element e : elements) {
            boolean takesColumn = ElementRules.model(catalog, e).flatMap(m -> m.parameter(IBIS_CORNER)).isPresent();
            if (takesColumn) {
                values.put(new ValuePath(e.id(), IBIS_CORNER), new Value.Word(column));
            }
        }
        return Point.of(values);
    }

    private Value read(YamlMap m, String key, ValueRule rule) {
        Node n = m.get(key).orElseThrow();
        return ValueReader.read(rule, YamlMap.scalarOrEmpty(file, n, m.path(key), "a single value"), rails,
                YamlMap.location(file, n), m.path(key));
    }

    private double number(YamlMap m, String key, ValueRule.Quantity rule) {
        return ((Value.Number) read(m, key, rule)).si();
    }

    private String point(YamlMap m, String key) {
        String p = name(m, key, POINT);
        if (rails.contains(p)) {
            throw new InputException(YamlMap.location(file, m.get(key).orElseThrow()), m.path(key), "`" + p
                    + "` is a rail; expected a pin or junction (drivers, receivers and segment ends sit on the net, not on a rail)");
        }
        return p;
    }

    private String name(YamlMap m, String key, String what) {
        String t = m.text(key, what);
        requireName(t, m.get(key).orElseThrow(), m.path(key), what);
        return t;
    }

    private String pointText(Node n, String key) {
        String t = YamlMap.scalar(file, n, key, POINT);
        requireName(t, n, key, POINT);
        return t;
    }

    /** Names reach paths (ID/param) and options (ID/param=value): no blanks, no {@code /} or {@code =}. */
    private void requireName(String t, Node n, String key, String what) {
        if (t.isEmpty() || t.chars().anyMatch(c -> Character.isWhitespace(c) || c == '/' || c == '=')) {
            throw new InputException(YamlMap.location(file, n), key, "expected " + what + " (no spaces, `/` or `=`), found " + ValueReader.found(t));
        }
    }

    private void remember(Element e, YamlMap m, String idKey) {
        Origin o = new Origin(m.path(), m.location(), idKey == null ? m.path() : m.path(idKey),
                idKey == null ? m.location() : YamlMap.location(file, m.get(idKey).orElseThrow()));
        originsByLocation.put(e.location(), o);
        elementsInOrder.add(Map.entry(e, o));
    }

    /** Duplicate ids and dangling part terminals, named by key path (NetBuilder would name them by id). */
    private void checkAcrossElements() {
        Map<String, Map.Entry<Element, Origin>> seen = new HashMap<>();
        for (Map.Entry<Element, Origin> entry : elementsInOrder) {
            Element e = entry.getKey();
            Origin o = entry.getValue();
            Map.Entry<Element, Origin> before = seen.putIfAbsent(e.id(), entry);
            if (before == null) {
                continue;
            }
            Origin first = before.getValue();
            String detail;
            if (e instanceof Receiver && before.getKey() instanceof Driver) {
                detail = "pin " + e.id() + " has a driver (" + first.path() + " at line " + first.id().line()
                        + ") and a receiver; expected a receiver on another pin (a driver's own load belongs to its model)";
            } else if (e instanceof Driver && before.getKey() instanceof Driver) {
                detail = "two drivers on pin " + e.id() + " (the other is " + first.path() + " at line " + first.id().line()
                        + "); expected one driver per pin";
            } else {
                detail = "id " + e.id() + " is used twice (first by " + first.path() + " at line " + first.id().line()
                        + "); expected ids unique across segments, parts, drivers and receivers";
            }
            throw new InputException(o.id(), o.idKey(), detail);
        }
        Map<String, Integer> uses = new HashMap<>();
        for (Map.Entry<Element, Origin> entry : elementsInOrder) {
            entry.getKey().points().forEach(p -> uses.merge(p, 1, Integer::sum));
        }
        for (Map.Entry<Element, Origin> entry : elementsInOrder) {
            if (!(entry.getKey() instanceof Part p)) {
                continue;
            }
            for (int i = 0; i < 2; i++) {
                String t = p.points().get(i);
                if (!rails.contains(t) && uses.get(t) == 1) {
                    throw new InputException(YamlMap.location(file, partTerminals.get(p).get(i)), entry.getValue().path() + ".between[" + i + "]",
                            "terminal " + t + " of " + p.kind().word() + " " + p.ref() + " connects to nothing else; expected it on a segment, "
                                    + "another part, a driver, a receiver or a rail (" + String.join(", ", rails) + ")");
                }
            }
        }
    }

    private Net build(NetBuilder b) {
        try {
            return b.build();
        } catch (NetValidationException e) {
            Origin o = originsByLocation.get(e.location());
            Location at = e.location().line() > 0 ? e.location() : new Location(file, 0, 0);
            throw new InputException(at, o != null ? o.path() : e.key(), e.getMessage(), e);
        }
    }
}
