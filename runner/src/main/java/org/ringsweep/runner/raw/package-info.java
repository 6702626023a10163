/**
 * ngspice raw files: {@link org.ringsweep.runner.raw.RawFileReader} turns binary or ASCII raw
 * files (one or several plots, complete, padded or cut short by a failed or killed run) into
 * {@link org.ringsweep.runner.raw.RawPlot} columns; {@link org.ringsweep.runner.raw.RawFileWriter}
 * writes plots back in ngspice's own layout. Format facts: {@code shared/reference/ngspice.md}
 * §9 and §10.
 *
 * <p>Tier: internal to the runner.
 */
package org.ringsweep.runner.raw;
