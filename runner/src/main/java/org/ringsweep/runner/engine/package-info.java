/**
 * Simulation engines: turn a rendered deck into sampled {@link org.ringsweep.api.wave.Waveforms}
 * or a classified failure. {@link org.ringsweep.runner.engine.NgspiceEngine} runs ngspice as an
 * external batch process; {@link org.ringsweep.runner.engine.EngineSelector} resolves the
 * {@code --engine} option.
 *
 * <p>Tier: internal (used by the runner's commands; not a plugin API).
 */
package org.ringsweep.runner.engine;
