package org.ringsweep.runner.plugins;

import java.util.function.Supplier;
import org.ringsweep.api.model.ModelParameterException;

/** Runs plugin code, turning what it throws (except parameter complaints) into a named failure. */
final class Guard {
    private Guard() {
    }

    static <T> T call(PluginSource source, String what, Supplier<T> body) {
        try {
            return body.get();
        } catch (ModelParameterException | PluginFailureException e) {
            throw e;
        } catch (RuntimeException | LinkageError e) {
            // LinkageError: a plugin compiled against other api classes (AbstractMethodError, NoClassDefFoundError).
            throw new PluginFailureException(source, what, e);
        }
    }

    static void run(PluginSource source, String what, Runnable body) {
        call(source, what, () -> {
            body.run();
            return null;
        });
    }
}
