package org.ringsweep.runner.raw;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.testing.Ngspice;

/** Raw files written by ngspice itself, the reference simulator (ngspice.md §9–§10). */
class RawFileReaderNgspiceTests {
    /** The deck of ngspice.md §10.6, written once as binary and once as ASCII. */
    private static final String HEX_DECK = String.join("\n",
            "hex",
            "V1 a 0 DC 1.5",
            ".options interp",
            ".tran 1n 2n",
            ".control",
            "run",
            "set filetype=binary",
            "write b.raw v(a)",
            "set filetype=ascii",
            "write a.raw v(a)",
            "quit",
            ".endc",
            ".end", "");

    private static final double R = 1e3;
    private static final double C = 1e-9;
    private static final double TSTOP = 5e-6;

    private static String rcDeck(String analyses, String control) {
        return String.join("\n",
                "rc step",
                "V1 in 0 PULSE(0 1 0 1p 1p 1 2) AC 1",
                "R1 in out 1k",
                "C1 out 0 1n",
                analyses,
                control,
                ".end", "");
    }

    private static final String RC_WRITE_BOTH = String.join("\n",
            ".control",
            "run",
            "set filetype=binary",
            "write b.raw v(in) v(out) i(v1)",
            "set filetype=ascii",
            "write a.raw v(in) v(out) i(v1)",
            "quit",
            ".endc");

    /** Step response of an RC low-pass, v(out) = 1 − exp(−t/RC) (any circuits textbook). */
    private static void assertRcStep(double tau, double[] time, double[] out) {
        for (int i = 0; i < time.length; i++) {
            // 5 mV: ngspice's default reltol 1e-3 / trapezoidal integration, not the reader, bounds the error
            assertEquals(1 - Math.exp(-time[i] / tau), out[i], 5e-3, "v(out) at t = " + time[i]);
        }
    }

    private static void assertRelativelyEqual(double[] expected, double[] actual, double tolerance, String what) {
        assertEquals(expected.length, actual.length, what + " length");
        for (int i = 0; i < expected.length; i++) {
            assertEquals(expected[i], actual[i], tolerance * Math.abs(expected[i]), what + " at point " + i);
        }
    }

    @Test
    void workedExampleDeckGivesTheReferenceBytesAndEqualAsciiValues(@TempDir Path dir) throws Exception {
        NgspiceRun.run(dir, HEX_DECK);

        // ngspice.md §10.6: 211 bytes, records (0, 1.5), (1e-9, 1.5), (2e-9, 1.5)
        assertEquals(211, Files.size(dir.resolve("b.raw")));
        RawPlot binary = RawFileReader.read(dir.resolve("b.raw")).get(0);
        assertArrayEquals(new double[] {0.0, 1e-9, 2e-9}, binary.column("time").orElseThrow());
        assertArrayEquals(new double[] {1.5, 1.5, 1.5}, binary.column("v(a)").orElseThrow());
        RawPlot ascii = RawFileReader.read(dir.resolve("a.raw")).get(0);
        assertEquals(binary.variables(), ascii.variables());
        for (int v = 0; v < binary.variables().size(); v++) {
            // ASCII holds %.15e (ngspice.md §10.3): 16 significant digits
            assertRelativelyEqual(binary.columns().get(v), ascii.columns().get(v), 1e-14, binary.variables().get(v));
        }
    }

    @Test
    void binaryAndAsciiFromTheSameRunHoldTheSameValues(@TempDir Path dir) throws Exception {
        NgspiceRun.run(dir, rcDeck(".tran 10n 5u", RC_WRITE_BOTH));

        RawPlot binary = RawFileReader.read(dir.resolve("b.raw")).get(0);
        RawPlot ascii = RawFileReader.read(dir.resolve("a.raw")).get(0);

        assertEquals(List.of("time", "v(in)", "v(out)", "i(v1)"), binary.variables());
        assertEquals(binary.variables(), ascii.variables());
        assertFalse(binary.truncated());
        assertEquals(binary.declaredPoints(), binary.points()); // `write` puts the exact count (§10.4)
        assertTrue(binary.points() > 100);
        for (int v = 0; v < binary.variables().size(); v++) {
            // ngspice.md §10.3: %.15e, so 1e-14 relative
            assertRelativelyEqual(binary.columns().get(v), ascii.columns().get(v), 1e-14, binary.variables().get(v));
        }
        double[] time = binary.column("time").orElseThrow();
        assertEquals(TSTOP, time[time.length - 1], TSTOP * 1e-9); // ngspice.md §3.4: last time is tstop
        assertRcStep(R * C, time, binary.column("v(out)").orElseThrow());
    }

