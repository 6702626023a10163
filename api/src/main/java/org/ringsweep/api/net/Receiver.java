package org.ringsweep.api.net;

import java.util.List;
import org.apiguardian.api.API;

/**
 * A receiver on a pin: a model id, its parameters (for the built-in {@code cmos}: {@code c_in},
 * {@code vih}, {@code vil}, {@code clamp}, {@code supply}) and limits of its own that override
 * the net's. In the graph it joins its pin to GND.
 *
 * @param pin        the pin it loads
 * @param model      the model id
 * @param parameters the model's parameters
 * @param limits     limits set on this receiver (may be empty)
 * @param location   where it was written
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record Receiver(String pin, String model, Parameters parameters, Limits limits, Location location) implements Element {
    @Override
    public String id() {
        return pin;
    }

    @Override
    public List<String> points() {
        return List.of(pin);
    }

    @Override
    public Receiver withParameters(Parameters p) {
        return new Receiver(pin, model, p, limits, location);
    }
}
