package org.ringsweep.runner.plugins;

import java.util.List;
import org.ringsweep.api.model.DriverContext;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Stimulus;

/** A plugin's driver model as the host uses it: descriptors read once, every call guarded. */
final class PluginDriverModel implements DriverModel {
    private final DriverModel model;
    private final PluginSource source;
    private final String id;
    private final String description;
    private final List<ParameterSpec> parameters;

    PluginDriverModel(DriverModel model, PluginSource source, String id, String description, List<ParameterSpec> parameters) {
        this.model = model;
        this.source = source;
        this.id = id;
        this.description = description;
        this.parameters = List.copyOf(parameters);
    }

    private String what(String call) {
        return "driver model `" + id + "` (" + call + ")";
    }

    @Override
    public String id() {
        return id;
    }

    @Override
    public Role role() {
        return Role.DRIVER;
    }

    @Override
    public String description() {
        return description;
    }

    @Override
    public List<ParameterSpec> parameters() {
        return parameters;
    }

    @Override
    public String origin() {
        return source.describe();
    }

    @Override
    public List<Problem> check(Parameters given) {
        return List.copyOf(Guard.call(source, what("check"), () -> model.check(given)));
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
