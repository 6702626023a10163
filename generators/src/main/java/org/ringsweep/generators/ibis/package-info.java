/**
 * A reader for IBIS buffer-model files: a practical subset of IBIS 3.2 to 7 (header, component,
 * package, pins, {@code [Model Selector]}, models with their V–I tables, {@code [Ramp]} and V–t
 * waveform tables). The result
 * is a set of immutable records; the models in {@code org.ringsweep.generators.models} turn them
 * into circuit primitives.
 *
 * <p>Tier: internal.
 */
package org.ringsweep.generators.ibis;
