package org.ringsweep.generators.models;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentMap;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.net.Element;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Value;
import org.ringsweep.generators.ibis.IbisComponent;
import org.ringsweep.generators.ibis.IbisCorner;
import org.ringsweep.generators.ibis.IbisFile;
import org.ringsweep.generators.ibis.IbisFormatException;
import org.ringsweep.generators.ibis.IbisModel;
import org.ringsweep.generators.ibis.IbisModelSelector;
import org.ringsweep.generators.ibis.IbisParser;
import org.ringsweep.generators.ibis.IbisPin;
import org.ringsweep.generators.ibis.IbisRange;

/**
 * The IBIS model an element names: its file ({@code file}, relative to the net file the element
 * was written in), the model in it ({@code ibis_model}, or {@code component} + {@code ibis_pin})
 * and the data column ({@code ibis_corner}). A name that is a {@code [Model Selector]} stands for
 * its first (default) entry, or the entry {@code ibis_select} names. The package parasitics are
 * those of the component when one is known ({@code component}, with {@code ibis_pin} for the
 * pin's own {@code R_pin L_pin C_pin}), unless {@code package: false}. Parsed files are cached by
 * absolute path and re-read when their size or modification time changes; the cache is
 * thread-safe.
 *
 * @param file        the parsed file
 * @param model       the chosen model
 * @param corner      the chosen column
 * @param component   the component named by {@code component}, or null
 * @param pin         the {@code [Pin]} row named by {@code ibis_pin}, or null
 * @param withPackage whether the package parasitics are wanted ({@code package}, default true)
 */
record IbisSelection(IbisFile file, IbisModel model, IbisCorner corner, IbisComponent component, IbisPin pin,
                     boolean withPackage) {
    private static final ConcurrentMap<Path, Cached> CACHE = new ConcurrentHashMap<>();

    /** A parsed file with the stamp it was read at. */
    private record Cached(FileTime modified, long size, IbisFile file) {
    }

    /** The parameters both IBIS models take. */
    static List<ParameterSpec> commonParameters() {
        return List.of(
                ParameterSpec.text("file", "", true, "the IBIS file, relative to the net file"),
                ParameterSpec.text("ibis_model", "", false, "the [Model] or [Model Selector] name in the file (or give component and ibis_pin)"),
                ParameterSpec.text("component", "", false, "the [Component] whose [Pin] row names the model; also gives the package"),
                ParameterSpec.text("ibis_pin", "", false, "the pin of that component (its R_pin L_pin C_pin override [Package])"),
                ParameterSpec.text("ibis_select", "", false, "the entry of a [Model Selector] to use; default its first entry"),
                new ParameterSpec("package", ParameterSpec.Type.FLAG, Dimension.DIMENSIONLESS, Set.of(), "true", false,
                        "add the component's package R-L-C between die and pin (false: die pad at the pin)"),
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
        IbisComponent comp = null;
        IbisPin row = null;
        if (p.has("component")) {
            String name = ModelParameters.word(p, "component", "");
            comp = file.component(name).orElseThrow(() -> new ModelParameterException("component", "component `" + name
                    + "` is not in " + path + "; expected one of "
                    + String.join(", ", file.components().stream().map(IbisComponent::name).toList())));
        }
        String modelKey;
        String modelName;
        if (p.has("ibis_model")) {
            modelKey = "ibis_model";
            modelName = ModelParameters.word(p, "ibis_model", "");
            if (!file.models().containsKey(modelName) && !file.selectors().containsKey(modelName)) {
                List<String> names = new ArrayList<>(file.models().keySet());
                names.addAll(file.selectors().keySet());
                throw new ModelParameterException("ibis_model", "model `" + modelName + "` is not in " + path
                        + "; expected one of " + String.join(", ", names));
            }
            if (comp != null && p.has("ibis_pin")) {
                row = pinRow(comp, ModelParameters.word(p, "ibis_pin", ""), path);
            }
        } else {
            modelKey = "ibis_pin";
            String pinName = ModelParameters.word(p, "ibis_pin", "");
            if (comp == null) {
                throw new ModelParameterException("component", "expected `component` with `ibis_pin` `" + pinName + "`");
            }
            row = pinRow(comp, pinName, path);
            modelName = row.model();
            if (!file.models().containsKey(modelName) && !file.selectors().containsKey(modelName)) {
                throw new ModelParameterException("ibis_pin", "pin `" + pinName + "` of " + comp.name()
                        + " uses model `" + modelName + "`, which is not a [Model] of " + path
                        + " (POWER, GND and NC pins have none); expected a signal pin");
            }
        }
        IbisModel model = select(file, modelName, modelKey, p, path);
        boolean withPackage = !(p.get("package").orElse(null) instanceof Value.Flag f) || f.on();
        return new IbisSelection(file, model, corner, comp, row, withPackage);
    }

    private static IbisPin pinRow(IbisComponent comp, String pin, Path path) {
        return comp.pin(pin).orElseThrow(() -> new ModelParameterException("ibis_pin", "pin `" + pin + "` is not in the [Pin] list of "
                + comp.name() + " in " + path + "; expected one of "
                + String.join(", ", comp.pins().stream().map(IbisPin::pin).toList())));
    }

    /** The model a name stands for: itself, or the chosen entry of the selector of that name. */
    private static IbisModel select(IbisFile file, String name, String key, Parameters p, Path path) {
        IbisModelSelector sel = file.selector(name).orElse(null);
        if (sel == null) {
            if (p.has("ibis_select")) {
                throw new ModelParameterException("ibis_select", "`ibis_select` is given but `" + name + "` is a [Model] of " + path
                        + ", not a [Model Selector]; expected ibis_select only with a selector name");
            }
            return file.model(name).orElseThrow();
        }
        String where = path + ":" + sel.line() + ": [Model Selector] " + sel.name();
        String choice = p.has("ibis_select") ? ModelParameters.word(p, "ibis_select", "") : sel.entries().get(0).model();
        if (!sel.modelNames().contains(choice)) {
            throw new ModelParameterException("ibis_select", "`" + choice + "` is not an entry of " + where + "; expected one of "
                    + String.join(", ", sel.modelNames()));
        }
        return file.model(choice).orElseThrow(() -> new ModelParameterException(p.has("ibis_select") ? "ibis_select" : key, where
                + " lists `" + choice + "`, which is not a [Model] of the file; expected every entry to name a [Model]"));
    }

    /**
     * The package parasitics at this corner, or empty when not wanted or no component is known:
     * the pin's {@code R_pin L_pin C_pin} where given (one value for every column), else
     * {@code [Package]}'s column.
     */
    Optional<IbisPackage> packageValues() {
        if (!withPackage || component == null) {
            return Optional.empty();
        }
        double r = pick(pin == null ? Double.NaN : pin.rPin(), component.rPkg());
        double l = pick(pin == null ? Double.NaN : pin.lPin(), component.lPkg());
        double c = pick(pin == null ? Double.NaN : pin.cPin(), component.cPkg());
        return r > 0 || l > 0 || c > 0 ? Optional.of(new IbisPackage(r, l, c)) : Optional.empty();
    }

    private double pick(double perPin, IbisRange pkg) {
        return Double.isFinite(perPin) ? perPin : pkg == null ? 0 : pkg.get(corner);
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
