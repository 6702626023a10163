package org.ringsweep.api.circuit;

import java.util.Collections;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.apiguardian.api.API;

/**
 * A flat circuit ready for an engine: primitives on safe node names, the transient analysis, the
 * nodes to record (probes, each with the user's name for it) and descriptive header lines.
 *
 * <p>Immutable. Element names are unique; every probe is a node of some primitive.
 *
 * @param title       a safe title (letters, digits, space, {@code _ . -}; at most 60 characters)
 * @param primitives  the elements
 * @param analysis    the transient analysis
 * @param probes      recorded nodes: safe node name → the user's name (e.g. {@code u7_6} → {@code U7.6})
 * @param notes       free header facts for humans (net, point, source, hash); rendered as comments
 *                    only after the deck writer has made them safe
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record Circuit(String title, List<Primitive> primitives, Transient analysis,
                      Map<String, String> probes, Map<String, String> notes) {
    private static final java.util.regex.Pattern TITLE = java.util.regex.Pattern.compile("[A-Za-z0-9 _.\\-]{1,60}");

    /** Validates and copies. */
    public Circuit {
        if (!TITLE.matcher(title).matches()) {
            throw new IllegalArgumentException("circuit title `" + title + "` must match " + TITLE.pattern());
        }
        primitives = List.copyOf(primitives);
        probes = Collections.unmodifiableMap(new LinkedHashMap<>(probes));
        notes = Collections.unmodifiableMap(new LinkedHashMap<>(notes));
        java.util.Objects.requireNonNull(analysis, "analysis");
        Set<String> names = new HashSet<>();
        Set<String> nodes = new HashSet<>();
        for (Primitive p : primitives) {
            String key = p.getClass().getSimpleName() + ":" + p.name();
            if (!names.add(key)) {
                throw new IllegalArgumentException("element name " + p.name() + " is used twice for " + p.getClass().getSimpleName());
            }
            nodes.addAll(p.nodes());
        }
        for (String probe : probes.keySet()) {
            if (!nodes.contains(probe)) {
                throw new IllegalArgumentException("probe " + probe + " is not a node of the circuit");
            }
        }
    }

    /** Every node used by a primitive, ground included. */
    public Set<String> nodes() {
        Set<String> all = new java.util.TreeSet<>();
        primitives.forEach(p -> all.addAll(p.nodes()));
        return all;
    }
}
