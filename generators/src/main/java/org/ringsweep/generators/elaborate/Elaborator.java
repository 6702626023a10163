package org.ringsweep.generators.elaborate;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.function.Supplier;
import java.util.stream.Collectors;
import org.jgrapht.Graph;
import org.jgrapht.Graphs;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.SafeName;
import org.ringsweep.api.circuit.Transient;
import org.ringsweep.api.model.DriverContext;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ReceiverContext;
import org.ringsweep.api.model.ReceiverModel;
import org.ringsweep.api.model.ScheduledEdge;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Element;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetPoint;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.net.Segment;
import org.ringsweep.api.net.SimulationSettings;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.api.net.Value;
import org.ringsweep.generators.analysis.I2cPullUp;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.generators.models.OpenDrainDriverModel;
import org.ringsweep.generators.names.NodeNamer;

/**
 * Turns a {@link Net} (its point already applied with {@link Net#with}) into a flat
 * {@link Circuit} plus the edge schedule and receiver thresholds. Stateless and thread-safe.
 *
 * <h2>Elements</h2>
 * <ul>
 * <li>Every point gets a safe node from {@link NodeNamer}; GND is node {@code 0} and no other
 *     point can become ground. Each rail other than GND is a DC source from its node to ground.</li>
 * <li>Drivers and receivers are elaborated by their model ({@link DriverModel},
 *     {@link ReceiverModel}; built-in {@code ramp}, {@code cmos} and {@code ibis}).</li>
 * <li>Parts become resistors, capacitors and inductors. A 0 Ω resistor (legal in sweeps, e.g. "no
 *     series resistor") becomes 1 µΩ: ngspice has no zero resistance and would otherwise replace
 *     it by 1 mΩ with only a warning (ngspice.md §1, §6). Negative values, and a capacitance or
 *     inductance of 0, are errors.</li>
 * <li>A lossless segment whose delay is under 1/20 of the shortest full ramp is electrically short:
 *     it becomes a lumped pi section with the same total L and C (see {@link #SHORT_LINE_FRACTION}),
 *     and it does not limit the time step.</li>
 * <li>A segment is a lossless line (Z0, delay from {@link Segment#delaySeconds()}) with both
 *     reference nodes on ground. With {@code r_per_m} or {@code g_per_m} &gt; 0 it is a lossy RLGC
 *     line with {@code L = Z0·TD/len} and {@code C = TD/(Z0·len)} (lines-and-terminations.md §1),
 *     which needs {@code length}.</li>
 * </ul>
 *
 * <h2>Edge schedule and automatic timing</h2>
 * <ul>
 * <li>Several drivers all switch together at the scheduled times; the first driver (in file
 *     order) defines the swing, the {@code delay} and each edge's 50 % instant.</li>
 * <li>Lead-in: the first edge starts at {@code max(1 ns, 2 × the longest full ramp)} plus the first
 *     driver's {@code delay}, so the circuit starts from a quiet DC state.</li>
 * <li>Single edges ({@code edges: [rise, fall]}): they must alternate. After each edge's longest
 *     full ramp (over all drivers) comes the settle time, then the next edge starts. Each
 *     measurement window runs from an edge's start to the next edge's start; the last one ends at
 *     the stop time, which is the end of the last settle time.</li>
 * <li>{@code settle: auto}: take the longest simple driver-to-receiver path through segments and
 *     parts (not through rails) and its total one-way delay TDmax; the source reflection
 *     coefficient {@code Γs = (r_out − Z0)/(r_out + Z0)} of the driver's output resistance against
 *     the first segment on that path, and a load {@code ΓL = +1} (CMOS inputs are nearly open). The
 *     far end stays within e = 1 % of the swing after {@code n ≥ ln(e/|Vfar(0) − Vfinal|)/ln|Γs·ΓL|}
 *     arrivals (lines-and-terminations.md §2), i.e. at {@code (2n + 1)·TDmax}. Add 5 RC time
 *     constants of {@code (r_out + series R on the path + Z0) × (all receiver input capacitance +
 *     all capacitor parts)} (e^-5 &lt; 1 %) and the longest full ramp. The result is at least 10 ns
 *     and at most 2 µs (capped with a warning). Parallel or RC terminations and clamps only damp
 *     the ringing, so for them the estimate is conservative; inductor parts are not estimated
 *     (give {@code settle} yourself for LC ringing). With an {@code open-drain} first driver the
 *     rising edge is the RC charge of the pull-up, so the settle time is at least 5 × R_p × C_b plus
 *     the longest full ramp (R_p and C_b as in "Open-drain buses" below); slow buses reach the
 *     2 µs cap (Standard-mode with R_p·C_b above 0.4 µs): give {@code settle} yourself.</li>
 * <li>Periodic clock ({@code period}, {@code cycles}): edges every half period, alternating,
 *     starting with the first listed direction; each full ramp must be shorter than half a
 *     period. Only the last cycle's two edges are measured; their windows end at the next edge or
 *     the stop time ({@code lead-in + cycles × period}).</li>
 * <li>{@code simulation.stop} overrides the stop time; windows are cut at it and an edge that would
 *     start after it is dropped with a warning.</li>
 * <li>Maximum time step ({@code step: auto}): {@code min(shortest full ramp / 20, shortest segment
 *     delay / 4)} over the segments that stay lines; ngspice.md §5 advises at most {@code min(tr/10, TD/2)}, this takes twice that
 *     margin. {@code simulation.step} overrides it. The output step equals the maximum step.</li>
 * </ul>
 *
 * <h2>Open-drain buses</h2>
 * When the first driver is {@code open-drain} ({@link OpenDrainDriverModel}), its pull-up R_p is the
 * parallel combination of the resistor parts from a net point to a rail other than GND, and the bus
 * capacitance C_b is the sum of the receivers' input capacitance, the capacitor parts from a net point
 * to a rail (GND or a supply, both AC ground), every segment's {@code TD/Z0} (its total capacitance,
 * lines-and-terminations.md §1) and the open-drain drivers' {@code c_out}. The warnings then give the
 * I²C pull-up window ({@link I2cPullUp}) for the modes of the driver's {@code i2c_mode} at the
 * driver's {@code v_high}, and say when the pull-up is outside a window, a window is empty
 * (infeasible) or C_b exceeds a mode's limit. A net with no pull-up gets a warning instead.
 *
 * <h2>Probes and notes</h2>
 * Every driver pin and every receiver pin is recorded (safe node → user name). The circuit notes
 * hold the net name, point label, source file and source hash as raw user text; the deck writer
 * makes them safe.
 */
