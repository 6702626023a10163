package org.ringsweep.runner.importer;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.net.LimitName;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.api.quantity.Quantities;
import org.ringsweep.api.quantity.QuantityFormatException;
import org.ringsweep.runner.input.InputException;
import org.ringsweep.runner.input.YamlMap;
import org.ringsweep.runner.input.YamlSource;
import org.ringsweep.runner.netlist.LengthUnits;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.ScalarNode;

/**
 * Loads a board mapping file ({@code format: ringsweep/board-1}). Besides the keys of formats.md
 * it accepts (compatible extensions): {@code ignore} (pin globs not modelled, e.g. test points),
 * {@code units} (the unit of plain numbers in CSV coordinates and lengths: {@code mm}, {@code mil},
 * {@code in}, {@code um}, {@code m}) and, per class, {@code termination} (a series resistor value
 * added at the driver of nets of that class that have no series part, or {@code none}).
 *
 * <p>Checked here: keys, the model ids and their parameter names (against the catalog), series
 * kinds and values, class impedance and er_eff, limit names, {@code detour ≥ 1}. Model parameter
 * values are checked when the generated net files load. Errors name file, line, column and key.
 */
public final class BoardMappingLoader {
    /** The format tag. */
    public static final String FORMAT = "ringsweep/board-1";
    private static final List<String> TOP = List.of("format", "rails", "drivers", "receivers", "series", "classes",
            "include", "exclude", "ignore", "lengths", "detour", "units");
    private final ModelCatalog catalog;

    /** @param catalog the models rules may name */
    public BoardMappingLoader(ModelCatalog catalog) {
        this.catalog = Objects.requireNonNull(catalog, "catalog");
    }

    /**
     * Loads the file.
     *
     * @throws InputException for any problem
     */
    public BoardMapping load(Path file) {
        String label = file.toString();
        String text = YamlSource.decode(YamlSource.readBytes(file, label, "board mapping file", FORMAT), label, "board mapping file");
        Node root = YamlSource.compose(text, label);
        if (root == null) {
            throw new InputException(new Location(label, 0, 0), "", "the file is empty; expected `format: " + FORMAT + "`");
        }
        YamlMap top = YamlMap.of(label, root, "", "a map of keys starting with `format: " + FORMAT + "`");
        String format = top.text("format", "`" + FORMAT + "`");
        if (!format.equals(FORMAT)) {
            throw new InputException(YamlMap.location(label, top.get("format").orElseThrow()), "format",
                    "expected `" + FORMAT + "`, found `" + format + "`");
        }
        top.allowOnly(TOP, "a board mapping file");
        Map<String, String> rails = new LinkedHashMap<>();
        top.get("rails").ifPresent(n -> {
            YamlMap m = YamlMap.of(label, n, "rails", "a map of rails such as `{ VCC: 3.3 }`");
            for (String k : m.keys()) {
                String v = m.text(k, "a voltage such as `3.3`");
                quantity(v, Dimension.VOLTAGE, YamlMap.location(label, m.require(k, "")), m.path(k));
                rails.put(k, v);
            }
        });
        List<BoardMapping.PinRule> drivers = pinRules(top, "drivers", ModelDescriptor.Role.DRIVER, label);
        List<BoardMapping.PinRule> receivers = pinRules(top, "receivers", ModelDescriptor.Role.RECEIVER, label);
        List<BoardMapping.SeriesRule> series = new ArrayList<>();
        List<Node> seriesNodes = listOf(top, "series", label);
        for (int i = 0; i < seriesNodes.size(); i++) {
            YamlMap m = YamlMap.of(label, seriesNodes.get(i), "series[" + i + "]", "a series rule such as `{ refs: \"R1*\", kind: resistor, value: 22 }`");
            m.allowOnly(List.of("refs", "kind", "value"), "a series rule");
            String kind = m.has("kind") ? m.text("kind", "resistor, capacitor or inductor") : "resistor";
            Dimension d = switch (kind) {
                case "resistor" -> Dimension.RESISTANCE;
                case "capacitor" -> Dimension.CAPACITANCE;
                case "inductor" -> Dimension.INDUCTANCE;
                default -> throw new InputException(YamlMap.location(label, m.require("kind", "")), m.path("kind"),
                        "expected resistor, capacitor or inductor, found `" + kind + "`");
            };
            String value = m.text("value", "the part's value such as `22`");
            positive(value, d, YamlMap.location(label, m.require("value", "")), m.path("value"));
            series.add(new BoardMapping.SeriesRule(new Glob(m.text("refs", "a refdes pattern such as `R1*`")), kind, value, m.location()));
        }
        List<BoardMapping.NetClass> classes = new ArrayList<>();
        List<Node> classNodes = listOf(top, "classes", label);
        for (int i = 0; i < classNodes.size(); i++) {
            classes.add(netClass(YamlMap.of(label, classNodes.get(i), "classes[" + i + "]",
                    "a class such as `{ nets: \"SPI_*\", z0: 50, er_eff: 3.4 }`"), label));
        }
        Path lengths = null;
        if (top.has("lengths")) {
            Path base = file.toAbsolutePath().getParent();
            lengths = base.resolve(top.text("lengths", "a CSV file name such as `lengths.csv`"));
        }
        double detour = BoardMapping.DEFAULT_DETOUR;
        if (top.has("detour")) {
            String t = top.text("detour", "a factor of at least 1 such as `1.2`");
            Location at = YamlMap.location(label, top.require("detour", ""));
            detour = quantity(t, Dimension.DIMENSIONLESS, at, "detour");
            if (!(detour >= 1)) {
                throw new InputException(at, "detour", "expected a factor of at least 1 such as `1.2`, found `" + t + "`");
            }
        }
        double unit = Double.NaN;
        if (top.has("units")) {
            unit = LengthUnits.metresPer(top.text("units", "a length unit such as `mm`"),
                    YamlMap.location(label, top.require("units", "")), "units");
        }
        return new BoardMapping(label, rails, drivers, receivers, series, classes, globs(top, "include", label),
                globs(top, "exclude", label), globs(top, "ignore", label), lengths, detour, unit);
    }

