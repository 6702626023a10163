package org.ringsweep.runner.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.input.InputException;

class SweepFileLoaderTests {
    private final SweepFileLoader loader = new SweepFileLoader();

    @TempDir
    Path dir;

    @Test
    void readsEveryFormOfTheFormatsExample() {
        // formats.md "Sweep file" example, with its second R5/value entry moved to C9 (each target once)
        Path file = SweepFixture.write(dir,
                "format: ringsweep/sweep-1",
                "nets: [nets/*.yaml]",
                "vary:",
                "  - { target: R5/value, values: [0, 10, 22, 33, 47] }",
                "  - { target: C9/value, series: E24, from: 1pF, to: 10pF }",
                "  - { target: U1.14/rise, from: 0.5ns, to: 3ns, steps: 6 }",
                "  - { target: corner, values: [slow, typ, fast] }",
                "combine: grid");
        SweepFile s = loader.load(file);
        assertEquals(List.of(dir.resolve("nets/reset.yaml"), dir.resolve("nets/spi-sck.yaml")), s.nets());
        assertEquals(Combine.GRID, s.combine());
        assertEquals(4, s.vary().size());
        Vary.Listed listed = assertInstanceOf(Vary.Listed.class, s.vary().get(0).values());
        assertEquals(List.of("0", "10", "22", "33", "47"), listed.texts().stream().map(Vary.Text::text).toList());
        assertEquals("vary[0].values[2]", listed.texts().get(2).key());
        assertEquals(4, listed.texts().get(2).location().line());
        Vary.SeriesRange series = assertInstanceOf(Vary.SeriesRange.class, s.vary().get(1).values());
        assertEquals(ESeries.Series.E24, series.series());
        assertEquals("1pF", series.from().text());
        Vary.Range range = assertInstanceOf(Vary.Range.class, s.vary().get(2).values());
        assertEquals(6, range.steps());
        assertEquals(false, range.log());
        Vary.Corners corners = assertInstanceOf(Vary.Corners.class, s.vary().get(3).values());
        assertEquals(List.of("slow", "typ", "fast"), corners.names().stream().map(Vary.Text::text).toList());
        assertTrue(s.vary().get(3).isCorner());
        assertEquals(7, s.vary().get(3).location().line());
    }

    @Test
    void combineDefaultsToGridAndReadsZip() {
        Path file = SweepFixture.write(dir, "format: ringsweep/sweep-1", "nets: nets/spi-sck.yaml",
                "vary: [{ target: R5/value, values: [10] }]");
        assertEquals(Combine.GRID, loader.load(file).combine());
        Path zip = SweepFixture.write(dir, "format: ringsweep/sweep-1", "nets: nets/spi-sck.yaml",
                "vary: [{ target: R5/value, values: [10] }]", "combine: zip");
        assertEquals(Combine.ZIP, loader.load(zip).combine());
    }

    @Test
    void removesDuplicateNetsAndSortsThem() {
        Path file = SweepFixture.write(dir, "format: ringsweep/sweep-1",
                "nets: [nets/spi-sck.yaml, nets/*.yaml, ./nets/../nets/reset.yaml]",
                "vary: [{ target: R5/value, values: [10] }]");
        assertEquals(List.of(dir.resolve("nets/reset.yaml"), dir.resolve("nets/spi-sck.yaml")), loader.load(file).nets());
    }

    @Test
    void expandsGlobsRelativeToTheSweepFileIncludingSubfolders() throws IOException {
        Path file = SweepFixture.write(dir.resolve("board"), "format: ringsweep/sweep-1", "nets: ['**/*.yaml', 'nets/s*.yaml']",
                "vary: [{ target: R5/value, values: [10] }]");
        Files.createDirectories(dir.resolve("board/more/deeper"));
        Files.copy(SweepFixture.resource("nets/reset.yaml"), dir.resolve("board/more/deeper/reset2.yaml"));
        List<Path> nets = loader.load(file).nets();
        // `**/*.yaml` needs a folder part, so sweep.yaml itself (in the base folder) is not matched
        assertEquals(List.of(dir.resolve("board/more/deeper/reset2.yaml"), dir.resolve("board/nets/reset.yaml"),
                dir.resolve("board/nets/spi-sck.yaml")), nets);
    }

    @Test
    void aGlobThatMatchesNothingIsAnError() {
        Path file = SweepFixture.write(dir, "format: ringsweep/sweep-1", "nets: [nets/*.yaml, other/*.yaml]",
                "vary: [{ target: R5/value, values: [10] }]");
        InputException e = assertThrows(InputException.class, () -> loader.load(file));
        assertEquals("nets[1]", e.key());
        assertEquals(2, e.line());
        assertTrue(e.getMessage().contains("`other/*.yaml` matches no file"), e.getMessage());
    }

    @Test
    void aMissingFileIsNamed() {
        InputException e = assertThrows(InputException.class, () -> loader.load(dir.resolve("none.yaml")));
        assertTrue(e.getMessage().contains("no such file; expected a sweep file"), e.getMessage());
    }

    @Test
    void aNetFileGivenAsASweepSaysWhatItIs() {
        InputException e = assertThrows(InputException.class, () -> loader.load(SweepFixture.resource("nets/reset.yaml")));
        assertEquals("format", e.key());
        assertTrue(e.getMessage().contains("that is a net file"), e.getMessage());
    }
}
