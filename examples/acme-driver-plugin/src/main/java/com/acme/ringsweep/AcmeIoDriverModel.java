package com.acme.ringsweep;

import java.util.List;
import java.util.Map;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.model.DriverContext;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.model.ScheduledEdge;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.api.net.Value;

/**
 * The {@code acme-io} driver of the invented Acme Instruments I/O cell: a linear ramp behind an
 * output resistance, elaborated into circuit primitives only (a {@link Primitive.PwlVoltage} and
 * a {@link Primitive.Resistor}), so every engine can run it.
 *
 * <p>Parameters: {@code v_high} (voltage or rail, required), {@code v_low} (default GND),
 * {@code drive} ({@code 4mA}, {@code 8mA} or {@code 12mA}, default {@code 8mA}) and
 * {@code slew} ({@code fast} or {@code slow}, default {@code fast}).
 *
 * <p>The tables are <b>invented demo data</b>, not measured from any part: output resistance
 * 4mA → 50 Ω, 8mA → 28 Ω, 12mA → 18 Ω; 10–90 % transition time fast → 0.8 ns, slow → 2.5 ns,
 * the same rising and falling. A straight ramp's full (0–100 %) duration is the 10–90 % time
 * divided by 0.8.
 */
public final class AcmeIoDriverModel implements DriverModel {
    /** The shared instance. */
    public static final AcmeIoDriverModel INSTANCE = new AcmeIoDriverModel();
    /** The model id. */
    public static final String ID = "acme-io";

    /** Output resistance by drive strength (ohm); invented. */
    public static final Map<String, Double> OUTPUT_OHMS = Map.of("4mA", 50.0, "8mA", 28.0, "12mA", 18.0);
    /** 10–90 % transition time by slew setting (s); invented. */
    public static final Map<String, Double> TRANSITION_10_90 = Map.of("fast", 0.8e-9, "slow", 2.5e-9);

    private AcmeIoDriverModel() {
    }

    @Override
    public String id() {
        return ID;
    }

    @Override
    public Role role() {
        return Role.DRIVER;
    }

    @Override
    public String description() {
        return "Acme Instruments I/O cell (invented): ramp behind 50/28/18 ohm for drive 4mA/8mA/12mA, 0.8 or 2.5 ns 10-90 %";
    }

    @Override
    public List<ParameterSpec> parameters() {
        return List.of(
                ParameterSpec.voltageOrRail("v_high", "", true, "high level: a voltage or a rail name"),
                ParameterSpec.voltageOrRail("v_low", "GND", false, "low level: a voltage or a rail name"),
                ParameterSpec.word("drive", OUTPUT_OHMS.keySet(), "8mA", "drive strength: output resistance 50, 28 or 18 ohm"),
                ParameterSpec.word("slew", TRANSITION_10_90.keySet(), "fast", "slew control: 10-90 % time 0.8 ns (fast) or 2.5 ns (slow)"));
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
        return lookup(driver, "slew", "fast", TRANSITION_10_90) / 0.8;
    }

    @Override
    public double sourceResistance(Driver driver, NetRails rails) {
        return lookup(driver, "drive", "8mA", OUTPUT_OHMS);
    }

    @Override
    public void elaborate(Driver driver, DriverContext ctx) {
        Swing swing = swing(driver, ctx.rails());
        double ramp = fullTransition(driver, Stimulus.Edge.RISE, ctx.rails());
        List<ScheduledEdge> edges = ctx.edges();
        boolean startHigh = !edges.isEmpty() && edges.get(0).direction() == Stimulus.Edge.FALL;
        double[] times = new double[1 + 2 * edges.size()];
        double[] volts = new double[times.length];
        times[0] = 0;
        volts[0] = startHigh ? swing.high() : swing.low();
        int i = 1;
        for (ScheduledEdge e : edges) {
            boolean rising = e.direction() == Stimulus.Edge.RISE;
            times[i] = e.start();
            volts[i++] = rising ? swing.low() : swing.high();
            times[i] = e.start() + ramp;
            volts[i++] = rising ? swing.high() : swing.low();
        }
        String source = ctx.newNode(driver.pin() + "_acme_src");
        ctx.add(new Primitive.PwlVoltage(ctx.newName("acme_" + driver.pin()), source, ctx.groundNode(), times, volts));
        ctx.add(new Primitive.Resistor(ctx.newName("acme_rout_" + driver.pin()), source, ctx.pinNode(), sourceResistance(driver, ctx.rails())));
    }

    private static double lookup(Driver driver, String key, String fallback, Map<String, Double> table) {
        String word = driver.parameters().get(key).map(Value::display).orElse(fallback);
        Double v = table.get(word);
        if (v == null) {
            throw new ModelParameterException(key, "expected one of " + String.join(", ", new java.util.TreeSet<>(table.keySet()))
                    + ", found `" + word + "`");
        }
        return v;
    }
}
