package org.ringsweep.runner.input;

import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.ringsweep.api.net.Location;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;
import org.yaml.snakeyaml.nodes.Tag;

/**
 * A YAML mapping of one input file, seen with its key path: typed access to its entries that
 * fails with an {@link InputException} naming file, line, column, key and what was expected.
 * Rejects duplicate keys and non-scalar keys when made. Public so that other input readers (the
 * sweep file) report problems the same way.
 */
public final class YamlMap {
    private final String file;
    private final MappingNode node;
    private final String path;
    private final Map<String, NodeTuple> entries = new LinkedHashMap<>();

    private YamlMap(String file, MappingNode node, String path) {
        this.file = file;
        this.node = node;
        this.path = path;
        for (NodeTuple t : node.getValue()) {
            if (!(t.getKeyNode() instanceof ScalarNode k)) {
                throw new InputException(location(file, t.getKeyNode()), path, "expected plain text keys, found " + describe(t.getKeyNode()));
            }
            NodeTuple before = entries.putIfAbsent(k.getValue(), t);
            if (before != null) {
                throw new InputException(location(file, k), join(path, k.getValue()), "duplicate key `" + k.getValue()
                        + "` (first at line " + location(file, before.getKeyNode()).line() + "); expected each key once");
            }
        }
    }

    /**
     * The mapping at {@code n}.
     *
     * @param what what the key expects, for the message ("a map such as `{ VCC: 3.3 }`")
     * @throws InputException if {@code n} is not a mapping
     */
    public static YamlMap of(String file, Node n, String path, String what) {
        if (n instanceof MappingNode m) {
            return new YamlMap(file, m, path);
        }
        throw new InputException(location(file, n), path, "expected " + what + ", found " + describe(n));
    }

    /** Where a node starts (1-based line and column). */
    public static Location location(String file, Node n) {
        return new Location(file, n.getStartMark().getLine() + 1, n.getStartMark().getColumn() + 1);
    }

    /** {@code parent.key}, or {@code key} at the top. */
    public static String join(String parent, String key) {
        return parent.isEmpty() ? key : parent + "." + key;
    }

    /** "a list", "a map", "nothing" or the quoted text, for messages. */
    public static String describe(Node n) {
        if (n instanceof SequenceNode) {
            return "a list";
        } else if (n instanceof MappingNode) {
            return "a map";
        }
        ScalarNode s = (ScalarNode) n;
        return s.getTag().equals(Tag.NULL) && s.getValue().isEmpty() || s.getValue().isBlank() ? "nothing" : "`" + s.getValue() + "`";
    }

    /** The file label used in messages. */
    public String file() {
        return file;
    }

    /** This map's key path. */
    public String path() {
        return path;
    }

    /** Where this map starts. */
    public Location location() {
        return location(file, node);
    }

    /** The key path of one of its keys. */
    public String path(String key) {
        return join(path, key);
    }

    /** The keys in file order. */
    public Collection<String> keys() {
        return entries.keySet();
    }

    /** Whether the map has {@code key}. */
    public boolean has(String key) {
        return entries.containsKey(key);
    }

    /** The value under {@code key}, if present. */
    public Optional<Node> get(String key) {
        return Optional.ofNullable(entries.get(key)).map(NodeTuple::getValueNode);
    }

    /** The key node itself, for errors about the key. */
    public Node keyNode(String key) {
        return entries.get(key).getKeyNode();
    }

    /**
     * The value under {@code key}.
     *
     * @param what what the key expects ("a point such as `U1.14`")
     * @throws InputException at this map when the key is missing
     */
    public Node require(String key, String what) {
        return get(key).orElseThrow(() -> new InputException(location(), path(key), "missing `" + key + "`; expected " + what));
    }

    /**
     * Rejects keys not in {@code allowed}, listing the allowed ones.
     *
     * @param what what this map is ("a segment")
     */
    public void allowOnly(List<String> allowed, String what) {
        for (String k : entries.keySet()) {
            if (!allowed.contains(k)) {
                throw new InputException(location(file, keyNode(k)), path(k),
                        "unknown key `" + k + "` in " + what + "; expected one of: " + String.join(", ", allowed));
            }
        }
    }

    /**
     * The text of a scalar value.
     *
     * @param what what the key expects
     * @throws InputException when the value is a list or map, or empty
     */
    public String text(String key, String what) {
        return scalar(file, require(key, what), path(key), what);
    }

    /** The text of a scalar node, not empty. */
    public static String scalar(String file, Node n, String path, String what) {
        if (n instanceof ScalarNode s && !s.getValue().isBlank()) {
            return s.getValue().strip();
        }
        throw new InputException(location(file, n), path, "expected " + what + ", found " + describe(n));
    }

    /** The text of a scalar node, possibly empty (null becomes empty). */
    public static String scalarOrEmpty(String file, Node n, String path, String what) {
        if (n instanceof ScalarNode s) {
            return s.getValue().strip();
        }
        throw new InputException(location(file, n), path, "expected " + what + ", found " + describe(n));
    }

    /** The items of a list value. */
    public static List<Node> list(String file, Node n, String path, String what) {
        if (n instanceof SequenceNode s) {
            return s.getValue();
        }
        throw new InputException(location(file, n), path, "expected " + what + ", found " + describe(n));
    }
}
