/**
 * Sweeps: the sweep file ({@code format: ringsweep/sweep-1}, see {@code formats.md} "Sweep file")
 * read into a {@link org.ringsweep.runner.sweep.SweepFile}, IEC 60063 preferred values
 * ({@link org.ringsweep.runner.sweep.ESeries}), and the plan of points one net runs
 * ({@link org.ringsweep.runner.sweep.SweepPlanner}). Every input problem is an
 * {@link org.ringsweep.runner.input.InputException} naming file, line, column and key path.
 *
 * <p>Tier: public (used by the command line).
 */
package org.ringsweep.runner.sweep;
