package org.ringsweep.generators.ibis;

/**
 * An IBIS file that cannot be read: names the file, the line, the keyword and what was expected.
 * The message reads {@code parts/kx32.ibs:42: [Pulldown]: expected ...}.
 */
public class IbisFormatException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;
    private final String file;
    private final int line;
    private final String keyword;

    /**
     * @param file    the file as named by the user
     * @param line    1-based line, 0 when the problem concerns the whole file
     * @param keyword the keyword concerned with its brackets ({@code [Pulldown]}), or empty
     * @param detail  what is wrong and what was expected, values in backticks
     */
    public IbisFormatException(String file, int line, String keyword, String detail) {
        super(file + (line > 0 ? ":" + line : "") + ": " + (keyword.isEmpty() ? "" : keyword + ": ") + detail);
        this.file = file;
        this.line = line;
        this.keyword = keyword;
    }

    /** The file as named by the user. */
    public String file() {
        return file;
    }

    /** The 1-based line, 0 when unknown. */
    public int line() {
        return line;
    }

    /** The keyword concerned ({@code [Pulldown]}), or empty. */
    public String keyword() {
        return keyword;
    }
}
