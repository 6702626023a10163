package org.ringsweep.runner.plugins;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import org.ringsweep.api.model.ApiVersion;
import org.ringsweep.api.model.DriverContext;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.EdgeCheck;
import org.ringsweep.api.model.EdgeSample;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.model.RingsweepPlugin;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.generators.models.RampDriverModel;

/** Small plugins for the registry and failure tests, and a way to put them in a jar. */
public final class TestPlugins {
    private TestPlugins() {
    }

    /** A plugin with fixed answers. */
    record Fixed(String id, String version, int apiVersion, List<DriverModel> drivers, List<EdgeCheck> checks) implements RingsweepPlugin {
    }

    static RingsweepPlugin plugin(String id, DriverModel... drivers) {
        return new Fixed(id, "1.0", ApiVersion.CURRENT, List.of(drivers), List.of());
    }

    /** The ramp's behaviour under another id. */
    static DriverModel rampNamed(String id) {
        return new DriverModel() {
            public String id() {
                return id;
            }

            public Role role() {
                return Role.DRIVER;
            }

            public String description() {
                return "the ramp under another name";
            }

            public List<ParameterSpec> parameters() {
                return RampDriverModel.INSTANCE.parameters();
            }

            public List<Problem> check(org.ringsweep.api.net.Parameters given) {
                return RampDriverModel.INSTANCE.check(given);
            }

            public Swing swing(Driver d, NetRails r) {
                return RampDriverModel.INSTANCE.swing(d, r);
            }

            public double fullTransition(Driver d, Stimulus.Edge e, NetRails r) {
                return RampDriverModel.INSTANCE.fullTransition(d, e, r);
            }

            public double sourceResistance(Driver d, NetRails r) {
                return RampDriverModel.INSTANCE.sourceResistance(d, r);
            }

            public void elaborate(Driver d, DriverContext ctx) {
                RampDriverModel.INSTANCE.elaborate(d, ctx);
            }
        };
    }

    /** A driver that times like the ramp but whose elaborate() hits a bug. */
    static final class BrokenDriver implements DriverModel {
        private final DriverModel ramp = rampNamed("broken-io");

        public String id() {
            return "broken-io";
        }

        public Role role() {
            return Role.DRIVER;
        }

        public String description() {
            return "a driver with a bug in elaborate";
        }

        public List<ParameterSpec> parameters() {
            return ramp.parameters();
        }

        public Swing swing(Driver d, NetRails r) {
            return ramp.swing(d, r);
        }

        public double fullTransition(Driver d, Stimulus.Edge e, NetRails r) {
            return ramp.fullTransition(d, e, r);
        }

        public double sourceResistance(Driver d, NetRails r) {
            return ramp.sourceResistance(d, r);
        }

        public void elaborate(Driver d, DriverContext ctx) {
            throw new IllegalStateException("table index 3 out of range");
        }
    }

    /** A check that throws on every edge. */
    static class BrokenCheck implements EdgeCheck {
        public String id() {
            return "broken-check";
        }

        public String limitKey() {
            return "broken_max";
        }

        public String description() {
            return "a check with a bug";
        }

        public Optional<Finding> check(EdgeSample sample) {
            throw new ArithmeticException("division by zero");
        }
    }

    /** Found through META-INF/services in a jar: the broken driver. */
    public static final class BrokenDriverPlugin implements RingsweepPlugin {
        /** For ServiceLoader. */
        public BrokenDriverPlugin() {
        }

        public String id() {
            return "test-broken-driver";
        }

        public String version() {
            return "0.0.1";
        }

        public int apiVersion() {
            return ApiVersion.CURRENT;
        }

        public List<DriverModel> drivers() {
            return List.of(new BrokenDriver());
        }
    }

    /** Found through META-INF/services in a jar: the broken check. */
    public static final class BrokenCheckPlugin implements RingsweepPlugin {
        /** For ServiceLoader. */
        public BrokenCheckPlugin() {
        }

        public String id() {
            return "test-broken-check";
        }

        public String version() {
            return "0.0.2";
        }

        public int apiVersion() {
            return ApiVersion.CURRENT;
        }

        public List<EdgeCheck> checks() {
            return List.of(new BrokenCheck());
        }
    }

    /** Found through META-INF/services in a jar: built for a future API. */
    public static final class FuturePlugin implements RingsweepPlugin {
        /** For ServiceLoader. */
        public FuturePlugin() {
        }

        public String id() {
            return "test-future";
        }

        public String version() {
            return "9.0";
        }

        public int apiVersion() {
            return ApiVersion.CURRENT + 1;
        }
    }

    /**
     * Writes a jar holding only {@code META-INF/services/...RingsweepPlugin} that lists the given
     * classes (they are on the test class path, which the folder's loader delegates to).
     */
    static Path jarListing(Path dir, String name, Class<?>... providers) {
        Path jar = dir.resolve(name);
        try (JarOutputStream out = new JarOutputStream(Files.newOutputStream(jar))) {
            out.putNextEntry(new JarEntry("META-INF/services/" + RingsweepPlugin.class.getName()));
            StringBuilder b = new StringBuilder();
            for (Class<?> c : providers) {
                b.append(c.getName()).append('\n');
            }
            out.write(b.toString().getBytes(StandardCharsets.UTF_8));
            out.closeEntry();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return jar;
    }
}
