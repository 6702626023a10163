package org.ringsweep.api.net;

import org.apiguardian.api.API;

/**
 * The {@code simulation:} block: stop time and maximum time step, each NaN for {@code auto}.
 *
 * @param stopSeconds stop time, NaN for auto
 * @param stepSeconds largest time step, NaN for auto
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record SimulationSettings(double stopSeconds, double stepSeconds) {
    /** Both automatic. */
    public static final SimulationSettings AUTO = new SimulationSettings(Double.NaN, Double.NaN);

    /** Whether the stop time is automatic. */
    public boolean isStopAuto() {
        return Double.isNaN(stopSeconds);
    }

    /** Whether the step is automatic. */
    public boolean isStepAuto() {
        return Double.isNaN(stepSeconds);
    }
}
