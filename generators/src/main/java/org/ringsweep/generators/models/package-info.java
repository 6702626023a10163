/**
 * The built-in driver and receiver models.
 *
 * <p>Tier: internal.
 */
package org.ringsweep.generators.models;
