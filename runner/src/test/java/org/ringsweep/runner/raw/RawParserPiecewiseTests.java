package org.ringsweep.runner.raw;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The path taken for files over 2 GiB (slices mapped on demand, records decoded piece by piece)
 * gives the same columns as the one-buffer path, shown on a small file with tiny pieces.
 */
class RawParserPiecewiseTests {
    @Test
    void piecewiseDecodingEqualsWholeFileDecoding(@TempDir Path dir) throws IOException {
        int points = 20_011; // not a multiple of any block or piece size
        double[] time = new double[points];
        double[] v = new double[points];
        for (int k = 0; k < points; k++) {
            time[k] = k * 1e-12;
            v[k] = Math.sin(k * 0.01);
        }
        RawPlot plot = new RawPlot("p", "Transient Analysis", "real", List.of("time", "v(a)"), points,
                List.of(time, v), false);
        Path file = dir.resolve("p.raw");
        RawFileWriter.write(file, RawFileWriter.Encoding.BINARY, List.of(plot, plot));

        List<RawPlot> read;
        try (FileChannel channel = FileChannel.open(file, StandardOpenOption.READ)) {
            // 1000-byte pieces: 62 records of 16 bytes each, the last piece partly filled
            read = new RawParser(file, FileBytes.mappedOnDemand(channel), 1000).plots();
        }

        assertEquals(2, read.size());
        for (RawPlot r : read) {
            // the values written (IEEE-754 float64 round trip is exact)
            assertArrayEquals(time, r.column("time").orElseThrow());
            assertArrayEquals(v, r.column("v(a)").orElseThrow());
        }
    }
}
