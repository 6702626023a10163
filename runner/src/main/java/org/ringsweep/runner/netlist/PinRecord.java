package org.ringsweep.runner.netlist;

import java.util.Objects;
import org.ringsweep.api.net.Location;

/**
 * One pin of a net as a netlist lists it.
 *
 * @param net      the net name (aliases already resolved)
 * @param refdes   the reference designator ({@code U1})
 * @param pin      the pin or terminal ({@code 14}, {@code A3})
 * @param x        x coordinate in metres, NaN when the netlist gives none
 * @param y        y coordinate in metres, NaN when the netlist gives none
 * @param location where the record is (file and 1-based line)
 */
public record PinRecord(String net, String refdes, String pin, double x, double y, Location location) {
    /** Validates the names. */
    public PinRecord {
        Objects.requireNonNull(net, "net");
        Objects.requireNonNull(refdes, "refdes");
        Objects.requireNonNull(pin, "pin");
        Objects.requireNonNull(location, "location");
    }

    /** The point name used in net files: {@code REFDES.PIN}. */
    public String point() {
        return refdes + "." + pin;
    }

    /** Whether both coordinates are known. */
    public boolean hasCoordinates() {
        return Double.isFinite(x) && Double.isFinite(y);
    }
}
