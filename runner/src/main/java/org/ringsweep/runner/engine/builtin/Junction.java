package org.ringsweep.runner.engine.builtin;

import org.ringsweep.api.circuit.DiodeModel;

/**
 * The SPICE level-1 junction (Shockley equation) and its Newton–Raphson voltage limiting
 * ({@code pnjlim} of SPICE3). Pure functions; thread-safe.
 */
final class Junction {
    /** Thermal voltage kT/q at the SPICE nominal temperature 27 °C (300.15 K), in volts. */
    static final double THERMAL_VOLTAGE = 1.380649e-23 * 300.15 / 1.602176634e-19;
    /** Conductance in parallel with every junction (S), SPICE's default {@code gmin}. */
    static final double GMIN = 1e-12;

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
}
