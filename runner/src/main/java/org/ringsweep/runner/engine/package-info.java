/**
 * Simulation engines: turn a rendered deck into sampled {@link org.ringsweep.api.wave.Waveforms}
 * or a classified failure. {@link org.ringsweep.runner.engine.NgspiceEngine} runs ngspice as an
 * external batch process; {@link org.ringsweep.runner.engine.EngineSelector} resolves the
 * {@code --engine} option.
 *
 * <p>Every run is bounded twice: by its wall-clock timeout
 * ({@link org.ringsweep.runner.engine.FailureKind#TIMEOUT}) and by its stall timeout, the time
 * the transient may go without its simulated time advancing once ngspice has reported a first
 * time point ({@link org.ringsweep.runner.engine.FailureKind#STALLED}, a time step collapse that
 * a retry with conservative options usually cures). Both kill the engine's whole process tree.
 *
 * <p>{@link org.ringsweep.runner.engine.NgspiceBatch} runs several points in one ngspice process
 * and falls back to one process per point for every point the batch does not prove good.
 *
 * <p>Tier: internal (used by the runner's commands; not a plugin API).
 */
package org.ringsweep.runner.engine;
