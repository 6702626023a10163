package org.ringsweep.generators.models;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.model.DriverContext;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.ElaborationContext;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.model.ScheduledEdge;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.generators.ibis.IbisCorner;
import org.ringsweep.generators.ibis.IbisModel;
import org.ringsweep.generators.ibis.IbisRamp;

/**
 * The built-in {@code ibis} driver: a behavioural buffer built from an IBIS model's tables
 * (impedance-and-standards.md §7, "Behavioural SPICE build").
 *
 * <p>Pad current into the buffer {@code = ku(t)·Ipu(Vcc − Vpad) + kd(t)·Ipd(Vpad − Vgnd) +
 * Ipc(Vpc − Vpad) + Igc(Vpad − Vgc)}: each V–I table is a {@link Primitive.TableCurrent} (IBIS
 * currents are positive into the pin; the pull-up and POWER clamp tables are Vcc-relative), the
 * clamps unscaled, and {@code C_comp} from the pad to GND. The four references come from the
 * file ({@code [Pullup Reference]} etc., else {@code [Voltage Range]} and 0 V) in the chosen
 * column, each as the model's own DC source: the buffer does not draw from the net's rails.
 *
 * <p>Switching: the pull-up and pull-down factors {@code ku(t)}, {@code kd(t)} come from the
 * model's {@code [Rising Waveform]}/{@code [Falling Waveform]} tables when it has usable ones
 * (two waveforms per edge: the two-equation method; one: kd = 1 − ku), else from {@code [Ramp]};
 * see {@link IbisSwitching}. Each edge's coefficients start at the scheduled edge time and run
 * until they settle or the next edge starts.
 *
 * <p>Package: when the component is known ({@code component}), the die pad (tables, clamps,
 * {@code C_comp}) sits behind the package, {@code R_pkg} and {@code L_pkg} in series to the pin
 * and {@code C_pkg} from the pin to GND, each from the pin's {@code [Pin]} row where given, else
 * from {@code [Package]} in the chosen column ({@link IbisPackage}); {@code package: false} puts
 * the die pad at the pin. ECL model types (whose pull-down is Vcc-relative) are rejected for now.
 *
 * <p>Parameters: {@code file} (relative to the net file), {@code ibis_model} or
 * {@code component} + {@code ibis_pin}, {@code ibis_select} (an entry of a {@code [Model Selector]}),
 * {@code package} (true or false; default true), {@code ibis_corner} (typ, min, max; default typ).
 */
public final class IbisDriverModel implements DriverModel {
    /** The shared instance. */
    public static final IbisDriverModel INSTANCE = new IbisDriverModel();
    private IbisDriverModel() {
    }

    @Override
    public String id() {
        return BuiltinModels.IBIS;
    }

    @Override
    public Role role() {
        return Role.DRIVER;
    }

    @Override
    public String description() {
        return "IBIS buffer: pull-up/pull-down/clamp V-I tables, C_comp, package R-L-C, switched by its waveforms or [Ramp]";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return IbisSelection.commonParameters();
    }

    @Override
    public List<Problem> check(Parameters given) {
        return IbisSelection.check(given);
    }

    /** The selection, checked to be a model that can drive. */
    static IbisSelection driving(Driver driver) {
        IbisSelection s = IbisSelection.of(driver);
        IbisModel m = s.model();
        if (m.isInputOnly() || m.modelType().equalsIgnoreCase("Terminator")) {
            throw new ModelParameterException(driver.parameters().has("ibis_model") ? "ibis_model" : "ibis_pin", "IBIS model `" + m.name() + "` is of type " + m.modelType() + " and cannot drive; expected an output or I/O model");
        }
        if (m.modelType().toUpperCase(java.util.Locale.ROOT).contains("ECL")) {
            // ECL pull-down tables are Vcc-relative too (impedance-and-standards.md §7); not built yet.
            throw new ModelParameterException(driver.parameters().has("ibis_model") ? "ibis_model" : "ibis_pin", "IBIS model `"
                    + m.name() + "` is of type " + m.modelType() + "; ECL drivers are not supported yet; expected a CMOS-style output or I/O model");
        }
        if (m.ramp() == null && (m.rising().isEmpty() || m.falling().isEmpty())) {
            throw new ModelParameterException("file", "IBIS model `" + m.name()
                    + "` has no [Ramp]; expected one, or both [Rising Waveform] and [Falling Waveform], to time its edges");
        }
        if (m.pulldown() == null && m.pullup() == null) {
            throw new ModelParameterException("file", "IBIS model `" + m.name() + "` has neither [Pullup] nor [Pulldown]; expected its output tables");
        }
        return s;
    }

