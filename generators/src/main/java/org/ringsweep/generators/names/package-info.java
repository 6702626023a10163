/**
 * The single place where user names (points, rails, ids, net names, free text) become safe
 * circuit names, deck comments and file names.
 *
 * <p>Tier: internal.
 */
package org.ringsweep.generators.names;
