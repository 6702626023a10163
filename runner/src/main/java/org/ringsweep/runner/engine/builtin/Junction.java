package org.ringsweep.runner.engine.builtin;

import org.ringsweep.api.circuit.DiodeModel;

/**
 * The SPICE level-1 junction (Shockley equation), its depletion charge and its Newton–Raphson
 * voltage limiting ({@code pnjlim} of SPICE3). Pure functions; thread-safe.
 */
final class Junction {
    /** Thermal voltage kT/q at the SPICE nominal temperature 27 °C (300.15 K), in volts. */
    static final double THERMAL_VOLTAGE = 1.380649e-23 * 300.15 / 1.602176634e-19;
    /** Conductance in parallel with every junction (S), SPICE's default {@code gmin}. */
    static final double GMIN = 1e-12;

    /** Junction potential VJ (V): the SPICE diode model's default, which the deck leaves in force. */
    static final double VJ = 1.0;
    /** Grading coefficient M: the SPICE default. */
    static final double M = 0.5;
    /** Forward-bias depletion coefficient FC: the SPICE default. */
    static final double FC = 0.5;
    private static final double F1 = VJ * (1 - Math.pow(1 - FC, 1 - M)) / (1 - M);
    private static final double F2 = Math.pow(1 - FC, 1 + M);
    private static final double F3 = 1 - FC * (1 + M);

    private Junction() {
    }

    /** n·Vt of a model (V). */
    static double nvt(DiodeModel m) {
        return m.n() * THERMAL_VOLTAGE;
    }

    /** The critical voltage above which Newton steps are limited: {@code nVt·ln(nVt/(√2·IS))} (V). */
    static double criticalVoltage(DiodeModel m) {
        double nvt = nvt(m);
        return nvt * Math.log(nvt / (Math.sqrt(2) * m.is()));
    }

    /** Junction current (A) at voltage {@code vd}, gmin included. */
    static double current(DiodeModel m, double vd) {
        double nvt = nvt(m);
        if (vd >= -5 * nvt) {
            return m.is() * (Math.exp(vd / nvt) - 1) + GMIN * vd;
        }
        return -m.is() + GMIN * vd; // deep reverse bias: saturated, as SPICE's level-1 diode
    }

    /** Junction conductance dI/dV (S) at {@code vd}, gmin included. */
    static double conductance(DiodeModel m, double vd) {
        double nvt = nvt(m);
        if (vd >= -5 * nvt) {
            return m.is() / nvt * Math.exp(vd / nvt) + GMIN;
        }
        return GMIN;
    }

    /**
     * {@link #conductance(DiodeModel, double)} from the current at the same voltage, without a
     * second exponential: {@code IS·e^(V/nVt) = I − gmin·V + IS} in the exponential region.
     */
    static double conductance(DiodeModel m, double vd, double current) {
        double nvt = nvt(m);
        if (vd >= -5 * nvt) {
            return (current - GMIN * vd + m.is()) / nvt + GMIN;
        }
        return GMIN;
    }

    /**
     * SPICE3 {@code pnjlim}: limits a new junction voltage so the exponential cannot overflow or
     * oscillate, stepping logarithmically above the critical voltage.
     *
     * @param vnew  the voltage Newton proposes (V)
     * @param vold  the voltage of the previous iteration (V)
     * @param nvt   n·Vt (V)
     * @param vcrit the critical voltage (V)
     * @return the voltage to use; equal to {@code vnew} when no limiting was needed
     */
    static double limit(double vnew, double vold, double nvt, double vcrit) {
        if (vnew > vcrit && Math.abs(vnew - vold) > 2 * nvt) {
            if (vold > 0) {
                double arg = 1 + (vnew - vold) / nvt;
                return arg > 0 ? vold + nvt * Math.log(arg) : vcrit;
            }
            return nvt * Math.log(vnew / nvt);
        }
        return vnew;
    }

    /**
     * Depletion charge (C) stored at junction voltage {@code vd}, the SPICE formulation: the
     * integral of {@code Cj = CJO/(1 − V/VJ)^M} below {@code FC·VJ}, of its linear continuation
     * {@code CJO/F2·(F3 + M·V/VJ)} above, with F2 = (1−FC)^(1+M), F3 = 1 − FC·(1+M).
     */
    static double charge(DiodeModel m, double vd) {
        double cjo = m.cjo();
        if (vd < FC * VJ) {
            double arg = 1 - vd / VJ;
            return VJ * cjo * (1 - arg * Math.pow(arg, -M)) / (1 - M);
        }
        double fcv = FC * VJ;
        return cjo * (F1 + (F3 * (vd - fcv) + M / (2 * VJ) * (vd * vd - fcv * fcv)) / F2);
    }

    /** Depletion capacitance dQ/dV (F) at junction voltage {@code vd} (see {@link #charge}). */
    static double capacitance(DiodeModel m, double vd) {
        if (vd < FC * VJ) {
            return m.cjo() * Math.pow(1 - vd / VJ, -M);
        }
        return m.cjo() / F2 * (F3 + M * vd / VJ);
    }
}
