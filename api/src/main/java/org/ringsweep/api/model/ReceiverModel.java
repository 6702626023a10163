package org.ringsweep.api.model;

import java.util.Optional;
import org.apiguardian.api.API;
import org.ringsweep.api.net.Receiver;

/**
 * A receiver model: describes its parameters, gives the thresholds the checks use and turns a
 * {@link Receiver} into circuit primitives on its pin. Implementations must be stateless and
 * thread-safe.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public interface ReceiverModel extends ModelDescriptor {
    /**
     * The input thresholds and the rail the receiver runs from.
     *
     * @param vil    input low threshold (V)
     * @param vih    input high threshold (V), above vil
     * @param supply the name of the supply rail, if the receiver names one
     */
    record Thresholds(double vil, double vih, Optional<String> supply) {
    }

    /**
     * The thresholds of one receiver.
     *
     * @throws ModelParameterException on a bad parameter
     */
    Thresholds thresholds(Receiver receiver, NetRails rails);

    /** The input capacitance (F) for automatic timing estimates; 0 by default. */
    default double inputCapacitance(Receiver receiver) {
        return 0;
    }

    /**
     * Adds the primitives of one receiver.
     *
     * @throws ModelParameterException on a bad parameter
     */
    void elaborate(Receiver receiver, ReceiverContext ctx);
}
