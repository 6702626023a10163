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
import org.ringsweep.api.net.Value;
import org.ringsweep.api.quantity.Dimension;

/**
 * The built-in {@code open-drain} driver (open drain or open collector): a switch from the pin to
 * the low rail {@code v_low} (GND by default). It only pulls down; the high level comes from a
 * pull-up resistor, which is a part on the net ({@code between: [SDA, VDD]}), charging the bus
 * capacitance (receiver inputs, capacitor parts, the lines and {@code c_out}).
 *
 * <ul>
 * <li>On-resistance: {@code r_on}, or the datasheet's low-level output voltage {@code v_ol} at the
 *     sink current {@code i_ol}, giving {@code r_on = v_ol / i_ol} (a linear switch through that
 *     datasheet point: real drivers saturate at high currents, so use the {@code i_ol} nearest to
 *     the bus's own current).</li>
 * <li>Released, the switch is {@code r_off}, default 100 MΩ ({@link #R_OFF_DEFAULT}): a leakage of
 *     33 nA at 3.3 V, far below any pull-up current, yet finite so that the node always has a DC
 *     path and the deck needs no special treatment.</li>
 * <li>The switch is a {@link Primitive.TimedResistor}. Its conductance moves linearly from
 *     {@code 1/r_off} to {@code 1/r_on} over {@code fall} when it turns on (the falling edge) and
 *     back over {@code release} (default 1 ns) when it lets go (the rising edge), in
 *     {@link #STEPS} straight pieces of resistance each. {@code fall} is therefore the time the
 *     switch takes to close, not a 10–90 % fall time at the pin; the pin's fall time also depends
 *     on the bus capacitance and the pull-up.</li>
 * <li>Swing and timing: the swing for the measurements is {@code v_low} to {@code v_high}, where
 *     {@code v_high} is the pull-up supply (a voltage or the rail's name). The host takes each
 *     edge's "source 50 %" instant half-way through its full transition: for a falling edge the
 *     middle of {@code fall}, for a rising edge the middle of {@code release}, i.e. the release
 *     instant itself. The rising edge is then an RC charge through the pull-up, and delays and
 *     settling times of rising edges count from the release.</li>
 * <li>{@code c_out}, default 0: the pin's own capacitance to GND, part of the bus capacitance.</li>
 * <li>{@code i2c_mode}: which I²C-bus modes' pull-up windows the elaborator reports for the net
 *     (all, standard, fast, fast-plus or none; see
 *     {@link org.ringsweep.generators.analysis.I2cPullUp}).</li>
 * </ul>
 */
public final class OpenDrainDriverModel implements DriverModel {
    /** The shared instance. */
    public static final OpenDrainDriverModel INSTANCE = new OpenDrainDriverModel();

    /** The default off resistance of the released switch (ohm): 100 MΩ. */
    public static final double R_OFF_DEFAULT = 100e6;
    /** The default release time (s): 1 ns. */
    public static final double RELEASE_DEFAULT = 1e-9;
    /** The default switch-on time (s): 10 ns. */
    public static final double FALL_DEFAULT = 10e-9;
    /** The number of straight pieces approximating a linear conductance ramp. */
    static final int STEPS = 16;

    private OpenDrainDriverModel() {
    }

    @Override
    public String id() {
        return BuiltinModels.OPEN_DRAIN;
    }

    @Override
    public Role role() {
        return Role.DRIVER;
    }

    @Override
    public String description() {
        return "open-drain pull-down switch (r_on, or v_ol at i_ol) to v_low; the pull-up is a resistor part to the v_high rail";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return List.of(
                ParameterSpec.voltageOrRail("v_high", "", true, "the pull-up supply: a voltage or a rail name (the swing's high level)"),
                ParameterSpec.voltageOrRail("v_low", "GND", false, "the rail the switch pulls down to"),
                ParameterSpec.number("r_on", Dimension.RESISTANCE, "", false, "on-resistance of the switch; or give v_ol and i_ol"),
                ParameterSpec.number("v_ol", Dimension.VOLTAGE, "", false, "datasheet low output voltage at i_ol: r_on = v_ol / i_ol"),
                ParameterSpec.number("i_ol", Dimension.CURRENT, "", false, "datasheet sink current for v_ol"),
                ParameterSpec.number("r_off", Dimension.RESISTANCE, "100meg", false, "resistance of the released switch"),
                ParameterSpec.number("fall", Dimension.TIME, "10ns", false, "time the switch takes to turn on (conductance ramp)"),
                ParameterSpec.number("release", Dimension.TIME, "1ns", false, "time the switch takes to let go (rising edge)"),
                ParameterSpec.number("c_out", Dimension.CAPACITANCE, "0", false, "pin capacitance to GND"),
                ParameterSpec.number("delay", Dimension.TIME, "0", false, "extra delay before the first edge starts"),
                ParameterSpec.word("i2c_mode", Set.of("all", "standard", "fast", "fast-plus", "none"), "all",
                        "I²C modes whose pull-up window is reported: all, standard, fast, fast-plus or none"));
    }

    @Override
    public List<Problem> check(Parameters given) {
        List<Problem> problems = new ArrayList<>();
        boolean datasheet = given.has("v_ol") || given.has("i_ol");
        if (given.has("r_on") && datasheet) {
            problems.add(new Problem(given.has("v_ol") ? "v_ol" : "i_ol", "give either r_on, or v_ol with i_ol, not both"));
        } else if (!given.has("r_on") && !(given.has("v_ol") && given.has("i_ol"))) {
            problems.add(new Problem(given.has("v_ol") ? "i_ol" : given.has("i_ol") ? "v_ol" : "r_on",
                    "expected r_on, or both v_ol and i_ol (r_on = v_ol / i_ol)"));
        }
        return problems;
    }