    @Test
    void writerReproducesNgspiceWriteByteForByteExceptTheDate(@TempDir Path dir) throws Exception {
        NgspiceRun.run(dir, rcDeck(".tran 10n 5u", RC_WRITE_BOTH));
        List<RawPlot> plots = RawFileReader.read(dir.resolve("b.raw"));

        RawFileWriter.write(dir.resolve("b2.raw"), RawFileWriter.Encoding.BINARY, plots);
        RawFileWriter.write(dir.resolve("a2.raw"), RawFileWriter.Encoding.ASCII, plots);

        // ngspice's own `write` output is the reference layout (ngspice.md §9–§10)
        assertArrayEquals(withoutDate(Files.readAllBytes(dir.resolve("b.raw"))),
                withoutDate(Files.readAllBytes(dir.resolve("b2.raw"))));
        assertEquals(new String(withoutDate(Files.readAllBytes(dir.resolve("a.raw"))), StandardCharsets.ISO_8859_1),
                new String(withoutDate(Files.readAllBytes(dir.resolve("a2.raw"))), StandardCharsets.ISO_8859_1));
    }

    /** The file with its first {@code Date:} line removed. */
    private static byte[] withoutDate(byte[] raw) {
        String latin = new String(raw, StandardCharsets.ISO_8859_1);
        int start = latin.indexOf("\nDate:") + 1;
        int end = latin.indexOf('\n', start) + 1;
        return (latin.substring(0, start) + latin.substring(end)).getBytes(StandardCharsets.ISO_8859_1);
    }

    @Test
    void paddedPointCountOfMinusRFileIsRead(@TempDir Path dir) throws Exception {
        NgspiceRun.run(dir, rcDeck(".tran 10n 5u", ""), "-r", "r.raw");

        String head = new String(Files.readAllBytes(dir.resolve("r.raw")), StandardCharsets.ISO_8859_1);
        Matcher padded = Pattern.compile("No\\. Points: (\\d+) +\n").matcher(head);
        assertTrue(padded.find(), "-r pads the count field (ngspice.md §9)");
        RawPlot plot = RawFileReader.read(dir.resolve("r.raw")).get(0);

        assertEquals(Integer.parseInt(padded.group(1)), plot.declaredPoints());
        assertEquals(plot.declaredPoints(), plot.points());
        assertFalse(plot.truncated());
        double[] time = plot.column("time").orElseThrow();
        assertEquals(TSTOP, time[time.length - 1], TSTOP * 1e-9); // ngspice.md §3.4
        assertRcStep(R * C, time, plot.column("v(out)").orElseThrow());
    }

    @Test
    void threeAnalysesInOneMinusRFileAreThreePlots(@TempDir Path dir) throws Exception {
        NgspiceRun.run(dir, rcDeck(".op\n.ac dec 5 1k 10meg\n.tran 10n 5u", ""), "-r", "r.raw");

        List<RawPlot> plots = RawFileReader.read(dir.resolve("r.raw"));

        // ngspice.md §9: order AC, Operating Point, Transient for `.op .ac .tran`
        assertEquals(List.of("AC Analysis", "Operating Point", "Transient Analysis"),
                plots.stream().map(RawPlot::plotName).toList());
        RawPlot ac = plots.get(0);
        assertTrue(ac.isComplex());
        double[] f = ac.column("frequency").orElseThrow();
        double[] out = ac.column("v(out)").orElseThrow();
        assertEquals(21, f.length); // 5 points per decade over 4 decades, both ends included
        for (int i = 0; i < f.length; i++) {
            // `.ac dec 5 1k 10meg`: f = 1 kHz · 10^(i/5) (ngspice manual, AC analysis), real part of the scale
            assertEquals(1e3 * Math.pow(10, i / 5.0), f[i], 1e-9 * f[i], "frequency " + i);
        }
        for (int i = 0; i < f.length; i++) {
            double wrc = 2 * Math.PI * f[i] * R * C;
            // RC low-pass H = 1 / (1 + jωRC), real part 1 / (1 + (ωRC)²) (any circuits textbook)
            assertEquals(1 / (1 + wrc * wrc), out[i], 1e-9, "Re v(out) at " + f[i] + " Hz");
        }
        // the operating point: the source is 0 V at t = 0, so both nodes are at 0 V (Ohm's law)
        assertEquals(0.0, plots.get(1).column("v(out)").orElseThrow()[0], 1e-12);
        assertRcStep(R * C, plots.get(2).column("time").orElseThrow(), plots.get(2).column("v(out)").orElseThrow());
    }

