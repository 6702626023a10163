package org.ringsweep.api.net;

import org.apiguardian.api.API;

/**
 * Where a piece of input came from, for error messages: a file, a 1-based line and column.
 *
 * @param file   the file as the user named it (or a label such as {@code --set}); never null
 * @param line   1-based line, 0 when unknown
 * @param column 1-based column, 0 when unknown
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record Location(String file, int line, int column) {
    /** A location for values that come from code, not from a file. */
    public static final Location UNKNOWN = new Location("<unknown>", 0, 0);

    /** Validates the fields. */
    public Location {
        java.util.Objects.requireNonNull(file, "file");
    }

    /** {@code file:line:column}, or just the file when the line is unknown. */
    @Override
    public String toString() {
        return line > 0 ? file + ":" + line + ":" + column : file;
    }
}
