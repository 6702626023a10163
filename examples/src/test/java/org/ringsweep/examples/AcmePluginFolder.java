package org.ringsweep.examples;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import java.util.stream.Stream;

/**
 * A plugin folder holding the example plugin's jar, as a user would give it to {@code --plugins}.
 * The reactor builds {@code acme-driver-plugin} first; after {@code package} its jar is copied,
 * and when only its classes exist ({@code mvn test}) a jar is made from them.
 */
final class AcmePluginFolder {
    private static final Path MODULE = Path.of("acme-driver-plugin", "target");

    private AcmePluginFolder() {
    }

    static Path create(Path parent) {
        try {
            Path dir = Files.createDirectories(parent.resolve("plugins"));
            Path built = MODULE.resolve("acme-driver-plugin.jar");
            Path jar = dir.resolve("acme-driver-plugin.jar");
            if (Files.isRegularFile(built)) {
                Files.copy(built, jar, StandardCopyOption.REPLACE_EXISTING);
                return dir;
            }
            Path classes = MODULE.resolve("classes");
            if (!Files.isDirectory(classes.resolve("META-INF/services"))) {
                throw new IllegalStateException("the example plugin is not built: expected " + built + " or " + classes
                        + "; build the reactor from the repository root");
            }
            try (OutputStream out = Files.newOutputStream(jar); JarOutputStream j = new JarOutputStream(out);
                 Stream<Path> files = Files.walk(classes)) {
                List<Path> all = files.filter(Files::isRegularFile).sorted().toList();
                for (Path f : all) {
                    j.putNextEntry(new JarEntry(classes.relativize(f).toString().replace('\\', '/')));
                    j.write(Files.readAllBytes(f));
                    j.closeEntry();
                }
            }
            return dir;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
