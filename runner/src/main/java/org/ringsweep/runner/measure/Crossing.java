package org.ringsweep.runner.measure;

/**
 * One crossing of a level.
 *
 * @param time   the interpolated crossing instant (s)
 * @param rising whether the waveform goes upwards through the level
 */
public record Crossing(double time, boolean rising) {
}
