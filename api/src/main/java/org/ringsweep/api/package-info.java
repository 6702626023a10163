/**
 * The ringsweep API: what an in-house plugin compiles against.
 *
 * <p>Tier: public. Sub-packages hold the quantity model ({@code quantity}), the net topology
 * ({@code net}), the flat circuit an engine solves ({@code circuit}) and sampled waveforms
 * ({@code wave}). Every type here is immutable unless it says otherwise. Nothing in this module
 * knows about templates, processes or file formats. Parameters and return values are non-null
 * unless documented otherwise.
 */
package org.ringsweep.api;
