package org.ringsweep.generators.elaborate;

import java.util.List;
import org.ringsweep.api.circuit.Circuit;

/**
 * The result of elaborating one net at one point.
 *
 * @param circuit    the flat circuit
 * @param edges      the measured edges in time order
 * @param vLow       the first driver's low level (V)
 * @param vHigh      the first driver's high level (V)
 * @param driverNode the safe node of the first driver's pin
 * @param receivers  the receivers in file order
 * @param warnings   plain-text warnings for the user (e.g. an automatic settle time was capped)
 */
public record Elaboration(Circuit circuit, List<EdgeEvent> edges, double vLow, double vHigh, String driverNode,
                          List<ReceiverProbe> receivers, List<String> warnings) {
    /** Copies the lists. */
    public Elaboration {
        edges = List.copyOf(edges);
        receivers = List.copyOf(receivers);
        warnings = List.copyOf(warnings);
    }

    /** The swing {@code vHigh − vLow} (V). */
    public double swing() {
        return vHigh - vLow;
    }
}
