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
import org.ringsweep.api.net.Location;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.Node;

/**
 * Reads an input file's bytes, decodes them as UTF-8 (a leading byte-order mark is dropped) and
 * composes the YAML node tree, turning every failure into an {@link InputException} for the user.
 * Shared by the net and sweep file loaders.
 */
public final class YamlSource {
    private YamlSource() {
    }

    /**
     * The file's bytes.
     *
     * @param label  the file as the user named it, for messages
     * @param kind   what the file should be, for messages ("net file")
     * @param format the format it should declare ("ringsweep/net-1")
     * @throws InputException if the file is missing, a directory or unreadable
     */
    public static byte[] readBytes(Path file, String label, String kind, String format) {
        Location at = new Location(label, 0, 0);
        try {
            return Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw new InputException(at, "", "no such file; expected a " + kind + " (YAML with `format: " + format + "`)", e);
        } catch (IOException e) {
            String why = Files.isDirectory(file) ? "is a directory" : "cannot be read (" + e.getClass().getSimpleName() + ")";
            throw new InputException(at, "", why + "; expected a readable " + kind, e);
        }
    }

    /**
     * The bytes as UTF-8 text without a byte-order mark.
     *
     * @throws InputException if the bytes are not UTF-8
     */
    public static String decode(byte[] bytes, String label, String kind) {
        try {
            String text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
            return text.startsWith("\uFEFF") ? text.substring(1) : text;
        } catch (CharacterCodingException e) {
            throw new InputException(new Location(label, 0, 0), "", "is not UTF-8 text; expected a YAML " + kind + " saved as UTF-8", e);
        }
    }

    /**
     * The composed node tree (no objects are constructed from it), or null for an empty document.
     *
     * @throws InputException for YAML syntax errors, located at the problem
     */
    public static Node compose(String text, String label) {
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
}
