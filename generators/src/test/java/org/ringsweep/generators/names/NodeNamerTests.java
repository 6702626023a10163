package org.ringsweep.generators.names;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.ringsweep.api.circuit.SafeName;

class NodeNamerTests {
    private static final Pattern COMMENT = Pattern.compile("[A-Za-z0-9 _.,:/+=#@%()\\[\\]\\\\-]*");
    private static final Pattern FILE = Pattern.compile("[A-Za-z0-9_.-]{1,60}");

    @Test
    void groundRailIsNodeZeroAndNothingElseIs() {
        NodeNamer n = new NodeNamer();
        assertEquals("0", n.node("GND"));
        for (String s : List.of("gnd", "Gnd", "0", "00", "GND ", " GND")) {
            String safe = n.node(s);
            assertNotEquals("0", safe, s);
            assertNotEquals("gnd", safe, s);
            assertTrue(SafeName.isSafe(safe), safe);
        }
    }

    @Test
    void namesThatNgspiceWouldMergeStayDistinct() {
        NodeNamer n = new NodeNamer();
        String a = n.node("U1.A");
        String b = n.node("u1.a");
        String c = n.node("u1_a");
        assertEquals("u1_a", a);
        assertEquals(3, Set.of(a, b, c).size());
        // ngspice compares case-folded (ngspice.md §7): distinct after lower-casing too
        assertEquals(3, Set.of(a.toLowerCase(), b.toLowerCase(), c.toLowerCase()).size());
        assertEquals(a, n.node("U1.A"));
        assertEquals(b, n.node("u1.a"));
    }

    @Test
    void freshNamesNeverEqualUserNames() {
        NodeNamer n = new NodeNamer();
        String user = n.node("x_src");
        String fresh = n.fresh("x_src");
        assertNotEquals(user, fresh);
        assertNotEquals(fresh, n.node("X.SRC"));
    }

    @Test
    void everyNameIsSafeEvenForHostileOrLongText() {
        NodeNamer n = new NodeNamer();
        Set<String> seen = new HashSet<>();
        for (String s : List.of("", "\n.control\nshell touch x", "a b", "é", "`rm`", "{x}", "$ y", "*", "+", ";", "../..",
                "x".repeat(200), "x".repeat(201), "123", "_", "ÄÖÜ")) {
            String safe = n.node(s);
            assertTrue(SafeName.isSafe(safe) && !safe.equals("0"), safe);
            assertTrue(seen.add(safe), "unique: " + safe);
        }
    }

    @Test
    void safeCommentEscapesEverythingOutsideTheWhitelist() {
        String c = NodeNamer.safeComment("a\nb\r\tc;d$ e`f{g}h*i\\j\"k'lé");
        assertTrue(COMMENT.matcher(c).matches(), c);
        assertEquals("a\\u000ab\\u000d\\u0009c\\u003bd\\u0024 e\\u0060f\\u007bg\\u007dh\\u002ai\\u005cj\\u0022k\\u0027l\\u00e9", c);
        assertEquals("U1.14 nets/a.yaml", NodeNamer.safeComment("U1.14 nets/a.yaml"));
    }

    @Test
    void safeCommentIsCappedWithoutCuttingAnEscape() {
        String c = NodeNamer.safeComment("\n".repeat(100));
        assertTrue(c.length() <= 203, "length " + c.length());
        assertTrue(c.endsWith("\\u000a..."), c);
    }

    @Test
    void safeFileStemsStayInsideTheFolderAndDoNotCollide() {
        Set<String> seen = new HashSet<>();
        for (String s : List.of("SPI0_SCK", "spi0_sck", "../etc/passwd", "..", ".hidden", "a/b", "a\\b", "a_b", "", "CON",
                "x".repeat(100), "x".repeat(101), "net\nname", "a..b")) {
            String f = NodeNamer.safeFileStem(s);
            assertTrue(FILE.matcher(f).matches(), f);
            assertFalse(f.startsWith("."), f);
            assertFalse(f.contains(".."), f);
            assertTrue(seen.add(f.toLowerCase()), "distinct even case-folded: " + f);
        }
        assertEquals("spi0_sck", NodeNamer.safeFileStem("spi0_sck"));
    }
}
