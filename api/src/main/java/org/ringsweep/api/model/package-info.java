/**
 * Descriptions of driver and receiver models: their ids and parameters with units and defaults,
 * so that input files can be checked before anything is simulated. The elaboration half of the
 * plugin SPI lives beside it once it is stable.
 *
 * <p>Tier: public, for plugin authors; EXPERIMENTAL.
 */
package org.ringsweep.api.model;
