package org.ringsweep.runner.plugins;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.model.ApiVersion;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.RingsweepPlugin;

class PluginRegistryTests {
    @TempDir
    Path dir;

    private static PluginRegistry withPlugins(RingsweepPlugin... plugins) {
        PluginRegistry.Builder b = PluginRegistry.builder().discoverClassPath(false);
        for (RingsweepPlugin p : plugins) {
            b.add(p, "test:" + p.id());
        }
        return b.build();
    }

    @Test
    void builtInOnlyKnowsTheBuiltInModelsAndNoChecks() {
        PluginRegistry r = PluginRegistry.builtInOnly();
        // Drivers first, each role sorted by id: the built-in set, whatever it holds.
        List<String> expected = new java.util.ArrayList<>();
        expected.addAll(org.ringsweep.generators.models.BuiltinModels.drivers().stream().map(ModelDescriptor::id).sorted().toList());
        expected.addAll(org.ringsweep.generators.models.BuiltinModels.receivers().stream().map(ModelDescriptor::id).sorted().toList());
        assertEquals(expected, r.catalog().all().stream().map(ModelDescriptor::id).toList());
        assertTrue(r.catalog().all().stream().allMatch(m -> m.origin().equals(PluginRegistry.BUILT_IN)));
        assertTrue(r.checks().isEmpty());
        assertTrue(r.plugins().isEmpty());
    }

    @Test
    void aHandAddedPluginsModelIsInTheCatalogWithItsOriginAndElaborates() {
        PluginRegistry r = withPlugins(TestPlugins.plugin("acme", TestPlugins.rampNamed("acme-io")));
        ModelDescriptor m = r.catalog().find(ModelDescriptor.Role.DRIVER, "acme-io").orElseThrow();
        assertEquals("plugin `acme` 1.0 (test:acme)", m.origin());
        List<String> drivers = new java.util.ArrayList<>(List.of("acme-io"));
        org.ringsweep.generators.models.BuiltinModels.drivers().forEach(d -> drivers.add(d.id()));
        assertEquals(drivers.stream().sorted().toList(), r.drivers().stream().map(ModelDescriptor::id).sorted().toList());
        assertTrue(r.messages().get(0).contains("plugin `acme` 1.0 (test:acme): driver acme-io"), r.messages().toString());
    }

    @Test
    void anApiVersionMismatchNamesThePluginAndBothVersions() {
        RingsweepPlugin future = new TestPlugins.Fixed("acme", "2.0", ApiVersion.CURRENT + 1, List.of(), List.of());
        PluginLoadException e = assertThrows(PluginLoadException.class, () -> withPlugins(future));
        assertTrue(e.getMessage().contains("plugin `acme` 2.0 (test:acme)"), e.getMessage());
        assertTrue(e.getMessage().contains("plugin API version " + (ApiVersion.CURRENT + 1)), e.getMessage());
        assertTrue(e.getMessage().contains("provides version " + ApiVersion.CURRENT), e.getMessage());
    }

    @Test
    void aPluginIdUsedTwiceNamesBothSources() {
        PluginLoadException e = assertThrows(PluginLoadException.class, () -> PluginRegistry.builder().discoverClassPath(false)
                .add(TestPlugins.plugin("acme"), "a.jar").add(TestPlugins.plugin("acme"), "b.jar").build());
        assertTrue(e.getMessage().contains("(a.jar)") && e.getMessage().contains("(b.jar)"), e.getMessage());
    }

    @Test
    void aModelIdThatABuiltInUsesIsRejectedNamingBoth() {
        PluginLoadException e = assertThrows(PluginLoadException.class,
                () -> withPlugins(TestPlugins.plugin("acme", TestPlugins.rampNamed("ramp"))));
        assertTrue(e.getMessage().contains("driver model id `ramp` of plugin `acme` 1.0 (test:acme) clashes with the built-in driver model"),
                e.getMessage());
    }

    @Test
    void aModelIdAnotherPluginUsesIsRejectedNamingBoth() {
        PluginLoadException e = assertThrows(PluginLoadException.class, () -> withPlugins(
                TestPlugins.plugin("acme", TestPlugins.rampNamed("io")), TestPlugins.plugin("other", TestPlugins.rampNamed("io"))));
        assertTrue(e.getMessage().contains("plugin `other`") && e.getMessage().contains("plugin `acme`"), e.getMessage());
    }

