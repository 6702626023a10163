package org.ringsweep.runner.engine.builtin;

/**
 * Dense LU factorisation with partial (row) pivoting, in place, for the small systems of a board
 * net (tens of unknowns). One instance holds one factorisation and its scratch space; it is
 * reused for many right-hand sides while the matrix stays the same. A board net's matrix is
 * sparse (each node touches two or three others), and so mostly are its factors: after each
 * factorisation the non-zeros of L and U are listed row by row, and a solve visits only those.
 * Not thread-safe: each solve owns its instances.
 */
final class DenseLu {
    /** A pivot below this (relative to the largest entry of the matrix) means a singular matrix. */
    private static final double SINGULAR_PIVOT = 1e-14;

    private final int n;
    private final double[] lu;
    private final int[] perm;
    private final double[] scratch;
    /** Row-compressed non-zeros of L (below the diagonal) and U (above it), and the reciprocals of U's diagonal (a solve multiplies). */
    private final int[] lStart;
    private final int[] uStart;
    private int[] cols;
    private double[] vals;
    private final double[] inverseDiag;

    DenseLu(int n) {
        this.n = n;
        this.lu = new double[n * n];
        this.perm = new int[n];
        this.scratch = new double[n];
        this.lStart = new int[n + 1];
        this.uStart = new int[n + 1];
        this.cols = new int[4 * n];
        this.vals = new double[4 * n];
        this.inverseDiag = new double[n];
    }

    /**
     * Factors {@code a} (row-major, n × n; left unchanged).
     *
     * @return the index of the first unknown found without a usable pivot, or −1 when the matrix is regular
     */
    int factor(double[] a) {
        System.arraycopy(a, 0, lu, 0, n * n);
        double scale = 0;
        for (double v : a) {
            scale = Math.max(scale, Math.abs(v));
        }
        double tiny = SINGULAR_PIVOT * Math.max(scale, Double.MIN_NORMAL);
        for (int i = 0; i < n; i++) {
            perm[i] = i;
        }
        for (int k = 0; k < n; k++) {
            int p = k;
            double best = Math.abs(lu[k * n + k]);
            for (int i = k + 1; i < n; i++) {
                double v = Math.abs(lu[i * n + k]);
                if (v > best) {
                    best = v;
                    p = i;
                }
            }
            if (best <= tiny) {
                return perm[k];
            }
            if (p != k) {
                swapRows(p, k);
            }
            double pivot = lu[k * n + k];
            for (int i = k + 1; i < n; i++) {
                int row = i * n;
                double f = lu[row + k];
                if (f == 0) {
                    continue;
                }
                f /= pivot;
                lu[row + k] = f;
                int krow = k * n;
                for (int j = k + 1; j < n; j++) {
                    lu[row + j] -= f * lu[krow + j];
                }
            }
        }
        compress();
        return -1;
    }

    /** Lists the factors' non-zeros: for row i, L's at [lStart[i], uStart[i]), U's at [uStart[i], lStart[i+1]). */
    private void compress() {
        int count = 0;
        for (double v : lu) {
            if (v != 0) {
                count++;
            }
        }
        if (cols.length < count) {
            cols = new int[count];
            vals = new double[count];
        }
        int k = 0;
        for (int i = 0; i < n; i++) {
            int row = i * n;
            lStart[i] = k;
            for (int j = 0; j < i; j++) {
                if (lu[row + j] != 0) {
                    cols[k] = j;
                    vals[k++] = lu[row + j];
                }
            }
            uStart[i] = k;
            for (int j = i + 1; j < n; j++) {
                if (lu[row + j] != 0) {
                    cols[k] = j;
                    vals[k++] = lu[row + j];
                }
            }
            inverseDiag[i] = 1 / lu[row + i];
        }
        lStart[n] = k;
    }

    /** Solves A·x = b with the last factorisation; {@code b} is overwritten with x. */
    void solve(double[] b) {
        for (int i = 0; i < n; i++) {
            scratch[i] = b[perm[i]];
        }
        for (int i = 0; i < n; i++) {
            double s = scratch[i];
            for (int k = lStart[i], end = uStart[i]; k < end; k++) {
                s -= vals[k] * scratch[cols[k]];
            }
            scratch[i] = s;
        }
        for (int i = n - 1; i >= 0; i--) {
            double s = scratch[i];
            for (int k = uStart[i], end = lStart[i + 1]; k < end; k++) {
                s -= vals[k] * scratch[cols[k]];
            }
            scratch[i] = s * inverseDiag[i];
        }
        System.arraycopy(scratch, 0, b, 0, n);
    }

    private void swapRows(int p, int k) {
        swapRows(lu, n, p, k);
        int t = perm[p];
        perm[p] = perm[k];
        perm[k] = t;
    }

    /** Swaps rows p and k of the row-major n-column matrix {@code a}. */
    static void swapRows(double[] a, int n, int p, int k) {
        for (int j = 0; j < n; j++) {
            double t = a[p * n + j];
            a[p * n + j] = a[k * n + j];
            a[k * n + j] = t;
        }
    }
}
