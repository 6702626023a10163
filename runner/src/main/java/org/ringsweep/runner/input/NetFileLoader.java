package org.ringsweep.runner.input;

import java.io.IOException;
import java.io.StringReader;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.Objects;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Net;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
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
        byte[] bytes = readBytes(file, label);
        String text = decode(bytes, label);
        Node root = compose(text, label);
        return new NetReader(label, sha256(bytes), catalog).read(root);
    }

    private static byte[] readBytes(Path file, String label) {
        Location at = new Location(label, 0, 0);
        try {
            return Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw new InputException(at, "", "no such file; expected a net file (YAML with `format: " + NetReader.FORMAT + "`)", e);
        } catch (IOException e) {
            String why = Files.isDirectory(file) ? "is a directory" : "cannot be read (" + e.getClass().getSimpleName() + ")";
            throw new InputException(at, "", why + "; expected a readable net file", e);
        }
    }

    private static String decode(byte[] bytes, String label) {
        try {
            String text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
            return text.startsWith("\uFEFF") ? text.substring(1) : text;
        } catch (CharacterCodingException e) {
            throw new InputException(new Location(label, 0, 0), "", "is not UTF-8 text; expected a YAML net file saved as UTF-8", e);
        }
    }

    private static Node compose(String text, String label) {
        LoaderOptions options = new LoaderOptions();
        options.setAllowRecursiveKeys(false);
        try {
            return new Yaml(options).compose(new StringReader(text));
        } catch (MarkedYAMLException e) {
            Mark mark = e.getProblemMark() != null ? e.getProblemMark() : e.getContextMark();
            Location at = mark == null ? new Location(label, 0, 0) : new Location(label, mark.getLine() + 1, mark.getColumn() + 1);
            throw new InputException(at, "", syntaxMessage(e), e);
        } catch (YAMLException e) {
            throw new InputException(new Location(label, 0, 0), "", "invalid YAML: " + e.getMessage(), e);
        }
    }

    private static String syntaxMessage(MarkedYAMLException e) {
        String problem = e.getProblem() == null ? "" : e.getProblem();
        if (problem.contains("\t") || problem.contains("TAB")) {
            return "invalid YAML: a tab character; expected spaces for indentation (YAML does not allow tabs there)";
        }
        String context = e.getContext() == null ? "" : e.getContext() + ", ";
        return "invalid YAML: " + context + problem + "; expected `key: value` lines indented with spaces"
                + " and list items starting with `- `";
    }

    private static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("every Java platform has SHA-256", e);
        }
    }
}
