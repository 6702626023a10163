/**
 * Descriptions of driver and receiver models: their ids and parameters with units and defaults,
 * so that input files can be checked before anything is simulated, and the elaboration half of
 * the plugin SPI: {@link org.ringsweep.api.model.DriverModel} and
 * {@link org.ringsweep.api.model.ReceiverModel} turn a driver or receiver into circuit primitives
 * through a narrow {@link org.ringsweep.api.model.ElaborationContext}; and the packaging half:
 * a {@link org.ringsweep.api.model.RingsweepPlugin} bundles models and extra
 * {@link org.ringsweep.api.model.EdgeCheck}s under an id, a version and the
 * {@link org.ringsweep.api.model.ApiVersion} it was built for, found by
 * {@link java.util.ServiceLoader}.
 *
 * <p>Tier: public, for plugin authors; EXPERIMENTAL.
 */
package org.ringsweep.api.model;
