package org.ringsweep.runner.importer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Segment;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.input.InputException;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.netlist.DemoBoard;
import org.ringsweep.runner.netlist.LengthTableReader;
import org.ringsweep.runner.netlist.Netlist;
import org.ringsweep.runner.netlist.NetlistReader;
import org.ringsweep.runner.netlist.PinListCsvReader;

/** Importing the demo board (examples/demo-board/netlist) and small hand-made netlists. */
class BoardImporterTests {
    private static final BuiltinModels CATALOG = new BuiltinModels();

    @TempDir
    Path out;

    private ImportReport importDemo(String netlist) {
        BoardMapping board = new BoardMappingLoader(CATALOG).load(DemoBoard.file("board.yaml"));
        Netlist n = new NetlistReader().read(DemoBoard.file(netlist), netlist, board.unit());
        var lengths = new LengthTableReader().read(board.lengths(), "lengths.csv", board.unit());
        return new BoardImporter(CATALOG).run(n, board, lengths, out);
    }

    private Net load(String file) {
        return new NetFileLoader(CATALOG).load(out.resolve(file));
    }

    @Test
    void makesOneValidNetFilePerIncludedNet() {
        ImportReport r = importDemo("kestrel-fc2.ipc");
        assertEquals(List.of("SPI0_SCK", "SPI0_MOSI", "SPI0_CS_FLASH", "SYNC_OUT", "TRIG_OUT", "CLK_ADC_1V8",
                "SENSOR_INT_FROM_ACCELEROMETER_U11"), r.made().stream().map(ImportReport.Made::net).toList());
        assertEquals(List.of(), r.errors());
        for (ImportReport.Made m : r.made()) {
            assertEquals(m.net(), new NetFileLoader(CATALOG).load(m.file()).name());
        }
    }

    @Test
    void joinsNetsThroughASeriesPartNamedAfterThePieceWithoutTheDriver() {
        importDemo("kestrel-fc2.ipc");
        assertFalse(Files.exists(out.resolve("SCK_MCU.yaml")));
        Net sck = load("SPI0_SCK.yaml");
        assertEquals(1, sck.parts().size());
        Part r5 = sck.parts().get(0);
        assertEquals("R5", r5.ref());
        assertEquals(Part.Kind.RESISTOR, r5.kind());
        assertEquals(33, r5.value(), 0); // board.yaml: { refs: "R5", kind: resistor, value: 33 }
        assertEquals(List.of("R5.1", "R5.2"), List.of(r5.a(), r5.b()));
        assertEquals("U1.14", sck.drivers().get(0).pin());
        assertEquals(List.of("U7.6", "U9.2", "U11.2"), sck.receivers().stream().map(r -> r.pin()).toList());
    }

    @Test
    void estimatesLengthsAsTheManhattanTreeTimesTheDetourFactor() throws IOException {
        importDemo("kestrel-fc2.ipc");
        Net sck = load("SPI0_SCK.yaml");
        // Hand-computed tree (RectilinearTreeTests): U1.14-R5.1 0.20 in, then R5.2 → U11.2 1.44 in,
        // U11.2 → U9.2 0.90 in, U9.2 → U7.6 0.80 in; times detour 1.2, 1 in = 25.4 mm.
        Map<String, Double> inches = Map.of("R5.1", 0.20, "U11.2", 1.44, "U9.2", 0.90, "U7.6", 0.80);
        assertEquals(4, sck.segments().size());
        for (Segment s : sck.segments()) {
            assertEquals(inches.get(s.to()) * 25.4e-3 * 1.2, s.parameters().number("length"), 1e-6, s.id());
        }
        String text = Files.readString(out.resolve("SPI0_SCK.yaml"));
        assertTrue(text.contains("Segment lengths are ESTIMATES"), text);
    }

    @Test
    void usesTheLengthTableWhereItHasRowsForTheNet() throws IOException {
        importDemo("kestrel-fc2.ipc");
        Net mosi = load("SPI0_MOSI.yaml");
        // lengths.csv: U1.15-R6.1 3mm, R6.2-U7.5 55mm, U7.5-U9.3 30mm.
        assertEquals(List.of(3e-3, 55e-3, 30e-3), mosi.segments().stream().map(s -> s.parameters().number("length")).toList());
        assertTrue(Files.readString(out.resolve("SPI0_MOSI.yaml")).contains("from the length table"));
    }