    @Test
    void appendwriteGivesOnePlotPerWriteInBinaryAndAscii(@TempDir Path dir) throws Exception {
        String control = String.join("\n",
                ".control",
                "set appendwrite",
                "run",
                "set filetype=binary",
                "write p.raw v(out)",
                "set filetype=ascii",
                "write q.raw v(out)",
                "alter R1 2k",
                "run",
                "set filetype=binary",
                "write p.raw v(out)",
                "set filetype=ascii",
                "write q.raw v(out)",
                "quit",
                ".endc");
        NgspiceRun.run(dir, rcDeck(".tran 10n 5u", control));

        for (String name : List.of("p.raw", "q.raw")) {
            List<RawPlot> plots = RawFileReader.read(dir.resolve(name));
            assertEquals(2, plots.size(), name);
            for (int k = 0; k < 2; k++) {
                RawPlot plot = plots.get(k);
                assertFalse(plot.truncated(), name);
                assertEquals(List.of("time", "v(out)"), plot.variables());
                // first run R = 1 kΩ, second after `alter R1 2k` (ngspice.md §2): τ = RC
                assertRcStep((k + 1) * R * C, plot.column("time").orElseThrow(), plot.column("v(out)").orElseThrow());
            }
        }
    }

    @Test
    void runKilledWhileWritingMinusRGivesCompleteRecordsMarkedTruncated(@TempDir Path dir) throws Exception {
        Path ngspice = Ngspice.require();
        // a transient far too long to finish: killed like the runner's wall-clock timeout (ngspice.md §3.1)
        Files.writeString(dir.resolve("deck.cir"), rcDeck(".tran 1p 1 0 1p", ""));
        Process p = new ProcessBuilder(new ArrayList<>(List.of(ngspice.toString(), "-n", "-b", "-r", "k.raw",
                "deck.cir"))).directory(dir.toFile()).redirectErrorStream(true)
                .redirectOutput(dir.resolve("out.txt").toFile()).start();
        Path raw = dir.resolve("k.raw");
        try {
            long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(20);
            while ((!Files.exists(raw) || Files.size(raw) < 300_000) && System.nanoTime() < deadline && p.isAlive()) {
                Thread.sleep(20);
            }
        } finally {
            p.destroy();
            if (!p.waitFor(10, TimeUnit.SECONDS)) {
                p.destroyForcibly().waitFor(5, TimeUnit.SECONDS);
            }
        }
        byte[] bytes = Files.readAllBytes(raw);
        String latin = new String(bytes, StandardCharsets.ISO_8859_1);
        int dataStart = latin.indexOf("Binary:\n") + "Binary:\n".length();
        assertTrue(bytes.length - dataStart > 100_000, "the killed run wrote data");

        RawPlot plot = RawFileReader.read(raw).get(0);

        // ngspice.md §10.5: count stays 0; floor(bytes / record size) records, truncated
        assertEquals(0, plot.declaredPoints());
        assertTrue(plot.truncated());
        assertEquals((bytes.length - dataStart) / (4 * 8), plot.points());
        double[] time = plot.column("time").orElseThrow();
        assertRcStep(R * C, time, plot.column("v(out)").orElseThrow());
    }
}
