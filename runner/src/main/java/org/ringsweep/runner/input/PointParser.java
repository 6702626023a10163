package org.ringsweep.runner.input;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.stream.Collectors;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Element;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Point;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.net.Segment;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.net.ValuePath;

/**
 * Turns {@code ID/param = text} overrides (a corner of a net file, {@code --set}, a sweep's values)
 * into a {@link Point} for one net, checking each against the net and the model catalog:
 * <ul>
 *   <li>the ID is an element of the net (else the message lists every id);</li>
 *   <li>the param is one the element takes: segments {@code z0 delay length er_eff velocity r_per_m
 *       g_per_m}, parts {@code value}, drivers and receivers their model's parameters (else the
 *       message lists them);</li>
 *   <li>the text is a value of that param's kind, sign and range, as in the net file;</li>
 *   <li>the override is not silently shadowed: a segment given by {@code delay} takes no
 *       {@code length}, {@code er_eff} or {@code velocity}, and one given by {@code er_eff} takes
 *       no {@code velocity} (or the reverse). A {@code delay} on a segment given by length is
 *       accepted and then wins, as {@link Segment#delaySeconds()} reads it first;</li>
 *   <li>a driver or receiver with its overrides still passes its model's combination check.</li>
 * </ul>
 * The name {@code typ} stands for the file's own values and is not a corner. Thread-safe.
 */
public final class PointParser {
    /** The location label of values given with {@code --set}. */
    public static final String SET_OPTION_LABEL = "--set";

    /**
     * One override as written.
     *
     * @param path      {@code ID/param}, e.g. {@code U1.14/rise}
     * @param valueText the value as written, e.g. {@code 2.5ns}
     * @param location  where it was written (the value's position; {@code --set} for the command line)
     */
    public record Assignment(String path, String valueText, Location location) {
        /** Rejects nulls. */
        public Assignment {
            Objects.requireNonNull(path, "path");
            Objects.requireNonNull(valueText, "valueText");
            Objects.requireNonNull(location, "location");
        }
    }

    private final ModelCatalog catalog;

    /** @param catalog the models drivers and receivers may use */
    public PointParser(ModelCatalog catalog) {
        this.catalog = Objects.requireNonNull(catalog, "catalog");
    }

    /**
     * Reads a {@code --set ID/param=value} option value (split at the first {@code =}).
     *
     * @param text the option's value, e.g. {@code U1.14/rise=2ns}
     * @return the assignment, located at {@value #SET_OPTION_LABEL}
     * @throws InputException if there is no {@code =} or an empty side
     */
    public static Assignment fromSetOption(String text) {
        Location at = new Location(SET_OPTION_LABEL, 0, 0);
        String t = text == null ? "" : text.strip();
        int eq = t.indexOf('=');
        if (eq <= 0 || eq == t.length() - 1) {
            throw new InputException(at, "", "expected ID/param=value such as `R5/value=33` or `U1.14/rise=2ns`, found "
                    + ValueReader.found(t));
        }
        return new Assignment(t.substring(0, eq).strip(), t.substring(eq + 1).strip(), at);
    }

    /**
     * Checks and parses overrides for {@code net}; later assignments to the same path win.
     *
     * @param net         the net they apply to
     * @param assignments the overrides in order
     * @return the point (empty for no assignments)
     * @throws InputException naming the assignment's location and its path as the key
     */
    public Point parse(Net net, List<Assignment> assignments) {
        return parse(net, assignments, "");
    }

    /**
     * As {@link #parse(Net, List)}, with error keys written {@code keyPrefix.ID/param} (e.g.
     * {@code corners.slow.U1.14/rise}).
     *
     * @param keyPrefix the key path the assignments sit under, or empty
     */
    public Point parse(Net net, List<Assignment> assignments, String keyPrefix) {
        Map<ValuePath, Value> values = new LinkedHashMap<>();
        Map<String, Assignment> lastByElement = new LinkedHashMap<>();
        for (Assignment a : assignments) {
            ValuePath path = path(a, keyPrefix);
            values.put(path, value(net, path, a.valueText(), a.location(), YamlMap.join(keyPrefix, a.path())));
            lastByElement.put(path.id(), a);
        }
        checkCombinations(net, values, lastByElement, keyPrefix);
        return Point.of(values);
    }

