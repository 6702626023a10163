package org.ringsweep.runner.plugins;

/**
 * Where a registered plugin came from, for logs, {@code ringsweep models} and error messages.
 *
 * @param id       the plugin's id
 * @param version  the plugin's version
 * @param location the jar or folder it was loaded from ({@code class path} when unknown, or the
 *                 text given to {@link PluginRegistry.Builder#add})
 */
public record PluginSource(String id, String version, String location) {
    /** {@code plugin `acme-instruments` 1.0.0 (/opt/acme.jar)}. */
    public String describe() {
        return "plugin `" + id + "` " + version + " (" + location + ")";
    }
}
