package org.ringsweep.generators.ibis;

/**
 * The {@code [Ramp]} of a model: for each edge the voltage step between the 20 % and 80 % points
 * and the time it takes, measured into {@code R_load} (impedance-and-standards.md §7,
 * lines-and-terminations.md §6). {@code dV/dt_r = 2.20/1.06n} gives dv 2.20 V, dt 1.06 ns.
 *
 * @param riseDv the rising 20–80 % voltage step (V), typ/min/max
 * @param riseDt the rising 20–80 % time (s), typ/min/max
 * @param fallDv the falling 20–80 % voltage step (V), typ/min/max
 * @param fallDt the falling 20–80 % time (s), typ/min/max
 * @param rLoad  the load the ramp was measured into (ohm); 50 when the file does not say
 */
public record IbisRamp(IbisRange riseDv, IbisRange riseDt, IbisRange fallDv, IbisRange fallDt, double rLoad) {
    /** The default {@code R_load} of the standard (ohm). */
    public static final double DEFAULT_R_LOAD = 50;

    /** The 20–80 % slew rate of one edge at a corner (V/s), positive. */
    public double slope(boolean rising, IbisCorner corner) {
        return rising ? riseDv.get(corner) / riseDt.get(corner) : fallDv.get(corner) / fallDt.get(corner);
    }

    /**
     * The duration of the equivalent 0–100 % linear ramp (s): the 20–80 % time over 0.6
     * (lines-and-terminations.md §6).
     */
    public double fullTime(boolean rising, IbisCorner corner) {
        return (rising ? riseDt.get(corner) : fallDt.get(corner)) / 0.6;
    }
}
