/**
 * Test helpers shared through the runner's test-jar: {@link org.ringsweep.runner.testing.Ngspice}
 * (the reference simulator, or skip) and {@link org.ringsweep.runner.testing.ModelContract} (the
 * contract test for driver and receiver models, for plugin authors).
 *
 * <p>Tier: tests only; published for plugin authors.
 */
package org.ringsweep.runner.testing;