public final class Elaborator {
    static final double LEAD_IN_MIN = 1e-9;
    static final double ZERO_OHMS = 1e-6;
    private static final int PATH_SEARCH_LIMIT = 200_000;

    /**
     * A lossless segment whose delay is below this fraction of the shortest full ramp is
     * elaborated as a lumped pi section (C/2, L = Z0·TD, C/2 with C = TD/Z0) instead of a line.
     * 1/20 is far below every rule of thumb for treating a trace as a line (the lowest,
     * TD &gt; tr/6, lines-and-terminations.md §3), so the waveform does not change visibly; but
     * ngspice's lossless line with a delay far below the time step, next to conducting clamp
     * diodes, was seen to stall with ever smaller steps (a 12 ps line, 1.1 ns ramp, 3 ps step).
     */
    static final double SHORT_LINE_FRACTION = 1.0 / 20;

    private final Map<String, DriverModel> driverModels = new LinkedHashMap<>();
    private final Map<String, ReceiverModel> receiverModels = new LinkedHashMap<>();

    /** An elaborator that knows the built-in models only. */
    public Elaborator() {
        this(BuiltinModels.drivers(), BuiltinModels.receivers());
    }

    /**
     * An elaborator with the given models (the first model of an id wins).
     *
     * @param drivers   driver models, e.g. built-ins followed by plugins
     * @param receivers receiver models
     */
    public Elaborator(List<? extends DriverModel> drivers, List<? extends ReceiverModel> receivers) {
        drivers.forEach(m -> driverModels.putIfAbsent(m.id(), m));
        receivers.forEach(m -> receiverModels.putIfAbsent(m.id(), m));
    }

    /**
     * Elaborates one net.
     *
     * @param net        the net, its point applied
     * @param pointLabel a label for the point (e.g. {@code typ} or {@code R5/value=22}), for notes
     * @return the circuit, schedule and receivers
     * @throws ElaborationException naming the file, line, element and key of the first problem
     */
    public Elaboration elaborate(Net net, String pointLabel) {
        return new Run(net, pointLabel).elaborate();
    }

    /** The state of one elaboration. */
    private final class Run {
        private final Net net;
        private final String pointLabel;
        private final NetRails rails;
        private final NodeNamer nodes = new NodeNamer();
        private final NodeNamer names = new NodeNamer();
        private final List<Primitive> primitives = new ArrayList<>();
        private final List<String> warnings = new ArrayList<>();
        private final Location netLocation;

        Run(Net net, String pointLabel) {
            this.net = net;
            this.pointLabel = pointLabel;
            this.rails = new NetRails(net.rails());
            this.netLocation = new Location(net.source(), 0, 0);
        }

