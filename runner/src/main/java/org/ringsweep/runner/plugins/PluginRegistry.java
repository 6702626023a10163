package org.ringsweep.runner.plugins;

import java.io.IOException;
import java.net.MalformedURLException;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.CodeSource;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.ServiceConfigurationError;
import java.util.ServiceLoader;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.ringsweep.api.model.ApiVersion;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.EdgeCheck;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.model.ReceiverModel;
import org.ringsweep.api.model.RingsweepPlugin;
import org.ringsweep.api.net.LimitName;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.models.BuiltinModels;

/**
 * The models and checks of one run: the built-ins, then every {@link RingsweepPlugin} found by
 * {@link ServiceLoader} on the class path (unless switched off) and in the jars of each plugin
 * folder (one {@link URLClassLoader} per folder), then any added by hand. Immutable once built.
 *
 * <p>Each find is logged in {@link #messages()} with its id, version and jar. Registration
 * rejects, with a {@link PluginLoadException} naming the plugin and its jar: a provider that
 * cannot be created; a blank, malformed ({@link RingsweepPlugin#ID_PATTERN}) or reserved
 * ({@link RingsweepPlugin#RESERVED_PREFIX}) id; a plugin id seen twice; an
 * {@link RingsweepPlugin#apiVersion()} other than {@link ApiVersion#CURRENT}; a model id that a
 * built-in or another plugin already uses for that role; a check id or limit key used twice or
 * equal to a built-in limit key. Both sources of a clash are named.
 *
 * <p>Plugin models and checks are wrapped: their descriptors are read once, and any exception
 * their code throws (other than {@link org.ringsweep.api.model.ModelParameterException}) becomes
 * a {@link PluginFailureException} naming the plugin.
 *
 * <p>Example:
 * <pre>{@code
 * PluginRegistry r = PluginRegistry.builder().pluginDir(Path.of("plugins")).build();
 * r.messages().forEach(System.err::println);
 * Elaborator e = r.elaborator();
 * }</pre>
 */
public final class PluginRegistry {
    /** The origin shown for built-in models. */
    public static final String BUILT_IN = "built-in";
    private static final Pattern LIMIT_KEY = Pattern.compile("[a-z][a-z0-9_]*");

    private final List<DriverModel> drivers;
    private final List<ReceiverModel> receivers;
    private final List<PluginCheck> checks;
    private final List<PluginSource> plugins;
    private final List<String> messages;
    private final ModelCatalog catalog;

    private PluginRegistry(List<DriverModel> drivers, List<ReceiverModel> receivers, List<PluginCheck> checks,
                           List<PluginSource> plugins, List<String> messages) {
        this.drivers = List.copyOf(drivers);
        this.receivers = List.copyOf(receivers);
        this.checks = List.copyOf(checks);
        this.plugins = List.copyOf(plugins);
        this.messages = List.copyOf(messages);
        List<ModelDescriptor> all = new ArrayList<>();
        this.drivers.stream().sorted(Comparator.comparing(ModelDescriptor::id)).forEach(all::add);
        this.receivers.stream().sorted(Comparator.comparing(ModelDescriptor::id)).forEach(all::add);
        List<ModelDescriptor> frozen = List.copyOf(all);
        this.catalog = () -> frozen;
    }

    /** A builder with class-path discovery on and no plugin folder. */
    public static Builder builder() {
        return new Builder();
    }

    /** The built-in models only: no discovery. */
    public static PluginRegistry builtInOnly() {
        return builder().discoverClassPath(false).build();
    }

    /** Every driver model, built-ins first, then plugins in the order found. */
    public List<DriverModel> drivers() {
        return drivers;
    }

    /** Every receiver model, built-ins first, then plugins in the order found. */
    public List<ReceiverModel> receivers() {
        return receivers;
    }

    /** Every extra edge check from plugins, in the order found. */
    public List<PluginCheck> checks() {
        return checks;
    }

    /** The registered plugins, in the order found. */
    public List<PluginSource> plugins() {
        return plugins;
    }

    /** What discovery found, one line each (id, version, jar), for stderr. */
    public List<String> messages() {
        return messages;
    }

    /** The catalog for input checking ({@code NetFileLoader}, {@code PointParser}, {@code models}). */
    public ModelCatalog catalog() {
        return catalog;
    }

    /** An elaborator that knows every registered model. */
    public Elaborator elaborator() {
        return new Elaborator(drivers, receivers);
    }

