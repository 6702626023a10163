/**
 * Descriptions of driver and receiver models: their ids and parameters with units and defaults,
 * so that input files can be checked before anything is simulated, and the elaboration half of
 * the plugin SPI: {@link org.ringsweep.api.model.DriverModel} and
 * {@link org.ringsweep.api.model.ReceiverModel} turn a driver or receiver into circuit primitives
 * through a narrow {@link org.ringsweep.api.model.ElaborationContext}.
 *
 * <p>Tier: public, for plugin authors; EXPERIMENTAL.
 */
package org.ringsweep.api.model;
