package org.ringsweep.runner.plugins;

import java.util.List;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.net.Parameters;

/**
 * The descriptor half shared by the guarded driver and receiver wrappers: id, description and
 * parameters read once at registration, the origin from the plugin source, and {@code check}
 * guarded like every other call into plugin code.
 */
abstract class GuardedDescriptor implements ModelDescriptor {
    private final ModelDescriptor model;
    final PluginSource source;
    private final String id;
    private final String description;
    private final List<ParameterSpec> parameters;
    private final Role role;

    GuardedDescriptor(ModelDescriptor model, Role role, PluginSource source, String id, String description,
                      List<ParameterSpec> parameters) {
        this.model = model;
        this.role = role;
        this.source = source;
        this.id = id;
        this.description = description;
        this.parameters = List.copyOf(parameters);
    }

    /** How a call is named in a plugin-failure message, e.g. "driver model `x` (elaborate)". */
    final String what(String call) {
        return role.name().toLowerCase(java.util.Locale.ROOT) + " model `" + id + "` (" + call + ")";
    }

    @Override
    public final String id() {
        return id;
    }

    @Override
    public final Role role() {
        return role;
    }

    @Override
    public final String description() {
        return description;
    }

    @Override
    public final List<ParameterSpec> parameters() {
        return parameters;
    }

    @Override
    public final String origin() {
        return source.describe();
    }

    @Override
    public final List<Problem> check(Parameters given) {
        return List.copyOf(Guard.call(source, what("check"), () -> model.check(given)));
    }
}
