package org.ringsweep.runner.sweep;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.ringsweep.api.net.Net;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.input.NetFileLoader;

/** Test nets (the formats.md example as SPI0_SCK, and RESET_N) copied beside a written sweep file. */
final class SweepFixture {
    private SweepFixture() {
    }

    static Path resource(String name) {
        try {
            return Path.of(SweepFixture.class.getResource("/sweep/" + name).toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    static Net net(String name) {
        return new NetFileLoader(new BuiltinModels()).load(resource("nets/" + name));
    }

    /** Writes {@code dir/sweep.yaml} from lines, with both test nets under {@code dir/nets/}. */
    static Path write(Path dir, String... lines) {
        try {
            Files.createDirectories(dir.resolve("nets"));
            for (String n : new String[] {"spi-sck.yaml", "reset.yaml"}) {
                Files.copy(resource("nets/" + n), dir.resolve("nets").resolve(n), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
            }
            Path file = dir.resolve("sweep.yaml");
            Files.writeString(file, String.join("\n", lines) + "\n", StandardCharsets.UTF_8);
            return file;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
