package org.ringsweep.runner.importer;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeMap;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.runner.input.InputException;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.netlist.LengthRow;
import org.ringsweep.runner.netlist.Netlist;
import org.ringsweep.runner.netlist.PinRecord;

/**
 * Turns a netlist and a board mapping into one {@code ringsweep/net-1} file per included net.
 *
 * <p>Steps: (1) series parts: a refdes matching a {@code series} rule with exactly two pins on two
 * different, not excluded nets joins those nets into one, the part between the pieces; (2) nets
 * matching {@code exclude} are skipped, and when {@code include} is given only nets (or joined
 * pieces) matching it are kept, else every net with a driver and a receiver; (3) each other pin is
 * an {@code ignore}d pin, a driver (first {@code drivers} rule), a receiver (first
 * {@code receivers} rule) or unknown; a net with unknown pins is skipped and the pins listed, a
 * net needs exactly one driver and at least one receiver; (4) a joined net takes the name of the
 * first piece (netlist order) that does not hold the driver; (5) the class is the first whose
 * pattern matches the net name (else a piece name); (6) topology: the length-table rows of the
 * net's pieces when there are any (every modelled pin must appear in them), else per piece a
 * rectilinear minimum spanning tree of the pin coordinates rooted at the driver (or at the
 * series-part pin toward it) with each Manhattan distance times {@code detour} (estimated
 * lengths under 0.1 mm are raised to 0.1 mm, a line must have a length); (7) a class
 * {@code termination} adds a series resistor {@code RTn} at the driver of a net with no series
 * part.
 *
 * <p>Each written file is loaded back with {@link NetFileLoader}; one that does not load is
 * removed and reported in {@link ImportReport#errors()}.
 */
public final class BoardImporter {
    private static final double MIN_ESTIMATE_M = 1e-4;
    private final ModelCatalog catalog;

    /** @param catalog the models the generated files name */
    public BoardImporter(ModelCatalog catalog) {
        this.catalog = Objects.requireNonNull(catalog, "catalog");
    }

    /** A joining part: {@code a} on one piece, {@code b} on the other. */
    private record Join(String ref, BoardMapping.SeriesRule rule, PinRecord a, PinRecord b) {
    }

    /** A classified pin. */
    private record Classified(PinRecord pin, BoardMapping.PinRule rule) {
    }

