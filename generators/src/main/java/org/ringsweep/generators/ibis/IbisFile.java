package org.ringsweep.generators.ibis;

import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * A parsed IBIS file.
 *
 * @param source     the file as named by the user (for messages)
 * @param version    {@code [IBIS Ver]}
 * @param fileName   {@code [File Name]}, empty when absent
 * @param components the components in file order
 * @param models     the models by name, in file order
 * @param selectors  the {@code [Model Selector]}s by name, in file order
 * @param warnings   one line per keyword the reader does not support and skipped (with its line)
 */
public record IbisFile(String source, String version, String fileName, List<IbisComponent> components,
                       Map<String, IbisModel> models, Map<String, IbisModelSelector> selectors,
                       List<String> warnings) {
    /** Copies the collections (model order kept). */
    public IbisFile {
        components = List.copyOf(components);
        models = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(models));
        selectors = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(selectors));
        warnings = List.copyOf(warnings);
    }

    /** The model with that name (model names are case-sensitive in IBIS). */
    public Optional<IbisModel> model(String name) {
        return Optional.ofNullable(models.get(name));
    }

    /** The {@code [Model Selector]} with that name (case-sensitive like model names). */
    public Optional<IbisModelSelector> selector(String name) {
        return Optional.ofNullable(selectors.get(name));
    }

    /** The component with that name. */
    public Optional<IbisComponent> component(String name) {
        return components.stream().filter(c -> c.name().equals(name)).findFirst();
    }
}
