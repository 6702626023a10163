/**
 * Discovery and registration of plugins ({@link org.ringsweep.api.model.RingsweepPlugin}): the
 * built-in models plus those found by {@link java.util.ServiceLoader} on the class path and in
 * the jars of {@code --plugins DIR}, validated (ids, API version) and wrapped so that a plugin
 * that throws is named in the error.
 *
 * <p>Tier: internal.
 */
package org.ringsweep.runner.plugins;