    @Test
    void inchAndMetricNetlistsGiveTheSameNets() {
        ImportReport inch = importDemo("kestrel-fc2.ipc");
        Net a = load("SPI0_SCK.yaml");
        ImportReport metric = importDemo("kestrel-fc2-metric.ipc");
        Net b = load("SPI0_SCK.yaml");
        assertEquals(inch.made().size(), metric.made().size());
        for (int i = 0; i < a.segments().size(); i++) {
            assertEquals(a.segments().get(i).parameters().number("length"), b.segments().get(i).parameters().number("length"), 1e-6);
        }
    }

    @Test
    void listsUnknownPinsInsteadOfGuessingAndSaysWhyNetsWereSkipped() {
        ImportReport r = importDemo("kestrel-fc2.ipc");
        assertEquals(Map.of("TP4", List.of("TP4.1")), r.unknown());
        Map<String, String> skipped = new java.util.HashMap<>();
        r.skipped().forEach(s -> skipped.put(s.net(), s.reason()));
        assertTrue(skipped.get("SPI0_HOLD").contains("unknown pins TP4.1"), skipped.toString());
        assertEquals("excluded by `GND`", skipped.get("GND"));
        assertEquals("excluded by `VDD*`", skipped.get("VDD18"));
        assertEquals("not matched by `include`", skipped.get("LED_STATUS"));
    }

    @Test
    void aClassTerminationAddsASeriesResistorAtTheDriver() {
        importDemo("kestrel-fc2.ipc");
        Net sync = load("SYNC_OUT.yaml");
        // board.yaml: class SYNC* has termination { series: 39 }.
        assertEquals(1, sync.parts().size());
        assertEquals(List.of("U1.20", "RT1.2"), List.of(sync.parts().get(0).a(), sync.parts().get(0).b()));
        assertEquals(39, sync.parts().get(0).value(), 0);
        assertEquals("RT1.2", sync.segments().get(0).from());
    }

    @Test
    void userTextIsQuotedSafelyAndFileNamesAreSanitised() throws IOException {
        Path board = out.resolve("b.yaml");
        Files.writeString(board, String.join("\n", "format: ringsweep/board-1", "rails: { VCC: 3.3 }",
                "drivers: [ { pins: \"U1.*\", model: ramp, v_high: VCC, rise: 1ns, r_out: 20 } ]",
                "receivers: [ { pins: \"U*.*\", model: cmos, c_in: 4pF, vih: 2.0, vil: 0.8 } ]",
                "classes: [ { nets: \"*\", z0: 50, er_eff: 3.4 } ]", "units: mm", ""));
        String name = "CLK: \"A\" #1/\\x";
        Path csv = out.resolve("p.csv");
        Files.writeString(csv, "\"CLK: \"\"A\"\" #1/\\x\",U1,3,0,0\n\"CLK: \"\"A\"\" #1/\\x\",U2,1,10,5\n");
        Netlist n = new PinListCsvReader().read(csv, "p.csv", 1e-3);
        Path dir = out.resolve("nets");
        ImportReport r = new BoardImporter(CATALOG).run(n, new BoardMappingLoader(CATALOG).load(board), Map.of(), dir);
        assertEquals(1, r.made().size(), r.toString());
        assertEquals("CLK___A___1__x.yaml", r.made().get(0).file().getFileName().toString());
        Net net = new NetFileLoader(CATALOG).load(r.made().get(0).file());
        assertEquals(name, net.name());
        // 10 mm + 5 mm Manhattan, times the default detour 1.2 (BoardMapping.DEFAULT_DETOUR).
        assertEquals(18e-3, net.segments().get(0).parameters().number("length"), 1e-9);
    }

    @Test
    void boardFileErrorsNameFileLineAndKey() throws IOException {
        Path board = out.resolve("bad.yaml");
        Files.writeString(board, String.join("\n", "format: ringsweep/board-1",
                "drivers:", "  - { pins: \"U1.*\", model: flux, rise: 1ns }", ""));
        InputException e = assertThrows(InputException.class, () -> new BoardMappingLoader(CATALOG).load(board));
        assertEquals(3, e.line());
        assertEquals("drivers[0].model", e.key());
        assertTrue(e.getMessage().contains("unknown driver model `flux`; expected one of: ramp"), e.getMessage());
    }
}
