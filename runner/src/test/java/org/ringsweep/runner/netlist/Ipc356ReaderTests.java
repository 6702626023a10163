package org.ringsweep.runner.netlist;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.ringsweep.runner.input.InputException;

/**
 * The IPC-D-356A reader on the demo board (examples/demo-board/netlist, written by
 * make-netlists.py with the column layout of shared/reference/impedance-and-standards.md §8).
 */
class Ipc356ReaderTests {
    private static final double MM = 1e-3;

    private static Netlist inch() {
        return new Ipc356Reader().read(DemoBoard.file("kestrel-fc2.ipc"), "kestrel-fc2.ipc");
    }

    private static Netlist metric() {
        return new Ipc356Reader().read(DemoBoard.file("kestrel-fc2-metric.ipc"), "kestrel-fc2-metric.ipc");
    }

    @Test
    void readsEveryNetOfTheDemoBoardWithItsPins() {
        Map<String, List<PinRecord>> nets = inch().byNet();
        // The generator script lists 15 nets; the via on SPI0_SCK is not a pin.
        assertEquals(15, nets.size());
        assertEquals(4, nets.get("SPI0_SCK").size());
        assertEquals(List.of("R5.2", "U7.6", "U9.2", "U11.2"), nets.get("SPI0_SCK").stream().map(PinRecord::point).toList());
        assertEquals(2, nets.get("SCK_MCU").size());
        assertEquals(6, nets.get("VCC").size());
        assertEquals(6, nets.get("GND").size());
    }

    @Test
    void resolvesLongNetNamesThroughAliasLines() {
        // §8: `P  NNAME00001 <name>` lines; records then carry NNAME00001 as the net name.
        Map<String, List<PinRecord>> nets = inch().byNet();
        assertTrue(nets.containsKey("SENSOR_INT_FROM_ACCELEROMETER_U11"));
        assertEquals(List.of("U11.5", "U1.25"), nets.get("SENSOR_INT_FROM_ACCELEROMETER_U11").stream().map(PinRecord::point).toList());
    }

    @Test
    void readsInchCoordinatesInTenThousandthsOfAnInch() {
        // §8: CUST 0 → 0.0001 in; 1 in = 25.4 mm exactly. U1.14 is X+010000 Y+011000 = (1.0, 1.1) in.
        PinRecord u1 = inch().pins().stream().filter(p -> p.point().equals("U1.14")).findFirst().orElseThrow();
        assertEquals(25.4 * MM, u1.x(), 1e-12);
        assertEquals(27.94 * MM, u1.y(), 1e-12);
        // U12.4 is X+046000 Y+024000 = (4.6, 2.4) in = (116.84, 60.96) mm.
        PinRecord u12 = inch().pins().stream().filter(p -> p.point().equals("U12.4")).findFirst().orElseThrow();
        assertEquals(116.84 * MM, u12.x(), 1e-12);
        assertEquals(60.96 * MM, u12.y(), 1e-12);
    }

    @Test
    void readsMetricCoordinatesInMicrometres() {
        // §8: CUST 1 → 0.001 mm. The metric file places U12.4 at X+116840 Y+060960.
        PinRecord u12 = metric().pins().stream().filter(p -> p.point().equals("U12.4")).findFirst().orElseThrow();
        assertEquals(116.840 * MM, u12.x(), 1e-12);
        assertEquals(60.960 * MM, u12.y(), 1e-12);
    }

    @Test
    void inchAndMetricFilesOfTheSameBoardAgreeWithinTheirResolution() {
        // Both files describe the same board; the inch grid is exact in 0.001 mm (0.0001 in = 2.54 um).
        Map<String, PinRecord> m = new java.util.HashMap<>();
        metric().pins().forEach(p -> m.put(p.point(), p));
        for (PinRecord p : inch().pins()) {
            assertEquals(p.x(), m.get(p.point()).x(), 1e-9, p.point());
            assertEquals(p.y(), m.get(p.point()).y(), 1e-9, p.point());
            assertEquals(p.net(), m.get(p.point()).net());
        }
    }

    @Test
    void notesWhatItDidNotRead() {
        List<String> notes = inch().notes();
        assertTrue(notes.stream().anyMatch(n -> n.contains("1 via record")), notes.toString());
        assertTrue(notes.stream().anyMatch(n -> n.contains("367 tooling-hole")), notes.toString());
    }

    private static final String GOOD = "327SCK_MCU          U1    -14         A01X+010000Y+011000X0600Y0600R000 S0";

    @ParameterizedTest(name = "line {1}: {2}")
    @CsvSource(delimiter = '|', value = {
        "327SCK_MCU          U1    -14         A01X+01000ZY+011000 | 3 | malformed X coordinate",
        "327SCK_MCU          U1    -14         A01X+010000Q+011000 | 3 | malformed Y coordinate",
        "327SCK_MCU                -14         A01X+010000Y+011000 | 3 | no reference designator",
        "327SCK_MCU          U1    -           A01X+010000Y+011000 | 3 | no pin",
        "327NNAME00077       U1    -14         A01X+010000Y+011000 | 3 | has no alias line",
        "HELLO WORLD                                               | 3 | unexpected line",
        "327OTHER            U1    -14         A01X+010000Y+011000 | 3 | is on net `OTHER` here but on `SCK_MCU` at line 2",
    })
    void malformedRecordsAreErrorsNamingFileAndLine(String bad, int line, String expected) {
        List<String> lines = List.of("P  UNITS CUST 0", GOOD, bad, "999");
        InputException e = assertThrows(InputException.class, () -> new Ipc356Reader().parse(lines, "bad.ipc"));
        assertEquals("bad.ipc", e.file());
        assertEquals(line, e.line());
        assertTrue(e.getMessage().startsWith("bad.ipc:" + line + ":"), e.getMessage());
        assertTrue(e.getMessage().contains(expected), e.getMessage());
    }

    @Test
    void unsupportedUnitsAreAnError() {
        InputException e = assertThrows(InputException.class,
                () -> new Ipc356Reader().parse(List.of("C  test", "P  UNITS CUST 2", GOOD), "u.ipc"));
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("expected `CUST 0` (0.0001 in) or `CUST 1` (0.001 mm)"), e.getMessage());
    }

    @Test
    void stopsReadingAtTheEndRecord() {
        Netlist n = new Ipc356Reader().parse(List.of("P  UNITS CUST 1", GOOD, "999", "garbage after the end"), "e.ipc");
        assertEquals(1, n.pins().size());
        // CUST 1: X+010000 = 10.000 mm.
        assertEquals(10 * MM, n.pins().get(0).x(), 1e-12);
    }
}
