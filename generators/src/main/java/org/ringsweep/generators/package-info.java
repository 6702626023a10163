/**
 * Elaboration (net + point → circuit), built-in models and the ngspice deck writer.
 *
 * <p>Tier: internal to ringsweep; plugin authors use {@code org.ringsweep.api}.
 */
package org.ringsweep.generators;
