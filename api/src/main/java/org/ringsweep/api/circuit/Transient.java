package org.ringsweep.api.circuit;

import org.apiguardian.api.API;

/**
 * The transient analysis to run.
 *
 * @param step    output/print step (s), positive
 * @param stop    stop time (s), greater than step
 * @param maxStep largest internal time step the solver may take (s), positive
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record Transient(double step, double stop, double maxStep) {
    /** Validates. */
    public Transient {
        Checks.positive(step, "transient step");
        Checks.positive(stop, "transient stop");
        Checks.positive(maxStep, "transient max step");
        if (stop <= step) {
            throw new IllegalArgumentException("transient stop " + stop + " must exceed the step " + step);
        }
    }
}
