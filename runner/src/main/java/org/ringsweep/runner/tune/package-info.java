/**
 * Choosing a value: the default objective that ranks points, and the search behind
 * {@code ringsweep tune}.
 *
 * <p>Tier: internal.
 */
package org.ringsweep.runner.tune;
