package org.ringsweep.runner.raw;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The byte-level worked example of shared/reference/ngspice.md §10.6, rebuilt byte by byte. */
class RawFileReaderWorkedExampleTests {
    /** Header of §10.6: the hex dump rows 0x00–0xA2 (the rows elided there are the lines named in it). */
    static final String HEADER = "Title: hex\n"
            + "Date: Wed Dec  2 00:59:59  2026\n"
            + "Plotname: Transient Analysis\n"
            + "Flags: real\n"
            + "No. Variables: 2\n"
            + "No. Points: 3\n"
            + "Variables:\n"
            + "\t0\ttime\ttime\n"
            + "\t1\tv(a)\tvoltage\n"
            + "Binary:\n";
    /** Data of §10.6, bytes 0xA3–0xD2 copied from its dump. */
    static final String DATA_HEX = "0000000000000000" + "000000000000f83f"
            + "95d626e80b2e113e" + "000000000000f83f"
            + "95d626e80b2e213e" + "000000000000f83f";

    static byte[] exampleBytes() {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        out.writeBytes(HEADER.getBytes(StandardCharsets.ISO_8859_1));
        out.writeBytes(HexFormat.of().parseHex(DATA_HEX));
        return out.toByteArray();
    }

    @Test
    void rebuiltExampleHasTheSizesTheReferenceStates() {
        // ngspice.md §10.6: header 163 bytes ending with `Binary:\n`, file 211 bytes
        assertEquals(163, HEADER.getBytes(StandardCharsets.ISO_8859_1).length);
        assertEquals(211, exampleBytes().length);
    }

    @Test
    void readsTheThreeRecordsOfTheWorkedExample(@TempDir Path dir) throws IOException {
        Path file = Files.write(dir.resolve("hx.raw"), exampleBytes());

        List<RawPlot> plots = RawFileReader.read(file);

        assertEquals(1, plots.size());
        RawPlot plot = plots.get(0);
        assertEquals("hex", plot.title());
        assertEquals("Transient Analysis", plot.plotName());
        assertEquals("real", plot.flags());
        assertEquals(List.of("time", "v(a)"), plot.variables());
        assertEquals(3, plot.declaredPoints());
        assertFalse(plot.truncated());
        // ngspice.md §10.6: rec0 = (0.0, 1.5), rec1 = (1e-9, 1.5), rec2 = (2e-9, 1.5)
        assertArrayEquals(new double[] {0.0, 1e-9, 2e-9}, plot.column("time").orElseThrow());
        assertArrayEquals(new double[] {1.5, 1.5, 1.5}, plot.column("V(A)").orElseThrow());
    }
}
