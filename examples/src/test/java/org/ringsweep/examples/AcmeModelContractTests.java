package org.ringsweep.examples;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.runner.plugins.PluginRegistry;
import org.ringsweep.runner.testing.ModelContract;

/**
 * The model contract (runner test-jar) over the example plugin's model, loaded from its jar: what
 * a plugin author's own test looks like.
 */
class AcmeModelContractTests extends ModelContract {
    @Override
    protected List<ModelCase> cases() {
        try {
            Path tmp = Files.createTempDirectory("acme-contract");
            PluginRegistry r = PluginRegistry.builder().discoverClassPath(false).pluginDir(AcmePluginFolder.create(tmp)).build();
            ModelDescriptor acme = r.catalog().find(ModelDescriptor.Role.DRIVER, "acme-io").orElseThrow();
            return List.of(
                    new ModelCase(acme, Map.of("v_high", "VCC")),
                    new ModelCase(acme, Map.of("v_high", "VCC", "drive", "12mA", "slew", "slow")));
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }
}
