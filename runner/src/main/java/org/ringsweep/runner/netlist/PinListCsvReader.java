package org.ringsweep.runner.netlist;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.ringsweep.api.net.Location;
import org.ringsweep.runner.input.InputException;

/**
 * Reads a CSV pin list: one pin per line, {@code net,refdes,pin[,x,y]}.
 *
 * <p>A header line is optional. When the first line names the columns (it has {@code net},
 * {@code refdes} and {@code pin}), columns are found by name in any order and may include
 * {@code x}, {@code y} and {@code units}; without a header they are positional
 * {@code net,refdes,pin[,x,y]}. Blank lines and lines starting with {@code #} are skipped.
 *
 * <p>Coordinates: a value with a unit ({@code 12.5mm}, {@code 480mil}) is read as written; a plain
 * number is in the line's {@code units} column when there is one, else in the default units
 * passed in (the board file's {@code units}); a plain number with neither is an error. Empty x and
 * y mean no coordinates. Errors name the file, line and column name. Thread-safe (stateless).
 */
public final class PinListCsvReader {
    /** The {@link Netlist#kind()} of this format. */
    public static final String KIND = "csv";

    /**
     * Reads the pin list.
     *
     * @param defaultUnit metres per unit for plain-number coordinates, NaN when none is given
     * @throws InputException for any problem with the file
     */
    public Netlist read(Path file, String label, double defaultUnit) {
        return parse(TextFile.lines(file, label, "CSV pin list"), label, defaultUnit);
    }

    Netlist parse(List<String> lines, String label, double defaultUnit) {
        Map<String, Integer> columns = null;
        Map<String, PinRecord> byPoint = new LinkedHashMap<>();
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i);
            if (Csv.skip(line)) {
                continue;
            }
            Location at = new Location(label, i + 1, 1);
            List<String> f = Csv.split(line, at);
            if (columns == null) {
                columns = header(f, at);
                if (!columns.isEmpty()) {
                    continue;
                }
                columns = Map.of("net", 0, "refdes", 1, "pin", 2, "x", 3, "y", 4);
            }
            String net = get(f, columns, "net");
            String refdes = get(f, columns, "refdes");
            String pin = get(f, columns, "pin");
            if (net.isEmpty() || refdes.isEmpty() || pin.isEmpty()) {
                throw new InputException(at, "", "line `" + line.strip() + "` lacks a "
                        + (net.isEmpty() ? "net" : refdes.isEmpty() ? "refdes" : "pin") + "; expected `net,refdes,pin[,x,y]`");
            }
            String xs = get(f, columns, "x");
            String ys = get(f, columns, "y");
            double unit = defaultUnit;
            String units = get(f, columns, "units");
            if (!units.isEmpty()) {
                unit = LengthUnits.metresPer(units, at, "units");
            }
            double x = Double.NaN;
            double y = Double.NaN;
            if (!xs.isEmpty() || !ys.isEmpty()) {
                if (xs.isEmpty() || ys.isEmpty()) {
                    throw new InputException(at, xs.isEmpty() ? "x" : "y", "only one coordinate given; expected both x and y, or neither");
                }
                x = LengthUnits.parse(xs, unit, true, at, "x");
                y = LengthUnits.parse(ys, unit, true, at, "y");
            }
            PinRecord p = new PinRecord(net, refdes, pin, x, y, at);
            PinRecord before = byPoint.putIfAbsent(p.point(), p);
            if (before != null && !before.net().equals(net)) {
                throw new InputException(at, "", "pin `" + p.point() + "` is on net `" + net + "` here but on `"
                        + before.net() + "` at line " + before.location().line() + "; expected each pin on one net");
            }
        }
        return new Netlist(label, KIND, List.copyOf(byPoint.values()), List.of());
    }

    /** Column indexes by name when {@code f} is a header line, else empty. */
    private static Map<String, Integer> header(List<String> f, Location at) {
        Map<String, Integer> cols = new LinkedHashMap<>();
        for (int i = 0; i < f.size(); i++) {
            cols.put(f.get(i).toLowerCase(Locale.ROOT), i);
        }
        if (!(cols.containsKey("net") && cols.containsKey("refdes") && cols.containsKey("pin"))) {
            if (cols.containsKey("net") || cols.containsKey("refdes")) {
                throw new InputException(at, "", "header `" + String.join(",", f) + "` lacks a column; expected at least `net,refdes,pin`");
            }
            return Map.of();
        }
        for (String name : cols.keySet()) {
            if (!List.of("net", "refdes", "pin", "x", "y", "units").contains(name)) {
                throw new InputException(at, "", "unknown column `" + name + "`; expected net, refdes, pin, x, y, units");
            }
        }
        return cols;
    }

    private static String get(List<String> f, Map<String, Integer> columns, String name) {
        Integer i = columns.get(name);
        return i == null || i >= f.size() ? "" : f.get(i);
    }
}
