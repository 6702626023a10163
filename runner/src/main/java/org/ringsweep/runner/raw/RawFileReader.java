package org.ringsweep.runner.raw;

import java.nio.file.Path;
import java.util.List;

/** Reads ngspice raw files (binary and ASCII, one or several plots). */
public final class RawFileReader {
    private RawFileReader() {
    }

    /**
     * Reads every plot of a raw file.
     *
     * @throws RawFormatException naming the file, the byte offset or line and what was expected
     */
    public static List<RawPlot> read(Path file) {
        throw new UnsupportedOperationException("not yet written");
    }
}
