/**
 * Sampled waveforms from a transient analysis: one strictly increasing, possibly non-uniform time
 * axis and the voltages recorded on it.
 *
 * <p>Tier: public.
 */
package org.ringsweep.api.wave;
