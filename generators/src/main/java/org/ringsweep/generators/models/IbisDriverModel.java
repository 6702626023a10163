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
import org.ringsweep.generators.ibis.IbisTable;

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
 * <p>Switching: {@code kd = 1 − ku}; across each edge {@code ku} moves between 0 and 1 over the
 * 0–100 % time of the equivalent linear ramp, {@code dt/0.6} of {@code [Ramp]}
 * (lines-and-terminations.md §6). Its shape is solved, at 40 steps per edge, so that the buffer
 * driving {@code [Ramp]}'s {@code R_load} (to GND for the rising edge, to the pull-up reference
 * for the falling edge — common practice; the reference leaves the fixture rail unverified),
 * with {@code C_comp}, follows that straight ramp between its two DC levels: at each instant
 * KCL at the pad is linear in {@code ku}. The buffer then reproduces {@code [Ramp]}'s 20–80 %
 * slew into that load; into other loads the shape follows from the tables.
 * {@code [Rising Waveform]}/{@code [Falling Waveform]} tables are read but not used yet.
 * Package parasitics ({@code [Package]}, {@code [Pin]} R/L/C) are not added: model them as parts.
 * ECL model types (whose pull-down is Vcc-relative) are rejected for now.
 *
 * <p>Parameters: {@code file} (relative to the net file), {@code ibis_model} or
 * {@code component} + {@code ibis_pin}, {@code ibis_corner} (typ, min, max; default typ).
 */
public final class IbisDriverModel implements DriverModel {
    /** The shared instance. */
    public static final IbisDriverModel INSTANCE = new IbisDriverModel();
    /** Steps of the solved switching function per edge. */
    static final int STEPS = 40;

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
        return "IBIS buffer: pull-up/pull-down/clamp V-I tables, C_comp, switched over the [Ramp] time";
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
        if (m.ramp() == null) {
            throw new ModelParameterException("file", "IBIS model `" + m.name() + "` has no [Ramp]; expected one to time its edges");
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
        return s.model().ramp().fullTime(edge == Stimulus.Edge.RISE, s.corner());
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
        return rs.isEmpty() ? IbisRamp.DEFAULT_R_LOAD : rs.stream().mapToDouble(Double::doubleValue).average().orElseThrow();
    }

    @Override
    public void elaborate(Driver driver, DriverContext ctx) {
        IbisSelection s = driving(driver);
        swing(driver, ctx.rails()); // checks the references
        s.file().warnings().forEach(ctx::warn);
        IbisModel m = s.model();
        IbisCorner c = s.corner();
        Buffer b = new Buffer(m, c);
        String pad = ctx.pinNode();
        References refs = new References(ctx, driver.pin());
        String vcc = refs.node("vpu", b.vcc);
        String vgnd = refs.node("vpd", b.vgnd);
        double[][] k = switching(b, ctx.edges());
        double[] times = k[0];
        double[] ku = k[1];
        double[] kd = new double[ku.length];
        for (int i = 0; i < ku.length; i++) {
            kd[i] = 1 - ku[i];
        }
        String pin = driver.pin();
        if (m.pulldown() != null) {
            ctx.add(new Primitive.TableCurrent(ctx.newName("ipd_" + pin), pad, vgnd, pad, vgnd, m.pulldown().x(),
                    m.pulldown().column(c), times, kd));
        }
        if (m.pullup() != null) {
            ctx.add(new Primitive.TableCurrent(ctx.newName("ipu_" + pin), pad, vcc, vcc, pad, m.pullup().x(),
                    m.pullup().column(c), times, ku));
        }
        clamps(m, c, ctx, refs, pin);
        double cComp = m.cComp().get(c);
        if (cComp > 0) {
            ctx.add(new Primitive.Capacitor(ctx.newName("ccomp_" + pin), pad, ctx.groundNode(), cComp));
        }
    }