        Elaboration elaborate() {
            Driver first = net.drivers().get(0);
            DriverModel firstModel = driverModel(first);
            DriverModel.Swing swing = call(first, () -> firstModel.swing(first, rails));
            // Claim the user points first so that their safe names do not depend on internal ones.
            net.rails().keySet().forEach(nodes::node);
            net.elements().forEach(e -> e.points().forEach(nodes::node));

            Schedule schedule = schedule(first, firstModel);
            double maxStep = maxStep(schedule);
            if (!(schedule.stop > maxStep)) {
                throw new ElaborationException(netLocation, "", "simulation.step",
                        "step `" + maxStep + "` s must be shorter than the stop time `" + schedule.stop + "` s");
            }
            for (Map.Entry<String, Double> rail : net.rails().entrySet()) {
                if (!rail.getKey().equals(NetPoint.GROUND)) {
                    primitives.add(new Primitive.DcVoltage(names.fresh("rail_" + rail.getKey()),
                            nodes.node(rail.getKey()), SafeName.GROUND, rail.getValue()));
                }
            }
            Map<String, String> probes = new LinkedHashMap<>();
            for (Driver d : net.drivers()) {
                DriverModel m = driverModel(d);
                Context ctx = new Context(d, schedule);
                call(d, () -> {
                    m.elaborate(d, ctx);
                    return null;
                });
                probes.put(nodes.node(d.pin()), d.pin());
            }
            List<ReceiverProbe> receivers = new ArrayList<>();
            for (Receiver r : net.receivers()) {
                ReceiverModel m = receiverModel(r);
                ReceiverModel.Thresholds th = call(r, () -> m.thresholds(r, rails));
                Context ctx = new Context(r, schedule);
                call(r, () -> {
                    m.elaborate(r, ctx);
                    return null;
                });
                String node = nodes.node(r.pin());
                probes.put(node, r.pin());
                double high = th.supply().map(s -> rails.volts(s).orElse(swing.high())).orElse(swing.high());
                receivers.add(new ReceiverProbe(r.pin(), node, th.vil(), th.vih(), swing.low(), high));
            }
            net.segments().forEach(seg -> segment(seg, schedule.shortestRamp));
            net.parts().forEach(this::part);
            if (firstModel instanceof OpenDrainDriverModel od) {
                call(first, () -> {
                    openDrainNotes(first, od, swing.high());
                    return null;
                });
            }

            Map<String, String> notes = new LinkedHashMap<>();
            notes.put("net", net.name());
            notes.put("point", pointLabel);
            notes.put("source", net.source());
            notes.put("source hash", net.sourceHash());
            Circuit circuit;
            try {
                circuit = new Circuit(title(net.name()), primitives, new Transient(maxStep, schedule.stop, maxStep, net.simulation().isStepAuto()), probes, notes);
            } catch (IllegalArgumentException e) {
                throw new ElaborationException(netLocation, "", "", e.getMessage());
            }
            return new Elaboration(circuit, schedule.events, swing.low(), swing.high(), nodes.node(first.pin()),
                    receivers, warnings);
        }

        private DriverModel driverModel(Driver d) {
            DriverModel m = driverModels.get(d.model());
            if (m == null) {
                throw new ElaborationException(d.location(), d.pin(), "model", "unknown driver model `" + d.model()
                        + "`; expected one of " + String.join(", ", driverModels.keySet()));
            }
            return m;
        }

        private ReceiverModel receiverModel(Receiver r) {
            ReceiverModel m = receiverModels.get(r.model());
            if (m == null) {
                throw new ElaborationException(r.location(), r.pin(), "model", "unknown receiver model `" + r.model()
                        + "`; expected one of " + String.join(", ", receiverModels.keySet()));
            }
            return m;
        }

        /** Runs model code, turning its complaints into located errors. */
        private <T> T call(Element e, Supplier<T> body) {
            try {
                return body.get();
            } catch (ModelParameterException x) {
                throw error(e, x.key(), x.getMessage());
            } catch (ElaborationException x) {
                throw x;
            } catch (IllegalArgumentException | IllegalStateException x) {
                throw error(e, "", x.getMessage());
            }
        }

        private ElaborationException error(Element e, String key, String message) {
            Location loc = key.isEmpty() ? e.location() : e.parameters().locationOf(key);
            if (loc.equals(Location.UNKNOWN)) {
                loc = e.location();
            }
            return new ElaborationException(loc, e.id(), key, message);
        }

        // ---- schedule ----

