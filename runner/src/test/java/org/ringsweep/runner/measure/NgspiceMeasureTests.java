package org.ringsweep.runner.measure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.net.Stimulus.Edge;
import org.ringsweep.runner.testing.Ngspice;

/**
 * Our measurements on a real simulated waveform against ngspice's own {@code .meas} (reference
 * simulator): a 10 ohm driver into an open 50 ohm line with 2 pF at the end, which rings hard and
 * double-clocks on both edges. ngspice prints 7 significant digits, hence the tolerances.
 */
class NgspiceMeasureTests {
    private static final double NS = 1e-9;
    /** ngspice prints 7 significant digits: half a unit of the 7th digit is 5e-7 of the value. */
    private static final double RELATIVE = 1e-6;
    private static final Pattern MEAS = Pattern.compile(
            "^(\\w+)\\s*=\\s*([-+0-9.eE]+)(?:\\s+at=\\s*([-+0-9.eE]+))?", Pattern.MULTILINE);
    private static final Levels LEVELS = new Levels(0, 3.3, 0.8, 2.0, 0.165, 0.001);

    @TempDir
    Path dir;

    @Test
    void crossingsExtremesAndRingbackAgreeWithNgspiceMeas() throws Exception {
        Path ngspice = Ngspice.require();
        Path wave = dir.resolve("wave.txt");
        Map<String, double[]> ref = run(ngspice, deck(wave, List.of(
                "meas tran r_vih when v(rx)=2.0 rise=1",
                "meas tran r_vil when v(rx)=0.8 rise=1",
                "meas tran r_last when v(rx)=2.0 rise=last from=1n to=31n",
                "meas tran r_max max v(rx) from=1n to=31n",
                "meas tran f_vil when v(rx)=0.8 fall=1 td=31n",
                "meas tran f_vih when v(rx)=2.0 fall=1 td=31n",
                "meas tran f_last when v(rx)=0.8 fall=last from=31n to=60n",
                "meas tran f_min min v(rx) from=31n to=60n",
                "meas tran f_trough min v(rx) from=32.5n to=33.5n",
                "meas tran r_2 when v(rx)=2.0 rise=2",
                "meas tran r_3 when v(rx)=2.0 rise=3",
                "meas tran f_2 when v(rx)=0.8 fall=2 td=31n",
                "meas tran f_3 when v(rx)=0.8 fall=3 td=31n")));
        double[][] tv = readWrdata(wave);

        EdgeMetrics rise = EdgeMeasurer.measure(tv[0], tv[1], new EdgeWindow(Edge.RISE, 1 * NS, 1.25 * NS, 31 * NS), LEVELS);
        assertTime(ref.get("r_vih")[0], rise.firstCrossingS());
        assertTime(ref.get("r_vil")[0], rise.nearThresholdCrossingS());
        assertTime(ref.get("r_last")[0], rise.lastCrossingS());
        assertVolts(ref.get("r_max")[0], rise.vMax());
        assertVolts(ref.get("r_max")[0] - 3.3, rise.overshootV());
        // ngspice finds a second rising VIH crossing and no third (its r_3 measurement fails)
        assertTrue(ref.containsKey("r_2") && !ref.containsKey("r_3"), ref.keySet().toString());
        assertEquals(2, rise.crossings());

        EdgeMetrics fall = EdgeMeasurer.measure(tv[0], tv[1], new EdgeWindow(Edge.FALL, 31 * NS, 31.25 * NS, 60 * NS), LEVELS);
        assertTime(ref.get("f_vil")[0], fall.firstCrossingS());
        assertTime(ref.get("f_vih")[0], fall.nearThresholdCrossingS());
        assertTime(ref.get("f_last")[0], fall.lastCrossingS());
        assertVolts(ref.get("f_min")[0], fall.vMin());
        assertVolts(-ref.get("f_min")[0], fall.undershootV());
        assertTrue(ref.containsKey("f_2") && !ref.containsKey("f_3"), ref.keySet().toString());
        assertEquals(2, fall.crossings());

        // Ringback, rising: the first peak after VIH is this wave's highest point, so it is ngspice's
        // maximum. Falling: by inspection of the written points the wave bottoms out at about -2.1975 V
        // near 33.1 ns, turns back up by about 5 mV (more than the 1 mV hysteresis) and only then dips to
        // its lowest -2.32 V at 34.1 ns, so the first trough is ngspice's minimum over 32.5..33.5 ns.
        assertTime(ref.get("r_max")[1], rise.ringbackPeakS());
        assertTime(ref.get("f_trough")[1], fall.ringbackPeakS());
        // The margins: ngspice's min (max) from that peak (trough) to the window end, against VIH (VIL).
        Map<String, double[]> back = run(ngspice, deck(dir.resolve("wave2.txt"), List.of(
                String.format(java.util.Locale.ROOT, "meas tran r_back min v(rx) from=%.9e to=31n", rise.ringbackPeakS()),
                String.format(java.util.Locale.ROOT, "meas tran f_back max v(rx) from=%.9e to=60n", fall.ringbackPeakS()))));
        assertVolts(back.get("r_back")[0] - 2.0, rise.ringbackMarginV());
        assertVolts(0.8 - back.get("f_back")[0], fall.ringbackMarginV());
        assertTrue(rise.ringbackMarginV() < 0, "the wave rings back below VIH (it crosses VIH twice)");
    }

