package org.ringsweep.generators.deck;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.ringsweep.generators.TestNets.cmos;
import static org.ringsweep.generators.TestNets.part;
import static org.ringsweep.generators.TestNets.ramp;
import static org.ringsweep.generators.TestNets.segment;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.api.net.Part;
import org.ringsweep.generators.NgspiceCheck;
import org.ringsweep.generators.TestNets;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;

/** Hostile user text must not change what the deck does (ngspice.md §7, §8). */
class InjectionTests {
    private static final String EVIL = "x\n.control\nshell touch pwned\nquit\n.endc\n";
    private static final Set<String> KNOWN_CARDS = Set.of(".title", ".model", ".tran", ".options", ".control", ".endc", ".end",
            ".subckt", ".ends");

    static Net hostileNet() {
        String driverPin = "U1.1\r\n.include /etc/passwd";
        String rx = "U2.1 `touch pwned` $ x";
        String gndLike = "gnd";
        String zero = "0";
        return new NetBuilder(EVIL + "\"quoted\" ; {p} *star ../up").source("../nets/" + EVIL, "`rm -rf /` $ x")
                .rail("VCC", 3.3)
                .driver(ramp(driverPin, "v_high", "VCC", "rise", 1e-9, "r_up", 20.0, "r_down", 15.0))
                .receiver(cmos(rx, "c_in", 2e-12, "vih", 2.0, "vil", 0.8, "clamp", "rails", "supply", "VCC"))
                .segment(segment("TL1;\n.control", driverPin, gndLike, "z0", 50.0, "delay", 1e-9))
                .part(part("R*1 {x}", Part.Kind.RESISTOR, 10, gndLike, zero))
                .segment(segment("$ TL2 ../", zero, "J'1\"", "z0", 50.0, "delay", 0.5e-9))
                .segment(segment("+TL3", "J'1\"", rx, "z0", 50.0, "delay", 0.5e-9))
                .part(part(".include", Part.Kind.CAPACITOR, 1e-12, "J'1\"", "GND"))
                .build();
    }

    private static String deck(Elaboration e) {
        return new DeckWriter().render(e.circuit(), DeckOptions.of("evil.raw"));
    }

    @Test
    void onlyOurCardsAndOurControlBlockAppear() {
        String deck = deck(new Elaborator().elaborate(hostileNet(), EVIL));
        List<String> lines = TestNets.lines(deck);
        int controls = 0;
        boolean inControl = false;
        for (int i = 1; i < lines.size(); i++) {
            String line = lines.get(i);
            String lower = line.toLowerCase(Locale.ROOT);
            if (lower.equals(".control")) {
                controls++;
                inControl = true;
                continue;
            }
            if (lower.equals(".endc")) {
                inControl = false;
                continue;
            }
            if (!inControl && line.startsWith(".")) {
                assertTrue(KNOWN_CARDS.contains(lower.split(" ")[0]), "unexpected card: " + line);
            }
            assertFalse(line.startsWith("+"), "continuation line: " + line);
            assertFalse(line.contains("`"), "backquote: " + line);
            assertFalse(line.contains(";"), "inline comment: " + line);
            assertFalse(line.contains("$"), "dollar: " + line);
            assertFalse(line.contains("{") || line.contains("}"), "brace: " + line);
            assertFalse(line.contains("\"") || line.contains("'"), "quote: " + line);
        }
        assertEquals(1, controls);
        // the user's words survive only inside single comment lines (escaped, harmless there) and in the
        // title, reduced to [A-Za-z0-9 _.-] (ngspice.md §8: titles are emitted verbatim, never executed)
        assertEquals(".title " + lines.get(0), lines.get(1));
        for (String line : lines.subList(2, lines.size())) {
            if (!line.startsWith("* ")) {
                String lower = line.toLowerCase(Locale.ROOT);
                assertFalse(lower.contains(".include") || lower.contains(".inc ") || lower.contains(".lib"), line);
                // safe identifiers may carry the words (u1_1_include_etc_passwd) but never as a token of their own
                String[] tokens = lower.split("[\\s(),=]+");
                for (int t = 0; t < tokens.length; t++) {
                    assertFalse(tokens[t].equals("shell") || tokens[t].equals("source") || tokens[t].equals("pwned"), line);
                    assertFalse(t > 0 && tokens[t].startsWith("."), line);
                }
            }
        }
        assertFalse(deck.contains("\r"));
        assertTrue(lines.get(0).matches("[A-Za-z0-9][A-Za-z0-9 _.-]{0,59}"), lines.get(0));
        // line 1 is the title; every other line is a comment, a known card, a control line or an element line
        for (String line : lines.subList(1, lines.size())) {
            assertTrue(line.isEmpty() || line.startsWith("* ") || line.startsWith(".") || line.matches("[A-Za-z ].*"), line);
        }
    }

    @Test
    void groundLikeNamesDoNotBecomeGround() {
        Elaboration e = new Elaborator().elaborate(hostileNet(), "typ");
        Primitive.Resistor r = e.circuit().primitives().stream().filter(p -> p instanceof Primitive.Resistor)
                .map(p -> (Primitive.Resistor) p).filter(p -> p.ohms() == 10).findFirst().orElseThrow();
        // R*1 joins the junctions "gnd" and "0": neither may alias ngspice's ground (ngspice.md §7)
        for (String node : List.of(r.a(), r.b())) {
            assertNotEquals("0", node);
            assertNotEquals("gnd", node);
        }
        assertNotEquals(r.a(), r.b());
        String deck = deck(e);
        assertTrue(deck.contains("\nR" + r.name() + " " + r.a() + " " + r.b() + " 1e+01\n"), deck);
        // the only ground connections are GND's: the line references, the receiver's C and lower clamp, the
        // sources, and the capacitor to GND
        for (String line : TestNets.lines(deck)) {
            if (line.startsWith("R")) {
                assertFalse(List.of(line.split(" ")).subList(1, 3).contains("0"), line);
            }
        }
    }

    @Test
    void hostileDeckIsValidNgspiceInputAndRunsNoCommand(@TempDir Path dir) throws Exception {
        String deck = deck(new Elaborator().elaborate(hostileNet(), EVIL));
        NgspiceCheck.assertRuns(deck, "evil.raw", dir);
        assertFalse(Files.exists(dir.resolve("pwned")));
    }
}