    private BoardMapping.NetClass netClass(YamlMap m, String label) {
        m.allowOnly(List.of("nets", "z0", "er_eff", "limits", "termination"), "a net class");
        String z0 = m.text("z0", "an impedance such as `50`");
        positive(z0, Dimension.RESISTANCE, YamlMap.location(label, m.require("z0", "")), m.path("z0"));
        String er = m.text("er_eff", "an effective relative permittivity such as `3.4`");
        Location erAt = YamlMap.location(label, m.require("er_eff", ""));
        if (!(quantity(er, Dimension.DIMENSIONLESS, erAt, m.path("er_eff")) >= 1)) {
            throw new InputException(erAt, m.path("er_eff"), "expected an effective relative permittivity of at least 1, found `" + er + "`");
        }
        Map<String, String> limits = new LinkedHashMap<>();
        Optional<Node> ln = m.get("limits");
        if (ln.isPresent()) {
            YamlMap lm = YamlMap.of(label, ln.get(), m.path("limits"), "a map of limits such as `{ overshoot_max: 0.5V }`");
            List<String> names = java.util.Arrays.stream(LimitName.values()).map(LimitName::key).toList();
            lm.allowOnly(names, "limits");
            for (String k : lm.keys()) {
                limits.put(k, lm.text(k, "a limit value"));
            }
        }
        String termination = null;
        if (m.has("termination")) {
            Node tn = m.require("termination", "");
            if (tn instanceof ScalarNode s && s.getValue().strip().equals("none")) {
                termination = null;
            } else if (tn instanceof MappingNode) {
                YamlMap tm = YamlMap.of(label, tn, m.path("termination"), "`{ series: 33 }` or `none`");
                tm.allowOnly(List.of("series"), "a termination");
                termination = tm.text("series", "a series resistor value such as `33`");
                positive(termination, Dimension.RESISTANCE, YamlMap.location(label, tm.require("series", "")), tm.path("series"));
            } else {
                throw new InputException(YamlMap.location(label, tn), m.path("termination"),
                        "expected `{ series: 33 }` or `none`, found " + YamlMap.describe(tn));
            }
        }
        return new BoardMapping.NetClass(new Glob(m.text("nets", "a net-name pattern such as `SPI_*`")), z0, er, limits, termination, m.location());
    }

