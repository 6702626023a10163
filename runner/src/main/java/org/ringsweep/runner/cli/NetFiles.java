package org.ringsweep.runner.cli;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.ringsweep.api.net.Location;
import org.ringsweep.runner.input.InputException;

/** Net file arguments: a folder stands for its {@code *.yaml} files (sorted by name, not recursive). */
final class NetFiles {
    private NetFiles() {
    }

    static List<Path> expand(List<Path> args) {
        List<Path> files = new ArrayList<>();
        for (Path p : args) {
            if (!Files.isDirectory(p)) {
                files.add(p);
                continue;
            }
            try (Stream<Path> s = Files.list(p)) {
                List<Path> yaml = s.filter(f -> f.getFileName().toString().endsWith(".yaml") && Files.isRegularFile(f)).sorted().toList();
                if (yaml.isEmpty()) {
                    throw new InputException(new Location(p.toString(), 0, 0), "", "folder has no *.yaml net files");
                }
                files.addAll(yaml);
            } catch (IOException e) {
                throw new InputException(new Location(p.toString(), 0, 0), "", "folder cannot be listed (" + e.getClass().getSimpleName() + ")", e);
            }
        }
        return files;
    }
}
