/**
 * The built-in transient engine: solves a {@link org.ringsweep.api.circuit.Circuit} in-process
 * (modified nodal analysis, trapezoidal integration with damped starts, method of
 * characteristics for lines, Newton–Raphson for diodes and
 * table-driven sources), so ngspice and this engine can be
 * compared point by point. Entry point: {@link org.ringsweep.runner.engine.builtin.BuiltinEngine}.
 *
 * <p>Tier: internal (used by the runner's point runner; not a plugin API).
 */
package org.ringsweep.runner.engine.builtin;
