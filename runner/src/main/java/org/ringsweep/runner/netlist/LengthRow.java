package org.ringsweep.runner.netlist;

import java.util.Objects;
import org.ringsweep.api.net.Location;

/**
 * One row of a length table: a routed piece of a net between two points.
 *
 * @param net      the net name (as in the netlist)
 * @param from     a point: {@code REFDES.PIN} or a junction name
 * @param to       a point
 * @param metres   the routed length (m), positive
 * @param location where the row is
 */
public record LengthRow(String net, String from, String to, double metres, Location location) {
    /** Validates the fields. */
    public LengthRow {
        Objects.requireNonNull(net, "net");
        Objects.requireNonNull(from, "from");
        Objects.requireNonNull(to, "to");
        Objects.requireNonNull(location, "location");
    }
}
