package org.ringsweep.generators.models;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.function.Consumer;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.generators.ibis.IbisRamp;
import org.ringsweep.generators.ibis.IbisTable;
import org.ringsweep.generators.ibis.IbisWaveform;

/**
 * The switching coefficients of one edge of an IBIS buffer: the pull-up and pull-down scale
 * factors {@code ku(t)}, {@code kd(t)} that multiply the {@code [Pullup]} and {@code [Pulldown]}
 * currents, from the start of the edge.
 *
 * <p><b>From {@code [Rising Waveform]}/{@code [Falling Waveform]}</b> (preferred when present):
 * KCL at the die pad for a waveform {@code V(t)} into its fixture ({@code R_fixture} to
 * {@code V_fixture}) reads
 * {@code ku·Ipu(Vcc − V) + kd·Ipd(V) + Iclamp(V) + C·dV/dt + (V − V_fixture)/R_fixture = 0},
 * with {@code C = C_comp + C_fixture + C_dut}. Two waveforms of the same edge into different
 * fixtures give two such equations at every instant, linear in ku and kd: solved as a 2×2 system
 * (the usual "two-equation" method). With one waveform, {@code kd = 1 − ku} (the complementary
 * stage hands over exactly as the other takes over) leaves one unknown (the "one-equation"
 * method). Of several waveforms the two with the lowest and the highest {@code V_fixture} are used.
 * {@code L_fixture}, {@code R_dut} and {@code L_dut} are ignored (a warning says so when they are
 * non-zero); the capacitances are taken at the pad, which is exact when those three are zero.
 *
 * <p>Time base: both waveforms of an edge share the file's time axis. The quiet lead-in before
 * any of them leaves its first value by 1 % of its swing is removed (the edge starts when the
 * buffer starts to move, as for {@code [Ramp]}; the buffer's own input-to-output delay is not
 * modelled), and the flat tail once all are within 0.2 % of their last values is dropped but for
 * its last row (the coefficients then hold their settled values). The coefficients are solved at
 * the rows of the tables in that span, resampled to at most {@link #MAX_POINTS} evenly spaced
 * instants, {@code dV/dt} by
 * central differences, and clamped to [{@link #K_MIN}, {@link #K_MAX}] (a warning when that moves
 * a value by more than 0.05). The full transition reported to the host is twice the time from
 * the start to the 50 % crossing of the waveform into the opposite rail's fixture, so the host's
 * source 50 % point is that waveform's.
 *
 * <p>A waveform that cannot be used (it does not move, moves the wrong way, or disagrees with the
 * V–I tables so the solved stage does not turn fully on) gives a warning and the edge falls back
 * to {@code [Ramp]}.
 *
 * <p><b>From {@code [Ramp]}</b>: {@code kd = 1 − ku}; ku moves between 0 and 1 over the 0–100 %
 * time of the equivalent linear ramp, {@code dt/0.6} (lines-and-terminations.md §6), its shape
 * solved at {@link #RAMP_STEPS} steps so that the buffer driving {@code R_load} (to GND for the
 * rising edge, to the pull-up reference for the falling edge — common practice) with
 * {@code C_comp} follows that straight ramp between its two DC levels.
 *
 * @param times     instants from the start of the edge (s), strictly increasing, the first 0
 * @param ku        pull-up factor at each instant
 * @param kd        pull-down factor at each instant
 * @param fullTime  the full transition time reported to the host (s), positive
 * @param leadIn    the quiet lead-in removed from the waveforms' time axis (s): instant 0 is
 *                  this time of the tables; 0 for {@code [Ramp]}
 * @param fromTable true when solved from waveform tables, false from {@code [Ramp]}
 */
record IbisSwitching(double[] times, double[] ku, double[] kd, double fullTime, double leadIn, boolean fromTable) {
    /** Steps of the solved ramp shape per edge. */
    static final int RAMP_STEPS = 40;
    /** Most instants per edge solved from waveforms. */
    static final int MAX_POINTS = 100;
    /** Lowest coefficient kept (a stage cannot push current against its own table). */
    static final double K_MIN = 0;
    /** Highest coefficient kept. */
    static final double K_MAX = 1.5;

    /** Copies the arrays. */
    IbisSwitching {
        times = times.clone();
        ku = ku.clone();
        kd = kd.clone();
    }

