package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.generators.models.BuiltinModels;
import picocli.CommandLine.Command;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code ringsweep models}: list the driver and receiver models with their parameters. */
@Command(name = "models", mixinStandardHelpOptions = true,
        description = "List the driver and receiver models, their parameters, units, defaults and origin.")
public final class ModelsCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        PrintWriter out = spec.commandLine().getOut();
        for (ModelDescriptor m : new BuiltinModels().all()) {
            out.printf("%s %s (%s): %s%n", m.role().name().toLowerCase(java.util.Locale.ROOT), m.id(), m.origin(), m.description());
            for (ParameterSpec p : m.parameters()) {
                String unit = switch (p.type()) {
                    case NUMBER -> p.dimension().unitSymbol().isEmpty() ? "number" : p.dimension().unitSymbol();
                    case VOLTAGE_OR_RAIL -> "V or rail";
                    case RAIL -> "rail";
                    case WORD -> String.join("|", new java.util.TreeSet<>(p.words()));
                    case FLAG -> "true|false";
                    case TEXT -> "text";
                };
                String dflt = p.required() ? "required" : p.defaultText().isEmpty() ? "optional" : "default " + p.defaultText();
                out.printf("    %-10s %-18s %-16s %s%n", p.key(), unit, dflt, p.description());
            }
        }
        return ExitCodes.OK;
    }
}