    /** Sets up a registry. Not thread-safe; use once. */
    public static final class Builder {
        private boolean classPath = true;
        private final List<Path> dirs = new ArrayList<>();
        private final List<Candidate> manual = new ArrayList<>();

        private Builder() {
        }

        /** Whether to look for plugins on the class path (default true; tests switch it off). */
        public Builder discoverClassPath(boolean on) {
            this.classPath = on;
            return this;
        }

        /** Adds a folder whose {@code *.jar} files are searched for plugins ({@code --plugins DIR}). */
        public Builder pluginDir(Path dir) {
            dirs.add(java.util.Objects.requireNonNull(dir, "dir"));
            return this;
        }

        /**
         * Adds a plugin instance by hand.
         *
         * @param plugin   the plugin
         * @param location what to show as its origin, e.g. {@code test}
         */
        public Builder add(RingsweepPlugin plugin, String location) {
            manual.add(new Candidate(java.util.Objects.requireNonNull(plugin, "plugin"), location));
            return this;
        }

        /**
         * Discovers, validates and registers.
         *
         * @throws PluginLoadException naming the plugin or jar at the first problem
         */
        public PluginRegistry build() {
            List<Candidate> found = new ArrayList<>();
            if (classPath) {
                found.addAll(load(ServiceLoader.load(RingsweepPlugin.class, PluginRegistry.class.getClassLoader()), java.util.Set.of(),
                        "the class path"));
            }
            List<String> messages = new ArrayList<>();
            java.util.Set<String> onClassPath = new java.util.HashSet<>();
            found.forEach(c -> onClassPath.add(c.plugin.getClass().getName()));
            for (Path dir : dirs) {
                found.addAll(loadDir(dir, onClassPath, messages));
            }
            found.addAll(manual);
            return new Registration(messages).register(found);
        }

        private static List<Candidate> loadDir(Path dir, java.util.Set<String> onClassPath, List<String> messages) {
            if (!Files.isDirectory(dir)) {
                throw new PluginLoadException("--plugins `" + dir + "`: not a folder; expected a folder of plugin jars");
            }
            List<Path> jars;
            try (Stream<Path> s = Files.list(dir)) {
                jars = s.filter(p -> p.getFileName().toString().endsWith(".jar") && Files.isRegularFile(p)).sorted().toList();
            } catch (IOException e) {
                throw new PluginLoadException("--plugins `" + dir + "`: cannot list the folder: " + e.getMessage(), e);
            }
            if (jars.isEmpty()) {
                messages.add("--plugins " + dir + ": no .jar files found");
                return List.of();
            }
            URL[] urls = new URL[jars.size()];
            for (int i = 0; i < urls.length; i++) {
                try {
                    urls[i] = jars.get(i).toUri().toURL();
                } catch (MalformedURLException e) {
                    throw new PluginLoadException("--plugins: cannot read jar `" + jars.get(i) + "`: " + e.getMessage(), e);
                }
            }
            // Kept open for the life of the run: the plugins' classes are used until it ends.
            URLClassLoader loader = new URLClassLoader("ringsweep-plugins:" + dir, urls, PluginRegistry.class.getClassLoader());
            return load(ServiceLoader.load(RingsweepPlugin.class, loader), onClassPath, dir.toString());
        }

        /**
         * The providers of a loader, without those already found on the class path: a folder's
         * loader also sees its parent's providers, and a plugin must not register twice.
         */
        private static List<Candidate> load(ServiceLoader<RingsweepPlugin> services, java.util.Set<String> skip, String where) {
            List<Candidate> list = new ArrayList<>();
            try {
                for (ServiceLoader.Provider<RingsweepPlugin> p : (Iterable<ServiceLoader.Provider<RingsweepPlugin>>) services.stream()::iterator) {
                    Class<? extends RingsweepPlugin> type = p.type();
                    if (skip.contains(type.getName())) {
                        continue;
                    }
                    String location = locationOf(type);
                    RingsweepPlugin plugin;
                    try {
                        plugin = p.get();
                    } catch (ServiceConfigurationError | RuntimeException | LinkageError e) {
                        throw new PluginLoadException("plugin class `" + type.getName() + "` in " + location
                                + " cannot be created: " + describe(e) + "; expected a public no-argument constructor", e);
                    }
                    list.add(new Candidate(plugin, location));
                }
            } catch (ServiceConfigurationError e) {
                throw new PluginLoadException("a plugin in " + where + " cannot be loaded: " + describe(e)
                        + "; check its META-INF/services/" + RingsweepPlugin.class.getName(), e);
            }
            return list;
        }

