package org.ringsweep.generators.models;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.model.DriverContext;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.model.ScheduledEdge;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.api.quantity.Dimension;

/**
 * The built-in {@code ramp} driver: a linear Thevenin source. An ideal piecewise-linear source
 * moves between {@code v_low} and {@code v_high} with straight-line ramps, behind the output
 * resistance.
 *
 * <p>{@code rise}/{@code fall} are measured between the {@code edge_ref} levels; the full
 * (0–100 %) ramp of a straight line is that time divided by the fraction of the swing between the
 * levels: 10-90 → /0.8, 20-80 → /0.6, 0-100 → /1. {@code fall} defaults to {@code rise}.
 *
 * <p>Output resistance: {@code r_out} for both states, or {@code r_up} (driving high) and
 * {@code r_down} (driving low), each defaulting to {@code r_out}. When they differ the resistance
 * is a {@link Primitive.TimedResistor} that moves linearly from {@code r_down} to {@code r_up}
 * across each rising ramp and back across each falling one; otherwise a plain resistor.
 */
public final class RampDriverModel implements DriverModel {
    /** The shared instance. */
    public static final RampDriverModel INSTANCE = new RampDriverModel();

    private RampDriverModel() {
    }

    @Override
    public String id() {
        return BuiltinModels.RAMP;
    }

    @Override
    public Role role() {
        return Role.DRIVER;
    }

    @Override
    public String description() {
        return "linear Thevenin source: an ideal ramp between v_low and v_high behind r_out (or r_up/r_down)";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return List.of(
                ParameterSpec.voltageOrRail("v_high", "", true, "high level: a voltage or a rail name"),
                ParameterSpec.voltageOrRail("v_low", "GND", false, "low level: a voltage or a rail name"),
                ParameterSpec.number("rise", Dimension.TIME, "", true, "rising transition time between the edge_ref levels"),
                ParameterSpec.number("fall", Dimension.TIME, "rise", false, "falling transition time; defaults to rise"),
                ParameterSpec.word("edge_ref", Set.of("10-90", "20-80", "0-100"), "10-90", "levels rise and fall are measured between"),
                ParameterSpec.number("r_out", Dimension.RESISTANCE, "", false, "output resistance for both states"),
                ParameterSpec.number("r_up", Dimension.RESISTANCE, "r_out", false, "output resistance driving high"),
                ParameterSpec.number("r_down", Dimension.RESISTANCE, "r_out", false, "output resistance driving low"),
                ParameterSpec.number("delay", Dimension.TIME, "0", false, "extra delay before the first edge starts"));
    }

    @Override
    public List<Problem> check(Parameters given) {
        List<Problem> problems = new ArrayList<>();
        boolean both = given.has("r_up") && given.has("r_down");
        if (!given.has("r_out") && !both) {
            problems.add(new Problem(given.has("r_up") ? "r_down" : given.has("r_down") ? "r_up" : "r_out",
                    "expected r_out, or both r_up and r_down"));
        }
        return problems;
    }

    @Override
    public Swing swing(Driver driver, NetRails rails) {
        double low = rails.voltageOrRail(driver.parameters(), "v_low", "GND");
        double high = rails.voltageOrRail(driver.parameters(), "v_high", "");
        if (!(high > low)) {
            throw new ModelParameterException("v_high", "v_high `" + high + "` V must be above v_low `" + low + "` V");
        }
        return new Swing(low, high);
    }

    /** The fraction of the swing between the {@code edge_ref} levels (0.8, 0.6 or 1). */
    static double edgeFraction(Parameters p) {
        String ref = ModelParameters.word(p, "edge_ref", "10-90");
        switch (ref) {
            case "10-90":
                return 0.8;
            case "20-80":
                return 0.6;
            case "0-100":
                return 1.0;
            default:
                throw new ModelParameterException("edge_ref", "expected 10-90, 20-80 or 0-100, found `" + ref + "`");
        }
    }

    @Override
    public double fullTransition(Driver driver, Stimulus.Edge edge, NetRails rails) {
        Parameters p = driver.parameters();
        double rise = ModelParameters.positive(p, "rise");
        double t = edge == Stimulus.Edge.RISE || !p.has("fall") ? rise : ModelParameters.positive(p, "fall");
        return t / edgeFraction(p);
    }

    @Override
    public double sourceResistance(Driver driver, NetRails rails) {
        return (resistance(driver.parameters(), "r_up") + resistance(driver.parameters(), "r_down")) / 2;
    }

    @Override
    public double delay(Driver driver) {
        return ModelParameters.nonNegative(driver.parameters(), "delay", 0);
    }

    /** {@code r_up} or {@code r_down}, defaulting to {@code r_out}. */
    static double resistance(Parameters p, String key) {
        if (p.has(key)) {
            return ModelParameters.positive(p, key);
        }
        if (p.has("r_out")) {
            return ModelParameters.positive(p, "r_out");
        }
        throw new ModelParameterException("r_out", "expected r_out, or both r_up and r_down");
    }

    @Override
    public void elaborate(Driver driver, DriverContext ctx) {
        Parameters p = driver.parameters();
        Swing swing = swing(driver, ctx.rails());
        double rUp = resistance(p, "r_up");
        double rDown = resistance(p, "r_down");
        List<ScheduledEdge> edges = ctx.edges();
        boolean startHigh = !edges.isEmpty() && edges.get(0).direction() == Stimulus.Edge.FALL;
        int n = 1 + 2 * edges.size();
        double[] times = new double[n];
        double[] volts = new double[n];
        double[] ohms = new double[n];
        times[0] = 0;
        volts[0] = startHigh ? swing.high() : swing.low();
        ohms[0] = startHigh ? rUp : rDown;
        int i = 1;
        for (ScheduledEdge e : edges) {
            boolean rising = e.direction() == Stimulus.Edge.RISE;
            double end = e.start() + fullTransition(driver, e.direction(), ctx.rails());
            times[i] = e.start();
            volts[i] = rising ? swing.low() : swing.high();
            ohms[i] = rising ? rDown : rUp;
            i++;
            times[i] = end;
            volts[i] = rising ? swing.high() : swing.low();
            ohms[i] = rising ? rUp : rDown;
            i++;
        }
        String source = ctx.newNode(driver.pin() + "_src");
        ctx.add(new Primitive.PwlVoltage(ctx.newName("drv_" + driver.pin()), source, ctx.groundNode(), times, volts));
        String rName = ctx.newName("rout_" + driver.pin());
        if (rUp == rDown) {
            ctx.add(new Primitive.Resistor(rName, source, ctx.pinNode(), rUp));
        } else {
            ctx.add(new Primitive.TimedResistor(rName, source, ctx.pinNode(), times, ohms));
        }
    }
}
