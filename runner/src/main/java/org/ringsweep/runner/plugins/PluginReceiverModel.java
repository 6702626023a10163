package org.ringsweep.runner.plugins;

import java.util.List;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.model.ReceiverContext;
import org.ringsweep.api.model.ReceiverModel;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Receiver;

/** A plugin's receiver model as the host uses it: descriptors read once, every call guarded. */
final class PluginReceiverModel implements ReceiverModel {
    private final ReceiverModel model;
    private final PluginSource source;
    private final String id;
    private final String description;
    private final List<ParameterSpec> parameters;

    PluginReceiverModel(ReceiverModel model, PluginSource source, String id, String description, List<ParameterSpec> parameters) {
        this.model = model;
        this.source = source;
        this.id = id;
        this.description = description;
        this.parameters = List.copyOf(parameters);
    }

    private String what(String call) {
        return "receiver model `" + id + "` (" + call + ")";
    }

    @Override
    public String id() {
        return id;
    }

    @Override
    public Role role() {
        return Role.RECEIVER;
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
    public Thresholds thresholds(Receiver receiver, NetRails rails) {
        return Guard.call(source, what("thresholds"), () -> model.thresholds(receiver, rails));
    }

    @Override
    public double inputCapacitance(Receiver receiver) {
        return Guard.call(source, what("inputCapacitance"), () -> model.inputCapacitance(receiver));
    }

    @Override
    public void elaborate(Receiver receiver, ReceiverContext ctx) {
        Guard.run(source, what("elaborate"), () -> model.elaborate(receiver, ctx));
    }
}
