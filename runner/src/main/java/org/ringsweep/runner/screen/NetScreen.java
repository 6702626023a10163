package org.ringsweep.runner.screen;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import org.jgrapht.Graph;
import org.jgrapht.GraphPath;
import org.jgrapht.alg.shortestpath.DijkstraShortestPath;
import org.jgrapht.graph.DefaultWeightedEdge;
import org.jgrapht.graph.WeightedPseudograph;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetPoint;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.net.Segment;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.runner.sweep.ESeries;

/**
 * The analytic pre-screen of a net, no simulation (lines-and-terminations.md):
 * <ul>
 * <li>t_r: the 10–90 % time of the driver's linear ramp, {@code 0.8 × full transition} (for the
 * built-in ramp the given {@code rise} converted from its {@code edge_ref}); dV/dt = swing over
 * the full transition (§6);</li>
 * <li>knee frequency {@code 0.5/t_r} [Johnson &amp; Graham ch. 1] and bandwidth {@code 0.35/t_r}
 * [Bogatin] (§3);</li>
 * <li>path delays over segments (parts count zero delay; parts to a rail are not paths);
 * the longest driver-to-receiver delay against t_r classified by {@link LineClass} (§3);</li>
 * <li>on the path to the farthest receiver: Z0 of its longest segment, Rs = driver output
 * resistance + series resistors on the path (treated as at the source), launch
 * {@code Vi = Vs·Z0/(Rs + Z0)}, Γs = (Rs − Z0)/(Rs + Z0), first far-end step {@code Vi·(1 + ΓL)}
 * with ΓL = +1 for high-impedance CMOS inputs (§2);</li>
 * <li>the series resistor {@code Z0 − r_out} and the nearest E24 value (§4, IEC 60063).</li>
 * </ul>
 * Only the first driver of a net is screened. For an {@code open-drain} driver the I²C pull-up
 * window (R_p(min) from V_DD, V_OL and I_OL, R_p(max) from the rise-time limit and the bus
 * capacitance, per I²C mode: UM10204 §7.1) is taken from the elaboration, which computes it
 * from the net's pull-up resistor, input, pin and line capacitances.
 */
public final class NetScreen {
    private final ModelCatalog catalog;

    /** @param catalog the models nets may name */
    public NetScreen(ModelCatalog catalog) {
        this.catalog = Objects.requireNonNull(catalog, "catalog");
    }

