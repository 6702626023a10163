/**
 * Closed-form design checks on a net that need no simulation, such as the I²C pull-up window.
 *
 * <p>Tier: internal.
 */
package org.ringsweep.generators.analysis;
