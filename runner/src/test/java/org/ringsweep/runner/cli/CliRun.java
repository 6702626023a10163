package org.ringsweep.runner.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/** Runs the command line in-process and captures what it printed. */
record CliRun(int exitCode, String out, String err) {
    private static final ObjectMapper JSON = new ObjectMapper();

    static CliRun of(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new CliRun(code, out.toString(), err.toString());
    }

    /** The JSON records printed with --json. */
    List<JsonNode> records() {
        List<JsonNode> list = new ArrayList<>();
        for (String line : out.split("\n")) {
            if (line.startsWith("{")) {
                try {
                    list.add(JSON.readTree(line));
                } catch (java.io.IOException e) {
                    throw new UncheckedIOException(e);
                }
            }
        }
        return list;
    }

    static Path resource(String name) {
        try {
            return Path.of(CliRun.class.getResource("/" + name).toURI());
        } catch (java.net.URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }
}
