/**
 * Reading input files: the net file ({@code format: ringsweep/net-1}) into a
 * {@link org.ringsweep.api.net.Net}, and {@code ID/param} overrides (corners, {@code --set}) into a
 * {@link org.ringsweep.api.net.Point}. Every error is an {@link org.ringsweep.runner.input.InputException}
 * naming the file, line, column and key path and what was expected.
 *
 * <p>Key paths use YAML keys joined by {@code .} and zero-based list indexes in brackets:
 * {@code segments[2].z0} is the {@code z0} of the third segment.
 *
 * <p>{@link org.ringsweep.runner.input.YamlSource} and {@link org.ringsweep.runner.input.YamlMap} are
 * public so that other input files (the sweep file) are read and reported the same way.
 *
 * <p>Tier: public (used by the command line and by tests of other modules).
 */
package org.ringsweep.runner.input;
