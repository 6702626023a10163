package org.ringsweep.runner.netlist;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.ringsweep.api.net.Location;
import org.ringsweep.runner.input.InputException;

/**
 * Reads an IPC-D-356A bare-board test netlist (fixed 80-column ASCII; column layout as in
 * {@code shared/reference/impedance-and-standards.md} §8).
 *
 * <p>Kept: {@code 317} (through-hole) and {@code 327} (SMT) test records with their net name,
 * reference designator, pin and X/Y coordinates. Read: {@code P  UNITS CUST 0} (inch, coordinates
 * in 0.0001 in) and {@code CUST 1} (millimetre, 0.001 mm) and {@code P  NNAMEnnnnn} alias lines for
 * long net names (a record naming {@code NNAMEnnnnn} gets the alias). Skipped and noted: vias
 * ({@code VIA}), pins on no net (blank net name or {@code N/C}), {@code 367} tooling holes and
 * other numeric record kinds. Ignored: {@code C} comments and everything after {@code 999}.
 * Without a units record, coordinates are taken as inches ({@code CUST 0}) and a note says so.
 *
 * <p>Errors (an {@link InputException} at the file and 1-based line, the column where known): a
 * line that is not a comment, parameter or numeric record; a record with no reference designator
 * or pin; a malformed X or Y field; an unsupported units record; a {@code NNAME} that no alias
 * line defines; one pin listed on two different nets. Thread-safe (stateless).
 */
public final class Ipc356Reader {
    /** The {@link Netlist#kind()} of this format. */
    public static final String KIND = "ipc-d-356a";
    private static final double INCH_UNIT = 0.0254e-4; // 0.0001 in, in metres
    private static final double MM_UNIT = 1e-6; // 0.001 mm, in metres

    /**
     * Reads the netlist.
     *
     * @param file  the file
     * @param label the file as the user named it (for messages)
     * @throws InputException for any problem with the file
     */
    public Netlist read(Path file, String label) {
        return parse(TextFile.lines(file, label, "IPC-D-356A netlist"), label);
    }