    private List<BoardMapping.PinRule> pinRules(YamlMap top, String key, ModelDescriptor.Role role, String label) {
        List<BoardMapping.PinRule> rules = new ArrayList<>();
        List<Node> nodes = listOf(top, key, label);
        for (int i = 0; i < nodes.size(); i++) {
            String path = key + "[" + i + "]";
            YamlMap m = YamlMap.of(label, nodes.get(i), path, "a rule such as `{ pins: \"U1.*\", model: ramp, ... }`");
            String id = m.text("model", "a model id such as `" + (role == ModelDescriptor.Role.DRIVER ? "ramp" : "cmos") + "`");
            ModelDescriptor model = catalog.find(role, id).orElseThrow(() -> new InputException(
                    YamlMap.location(label, m.require("model", "")), m.path("model"), "unknown " + role.name().toLowerCase(java.util.Locale.ROOT)
                    + " model `" + id + "`; expected one of: " + String.join(", ", catalog.all().stream()
                            .filter(d -> d.role() == role).map(ModelDescriptor::id).toList())));
            List<String> allowed = new ArrayList<>(List.of("pins", "model"));
            model.parameters().stream().map(ParameterSpec::key).forEach(allowed::add);
            if (role == ModelDescriptor.Role.RECEIVER) {
                allowed.add("limits");
            }
            m.allowOnly(allowed, "a " + key.substring(0, key.length() - 1) + " rule with model " + id);
            Map<String, String> params = new LinkedHashMap<>();
            for (String k : m.keys()) {
                if (!k.equals("pins") && !k.equals("model") && !k.equals("limits")) {
                    params.put(k, m.text(k, "a value"));
                }
            }
            if (m.has("limits")) {
                throw new InputException(YamlMap.location(label, m.keyNode("limits")), m.path("limits"),
                        "receiver limits come from the net classes in a board file; expected them under `classes[..].limits`");
            }
            rules.add(new BoardMapping.PinRule(new Glob(m.text("pins", "a pin pattern such as `U1.*`")), id, params, m.location()));
        }
        return rules;
    }

    private static List<Node> listOf(YamlMap top, String key, String label) {
        return top.get(key).map(n -> YamlMap.list(label, n, key, "a list")).orElse(List.of());
    }

    private static List<Glob> globs(YamlMap top, String key, String label) {
        List<Glob> out = new ArrayList<>();
        Optional<Node> n = top.get(key);
        if (n.isEmpty()) {
            return out;
        }
        if (n.get() instanceof ScalarNode) {
            out.add(new Glob(YamlMap.scalar(label, n.get(), key, "a name pattern")));
            return out;
        }
        List<Node> items = YamlMap.list(label, n.get(), key, "a list of name patterns such as `[\"SPI_*\", \"CLK*\"]`");
        for (int i = 0; i < items.size(); i++) {
            out.add(new Glob(YamlMap.scalar(label, items.get(i), key + "[" + i + "]", "a name pattern")));
        }
        return out;
    }

    private static double quantity(String text, Dimension d, Location at, String key) {
        try {
            return Quantities.parse(text, d);
        } catch (QuantityFormatException e) {
            throw new InputException(at, key, e.getMessage(), e);
        }
    }

    private static void positive(String text, Dimension d, Location at, String key) {
        if (!(quantity(text, d, at, key) > 0)) {
            throw new InputException(at, key, "expected a positive value such as `" + (d == Dimension.RESISTANCE ? "22" : "1n")
                    + "`, found `" + text + "`");
        }
    }
}