        private Schedule schedule(Driver first, DriverModel firstModel) {
            Stimulus st = net.stimulus();
            double longestRise = 0;
            double longestFall = 0;
            double shortest = Double.POSITIVE_INFINITY;
            for (Driver d : net.drivers()) {
                DriverModel m = driverModel(d);
                double rise = call(d, () -> m.fullTransition(d, Stimulus.Edge.RISE, rails));
                double fall = call(d, () -> m.fullTransition(d, Stimulus.Edge.FALL, rails));
                if (!(rise > 0) || !(fall > 0) || !Double.isFinite(rise) || !Double.isFinite(fall)) {
                    throw error(d, "rise", "the model gave a transition time that is not positive and finite");
                }
                longestRise = Math.max(longestRise, rise);
                longestFall = Math.max(longestFall, fall);
                shortest = Math.min(shortest, Math.min(rise, fall));
            }
            double longest = Math.max(longestRise, longestFall);
            double delay = call(first, () -> firstModel.delay(first));
            for (Driver d : net.drivers()) {
                double other = call(d, () -> driverModel(d).delay(d));
                if (other != delay) {
                    warnings.add("driver " + d.pin() + ": its delay is ignored; all drivers switch together, timed by the first driver "
                            + first.pin());
                }
            }
            double leadIn = Math.max(LEAD_IN_MIN, 2 * longest) + delay;
            double riseFirst = call(first, () -> firstModel.fullTransition(first, Stimulus.Edge.RISE, rails));
            double fallFirst = call(first, () -> firstModel.fullTransition(first, Stimulus.Edge.FALL, rails));

            List<ScheduledEdge> all = new ArrayList<>();
            List<EdgeEvent> events = new ArrayList<>();
            double stop;
            if (st.edges().isEmpty()) {
                throw new ElaborationException(netLocation, "", "stimulus.edges", "no edges; expected e.g. [rise, fall]");
            }
            if (st.isPeriodic()) {
                double period = st.periodSeconds();
                int cycles = st.cycles();
                if (!(period > 0) || cycles < 1) {
                    throw new ElaborationException(netLocation, "", "stimulus.period",
                            "expected a positive period and at least one cycle, found period `" + period + "` s, cycles `" + cycles + "`");
                }
                if (!(longest < period / 2)) {
                    throw new ElaborationException(netLocation, "", "stimulus.period", "period `" + period
                            + "` s is too short: the full ramp of `" + longest + "` s must be shorter than half a period");
                }
                Stimulus.Edge dir = st.edges().get(0);
                for (int k = 0; k < 2 * cycles; k++) {
                    all.add(new ScheduledEdge(dir, leadIn + k * period / 2));
                    dir = opposite(dir);
                }
                stop = leadIn + cycles * period;
                for (int k = 2 * cycles - 2; k < 2 * cycles; k++) {
                    ScheduledEdge e = all.get(k);
                    double end = k + 1 < all.size() ? all.get(k + 1).start() : stop;
                    events.add(event(e, end, riseFirst, fallFirst));
                }
            } else {
                double settle = st.isSettleAuto() ? autoSettle(first, firstModel, longest) : st.settleSeconds();
                if (!(settle > 0)) {
                    throw new ElaborationException(netLocation, "", "stimulus.settle", "expected a positive settle time, found `" + settle + "` s");
                }
                double t = leadIn;
                Stimulus.Edge previous = null;
                for (Stimulus.Edge dir : st.edges()) {
                    if (dir == previous) {
                        throw new ElaborationException(netLocation, "", "stimulus.edges", "two `" + dir.word()
                                + "` edges in a row; expected the edges to alternate (rise, fall, rise, ...)");
                    }
                    all.add(new ScheduledEdge(dir, t));
                    t += (dir == Stimulus.Edge.RISE ? longestRise : longestFall) + settle;
                    previous = dir;
                }
                stop = t;
                for (int k = 0; k < all.size(); k++) {
                    double end = k + 1 < all.size() ? all.get(k + 1).start() : stop;
                    events.add(event(all.get(k), end, riseFirst, fallFirst));
                }
            }
            SimulationSettings sim = net.simulation();
            if (!sim.isStopAuto()) {
                double given = sim.stopSeconds();
                if (!(given > 0)) {
                    throw new ElaborationException(netLocation, "", "simulation.stop", "expected a positive stop time, found `" + given + "` s");
                }
                List<EdgeEvent> cut = new ArrayList<>();
                for (EdgeEvent e : events) {
                    if (e.start() >= given) {
                        warnings.add("the " + e.direction().word() + " edge at " + e.start() + " s starts after simulation.stop "
                                + given + " s and is not measured");
                    } else {
                        cut.add(new EdgeEvent(e.direction(), e.start(), e.source50(), Math.min(e.end(), given)));
                    }
                }
                if (cut.isEmpty()) {
                    throw new ElaborationException(netLocation, "", "simulation.stop", "stop time `" + given
                            + "` s ends before the first edge starts at `" + events.get(0).start() + "` s");
                }
                events = cut;
                stop = given;
            }
            return new Schedule(List.copyOf(all), List.copyOf(events), stop, shortest);
        }

