package org.ringsweep.generators.deck;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.ringsweep.generators.TestNets.cmos;
import static org.ringsweep.generators.TestNets.part;
import static org.ringsweep.generators.TestNets.ramp;
import static org.ringsweep.generators.TestNets.segment;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.Transient;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.generators.NgspiceCheck;
import org.ringsweep.generators.TestNets;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;

class DeckWriterTests {
    private static final DeckWriter WRITER = new DeckWriter();
    private static final String HASH_PREFIX = "* deck body sha-256: ";

    /** The golden net: round numbers so the expected deck can be written by hand from the rules. */
    static Net goldenNet() {
        return new NetBuilder("GOLDEN_1").source("nets/golden.yaml", "abc123").rail("VCC", 3.3)
                .driver(ramp("U1.1", "v_high", "VCC", "rise", 1e-9, "edge_ref", "0-100", "r_up", 20.0, "r_down", 10.0))
                .receiver(cmos("U2.1", "c_in", 2e-12, "vih", 2.0, "vil", 0.8, "clamp", "rails", "supply", "VCC"))
                .segment(segment("TL1", "U1.1", "R1.1", "z0", 50.0, "delay", 1e-9))
                .segment(segment("TL2", "R1.2", "U2.1", "z0", 50.0, "delay", 0.5e-9, "length", 0.1, "r_per_m", 5.0))
                .part(part("R1", Part.Kind.RESISTOR, 0, "R1.1", "R1.2"))
                .stimulus(new Stimulus(List.of(Stimulus.Edge.RISE, Stimulus.Edge.FALL), 20e-9, Double.NaN, 0))
                .build();
    }