    /**
     * The coefficients of one edge: from the waveforms when usable, else from {@code [Ramp]}.
     *
     * @param warn receives one line per problem worth telling the user
     * @throws ModelParameterException when neither waveforms nor {@code [Ramp]} can time the edge
     */
    static IbisSwitching of(IbisBuffer b, boolean rising, Consumer<String> warn) {
        Optional<IbisSwitching> table = fromWaveforms(b, rising, warn);
        if (table.isPresent()) {
            return table.get();
        }
        if (b.model.ramp() == null) {
            throw new ModelParameterException("file", "IBIS model `" + b.model.name() + "` has no [Ramp] and no usable "
                    + keyword(rising) + "; expected one to time its edges");
        }
        return fromRamp(b, rising);
    }

    private static String keyword(boolean rising) {
        return rising ? "[Rising Waveform]" : "[Falling Waveform]";
    }

    /** The ramp-based coefficients (see the class comment). */
    static IbisSwitching fromRamp(IbisBuffer b, boolean rising) {
        IbisRamp ramp = b.model.ramp();
        double rLoad = ramp.rLoad();
        double vFix = rising ? 0 : b.vcc;
        double vStart = b.level(!rising, rLoad, vFix);
        double vEnd = b.level(rising, rLoad, vFix);
        double full = ramp.fullTime(rising, b.corner);
        double slope = (vEnd - vStart) / full;
        double[] t = new double[RAMP_STEPS + 1];
        double[] ku = new double[RAMP_STEPS + 1];
        double[] kd = new double[RAMP_STEPS + 1];
        for (int i = 0; i <= RAMP_STEPS; i++) {
            double v = vStart + (vEnd - vStart) * i / RAMP_STEPS;
            double off = rising ? b.pulldown(v) : b.pullup(v);
            double on = rising ? b.pullup(v) : b.pulldown(v);
            double load = (v - vFix) / rLoad + b.cComp * slope;
            double denominator = on - off;
            // At each instant KCL at the pad is linear in the factor of the stage turning on.
            double k = Math.abs(denominator) > 1e-12 ? -(off + b.clamps(v) + load) / denominator : (double) i / RAMP_STEPS;
            k = i == 0 ? 0 : i == RAMP_STEPS ? 1 : Math.max(0, Math.min(1, k));
            t[i] = full * i / RAMP_STEPS;
            ku[i] = rising ? k : 1 - k;
            kd[i] = 1 - ku[i];
        }
        return new IbisSwitching(t, ku, kd, full, 0, false);
    }

    /** One waveform in the chosen column with its fixture. */
    private record Wave(IbisWaveform w, IbisTable table, double[] v, double vFixture, double rFixture, double cPad) {
        double at(IbisBuffer b, double t) {
            return table.valueAt(b.corner, t);
        }
    }