    @Test
    void blankMalformedAndReservedIdsAreRejected() {
        for (String id : new String[] {"", " ", "Acme", "acme_io", "ringsweep-extra"}) {
            PluginLoadException e = assertThrows(PluginLoadException.class,
                    () -> withPlugins(TestPlugins.plugin("acme", TestPlugins.rampNamed(id))), "`" + id + "`");
            assertTrue(e.getMessage().contains("plugin `acme`") || e.getMessage().contains("(test:acme)"), e.getMessage());
        }
        PluginLoadException reserved = assertThrows(PluginLoadException.class, () -> withPlugins(TestPlugins.plugin("ringsweep-x")));
        assertTrue(reserved.getMessage().contains("reserved prefix `ringsweep`"), reserved.getMessage());
    }

    @Test
    void aCheckWhoseLimitKeyIsABuiltInLimitIsRejected() {
        org.ringsweep.api.model.EdgeCheck overshoot = new TestPlugins.BrokenCheck() {
            @Override
            public String limitKey() {
                return "overshoot_max";
            }
        };
        PluginLoadException e = assertThrows(PluginLoadException.class,
                () -> withPlugins(new TestPlugins.Fixed("acme", "1.0", ApiVersion.CURRENT, List.of(), List.of(overshoot))));
        assertTrue(e.getMessage().contains("limit key `overshoot_max`") && e.getMessage().contains("the built-in limit"), e.getMessage());
    }

    @Test
    void pluginsInAFolderAreFoundByServiceLoaderAndLoggedWithIdVersionAndLocation() {
        TestPlugins.jarListing(dir, "broken.jar", TestPlugins.BrokenDriverPlugin.class, TestPlugins.BrokenCheckPlugin.class);
        PluginRegistry r = PluginRegistry.builder().discoverClassPath(false).pluginDir(dir).build();
        assertEquals(List.of("test-broken-driver", "test-broken-check"), r.plugins().stream().map(PluginSource::id).toList());
        assertEquals("0.0.1", r.plugins().get(0).version());
        assertTrue(r.catalog().find(ModelDescriptor.Role.DRIVER, "broken-io").isPresent());
        assertEquals(List.of("broken_max"), r.checks().stream().map(PluginCheck::limitKey).toList());
        assertEquals(2, r.messages().size(), r.messages().toString());
        assertTrue(r.messages().get(0).startsWith("loaded plugin `test-broken-driver` 0.0.1 ("), r.messages().toString());
    }

    @Test
    void aFolderPluginBuiltForAnotherApiVersionIsAClearError() {
        TestPlugins.jarListing(dir, "future.jar", TestPlugins.FuturePlugin.class);
        PluginLoadException e = assertThrows(PluginLoadException.class,
                () -> PluginRegistry.builder().discoverClassPath(false).pluginDir(dir).build());
        assertTrue(e.getMessage().startsWith("plugin `test-future` 9.0 ("), e.getMessage());
    }

    @Test
    void aPluginFolderThatIsMissingIsAnErrorAndAnEmptyOneIsLogged() throws Exception {
        PluginLoadException e = assertThrows(PluginLoadException.class,
                () -> PluginRegistry.builder().discoverClassPath(false).pluginDir(dir.resolve("nope")).build());
        assertTrue(e.getMessage().contains("--plugins `" + dir.resolve("nope") + "`: not a folder"), e.getMessage());
        Files.createDirectories(dir.resolve("empty"));
        PluginRegistry r = PluginRegistry.builder().discoverClassPath(false).pluginDir(dir.resolve("empty")).build();
        assertTrue(r.messages().get(0).contains("no .jar files found"), r.messages().toString());
    }

    @Test
    void aProviderThatCannotBeCreatedNamesItsClass() {
        TestPlugins.jarListing(dir, "bad.jar", PluginRegistryTests.class); // not a RingsweepPlugin
        PluginLoadException e = assertThrows(PluginLoadException.class,
                () -> PluginRegistry.builder().discoverClassPath(false).pluginDir(dir).build());
        assertTrue(e.getMessage().contains(PluginRegistryTests.class.getName()) && e.getMessage().contains(dir.toString()), e.getMessage());
    }
}
