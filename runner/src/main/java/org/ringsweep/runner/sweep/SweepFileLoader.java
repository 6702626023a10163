package org.ringsweep.runner.sweep;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.PathMatcher;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.runner.input.InputException;
import org.ringsweep.runner.input.YamlMap;
import org.ringsweep.runner.input.YamlSource;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * Loads a sweep file ({@code format: ringsweep/sweep-1}, see {@code formats.md} "Sweep file").
 *
 * <p>Checks what can be checked without a net: the format, known keys only, one form of values
 * per entry ({@code values}; {@code from}/{@code to}/{@code steps} with optional {@code log}; or
 * {@code series} with {@code from}/{@code to}), {@code steps} a whole number ≥ 2, {@code log} a
 * flag, a known series, a non-empty {@code values} list, target syntax, each target once,
 * {@code combine} {@code grid} or {@code zip}, and that every {@code nets} file or glob names at
 * least one file. Bounds written as plain numbers are checked here ({@code from < to}, positive
 * for {@code log} and series); bounds with units, and all values, are checked by
 * {@link SweepPlanner} against each net's parameter, at the same file position. Every problem is
 * an {@link InputException}. Thread-safe.
 */
public final class SweepFileLoader {
    /** The format line a sweep file declares. */
    public static final String FORMAT = "ringsweep/sweep-1";
    private static final List<String> TOP_KEYS = List.of("format", "nets", "vary", "combine");
    private static final List<String> VARY_KEYS = List.of("target", "values", "from", "to", "steps", "log", "series");
    private static final String FORMS = "`values: [...]`, `from`/`to` with `steps`, or `series` with `from`/`to`";
    private static final String NETS_EXAMPLE = "a list of net files or globs such as `[nets/*.yaml]`";

    /**
     * Loads and checks one sweep file; net globs are resolved against the file's folder.
     *
     * @param file the sweep file; its text as given labels errors
     * @return the sweep
     * @throws InputException for any problem with the file
     */
    public SweepFile load(Path file) {
        String label = file.toString();
        String text = YamlSource.decode(YamlSource.readBytes(file, label, "sweep file", FORMAT), label, "sweep file");
        Node root = YamlSource.compose(text, label);
        if (root == null) {
            throw new InputException(new Location(label, 0, 0), "", "the file is empty; expected a sweep file starting with `format: "
                    + FORMAT + "`");
        }
        YamlMap top = YamlMap.of(label, root, "", "a map of keys starting with `format: " + FORMAT + "`");
        checkFormat(top);
        top.allowOnly(TOP_KEYS, "a sweep file");
        Path base = file.getParent() == null ? Path.of(".") : file.getParent();
        List<Path> nets = nets(top, base);
        List<Vary> vary = vary(top);
        Combine combine = Combine.GRID;
        Location combineAt = top.location();
        Optional<Node> c = top.get("combine");
        if (c.isPresent()) {
            combineAt = YamlMap.location(label, c.get());
            String word = YamlMap.scalar(label, c.get(), "combine", "`grid` or `zip`");
            combine = Arrays.stream(Combine.values()).filter(x -> x.word().equals(word)).findFirst().orElseThrow(() ->
                    new InputException(YamlMap.location(label, c.get()), "combine", "expected `grid` (every combination) or `zip`"
                            + " (paired lists), found `" + word + "`"));
        }
        if (combine == Combine.ZIP) {
            checkKnownZipLengths(vary, combineAt);
        }
        return new SweepFile(file, nets, vary, combine, combineAt);
    }

    private static void checkFormat(YamlMap top) {
        String format = top.text("format", "`format: " + FORMAT + "` as the first key");
        if (format.equals(FORMAT)) {
            return;
        }
        String hint = format.equals("ringsweep/net-1") ? " (that is a net file: name it under `nets` of a sweep file, or run"
                + " it with `ringsweep check`)" : "";
        throw new InputException(YamlMap.location(top.file(), top.get("format").orElseThrow()), "format",
                "expected `" + FORMAT + "`, found `" + format + "`" + hint);
    }

    private static List<Path> nets(YamlMap top, Path base) {
        Node n = top.require("nets", NETS_EXAMPLE);
        String file = top.file();
        List<Node> items;
        List<String> keys = new ArrayList<>();
        if (n instanceof SequenceNode) {
            items = YamlMap.list(file, n, "nets", NETS_EXAMPLE);
            if (items.isEmpty()) {
                throw new InputException(YamlMap.location(file, n), "nets", "expected " + NETS_EXAMPLE + ", found an empty list");
            }
            for (int i = 0; i < items.size(); i++) {
                keys.add("nets[" + i + "]");
            }
        } else {
            items = List.of(n);
            keys.add("nets");
        }
        Set<Path> found = new TreeSet<>();
        for (int i = 0; i < items.size(); i++) {
            String pattern = YamlMap.scalar(file, items.get(i), keys.get(i), "a net file or a glob such as `nets/*.yaml`");
            found.addAll(expand(base, pattern, YamlMap.location(file, items.get(i)), keys.get(i)));
        }
        return List.copyOf(found);
    }

