package org.ringsweep.runner.plugins;

import java.util.Optional;
import org.ringsweep.api.model.EdgeCheck;
import org.ringsweep.api.model.EdgeSample;

/**
 * A plugin's edge check as the host uses it: id, limit key and description read once, every
 * {@link #check} guarded so that a throw names the plugin.
 */
public final class PluginCheck implements EdgeCheck {
    private final EdgeCheck check;
    private final PluginSource source;
    private final String id;
    private final String limitKey;
    private final String description;

    PluginCheck(EdgeCheck check, PluginSource source, String id, String limitKey, String description) {
        this.check = check;
        this.source = source;
        this.id = id;
        this.limitKey = limitKey;
        this.description = description;
    }

    @Override
    public String id() {
        return id;
    }

    @Override
    public String limitKey() {
        return limitKey;
    }

    @Override
    public String description() {
        return description;
    }

    /** Where the check came from ({@link PluginSource#describe()}). */
    public String origin() {
        return source.describe();
    }

    /** The plugin it belongs to. */
    public PluginSource source() {
        return source;
    }

    /**
     * {@inheritDoc}
     *
     * @throws PluginFailureException when the plugin's check throws or returns null
     */
    @Override
    public Optional<Finding> check(EdgeSample sample) {
        Optional<Finding> f = Guard.call(source, "check `" + id + "`", () -> check.check(sample));
        if (f == null) {
            throw new PluginFailureException(source, "check `" + id + "`", new NullPointerException("check returned null, expected Optional.empty()"));
        }
        return f;
    }
}
