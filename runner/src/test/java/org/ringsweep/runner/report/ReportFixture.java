package org.ringsweep.runner.report;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.ringsweep.runner.cli.Main;

/** Runs the real command line (with ngspice) to make the records and files the report tests read. */
final class ReportFixture {
    private ReportFixture() {
    }

    /** A test resource as a path. */
    static Path resource(String name) {
        try {
            return Path.of(ReportFixture.class.getResource("/" + name).toURI());
        } catch (java.net.URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    /** The physics nets of the test resources, sorted by file name. */
    static List<Path> physicsNets() throws java.io.IOException {
        try (Stream<Path> s = Files.list(resource("physics"))) {
            return s.filter(p -> p.toString().endsWith(".yaml")).sorted().toList();
        }
    }

    /** Runs {@code ringsweep args...}; returns the exit code and asserts it is one a finished run gives (0, 1 or 3). */
    static int run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        assertTrue(code == 0 || code == 1 || code == 3, "exit " + code + ":\n" + out + err);
        return code;
    }

    /** {@code ringsweep check <physics nets> --out out --quiet}. */
    static void checkPhysics(Path out) throws java.io.IOException {
        List<String> args = new ArrayList<>(List.of("check"));
        physicsNets().forEach(p -> args.add(p.toString()));
        args.addAll(List.of("--out", out.toString(), "--quiet"));
        run(args.toArray(String[]::new));
    }
}
