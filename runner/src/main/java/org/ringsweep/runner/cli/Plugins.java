package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import org.ringsweep.runner.plugins.PluginLoadException;
import org.ringsweep.runner.plugins.PluginRegistry;

/** Sets up the plugin registry of a command: class path plus {@code --plugins DIR}, finds logged to stderr. */
final class Plugins {
    private Plugins() {
    }

    /**
     * The registry, its load log printed to {@code err} unless quiet.
     *
     * @param dir   the {@code --plugins} folder, or null
     * @param quiet whether to keep the load log to oneself
     * @param err   standard error
     * @throws PluginLoadException when a plugin cannot be registered (the caller exits with 2)
     */
    static PluginRegistry load(Path dir, boolean quiet, PrintWriter err) {
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