    /** A time within the 7 printed digits of ngspice's number. */
    private static void assertTime(double expected, double actual) {
        assertEquals(expected, actual, Math.abs(expected) * RELATIVE);
    }

    /** A voltage within the 7 printed digits of ngspice's number (all are below 10 V here). */
    private static void assertVolts(double expected, double actual) {
        assertEquals(expected, actual, 10 * RELATIVE);
    }

    private static String deck(Path wave, List<String> meas) {
        return String.join("\n",
                "* two edges into an under-terminated line",
                "V1 src 0 PWL(0 0 1n 0 1.5n 3.3 31n 3.3 31.5n 0 60n 0)",
                "R1 src a 10",
                "T1 a 0 rx 0 Z0=50 TD=1n",
                "C1 rx 0 2p",
                ".tran 2p 60n",
                ".control",
                "set numdgt=15",
                "run",
                "wrdata " + wave.toAbsolutePath() + " v(rx)",
                String.join("\n", meas),
                ".endc",
                ".end",
                "");
    }

    private Map<String, double[]> run(Path ngspice, String deck) throws IOException, InterruptedException {
        Path cir = Files.createTempFile(dir, "deck", ".cir");
        Files.writeString(cir, deck, StandardCharsets.US_ASCII);
        Path out = dir.resolve(cir.getFileName() + ".log");
        Process p = new ProcessBuilder(ngspice.toString(), "-b", cir.toString())
                .redirectErrorStream(true).redirectOutput(out.toFile()).start();
        assertTrue(p.waitFor(60, TimeUnit.SECONDS), "ngspice finished");
        Map<String, double[]> values = new HashMap<>();
        Matcher m = MEAS.matcher(Files.readString(out));
        while (m.find()) {
            double at = m.group(3) == null ? Double.NaN : Double.parseDouble(m.group(3));
            values.put(m.group(1), new double[] {Double.parseDouble(m.group(2)), at});
        }
        return values;
    }

    private static double[][] readWrdata(Path file) throws IOException {
        List<String> lines = Files.readAllLines(file).stream().filter(l -> !l.isBlank()).toList();
        double[] t = new double[lines.size()];
        double[] v = new double[lines.size()];
        for (int i = 0; i < lines.size(); i++) {
            String[] f = lines.get(i).trim().split("\\s+");
            t[i] = Double.parseDouble(f[0]);
            v[i] = Double.parseDouble(f[1]);
        }
        return new double[][] {t, v};
    }
}
