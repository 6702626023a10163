/**
 * Measurements on one receiver waveform, edge by edge: extremes, overshoot and undershoot
 * against the rails, ringback margin, threshold crossings (with hysteresis), delay, monotonicity,
 * slew and settling, plus the area beyond a level. Pure functions on sampled, possibly
 * non-uniform time series with linear interpolation between samples, following the algorithms of
 * {@code waveform-metrics.md} §4 (IEEE Std 181-2011 vocabulary). Times in seconds, voltages in
 * volts. A metric that could not be found is NaN, never zero.
 *
 * <p>Tier: internal (runner only; not for plugins).
 */
package org.ringsweep.runner.measure;