    @Override
    public Swing swing(Driver driver, NetRails rails) {
        IbisSelection s = driving(driver);
        double low = s.model().pulldownReference(s.corner());
        double high = s.model().pullupReference(s.corner());
        if (Double.isNaN(high)) {
            throw new ModelParameterException("file", "IBIS model `" + s.model().name()
                    + "` gives neither [Voltage Range] nor [Pullup Reference]; expected one for the driven high level");
        }
        if (!(high > low)) {
            throw new ModelParameterException("file", "IBIS model `" + s.model().name() + "`: pull-up reference `" + high
                    + "` V must be above the pull-down reference `" + low + "` V");
        }
        return new Swing(low, high);
    }

    @Override
    public double fullTransition(Driver driver, Stimulus.Edge edge, NetRails rails) {
        IbisSelection s = driving(driver);
        // Warnings are given once, at elaboration.
        return IbisSwitching.of(new IbisBuffer(s.model(), s.corner()), edge == Stimulus.Edge.RISE, w -> { }).fullTime();
    }

    @Override
    public double sourceResistance(Driver driver, NetRails rails) {
        IbisSelection s = driving(driver);
        IbisModel m = s.model();
        IbisCorner c = s.corner();
        // Large-signal resistance at 10 % of the supply, where the stages are still nearly linear.
        double v = 0.1 * (m.pullupReference(c) - m.pulldownReference(c));
        List<Double> rs = new ArrayList<>();
        if (m.pulldown() != null && m.pulldown().valueAt(c, v) > 0) {
            rs.add(v / m.pulldown().valueAt(c, v));
        }
        if (m.pullup() != null && m.pullup().valueAt(c, v) < 0) {
            rs.add(-v / m.pullup().valueAt(c, v));
        }
        double stage = rs.isEmpty() ? IbisRamp.DEFAULT_R_LOAD : rs.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
        return stage + s.packageValues().map(IbisPackage::ohms).orElse(0.0);
    }

    @Override
    public void elaborate(Driver driver, DriverContext ctx) {
        IbisSelection s = driving(driver);
        swing(driver, ctx.rails()); // checks the references
        s.file().warnings().forEach(ctx::warn);
        IbisModel m = s.model();
        IbisCorner c = s.corner();
        IbisBuffer b = new IbisBuffer(m, c);
        String pin = driver.pin();
        String pad = IbisPackage.padNode(s, ctx, pin);
        References refs = new References(ctx, pin);
        String vcc = refs.node("vpu", b.vcc);
        String vgnd = refs.node("vpd", b.vgnd);
        double[][] k = switching(b, ctx.edges(), ctx::warn);
        if (m.pulldown() != null) {
            ctx.add(new Primitive.TableCurrent(ctx.newName("ipd_" + pin), pad, vgnd, pad, vgnd, m.pulldown().x(),
                    m.pulldown().column(c), k[0], k[2]));
        }
        if (m.pullup() != null) {
            ctx.add(new Primitive.TableCurrent(ctx.newName("ipu_" + pin), pad, vcc, vcc, pad, m.pullup().x(),
                    m.pullup().column(c), k[0], k[1]));
        }
        clamps(m, c, ctx, refs, pin, pad);
        double cComp = m.cComp().get(c);
        if (cComp > 0) {
            ctx.add(new Primitive.Capacitor(ctx.newName("ccomp_" + pin), pad, ctx.groundNode(), cComp));
        }
    }