    /** Adds the clamp tables and nothing else (shared with the receiver). */
    static void clamps(IbisModel m, IbisCorner c, ElaborationContext ctx, References refs, String pin) {
        String pad = ctx.pinNode();
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
     * The pull-up factor ku over time: {0: times, 1: ku}. It starts at the level before the
     * first edge and, for each edge, follows the solved shape (see the class comment).
     */
    static double[][] switching(Buffer b, List<ScheduledEdge> edges) {
        List<double[]> pts = new ArrayList<>();
        boolean startHigh = !edges.isEmpty() && edges.get(0).direction() == Stimulus.Edge.FALL;
        pts.add(new double[] {0, startHigh ? 1 : 0});
        for (ScheduledEdge e : edges) {
            boolean rising = e.direction() == Stimulus.Edge.RISE;
            double[] shape = b.shape(rising);
            double full = b.ramp.fullTime(rising, b.corner);
            for (int i = 0; i <= STEPS; i++) {
                double t = e.start() + full * i / STEPS;
                if (t > pts.get(pts.size() - 1)[0]) {
                    pts.add(new double[] {t, rising ? shape[i] : 1 - shape[i]});
                }
            }
        }
        double[][] out = new double[2][pts.size()];
        for (int i = 0; i < pts.size(); i++) {
            out[0][i] = pts.get(i)[0];
            out[1][i] = pts.get(i)[1];
        }
        return out;
    }

    /** The tables of one model in one column, as functions of the pad voltage. */
    static final class Buffer {
        final IbisModel model;
        final IbisCorner corner;
        final IbisRamp ramp;
        final double vcc;
        final double vgnd;
        final double cComp;

        Buffer(IbisModel model, IbisCorner corner) {
            this.model = model;
            this.corner = corner;
            this.ramp = model.ramp();
            this.vcc = model.pullupReference(corner);
            this.vgnd = model.pulldownReference(corner);
            this.cComp = model.cComp().get(corner);
        }

        /** Pull-down current into the pin at pad voltage v (A). */
        double pulldown(double v) {
            return model.pulldown() == null ? 0 : model.pulldown().valueAt(corner, v - vgnd);
        }

        /** Pull-up current into the pin at pad voltage v (A). */
        double pullup(double v) {
            return model.pullup() == null ? 0 : model.pullup().valueAt(corner, vcc - v);
        }

        /** Clamp currents into the pin at pad voltage v (A). */
        double clamps(double v) {
            double i = 0;
            IbisTable gc = model.gndClamp();
            IbisTable pc = model.powerClamp();
            if (gc != null) {
                i += gc.valueAt(corner, v - model.gndClampReference(corner));
            }
            if (pc != null) {
                i += pc.valueAt(corner, model.powerClampReference(corner) - v);
            }
            return i;
        }

        /**
         * The solved factor of the stage turning on (pull-up when rising, pull-down when
         * falling), at {@link #STEPS} + 1 instants across the full ramp; 0 at the start and 1 at
         * the end.
         */
        double[] shape(boolean rising) {
            double rLoad = ramp.rLoad();
            double vFix = rising ? 0 : vcc;
            double vStart = level(!rising, rLoad, vFix);
            double vEnd = level(rising, rLoad, vFix);
            double full = ramp.fullTime(rising, corner);
            double slope = (vEnd - vStart) / full;
            double[] k = new double[STEPS + 1];
            for (int i = 0; i <= STEPS; i++) {
                double v = vStart + (vEnd - vStart) * i / STEPS;
                double off = rising ? pulldown(v) : pullup(v);
                double on = rising ? pullup(v) : pulldown(v);
                double load = (v - vFix) / rLoad + cComp * slope;
                double denominator = on - off;
                double ki = Math.abs(denominator) > 1e-12 ? -(off + clamps(v) + load) / denominator : (double) i / STEPS;
                k[i] = Math.max(0, Math.min(1, ki));
            }
            k[0] = 0;
            k[STEPS] = 1;
            return k;
        }

        /** The DC pad voltage with the pull-up on ({@code high}) or the pull-down on, into rLoad to vFix. */
        double level(boolean high, double rLoad, double vFix) {
            // Pad current into the buffer plus the load current rises with the pad voltage: bisect.
            double span = Math.max(1, vcc - vgnd);
            double lo = Math.min(vgnd, vFix) - 2 * span;
            double hi = Math.max(vcc, vFix) + 2 * span;
            for (int i = 0; i < 200; i++) {
                double mid = (lo + hi) / 2;
                double f = (high ? pullup(mid) : pulldown(mid)) + clamps(mid) + (mid - vFix) / rLoad;
                if (f > 0) {
                    hi = mid;
                } else {
                    lo = mid;
                }
            }
            return (lo + hi) / 2;
        }
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
