package org.ringsweep.runner.netlist;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.List;
import org.ringsweep.api.net.Location;
import org.ringsweep.runner.input.InputException;

/** Reads a text input file as lines, with user-facing errors. */
final class TextFile {
    private TextFile() {
    }

    /**
     * The file's lines (UTF-8, or ISO-8859-1 when it is not UTF-8: netlists are often plain
     * 8-bit ASCII exports), without a byte-order mark.
     *
     * @param kind what the file should be, for messages ("netlist")
     */
    static List<String> lines(Path file, String label, String kind) {
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw new InputException(new Location(label, 0, 0), "", "no such file; expected a " + kind, e);
        } catch (IOException e) {
            String why = Files.isDirectory(file) ? "is a directory" : "cannot be read (" + e.getClass().getSimpleName() + ")";
            throw new InputException(new Location(label, 0, 0), "", why + "; expected a readable " + kind, e);
        }
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(bytes)).toString();
        } catch (CharacterCodingException e) {
            text = new String(bytes, StandardCharsets.ISO_8859_1);
        }
        if (text.startsWith("\uFEFF")) {
            text = text.substring(1);
        }
        return text.lines().toList();
    }
}
