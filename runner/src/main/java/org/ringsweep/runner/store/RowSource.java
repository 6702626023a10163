package org.ringsweep.runner.store;

import java.util.function.Consumer;

/**
 * Rows to walk once or several times, one at a time: a store query re-run on every walk (a
 * cursor, so memory stays bounded) or a list in memory ({@code list::forEach}).
 */
@FunctionalInterface
public interface RowSource {
    /** Hands every row to {@code action}, in order. */
    void forEach(Consumer<? super StoredRow> action);
}
