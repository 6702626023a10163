package org.ringsweep.runner.netlist;

import java.util.ArrayList;
import java.util.List;
import org.ringsweep.api.net.Location;
import org.ringsweep.runner.input.InputException;

/** Splits one CSV line (RFC 4180 quoting with {@code "}; fields trimmed). */
final class Csv {
    private Csv() {
    }

    static List<String> split(String line, Location at) {
        List<String> fields = new ArrayList<>();
        StringBuilder f = new StringBuilder();
        boolean quoted = false;
        for (int i = 0; i < line.length(); i++) {
            char c = line.charAt(i);
            if (quoted) {
                if (c == '"' && i + 1 < line.length() && line.charAt(i + 1) == '"') {
                    f.append('"');
                    i++;
                } else if (c == '"') {
                    quoted = false;
                } else {
                    f.append(c);
                }
            } else if (c == '"') {
                quoted = true;
            } else if (c == ',') {
                fields.add(f.toString().strip());
                f.setLength(0);
            } else {
                f.append(c);
            }
        }
        if (quoted) {
            throw new InputException(at, "", "a quoted field is not closed; expected a closing `\"`");
        }
        fields.add(f.toString().strip());
        return fields;
    }

    /** Whether a line is blank or a {@code #} comment. */
    static boolean skip(String line) {
        String s = line.strip();
        return s.isEmpty() || s.startsWith("#");
    }
}
