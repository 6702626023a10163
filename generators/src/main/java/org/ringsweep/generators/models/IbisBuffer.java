package org.ringsweep.generators.models;

import org.ringsweep.generators.ibis.IbisCorner;
import org.ringsweep.generators.ibis.IbisModel;
import org.ringsweep.generators.ibis.IbisTable;

/**
 * The V–I tables of one IBIS model in one column, as currents into the pin against the die-pad
 * voltage (impedance-and-standards.md §7: currents into the pin; the pull-up and POWER clamp
 * tables Vcc-relative, the pull-down and GND clamp tables ground-relative). A missing table
 * carries no current.
 */
final class IbisBuffer {
    final IbisModel model;
    final IbisCorner corner;
    /** Pull-up reference (V). */
    final double vcc;
    /** Pull-down reference (V). */
    final double vgnd;
    /** {@code C_comp} (F). */
    final double cComp;

    IbisBuffer(IbisModel model, IbisCorner corner) {
        this.model = model;
        this.corner = corner;
        this.vcc = model.pullupReference(corner);
        this.vgnd = model.pulldownReference(corner);
        this.cComp = model.cComp().get(corner);
    }

    /** Pull-down current into the pin at pad voltage v (A), unscaled. */
    double pulldown(double v) {
        return model.pulldown() == null ? 0 : model.pulldown().valueAt(corner, v - vgnd);
    }

    /** Pull-up current into the pin at pad voltage v (A), unscaled. */
    double pullup(double v) {
        return model.pullup() == null ? 0 : model.pullup().valueAt(corner, vcc - v);
    }

    /** Clamp currents into the pin at pad voltage v (A). */
    double clamps(double v) {
        double i = 0;
        IbisTable gc = model.gndClamp();
        IbisTable pc = model.powerClamp();
        if (gc != null) {
            i += gc.valueAt(corner, v - model.gndClampReference(corner));
        }
        if (pc != null) {
            i += pc.valueAt(corner, model.powerClampReference(corner) - v);
        }
        return i;
    }

    /** The DC pad voltage with the pull-up on ({@code high}) or the pull-down on, into rLoad to vFix. */
    double level(boolean high, double rLoad, double vFix) {
        // Pad current into the buffer plus the load current rises with the pad voltage: bisect.
        double span = Math.max(1, vcc - vgnd);
        double lo = Math.min(vgnd, vFix) - 2 * span;
        double hi = Math.max(vcc, vFix) + 2 * span;
        for (int i = 0; i < 200; i++) {
            double mid = (lo + hi) / 2;
            double f = (high ? pullup(mid) : pulldown(mid)) + clamps(mid) + (mid - vFix) / rLoad;
            if (f > 0) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return (lo + hi) / 2;
    }
}