    /** The files a name or glob matches, relative to {@code base}, normalized. */
    static List<Path> expand(Path base, String pattern, Location at, String key) {
        String[] parts = pattern.split("/", -1);
        int firstGlob = 0;
        while (firstGlob < parts.length && !isGlob(parts[firstGlob])) {
            firstGlob++;
        }
        if (firstGlob == parts.length) {
            Path p = base.resolve(pattern).normalize();
            if (!Files.isRegularFile(p)) {
                throw new InputException(at, key, "no net file `" + pattern + "` (looked for " + p + "); expected a net file or a"
                        + " glob such as `nets/*.yaml`, relative to the sweep file");
            }
            return List.of(p);
        }
        String prefix = String.join("/", Arrays.copyOfRange(parts, 0, firstGlob));
        Path root = !prefix.isEmpty() ? base.resolve(prefix) : pattern.startsWith("/") ? Path.of("/") : base;
        String rest = String.join("/", Arrays.copyOfRange(parts, firstGlob, parts.length));
        PathMatcher matcher = FileSystems.getDefault().getPathMatcher("glob:" + rest);
        int depth = rest.contains("**") ? Integer.MAX_VALUE : parts.length - firstGlob;
        List<Path> out = new ArrayList<>();
        if (Files.isDirectory(root)) {
            Path walkRoot = root;
            try (Stream<Path> files = Files.walk(walkRoot, depth)) {
                files.filter(Files::isRegularFile).filter(f -> matcher.matches(walkRoot.relativize(f)))
                        .map(Path::normalize).forEach(out::add);
            } catch (IOException | UncheckedIOException e) {
                throw new InputException(at, key, "cannot list folder " + walkRoot + " (" + e.getClass().getSimpleName()
                        + "); expected a readable folder of net files", e);
            }
        }
        if (out.isEmpty()) {
            throw new InputException(at, key, "`" + pattern + "` matches no file (looked under " + root.normalize()
                    + "); expected a glob that matches net files, relative to the sweep file");
        }
        return out;
    }

    private static boolean isGlob(String part) {
        return part.chars().anyMatch(ch -> "*?[{".indexOf(ch) >= 0);
    }

    private static List<Vary> vary(YamlMap top) {
        String file = top.file();
        String example = "a list of entries such as `- { target: R5/value, values: [10, 22, 33] }`";
        Node n = top.require("vary", example);
        List<Node> items = YamlMap.list(file, n, "vary", example);
        if (items.isEmpty()) {
            throw new InputException(YamlMap.location(file, n), "vary", "expected " + example + ", found an empty list");
        }
        List<Vary> out = new ArrayList<>();
        Map<String, Vary> byTarget = new HashMap<>();
        for (int i = 0; i < items.size(); i++) {
            Vary v = entry(file, items.get(i), i);
            Vary before = byTarget.putIfAbsent(v.target(), v);
            if (before != null) {
                throw new InputException(v.location(), v.key("target"), "`" + v.target() + "` is already varied by " + before.key()
                        + "; expected each target once (list all its values in one entry)");
            }
            out.add(v);
        }
        return out;
    }

    private static Vary entry(String file, Node n, int index) {
        String key = "vary[" + index + "]";
        YamlMap m = YamlMap.of(file, n, key, "an entry such as `{ target: R5/value, values: [10, 22, 33] }`");
        m.allowOnly(VARY_KEYS, "a vary entry");
        String target = m.text("target", "`ID/param` such as `R5/value` or `U1.14/rise`, or `corner`");
        Location at = YamlMap.location(file, m.get("target").orElseThrow());
        if (!target.equals(Vary.CORNER)) {
            try {
                ValuePath.parse(target);
            } catch (IllegalArgumentException e) {
                throw new InputException(at, m.path("target"), "expected `ID/param` such as `R5/value` or `U1.14/rise`, or `corner`,"
                        + " found `" + target + "`", e);
            }
        }
        return new Vary(index, target, at, values(m, target.equals(Vary.CORNER)));
    }

