package org.ringsweep.runner.input;

import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.Objects;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.net.Net;
import org.yaml.snakeyaml.nodes.Node;

/**
 * Loads a net file ({@code format: ringsweep/net-1}, see {@code formats.md} "Net file") into a
 * validated {@link Net}.
 *
 * <p>Every problem is an {@link InputException} naming the file as given, the line and column,
 * the key path ({@code segments[2].z0}, zero-based indexes) and what was expected: unreadable
 * files, text that is not UTF-8, YAML syntax (tabs, bad indentation), duplicate or unknown keys,
 * missing required keys, values of the wrong kind, sign or range, unknown models or model
 * parameters, undeclared rails, and topology errors (floating pieces, duplicate ids, two drivers
 * on one pin, a part terminal that connects to nothing else, a segment from a point to itself).
 *
 * <p>Values are kept as written (no model defaults applied): numbers as
 * {@link org.ringsweep.api.net.Value.Number} in SI units with their dimension, rail names and words
 * as {@link org.ringsweep.api.net.Value.Word}, booleans as {@link org.ringsweep.api.net.Value.Flag},
 * each with the location of its value. Segments without {@code id} are named TL1..TLn by their
 * position in the file. Corners are parsed with {@link PointParser}. Thread-safe.
 */
public final class NetFileLoader {
    private final ModelCatalog catalog;

    /** @param catalog the driver and receiver models a net may name */
    public NetFileLoader(ModelCatalog catalog) {
        this.catalog = Objects.requireNonNull(catalog, "catalog");
    }

    /**
     * Loads and validates one net file.
     *
     * @param file the file; its text as given becomes {@link Net#source()} and error file label
     * @return the net, whose {@link Net#sourceHash()} is the SHA-256 of the file's bytes (lower-case hex)
     * @throws InputException for any problem with the file, never another exception for bad input
     */
    public Net load(Path file) {
        String label = file.toString();
        byte[] bytes = YamlSource.readBytes(file, label, "net file", NetReader.FORMAT);
        String text = YamlSource.decode(bytes, label, "net file");
        Node root = YamlSource.compose(text, label);
        return new NetReader(label, sha256(bytes), catalog).read(root);
    }

    private static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
    }
}
