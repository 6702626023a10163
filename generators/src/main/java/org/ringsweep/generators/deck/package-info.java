/**
 * The ngspice deck writer: renders a {@link org.ringsweep.api.circuit.Circuit} through the
 * Freemarker templates of the {@code templates} module (or a user's copy).
 *
 * <p>Tier: internal.
 */
package org.ringsweep.generators.deck;
