/**
 * Physical quantities with units: parsing of user text ({@code 2ns}, {@code 4k7}, {@code 500mil})
 * into SI base values checked against the kind a key expects.
 *
 * <p>Tier: public.
 */
package org.ringsweep.api.quantity;
