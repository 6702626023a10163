package org.ringsweep.runner.importer;

/** Writing user text into generated YAML safely: always double-quoted, with escapes. */
final class YamlText {
    private YamlText() {
    }

    /** {@code text} as a YAML double-quoted scalar: {@code "} and {@code \} escaped, control characters as {@code \\uXXXX}. */
    static String quote(String text) {
        StringBuilder b = new StringBuilder("\"");
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            switch (c) {
                case '"' -> b.append("\\\"");
                case '\\' -> b.append("\\\\");
                case '\n' -> b.append("\\n");
                case '\t' -> b.append("\\t");
                case '\r' -> b.append("\\r");
                default -> {
                    if (c < 0x20 || c == 0x7f || c == 0x85 || c == 0x2028 || c == 0x2029 || c == 0xFEFF) {
                        b.append(String.format("\\u%04x", (int) c));
                    } else {
                        b.append(c);
                    }
                }
            }
        }
        return b.append('"').toString();
    }

    /** Text for a {@code #} comment line: control characters (newlines) become spaces. */
    static String comment(String text) {
        StringBuilder b = new StringBuilder();
        text.codePoints().forEach(c -> b.appendCodePoint(Character.isISOControl(c) || c == 0x2028 || c == 0x2029 ? ' ' : c));
        return b.toString();
    }

    /** A name made safe for a file name: letters, digits, {@code . _ -} kept, anything else {@code _}. */
    static String fileName(String name) {
        StringBuilder b = new StringBuilder();
        for (char c : name.toCharArray()) {
            b.append(c < 128 && (Character.isLetterOrDigit(c) || c == '_' || c == '-' || c == '.') ? c : '_');
        }
        String s = b.toString().replaceAll("^[.]+", "_");
        return s.isEmpty() ? "net" : s;
    }
}