    /**
     * Imports.
     *
     * @param netlist the board netlist
     * @param board   the board mapping
     * @param lengths length-table rows by net name (empty when there is no table)
     * @param outDir  the folder for the net files (created)
     * @throws UncheckedIOException when a file cannot be written
     */
    public ImportReport run(Netlist netlist, BoardMapping board, Map<String, List<LengthRow>> lengths, Path outDir) {
        Map<String, List<PinRecord>> nets = netlist.byNet();
        List<String> notes = new ArrayList<>(netlist.notes());
        List<ImportReport.Made> made = new ArrayList<>();
        List<ImportReport.Skipped> skipped = new ArrayList<>();
        Map<String, List<String>> unknown = new TreeMap<>();
        List<String> errors = new ArrayList<>();

        // (1) series parts
        Map<String, List<PinRecord>> byRef = new LinkedHashMap<>();
        netlist.pins().forEach(p -> byRef.computeIfAbsent(p.refdes(), k -> new ArrayList<>()).add(p));
        Map<String, String> parent = new HashMap<>();
        nets.keySet().forEach(n -> parent.put(n, n));
        List<Join> joins = new ArrayList<>();
        for (Map.Entry<String, List<PinRecord>> e : byRef.entrySet()) {
            BoardMapping.SeriesRule rule = board.series().stream().filter(r -> r.refs().matches(e.getKey())).findFirst().orElse(null);
            if (rule == null) {
                continue;
            }
            List<PinRecord> pins = e.getValue();
            String why = null;
            if (pins.size() != 2) {
                why = "has " + pins.size() + " pin(s)";
            } else if (pins.get(0).net().equals(pins.get(1).net())) {
                why = "has both pins on net `" + pins.get(0).net() + "`";
            } else if (excluded(board, pins.get(0).net()) || excluded(board, pins.get(1).net())) {
                why = "touches an excluded net";
            }
            if (why != null) {
                notes.add("series part " + e.getKey() + " (rule `" + rule.refs().text() + "`) " + why + ": not joined");
                continue;
            }
            joins.add(new Join(e.getKey(), rule, pins.get(0), pins.get(1)));
            parent.put(find(parent, pins.get(0).net()), find(parent, pins.get(1).net()));
        }
        Map<String, List<String>> groups = new LinkedHashMap<>();
        nets.keySet().forEach(n -> groups.computeIfAbsent(find(parent, n), k -> new ArrayList<>()).add(n));
        Set<String> usedRefs = new HashSet<>(byRef.keySet());
        Set<String> usedFiles = new HashSet<>();
        try {
            Files.createDirectories(outDir);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        NetFileLoader loader = new NetFileLoader(catalog);
        for (List<String> pieceList : groups.values()) {
            List<String> pieces = new ArrayList<>();
            nets.keySet().stream().filter(pieceList::contains).forEach(pieces::add);
            String label = String.join("+", pieces);
            if (pieces.size() == 1 && excluded(board, pieces.get(0))) {
                skipped.add(new ImportReport.Skipped(label, "excluded by `" + Glob.first(board.exclude(), pieces.get(0)).text() + "`"));
                continue;
            }
            boolean explicitlyIncluded = pieces.stream().anyMatch(p -> Glob.first(board.include(), p) != null);
            if (!board.include().isEmpty() && !explicitlyIncluded) {
                skipped.add(new ImportReport.Skipped(label, "not matched by `include`"));
                continue;
            }
            List<Join> netJoins = joins.stream().filter(j -> pieces.contains(j.a().net())).toList();
            Set<String> seriesPoints = new HashSet<>();
            netJoins.forEach(j -> {
                seriesPoints.add(j.a().point());
                seriesPoints.add(j.b().point());
            });
            List<Classified> drivers = new ArrayList<>();
            List<Classified> receivers = new ArrayList<>();
            List<PinRecord> unknownPins = new ArrayList<>();
            List<PinRecord> modelled = new ArrayList<>();
            for (String piece : pieces) {
                for (PinRecord p : nets.get(piece)) {
                    if (seriesPoints.contains(p.point())) {
                        modelled.add(p);
                    } else if (Glob.first(board.ignore(), p.point()) != null) {
                        continue;
                    } else {
                        BoardMapping.PinRule d = board.drivers().stream().filter(r -> r.pins().matches(p.point())).findFirst().orElse(null);
                        BoardMapping.PinRule r = d != null ? null : board.receivers().stream().filter(x -> x.pins().matches(p.point())).findFirst().orElse(null);
                        if (d != null) {
                            drivers.add(new Classified(p, d));
                            modelled.add(p);
                        } else if (r != null) {
                            receivers.add(new Classified(p, r));
                            modelled.add(p);
                        } else {
                            unknownPins.add(p);
                        }
                    }
                }
            }
            String unknownText = String.join(", ", unknownPins.stream().map(PinRecord::point).toList());
            if (!unknownPins.isEmpty() && (explicitlyIncluded || !drivers.isEmpty())) {
                unknownPins.forEach(p -> unknown.computeIfAbsent(p.refdes(), k -> new ArrayList<>()).add(p.point()));
                skipped.add(new ImportReport.Skipped(label, "unknown pins " + unknownText
                        + " (no drivers, receivers, series or ignore rule matches them)"));
                continue;
            }
            if (drivers.isEmpty()) {
                skipped.add(new ImportReport.Skipped(label, "no driver pin (no `drivers` rule matches a pin)"));
                continue;
            }
            if (drivers.size() > 1) {
                skipped.add(new ImportReport.Skipped(label, "more than one driver (" + String.join(", ",
                        drivers.stream().map(c -> c.pin().point()).toList()) + "); a generated net has one driver"));
                continue;
            }
            if (receivers.isEmpty()) {
                skipped.add(new ImportReport.Skipped(label, "no receiver pin (no `receivers` rule matches a pin)"));
                continue;
            }
            PinRecord driver = drivers.get(0).pin();
            String name = pieces.size() == 1 ? pieces.get(0)
                    : pieces.stream().filter(p -> !p.equals(driver.net())).findFirst().orElseThrow();
            BoardMapping.NetClass netClass = board.classes().stream().filter(c -> c.nets().matches(name)).findFirst()
                    .orElse(board.classes().stream().filter(c -> pieces.stream().anyMatch(p -> c.nets().matches(p))).findFirst().orElse(null));
            if (netClass == null) {
                skipped.add(new ImportReport.Skipped(label, "no class matches `" + name + "`; add a class with z0 and er_eff"));
                continue;
            }
            // (6) topology
            List<NetFileWriter.SegmentText> segments = new ArrayList<>();
            boolean estimated;
            List<LengthRow> rows = new ArrayList<>();
            pieces.forEach(p -> rows.addAll(lengths.getOrDefault(p, List.of()))); // pieces in netlist order
            if (!rows.isEmpty()) {
                estimated = false;
                Set<String> ends = new HashSet<>();
                rows.forEach(r -> {
                    ends.add(r.from());
                    ends.add(r.to());
                });
                List<String> missing = modelled.stream().map(PinRecord::point).filter(p -> !ends.contains(p)).toList();
                if (!missing.isEmpty()) {
                    skipped.add(new ImportReport.Skipped(label, "the length table has rows for this net but none reaching "
                            + String.join(", ", missing)));
                    continue;
                }
                rows.forEach(r -> segments.add(new NetFileWriter.SegmentText(r.from(), r.to(), r.metres())));
            } else {
                estimated = true;
                List<String> noXy = modelled.stream().filter(p -> !p.hasCoordinates()).map(PinRecord::point).toList();
                if (!noXy.isEmpty()) {
                    skipped.add(new ImportReport.Skipped(label, "no coordinates for " + String.join(", ", noXy)
                            + " and no length-table rows for this net"));
                    continue;
                }
                segments.addAll(estimate(pieces, modelled, netJoins, driver, board.detour()));
            }
            List<NetFileWriter.PartText> parts = new ArrayList<>();
            netJoins.forEach(j -> parts.add(new NetFileWriter.PartText(j.ref(), j.rule().kind(), j.rule().value(),
                    j.a().point(), j.b().point())));
            String driverPoint = driver.point();
            if (netClass.termination() != null && parts.isEmpty()) {
                String ref = freshRef(usedRefs);
                String end = ref + ".2";
                parts.add(new NetFileWriter.PartText(ref, "resistor", netClass.termination(), driverPoint, end));
                segments.replaceAll(s -> new NetFileWriter.SegmentText(s.from().equals(driverPoint) ? end : s.from(),
                        s.to().equals(driverPoint) ? end : s.to(), s.metres()));
            }
            String base = YamlText.fileName(name);
            String fileName = base + ".yaml";
            for (int n = 2; !usedFiles.add(fileName.toLowerCase(Locale.ROOT)); n++) {
                fileName = base + "-" + n + ".yaml";
            }
            Path file = outDir.resolve(fileName);
            String text = NetFileWriter.text(new NetFileWriter.NetText(name, pieces, netlist.file(), board, drivers.get(0).rule(), driverPoint,
                    receivers.stream().map(c -> Map.entry(c.pin().point(), c.rule())).toList(), segments, parts, netClass, estimated));
            try {
                Files.writeString(file, text, StandardCharsets.UTF_8);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            try {
                loader.load(file);
            } catch (InputException e) {
                errors.add(e.getMessage() + " (net `" + name + "`: check the board file's rules for its pins and class `"
                        + netClass.nets().text() + "`)");
                try {
                    Files.deleteIfExists(file);
                } catch (IOException io) {
                    throw new UncheckedIOException(io);
                }
                continue;
            }
            made.add(new ImportReport.Made(name, file, pieces, modelled.size(), estimated, netClass.nets().text()));
        }
        return new ImportReport(made, skipped, unknown, errors, notes);
    }

    /** Per piece, a rectilinear MST rooted at the driver or at the series pin toward it. */
    private static List<NetFileWriter.SegmentText> estimate(List<String> pieces, List<PinRecord> modelled, List<Join> joins,
            PinRecord driver, double detour) {
        Map<String, String> rootOf = new LinkedHashMap<>();
        rootOf.put(driver.net(), driver.point());
        Deque<String> queue = new ArrayDeque<>(List.of(driver.net()));
        while (!queue.isEmpty()) {
            String piece = queue.removeFirst();
            for (Join j : joins) {
                for (PinRecord[] side : new PinRecord[][] {{j.a(), j.b()}, {j.b(), j.a()}}) {
                    if (side[0].net().equals(piece) && !rootOf.containsKey(side[1].net())) {
                        rootOf.put(side[1].net(), side[1].point());
                        queue.addLast(side[1].net());
                    }
                }
            }
        }
        List<NetFileWriter.SegmentText> segments = new ArrayList<>();
        for (String piece : pieces) {
            Map<String, double[]> points = new LinkedHashMap<>();
            modelled.stream().filter(p -> p.net().equals(piece)).forEach(p -> points.put(p.point(), new double[] {p.x(), p.y()}));
            for (RectilinearTree.Edge e : RectilinearTree.of(points, rootOf.get(piece))) {
                segments.add(new NetFileWriter.SegmentText(e.from(), e.to(), Math.max(MIN_ESTIMATE_M, e.manhattan() * detour)));
            }
        }
        return segments;
    }

    private static String freshRef(Set<String> used) {
        for (int n = 1; ; n++) {
            if (used.add("RT" + n)) {
                return "RT" + n;
            }
        }
    }

    private static boolean excluded(BoardMapping board, String net) {
        return Glob.first(board.exclude(), net) != null;
    }

    private static String find(Map<String, String> parent, String n) {
        String p = parent.get(n);
        while (!p.equals(parent.get(p))) {
            p = parent.get(p);
        }
        return p;
    }
}