    private static Vary.Values values(YamlMap m, boolean corner) {
        String file = m.file();
        if (corner) {
            for (String k : List.of("from", "to", "steps", "log", "series")) {
                if (m.has(k)) {
                    throw new InputException(YamlMap.location(file, m.keyNode(k)), m.path(k), "`target: corner` takes corner names"
                            + " under `values`, such as `values: [slow, typ, fast]`; expected no `" + k + "`");
                }
            }
            return new Vary.Corners(texts(m, "a non-empty list of corner names such as `[slow, typ, fast]`"));
        }
        if (m.has("values")) {
            for (String k : List.of("from", "to", "steps", "log", "series")) {
                if (m.has(k)) {
                    throw new InputException(YamlMap.location(file, m.keyNode(k)), m.path(k), "`values` lists the values itself, so `"
                            + k + "` has no place beside it; expected one of " + FORMS);
                }
            }
            return new Vary.Listed(texts(m, "a non-empty list of values such as `[10, 22, 33]` or `[1ns, 2ns]`"));
        }
        if (m.has("series")) {
            for (String k : List.of("steps", "log")) {
                if (m.has(k)) {
                    throw new InputException(YamlMap.location(file, m.keyNode(k)), m.path(k), "a series gives its own values, so `"
                            + k + "` has no place beside `series`; expected only `series`, `from` and `to`");
                }
            }
            String name = m.text("series", "a series name such as `E24`");
            ESeries.Series series = ESeries.Series.named(name).orElseThrow(() -> new InputException(
                    YamlMap.location(file, m.get("series").orElseThrow()), m.path("series"), "unknown series `" + name
                    + "`; expected one of: " + Arrays.stream(ESeries.Series.values()).map(Enum::name).collect(Collectors.joining(", "))));
            Vary.SeriesRange s = new Vary.SeriesRange(series, bound(m, "from"), bound(m, "to"));
            checkPlainBounds(s);
            return s;
        }
        if (!m.has("from") && !m.has("to") && !m.has("steps")) {
            throw new InputException(m.location(), m.path(), "missing the values; expected " + FORMS);
        }
        Vary.Text from = bound(m, "from");
        Vary.Text to = bound(m, "to");
        int steps = steps(m);
        boolean log = false;
        if (m.has("log")) {
            Node l = m.get("log").orElseThrow();
            String t = YamlMap.scalarOrEmpty(file, l, m.path("log"), "`true` or `false`");
            if (!t.equals("true") && !t.equals("false")) {
                throw new InputException(YamlMap.location(file, l), m.path("log"), "expected `true` or `false`, found "
                        + (t.isEmpty() ? "nothing" : "`" + t + "`"));
            }
            log = t.equals("true");
        }
        Vary.Range r = new Vary.Range(from, to, steps, log);
        checkPlainBounds(r);
        return r;
    }

    private static List<Vary.Text> texts(YamlMap m, String what) {
        String file = m.file();
        Node n = m.require("values", what);
        List<Node> items = YamlMap.list(file, n, m.path("values"), what);
        if (items.isEmpty()) {
            throw new InputException(YamlMap.location(file, n), m.path("values"), "expected " + what + ", found an empty list");
        }
        List<Vary.Text> out = new ArrayList<>();
        for (int j = 0; j < items.size(); j++) {
            String key = m.path("values") + "[" + j + "]";
            out.add(new Vary.Text(YamlMap.scalar(file, items.get(j), key, "a single value"), YamlMap.location(file, items.get(j)), key));
        }
        return out;
    }

    private static Vary.Text bound(YamlMap m, String k) {
        String what = k.equals("from") ? "the first value such as `10` or `0.5ns`" : "the last value such as `100` or `3ns`";
        Node n = m.require(k, what);
        return new Vary.Text(YamlMap.scalar(m.file(), n, m.path(k), what), YamlMap.location(m.file(), n), m.path(k));
    }

    private static int steps(YamlMap m) {
        String what = "a whole number of at least 2 such as `6`";
        Node n = m.require("steps", what + " (the count of values from `from` to `to`)");
        String t = YamlMap.scalarOrEmpty(m.file(), n, m.path("steps"), what);
        if (t.matches("\\+?\\d{1,9}") && Integer.parseInt(t.replace("+", "")) >= 2) {
            return Integer.parseInt(t.replace("+", ""));
        }
        throw new InputException(YamlMap.location(m.file(), n), m.path("steps"), "expected " + what + " (the count of values,"
                + " both ends included), found " + (t.isEmpty() ? "nothing" : "`" + t + "`"));
    }

    private static void checkPlainBounds(Vary.Values v) {
        Vary.Text from = v instanceof Vary.Range r ? r.from() : ((Vary.SeriesRange) v).from();
        Vary.Text to = v instanceof Vary.Range r ? r.to() : ((Vary.SeriesRange) v).to();
        Optional<Double> f = SweepChecks.plain(from.text());
        Optional<Double> t = SweepChecks.plain(to.text());
        if (f.isPresent() && t.isPresent()) {
            SweepChecks.bounds(v, f.get(), t.get());
        }
    }

    /** Lengths known without a net: listed values, corners, steps, and series with plain bounds. */
    private static void checkKnownZipLengths(List<Vary> vary, Location combineAt) {
        List<Vary> known = new ArrayList<>();
        List<Integer> lengths = new ArrayList<>();
        for (Vary v : vary) {
            Optional<Integer> n = knownLength(v.values());
            if (n.isPresent()) {
                known.add(v);
                lengths.add(n.get());
            }
        }
        SweepChecks.zipLengths(known, lengths, combineAt);
    }

    private static Optional<Integer> knownLength(Vary.Values values) {
        if (values instanceof Vary.Listed l) {
            return Optional.of(l.texts().size());
        } else if (values instanceof Vary.Corners c) {
            return Optional.of(c.names().size());
        } else if (values instanceof Vary.Range r) {
            return Optional.of(r.steps());
        }
        Vary.SeriesRange s = (Vary.SeriesRange) values;
        Optional<Double> f = SweepChecks.plain(s.from().text());
        Optional<Double> t = SweepChecks.plain(s.to().text());
        return f.isPresent() && t.isPresent() ? Optional.of(ESeries.between(s.series(), f.get(), t.get()).size()) : Optional.empty();
    }
}
