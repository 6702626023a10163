package org.ringsweep.runner.netlist;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.ringsweep.api.net.Location;
import org.ringsweep.runner.input.InputException;

/**
 * Reads a length table exported from a layout: CSV {@code net,from,to,length}, one routed piece
 * per line (pin to pin, or to and from junction names the table makes up, e.g. a via or tee).
 * The header is optional; lengths carry their unit ({@code 45mm}, {@code 1.2in}, {@code 800mil});
 * a plain number is in the default unit given (the board file's {@code units}), else an error.
 * Blank and {@code #} lines are skipped. Thread-safe (stateless).
 */
public final class LengthTableReader {
    /**
     * Reads the table.
     *
     * @param defaultUnit metres per unit for plain numbers, NaN when none is given
     * @return the rows by net name, nets and rows in file order
     * @throws InputException naming the file and line for any problem
     */
    public Map<String, List<LengthRow>> read(Path file, String label, double defaultUnit) {
        return parse(TextFile.lines(file, label, "length table (CSV net,from,to,length)"), label, defaultUnit);
    }

    Map<String, List<LengthRow>> parse(List<String> lines, String label, double defaultUnit) {
        Map<String, List<LengthRow>> rows = new LinkedHashMap<>();
        boolean first = true;
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i);
            if (Csv.skip(line)) {
                continue;
            }
            Location at = new Location(label, i + 1, 1);
            List<String> f = Csv.split(line, at);
            if (first) {
                first = false;
                if (f.size() >= 4 && f.get(0).toLowerCase(Locale.ROOT).equals("net") && f.get(3).toLowerCase(Locale.ROOT).equals("length")) {
                    continue;
                }
            }
            if (f.size() != 4 || f.stream().anyMatch(String::isEmpty)) {
                throw new InputException(at, "", "line `" + line.strip() + "` has " + f.size()
                        + " field(s); expected `net,from,to,length` such as `SPI_SCK,U1.14,R12.1,4mm`");
            }
            if (f.get(1).equals(f.get(2))) {
                throw new InputException(at, "", "a piece from `" + f.get(1) + "` to itself; expected two different points");
            }
            double metres = LengthUnits.parse(f.get(3), defaultUnit, false, at, "length");
            rows.computeIfAbsent(f.get(0), k -> new ArrayList<>()).add(new LengthRow(f.get(0), f.get(1), f.get(2), metres, at));
        }
        rows.replaceAll((k, v) -> List.copyOf(v));
        return java.util.Collections.unmodifiableMap(rows);
    }
}
