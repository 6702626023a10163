package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Optional;
import org.ringsweep.runner.plugins.PluginLoadException;
import org.ringsweep.runner.plugins.PluginRegistry;

/** Sets up the plugin registry of a command: class path plus {@code --plugins DIR}, finds logged to stderr. */
final class Plugins {
    private Plugins() {
    }

    /**
     * The registry, or empty after printing why it could not be built (the caller exits with 2).
     *
     * @param dir   the {@code --plugins} folder, or null
     * @param quiet whether to keep the load log to oneself
     * @param err   standard error
     */
    static Optional<PluginRegistry> loadOrReport(Path dir, boolean quiet, PrintWriter err) {
        try {
            return Optional.of(build(dir, quiet, err));
        } catch (PluginLoadException e) {
            err.println("ringsweep: " + e.getMessage());
            return Optional.empty();
        }
    }

    /** The registry, its load log printed to {@code err} unless quiet; throws when a plugin cannot be registered. */
    private static PluginRegistry build(Path dir, boolean quiet, PrintWriter err) {
        PluginRegistry.Builder b = PluginRegistry.builder();
        if (dir != null) {
            b.pluginDir(dir);
        }
        PluginRegistry registry = b.build();
        if (!quiet) {
            registry.messages().forEach(m -> err.println("ringsweep: " + m));
        }
        return registry;
    }
}
