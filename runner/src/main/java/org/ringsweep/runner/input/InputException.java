package org.ringsweep.runner.input;

import org.ringsweep.api.net.Location;

/**
 * Bad user input: a file that cannot be read, is not valid YAML, or has a value or a structure
 * that is not what its key expects. {@link #getMessage()} is written for the user and is all the
 * command line shows (never a stack trace), e.g.
 * {@code nets/bad.yaml:12:5: segments[1].z0: expected a positive impedance such as `50` or `50ohm`, found `-3`}.
 */
public final class InputException extends RuntimeException {
    private static final long serialVersionUID = 1L;
    private final String file;
    private final int line;
    private final int column;
    private final String key;
    private final String detail;

    /**
     * @param location where the problem is (file label, 1-based line and column, 0 when unknown)
     * @param key      the key path concerned ({@code segments[1].z0}), or empty
     * @param detail   what is wrong and what was expected, without the location
     */
    public InputException(Location location, String key, String detail) {
        this(location, key, detail, null);
    }

    /**
     * @param location where the problem is
     * @param key      the key path concerned, or empty
     * @param detail   what is wrong and what was expected
     * @param cause    the underlying failure (kept for debugging; not shown to users)
     */
    public InputException(Location location, String key, String detail, Throwable cause) {
        super(format(location, key, detail), cause);
        this.file = location.file();
        this.line = location.line();
        this.column = location.column();
        this.key = key == null ? "" : key;
        this.detail = detail;
    }

    private static String format(Location location, String key, String detail) {
        String where = location.line() > 0 ? location.file() + ":" + location.line() + ":" + location.column() : location.file();
        return where + ": " + (key == null || key.isEmpty() ? "" : key + ": ") + detail;
    }

    /** The file as the user named it, or a label such as {@code --set}. */
    public String file() {
        return file;
    }

    /** The 1-based line, 0 when unknown. */
    public int line() {
        return line;
    }

    /** The 1-based column, 0 when unknown. */
    public int column() {
        return column;
    }

    /** The key path concerned ({@code segments[1].z0}), or empty for file-level problems. */
    public String key() {
        return key;
    }

    /** What is wrong and what was expected, without file, position and key. */
    public String detail() {
        return detail;
    }

    /** Where the problem is. */
    public Location location() {
        return new Location(file, line, column);
    }
}
