package org.ringsweep.runner.netlist;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ringsweep.runner.input.InputException;

/** CSV pin lists and length tables; unit factors from formats.md "Quantities" (1 mil = 25.4 um, 1 in = 25.4 mm exactly). */
class PinListCsvReaderTests {
    @Test
    void readsTheDemoPinListWithItsUnitsColumnAndUnitsOnValues() {
        Netlist n = new NetlistReader().read(DemoBoard.file("kestrel-fc2-pins.csv"), "pins.csv", Double.NaN);
        assertEquals(PinListCsvReader.KIND, n.kind());
        assertEquals(3, n.byNet().size());
        assertEquals(4, n.byNet().get("SPI0_SCK").size());
        PinRecord u1 = n.pins().stream().filter(p -> p.point().equals("U1.14")).findFirst().orElseThrow();
        assertEquals(25.4e-3, u1.x(), 1e-12);
        // 1000 mil = 1 in = 25.4 mm, the same place as in the IPC-D-356A file (U1.16 at 1.0, 1.2 in).
        PinRecord cs = n.pins().stream().filter(p -> p.point().equals("U1.16")).findFirst().orElseThrow();
        assertEquals(25.4e-3, cs.x(), 1e-12);
        assertEquals(30.48e-3, cs.y(), 1e-12);
    }

    @Test
    void positionalColumnsWithoutAHeaderUseTheDefaultUnits() {
        Netlist n = new PinListCsvReader().parse(List.of("CLK,U1,3,10,20", "CLK,U2,1,40,20"), "p.csv", 1e-3);
        assertEquals(2, n.pins().size());
        assertEquals(40e-3, n.pins().get(1).x(), 1e-15);
    }

    @Test
    void aPlainCoordinateWithoutUnitsIsAnErrorNamingTheLine() {
        InputException e = assertThrows(InputException.class,
                () -> new PinListCsvReader().parse(List.of("net,refdes,pin,x,y", "CLK,U1,3,10mm,20mm", "CLK,U2,1,40,20"), "p.csv", Double.NaN));
        assertEquals(3, e.line());
        assertTrue(e.getMessage().contains("has no unit"), e.getMessage());
    }

    @Test
    void aQuotedNetNameKeepsItsCommas() {
        Netlist n = new PinListCsvReader().parse(List.of("\"A,B\",U1,1", "\"A,B\",U2,2"), "q.csv", Double.NaN);
        assertEquals(List.of("A,B"), List.copyOf(n.byNet().keySet()));
    }

    @Test
    void detectsIpcAndCsvFiles() {
        assertEquals(Ipc356Reader.KIND, new NetlistReader().read(DemoBoard.file("kestrel-fc2.ipc"), "k.ipc", Double.NaN).kind());
        assertTrue(NetlistReader.isIpc("P  UNITS CUST 0"));
        assertTrue(NetlistReader.isIpc("327CLK  U1"));
        assertTrue(!NetlistReader.isIpc("PCLK,U1,3"));
    }

    @Test
    void readsLengthTablesWithUnits() {
        var rows = new LengthTableReader().read(DemoBoard.file("lengths.csv"), "lengths.csv", Double.NaN);
        assertEquals(2, rows.size());
        assertEquals(55e-3, rows.get("SPI0_MOSI").get(0).metres(), 1e-15);
        var inch = new LengthTableReader().parse(List.of("N,U1.1,U2.1,1.5in", "N,U2.1,U3.1,500mil"), "l.csv", Double.NaN);
        assertEquals(38.1e-3, inch.get("N").get(0).metres(), 1e-15);
        assertEquals(12.7e-3, inch.get("N").get(1).metres(), 1e-15);
    }

    @Test
    void aBadLengthRowIsAnErrorNamingTheLine() {
        InputException e = assertThrows(InputException.class,
                () -> new LengthTableReader().parse(List.of("net,from,to,length", "N,U1.1,U2.1,-3mm"), "l.csv", Double.NaN));
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("expected a positive length"), e.getMessage());
    }
}
