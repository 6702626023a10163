/**
 * The analytic pre-screen of {@code ringsweep screen}: per net, without simulation, the driver
 * edge rate, knee frequency and bandwidth, path delays, the electrical length against the rise
 * time with a named rule of thumb, the first bounce-diagram voltages and the series-termination
 * value; nets ranked by risk ({@link org.ringsweep.runner.screen.NetScreen}). Formulas and their
 * sources are in {@code shared/reference/lines-and-terminations.md} §2–§4 and §6.
 *
 * <p>Tier: internal (used by the command line).
 */
package org.ringsweep.runner.screen;
