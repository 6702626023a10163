package org.ringsweep.runner.raw;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;

/**
 * Reads ngspice raw files (binary and ASCII, one or several plots).
 *
 * <p>What is accepted, after ngspice 39 ({@code shared/reference/ngspice.md} §9 and §10):
 * <ul>
 *   <li>each plot starts at a {@code Title:} line; header lines are ISO-8859-1, {@code \n} or
 *       {@code \r\n} terminated, keys case-insensitive; {@code Date:}, {@code Dimensions:},
 *       {@code Command:} and {@code Option:} lines are ignored (never executed);</li>
 *   <li>{@code Flags:} holds {@code real} or {@code complex}, optionally {@code padded} or
 *       {@code unpadded} (all vectors of an analysis plot have the scale's length, so both
 *       lay out the same);</li>
 *   <li>{@code Binary:} data are point-major records of little-endian float64 values
 *       (16 bytes per value for complex data, of which the real part is kept);
 *       {@code Values:} data are a point index followed by one value per variable
 *       ({@code re,im} for complex data);</li>
 *   <li>a padded {@code No. Points:} field (as {@code -r} writes it) is trimmed.</li>
 * </ul>
 *
 * <p>Failed and killed runs: when {@code No. Points:} is 0, or the data hold fewer bytes than
 * the count requires, every complete record is read and the plot is marked
 * {@linkplain RawPlot#truncated() truncated}. A count of 0 makes the plot take the rest of the
 * file, so only the last plot can be truncated; in earlier plots the count is trusted and the
 * next plot must start right after its data.
 *
 * <p>A {@code time} column holding NaN, an infinity, or a value not greater than the one
 * before is rejected. Other columns are returned as found.
 */
public final class RawFileReader {
    private RawFileReader() {
    }

    /**
     * Reads every plot of a raw file.
     *
     * @param file the raw file, binary or ASCII
     * @return the plots in file order, at least one
     * @throws RawFormatException naming the file, the byte offset or line and what was expected;
     *                            also when the file is empty, missing or unreadable
     */
    public static List<RawPlot> read(Path file) {
        try (FileChannel channel = FileChannel.open(file, StandardOpenOption.READ)) {
            return new RawParser(file, FileBytes.of(channel)).plots();
        } catch (NoSuchFileException e) {
            throw new RawFormatException("raw file `" + file + "` does not exist", e);
        } catch (IOException e) {
            throw new RawFormatException("raw file `" + file + "` cannot be read: " + e.getMessage(), e);
        }
    }
}
