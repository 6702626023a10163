package org.ringsweep.runner.plugins;

/**
 * A plugin that cannot be registered: an unreadable {@code --plugins} folder, a jar whose
 * provider cannot be created, an API version mismatch, a blank, malformed, reserved or clashing
 * id. The message names the plugin (or jar) and says what was expected; the CLI exits with 2.
 */
public final class PluginLoadException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** @param message what is wrong, naming the plugin or jar */
    public PluginLoadException(String message) {
        super(message);
    }

    /**
     * @param message what is wrong, naming the plugin or jar
     * @param cause   the underlying failure
     */
    public PluginLoadException(String message, Throwable cause) {
        super(message, cause);
    }
}
