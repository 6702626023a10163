package org.ringsweep.runner.engine;

/**
 * Something that simulates a deck: today ngspice as an external program.
 *
 * <p>Implementations are thread-safe: several jobs may run at once, each in its own work folder.
 */
public interface SimulationEngine {
    /** The engine's name as results report it, e.g. {@code ngspice}. */
    String name();

    /** The engine's version as results report it, e.g. {@code 39}; {@code unknown} when it could not be read. */
    String version();

    /**
     * Runs one job to its end, its timeout, its stall (no progress of the simulated time for the
     * job's stall timeout) or its failure. Never throws for a simulation problem: every failure
     * comes back as a {@link SimulationOutcome.Failure} whose message quotes the engine's own words.
     *
     * @param job the deck and where to run it
     * @return the waveforms, or why there are none
     */
    SimulationOutcome run(SimulationJob job);
}