        private static String locationOf(Class<?> type) {
            CodeSource cs = type.getProtectionDomain().getCodeSource();
            if (cs == null || cs.getLocation() == null) {
                return "class path";
            }
            try {
                return Path.of(cs.getLocation().toURI()).toString();
            } catch (java.net.URISyntaxException | IllegalArgumentException e) {
                return cs.getLocation().toString();
            }
        }
    }

    private static String describe(Throwable e) {
        Throwable root = e.getCause() != null && e instanceof ServiceConfigurationError ? e.getCause() : e;
        return root.getClass().getSimpleName() + (root.getMessage() == null ? "" : ": " + root.getMessage());
    }

    private record Candidate(RingsweepPlugin plugin, String location) {
    }

    /** The validation and wrapping of one build. */
    private static final class Registration {
        private final List<String> messages;
        private final List<DriverModel> drivers = new ArrayList<>(BuiltinModels.drivers());
        private final List<ReceiverModel> receivers = new ArrayList<>(BuiltinModels.receivers());
        private final List<PluginCheck> checks = new ArrayList<>();
        private final List<PluginSource> plugins = new ArrayList<>();
        private final Map<String, String> pluginIds = new LinkedHashMap<>();
        private final Map<String, String> driverIds = new LinkedHashMap<>();
        private final Map<String, String> receiverIds = new LinkedHashMap<>();
        private final Map<String, String> checkIds = new LinkedHashMap<>();
        private final Map<String, String> limitKeys = new LinkedHashMap<>();

        Registration(List<String> messages) {
            this.messages = messages;
            drivers.forEach(d -> driverIds.put(d.id(), "the built-in driver model"));
            receivers.forEach(r -> receiverIds.put(r.id(), "the built-in receiver model"));
            for (LimitName n : LimitName.values()) {
                limitKeys.put(n.key(), "the built-in limit");
            }
        }

        PluginRegistry register(List<Candidate> candidates) {
            for (Candidate c : candidates) {
                register(c);
            }
            return new PluginRegistry(drivers, receivers, checks, plugins, messages);
        }

        private void register(Candidate c) {
            String where = "plugin class `" + c.plugin.getClass().getName() + "` (" + c.location + ")";
            String id = read(where, "id", c.plugin::id);
            requireId(id, where, "plugin id");
            String version = read(where, "version", c.plugin::version);
            if (version == null || version.isBlank()) {
                throw new PluginLoadException(where + ": plugin `" + id + "` has a blank version; expected e.g. `1.0.0`");
            }
            PluginSource source = new PluginSource(id, version.strip(), c.location);
            String previous = pluginIds.putIfAbsent(id, source.describe());
            if (previous != null) {
                throw new PluginLoadException("plugin id `" + id + "` is used twice: by " + previous + " and by " + source.describe()
                        + "; remove one of the jars");
            }
            int api = read(where, "apiVersion", c.plugin::apiVersion);
            if (api != ApiVersion.CURRENT) {
                throw new PluginLoadException(source.describe() + " was built for plugin API version " + api
                        + ", but this ringsweep provides version " + ApiVersion.CURRENT
                        + "; rebuild the plugin against this ringsweep-api");
            }
            List<String> names = new ArrayList<>();
            for (DriverModel m : list(source, "drivers", c.plugin::drivers)) {
                String mid = modelId(source, m, ModelDescriptor.Role.DRIVER, driverIds);
                drivers.add(new PluginDriverModel(m, source, mid, description(source, mid, m::description), parameters(source, mid, m)));
                names.add("driver " + mid);
            }
            for (ReceiverModel m : list(source, "receivers", c.plugin::receivers)) {
                String mid = modelId(source, m, ModelDescriptor.Role.RECEIVER, receiverIds);
                receivers.add(new PluginReceiverModel(m, source, mid, description(source, mid, m::description), parameters(source, mid, m)));
                names.add("receiver " + mid);
            }
            for (EdgeCheck k : list(source, "checks", c.plugin::checks)) {
                String kid = read(source.describe(), "check id", k::id);
                requireId(kid, source.describe(), "check id");
                claim(checkIds, kid, "check id", source);
                String key = read(source.describe(), "limitKey of check `" + kid + "`", k::limitKey);
                if (key == null || !LIMIT_KEY.matcher(key).matches()) {
                    throw new PluginLoadException(source.describe() + ": check `" + kid + "` has limit key `" + key
                            + "`; expected lower-case letters, digits and _ (" + LIMIT_KEY.pattern() + ")");
                }
                claim(limitKeys, key, "limit key", source);
                checks.add(new PluginCheck(k, source, kid, key, description(source, kid, k::description)));
                names.add("check " + kid + " (" + key + ")");
            }
            plugins.add(source);
            messages.add("loaded " + source.describe() + ": " + (names.isEmpty() ? "nothing to register" : String.join(", ", names)));
        }

