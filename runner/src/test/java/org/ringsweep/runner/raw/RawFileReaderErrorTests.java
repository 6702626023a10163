package org.ringsweep.runner.raw;

import static org.junit.jupiter.api.Assertions.assertAll;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Hand-built raw files in the layout of shared/reference/ngspice.md §9–§10: what is rejected, with
 * which message, and which damaged files still read (truncated runs, §10.5).
 */
class RawFileReaderErrorTests {
    @TempDir
    Path dir;

    private static String header(String flags, int variables, String points, String... variableLines) {
        StringBuilder b = new StringBuilder("Title: t\nDate: Wed Dec  2 00:59:59  2026\nPlotname: Transient Analysis\n");
        b.append("Flags: ").append(flags).append('\n');
        b.append("No. Variables: ").append(variables).append('\n');
        b.append("No. Points: ").append(points).append('\n');
        b.append("Variables:\n");
        for (String line : variableLines) {
            b.append(line).append('\n');
        }
        return b.toString();
    }

    private static byte[] binary(String header, double... values) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        out.writeBytes((header + "Binary:\n").getBytes(StandardCharsets.ISO_8859_1));
        ByteBuffer data = ByteBuffer.allocate(values.length * 8).order(ByteOrder.LITTLE_ENDIAN);
        for (double v : values) {
            data.putDouble(v);
        }
        out.writeBytes(data.array());
        return out.toByteArray();
    }

    private Path file(String name, byte[] content) throws IOException {
        return Files.write(dir.resolve(name), content);
    }

    private Path file(String name, String content) throws IOException {
        return file(name, content.getBytes(StandardCharsets.ISO_8859_1));
    }

    private String failure(Path file) {
        return assertThrows(RawFormatException.class, () -> RawFileReader.read(file)).getMessage();
    }

    private static void assertMentions(String message, String... fragments) {
        assertAll(Arrays.stream(fragments).map(f -> () -> assertTrue(message.contains(f),
                () -> "message should contain `" + f + "`: " + message)));
    }

    private static final String[] TWO_VARIABLES = {"\t0\ttime\ttime", "\t1\tv(a)\tvoltage"};

    @Test
    void emptyFileIsRejectedAsEmpty() throws IOException {
        Path f = file("empty.raw", new byte[0]);
        assertMentions(failure(f), "empty.raw", "is empty (0 bytes)", "`Title:`");
    }

    @Test
    void missingFileIsRejectedByName() {
        Path f = dir.resolve("absent.raw");
        assertMentions(failure(f), "absent.raw", "does not exist");
    }

    @Test
    void textThatIsNotARawFileIsRejectedAtLineOne() throws IOException {
        Path f = file("deck.raw", "* a deck, not a raw file\nR1 a 0 1k\n");
        assertMentions(failure(f), "deck.raw", "line 1 (byte offset 0)", "expected a `Title:` line",
                "found `* a deck, not a raw file`");
    }

    @Test
    void binaryGarbageIsRejectedAsNonText() throws IOException {
        byte[] junk = new byte[4096];
        new Random(7).nextBytes(junk);
        junk[0] = 0x01; // a control byte in the first line for certain
        Path f = file("junk.raw", junk);
        assertMentions(failure(f), "junk.raw", "line 1 (byte offset 0)", "non-text byte `0x01`", "is this an ngspice raw file?");
    }

    @Test
    void headerWithoutVariablesSectionNamesTheMissingLine() throws IOException {
        String h = "Title: t\nPlotname: Transient Analysis\nFlags: real\nNo. Variables: 2\nNo. Points: 1\n";
        Path f = file("novars.raw", binary(h, 0.0, 1.0));
        assertMentions(failure(f), "novars.raw", "line 6", "no `Variables:` line before `Binary:`");
    }

    @Test
    void unknownFlagIsRejectedWithTheAcceptedOnes() throws IOException {
        Path f = file("flags.raw", binary(header("real double", 2, "1", TWO_VARIABLES), 0.0, 1.0));
        assertMentions(failure(f), "line 4", "unknown `Flags:` token `double`", "expected `real` or `complex`");
    }

    @Test
    void fewerVariableLinesThanAnnouncedAreRejectedAtTheLineFound() throws IOException {
        Path f = file("count.raw", binary(header("real", 3, "1", TWO_VARIABLES), 0.0, 1.0, 2.0));
        assertMentions(failure(f), "line 10", "expected variable line 2 of 3", "`No. Variables: 3`",
                "found `Binary:`");
    }

    @Test
    void variableLineWithWrongIndexIsRejected() throws IOException {
        Path f = file("index.raw", binary(header("real", 2, "1", "\t0\ttime\ttime", "\t7\tv(a)\tvoltage"), 0.0, 1.0));
        assertMentions(failure(f), "line 9", "expected variable line 1 of 2", "found `\\t7\\tv(a)\\tvoltage`");
    }

    @Test
    void nonNumericVariableCountIsRejected() throws IOException {
        Path f = file("nvars.raw", binary(header("real", 2, "1", TWO_VARIABLES).replace("Variables: 2", "Variables: two"),
                0.0, 1.0));
        assertMentions(failure(f), "line 5", "expected a whole number after `No. Variables:`", "found `two`");
    }

    @Test
    void nanTimeIsRejectedWithItsPointAndOffset() throws IOException {
        String h = header("real", 2, "3", TWO_VARIABLES);
        Path f = file("nan.raw", binary(h, 0.0, 1.0, Double.NaN, 1.0, 2e-9, 1.0));
        int offset = (h + "Binary:\n").length() + 16; // record 1, variable 0
        assertMentions(failure(f), "nan.raw", "byte offset " + offset, "point 1", "`time` is `NaN`",
                "expected a finite time");
    }

    @Test
    void timeGoingBackIsRejected() throws IOException {
        Path f = file("back.raw", binary(header("real", 2, "3", TWO_VARIABLES), 0.0, 1.0, 2e-9, 1.0, 1e-9, 1.0));
        assertMentions(failure(f), "point 2", "`time` = `1.0E-9` is not after the previous `2.0E-9`",
                "strictly increasing");
    }

    @Test
    void nanTimeInAsciiDataIsRejectedWithItsLine() throws IOException {
        String text = header("real", 2, "2", TWO_VARIABLES) + "Values:\n 0\t0.0\n\t1.0\n\n 1\tnan\n\t1.0\n\n";
        Path f = file("nan-ascii.raw", text);
        assertMentions(failure(f), "line 14", "point 1", "`time` is `NaN`");
    }

    @Test
    void bytesAfterTheDeclaredRecordsThatAreNoPlotAreRejected() throws IOException {
        // header says 1 point but 2 records follow: the count is trusted, the rest must be a plot (§10.5)
        Path f = file("extra.raw", binary(header("real", 2, "1", TWO_VARIABLES), 0.0, 1.0, 1e-9, 1.0));
        assertMentions(failure(f), "`No. Points: 1`", "do not start a further plot", "expected the end of the file or a `Title:`");
    }

    @Test
    void binaryCutMidRecordKeepsTheCompleteRecordsAndIsTruncated() throws IOException {
        byte[] whole = binary(header("real", 2, "3", TWO_VARIABLES), 0.0, 1.0, 1e-9, 2.0, 2e-9, 3.0);
        Path f = file("cut.raw", Arrays.copyOf(whole, whole.length - 5)); // 2 records and 11 of 16 bytes

        RawPlot plot = RawFileReader.read(f).get(0);

        // ngspice.md §10.5: floor(bytes / record size) records, marked truncated
        assertTrue(plot.truncated());
        assertEquals(3, plot.declaredPoints());
        assertArrayEquals(new double[] {0.0, 1e-9}, plot.column("time").orElseThrow());
        assertArrayEquals(new double[] {1.0, 2.0}, plot.column("v(a)").orElseThrow());
    }

    @Test
    void zeroCountWithRowsPresentReadsTheRowsAsTruncated() throws IOException {
        // ngspice.md §1 table / §10.5: after a failed run the header keeps `No. Points: 0` but rows follow
        Path f = file("zero.raw", binary(header("real", 2, "0       ", TWO_VARIABLES), 0.0, 1.0, 1e-9, 2.0, 2e-9));

        RawPlot plot = RawFileReader.read(f).get(0);

        assertTrue(plot.truncated());
        assertEquals(0, plot.declaredPoints());
        assertArrayEquals(new double[] {0.0, 1e-9}, plot.column("time").orElseThrow());
    }

    @Test
    void zeroCountWithoutRowsIsAnEmptyTruncatedPlot() throws IOException {
        // ngspice.md §1 table: no DC operating point → header only, `No. Points: 0`
        Path f = file("header-only.raw", binary(header("real", 2, "0", TWO_VARIABLES)));

        RawPlot plot = RawFileReader.read(f).get(0);

        assertTrue(plot.truncated());
        assertEquals(0, plot.points());
    }

    @Test
    void asciiCutInsideANumberDropsThatPoint() throws IOException {
        // a killed run can stop mid-number: `1.5` of `1.500…e+00` must not be taken for a value
        String text = header("real", 2, "0", TWO_VARIABLES) + "Values:\n 0\t0.0\n\t1.0\n\n 1\t1.0e-09\n\t1.5";
        RawPlot plot = RawFileReader.read(file("cut-ascii.raw", text)).get(0);

        assertTrue(plot.truncated());
        assertArrayEquals(new double[] {0.0}, plot.column("time").orElseThrow());
    }

    @Test
    void crlfLineEndsAreAccepted() throws IOException {
        String text = (header("real", 2, "2", TWO_VARIABLES) + "Values:\n 0\t0.0\n\t1.0\n\n 1\t1e-9\n\t2.0\n\n")
                .replace("\n", "\r\n");
        RawPlot plot = RawFileReader.read(file("crlf.raw", text)).get(0);

        assertFalse(plot.truncated());
        assertEquals(List.of("time", "v(a)"), plot.variables());
        assertArrayEquals(new double[] {1.0, 2.0}, plot.column("v(a)").orElseThrow());
    }

    @Test
    void commandLinesAreIgnoredNotExecuted() throws IOException {
        // ngspice.md §8–§9: `Command:` lines would be executed by ngspice's own reader; ours ignores them
        Path marker = dir.resolve("executed");
        String h = header("real", 2, "1", TWO_VARIABLES).replace("Variables:\n",
                "Command: shell touch " + marker + "\nVariables:\n");
        RawPlot plot = RawFileReader.read(file("cmd.raw", binary(h, 0.0, 1.0))).get(0);

        assertEquals(1, plot.points());
        assertFalse(Files.exists(marker));
    }

    @Test
    void asciiPlotShortOfItsCountBeforeTheNextPlotIsRejected() throws IOException {
        String plot = header("real", 2, "2", TWO_VARIABLES) + "Values:\n 0\t0.0\n\t1.0\n\n";
        Path f = file("short.raw", plot + plot);
        assertMentions(failure(f), "has only 1 of the 2 points", "only the last plot");
    }

    @Test
    void headerOnlyPlotFollowedByAnotherPlotGivesBoth() throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        out.writeBytes(binary(header("real", 2, "0", TWO_VARIABLES)));
        out.writeBytes(binary(header("real", 2, "1", TWO_VARIABLES), 0.0, 4.0));

        List<RawPlot> plots = RawFileReader.read(file("two.raw", out.toByteArray()));

        assertEquals(2, plots.size());
        assertTrue(plots.get(0).truncated());
        assertEquals(0, plots.get(0).points());
        assertArrayEquals(new double[] {4.0}, plots.get(1).column("v(a)").orElseThrow());
    }

    @Test
    void crlfBinaryHeaderIsAccepted() throws IOException {
        String h = header("real", 2, "2", TWO_VARIABLES);
        byte[] lf = binary(h, 0.0, 1.0, 1e-9, 2.0);
        int data = (h + "Binary:\n").length();
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        out.writeBytes((h + "Binary:\n").replace("\n", "\r\n").getBytes(StandardCharsets.ISO_8859_1));
        out.write(lf, data, lf.length - data);

        RawPlot plot = RawFileReader.read(file("crlf-bin.raw", out.toByteArray())).get(0);

        assertFalse(plot.truncated());
        assertArrayEquals(new double[] {0.0, 1e-9}, plot.column("time").orElseThrow());
    }
}
