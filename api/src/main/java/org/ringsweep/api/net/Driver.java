package org.ringsweep.api.net;

import java.util.List;
import org.apiguardian.api.API;

/**
 * A driver on a pin, described by a model id and that model's parameters (for the built-in
 * {@code ramp}: {@code v_high}, {@code v_low}, {@code rise}, {@code fall}, {@code edge_ref},
 * {@code r_out} or {@code r_up}/{@code r_down}). In the graph it joins its pin to GND.
 *
 * @param pin        the pin it drives
 * @param model      the model id
 * @param parameters the model's parameters
 * @param location   where it was written
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record Driver(String pin, String model, Parameters parameters, Location location) implements Element {
    @Override
    public String id() {
        return pin;
    }

    @Override
    public List<String> points() {
        return List.of(pin);
    }

    @Override
    public Driver withParameters(Parameters p) {
        return new Driver(pin, model, p, location);
    }
}