        private String modelId(PluginSource source, ModelDescriptor m, ModelDescriptor.Role role, Map<String, String> ids) {
            String what = role == ModelDescriptor.Role.DRIVER ? "driver model" : "receiver model";
            String mid = read(source.describe(), what + " id", m::id);
            requireId(mid, source.describe(), what + " id");
            ModelDescriptor.Role declared = read(source.describe(), "role of " + what + " `" + mid + "`", m::role);
            if (declared != role) {
                throw new PluginLoadException(source.describe() + ": " + what + " `" + mid + "` declares role `" + declared
                        + "`; expected " + role);
            }
            claim(ids, mid, what + " id", source);
            return mid;
        }

        private void claim(Map<String, String> ids, String id, String what, PluginSource source) {
            String previous = ids.putIfAbsent(id, source.describe());
            if (previous != null) {
                throw new PluginLoadException(what + " `" + id + "` of " + source.describe() + " clashes with " + previous
                        + " of that name; rename it in the plugin");
            }
        }

        private static void requireId(String id, String where, String what) {
            if (id == null || id.isBlank()) {
                throw new PluginLoadException(where + ": blank " + what + "; expected lower-case letters, digits and - ("
                        + RingsweepPlugin.ID_PATTERN.pattern() + ")");
            }
            if (!RingsweepPlugin.ID_PATTERN.matcher(id).matches()) {
                throw new PluginLoadException(where + ": " + what + " `" + id + "` is malformed; expected lower-case letters, digits and - ("
                        + RingsweepPlugin.ID_PATTERN.pattern() + ")");
            }
            if (id.startsWith(RingsweepPlugin.RESERVED_PREFIX)) {
                throw new PluginLoadException(where + ": " + what + " `" + id + "` starts with the reserved prefix `"
                        + RingsweepPlugin.RESERVED_PREFIX + "`; choose your own, e.g. your company's name");
            }
        }

        private static String description(PluginSource source, String id, java.util.function.Supplier<String> d) {
            String text = read(source.describe(), "description of `" + id + "`", d);
            return text == null ? "" : text.strip();
        }

        private static List<ParameterSpec> parameters(PluginSource source, String id, ModelDescriptor m) {
            List<ParameterSpec> specs = list(source, "parameters of model `" + id + "`", m::parameters);
            java.util.Set<String> keys = new java.util.HashSet<>();
            for (ParameterSpec p : specs) {
                if (p == null || p.key() == null || p.key().isBlank() || p.type() == null || p.dimension() == null
                        || p.defaultText() == null || p.description() == null) {
                    throw new PluginLoadException(source.describe() + ": model `" + id + "` has an incomplete parameter " + p
                            + "; expected key, type, dimension, default text (may be empty) and description");
                }
                if (p.key().equals("pin") || p.key().equals("model") || !keys.add(p.key())) {
                    throw new PluginLoadException(source.describe() + ": model `" + id + "` declares parameter `" + p.key()
                            + "` twice or uses a reserved key (pin, model)");
                }
            }
            return specs;
        }

        private static <T> List<T> list(PluginSource source, String what, java.util.function.Supplier<List<T>> body) {
            List<T> l = read(source.describe(), what, body);
            if (l == null) {
                throw new PluginLoadException(source.describe() + ": " + what + " returned null; expected a list (List.of() for none)");
            }
            for (T t : l) {
                if (t == null) {
                    throw new PluginLoadException(source.describe() + ": " + what + " holds null");
                }
            }
            return List.copyOf(l);
        }

        private static <T> T read(String where, String what, java.util.function.Supplier<T> body) {
            try {
                return body.get();
            } catch (RuntimeException | LinkageError e) {
                throw new PluginLoadException(where + ": " + what + " threw " + describe(e), e);
            }
        }
    }
}
