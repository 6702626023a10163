package org.ringsweep.runner.report;

/**
 * Escaping of user text for XML 1.0 and HTML5 (names of nets and pins, engine messages): the five
 * markup characters become entities, and characters XML 1.0 forbids (C0 controls other than tab,
 * line feed and carriage return, lone surrogates, U+FFFE and U+FFFF) are dropped, since no entity
 * can carry them.
 */
final class Xml {
    private Xml() {
    }

    /** Text for element content and attribute values (quotes escaped too, so it is safe in both). */
    static String escape(String s) {
        if (s == null) {
            return "";
        }
        StringBuilder b = new StringBuilder(s.length() + 16);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '<' -> b.append("&lt;");
                case '>' -> b.append("&gt;");
                case '&' -> b.append("&amp;");
                case '"' -> b.append("&quot;");
                case '\'' -> b.append("&#39;");
                default -> {
                    if (Character.isHighSurrogate(c) && i + 1 < s.length() && Character.isLowSurrogate(s.charAt(i + 1))) {
                        b.append(c).append(s.charAt(++i));
                    } else if (allowed(c)) {
                        b.append(c);
                    }
                }
            }
        }
        return b.toString();
    }

    /** Whether a single UTF-16 unit (not part of a surrogate pair) may appear in an XML 1.0 document. */
    private static boolean allowed(char c) {
        if (c == '\t' || c == '\n' || c == '\r') {
            return true;
        }
        if (c < 0x20 || Character.isSurrogate(c)) {
            return false;
        }
        return c != '\uFFFE' && c != '\uFFFF';
    }
}
