package org.ringsweep.runner.plugins;

/**
 * Plugin code threw while a point was being elaborated or checked (anything but a
 * {@link org.ringsweep.api.model.ModelParameterException}, which is an input error). The point
 * becomes an error record whose message names the plugin, the model or check and the point; the
 * other points go on.
 */
public final class PluginFailureException extends RuntimeException {
    private static final long serialVersionUID = 1L;
    private final transient PluginSource source;

    /**
     * @param source the plugin
     * @param what   the model or check and the call, e.g. {@code driver model `acme-io` (elaborate)}
     * @param cause  what the plugin threw
     */
    public PluginFailureException(PluginSource source, String what, Throwable cause) {
        super(source.describe() + ": " + what + " failed: " + cause.getClass().getName()
                + (cause.getMessage() == null ? "" : ": " + cause.getMessage()), cause);
        this.source = source;
    }

    /** The plugin that failed. */
    public PluginSource source() {
        return source;
    }
}
