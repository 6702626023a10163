package org.ringsweep.runner.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.netlist.DemoBoard;
import org.ringsweep.runner.testing.Ngspice;

/** The whole demo board through the command line: import → screen → check, and bad netlists. */
class ImportScreenCheckTests {
    @TempDir
    Path tmp;

    @Test
    void importsScreensAndChecksTheDemoBoardEndToEnd() {
        Path nets = tmp.resolve("nets");
        CliRun imported = CliRun.of("import", DemoBoard.file("kestrel-fc2-metric.ipc").toString(),
                "--board", DemoBoard.file("board.yaml").toString(), "--out", nets.toString());
        assertEquals(0, imported.exitCode(), imported.err());
        assertTrue(imported.out().contains("made 7 net file(s)"), imported.out());
        assertTrue(imported.out().contains("TP4      TP4.1"), imported.out());
        assertTrue(imported.out().contains("joined from SCK_MCU + SPI0_SCK"), imported.out());

        CliRun screened = CliRun.of("screen", "--json", nets.toString());
        assertEquals(0, screened.exitCode(), screened.err());
        List<JsonNode> records = screened.records();
        assertEquals(7, records.size());
        for (int i = 0; i < records.size(); i++) {
            assertEquals("ringsweep/screen-1", records.get(i).get("format").asText());
            assertEquals(i + 1, records.get(i).get("rank").asInt());
        }
        // TRIG_OUT: 12 ohm driver, no termination, about 113 mm x 1.2 of 50 ohm line with a 1 ns edge:
        // TD/tr > 1/2, a transmission line by the J&G/MECL rule (lines-and-terminations.md §3).
        JsonNode trig = records.stream().filter(r -> r.get("net").asText().equals("TRIG_OUT")).findFirst().orElseThrow();
        assertEquals("transmission line", trig.get("class").asText());
        assertEquals("transmission line", records.get(0).get("class").asText());
        assertEquals("lumped", records.get(records.size() - 1).get("class").asText());

        CliRun table = CliRun.of("screen", nets.toString());
        assertEquals(0, table.exitCode());
        assertTrue(table.out().contains("Johnson & Graham"), table.out());

        Ngspice.require();
        CliRun checked = CliRun.of("check", nets.toString(), "--out", tmp.resolve("out").toString());
        // TRIG_OUT rings far past the rails (lines-and-terminations.md §2 Ex. 1: an unterminated
        // 15 ohm source peaks at 1.54 x VDD), so the batch fails with exit code 1.
        assertEquals(1, checked.exitCode(), checked.err());
        String out = checked.out();
        int summary = out.indexOf("Summary by net, worst first");
        assertTrue(summary > 0, out);
        String[] rows = out.substring(summary).split("\n");
        assertTrue(rows[2].startsWith("TRIG_OUT") && rows[2].contains("FAIL"), rows[2]);
        assertEquals(7 + 2, java.util.Arrays.stream(rows).takeWhile(l -> !l.isBlank()).count());
    }

    @Test
    void aMalformedNetlistLineIsAnInputErrorNamingFileAndLine() throws IOException {
        Path bad = tmp.resolve("bad.ipc");
        Files.writeString(bad, String.join("\n", "P  UNITS CUST 0",
                "327SCK_MCU          U1    -14         A01X+010000Y+011000X0600Y0600R000 S0",
                "327SCK_MCU          R5    -1          A01X+01O000Y+011000X0600Y0600R000 S0", "999", ""));
        CliRun r = CliRun.of("import", bad.toString(), "--board", DemoBoard.file("board.yaml").toString(),
                "--out", tmp.resolve("nets").toString());
        assertEquals(ExitCodes.INPUT, r.exitCode());
        assertTrue(r.err().contains(bad + ":3:42: malformed X coordinate `X+01O000`"), r.err());
        assertTrue(!r.err().contains("Exception"), r.err());
    }

    @Test
    void aBadValueInTheBoardFileIsAnInputErrorAndNoFileIsLeft() throws IOException {
        Path board = tmp.resolve("board.yaml");
        Files.writeString(board, Files.readString(DemoBoard.file("board.yaml")).replace("rise: 3ns", "rise: 3pF")
                .replace("lengths: lengths.csv", "lengths: " + DemoBoard.file("lengths.csv")));
        Path nets = tmp.resolve("nets");
        CliRun r = CliRun.of("import", DemoBoard.file("kestrel-fc2.ipc").toString(), "--board", board.toString(), "--out", nets.toString());
        assertEquals(ExitCodes.INPUT, r.exitCode());
        assertTrue(r.err().contains("SENSOR_INT_FROM_ACCELEROMETER_U11"), r.err());
        assertTrue(r.err().contains("`3pF`"), r.err());
        assertTrue(!Files.exists(nets.resolve("SENSOR_INT_FROM_ACCELEROMETER_U11.yaml")));
    }

    @Test
    void aCsvPinListImportsLikeTheIpcFileOfTheSameBoard() throws IOException {
        // kestrel-fc2-pins.csv places SPI0_SCK and SPI0_CS_FLASH where kestrel-fc2.ipc does (in mm and mil).
        Path fromCsv = tmp.resolve("csv");
        Path fromIpc = tmp.resolve("ipc");
        String board = DemoBoard.file("board.yaml").toString();
        CliRun csv = CliRun.of("import", DemoBoard.file("kestrel-fc2-pins.csv").toString(), "--board", board, "--out", fromCsv.toString());
        assertEquals(0, csv.exitCode(), csv.err());
        assertTrue(csv.out().contains("csv netlist, 8 pin(s) on 3 net(s)"), csv.out());
        assertEquals(0, CliRun.of("import", DemoBoard.file("kestrel-fc2.ipc").toString(), "--board", board, "--out", fromIpc.toString()).exitCode());
        for (String net : List.of("SPI0_SCK.yaml", "SPI0_CS_FLASH.yaml")) {
            String a = Files.readString(fromCsv.resolve(net));
            String b = Files.readString(fromIpc.resolve(net));
            assertEquals(b.substring(b.indexOf("format:")), a.substring(a.indexOf("format:")), net);
        }
    }

    @Test
    void theTopLevelHelpListsImportAndScreen() {
        CliRun r = CliRun.of("--help");
        assertTrue(r.out().contains("import") && r.out().contains("screen"), r.out());
    }
}
