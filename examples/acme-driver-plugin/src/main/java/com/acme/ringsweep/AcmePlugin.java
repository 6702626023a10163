package com.acme.ringsweep;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.List;
import java.util.Properties;
import org.ringsweep.api.model.ApiVersion;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.EdgeCheck;
import org.ringsweep.api.model.RingsweepPlugin;

/**
 * The Acme Instruments plugin: registers {@link AcmeIoDriverModel} and
 * {@link InputTransitionCheck}. Listed in {@code META-INF/services/org.ringsweep.api.model.RingsweepPlugin}.
 */
public final class AcmePlugin implements RingsweepPlugin {
    /** The plugin id. */
    public static final String ID = "acme-instruments";

    private final String version = readVersion();

    /** For ServiceLoader. */
    public AcmePlugin() {
    }

    @Override
    public String id() {
        return ID;
    }

    /** The build's version, from the filtered {@code acme-plugin.properties}. */
    @Override
    public String version() {
        return version;
    }

    @Override
    public int apiVersion() {
        return ApiVersion.CURRENT;
    }

    @Override
    public List<DriverModel> drivers() {
        return List.of(AcmeIoDriverModel.INSTANCE);
    }

    @Override
    public List<EdgeCheck> checks() {
        return List.of(InputTransitionCheck.INSTANCE);
    }

    private static String readVersion() {
        try (InputStream in = AcmePlugin.class.getResourceAsStream("acme-plugin.properties")) {
            Properties p = new Properties();
            if (in != null) {
                p.load(in);
            }
            return p.getProperty("version", "unknown");
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
