package org.ringsweep.runner.plugins;

import java.util.List;
import org.ringsweep.api.model.DriverContext;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Stimulus;

/** A plugin's driver model as the host uses it: descriptors read once, every call guarded. */
final class PluginDriverModel extends GuardedDescriptor implements DriverModel {
    private final DriverModel model;

    PluginDriverModel(DriverModel model, PluginSource source, String id, String description, List<ParameterSpec> parameters) {
        super(model, Role.DRIVER, source, id, description, parameters);
        this.model = model;
    }

    @Override
    public Swing swing(Driver driver, NetRails rails) {
        return Guard.call(source, what("swing"), () -> model.swing(driver, rails));
    }

    @Override
    public double fullTransition(Driver driver, Stimulus.Edge edge, NetRails rails) {
        return Guard.call(source, what("fullTransition"), () -> model.fullTransition(driver, edge, rails));
    }

    @Override
    public double sourceResistance(Driver driver, NetRails rails) {
        return Guard.call(source, what("sourceResistance"), () -> model.sourceResistance(driver, rails));
    }

    @Override
    public double delay(Driver driver) {
        return Guard.call(source, what("delay"), () -> model.delay(driver));
    }

    @Override
    public void elaborate(Driver driver, DriverContext ctx) {
        Guard.run(source, what("elaborate"), () -> model.elaborate(driver, ctx));
    }
}
