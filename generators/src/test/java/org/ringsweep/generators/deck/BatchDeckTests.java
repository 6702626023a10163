package org.ringsweep.generators.deck;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.generators.NgspiceCheck;
import org.ringsweep.generators.TestNets;
import org.ringsweep.generators.elaborate.Elaborator;

class BatchDeckTests {
    private static final DeckWriter WRITER = new DeckWriter();
    private static final String HASH_PREFIX = "* deck body sha-256: ";

    private static Circuit golden() {
        return new Elaborator().elaborate(DeckWriterTests.goldenNet(), "typ").circuit();
    }

    private static Circuit pointToPoint() {
        return new Elaborator().elaborate(TestNets.pointToPoint(15, 50, 1e-9).build(), "typ").circuit();
    }

    @Test
    void masterDeckMatchesTheHandWrittenFile() throws Exception {
        // Hand-written from ngspice.md §2 (source, run, write, destroy all) and the brief's marker line.
        String deck = WRITER.renderBatch(List.of(
                new BatchEntry("typ_0001_circuit.cir", "typ_0001.raw", List.of("u1_1", "u2_1")),
                new BatchEntry("fast_0002_circuit.cir", "fast_0002.raw", List.of("u2_1"))), true);
        GoldenFile.assertMatches("batch_1.cir", deck);
    }

    @Test
    void circuitOnlyDeckIsTheStandaloneDeckWithoutItsControlBlock() throws Exception {
        String standalone = WRITER.render(golden(), DeckOptions.of("golden.raw"));
        String circuit = WRITER.renderCircuitOnly(golden(), DeckOptions.of("golden.raw"));
        List<String> expected = new ArrayList<>();
        boolean inControl = false;
        for (String line : standalone.split("\n")) {
            if (line.equals(".control")) {
                inControl = true;
            }
            if (!inControl && !line.startsWith(HASH_PREFIX)) {
                expected.add(line);
            }
            if (line.equals(".endc")) {
                inControl = false;
            }
        }
        List<String> got = new ArrayList<>(Arrays.asList(circuit.split("\n")));
        String hashLine = got.stream().filter(l -> l.startsWith(HASH_PREFIX)).findFirst().orElseThrow();
        got.remove(hashLine);
        assertEquals(expected, got);
        // The header's hash is that of this deck's own body (the text after the hash line).
        String body = circuit.substring(circuit.indexOf(hashLine) + hashLine.length() + 1);
        assertEquals(HASH_PREFIX + HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256")
                .digest(body.getBytes(StandardCharsets.UTF_8))), hashLine);
        assertTrue(circuit.endsWith("\n.end\n"), circuit);
    }

    @Test
    void controlTemplateThatKeepsItsControlBlockCannotWriteACircuitOnlyDeck(@TempDir Path dir) throws Exception {
        Files.writeString(dir.resolve("control.ftl"), ".tran ${step} ${stop}\n.control\nrun\nquit 0\n.endc\n");
        DeckWriter w = DeckWriter.withTemplateDir(dir);
        DeckWriteException x = assertThrows(DeckWriteException.class, () -> w.renderCircuitOnly(golden(), DeckOptions.of("g.raw")));
        assertTrue(x.getMessage().contains("circuitOnly"), x.getMessage());
        assertTrue(w.render(golden(), DeckOptions.of("g.raw")).contains(".control\n"), "the standalone deck is unaffected");
    }

    @Test
    void batchEntriesTakeGeneratedNamesOnly() {
        for (String bad : List.of("../x.cir", "X.cir", "x y.cir", "x.cir\nshell ls", "x.raw", "x-1.cir")) {
            assertThrows(IllegalArgumentException.class, () -> new BatchEntry(bad, "x.raw", List.of("a")), bad);
        }
        for (String bad : List.of("x.cir", "x-1.raw", "A.raw")) {
            assertThrows(IllegalArgumentException.class, () -> new BatchEntry("x.cir", bad, List.of("a")), bad);
        }
        assertThrows(IllegalArgumentException.class, () -> new BatchEntry("x.cir", "x.raw", List.of()));
        assertThrows(IllegalArgumentException.class, () -> new BatchEntry("x.cir", "x.raw", List.of("a) v(b")));
        assertThrows(IllegalArgumentException.class, () -> WRITER.renderBatch(List.of(), true));
    }

    @Test
    void masterDeckRunsEachCircuitAsItsOwnDeckWould(@TempDir Path dir) throws Exception {
        // ngspice itself is the reference: the batch must write, per circuit, the data a standalone run writes.
        Circuit[] circuits = {golden(), pointToPoint()};
        List<BatchEntry> entries = new ArrayList<>();
        for (int k = 0; k < circuits.length; k++) {
            Path alone = Files.createDirectories(dir.resolve("alone" + k));
            NgspiceCheck.assertRuns(WRITER.render(circuits[k], DeckOptions.of("p" + k + ".raw")), "p" + k + ".raw", alone);
            Files.writeString(dir.resolve("p" + k + "_circuit.cir"), WRITER.renderCircuitOnly(circuits[k], DeckOptions.of("p" + k + ".raw")));
            entries.add(new BatchEntry("p" + k + "_circuit.cir", "p" + k + ".raw", new ArrayList<>(circuits[k].probes().keySet())));
        }
        String stdout = NgspiceCheck.assertRuns(WRITER.renderBatch(entries, true), "p1.raw", dir);
        for (int k = 0; k < circuits.length; k++) {
            assertTrue(stdout.matches("(?s).*\\nRSW_DONE " + k + " [0-9.E+-]+\\n.*"), stdout);
            assertArrayEquals(withoutDate(Files.readAllBytes(dir.resolve("alone" + k).resolve("p" + k + ".raw"))),
                    withoutDate(Files.readAllBytes(dir.resolve("p" + k + ".raw"))), "raw file of circuit " + k);
        }
    }

    /** A raw file with its {@code Date:} line (the only line that differs from run to run) blanked. */
    private static byte[] withoutDate(byte[] raw) {
        String latin = new String(raw, StandardCharsets.ISO_8859_1);
        return latin.replaceFirst("\nDate: [^\n]*\n", "\nDate:\n").getBytes(StandardCharsets.ISO_8859_1);
    }
}
