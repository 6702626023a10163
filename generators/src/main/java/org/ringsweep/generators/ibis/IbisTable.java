package org.ringsweep.generators.ibis;

import java.util.Arrays;

/**
 * A table with one abscissa column and typ/min/max ordinate columns: a V–I table (volts,
 * amperes; current positive into the buffer pin) or a V–t waveform (seconds, volts). A min or max
 * entry written {@code NA} takes the row's typ value.
 *
 * @param x   the abscissa, strictly increasing
 * @param typ the typical column
 * @param min the minimum column
 * @param max the maximum column
 */
public record IbisTable(double[] x, double[] typ, double[] min, double[] max) {
    /** Validates (equal lengths, at least two rows, x strictly increasing, all finite) and copies. */
    public IbisTable {
        int n = x.length;
        if (n < 2 || typ.length != n || min.length != n || max.length != n) {
            throw new IllegalArgumentException("a table needs at least two rows and equal columns");
        }
        x = x.clone();
        typ = typ.clone();
        min = min.clone();
        max = max.clone();
        for (int i = 0; i < n; i++) {
            if (!Double.isFinite(x[i]) || !Double.isFinite(typ[i])) {
                throw new IllegalArgumentException("table row " + (i + 1) + " needs finite x and typ values");
            }
            min[i] = Double.isNaN(min[i]) ? typ[i] : min[i];
            max[i] = Double.isNaN(max[i]) ? typ[i] : max[i];
            if (i > 0 && !(x[i] > x[i - 1])) {
                throw new IllegalArgumentException("table x values must increase strictly");
            }
        }
    }

    /** A copy of the abscissa. */
    @Override
    public double[] x() {
        return x.clone();
    }

    /** A copy of the typ column. */
    @Override
    public double[] typ() {
        return typ.clone();
    }

    /** A copy of the min column. */
    @Override
    public double[] min() {
        return min.clone();
    }

    /** A copy of the max column. */
    @Override
    public double[] max() {
        return max.clone();
    }

    /** A copy of one corner's column. */
    public double[] column(IbisCorner corner) {
        return switch (corner) {
            case TYP -> typ.clone();
            case MIN -> min.clone();
            case MAX -> max.clone();
        };
    }

    /** The number of rows. */
    public int size() {
        return x.length;
    }

    /**
     * The corner's value at {@code at}: linear between rows, held at the first and last row
     * outside the table.
     */
    public double valueAt(IbisCorner corner, double at) {
        double[] y = corner == IbisCorner.TYP ? typ : corner == IbisCorner.MIN ? min : max;
        if (at <= x[0]) {
            return y[0];
        }
        int n = x.length;
        if (at >= x[n - 1]) {
            return y[n - 1];
        }
        int i = Arrays.binarySearch(x, at);
        if (i >= 0) {
            return y[i];
        }
        int hi = -i - 1;
        int lo = hi - 1;
        return y[lo] + (y[hi] - y[lo]) * (at - x[lo]) / (x[hi] - x[lo]);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof IbisTable t && Arrays.equals(t.x, x) && Arrays.equals(t.typ, typ)
                && Arrays.equals(t.min, min) && Arrays.equals(t.max, max);
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(x) * 31 + Arrays.hashCode(typ);
    }

    @Override
    public String toString() {
        return "IbisTable[" + x.length + " rows, x " + x[0] + " .. " + x[x.length - 1] + "]";
    }
}
