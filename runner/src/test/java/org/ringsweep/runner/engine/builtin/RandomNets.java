package org.ringsweep.runner.engine.builtin;

import java.util.Locale;
import java.util.Random;

/**
 * Random board nets in the net file format (formats.md), built the way boards are: a ramp
 * driver (or the demo board's IBIS io33 buffer, examples/demo-board/parts/kx32.ibs), line segments with board-range impedances and delays, CMOS receivers with optional
 * clamps, and one of the usual terminations. Values come from a seed so a failing case can be
 * rebuilt.
 */
final class RandomNets {
    /** How the receivers hang on the driver. */
    enum Topology { POINT_TO_POINT, TEE, DAISY_CHAIN, OPEN_STUB }

    /** The termination at the (first) far-end receiver, or at the driver for SERIES. */
    enum Termination { NONE, SERIES, PARALLEL_GND, PARALLEL_VTT, THEVENIN, RC }

    /** The demo board's IBIS file (the tests run in the runner folder). */
    private static final String IBIS_FILE = java.nio.file.Path.of("..", "examples", "demo-board", "parts", "kx32.ibs")
            .toAbsolutePath().normalize().toString();

    private RandomNets() {
    }

    /**
     * A net file's text.
     *
     * @param topology    the receivers' arrangement
     * @param termination the termination
     * @param clamps      whether receivers have clamp diodes to their rails
     * @param lossy       whether one segment has series (and shunt) loss
     * @param ibis        whether the driver is the IBIS io33 buffer (3.3 V) instead of a ramp
     * @param seed        drives every value
     */
    static String yaml(Topology topology, Termination termination, boolean clamps, boolean lossy, boolean ibis, long seed) {
        Random r = new Random(seed);
        double vdd = new double[] {1.8, 2.5, 3.3}[r.nextInt(3)];
        double rise = pick(r, 0.3, 2.0);
        double rOut = pick(r, 5, 45);
        if (ibis) {
            vdd = 3.3; // the io33 buffer's typical supply ([Voltage Range] of kx32.ibs)
        }
        StringBuilder y = new StringBuilder();
        y.append("format: ringsweep/net-1\nnet: RANDOM_").append(Long.toHexString(seed)).append('\n');
        y.append("rails: { VDD: ").append(num(vdd)).append(", VTT: ").append(num(vdd / 2)).append(" }\n");
        if (ibis) {
            y.append("drivers:\n  - { pin: U1.1, model: ibis, file: \"").append(IBIS_FILE).append("\", ibis_model: io33 }\n");
        } else {
            y.append("drivers:\n  - { pin: U1.1, model: ramp, v_high: VDD, rise: ").append(num(rise)).append("ns, r_out: ")
                    .append(num(rOut)).append(" }\n");
        }
        String[] rx = topology == Topology.POINT_TO_POINT ? new String[] {"U2.1"} : new String[] {"U2.1", "U3.1"};
        y.append("receivers:\n");
        for (String p : rx) {
            y.append("  - { pin: ").append(p).append(", model: cmos, c_in: ").append(num(pick(r, 1, 8))).append("pF, vih: ")
                    .append(num(0.65 * vdd)).append(", vil: ").append(num(0.35 * vdd))
                    .append(clamps ? ", clamp: rails, supply: VDD" : "").append(" }\n");
        }
        double z0 = Math.round(pick(r, 40, 75));
        StringBuilder seg = new StringBuilder("segments:\n");
        StringBuilder parts = new StringBuilder("parts:\n");
        String start = "U1.1";
        if (termination == Termination.SERIES) {
            parts.append("  - { ref: RS, kind: resistor, value: ").append(num(Math.max(0, z0 - rOut))).append(", between: [RS.1, RS.2] }\n");
            segment(seg, r, "U1.1", "RS.1", z0, 0.02 + 0.05 * r.nextDouble(), false);
            start = "RS.2";
        }
        int lossyIndex = lossy ? r.nextInt(2) : -1;
        switch (topology) {
            case POINT_TO_POINT -> segment(seg, r, start, "U2.1", z0, pick(r, 0.1, 1.5), lossyIndex >= 0);
            case TEE -> {
                segment(seg, r, start, "J1", z0, pick(r, 0.1, 1.0), lossyIndex == 0);
                segment(seg, r, "J1", "U2.1", z0, pick(r, 0.1, 0.8), lossyIndex == 1);
                segment(seg, r, "J1", "U3.1", z0, pick(r, 0.1, 0.8), false);
            }
            case DAISY_CHAIN -> {
                segment(seg, r, start, "U3.1", z0, pick(r, 0.1, 1.0), lossyIndex == 0);
                segment(seg, r, "U3.1", "U2.1", z0, pick(r, 0.1, 0.8), lossyIndex == 1);
            }
            case OPEN_STUB -> {
                segment(seg, r, start, "J1", z0, pick(r, 0.1, 1.0), lossyIndex == 0);
                segment(seg, r, "J1", "U2.1", z0, pick(r, 0.1, 0.8), lossyIndex == 1);
                segment(seg, r, "J1", "U3.1", z0, pick(r, 0.05, 0.3), false);
                segment(seg, r, "J1", "J2", z0, pick(r, 0.05, 0.4), false); // the open stub
            }
        }
        String far = "U2.1";
        switch (termination) {
            case PARALLEL_GND -> parts.append("  - { ref: RT, kind: resistor, value: ").append(num(z0)).append(", between: [")
                    .append(far).append(", GND] }\n");
            case PARALLEL_VTT -> parts.append("  - { ref: RT, kind: resistor, value: ").append(num(z0)).append(", between: [")
                    .append(far).append(", VTT] }\n");
            case THEVENIN -> {
                parts.append("  - { ref: RT1, kind: resistor, value: ").append(num(2 * z0)).append(", between: [").append(far).append(", VDD] }\n");
                parts.append("  - { ref: RT2, kind: resistor, value: ").append(num(2 * z0)).append(", between: [").append(far).append(", GND] }\n");
            }
            case RC -> {
                parts.append("  - { ref: RT, kind: resistor, value: ").append(num(z0)).append(", between: [").append(far).append(", RC1] }\n");
                parts.append("  - { ref: CT, kind: capacitor, value: ").append(num(pick(r, 20, 200))).append("pF, between: [RC1, GND] }\n");
            }
            default -> {
            }
        }
        y.append(seg);
        if (parts.length() > "parts:\n".length()) {
            y.append(parts);
        }
        y.append("stimulus: { edges: [rise, fall], settle: 12ns }\n");
        return y.toString();
    }

    private static void segment(StringBuilder seg, Random r, String from, String to, double z0, double delayNs, boolean lossy) {
        seg.append("  - { from: ").append(from).append(", to: ").append(to).append(", z0: ").append(num(z0));
        if (lossy) {
            // length from the delay at er_eff 3.4 (c = 299 792 458 m/s): delay = length·√er_eff / c.
            double length = delayNs * 1e-9 * 299_792_458.0 / Math.sqrt(3.4);
            seg.append(", length: ").append(num(length * 1000)).append("mm, er_eff: 3.4, r_per_m: ").append(num(pick(r, 2, 30)));
        } else {
            seg.append(", delay: ").append(num(delayNs * 1000)).append("ps");
        }
        seg.append(" }\n");
    }

    private static double pick(Random r, double lo, double hi) {
        return lo + (hi - lo) * r.nextDouble();
    }

    private static String num(double v) {
        return new java.math.BigDecimal(String.format(Locale.ROOT, "%.4g", v)).stripTrailingZeros().toPlainString();
    }
}
