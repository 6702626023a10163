package org.ringsweep.generators.ibis;

import java.util.List;

/**
 * A {@code [Model Selector]}: a name a {@code [Pin]} row (or a net file's {@code ibis_model}) may
 * use instead of a model name, standing for a list of alternative models of that pin (e.g. a
 * fast and a slow drive strength). By the standard's convention the first entry is the default.
 *
 * @param name    the selector name
 * @param entries the alternatives in file order, the first the default
 * @param line    the line of the keyword in the file
 */
public record IbisModelSelector(String name, List<Entry> entries, int line) {
    /** Copies the entries. */
    public IbisModelSelector {
        entries = List.copyOf(entries);
    }

    /**
     * One alternative.
     *
     * @param model       the model name
     * @param description the free text after it, empty when absent
     */
    public record Entry(String model, String description) {
    }

    /** The entry names in file order. */
    public List<String> modelNames() {
        return entries.stream().map(Entry::model).toList();
    }
}
