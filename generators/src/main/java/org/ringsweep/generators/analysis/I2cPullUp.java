package org.ringsweep.generators.analysis;

import java.util.Objects;

/**
 * The I²C-bus pull-up resistor window of NXP UM10204 (Rev. 6) §7.1, as reproduced in
 * {@code lines-and-terminations.md} §7:
 * <ul>
 * <li>{@code R_p(max) = t_r / (0.8473·C_b)} (Eq. 1): the pull-up must charge the bus capacitance
 *     C_b from 0.3·VDD to 0.7·VDD within the mode's maximum rise time t_r; an RC charge takes
 *     {@code ln(7/3)·R·C = 0.8473·R·C} for that.</li>
 * <li>{@code R_p(min) = (VDD − V_OL(max)) / I_OL} (Eq. 2): with the pull-up alone the driver must
 *     still sink the current to stay at or below {@code V_OL(max)}, 0.4 V, or 0.2·VDD when
 *     VDD ≤ 2 V.</li>
 * </ul>
 * Mode limits (UM10204 Table 10): Standard-mode t_r 1000 ns, I_OL 3 mA, C_b 400 pF; Fast-mode
 * 300 ns, 3 mA, 400 pF; Fast-mode Plus 120 ns, 20 mA, 550 pF. Pure arithmetic; thread-safe.
 */
public final class I2cPullUp {
    /** {@code ln(7/3) = 0.8473}: the 30 %→70 % rise of an RC charge in units of RC. */
    public static final double RISE_30_70_PER_RC = Math.log(7.0 / 3.0);
    /** V_OL(max) above 2 V supply (V). */
    public static final double V_OL_MAX = 0.4;
    /** The supply at or below which V_OL(max) is 0.2·VDD instead of 0.4 V (V). */
    public static final double LOW_VOLTAGE_VDD = 2.0;

    private I2cPullUp() {
    }

    /** An I²C-bus speed mode with its UM10204 Table 10 limits. */
    public enum Mode {
        /** Standard-mode, 100 kHz. */
        STANDARD("Standard-mode", "standard", 1000e-9, 3e-3, 400e-12),
        /** Fast-mode, 400 kHz. */
        FAST("Fast-mode", "fast", 300e-9, 3e-3, 400e-12),
        /** Fast-mode Plus, 1 MHz. */
        FAST_PLUS("Fast-mode Plus", "fast-plus", 120e-9, 20e-3, 550e-12);

        private final String displayName;
        private final String word;
        private final double riseMaxS;
        private final double sinkCurrentA;
        private final double busCapacitanceMaxF;

        Mode(String displayName, String word, double riseMaxS, double sinkCurrentA, double busCapacitanceMaxF) {
            this.displayName = displayName;
            this.word = word;
            this.riseMaxS = riseMaxS;
            this.sinkCurrentA = sinkCurrentA;
            this.busCapacitanceMaxF = busCapacitanceMaxF;
        }

        /** The specification's name, e.g. {@code Fast-mode Plus}. */
        public String displayName() {
            return displayName;
        }

        /** The word used in net files ({@code i2c_mode: fast-plus}). */
        public String word() {
            return word;
        }

        /** The maximum rise time t_r, 30 % to 70 % of VDD (s). */
        public double riseMaxS() {
            return riseMaxS;
        }

        /** The sink current I_OL the driver must manage at V_OL(max) (A). */
        public double sinkCurrentA() {
            return sinkCurrentA;
        }

        /** The maximum bus capacitance C_b (F). */
        public double busCapacitanceMaxF() {
            return busCapacitanceMaxF;
        }
    }

    /**
     * The window of one mode.
     *
     * @param mode            the mode
     * @param vdd             the pull-up supply (V)
     * @param busCapacitanceF the bus capacitance C_b (F)
     * @param rMinOhm         R_p(min) (ohm)
     * @param rMaxOhm         R_p(max) (ohm)
     */
    public record Window(Mode mode, double vdd, double busCapacitanceF, double rMinOhm, double rMaxOhm) {
        /** Validates. */
        public Window {
            Objects.requireNonNull(mode, "mode");
        }

        /** Whether any resistor fits: {@code R_p(min) ≤ R_p(max)}. */
        public boolean feasible() {
            return rMinOhm <= rMaxOhm;
        }

        /** Whether a pull-up of {@code ohms} lies inside the window (ends included). */
        public boolean contains(double ohms) {
            return ohms >= rMinOhm && ohms <= rMaxOhm;
        }

        /**
         * Whether the bus capacitance is within the mode's limit, allowing 1 ppm so that a sum of
         * capacitances landing on the limit up to rounding is not flagged.
         */
        public boolean capacitanceWithinLimit() {
            return busCapacitanceF <= mode.busCapacitanceMaxF() * (1 + 1e-6);
        }
    }

    /** V_OL(max) for a supply (V): 0.4 V, or 0.2·VDD when VDD ≤ 2 V. */
    public static double vOlMax(double vdd) {
        return vdd <= LOW_VOLTAGE_VDD ? 0.2 * vdd : V_OL_MAX;
    }

    /**
     * {@code R_p(max) = t_r / (0.8473·C_b)} (ohm).
     *
     * @param busCapacitanceF C_b (F), positive
     */
    public static double rMax(Mode mode, double busCapacitanceF) {
        if (!(busCapacitanceF > 0) || !Double.isFinite(busCapacitanceF)) {
            throw new IllegalArgumentException("bus capacitance must be positive and finite, found " + busCapacitanceF + " F");
        }
        return mode.riseMaxS() / (RISE_30_70_PER_RC * busCapacitanceF);
    }

    /**
     * {@code R_p(min) = (VDD − V_OL(max)) / I_OL} (ohm).
     *
     * @param vdd the pull-up supply (V), above V_OL(max)
     */
    public static double rMin(Mode mode, double vdd) {
        double vol = vOlMax(vdd);
        if (!(vdd > vol) || !Double.isFinite(vdd)) {
            throw new IllegalArgumentException("the pull-up supply must be above V_OL(max) " + vol + " V, found " + vdd + " V");
        }
        return (vdd - vol) / mode.sinkCurrentA();
    }

    /** The window of a mode for a supply (V) and bus capacitance (F). */
    public static Window window(Mode mode, double vdd, double busCapacitanceF) {
        return new Window(mode, vdd, busCapacitanceF, rMin(mode, vdd), rMax(mode, busCapacitanceF));
    }
}
