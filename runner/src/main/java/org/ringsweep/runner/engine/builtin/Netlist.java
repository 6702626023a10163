package org.ringsweep.runner.engine.builtin;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.circuit.DiodeModel;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.SafeName;

/**
 * A {@link Circuit} compiled to unknown indices for modified nodal analysis: node voltages first
 * ({@code 0 … nodeCount−1}), then one branch current per voltage source and per inductor. Ground
 * is index −1; a node held by a DC source to ground is not an unknown but fixed, index −2 − f
 * ({@code eliminateFixedNodes}). A lossy line is replaced here by lossless sections with lumped loss
 * ({@link #sectionsFor}); a diode's series resistance gets an internal node (its junction and
 * depletion charge sit behind it, as in SPICE). Immutable after
 * construction; shared by nothing but its own solve.
 */
final class Netlist {
    /** A lossy line is cut into sections each losing at most this much (neper) of a travelling wave. */
    static final double LOSS_PER_SECTION = 0.001;
    /** Fewest sections of a lossy line: the lumped loss is spread along it, not put at its ends. */
    static final int MIN_SECTIONS = 8;
    /** Most sections of a lossy line (a very lossy line gets more loss per section). */
    static final int MAX_SECTIONS = 200;

    /** Resistors, including diode series resistances and the lumped loss of lossy lines. */
    final List<int[]> resistorNodes = new ArrayList<>();
    final List<Double> resistorSiemens = new ArrayList<>();
    final List<int[]> capacitorNodes = new ArrayList<>();
    final List<Double> capacitorFarads = new ArrayList<>();
    /** Inductors: nodes a, b and the branch index of their current (a → b). */
    final List<int[]> inductors = new ArrayList<>();
    final List<Double> inductorHenries = new ArrayList<>();
    /** Voltage sources: plus, minus and the branch index of their current. */
    final List<int[]> sources = new ArrayList<>();
    final List<Primitive> sourceElements = new ArrayList<>();
    final List<int[]> timedResistorNodes = new ArrayList<>();
    final List<Primitive.TimedResistor> timedResistors = new ArrayList<>();
    /** Lossless lines (also the sections of lossy ones): a, aRef, b, bRef. */
    final List<int[]> lineNodes = new ArrayList<>();
    final List<Double> lineZ0 = new ArrayList<>();
    final List<Double> lineDelay = new ArrayList<>();
    /** Diodes: the junction's anode (internal when RS &gt; 0) and cathode. */
    final List<int[]> diodeNodes = new ArrayList<>();
    final List<DiodeModel> diodeModels = new ArrayList<>();
    /** Table-driven current sources: plus, minus, controlling plus, controlling minus. */
    final List<int[]> tableNodes = new ArrayList<>();
    final List<Primitive.TableCurrent> tables = new ArrayList<>();

    private final Map<String, Integer> nodeIndex = new LinkedHashMap<>();
    private final List<String> nodeNames = new ArrayList<>();
    private int branches;

