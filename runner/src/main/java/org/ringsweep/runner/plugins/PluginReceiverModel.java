package org.ringsweep.runner.plugins;

import java.util.List;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.model.ReceiverContext;
import org.ringsweep.api.model.ReceiverModel;
import org.ringsweep.api.net.Receiver;

/** A plugin's receiver model as the host uses it: descriptors read once, every call guarded. */
final class PluginReceiverModel extends GuardedDescriptor implements ReceiverModel {
    private final ReceiverModel model;

    PluginReceiverModel(ReceiverModel model, PluginSource source, String id, String description, List<ParameterSpec> parameters) {
        super(model, Role.RECEIVER, source, id, description, parameters);
        this.model = model;
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
