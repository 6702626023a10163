package org.ringsweep.api.circuit;

import org.apiguardian.api.API;

/**
 * The transient analysis to run.
 *
 * @param step    output/print step (s), positive
 * @param stop    stop time (s), greater than step
 * @param maxStep largest internal time step the solver may take (s), positive
 * @param stepAuto whether {@code maxStep} is the elaborator's own resolution rule
 *                 ({@code simulation.step: auto}) rather than the user's explicit step: an engine
 *                 with its own truncation-error control may then step further where the waveform
 *                 allows it; an explicit step is always honoured as the largest step
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record Transient(double step, double stop, double maxStep, boolean stepAuto) {
    /**
     * An analysis whose maximum step is explicit (honoured as given).
     *
     * @param step    output/print step (s), positive
     * @param stop    stop time (s), greater than step
     * @param maxStep largest internal time step the solver may take (s), positive
     */
    public Transient(double step, double stop, double maxStep) {
        this(step, stop, maxStep, false);
    }

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
