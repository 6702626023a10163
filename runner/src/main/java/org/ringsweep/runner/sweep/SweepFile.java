package org.ringsweep.runner.sweep;

import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import org.ringsweep.api.net.Location;

/**
 * A loaded sweep file ({@code format: ringsweep/sweep-1}).
 *
 * @param file            the sweep file as given
 * @param nets            the net files its {@code nets} name, globs expanded relative to the
 *                        sweep file's folder, duplicates removed, sorted by path
 * @param vary            the vary entries in file order, at least one
 * @param combine         how the entries combine ({@code grid} when not given)
 * @param combineLocation where {@code combine} is written (the file's start when not given), for
 *                        errors found when the entries are resolved for a net
 */
public record SweepFile(Path file, List<Path> nets, List<Vary> vary, Combine combine, Location combineLocation) {
    /** Copies the lists and rejects nulls. */
    public SweepFile {
        Objects.requireNonNull(file, "file");
        nets = List.copyOf(nets);
        vary = List.copyOf(vary);
        Objects.requireNonNull(combine, "combine");
        Objects.requireNonNull(combineLocation, "combineLocation");
    }
}
