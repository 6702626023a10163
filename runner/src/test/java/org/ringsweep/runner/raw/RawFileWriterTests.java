package org.ringsweep.runner.raw;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** RawFileWriter output read back by RawFileReader, and the writer's own checks. */
class RawFileWriterTests {
    @TempDir
    Path dir;

    /** Values spanning what a transient holds: zeros, signs, tiny currents, large exponents. */
    private static RawPlot sample(String title, int points, long seed) {
        Random random = new Random(seed);
        double[] time = new double[points];
        double[] v = new double[points];
        double[] i = new double[points];
        for (int k = 0; k < points; k++) {
            time[k] = k * 1e-11 + (k > 0 ? random.nextDouble() * 1e-12 : 0);
            v[k] = k % 7 == 0 ? 0.0 : random.nextGaussian() * Math.pow(10, random.nextInt(40) - 20);
            i[k] = -Math.abs(random.nextGaussian()) * 1e-9;
        }
        return new RawPlot(title, "Transient Analysis", "real", List.of("time", "v(out)", "i(v1)"), points,
                List.of(time, v, i), false);
    }

    @Test
    void binaryRoundTripIsExact() throws IOException {
        List<RawPlot> plots = List.of(sample("first", 1000, 1), sample("second", 10, 2));
        Path file = dir.resolve("rt.raw");

        RawFileWriter.write(file, RawFileWriter.Encoding.BINARY, plots);
        List<RawPlot> read = RawFileReader.read(file);

        assertEquals(2, read.size());
        for (int k = 0; k < plots.size(); k++) {
            RawPlot expected = plots.get(k);
            RawPlot actual = read.get(k);
            assertEquals(expected.title(), actual.title());
            assertEquals(expected.plotName(), actual.plotName());
            assertEquals(expected.variables(), actual.variables());
            assertEquals(expected.points(), actual.declaredPoints()); // exact count, as ngspice `write`
            assertFalse(actual.truncated());
            for (int v = 0; v < expected.variables().size(); v++) {
                // IEEE-754 float64 written and read back bit for bit
                assertArrayEquals(expected.columns().get(v), actual.columns().get(v));
            }
        }
    }

    @Test
    void asciiRoundTripKeepsSixteenSignificantDigits() throws IOException {
        RawPlot plot = sample("ascii", 500, 3);
        Path file = dir.resolve("rt-ascii.raw");

        RawFileWriter.write(file, RawFileWriter.Encoding.ASCII, List.of(plot, plot));
        List<RawPlot> read = RawFileReader.read(file);

        assertEquals(2, read.size());
        for (RawPlot actual : read) {
            assertFalse(actual.truncated());
            assertEquals(500, actual.declaredPoints());
            for (int v = 0; v < plot.variables().size(); v++) {
                double[] expected = plot.columns().get(v);
                double[] got = actual.columns().get(v);
                for (int k = 0; k < expected.length; k++) {
                    // %.15e rounds to 16 significant digits: relative error ≤ 5e-16 (C printf rounding)
                    assertEquals(expected[k], got[k], 5e-16 * Math.abs(expected[k]), plot.variables().get(v) + k);
                }
            }
        }
    }

    @Test
    void complexPlotKeepsRealPartsAndFlag() throws IOException {
        double[] f = {1e3, 1e4, 1e5};
        double[] re = {0.99, 0.5, -0.01};
        RawPlot plot = new RawPlot("ac", "AC Analysis", "complex", List.of("frequency", "v(out)"), 3,
                List.of(f, re), false);
        for (RawFileWriter.Encoding encoding : RawFileWriter.Encoding.values()) {
            Path file = dir.resolve("ac-" + encoding + ".raw");
            RawFileWriter.write(file, encoding, List.of(plot));
            if (encoding == RawFileWriter.Encoding.BINARY) {
                // ngspice.md §10.2: 16 bytes per complex value, 2 variables, 3 points
                String head = Files.readString(file, java.nio.charset.StandardCharsets.ISO_8859_1);
                assertEquals(head.indexOf("Binary:\n") + 8 + 3 * 2 * 16, Files.size(file));
            }

            RawPlot read = RawFileReader.read(file).get(0);

            assertTrue(read.isComplex());
            assertArrayEquals(f, read.column("frequency").orElseThrow(), 1e-12);
            assertArrayEquals(re, read.column("v(out)").orElseThrow(), 1e-15);
        }
    }

    @Test
    void dateLineIsInNgspiceLayout() throws IOException {
        Path file = dir.resolve("dated.raw");
        RawFileWriter.write(file, RawFileWriter.Encoding.ASCII, List.of(sample("d", 2, 4)),
                Instant.parse("2026-12-02T00:59:59Z"));
        // ngspice.md §9: `Date: Wed Dec  2 00:59:59  2026`
        assertTrue(Files.readString(file).contains("\nDate: Wed Dec  2 00:59:59  2026\n"));
    }

    @Test
    void formatsNumbersAsCPrintfDoes() {
        // expected strings: C printf("%.15e", double) with glibc 2.36 (gcc, Debian 12), the function ngspice's
        // writer calls (ngspice.md §10.3); 1e23 is 99999999999999991611392 as a double, hence 9.99…9e+22
        String[][] cases = {
            {"0.0", "0.000000000000000e+00"},
            {"1.5", "1.500000000000000e+00"},
            {"1e-9", "1.000000000000000e-09"},
            {"-2.168404344971009e-19", "-2.168404344971009e-19"},
            {"0.1", "1.000000000000000e-01"},
            {"1e300", "1.000000000000000e+300"},
            {"1e23", "9.999999999999999e+22"},
        };
        for (String[] c : cases) {
            StringBuilder b = new StringBuilder();
            RawFileWriter.appendE15(b, Double.parseDouble(c[0]));
            assertEquals(c[1], b.toString(), c[0]);
        }
    }

    @Test
    void columnsOfUnequalLengthAreRefused() {
        RawPlot plot = new RawPlot("t", "Transient Analysis", "real", List.of("time", "v(a)"), 2,
                List.of(new double[2], new double[3]), false);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> RawFileWriter.write(dir.resolve("x.raw"), RawFileWriter.Encoding.BINARY, List.of(plot)));
        assertTrue(e.getMessage().contains("expected equal lengths"), e.getMessage());
    }

    @Test
    void namesWithWhitespaceAndUnknownFlagsAreRefused() {
        RawPlot spaced = new RawPlot("t", "Transient Analysis", "real", List.of("time", "v a"), 1,
                List.of(new double[1], new double[1]), false);
        RawPlot flagged = new RawPlot("t", "Transient Analysis", "double", List.of("time"), 1,
                List.of(new double[1]), false);
        assertTrue(assertThrows(IllegalArgumentException.class, () -> RawFileWriter.write(dir.resolve("s.raw"),
                RawFileWriter.Encoding.ASCII, List.of(spaced))).getMessage().contains("`v a`"));
        assertTrue(assertThrows(IllegalArgumentException.class, () -> RawFileWriter.write(dir.resolve("f.raw"),
                RawFileWriter.Encoding.ASCII, List.of(flagged))).getMessage().contains("`double`"));
    }
}
