/**
 * Running points: apply a corner or swept values to a net, elaborate, write the deck, simulate,
 * measure every receiver edge and check the limits, giving one result record per point.
 *
 * <p>Tier: internal.
 */
package org.ringsweep.runner.check;
