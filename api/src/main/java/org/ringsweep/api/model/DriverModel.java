package org.ringsweep.api.model;

import org.apiguardian.api.API;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Stimulus;

/**
 * A driver model: describes its parameters and turns a {@link Driver} into circuit primitives
 * that switch at the scheduled edges.
 *
 * <p>The host asks the timing questions ({@link #swing}, {@link #fullTransition},
 * {@link #sourceResistance}, {@link #delay}) before elaboration to build the edge schedule, then
 * calls {@link #elaborate} once per driver. The host assumes the 50 % point of an edge at the
 * source is half-way through its full transition. Implementations must be stateless and
 * thread-safe.
 *
 * <p>Example, a driver that is a plain resistor to a switched source:
 * <pre>{@code
 * public void elaborate(Driver d, DriverContext ctx) {
 *     String src = ctx.newNode("src");
 *     ctx.add(new Primitive.PwlVoltage(ctx.newName("v"), src, ctx.groundNode(), times, volts));
 *     ctx.add(new Primitive.Resistor(ctx.newName("r"), src, ctx.pinNode(), 25));
 * }
 * }</pre>
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public interface DriverModel extends ModelDescriptor {
    /**
     * The driven levels.
     *
     * @param low  the low level (V)
     * @param high the high level (V), above low
     */
    record Swing(double low, double high) {
    }

    /**
     * The low and high levels of the driver.
     *
     * @throws ModelParameterException on a bad parameter
     */
    Swing swing(Driver driver, NetRails rails);

    /**
     * The full (0–100 %) duration of a transition at the source (s), positive.
     *
     * @throws ModelParameterException on a bad parameter
     */
    double fullTransition(Driver driver, Stimulus.Edge edge, NetRails rails);

    /**
     * A representative output resistance (ohm) for automatic timing (reflection and RC
     * estimates), e.g. the mean of pull-up and pull-down resistance.
     *
     * @throws ModelParameterException on a bad parameter
     */
    double sourceResistance(Driver driver, NetRails rails);

    /** Extra time before the first edge (s), ≥ 0; none by default. */
    default double delay(Driver driver) {
        return 0;
    }

    /**
     * Adds the primitives of one driver.
     *
     * @throws ModelParameterException on a bad parameter
     */
    void elaborate(Driver driver, DriverContext ctx);
}