        private EdgeEvent event(ScheduledEdge e, double end, double riseFirst, double fallFirst) {
            double full = e.direction() == Stimulus.Edge.RISE ? riseFirst : fallFirst;
            return new EdgeEvent(e.direction(), e.start(), e.start() + full / 2, end);
        }

        private double maxStep(Schedule s) {
            SimulationSettings sim = net.simulation();
            if (!sim.isStepAuto()) {
                if (!(sim.stepSeconds() > 0)) {
                    throw new ElaborationException(netLocation, "", "simulation.step", "expected a positive step, found `" + sim.stepSeconds() + "` s");
                }
                return sim.stepSeconds();
            }
            double step = s.shortestRamp / 20;
            for (Segment seg : net.segments()) {
                double td = segmentDelay(seg);
                if (seg.isLossy() || !isElectricallyShort(td, s.shortestRamp)) {
                    step = Math.min(step, td / 4);
                }
            }
            return step;
        }

        /** {@code settle: auto}, see the class comment. */
        private double autoSettle(Driver first, DriverModel model, double longestRamp) {
            double rOut = call(first, () -> model.sourceResistance(first, rails));
            Path path = longestPath(first.pin());
            double capacitance = 0;
            for (Receiver r : net.receivers()) {
                capacitance += call(r, () -> receiverModel(r).inputCapacitance(r));
            }
            for (Part p : net.parts()) {
                if (p.kind() == Part.Kind.CAPACITOR) {
                    capacitance += partValue(p);
                }
            }
            double ringing = 0;
            double z0 = 0;
            if (path.firstZ0 > 0) {
                z0 = path.firstZ0;
                double gammaS = AutoTiming.gamma(rOut, z0);
                double n = Math.ceil(AutoTiming.arrivals(gammaS, 1, z0 / (rOut + z0), AutoTiming.BAND));
                ringing = (2 * n + 1) * path.delay;
            }
            double tau = (rOut + path.seriesOhms + z0) * capacitance;
            double settle = ringing + AutoTiming.RC_CONSTANTS * tau + longestRamp;
            double pullUp = pullUpOhms();
            if (model instanceof OpenDrainDriverModel && Double.isFinite(pullUp)) {
                // The released bus rises by the pull-up's RC charge alone.
                settle = Math.max(settle, AutoTiming.RC_CONSTANTS * pullUp * busCapacitance().total() + longestRamp);
            }
            if (!(settle <= AutoTiming.CAP)) {
                warnings.add("automatic settle time " + (Double.isFinite(settle) ? settle + " s" : "(reflections never decay)")
                        + " capped at " + AutoTiming.CAP + " s; ringing may not have settled before the next edge; set stimulus.settle");
                return AutoTiming.CAP;
            }
            return Math.max(AutoTiming.FLOOR, settle);
        }

        /** The longest simple path from the driver pin to a receiver pin through segments and parts. */
        private Path longestPath(String driverPin) {
            Graph<NetPoint, Element> g = net.graph();
            Set<String> receiverPins = net.receivers().stream().map(Receiver::pin).collect(Collectors.toSet());
            NetPoint start = g.vertexSet().stream().filter(v -> v.name().equals(driverPin)).findFirst().orElseThrow();
            Path best = new Path(0, 0, 0);
            Deque<Frame> stack = new ArrayDeque<>();
            Set<NetPoint> onPath = new HashSet<>();
            stack.push(new Frame(start, 0, 0, 0));
            int steps = 0;
            // Iterative depth-first search over simple paths; nets are small, the limit guards meshes.
            while (!stack.isEmpty()) {
                Frame f = stack.peek();
                if (f.edges == null) {
                    f.edges = new ArrayList<>(g.edgesOf(f.point));
                    onPath.add(f.point);
                    if (receiverPins.contains(f.point.name()) && f.delay >= best.delay) {
                        best = new Path(f.delay, f.seriesOhms, f.firstZ0);
                    }
                }
                if (f.next >= f.edges.size() || ++steps > PATH_SEARCH_LIMIT) {
                    onPath.remove(f.point);
                    stack.pop();
                    continue;
                }
                Element e = f.edges.get(f.next++);
                if (!(e instanceof Segment || e instanceof Part)) {
                    continue;
                }
                NetPoint other = Graphs.getOppositeVertex(g, e, f.point);
                if (other.kind() == NetPoint.Kind.RAIL || onPath.contains(other)) {
                    continue;
                }
                double delay = f.delay;
                double series = f.seriesOhms;
                double z0 = f.firstZ0;
                if (e instanceof Segment s) {
                    delay += segmentDelay(s);
                    z0 = z0 > 0 ? z0 : segmentZ0(s);
                } else if (e instanceof Part p && p.kind() == Part.Kind.RESISTOR) {
                    series += partValue(p);
                }
                stack.push(new Frame(other, delay, series, z0));
            }
            if (steps > PATH_SEARCH_LIMIT) {
                double total = net.segments().stream().mapToDouble(this::segmentDelay).sum();
                warnings.add("the net has too many paths to search; the automatic settle time uses the sum of all segment delays");
                return new Path(total, best.seriesOhms, best.firstZ0);
            }
            return best;
        }

