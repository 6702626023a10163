/**
 * Elaboration: a {@link org.ringsweep.api.net.Net} (with its point already applied) becomes a flat
 * {@link org.ringsweep.api.circuit.Circuit}, together with the edge schedule and the receiver
 * thresholds the measurements need.
 *
 * <p>Tier: internal.
 */
package org.ringsweep.generators.elaborate;
