package org.ringsweep.generators.names;

import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HashMap;
import java.util.HashSet;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import org.ringsweep.api.circuit.SafeName;
import org.ringsweep.api.net.NetPoint;

/**
 * Maps user names to safe circuit names ({@link SafeName}: {@code [a-z][a-z0-9_]{0,30}}, never
 * {@code gnd}) for one circuit. This is the only place user names turn into node or element
 * names.
 *
 * <p>Rules: the GND rail maps to node {@code 0}; nothing else ever does. A name gets a readable
 * stem (lower-cased; every character outside {@code [a-z0-9]} becomes {@code _}, runs of
 * {@code _} collapse; an {@code n} is put in front when it would not start with a letter; cut to
 * 24 characters). The first name to claim a stem gets it as is; a later, different name with the
 * same stem gets the stem plus {@code _2}, {@code _3}, ... The comparison is case-folded because
 * ngspice is case-insensitive, so {@code U1.A}, {@code u1.a} and {@code u1_a} become
 * {@code u1_a}, {@code u1_a_2} and {@code u1_a_3} in the order they are first asked for. The
 * same user name always gives the same safe name ({@link #node(String)}); {@link #fresh(String)}
 * makes a new internal name that can never equal a user's. The mapping is deterministic given
 * the order of calls, and bijective within the instance.
 *
 * <p>Not thread-safe: one instance per circuit (one for nodes, one for element names).
 */
public final class NodeNamer {
    private static final int STEM_MAX = 24;
    private static final int COMMENT_MAX = 200;
    private static final int FILE_STEM_MAX = 60;
    private static final Pattern COMMENT_SAFE = Pattern.compile("[A-Za-z0-9 _.,:/+=#@%()\\[\\]-]");
    private static final Set<String> WINDOWS_RESERVED = Set.of("con", "prn", "aux", "nul",
            "com1", "com2", "com3", "com4", "com5", "com6", "com7", "com8", "com9",
            "lpt1", "lpt2", "lpt3", "lpt4", "lpt5", "lpt6", "lpt7", "lpt8", "lpt9");

    private final Map<String, String> byUserName = new HashMap<>();
    private final Set<String> taken = new HashSet<>();

    /** A namer with nothing taken but {@code gnd} (reserved: ngspice reads it as ground). */
    public NodeNamer() {
        taken.add("gnd");
    }

    /**
     * The safe node for a user point or rail name: {@code 0} for GND, else a stable safe name.
     *
     * @param userName the point as the user wrote it (exact; {@code gnd} and {@code 0} are
     *                 ordinary names and never become ground)
     */
    public String node(String userName) {
        if (NetPoint.GROUND.equals(userName)) {
            return SafeName.GROUND;
        }
        return name(userName);
    }

    /**
     * The safe name for a user name, without the ground rule (element ids, rails in element names).
     * The same text always gives the same name.
     */
    public String name(String userName) {
        java.util.Objects.requireNonNull(userName, "userName");
        String known = byUserName.get(userName);
        if (known != null) {
            return known;
        }
        String safe = claim(stem(userName));
        byUserName.put(userName, safe);
        return safe;
    }

    /** A new name from a readable hint, never equal to any other name of this instance. */
    public String fresh(String hint) {
        return claim(stem(hint));
    }

    private String claim(String stem) {
        if (taken.add(stem)) {
            return SafeName.require(stem, "generated name");
        }
        for (int i = 2; ; i++) {
            String candidate = stem + "_" + i;
            if (taken.add(candidate)) {
                return SafeName.require(candidate, "generated name");
            }
        }
    }

    /** The readable stem of any text: {@code [a-z][a-z0-9_]*}, at most 24 characters. */
    static String stem(String text) {
        StringBuilder b = new StringBuilder();
        for (char c : text.toLowerCase(Locale.ROOT).toCharArray()) {
            boolean ok = (c >= 'a' && c <= 'z') || (c >= '0' && c <= '9');
            if (ok) {
                b.append(c);
            } else if (b.length() > 0 && b.charAt(b.length() - 1) != '_') {
                b.append('_');
            }
        }
        while (b.length() > 0 && b.charAt(b.length() - 1) == '_') {
            b.setLength(b.length() - 1);
        }
        if (b.length() == 0 || b.charAt(0) < 'a' || b.charAt(0) > 'z') {
            b.insert(0, 'n');
        }
        if (b.length() > STEM_MAX) {
            b.setLength(STEM_MAX);
            while (b.charAt(b.length() - 1) == '_') {
                b.setLength(b.length() - 1);
            }
        }
        return b.toString();
    }

    /**
     * Renders arbitrary user text as one safe fragment for a deck comment line: characters from
     * {@code [A-Za-z0-9 _.,:/+=#@%()[]-]} pass, every other one (CR, LF, TAB, {@code ;},
     * {@code $}, backquote, braces, quotes, {@code *}, backslash, non-ASCII ...) becomes
     * {@code \\uXXXX}; the result is cut at 200 characters (never inside an escape) with
     * {@code ...} appended when cut.
     */
    public static String safeComment(String userText) {
        StringBuilder b = new StringBuilder();
        String text = userText == null ? "" : userText;
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            String piece = c < 128 && COMMENT_SAFE.matcher(String.valueOf(c)).matches()
                    ? String.valueOf(c) : String.format(Locale.ROOT, "\\u%04x", (int) c);
            if (b.length() + piece.length() > COMMENT_MAX) {
                b.append("...");
                break;
            }
            b.append(piece);
        }
        return b.toString();
    }

    /**
     * A file-name stem for user text, for files under the output folder: only
     * {@code [A-Za-z0-9_.-]}, never empty, no leading {@code .}, no {@code ..}, at most 60
     * characters. When the text had to change, or has capitals (case-insensitive file systems
     * would merge {@code A} and {@code a}), or is a reserved device name on Windows, {@code -}
     * and 8 hex digits of the text's SHA-256 are appended, so different texts give different
     * stems.
     */
    public static String safeFileStem(String userText) {
        String text = userText == null ? "" : userText;
        StringBuilder b = new StringBuilder();
        for (char c : text.toCharArray()) {
            boolean ok = (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9')
                    || c == '_' || c == '-' || c == '.';
            char out = ok ? c : '_';
            if (out == '.' && (b.length() == 0 || b.charAt(b.length() - 1) == '.')) {
                out = '_';
            }
            b.append(out);
        }
        String stem = b.toString();
        boolean changed = !stem.equals(text) || stem.isEmpty() || !stem.equals(stem.toLowerCase(Locale.ROOT))
                || WINDOWS_RESERVED.contains(stem.toLowerCase(Locale.ROOT).split("\\.", 2)[0]);
        if (!changed && stem.length() <= FILE_STEM_MAX) {
            return stem;
        }
        String suffix = "-" + sha256Hex(text).substring(0, 8);
        if (stem.length() > FILE_STEM_MAX - suffix.length()) {
            stem = stem.substring(0, FILE_STEM_MAX - suffix.length());
        }
        if (stem.isEmpty()) {
            stem = "net";
        }
        return stem + suffix;
    }

    /** The SHA-256 of UTF-8 text, lower-case hex. */
    public static String sha256Hex(String text) {
        try {
            byte[] d = MessageDigest.getInstance("SHA-256").digest(text.getBytes(StandardCharsets.UTF_8));
            StringBuilder hex = new StringBuilder();
            for (byte x : d) {
                hex.append(String.format(Locale.ROOT, "%02x", x));
            }
            return hex.toString();
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }
}