        // ---- open-drain buses ----

        private boolean isRail(String point) {
            return point.equals(NetPoint.GROUND) || net.rails().containsKey(point);
        }

        /** Resistor parts from a net point to a rail other than GND. */
        private List<Part> pullUps() {
            List<Part> out = new ArrayList<>();
            for (Part p : net.parts()) {
                if (p.kind() == Part.Kind.RESISTOR && isRail(p.a()) != isRail(p.b())) {
                    String rail = isRail(p.a()) ? p.a() : p.b();
                    if (!rail.equals(NetPoint.GROUND)) {
                        out.add(p);
                    }
                }
            }
            return out;
        }

        /** The parallel resistance of the pull-ups (ohm); NaN when there are none. */
        private double pullUpOhms() {
            List<Part> ups = pullUps();
            if (ups.isEmpty()) {
                return Double.NaN;
            }
            double g = 0;
            for (Part p : ups) {
                g += 1 / Math.max(partValue(p), ZERO_OHMS);
            }
            return 1 / g;
        }

        private BusCapacitance busCapacitance() {
            double inputs = 0;
            for (Receiver r : net.receivers()) {
                inputs += call(r, () -> receiverModel(r).inputCapacitance(r));
            }
            double parts = 0;
            for (Part p : net.parts()) {
                if (p.kind() == Part.Kind.CAPACITOR && isRail(p.a()) != isRail(p.b())) {
                    parts += partValue(p);
                }
            }
            double lines = 0;
            for (Segment s : net.segments()) {
                lines += segmentDelay(s) / segmentZ0(s);
            }
            double pins = 0;
            for (Driver d : net.drivers()) {
                if (driverModel(d) instanceof OpenDrainDriverModel od) {
                    pins += call(d, () -> od.outputCapacitance(d));
                }
            }
            return new BusCapacitance(inputs, parts, lines, pins);
        }

        /** The I²C pull-up window warnings of an open-drain net (see the class comment). */
        private void openDrainNotes(Driver first, OpenDrainDriverModel model, double vdd) {
            List<Part> ups = pullUps();
            if (ups.isEmpty()) {
                warnings.add("open-drain driver " + first.pin() + " has no pull-up: no resistor part from the net to a rail"
                        + " other than GND, so its rising edges cannot rise; add e.g. `{ ref: R1, kind: resistor, value: 4k7,"
                        + " between: [" + first.pin() + ", VDD] }`");
                return;
            }
            double rp = pullUpOhms();
            String refs = ups.stream().map(Part::ref).collect(Collectors.joining(" ∥ "));
            String pullUpText = (ups.size() == 1 ? "pull-up " : "pull-ups ") + refs + " = " + Quantities.ohms(rp);
            for (Part p : ups) {
                String rail = isRail(p.a()) ? p.a() : p.b();
                double railVolts = rails.volts(rail).orElse(vdd);
                if (railVolts != vdd) {
                    warnings.add("pull-up " + p.ref() + " goes to " + rail + " (" + railVolts + " V) but the open-drain driver "
                            + first.pin() + " has v_high " + vdd + " V; the measurements use v_high as the high rail");
                }
            }
            String mode = model.i2cMode(first);
            if (mode.equals("none")) {
                return;
            }
            BusCapacitance cb = busCapacitance();
            if (!(cb.total() > 0)) {
                warnings.add("open-drain net: the bus capacitance is 0, so no I²C pull-up window can be given");
                return;
            }
            warnings.add("open-drain bus: C_b = " + Quantities.picofarads(cb.total()) + " (inputs " + Quantities.picofarads(cb.inputs)
                    + ", capacitors " + Quantities.picofarads(cb.parts) + ", lines " + Quantities.picofarads(cb.lines)
                    + ", driver pins " + Quantities.picofarads(cb.pins) + "); " + pullUpText + " to " + vdd + " V");
            for (I2cPullUp.Mode m : I2cPullUp.Mode.values()) {
                if (!mode.equals("all") && !mode.equals(m.word())) {
                    continue;
                }
                if (!(vdd > I2cPullUp.vOlMax(vdd))) {
                    warnings.add("I²C " + m.displayName() + ": no pull-up window, v_high " + vdd + " V is not above V_OL(max)");
                    continue;
                }
                I2cPullUp.Window w = I2cPullUp.window(m, vdd, cb.total());
                String window = "[" + Quantities.ohms1(w.rMinOhm()) + ", " + Quantities.ohms1(w.rMaxOhm()) + "]";
                String limits = " (t_r ≤ " + Math.round(m.riseMaxS() * 1e9) + " ns, I_OL " + Math.round(m.sinkCurrentA() * 1e3)
                        + " mA at V_OL " + I2cPullUp.vOlMax(vdd) + " V, NXP UM10204 §7.1)";
                if (!w.capacitanceWithinLimit()) {
                    warnings.add("I²C " + m.displayName() + ": C_b = " + Quantities.picofarads(cb.total()) + " exceeds the mode's "
                            + Quantities.picofarads(m.busCapacitanceMaxF()) + " limit");
                }
                if (!w.feasible()) {
                    warnings.add("I²C " + m.displayName() + ": no pull-up fits (infeasible): R_p(max) " + Quantities.ohms1(w.rMaxOhm())
                            + " is below R_p(min) " + Quantities.ohms1(w.rMinOhm()) + " at C_b = " + Quantities.picofarads(cb.total())
                            + limits);
                } else if (!w.contains(rp)) {
                    warnings.add(pullUpText + " is outside the " + m.displayName() + " window " + window + limits);
                } else {
                    warnings.add("note: " + pullUpText + " is inside the " + m.displayName() + " window " + window + limits);
                }
            }
        }