    private static String sha256(String text) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(text.getBytes(StandardCharsets.UTF_8)));
    }

    @Test
    void goldenDeckMatchesTheHandWrittenFile() throws Exception {
        String deck = WRITER.render(new Elaborator().elaborate(goldenNet(), "typ").circuit(), DeckOptions.of("golden.raw"));
        int at = deck.indexOf(HASH_PREFIX);
        int eol = deck.indexOf('\n', at);
        String hash = deck.substring(at + HASH_PREFIX.length(), eol);
        // the recorded hash is the SHA-256 (JDK MessageDigest) of everything after its line
        assertEquals(sha256(deck.substring(eol + 1)), hash);
        GoldenFile.assertMatches("golden_1.cir", deck.substring(0, at + HASH_PREFIX.length()) + "(checked separately)" + deck.substring(eol));
    }

    @Test
    void goldenDeckIsValidNgspiceInput(@TempDir Path dir) throws Exception {
        String deck = WRITER.render(new Elaborator().elaborate(goldenNet(), "typ").circuit(), DeckOptions.of("golden.raw"));
        NgspiceCheck.assertRuns(deck, "golden.raw", dir);
    }

    @Test
    void formatsExampleDeckRunsInBinaryAsciiAndConservativeForms(@TempDir Path dir) throws Exception {
        Circuit c = new Elaborator().elaborate(TestNets.formatsExample().build(), "typ").circuit();
        NgspiceCheck.assertRuns(WRITER.render(c, DeckOptions.of("a.raw")), "a.raw", dir);
        String ascii = WRITER.render(c, new DeckOptions("b.raw", false, true));
        assertTrue(ascii.contains("\nset filetype=ascii\n"));
        assertTrue(ascii.contains("\n.options method=gear reltol=1e-4\n"));
        // conservative: a quarter of the maximum step
        String maxStep = SpiceNumbers.format(c.analysis().maxStep() / 4);
        assertTrue(ascii.contains(" 0 " + maxStep + "\n"), ascii);
        NgspiceCheck.assertRuns(ascii, "b.raw", dir);
        assertTrue(Files.readString(dir.resolve("b.raw"), StandardCharsets.ISO_8859_1).contains("Values:"));
    }

    @Test
    void periodicDeckRuns(@TempDir Path dir) throws Exception {
        Net net = TestNets.pointToPoint(20, 50, 1e-9).stimulus(new Stimulus(List.of(Stimulus.Edge.RISE), Double.NaN, 20e-9, 3)).build();
        NgspiceCheck.assertRuns(WRITER.render(new Elaborator().elaborate(net, "typ").circuit(), DeckOptions.of("p.raw")), "p.raw", dir);
    }

    @Test
    void timedResistorBehavesAsTheGivenResistanceInNgspice(@TempDir Path dir) throws Exception {
        // 1 V across the B-source resistor into a 1 kΩ load: ngspice's own result checks the rendering.
        // R goes 100 Ω → 300 Ω between 1 ns and 2 ns; at 3 ns v(b) = 1000/1300 (voltage divider).
        Circuit c = new Circuit("timed", List.of(
                new Primitive.DcVoltage("s", "a", "0", 1),
                new Primitive.TimedResistor("t", "a", "b", new double[] {1e-9, 2e-9}, new double[] {100, 300}),
                new Primitive.Resistor("load", "b", "0", 1000)),
                new Transient(1e-11, 4e-9, 1e-11), Map.of("b", "b"), Map.of());
        String deck = WRITER.render(c, new DeckOptions("t.raw", false, false)).replace("quit 0",
                "meas tran early find v(b) at=0.5e-9\nmeas tran late find v(b) at=3e-9\nquit 0");
        String out = NgspiceCheck.assertRuns(deck, "t.raw", dir);
        assertEquals(1000.0 / 1100.0, measured(out, "early"), 1e-6);
        assertEquals(1000.0 / 1300.0, measured(out, "late"), 1e-6);
    }

    private static double measured(String stdout, String name) {
        for (String line : stdout.split("\n")) {
            String t = line.trim();
            if (t.startsWith(name + " ")) {
                return Double.parseDouble(t.split("=")[1].trim().split("\\s+")[0]);
            }
        }
        throw new AssertionError("no measurement " + name + " in:\n" + stdout);
    }

    @Test
    void lineWithSeriesAndShuntLossUsesTheFullRlgcModelAndRuns(@TempDir Path dir) throws Exception {
        // ngspice.md §4: LTRA rejects R and G both non-zero, TXL takes them
        Net net = new NetBuilder("rlgc").driver(ramp("U1.1", "v_high", 3.3, "rise", 1e-9, "r_out", 20.0))
                .receiver(cmos("U2.1", "c_in", 1e-12, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", 50.0, "delay", 0.5e-9, "length", 0.1, "r_per_m", 5.0, "g_per_m", 1e-3))
                .build();
        String deck = WRITER.render(new Elaborator().elaborate(net, "typ").circuit(), DeckOptions.of("y.raw"));
        assertTrue(deck.contains("\nYtl1 u1_1 0 u2_1 0 mtl1\n"), deck);
        assertTrue(deck.contains("\n.model mtl1 TXL R=5e+00 L=2.5e-07 G=1e-03 C=1e-10 length=1e-01\n"), deck);
        NgspiceCheck.assertRuns(deck, "y.raw", dir);
    }

    @Test
    void oneWriterRendersTheSameDeckFromManyThreads() throws Exception {
        Circuit c = new Elaborator().elaborate(TestNets.formatsExample().build(), "typ").circuit();
        String expected = WRITER.render(c, DeckOptions.of("x.raw"));
        java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newFixedThreadPool(4);
        try {
            List<java.util.concurrent.Future<String>> decks = new java.util.ArrayList<>();
            for (int i = 0; i < 16; i++) {
                decks.add(pool.submit(() -> WRITER.render(c, DeckOptions.of("x.raw"))));
            }
            for (java.util.concurrent.Future<String> d : decks) {
                assertEquals(expected, d.get());
            }
        } finally {
            pool.shutdown();
        }
    }

    @Test
    void renderingTwiceGivesIdenticalDecks() {
        Net net = TestNets.formatsExample().build();
        String a = WRITER.render(new Elaborator().elaborate(net, "typ").circuit(), DeckOptions.of("x.raw"));
        String b = new DeckWriter().render(new Elaborator().elaborate(net, "typ").circuit(), DeckOptions.of("x.raw"));
        assertEquals(a, b);
    }

    @Test
    void numbersAreExponentFormWithoutSpiceSuffixes() {
        assertEquals("0", SpiceNumbers.format(0));
        assertEquals("1.25e-09", SpiceNumbers.format(1.25e-9));
        assertEquals("2.2e+01", SpiceNumbers.format(22));
        assertEquals("-1.5e+06", SpiceNumbers.format(-1.5e6));
        // 1/3 keeps 15 significant digits
        assertEquals("3.33333333333333e-01", SpiceNumbers.format(1.0 / 3));
    }

    @Test
    void rawFileNameMustBeSafe() {
        for (String bad : List.of("../x.raw", "A.raw", "x.raw\nshell ls", "x raw", "x.txt", ".raw")) {
            assertThrows(IllegalArgumentException.class, () -> new DeckOptions(bad, true, false), bad);
        }
    }

    @Test
    void userTemplateFolderOverridesByFileName(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("header.ftl"), "${title}\n* ACME deck\n");
        String deck = DeckWriter.withTemplateDir(dir).render(new Elaborator().elaborate(goldenNet(), "typ").circuit(),
                DeckOptions.of("golden.raw"));
        assertTrue(deck.startsWith("GOLDEN_1\n* ACME deck\nVrail_vcc "), deck);
        assertTrue(deck.endsWith(".endc\n.end\n"));
        assertThrows(IllegalArgumentException.class, () -> DeckWriter.withTemplateDir(dir.resolve("missing")));
    }

    @Test
    void brokenUserTemplateIsADeckWriteException(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("header.ftl"), "${no_such_value}\n");
        DeckWriter w = DeckWriter.withTemplateDir(dir);
        Circuit c = new Elaborator().elaborate(goldenNet(), "typ").circuit();
        DeckWriteException x = assertThrows(DeckWriteException.class, () -> w.render(c, DeckOptions.of("g.raw")));
        assertTrue(x.getMessage().contains("header.ftl"), x.getMessage());
    }

    private static Circuit withSubcircuit(String text) {
        return new Circuit("sub", List.of(
                new Primitive.DcVoltage("s", "a", "0", 1),
                new Primitive.SubcircuitText("x1", List.of("a", "b"), text),
                new Primitive.Resistor("load", "b", "0", 1000)),
                new Transient(1e-10, 1e-8, 1e-10), Map.of("b", "b"), Map.of());
    }

    @Test
    void subcircuitTextBecomesAScopedSubcircuitThatRuns(@TempDir Path dir) throws Exception {
        String deck = WRITER.render(withSubcircuit("R1 a mid 500\nR2 mid b 500\n"), DeckOptions.of("s.raw"));
        assertTrue(deck.contains("\n.subckt sx1 a b\nR1 a mid 500\nR2 mid b 500\n.ends sx1\nXx1 a b sx1\n"), deck);
        NgspiceCheck.assertRuns(deck, "s.raw", dir);
    }

    @Test
    void subcircuitTextWithCardsCommentsContinuationsOrCommandsIsRejected() {
        for (String bad : List.of(".include /etc/passwd", "* hidden", "+ 1k", "R1 a b 1k\n.control", "R1 a b 1k\r\nshell ls",
                "R1 a b `touch x`", "shell touch x", "R1 a b 1k .endc", "R1 a\tb 1k", "Rx a b 1k\nsource evil.cir", "")) {
            assertThrows(DeckWriteException.class, () -> WRITER.render(withSubcircuit(bad), DeckOptions.of("s.raw")),
                    bad.replace("\n", "\\n"));
        }
    }

    @Test
    void deckHasTheTitleOnLineOneAndEndsWithEnd() {
        String deck = WRITER.render(new Elaborator().elaborate(goldenNet(), "typ").circuit(), DeckOptions.of("golden.raw"));
        List<String> lines = TestNets.lines(deck);
        assertEquals("GOLDEN_1", lines.get(0));
        assertEquals(".title GOLDEN_1", lines.get(1));
        assertEquals(".end", lines.get(lines.size() - 2));
        assertEquals("", lines.get(lines.size() - 1));
        assertFalse(deck.contains("\r"));
    }
}
