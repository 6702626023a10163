package org.ringsweep.runner.netlist;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * A board netlist: every pin record in file order, with the kind of file it came from and notes
 * about what the reader left out (vias, tooling holes, unconnected pins).
 *
 * @param file    the file as the user named it
 * @param kind    {@code ipc-d-356a} or {@code csv}
 * @param pins    the pin records in file order, one per {@code REFDES.PIN}
 * @param notes   what was read but not kept, for the import report
 */
public record Netlist(String file, String kind, List<PinRecord> pins, List<String> notes) {
    /** Copies the lists. */
    public Netlist {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(kind, "kind");
        pins = List.copyOf(pins);
        notes = List.copyOf(notes);
    }

    /** The pins grouped by net name, nets in order of first appearance. */
    public Map<String, List<PinRecord>> byNet() {
        Map<String, List<PinRecord>> nets = new LinkedHashMap<>();
        for (PinRecord p : pins) {
            nets.computeIfAbsent(p.net(), k -> new ArrayList<>()).add(p);
        }
        nets.replaceAll((k, v) -> List.copyOf(v));
        return java.util.Collections.unmodifiableMap(nets);
    }
}
