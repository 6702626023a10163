/**
 * Benchmarks run by the {@code bench} command: each writes its own synthetic input into a work
 * directory, measures, and returns a short report. Performance targets live here, never in
 * timed unit tests.
 *
 * <p>Tier: internal to the runner.
 */
package org.ringsweep.runner.bench;