    /**
     * The waveform-based coefficients (see the class comment), or empty with a warning when the
     * edge has waveforms that cannot be used; empty without one when it has none.
     */
    static Optional<IbisSwitching> fromWaveforms(IbisBuffer b, boolean rising, Consumer<String> warn) {
        List<IbisWaveform> given = rising ? b.model.rising() : b.model.falling();
        if (given.isEmpty()) {
            return Optional.empty();
        }
        String what = "IBIS model `" + b.model.name() + "` " + keyword(rising) + " (" + b.corner.word() + " column)";
        String fallback = b.model.ramp() == null ? "" : "; using [Ramp] for this edge";
        if (b.model.pullup() == null && b.model.pulldown() == null) {
            warn.accept(what + ": the model has neither [Pullup] nor [Pulldown] to scale" + fallback);
            return Optional.empty();
        }
        List<Wave> waves = chosen(b, given);
        for (Wave w : waves) {
            IbisWaveform f = w.w();
            if (nonZero(f.lFixture()) || nonZero(f.rDut()) || nonZero(f.lDut())) {
                warn.accept(what + " at line " + f.line() + ": L_fixture, R_dut and L_dut are ignored (the fixture is taken as "
                        + "R_fixture to V_fixture with C_fixture and C_dut at the pad)");
            }
            double first = w.v()[0];
            double last = w.v()[w.v().length - 1];
            double moved = last - first;
            if (Math.abs(moved) < 0.01 * Math.max(1e-3, b.vcc - b.vgnd) || (moved > 0) != rising) {
                warn.accept(what + " at line " + f.line() + ": the waveform " + (Math.abs(moved) < 0.01 * (b.vcc - b.vgnd)
                        ? "does not move" : "moves the wrong way") + " (from `" + first + "` V to `" + last + "` V)" + fallback);
                return Optional.empty();
            }
        }
        double[] grid = span(b, waves);
        if (grid.length < 2) {
            warn.accept(what + ": too few rows while the waveform moves" + fallback);
            return Optional.empty();
        }
        boolean two = waves.size() == 2;
        double[][] k = two ? solveTwo(b, waves, grid) : null;
        if (two && k == null) {
            warn.accept(what + ": the two fixtures give nearly the same equations (the 2×2 system is singular); "
                    + "using the one-equation method on the waveform at line " + reference(waves, rising).w().line());
        }
        if (k == null) {
            k = solveOne(b, reference(waves, rising), grid);
        }
        double[] ku = k[0];
        double[] kd = k[1];
        int n = grid.length;
        double[] on = rising ? ku : kd;
        double[] off = rising ? kd : ku;
        if (Math.abs(on[n - 1] - 1) > 0.3 || Math.abs(off[n - 1]) > 0.3 || Math.abs(on[0]) > 0.3 || Math.abs(off[0] - 1) > 0.3) {
            warn.accept(what + ": the waveforms disagree with the V–I tables (the stage turning on goes from `" + round(on[0])
                    + "` to `" + round(on[n - 1]) + "`, the other from `" + round(off[0]) + "` to `" + round(off[n - 1])
                    + "`; expected about 0 to 1 and 1 to 0)" + fallback);
            if (b.model.ramp() != null) {
                return Optional.empty();
            }
        }
        double clamped = 0;
        for (int i = 0; i < n; i++) {
            double u = Math.max(K_MIN, Math.min(K_MAX, ku[i]));
            double d = Math.max(K_MIN, Math.min(K_MAX, kd[i]));
            clamped = Math.max(clamped, Math.max(Math.abs(u - ku[i]), Math.abs(d - kd[i])));
            ku[i] = u;
            kd[i] = d;
        }
        if (clamped > 0.05) {
            warn.accept(what + ": solved switching coefficients were clamped to [" + K_MIN + ", " + K_MAX + "] (by up to `"
                    + round(clamped) + "`); the waveforms and V–I tables are not fully consistent");
        }
        double t50 = crossing(b, reference(waves, rising), grid[0]);
        double full = 2 * (t50 - grid[0]);
        if (!(full > 0)) {
            warn.accept(what + ": no 50 % crossing after the start of the edge" + fallback);
            return Optional.empty();
        }
        double[] times = new double[n];
        for (int i = 0; i < n; i++) {
            times[i] = grid[i] - grid[0];
        }
        return Optional.of(new IbisSwitching(times, ku, kd, full, grid[0], true));
    }

    private static boolean nonZero(double v) {
        return Double.isFinite(v) && v != 0;
    }

    private static double round(double v) {
        return Math.round(v * 1000) / 1000.0;
    }

    /** One waveform, or the two with the lowest and highest V_fixture when they differ in their fixture. */
    private static List<Wave> chosen(IbisBuffer b, List<IbisWaveform> given) {
        List<Wave> all = new ArrayList<>();
        for (IbisWaveform w : given) {
            double cPad = b.cComp + (Double.isFinite(w.cFixture()) ? w.cFixture() : 0) + (Double.isFinite(w.cDut()) ? w.cDut() : 0);
            all.add(new Wave(w, w.table(), w.table().column(b.corner), w.vFixture().get(b.corner), w.rFixture(), cPad));
        }
        Wave low = all.stream().min(Comparator.comparingDouble(Wave::vFixture)).orElseThrow();
        Wave high = all.stream().max(Comparator.comparingDouble(Wave::vFixture)).orElseThrow();
        if (low == high || (low.vFixture() == high.vFixture() && low.rFixture() == high.rFixture())) {
            return List.of(all.get(0));
        }
        return List.of(low, high);
    }

    /** The waveform into the opposite rail's fixture: lowest V_fixture when rising, highest when falling. */
    private static Wave reference(List<Wave> waves, boolean rising) {
        return rising ? waves.get(0) : waves.get(waves.size() - 1);
    }

    /** The instants to solve at: the rows of the moving span, at most MAX_POINTS evenly spaced. */
    private static double[] span(IbisBuffer b, List<Wave> waves) {
        double[] all = waves.stream().flatMapToDouble(w -> Arrays.stream(w.table().x())).sorted().distinct().toArray();
        int n = all.length;
        int firstMove = n;
        int lastMove = -1;
        for (int i = 0; i < n; i++) {
            for (Wave w : waves) {
                double first = w.v()[0];
                double last = w.v()[w.v().length - 1];
                double swing = Math.abs(last - first);
                double v = w.at(b, all[i]);
                if (Math.abs(v - first) > 0.01 * swing) {
                    firstMove = Math.min(firstMove, i);
                }
                if (Math.abs(v - last) > 0.002 * swing) {
                    lastMove = Math.max(lastMove, i);
                }
            }
        }
        if (firstMove == n || lastMove < 0) {
            return new double[0];
        }
        double t0 = all[Math.max(0, firstMove - 1)];
        double tEnd = all[Math.min(n - 1, lastMove + 1)];
        double[] rows = Arrays.stream(all).filter(t -> t >= t0 && t <= tEnd).toArray();
        if (rows.length > MAX_POINTS - 1) {
            rows = new double[MAX_POINTS - 1];
            for (int i = 0; i < rows.length; i++) {
                rows[i] = t0 + (tEnd - t0) * i / (rows.length - 1);
            }
        }
        // The last row too, so the coefficients end (and hold) at the settled levels.
        if (tEnd < all[n - 1]) {
            rows = Arrays.copyOf(rows, rows.length + 1);
            rows[rows.length - 1] = all[n - 1];
        }
        return rows;
    }