    /**
     * The switch's on-resistance (ohm): {@code r_on}, or {@code v_ol / i_ol}.
     *
     * @throws ModelParameterException if neither form is given or a value is not positive
     */
    public double onResistance(Driver driver) {
        Parameters p = driver.parameters();
        if (p.has("r_on")) {
            return ModelParameters.positive(p, "r_on");
        }
        if (p.has("v_ol") && p.has("i_ol")) {
            return ModelParameters.positive(p, "v_ol") / ModelParameters.positive(p, "i_ol");
        }
        throw new ModelParameterException("r_on", "expected r_on, or both v_ol and i_ol (r_on = v_ol / i_ol)");
    }

    /** The resistance of the released switch (ohm), {@code r_off}, default 100 MΩ. */
    public double offResistance(Driver driver) {
        Parameters p = driver.parameters();
        double off = p.has("r_off") ? ModelParameters.positive(p, "r_off") : R_OFF_DEFAULT;
        double on = onResistance(driver);
        if (!(off > on)) {
            throw new ModelParameterException("r_off", "r_off `" + off + "` ohm must be above the on-resistance `" + on + "` ohm");
        }
        return off;
    }

    /** The pin's own capacitance to GND (F), {@code c_out}, default 0. */
    public double outputCapacitance(Driver driver) {
        return ModelParameters.nonNegative(driver.parameters(), "c_out", 0);
    }

    /** The {@code i2c_mode} word: all, standard, fast, fast-plus or none. */
    public String i2cMode(Driver driver) {
        return ModelParameters.word(driver.parameters(), "i2c_mode", "all");
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

    @Override
    public double fullTransition(Driver driver, Stimulus.Edge edge, NetRails rails) {
        Parameters p = driver.parameters();
        if (edge == Stimulus.Edge.RISE) {
            return p.has("release") ? ModelParameters.positive(p, "release") : RELEASE_DEFAULT;
        }
        return p.has("fall") ? ModelParameters.positive(p, "fall") : FALL_DEFAULT;
    }

    /** The on-resistance: it is what drives the line on falling edges; rising edges go through the pull-up. */
    @Override
    public double sourceResistance(Driver driver, NetRails rails) {
        return onResistance(driver);
    }

    @Override
    public double delay(Driver driver) {
        return ModelParameters.nonNegative(driver.parameters(), "delay", 0);
    }

    @Override
    public void elaborate(Driver driver, DriverContext ctx) {
        Parameters p = driver.parameters();
        swing(driver, ctx.rails());
        double gOn = 1 / onResistance(driver);
        double gOff = 1 / offResistance(driver);
        List<ScheduledEdge> edges = ctx.edges();
        // Before a first rising edge the switch is on (the line low); before a first falling edge it is off.
        boolean startOn = !edges.isEmpty() && edges.get(0).direction() == Stimulus.Edge.RISE;
        List<double[]> points = new ArrayList<>();
        points.add(new double[] {0, startOn ? 1 / gOn : 1 / gOff});
        for (ScheduledEdge e : edges) {
            boolean turningOn = e.direction() == Stimulus.Edge.FALL;
            double span = fullTransition(driver, e.direction(), ctx.rails());
            double from = turningOn ? gOff : gOn;
            double to = turningOn ? gOn : gOff;
            for (int k = 0; k <= STEPS; k++) {
                double g = from + (to - from) * k / STEPS;
                points.add(new double[] {e.start() + span * k / STEPS, 1 / g});
            }
        }
        double[] times = new double[points.size()];
        double[] ohms = new double[points.size()];
        int n = 0;
        for (double[] pt : points) {
            // Drop a point that does not advance in time (a first edge at t = 0 repeats the initial point).
            if (n > 0 && !(pt[0] > times[n - 1])) {
                ohms[n - 1] = pt[1];
                continue;
            }
            times[n] = pt[0];
            ohms[n] = pt[1];
            n++;
        }
        String low = lowNode(p, ctx);
        ctx.add(new Primitive.TimedResistor(ctx.newName("sw_" + driver.pin()), ctx.pinNode(), low,
                java.util.Arrays.copyOf(times, n), java.util.Arrays.copyOf(ohms, n)));
        double cOut = outputCapacitance(driver);
        if (cOut > 0) {
            ctx.add(new Primitive.Capacitor(ctx.newName("cout_" + driver.pin()), ctx.pinNode(), ctx.groundNode(), cOut));
        }
    }

    /** The node the switch pulls to: a rail's node, or a DC source for a plain voltage. */
    private static String lowNode(Parameters p, DriverContext ctx) {
        Value v = p.get("v_low").orElse(new Value.Word("GND"));
        if (v instanceof Value.Word w) {
            ctx.rails().voltageOrRail(p, "v_low", "GND"); // names the key when the rail is unknown
            return ctx.railNode(w.text());
        }
        double volts = ctx.rails().voltageOrRail(p, "v_low", "GND");
        if (volts == 0) {
            return ctx.groundNode();
        }
        String node = ctx.newNode("vlow");
        ctx.add(new Primitive.DcVoltage(ctx.newName("vlow"), node, ctx.groundNode(), volts));
        return node;
    }
}
