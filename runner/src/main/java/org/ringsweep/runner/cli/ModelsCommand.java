package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.runner.plugins.PluginCheck;
import org.ringsweep.runner.plugins.PluginRegistry;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/**
 * {@code ringsweep models [--plugins DIR]}: list every driver and receiver model and every extra
 * check, built-in and from plugins, with parameters, units, defaults and where each came from.
 */
@Command(name = "models", mixinStandardHelpOptions = true,
        description = "List the driver and receiver models and the extra checks: parameters, units, defaults and origin.")
public final class ModelsCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Option(names = "--plugins", paramLabel = "DIR",
            description = "Folder of plugin jars whose models and checks are listed too.")
    Path plugins;

    @Option(names = "--quiet", description = "Do not print the plugin load log on stderr.")
    boolean quiet;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        Optional<PluginRegistry> loaded = Plugins.loadOrReport(plugins, quiet, err);
        if (loaded.isEmpty()) {
            return ExitCodes.INPUT;
        }
        PluginRegistry registry = loaded.get();
        for (ModelDescriptor m : registry.catalog().all()) {
            out.printf("%s %s (%s): %s%n", m.role().name().toLowerCase(Locale.ROOT), m.id(), m.origin(), m.description());
            for (ParameterSpec p : m.parameters()) {
                out.printf("    %-10s %-18s %-16s %s%n", p.key(), unit(p), defaultOf(p), p.description());
            }
        }
        for (PluginCheck c : registry.checks()) {
            out.printf("check %s (%s): %s%n", c.id(), c.origin(), c.description());
            out.printf("    limit key %s%n", c.limitKey());
        }
        return ExitCodes.OK;
    }

    /** The unit column: the SI symbol, or what kind of word the parameter takes. */
    static String unit(ParameterSpec p) {
        return switch (p.type()) {
            case NUMBER -> p.dimension().unitSymbol().isEmpty() ? "number" : p.dimension().unitSymbol();
            case VOLTAGE_OR_RAIL -> "V or rail";
            case RAIL -> "rail";
            case WORD -> String.join("|", new java.util.TreeSet<>(p.words()));
            case FLAG -> "true|false";
            case TEXT -> "text";
        };
    }

    /** The default column: {@code required}, {@code optional} or {@code default X}. */
    static String defaultOf(ParameterSpec p) {
        return p.required() ? "required" : p.defaultText().isEmpty() ? "optional" : "default " + p.defaultText();
    }
}