    /** dV/dt of a waveform at grid point i, by central differences over the neighbouring instants. */
    private static double slope(IbisBuffer b, Wave w, double[] grid, int i) {
        int n = grid.length;
        double before = i > 0 ? grid[i] - grid[i - 1] : grid[1] - grid[0];
        double after = i < n - 1 ? grid[i + 1] - grid[i] : grid[n - 1] - grid[n - 2];
        return (w.at(b, grid[i] + after) - w.at(b, grid[i] - before)) / (before + after);
    }

    /** What the pull-up and pull-down must together sink for KCL at the pad: −(clamps + C·dV/dt + fixture). */
    private static double rest(IbisBuffer b, Wave w, double[] grid, int i) {
        double v = w.at(b, grid[i]);
        return -(b.clamps(v) + w.cPad() * slope(b, w, grid, i) + (v - w.vFixture()) / w.rFixture());
    }

    /** The 2×2 solution at every instant, or null when the system is singular at a quarter of them or more. */
    private static double[][] solveTwo(IbisBuffer b, List<Wave> waves, double[] grid) {
        int n = grid.length;
        double[] ku = new double[n];
        double[] kd = new double[n];
        Wave a = waves.get(0);
        Wave c = waves.get(1);
        int singular = 0;
        for (int i = 0; i < n; i++) {
            double va = a.at(b, grid[i]);
            double vc = c.at(b, grid[i]);
            double pua = b.pullup(va);
            double pda = b.pulldown(va);
            double puc = b.pullup(vc);
            double pdc = b.pulldown(vc);
            double ra = rest(b, a, grid, i);
            double rc = rest(b, c, grid, i);
            double det = pua * pdc - pda * puc;
            double size = Math.abs(pua * pdc) + Math.abs(pda * puc);
            if (size == 0 || Math.abs(det) < 1e-6 * size) {
                singular++;
                ku[i] = i > 0 ? ku[i - 1] : Double.NaN;
                kd[i] = i > 0 ? kd[i - 1] : Double.NaN;
                continue;
            }
            // Cramer's rule on [pua pda; puc pdc]·[ku; kd] = [ra; rc]
            ku[i] = (ra * pdc - pda * rc) / det;
            kd[i] = (pua * rc - ra * puc) / det;
        }
        if (singular * 4 >= n || Double.isNaN(ku[0])) {
            return null;
        }
        return new double[][] {ku, kd};
    }

    /** The one-equation solution with kd = 1 − ku. */
    private static double[][] solveOne(IbisBuffer b, Wave w, double[] grid) {
        int n = grid.length;
        double[] ku = new double[n];
        double[] kd = new double[n];
        for (int i = 0; i < n; i++) {
            double v = w.at(b, grid[i]);
            double pu = b.pullup(v);
            double pd = b.pulldown(v);
            // ku·pu + (1 − ku)·pd = rest
            double denominator = pu - pd;
            double scale = Math.abs(pu) + Math.abs(pd);
            ku[i] = scale > 0 && Math.abs(denominator) > 1e-9 * scale ? (rest(b, w, grid, i) - pd) / denominator
                    : i > 0 ? ku[i - 1] : 0;
            kd[i] = 1 - ku[i];
        }
        return new double[][] {ku, kd};
    }

    /** The first time at or after {@code from} that the waveform crosses half-way between its first and last values. */
    private static double crossing(IbisBuffer b, Wave w, double from) {
        double[] x = w.table().x();
        double half = (w.v()[0] + w.v()[w.v().length - 1]) / 2;
        double prevT = from;
        double prevV = w.at(b, from);
        for (double t : x) {
            if (t <= from) {
                continue;
            }
            double v = w.at(b, t);
            if ((prevV - half) * (v - half) <= 0 && v != prevV) {
                return prevT + (t - prevT) * (half - prevV) / (v - prevV);
            }
            prevT = t;
            prevV = v;
        }
        return Double.NaN;
    }
}