    /**
     * Checks and parses one value for {@code path} on {@code net} (the per-assignment part of
     * {@link #parse}; for sweep values).
     *
     * @param key the key path to name in errors
     * @throws InputException if the id, the param or the value is not valid for the net
     */
    public Value value(Net net, ValuePath path, String text, Location location, String key) {
        Element e = net.element(path.id()).orElseThrow(() -> new InputException(location, key,
                "no element `" + path.id() + "` on net " + net.name() + "; expected one of: "
                        + net.elements().stream().map(Element::id).collect(Collectors.joining(", "))));
        if ((e instanceof Driver || e instanceof Receiver)
                && ElementRules.model(catalog, e).isEmpty()) {
            throw new InputException(location, key, ElementRules.describe(e) + " uses a model this run does not know;"
                    + " expected a net loaded with the same models (see `ringsweep models`)");
        }
        ValueRule rule = ElementRules.rule(catalog, e, path.param()).orElseThrow(() -> new InputException(location, key,
                "unknown parameter `" + path.param() + "` for " + ElementRules.describe(e) + "; expected one of: "
                        + String.join(", ", ElementRules.parameterKeys(catalog, e))));
        if (e instanceof Segment s) {
            checkNotShadowed(s, path.param(), location, key);
        }
        return ValueReader.read(rule, text, net.rails().keySet(), location, key);
    }

    /** The parameters {@code id} takes on {@code net}, in listing order (empty when no such element). */
    public List<String> parametersOf(Net net, String id) {
        return net.element(id).map(e -> ElementRules.parameterKeys(catalog, e)).orElse(List.of());
    }

    private static ValuePath path(Assignment a, String keyPrefix) {
        try {
            return ValuePath.parse(a.path());
        } catch (IllegalArgumentException e) {
            throw new InputException(a.location(), YamlMap.join(keyPrefix, a.path()),
                    "expected a path ID/param such as `R5/value` or `U1.14/rise`, found " + ValueReader.found(a.path()), e);
        }
    }

    private static void checkNotShadowed(Segment s, String param, Location location, String key) {
        Set<String> given = s.parameters().keys();
        boolean byDelay = given.contains("delay") && !given.contains("length");
        if (byDelay && Set.of("length", "er_eff", "velocity").contains(param)) {
            throw new InputException(location, key, "segment " + s.id() + " is given by its delay, so `" + param
                    + "` would have no effect; expected `" + s.id() + "/delay`");
        }
        if (param.equals("velocity") && given.contains("er_eff") || param.equals("er_eff") && given.contains("velocity")) {
            String own = given.contains("er_eff") ? "er_eff" : "velocity";
            throw new InputException(location, key, "segment " + s.id() + " gives its speed by " + own + ", so `" + param
                    + "` would be ambiguous; expected `" + s.id() + "/" + own + "`");
        }
    }

    private void checkCombinations(Net net, Map<ValuePath, Value> values, Map<String, Assignment> lastByElement, String keyPrefix) {
        for (Map.Entry<String, Assignment> last : lastByElement.entrySet()) {
            Element e = net.element(last.getKey()).orElseThrow();
            ModelDescriptor model = ElementRules.model(catalog, e).orElse(null);
            if (model == null) {
                continue;
            }
            Parameters merged = e.parameters();
            for (Map.Entry<ValuePath, Value> v : values.entrySet()) {
                if (v.getKey().id().equals(e.id())) {
                    merged = merged.with(v.getKey().param(), v.getValue());
                }
            }
            List<ModelDescriptor.Problem> problems = model.check(merged);
            if (!problems.isEmpty()) {
                ModelDescriptor.Problem p = problems.get(0);
                throw new InputException(last.getValue().location(), YamlMap.join(keyPrefix, e.id() + "/" + p.key()),
                        ElementRules.describe(e) + " with these overrides: " + p.message());
            }
        }
    }
}