        // ---- elements ----

        private void segment(Segment s, double shortestRamp) {
            double z0 = segmentZ0(s);
            double td = segmentDelay(s);
            String name = names.fresh(s.id());
            String a = nodes.node(s.from());
            String b = nodes.node(s.to());
            if (!s.isLossy() && isElectricallyShort(td, shortestRamp)) {
                // Pi section: the same total L = Z0·TD and C = TD/Z0 as the line (lines-and-terminations.md §1).
                double c = td / z0;
                primitives.add(new Primitive.Capacitor(names.fresh(s.id() + "_ca"), a, SafeName.GROUND, c / 2));
                primitives.add(new Primitive.Inductor(name, a, b, z0 * td));
                primitives.add(new Primitive.Capacitor(names.fresh(s.id() + "_cb"), b, SafeName.GROUND, c / 2));
                return;
            }
            if (!s.isLossy()) {
                primitives.add(new Primitive.LosslessLine(name, a, SafeName.GROUND, b, SafeName.GROUND, z0, td));
                return;
            }
            Parameters p = s.parameters();
            if (!p.has("length")) {
                throw new ElaborationException(s.location(), s.id(), "length",
                        "a lossy segment (r_per_m or g_per_m given) needs `length`; expected a length such as 60mm");
            }
            double len = number(s, "length");
            double r = number(s, "r_per_m", 0);
            double gp = number(s, "g_per_m", 0);
            if (!(len > 0) || r < 0 || gp < 0) {
                throw new ElaborationException(s.location(), s.id(), "length", "expected a positive length and losses ≥ 0");
            }
            primitives.add(new Primitive.LossyLine(name, a, SafeName.GROUND, b, SafeName.GROUND,
                    r, z0 * td / len, gp, td / (z0 * len), len));
        }

        private void part(Part p) {
            double v = partValue(p);
            String name = names.fresh(p.ref());
            String a = nodes.node(p.a());
            String b = nodes.node(p.b());
            switch (p.kind()) {
                case RESISTOR:
                    primitives.add(new Primitive.Resistor(name, a, b, v == 0 ? ZERO_OHMS : v));
                    break;
                case CAPACITOR:
                    requirePositive(p, v);
                    primitives.add(new Primitive.Capacitor(name, a, b, v));
                    break;
                case INDUCTOR:
                    requirePositive(p, v);
                    primitives.add(new Primitive.Inductor(name, a, b, v));
                    break;
                default:
                    throw new IllegalStateException("unknown part kind " + p.kind());
            }
        }

        private void requirePositive(Part p, double v) {
            if (!(v > 0)) {
                throw new ElaborationException(p.parameters().locationOf("value"), p.ref(), "value",
                        "a " + p.kind().word() + " must have a positive value, found `" + v + "`");
            }
        }