    /** Adds the clamp tables at the die pad and nothing else (shared with the receiver). */
    static void clamps(IbisModel m, IbisCorner c, ElaborationContext ctx, References refs, String pin, String pad) {
        if (m.gndClamp() != null) {
            String ref = refs.node("vgc", m.gndClampReference(c));
            ctx.add(new Primitive.TableCurrent(ctx.newName("igc_" + pin), pad, ref, pad, ref, m.gndClamp().x(),
                    m.gndClamp().column(c), new double[0], new double[0]));
        }
        if (m.powerClamp() != null) {
            String ref = refs.node("vpc", m.powerClampReference(c));
            ctx.add(new Primitive.TableCurrent(ctx.newName("ipc_" + pin), pad, ref, ref, pad, m.powerClamp().x(),
                    m.powerClamp().column(c), new double[0], new double[0]));
        }
    }

    /**
     * The switching factors over time: {0: times, 1: ku, 2: kd}. They start at the first edge's
     * starting values and follow each edge's coefficients from its start, cut short where the
     * next edge begins (with a warning when they had not settled by then).
     */
    static double[][] switching(IbisBuffer b, List<ScheduledEdge> edges, java.util.function.Consumer<String> warn) {
        List<double[]> pts = new ArrayList<>();
        IbisSwitching rise = null;
        IbisSwitching fall = null;
        for (int j = 0; j < edges.size(); j++) {
            ScheduledEdge e = edges.get(j);
            boolean rising = e.direction() == Stimulus.Edge.RISE;
            if (rising && rise == null) {
                rise = IbisSwitching.of(b, true, warn);
            } else if (!rising && fall == null) {
                fall = IbisSwitching.of(b, false, warn);
            }
            IbisSwitching k = rising ? rise : fall;
            double[] t = k.times();
            double[] ku = k.ku();
            double[] kd = k.kd();
            if (pts.isEmpty()) {
                pts.add(new double[] {0, ku[0], kd[0]});
            }
            double next = j + 1 < edges.size() ? edges.get(j + 1).start() : Double.POSITIVE_INFINITY;
            for (int i = 0; i < t.length; i++) {
                double at = e.start() + t[i];
                if (at >= next) {
                    double settled = Math.max(Math.abs(ku[i] - ku[t.length - 1]), Math.abs(kd[i] - kd[t.length - 1]));
                    if (settled > 0.02) {
                        warn.accept("IBIS model `" + b.model.name() + "`: the next edge starts `" + (next - e.start())
                                + "` s after this one, before the switching of this edge has settled; lengthen `stimulus.settle`");
                    }
                    break;
                }
                if (at > pts.get(pts.size() - 1)[0]) {
                    pts.add(new double[] {at, ku[i], kd[i]});
                }
            }
        }
        double[][] out = new double[3][pts.size()];
        for (int i = 0; i < pts.size(); i++) {
            for (int r = 0; r < 3; r++) {
                out[r][i] = pts.get(i)[r];
            }
        }
        return out;
    }

    /** The model's own reference sources, one per distinct voltage; 0 V is ground. */
    static final class References {
        private final ElaborationContext ctx;
        private final String pin;
        private final Map<Double, String> nodes = new HashMap<>();

        References(ElaborationContext ctx, String pin) {
            this.ctx = ctx;
            this.pin = pin;
        }

        String node(String hint, double volts) {
            if (volts == 0) {
                return ctx.groundNode();
            }
            return nodes.computeIfAbsent(volts, v -> {
                String n = ctx.newNode(pin + "_" + hint);
                ctx.add(new Primitive.DcVoltage(ctx.newName(hint + "_" + pin), n, ctx.groundNode(), v));
                return n;
            });
        }
    }
}
