/**
 * An example in-house ringsweep plugin from the invented company Acme Instruments: the
 * {@code acme-io} driver model ({@link com.acme.ringsweep.AcmeIoDriverModel}) and the
 * {@code acme-input-transition} check ({@link com.acme.ringsweep.InputTransitionCheck}). All its
 * figures are invented demo data, not any real part's.
 *
 * <p>Tier: example (public, for plugin authors to copy).
 */
package com.acme.ringsweep;
