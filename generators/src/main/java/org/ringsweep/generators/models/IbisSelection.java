package org.ringsweep.generators.models;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentMap;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.net.Element;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.generators.ibis.IbisComponent;
import org.ringsweep.generators.ibis.IbisCorner;
import org.ringsweep.generators.ibis.IbisFile;
import org.ringsweep.generators.ibis.IbisFormatException;
import org.ringsweep.generators.ibis.IbisModel;
import org.ringsweep.generators.ibis.IbisParser;
import org.ringsweep.generators.ibis.IbisPin;

/**
 * The IBIS model an element names: its file ({@code file}, relative to the net file the element
 * was written in), the model in it ({@code ibis_model}, or {@code component} + {@code ibis_pin})
 * and the data column ({@code ibis_corner}). Parsed files are cached by absolute path and
 * re-read when their size or modification time changes; the cache is thread-safe.
 *
 * @param file   the parsed file
 * @param model  the chosen model
 * @param corner the chosen column
 */
record IbisSelection(IbisFile file, IbisModel model, IbisCorner corner) {
    private static final ConcurrentMap<Path, Cached> CACHE = new ConcurrentHashMap<>();

    /** A parsed file with the stamp it was read at. */
    private record Cached(FileTime modified, long size, IbisFile file) {
    }

    /** The parameters both IBIS models take. */
    static List<ParameterSpec> commonParameters() {
        return List.of(
                ParameterSpec.text("file", "", true, "the IBIS file, relative to the net file"),
                ParameterSpec.text("ibis_model", "", false, "the [Model] name in the file (or give component and ibis_pin)"),
                ParameterSpec.text("component", "", false, "the [Component] whose [Pin] row names the model"),
                ParameterSpec.text("ibis_pin", "", false, "the pin of that component"),
                ParameterSpec.word("ibis_corner", Set.of("typ", "min", "max"), "typ", "the IBIS data column: typ, min (slow/weak) or max (fast/strong)"));
    }

    /** ibis_model, or both component and ibis_pin. */
    static List<ModelDescriptor.Problem> check(Parameters given) {
        if (given.has("ibis_model")) {
            return List.of();
        }
        if (given.has("component") && given.has("ibis_pin")) {
            return List.of();
        }
        String key = given.has("component") ? "ibis_pin" : given.has("ibis_pin") ? "component" : "ibis_model";
        return List.of(new ModelDescriptor.Problem(key, "expected ibis_model, or both component and ibis_pin, to choose the IBIS model"));
    }

    /**
     * The selection of one element.
     *
     * @throws ModelParameterException naming the key when the file is missing or invalid, or the model is unknown
     */
    static IbisSelection of(Element element) {
        Parameters p = element.parameters();
        IbisCorner corner = IbisCorner.of(ModelParameters.word(p, "ibis_corner", "typ"));
        String given = p.get("file").map(v -> v.display()).orElseThrow(
                () -> new ModelParameterException("file", "`file` is missing; expected the IBIS file such as `parts/demo.ibs`"));
        Path path = resolve(element.location(), given);
        IbisFile file = load(path);
        IbisModel model;
        if (p.has("ibis_model")) {
            String name = ModelParameters.word(p, "ibis_model", "");
            model = file.model(name).orElseThrow(() -> new ModelParameterException("ibis_model", "model `" + name
                    + "` is not in " + path + "; expected one of " + String.join(", ", file.models().keySet())));
        } else {
            String comp = ModelParameters.word(p, "component", "");
            String pin = ModelParameters.word(p, "ibis_pin", "");
            IbisComponent c = file.component(comp).orElseThrow(() -> new ModelParameterException("component", "component `" + comp
                    + "` is not in " + path + "; expected one of "
                    + String.join(", ", file.components().stream().map(IbisComponent::name).toList())));
            IbisPin row = c.pin(pin).orElseThrow(() -> new ModelParameterException("ibis_pin", "pin `" + pin + "` is not in the [Pin] list of "
                    + comp + " in " + path));
            model = file.model(row.model()).orElseThrow(() -> new ModelParameterException("ibis_pin", "pin `" + pin + "` of " + comp
                    + " uses model `" + row.model() + "`, which is not a [Model] of " + path
                    + " (POWER, GND and NC pins have none); expected a signal pin"));
        }
        return new IbisSelection(file, model, corner);
    }

    /** The file relative to the folder of the file the element was written in (as given, normalized). */
    static Path resolve(Location written, String given) {
        Path g = Path.of(given);
        if (g.isAbsolute() || written.equals(Location.UNKNOWN) || written.file().startsWith("<")) {
            return g.normalize();
        }
        Path parent = Path.of(written.file()).getParent();
        return (parent == null ? g : parent.resolve(g)).normalize();
    }

    /** The parsed file, from the cache when unchanged. */
    static IbisFile load(Path path) {
        if (!Files.isRegularFile(path)) {
            throw new ModelParameterException("file", "IBIS file `" + path + "` does not exist; expected a path relative to the net file");
        }
        Path key = path.toAbsolutePath().normalize();
        try {
            FileTime modified = Files.getLastModifiedTime(path);
            long size = Files.size(path);
            Cached c = CACHE.get(key);
            if (c != null && c.modified.equals(modified) && c.size == size) {
                return c.file;
            }
            IbisFile f = IbisParser.parse(path, path.toString());
            CACHE.put(key, new Cached(modified, size, f));
            return f;
        } catch (IOException e) {
            throw new ModelParameterException("file", "IBIS file `" + path + "` cannot be read: " + e.getMessage());
        } catch (IbisFormatException e) {
            throw new ModelParameterException("file", e.getMessage());
        }
    }
}