    /**
     * Compiles a circuit.
     *
     * @throws UnsupportedElementException naming the first element this engine cannot simulate
     */
    Netlist(Circuit circuit) {
        new TreeSet<>(circuit.nodes()).forEach(this::node);
        List<int[]> pendingBranch = new ArrayList<>();
        for (Primitive p : circuit.primitives()) {
            if (p instanceof Primitive.Resistor r) {
                resistor(node(r.a()), node(r.b()), 1 / r.ohms());
            } else if (p instanceof Primitive.Capacitor c) {
                capacitorNodes.add(new int[] {node(c.a()), node(c.b())});
                capacitorFarads.add(c.farads());
            } else if (p instanceof Primitive.Inductor l) {
                int[] e = {node(l.a()), node(l.b()), -1};
                inductors.add(e);
                pendingBranch.add(e);
                inductorHenries.add(l.henries());
            } else if (p instanceof Primitive.DcVoltage v) {
                int[] e = {node(v.plus()), node(v.minus()), -1};
                sources.add(e);
                pendingBranch.add(e);
                sourceElements.add(v);
            } else if (p instanceof Primitive.PwlVoltage v) {
                int[] e = {node(v.plus()), node(v.minus()), -1};
                sources.add(e);
                pendingBranch.add(e);
                sourceElements.add(v);
            } else if (p instanceof Primitive.TimedResistor r) {
                timedResistorNodes.add(new int[] {node(r.a()), node(r.b())});
                timedResistors.add(r);
            } else if (p instanceof Primitive.LosslessLine t) {
                line(node(t.a()), node(t.aRef()), node(t.b()), node(t.bRef()), t.z0(), t.delay());
            } else if (p instanceof Primitive.LossyLine t) {
                lossyLine(t);
            } else if (p instanceof Primitive.Diode d) {
                diode(d);
            } else if (p instanceof Primitive.TableCurrent tc) {
                tableNodes.add(new int[] {node(tc.plus()), node(tc.minus()), node(tc.ctrlPlus()), node(tc.ctrlMinus())});
                tables.add(tc);
            } else if (p instanceof Primitive.SubcircuitText s) {
                throw new UnsupportedElementException("element `" + s.name() + "` is sub-circuit text, which only ngspice"
                        + " can simulate; the built-in engine solves resistors, capacitors, inductors, DC and PWL sources,"
                        + " timed resistors, table-driven current sources, transmission lines and diodes");
            } else {
                throw new UnsupportedElementException("element `" + p.name() + "` (" + p.getClass().getSimpleName()
                        + ") is not supported by the built-in engine");
            }
        }
        eliminateFixedNodes(pendingBranch);
        // Branch currents are numbered after every node, internal nodes included.
        int next = nodeNames.size();
        for (int[] e : pendingBranch) {
            e[2] = next++;
        }
        branches = pendingBranch.size();
    }

    /**
     * Takes the nodes held by a DC source to ground (the rails, an IBIS buffer's clamp and pull-up
     * references) out of the unknowns: their voltage is known, so each such source and its node
     * leave the system, which is solved for the rest with the known voltages on the right-hand
     * side. A board net's matrix loses a third of its unknowns this way, and the solve its work.
     * The first source on a node fixes it; a second one stays a source (and the matrix is singular, as it is with both).
     */
    private void eliminateFixedNodes(List<int[]> pendingBranch) {
        int[] map = new int[nodeNames.size()];
        Arrays.fill(map, Integer.MIN_VALUE);
        for (int k = 0; k < sources.size(); k++) {
            int[] e = sources.get(k);
            if (sourceElements.get(k) instanceof Primitive.DcVoltage v && e[1] == -1 && e[0] >= 0
                    && map[e[0]] == Integer.MIN_VALUE) {
                map[e[0]] = -2 - fixedVolts.size();
                fixedVolts.add(v.volts());
                pendingBranch.remove(e);
                sources.remove(k);
                sourceElements.remove(k);
                k--;
            }
        }
        if (fixedVolts.isEmpty()) {
            return;
        }
        List<String> kept = new ArrayList<>();
        for (int i = 0; i < map.length; i++) {
            if (map[i] == Integer.MIN_VALUE) {
                map[i] = kept.size();
                kept.add(nodeNames.get(i));
            }
        }
        nodeNames.clear();
        nodeNames.addAll(kept);
        nodeIndex.replaceAll((name, i) -> map[i]);
        for (List<int[]> list : List.of(resistorNodes, capacitorNodes, timedResistorNodes, lineNodes, diodeNodes, tableNodes)) {
            list.forEach(e -> remap(e, e.length, map));
        }
        inductors.forEach(e -> remap(e, 2, map));
        sources.forEach(e -> remap(e, 2, map));
    }

    private static void remap(int[] e, int count, int[] map) {
        for (int i = 0; i < count; i++) {
            e[i] = e[i] < 0 ? e[i] : map[e[i]];
        }
    }

    /** The volts of each fixed node: index −2 − f is held at {@code fixedVolts.get(f)}. */
    final List<Double> fixedVolts = new ArrayList<>();

    /** Number of node voltages (ground excluded, internal nodes included). */
    int nodeCount() {
        return nodeNames.size();
    }

    /** Number of unknowns of the transient system: nodes and branch currents. */
    int size() {
        return nodeNames.size() + branches;
    }

    /** The index of a circuit node; −1 for ground, −2 − f for the f-th fixed node ({@link #fixedVolts}). */
    int indexOf(String node) {
        if (SafeName.GROUND.equals(node)) {
            return -1;
        }
        Integer i = nodeIndex.get(node);
        if (i == null) {
            throw new IllegalArgumentException("no node `" + node + "` in the circuit");
        }
        return i;
    }

