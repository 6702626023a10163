package org.ringsweep.runner.netlist;

import java.nio.file.Path;
import java.util.List;
import org.ringsweep.api.net.Location;
import org.ringsweep.runner.input.InputException;

/**
 * Reads a board netlist of either kind, detected from its first meaningful line: IPC-D-356A when
 * it starts with {@code C } or {@code P } (comment or parameter, then a space) or with a
 * three-digit record code; a CSV pin list when it has a comma. Thread-safe (stateless).
 */
public final class NetlistReader {
    private final Ipc356Reader ipc = new Ipc356Reader();
    private final PinListCsvReader csv = new PinListCsvReader();

    /**
     * Reads and detects.
     *
     * @param file        the netlist
     * @param label       the file as the user named it
     * @param defaultUnit metres per unit for plain CSV coordinates, NaN when none is given
     * @throws InputException when the file is neither kind, or has a problem
     */
    public Netlist read(Path file, String label, double defaultUnit) {
        List<String> lines = TextFile.lines(file, label, "netlist (IPC-D-356A or CSV pin list)");
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i);
            if (line.isBlank()) {
                continue;
            }
            if (isIpc(line)) {
                return ipc.parse(lines, label);
            }
            if (line.startsWith("#")) {
                continue;
            }
            if (line.contains(",")) {
                return csv.parse(lines, label, defaultUnit);
            }
            throw new InputException(new Location(label, i + 1, 1), "", "cannot tell the netlist kind from `" + line.strip()
                    + "`; expected an IPC-D-356A file (lines starting `C `, `P ` or `317`/`327`) or a CSV pin list `net,refdes,pin[,x,y]`");
        }
        throw new InputException(new Location(label, 0, 0), "", "is empty; expected an IPC-D-356A netlist or a CSV pin list");
    }

    static boolean isIpc(String line) {
        return line.matches("^(C|P)(\\s.*)?$") || line.matches("^\\d{3}.*") && !line.contains(",");
    }
}
