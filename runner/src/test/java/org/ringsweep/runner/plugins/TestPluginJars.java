package org.ringsweep.runner.plugins;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;

/** Plugin folders holding one jar each with a test plugin, for the command-line tests. */
public final class TestPluginJars {
    private TestPluginJars() {
    }

    private static Path folder(Path dir) {
        try {
            return Files.createDirectories(dir);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** A folder with the plugin whose driver {@code broken-io} throws in elaborate. */
    public static Path brokenDriver(Path dir) {
        TestPlugins.jarListing(folder(dir), "broken-driver.jar", TestPlugins.BrokenDriverPlugin.class);
        return dir;
    }

    /** A folder with the plugin whose check {@code broken-check} throws on every edge. */
    public static Path brokenCheck(Path dir) {
        TestPlugins.jarListing(folder(dir), "broken-check.jar", TestPlugins.BrokenCheckPlugin.class);
        return dir;
    }

    /** A folder with a plugin built for the next API version. */
    public static Path future(Path dir) {
        TestPlugins.jarListing(folder(dir), "future.jar", TestPlugins.FuturePlugin.class);
        return dir;
    }
}