        private double partValue(Part p) {
            double v = number(p, "value");
            if (v < 0) {
                throw new ElaborationException(locationOf(p, "value"), p.ref(), "value",
                        "expected a value ≥ 0, found `" + v + "`");
            }
            return v;
        }

        private boolean isElectricallyShort(double td, double shortestRamp) {
            return td < SHORT_LINE_FRACTION * shortestRamp;
        }

        private double segmentZ0(Segment s) {
            double z0 = number(s, "z0");
            if (!(z0 > 0)) {
                throw new ElaborationException(locationOf(s, "z0"), s.id(), "z0", "expected a positive impedance, found `" + z0 + "`");
            }
            return z0;
        }

        private double segmentDelay(Segment s) {
            double td = call(s, s::delaySeconds);
            if (!(td > 0) || !Double.isFinite(td)) {
                String key = s.parameters().has("delay") ? "delay" : "length";
                throw new ElaborationException(locationOf(s, key), s.id(), key, "expected a positive delay, found `" + td + "` s");
            }
            return td;
        }

        private double number(Element e, String key) {
            Value v = e.parameters().get(key).orElse(null);
            if (v instanceof Value.Number n) {
                return n.si();
            }
            throw new ElaborationException(locationOf(e, key), e.id(), key,
                    v == null ? "`" + key + "` is missing; expected a number" : "expected a number, found `" + v.display() + "`");
        }

        private double number(Element e, String key, double fallback) {
            return e.parameters().has(key) ? number(e, key) : fallback;
        }

        private Location locationOf(Element e, String key) {
            Location loc = e.parameters().locationOf(key);
            return loc.equals(Location.UNKNOWN) ? e.location() : loc;
        }

        /** The context handed to one driver or receiver model. */
        private final class Context implements DriverContext, ReceiverContext {
            private final Element element;
            private final Schedule schedule;

            Context(Element element, Schedule schedule) {
                this.element = element;
                this.schedule = schedule;
            }

            @Override
            public String pinNode() {
                return nodes.node(element.points().get(0));
            }

            @Override
            public String groundNode() {
                return SafeName.GROUND;
            }

            @Override
            public NetRails rails() {
                return rails;
            }

            @Override
            public String railNode(String rail) {
                if (rails.volts(rail).isEmpty()) {
                    throw new ModelParameterException("", "rail `" + rail + "` is not declared under rails; expected one of "
                            + String.join(", ", net.rails().keySet()));
                }
                return nodes.node(rail);
            }

            @Override
            public List<ScheduledEdge> edges() {
                return schedule.all;
            }

            @Override
            public double stopTime() {
                return schedule.stop;
            }

            @Override
            public String newNode(String hint) {
                return nodes.fresh(hint);
            }

            @Override
            public String newName(String hint) {
                return names.fresh(hint);
            }

            @Override
            public void add(Primitive primitive) {
                primitives.add(java.util.Objects.requireNonNull(primitive, "primitive"));
            }

            @Override
            public void warn(String message) {
                warnings.add(element.id() + ": " + message);
            }
        }
    }

    private static Stimulus.Edge opposite(Stimulus.Edge e) {
        return e == Stimulus.Edge.RISE ? Stimulus.Edge.FALL : Stimulus.Edge.RISE;
    }

    /** A safe circuit title from the net name: {@code [A-Za-z0-9 _.-]}, starting with a letter or digit. */
    static String title(String netName) {
        StringBuilder b = new StringBuilder();
        for (char c : netName.toCharArray()) {
            boolean ok = (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '_' || c == '-' || c == '.';
            b.append(ok ? c : '_');
        }
        String t = b.toString();
        if (t.isEmpty() || !Character.isLetterOrDigit(t.charAt(0))) {
            t = "net " + t;
        }
        return t.length() > 60 ? t.substring(0, 60) : t;
    }

    private record Schedule(List<ScheduledEdge> all, List<EdgeEvent> events, double stop, double shortestRamp) {
    }

    private record Path(double delay, double seriesOhms, double firstZ0) {
    }

    /** The bus capacitance of an open-drain net by origin (F). */
    private record BusCapacitance(double inputs, double parts, double lines, double pins) {
        double total() {
            return inputs + parts + lines + pins;
        }
    }

    /** One step of the path search. */
    private static final class Frame {
        final NetPoint point;
        final double delay;
        final double seriesOhms;
        final double firstZ0;
        List<Element> edges;
        int next;

        Frame(NetPoint point, double delay, double seriesOhms, double firstZ0) {
            this.point = point;
            this.delay = delay;
            this.seriesOhms = seriesOhms;
            this.firstZ0 = firstZ0;
        }
    }
}