    /** Parses the lines of a netlist (for tests and for the detecting reader). */
    Netlist parse(List<String> lines, String label) {
        Map<String, String> aliases = new HashMap<>();
        List<String[]> raw = new ArrayList<>(); // record lines, resolved after all aliases are known
        List<Integer> rawLines = new ArrayList<>();
        double unit = Double.NaN;
        Map<String, Integer> skipped = new TreeMap<>();
        for (int i = 0; i < lines.size(); i++) {
            int lineNo = i + 1;
            String line = lines.get(i);
            if (line.isBlank()) {
                continue;
            }
            char first = line.charAt(0);
            if (first == 'C') {
                continue;
            }
            if (first == 'P') {
                String[] words = line.substring(1).strip().split("\\s+", 2);
                String keyword = words[0].toUpperCase(Locale.ROOT);
                String value = words.length > 1 ? words[1].strip() : "";
                if (keyword.equals("UNITS")) {
                    unit = units(value, label, lineNo);
                } else if (keyword.matches("NNAME\\d+")) {
                    if (value.isEmpty()) {
                        throw new InputException(new Location(label, lineNo, 1), "", "alias line `" + line.strip()
                                + "` gives no net name; expected `P  " + keyword + " <net name>`");
                    }
                    aliases.put(keyword, value);
                }
                continue;
            }
            String code = line.length() >= 3 ? line.substring(0, 3) : line;
            if (!code.matches("\\d{3}")) {
                throw new InputException(new Location(label, lineNo, 1), "", "unexpected line `" + abbreviate(line)
                        + "`; expected a comment (`C`), a parameter (`P`), a test record (`317`, `327`) or the end (`999`)");
            }
            if (code.equals("999")) {
                break;
            }
            if (!code.equals("317") && !code.equals("327")) {
                skipped.merge(code.equals("367") ? "367 tooling-hole records" : code + " records (not read)", 1, Integer::sum);
                continue;
            }
            raw.add(new String[] {String.format(Locale.ROOT, "%-80s", line)});
            rawLines.add(lineNo);
        }
        List<String> notes = new ArrayList<>();
        if (Double.isNaN(unit)) {
            unit = INCH_UNIT;
            notes.add("no `P  UNITS` record: coordinates read as CUST 0 (0.0001 in)");
        }
        Map<String, PinRecord> byPoint = new LinkedHashMap<>();
        int vias = 0;
        int unconnected = 0;
        for (int k = 0; k < raw.size(); k++) {
            String r = raw.get(k)[0];
            int lineNo = rawLines.get(k);
            String net = field(r, 4, 17);
            String refdes = field(r, 21, 26);
            String pin = field(r, 28, 31);
            if (refdes.equalsIgnoreCase("VIA")) {
                vias++;
                continue;
            }
            if (net.isEmpty() || net.equalsIgnoreCase("N/C")) {
                unconnected++;
                continue;
            }
            if (net.toUpperCase(Locale.ROOT).matches("NNAME\\d+")) {
                String alias = aliases.get(net.toUpperCase(Locale.ROOT));
                if (alias == null) {
                    throw new InputException(new Location(label, lineNo, 4), "", "net `" + net
                            + "` has no alias line; expected a `P  " + net + " <net name>` line in the file");
                }
                net = alias;
            }
            if (refdes.isEmpty()) {
                throw new InputException(new Location(label, lineNo, 21), "", "no reference designator in columns 21-26; expected e.g. `U1`");
            }
            if (pin.isEmpty()) {
                throw new InputException(new Location(label, lineNo, 28), "", "no pin in columns 28-31 for `" + refdes + "`; expected e.g. `14`");
            }
            double x = coordinate(r, 42, 'X', unit, label, lineNo);
            double y = coordinate(r, 50, 'Y', unit, label, lineNo);
            PinRecord p = new PinRecord(net, refdes, pin, x, y, new Location(label, lineNo, 1));
            PinRecord before = byPoint.putIfAbsent(p.point(), p);
            if (before != null && !before.net().equals(net)) {
                throw new InputException(p.location(), "", "pin `" + p.point() + "` is on net `" + net + "` here but on `"
                        + before.net() + "` at line " + before.location().line() + "; expected each pin on one net");
            }
        }
        if (vias > 0) {
            notes.add(vias + " via record(s) not read (vias are not modelled as pins)");
        }
        if (unconnected > 0) {
            notes.add(unconnected + " pin record(s) on no net (blank or N/C) not read");
        }
        skipped.forEach((what, n) -> notes.add(what + ": " + n + " skipped"));
        return new Netlist(label, KIND, List.copyOf(byPoint.values()), notes);
    }

    private static double units(String value, String label, int lineNo) {
        String v = value.toUpperCase(Locale.ROOT).replaceAll("\\s+", " ");
        if (v.equals("CUST 0") || v.equals("CUST0")) {
            return INCH_UNIT;
        }
        if (v.equals("CUST 1") || v.equals("CUST1")) {
            return MM_UNIT;
        }
        throw new InputException(new Location(label, lineNo, 1), "", "units `" + value
                + "` are not supported; expected `CUST 0` (0.0001 in) or `CUST 1` (0.001 mm)");
    }

    /** Columns {@code from..to} (1-based, inclusive), trimmed. */
    private static String field(String padded, int from, int to) {
        return padded.substring(from - 1, to).strip();
    }

    /** An {@code X+123456} field at column {@code col}, in metres; NaN when the field is blank. */
    private static double coordinate(String padded, int col, char axis, double unit, String label, int lineNo) {
        String f = padded.substring(col - 1, col + 7);
        if (f.isBlank()) {
            return Double.NaN;
        }
        String t = f.stripTrailing();
        if (!t.matches("[" + axis + Character.toLowerCase(axis) + "][+-]?\\d{1,6}")) {
            throw new InputException(new Location(label, lineNo, col), "", "malformed " + axis + " coordinate `" + f.strip()
                    + "` in columns " + col + "-" + (col + 7) + "; expected `" + axis + "` with a sign and 6 digits, e.g. `" + axis + "+028198`");
        }
        return Integer.parseInt(t.substring(1).replace("+", "")) * unit;
    }

    private static String abbreviate(String line) {
        String s = line.strip();
        return s.length() > 40 ? s.substring(0, 40) + "…" : s;
    }
}
