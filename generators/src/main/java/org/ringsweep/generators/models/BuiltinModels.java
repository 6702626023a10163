package org.ringsweep.generators.models;

import java.util.List;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.ReceiverModel;

/**
 * The built-in models: {@code ramp} and {@code open-drain} (drivers, {@link RampDriverModel},
 * {@link OpenDrainDriverModel}), {@code cmos} (receiver, {@link CmosReceiverModel}) and {@code ibis}
 * (driver {@link IbisDriverModel} and receiver {@link IbisReceiverModel}). Each descriptor is also
 * the model's implementation.
 */
public final class BuiltinModels implements ModelCatalog {
    /** The built-in ramp driver id. */
    public static final String RAMP = "ramp";
    /** The built-in open-drain driver id. */
    public static final String OPEN_DRAIN = "open-drain";
    /** The built-in CMOS receiver id. */
    public static final String CMOS = "cmos";
    /** The built-in IBIS driver and receiver id. */
    public static final String IBIS = "ibis";

    /** The built-in driver models. */
    public static List<DriverModel> drivers() {
        return List.of(RampDriverModel.INSTANCE, OpenDrainDriverModel.INSTANCE, IbisDriverModel.INSTANCE);
    }

    /** The built-in receiver models. */
    public static List<ReceiverModel> receivers() {
        return List.of(CmosReceiverModel.INSTANCE, IbisReceiverModel.INSTANCE);
    }

    @Override
    public List<ModelDescriptor> all() {
        return List.of(RampDriverModel.INSTANCE, OpenDrainDriverModel.INSTANCE, IbisDriverModel.INSTANCE, CmosReceiverModel.INSTANCE,
                IbisReceiverModel.INSTANCE);
    }
}
