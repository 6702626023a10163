package org.ringsweep.runner.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.testing.Ngspice;

/**
 * The report renders in a real browser: headless Chromium (Debian's {@code chromium} package)
 * takes a screenshot, and the plot areas in it are not blank. Skipped where
 * {@code /usr/bin/chromium} is not installed.
 */
class ChromiumRenderTests {
    private static final Path CHROMIUM = Path.of("/usr/bin/chromium");
    /**
     * Luminance below which a pixel counts as part of a frame line: the 1 px black border on a
     * whole-pixel coordinate is anti-aliased over two rows of mid grey (about 128), so the cut is
     * well above that and well below the light grid (#ddd, 221).
     */
    private static final int FRAME = 200;

    @TempDir
    Path dir;

    @Test
    void chromiumRendersThePlotsWithInk() throws Exception {
        Assumptions.assumeTrue(Files.isExecutable(CHROMIUM), "Chromium is not installed at /usr/bin/chromium");
        Ngspice.require();
        Path out = dir.resolve("out");
        ReportFixture.run("check", ReportFixture.resource("physics/matched-series.yaml").toString(), "--out", out.toString(), "--quiet");
        Path png = dir.resolve("shot.png");
        Process p = new ProcessBuilder(CHROMIUM.toString(), "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking",
                "--disable-component-update", "--disable-sync", "--no-first-run", "--user-data-dir=" + dir.resolve("profile"),
                "--screenshot=" + png, "--window-size=1200,2000", out.resolve(Reports.HTML_FILE).toUri().toString())
                .redirectErrorStream(true).redirectOutput(dir.resolve("chromium.log").toFile()).start();
        assertTrue(p.waitFor(90, TimeUnit.SECONDS), "chromium finished");
        assertEquals(0, p.exitValue(), Files.readString(dir.resolve("chromium.log")));
        BufferedImage img = ImageIO.read(png.toFile());
        List<int[]> areas = plotAreas(img);
        // matched-series has one receiver with a rising and a falling edge: two plots, side by side in 1200 px.
        assertEquals(2, areas.size(), "plot areas found: " + areas.size());
        for (int[] a : areas) {
            int dark = 0;
            int total = 0;
            for (int y = a[1] + 2; y < a[3] - 1; y++) {
                for (int x = a[0] + 2; x < a[2] - 1; x++) {
                    total++;
                    if (luminance(img.getRGB(x, y)) < 128) {
                        dark++;
                    }
                }
            }
            // Traces and reference lines: a blank or unstyled area would have (almost) no dark pixels.
            assertTrue(dark > total / 200, "plot area at " + a[0] + "," + a[1] + " has ink: " + dark + " of " + total);
        }
    }

    private static int luminance(int rgb) {
        int r = (rgb >> 16) & 0xff;
        int g = (rgb >> 8) & 0xff;
        int b = rgb & 0xff;
        return (299 * r + 587 * g + 114 * b) / 1000;
    }

    /**
     * The plot-area frames: black rectangles at least 300 px wide and 150 px high (each plot area is
     * drawn with a 1 px black border), found as pairs of long dark horizontal runs joined by dark
     * vertical edges. Returns {x0, y0, x1, y1} per area.
     */
    private static List<int[]> plotAreas(BufferedImage img) {
        List<int[]> runs = new ArrayList<>();
        for (int y = 0; y < img.getHeight(); y++) {
            int start = -1;
            for (int x = 0; x <= img.getWidth(); x++) {
                boolean dark = x < img.getWidth() && luminance(img.getRGB(x, y)) < FRAME;
                if (dark && start < 0) {
                    start = x;
                } else if (!dark && start >= 0) {
                    if (x - start >= 300) {
                        runs.add(new int[] {start, y, x - 1});
                    }
                    start = -1;
                }
            }
        }
        List<int[]> candidates = new ArrayList<>();
        for (int[] top : runs) {
            for (int[] bottom : runs) {
                if (bottom[1] - top[1] < 150 || Math.abs(bottom[0] - top[0]) > 1 || Math.abs(bottom[2] - top[2]) > 1) {
                    continue;
                }
                // The y-axis tick marks touch the frame on the same rows, so look a few pixels in for the sides.
                int left = -1;
                for (int x = top[0]; x <= top[0] + 10 && left < 0; x++) {
                    left = column(img, x, top[1], bottom[1]) ? x : -1;
                }
                int right = -1;
                for (int x = top[2]; x >= top[2] - 10 && right < 0; x--) {
                    right = column(img, x, top[1], bottom[1]) ? x : -1;
                }
                if (left >= 0 && right > left + 300) {
                    candidates.add(new int[] {left, top[1], right, bottom[1]});
                }
            }
        }
        // Rails and flat traces also make long dark runs inside a frame: keep only frames not inside another.
        List<int[]> areas = new ArrayList<>();
        for (int[] a : candidates) {
            boolean inside = candidates.stream().anyMatch(o -> o != a && o[0] <= a[0] + 1 && o[2] >= a[2] - 1 && o[1] <= a[1] && o[3] >= a[3]
                    && (o[1] < a[1] || o[3] > a[3]));
            boolean seen = areas.stream().anyMatch(o -> Math.abs(o[0] - a[0]) <= 1 && o[1] == a[1] && o[3] == a[3]);
            if (!inside && !seen) {
                areas.add(a);
            }
        }
        return areas;
    }

    private static boolean column(BufferedImage img, int x, int y0, int y1) {
        for (int y = y0; y <= y1; y++) {
            if (luminance(img.getRGB(x, y)) >= FRAME) {
                return false;
            }
        }
        return true;
    }
}