    /**
     * Screens one net.
     *
     * @param net  the net (validated, as loaded)
     * @param file the file it came from, for the record
     * @throws org.ringsweep.api.model.ModelParameterException on a bad driver parameter
     */
    public ScreenResult screen(Net net, String file) {
        List<String> notes = new ArrayList<>();
        Driver driver = net.drivers().get(0);
        if (net.drivers().size() > 1) {
            notes.add("only the first driver " + driver.pin() + " is screened");
        }
        DriverModel model = (DriverModel) catalog.find(ModelDescriptor.Role.DRIVER, driver.model())
                .orElseThrow(() -> new IllegalStateException("model " + driver.model() + " vanished from the catalog"));
        NetRails rails = new NetRails(net.rails());
        DriverModel.Swing swing = model.swing(driver, rails);
        double vs = swing.high() - swing.low();
        double full = model.fullTransition(driver, Stimulus.Edge.RISE, rails);
        double tr = 0.8 * full;
        String edgeRef = driver.parameters().get("edge_ref").map(v -> v.display()).orElse("10-90");
        double riseGiven = driver.parameters().number("rise", Double.NaN);
        double rOut = model.sourceResistance(driver, rails);

        Graph<String, DefaultWeightedEdge> g = new WeightedPseudograph<>(DefaultWeightedEdge.class);
        java.util.Map<DefaultWeightedEdge, Object> elementOf = new java.util.HashMap<>();
        double total = 0;
        for (Segment s : net.segments()) {
            total += s.delaySeconds();
            elementOf.put(edge(g, s.from(), s.to(), s.delaySeconds()), s);
        }
        for (Part p : net.parts()) {
            if (!net.rails().containsKey(p.a()) && !net.rails().containsKey(p.b())
                    && !p.a().equals(NetPoint.GROUND) && !p.b().equals(NetPoint.GROUND)) {
                elementOf.put(edge(g, p.a(), p.b(), 0), p);
            } else if (p.kind() == Part.Kind.RESISTOR) {
                notes.add("resistor " + p.ref() + " to a rail: ΓL = +1 overstates the first far-end step");
            }
        }
        g.addVertex(driver.pin());
        DijkstraShortestPath<String, DefaultWeightedEdge> paths = new DijkstraShortestPath<>(g);
        double longest = -1;
        Receiver farthest = null;
        GraphPath<String, DefaultWeightedEdge> path = null;
        for (Receiver r : net.receivers()) {
            g.addVertex(r.pin());
            GraphPath<String, DefaultWeightedEdge> p = paths.getPath(driver.pin(), r.pin());
            if (p != null && p.getWeight() > longest) {
                longest = p.getWeight();
                farthest = r;
                path = p;
            }
        }
        double z0 = Double.NaN;
        double maxDelay = -1;
        double rSeries = 0;
        for (DefaultWeightedEdge e : path == null ? List.<DefaultWeightedEdge>of() : path.getEdgeList()) {
            Object el = elementOf.get(e);
            if (el instanceof Segment s && s.delaySeconds() > maxDelay) {
                maxDelay = s.delaySeconds();
                z0 = s.z0();
            } else if (el instanceof Part p && p.kind() == Part.Kind.RESISTOR) {
                rSeries += p.value();
            }
        }
        if (Double.isNaN(z0)) {
            notes.add("no segment between the driver and a receiver: no line figures");
        }
        if (net.receivers().stream().anyMatch(r -> !r.model().equals("cmos"))) {
            notes.add("ΓL = +1 assumes high-impedance inputs; some receivers use other models");
        }
        double rs = rOut + rSeries;
        double gammaSource = (rs - z0) / (rs + z0);
        double gammaLoad = 1;
        double launch = vs * z0 / (rs + z0);
        double far = launch * (1 + gammaLoad);
        double suggested = z0 - rOut;
        double e24 = suggested > 0 ? ESeries.nearest(ESeries.Series.E24, suggested) : Double.NaN;
        double ratio = Math.max(0, longest) / tr;
        List<String> pullUp = new ArrayList<>();
        if (driver.model().equals(org.ringsweep.generators.models.BuiltinModels.OPEN_DRAIN)) {
            try {
                new org.ringsweep.generators.elaborate.Elaborator().elaborate(net, "screen").warnings().stream()
                        .filter(w -> w.contains("window") || w.contains("pull-up") || w.contains("bus capacitance"))
                        .forEach(pullUp::add);
            } catch (RuntimeException e) {
                notes.add("pull-up window not computed: " + e.getMessage());
            }
        }
        return new ScreenResult(net.name(), file, driver.pin(), edgeRef, riseGiven, tr, vs, vs / full, 0.5 / tr, 0.35 / tr,
                total, Math.max(0, longest), farthest == null ? "" : farthest.pin(), ratio, LineClass.of(ratio), z0, rOut,
                rSeries, gammaSource, gammaLoad, launch, far, far - vs, suggested > 0 ? suggested : Double.NaN, e24, notes, pullUp);
    }

    private static DefaultWeightedEdge edge(Graph<String, DefaultWeightedEdge> g, String a, String b, double w) {
        g.addVertex(a);
        g.addVertex(b);
        DefaultWeightedEdge e = g.addEdge(a, b);
        g.setEdgeWeight(e, w);
        return e;
    }

    /**
     * Ranks by risk, most at risk first: by class (transmission line, borderline, lumped), then
     * by the first far-end overshoot past the final level (V, larger first), then by TD/t_r.
     * A lumped net's bounce figures are not meaningful (the reflections hide in the edge), so the
     * class comes first.
     */
    public static List<ScreenResult> rank(List<ScreenResult> results) {
        List<ScreenResult> sorted = new ArrayList<>(results);
        sorted.sort(Comparator.comparing((ScreenResult r) -> r.lineClass().ordinal()).reversed()
                .thenComparing(Comparator.comparingDouble((ScreenResult r) -> Double.isNaN(r.overshootFirst()) ? Double.NEGATIVE_INFINITY : r.overshootFirst()).reversed())
                .thenComparing(Comparator.comparingDouble(ScreenResult::ratio).reversed()));
        return List.copyOf(sorted);
    }
}
