package org.ringsweep.runner.netlist;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;

/** The invented Kestrel FC-2 demo board's netlist folder (examples/demo-board/netlist). */
public final class DemoBoard {
    private DemoBoard() {
    }

    /** The folder, found from the runner module's working directory. */
    public static Path folder() {
        Path dir = Path.of("").toAbsolutePath().getParent().resolve("examples/demo-board/netlist");
        assertTrue(Files.isDirectory(dir), "expected the demo board netlist folder at " + dir);
        return dir;
    }

    /** A file in the folder. */
    public static Path file(String name) {
        return folder().resolve(name);
    }
}