    /** A readable name of an unknown, for messages. */
    String describe(int unknown) {
        if (unknown < nodeNames.size()) {
            return "node `" + nodeNames.get(unknown) + "`";
        }
        return "a branch current (voltage source, inductor or line) #" + (unknown - nodeNames.size());
    }

    /** Whether a lossy line was cut into sections (whose lumped loss the history interpolation rounds off at long steps). */
    boolean hasLossyLine() {
        return hasLossyLine;
    }

    private boolean hasLossyLine;

    /** Longest line (or line section) delay (s), or 0 without lines. */
    double longestDelay() {
        return lineDelay.stream().mapToDouble(Double::doubleValue).max().orElse(0);
    }

    /** Shortest line (or line section) delay (s), or +∞ without lines. */
    double shortestDelay() {
        return lineDelay.stream().mapToDouble(Double::doubleValue).min().orElse(Double.POSITIVE_INFINITY);
    }

    /**
     * The number of lossless sections for a lossy line: enough that each loses at most
     * {@value #LOSS_PER_SECTION} Np, with the low-loss attenuation {@code α·len = R·len/(2Z0) + G·len·Z0/2}
     * (lines-and-terminations.md §1), between {@value #MIN_SECTIONS} and {@value #MAX_SECTIONS}.
     */
    static int sectionsFor(Primitive.LossyLine t) {
        double z0 = Math.sqrt(t.lPerM() / t.cPerM());
        double loss = t.rPerM() * t.length() / (2 * z0) + t.gPerM() * t.length() * z0 / 2;
        int n = (int) Math.ceil(loss / LOSS_PER_SECTION);
        return Math.max(MIN_SECTIONS, Math.min(MAX_SECTIONS, n));
    }

    private int node(String name) {
        if (SafeName.GROUND.equals(name)) {
            return -1;
        }
        return nodeIndex.computeIfAbsent(name, k -> {
            nodeNames.add(k);
            return nodeNames.size() - 1;
        });
    }

    private int internalNode(String label) {
        nodeNames.add(label);
        return nodeNames.size() - 1;
    }

    private void resistor(int a, int b, double siemens) {
        resistorNodes.add(new int[] {a, b});
        resistorSiemens.add(siemens);
    }

    private void line(int a, int aRef, int b, int bRef, double z0, double delay) {
        lineNodes.add(new int[] {a, aRef, b, bRef});
        lineZ0.add(z0);
        lineDelay.add(delay);
    }

    /**
     * N lossless sections of Z0 = √(L/C) and delay TD/N; each section has half its series
     * resistance R·len/N in front and half behind, and half its shunt conductance G·len/N on each
     * of its two ports. Port 1 sides refer to {@code aRef}, port 2 sides to {@code bRef}.
     */
    private void lossyLine(Primitive.LossyLine t) {
        hasLossyLine = true;
        int n = sectionsFor(t);
        double z0 = Math.sqrt(t.lPerM() / t.cPerM());
        double delay = t.length() * Math.sqrt(t.lPerM() * t.cPerM()) / n;
        double rHalf = t.rPerM() * t.length() / n / 2;
        double gHalf = t.gPerM() * t.length() / n / 2;
        int aRef = node(t.aRef());
        int bRef = node(t.bRef());
        int from = node(t.a());
        int end = node(t.b());
        for (int k = 0; k < n; k++) {
            int to = k == n - 1 ? end : internalNode(t.name() + "#" + (k + 1));
            int p = from;
            int q = to;
            if (rHalf > 0) {
                p = internalNode(t.name() + "#" + k + "p");
                q = internalNode(t.name() + "#" + k + "q");
                resistor(from, p, 1 / rHalf);
                resistor(q, to, 1 / rHalf);
            }
            if (gHalf > 0) {
                resistor(p, aRef, gHalf);
                resistor(q, bRef, gHalf);
            }
            line(p, aRef, q, bRef, z0, delay);
            from = to;
        }
    }

    private void diode(Primitive.Diode d) {
        DiodeModel m = d.model();
        int anode = node(d.anode());
        int junction = anode;
        if (m.rs() > 0) {
            junction = internalNode(d.name() + "#junction");
            resistor(anode, junction, 1 / m.rs());
        }
        diodeNodes.add(new int[] {junction, node(d.cathode())});
        diodeModels.add(m);
    }
}
