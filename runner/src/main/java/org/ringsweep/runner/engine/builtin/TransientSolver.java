package org.ringsweep.runner.engine.builtin;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.circuit.DiodeModel;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.Transient;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.runner.engine.FailureKind;

/**
 * One transient solve of a {@link Netlist}: the DC operating point, then fixed-step
 * trapezoidal integration with backward-Euler steps at the start and after every source
 * breakpoint. Used once, by one thread.
 *
 * <h2>Method</h2>
 * <ul>
 * <li>Modified nodal analysis; companion models: a capacitor is a conductance {@code 2C/h}
 *     (trapezoidal) or {@code C/h} (backward Euler) beside a history current; an inductor keeps its
 *     branch current as an unknown with {@code v − (2L/h)·i = −v_n − (2L/h)·i_n} (or
 *     {@code v − (L/h)·i = −(L/h)·i_n}).</li>
 * <li>A lossless line is two Norton equivalents (method of characteristics, Bergeron):
 *     {@code i1(t) = v1(t)/Z0 − [v2(t−TD)/Z0 + i2(t−TD)]} and the same with the ports swapped,
 *     the delayed values interpolated linearly in the stored history: the delay is exact, not
 *     rounded to the step. A step longer than the delay (the error control's choice on a line
 *     shorter than the edges need) takes the waves that left the other port during the step as
 *     linear over it, which makes the line a two-port over that step ({@code lineTheta}). At DC
 *     a line is a direct connection of its ports.</li>
 * <li>Base step {@code h = min(maxStep, shortest delay / 2)}, so every delayed value lies
 *     at least one step in the accepted past; breakpoints (PWL corners, timed-resistor corners, table-scale corners,
 *     the stop time) are hit exactly, a step that would end within 1 % of a step before one is
 *     stretched to it. With the engine's own step choice only the sharp corners and the stop
 *     time are hit: the corners of a sampled smooth curve are integrated through ({@code hitFrom}).</li>
 * <li>Step control: after each trapezoidal step the local truncation error is estimated from
 *     the difference to the quadratic through the last three points (Milne's device); above
 *     {@value #LTE_RELATIVE} of the largest source voltage the step is redone smaller, and after
 *     an accepted step the next one grows while the estimate allows. The new step is the usual
 *     {@code h·0.9·(tolerance/estimate)^(1/3)} (the error grows as h³), rounded down to a level of
 *     {@code h·2^(−k/4)}: quarter octaves, so that few distinct steps occur and their
 *     factorisations can be kept; at most one octave up per step, down to h/2^{@value #MAX_HALVINGS}.
 *     When the analysis's step is the elaborator's automatic one
 *     ({@link Transient#stepAuto()}), the step may also grow beyond h in the same way (not
 *     within {@value #CALM_STEPS} steps of a rejection, and back to h at a sharp corner), up to
 *     the ceilings of {@code lineCeiling} and {@code edgeCeiling}: the elaborator's rule is a resolution rule for
 *     ngspice, while this engine's own error control guards the accuracy; a user's explicit step
 *     is honoured as the largest step. An edge keeps {@value #EDGE_POINTS} steps or more: while a
 *     source changes the step stays under that fraction of its transition, and while none does
 *     (an edge arriving through a line) a longer step that moves a node by more than that
 *     fraction of the largest source voltage is redone at the edge ceiling; after the error
 *     estimate rejects a step beyond the edge ceiling, {@value #EDGE_HOLD_STEPS} steps stay under it.
 *     An IBIS table's first linearisation at a step is where its last two points say its
 *     voltage is heading ({@code predictRatio}). The last {@value #FACTOR_CACHE} factorisations (fewer for a large matrix) are kept
 *     by rule, step and conductances, so switching between step sizes does not re-factor each time.</li>
 * <li>At rest (no node moving by more than {@value #REST_FRACTION} of the tolerance per step for
 *     a whole longest line delay) and with every source, timed resistor and table scale constant
 *     until the next breakpoint, one step goes towards that breakpoint, beyond the line bound (the
 *     lines' histories are flat), as far as the last drift allows ({@code noteRest}); only with
 *     the engine's own step choice.</li>
 * <li>{@value #DAMPED_STEPS} backward-Euler steps at t = 0 and after each sharp breakpoint (the
 *     slope changing by more than {@value #SHARP_CORNER} of itself: a ramp's start or end, not
 *     the points of a finely sampled curve) damp the trapezoidal rule's numerical ringing at a
 *     corner of a source.</li>
 * <li>Table-driven current sources ({@link Primitive.TableCurrent}, the IBIS V–I tables): a
 *     voltage-controlled current source linearised at the iterate, {@code g = s(t)·dy/dv} of the
 *     table segment holding the controlling voltage, {@code Ieq = s(t)·y(v) − g·v}. For the first
 *     {@value #TABLE_FREE_ITERATIONS} iterations the controlling voltage goes wherever Newton puts
 *     it; after them an iteration stops on the next table point and continues with the slope
 *     beyond it (the slope is discontinuous at table points, and two segments could otherwise
 *     send the iterate back and forth). The scale's corner times are breakpoints. Tables take
 *     part in the DC operating point at their t = 0 scale.</li>
 * <li>Diode junction capacitance (CJO &gt; 0): the SPICE depletion charge
 *     ({@link Junction#charge}), integrated with the step's rule from the charge
 *     ({@code i = (q − qₙ)/h}, or {@code 2(q − qₙ)/h − iₙ}), linearised with {@code Cj(v)·(1 or 2)/h}.</li>
 * <li>A table's conductance changes at every step of an edge (its scale moves); the factored
 *     matrix keeps the one it was factored with and each solve adds the difference exactly as a
 *     low-rank update (Sherman–Morrison–Woodbury, see {@code solveWithTables}), so tables never
 *     make the solver re-factor.</li>
 * <li>Diodes: Newton–Raphson with SPICE's {@code pnjlim} limiting. The factored matrix is reused
 *     while each diode's conductance stays within {@value #CHORD_RELATIVE} (relative) plus
 *     {@value #CHORD_ABSOLUTE} S of the factored one (a chord iteration; its right-hand side
 *     uses the true junction current, so its fixed point is the exact solution). A point is
 *     accepted when no voltage was limited, the solution moved within {@code reltol}/{@code vntol}
 *     of the previous iterate (not asked of the first) and every linearised diode current matches
 *     the Shockley current at the new voltages (SPICE's current test). Without diodes
 *     one solve per step; the factorisation is reused until the step, the integration rule or a
 *     timed resistor's value changes (by more than {@value #TIMED_CHORD} of itself). The solve
 *     visits only the factors' non-zeros ({@code DenseLu}); a line's history keeps only its
 *     last delay ({@code LineHistory}).</li>
 * </ul>
 */
final class TransientSolver {
    /** Backward-Euler steps after t = 0 and after every sharp breakpoint. */
    static final int DAMPED_STEPS = 2;
    /** Newton iterations per time point before the solve gives up. */
    static final int MAX_NEWTON = 150;
    /** Relative tolerance of Newton convergence (SPICE {@code reltol}). */
    static final double RELTOL = 1e-3;
    /** Absolute voltage tolerance of Newton convergence (V; SPICE {@code vntol}). */
    static final double VNTOL = 1e-6;
    /** Absolute current tolerance of Newton convergence (A; SPICE {@code abstol}). */
    static final double ABSTOL = 1e-12;
    /** Conductance from every node to ground (S), so a node reached only through capacitors has a DC solution. */
    static final double NODE_GMIN = 1e-12;
    /** Relative change of a diode's conductance that makes the solver re-factor. */
    static final double CHORD_RELATIVE = 0.05;
    /** Absolute change of a diode's conductance that makes the solver re-factor (S). */
    static final double CHORD_ABSOLUTE = 1e-6;
    /**
     * Newton iterations in which a table's controlling voltage may jump to wherever Newton puts
     * it; after them each iteration may only reach the next table point, so the iterate cannot
     * swing between two segments whose slopes each send it into the other.
     */
    static final int TABLE_FREE_ITERATIONS = 8;
    /** Relative slope change that makes a source corner sharp (a restart of the damped steps). */
    static final double SHARP_CORNER = 0.5;
    /**
     * Relative change of a timed resistor's conductance below which the factored value is kept
     * (a current error under 1e-6 of the resistor's, far inside {@code reltol}).
     */
    static final double TIMED_CHORD = 1e-6;
    /**
     * The largest step as a fraction of the shortest line delay: every delayed value a line needs
     * then lies at least one step in the accepted past. (Up to one delay would do for that, but
     * the history's linear interpolation then rounds off what a lossy line's short sections
     * pass on: 1 % of the swing on a 241 mm lossy line, which no truncation-error estimate sees.)
     */
    static final double LINE_STEP = 0.5;
    /**
     * The step the truncation-error control may grow to on a net of lossless lines only, in
     * shortest delays: a step longer than a line's delay makes that line a two-port over the step
     * ({@code lineTheta}); the error estimate, not this bound, limits the step on the demo nets.
     * Kept under {@link #IMPLICIT_LINE_LIMIT}, also after a step is stretched by up to 1 % onto a breakpoint.
     */
    static final double LOSSLESS_CEILING = 2;
    /**
     * The longest step, in line delays, that treats the line as a two-port over the step (see
     * {@code lineTheta}); a longer one is only the step at rest, over a flat history.
     */
    static final double IMPLICIT_LINE_LIMIT = 3;
    /**
     * Solves in a row after which a table conductance that differs from the factored one is
     * factored in (see {@code solveWithTables}) instead of updated at every solve.
     */
    static final int REBASE_AFTER = 16;
    /** Relative difference under which a step reuses a kept factorisation's step (see {@code snapToCached}). */
    static final double STEP_SNAP = 1e-6;
    /** Factorisations kept for reuse (rules × step sizes). */
    static final int FACTOR_CACHE = 24;
    /** The kept factorisations hold at most about this many matrix entries in all (16 MB), and at least 6 are kept. */
    static final int FACTOR_CACHE_ENTRIES = 1 << 21;
    /**
     * Local truncation error allowed per trapezoidal step, relative to the largest source voltage:
     * a step whose estimate exceeds it is redone smaller, and the next step is chosen from the
     * estimate by {@code levelsFor}.
     */
    static final double LTE_RELATIVE = 2e-4;
    /** A step moving no node by more than this fraction of the truncation-error tolerance is at rest (see noteRest). */
    static final double REST_FRACTION = 0.01;
    /** Fewest steps across the shortest transition of a source (a ramp) when the step grows. */
    static final double EDGE_POINTS = 10;
    /** Steps held at the edge ceiling after a longer step was rejected for its truncation error (see {@code edgeHold}). */
    static final int EDGE_HOLD_STEPS = 32;
    /**
     * Steps accepted after a rejection before the step may grow beyond the base step again: a
     * step that has just met an edge would otherwise double into it and be redone.
     */
    static final int CALM_STEPS = 2;
    /** The step control doubles the base step at most this many times (when the step is the engine's own choice). */
    static final int MAX_DOUBLINGS = 3;
    /**
     * With the engine's own step choice, a breakpoint up to this many steps ahead is reached in
     * one step (stretched up to the ceiling) rather than a step and a sliver of a step: the
     * sampled IBIS waveforms put a breakpoint every few tens of picoseconds.
     */
    static final double BREAK_STRETCH = 1.3;
    /** The smallest step is the largest one over 2^this. */
    static final int MAX_HALVINGS = 5;
    /** Step levels per octave: the step is the base step times 2^(−level/LEVELS_PER_OCTAVE). */
    static final int LEVELS_PER_OCTAVE = 4;
    /** The growth factor of each level, 2^(i/4) for i = 0 … 4·max(halvings, doublings). */
    private static final double[] LEVEL_FACTOR = new double[LEVELS_PER_OCTAVE * Math.max(MAX_HALVINGS, MAX_DOUBLINGS) + 1];

    static {
        for (int i = 0; i < LEVEL_FACTOR.length; i++) {
            LEVEL_FACTOR[i] = Math.pow(2, (double) i / LEVELS_PER_OCTAVE);
        }
    }
    /** How many steps between two looks at the wall clock. */
    private static final int CLOCK_EVERY = 64;

    private enum Rule { DC, EULER, TRAPEZOID }

    private final Netlist net;
    private final Transient analysis;
    private final long deadlineNanos;
    private final Map<String, String> probes;

    private final int nodes;
    private final int size;
    private final int dcSize;
    private final int[][] res;
    private final double[] resG;
    private final int[][] cap;
    private final double[] capC;
    private final int[][] ind;
    private final double[] indL;
    private final int[][] src;
    private final Primitive[] srcEl;
    private final int[][] tres;
    private final Primitive.TimedResistor[] tresEl;
    private final int[][] line;
    private final double[] lineG;
    private final double[] lineTd;
    private final int[][] dio;
    private final DiodeModel[] dioM;
    private final double[] dioNvt;
    private final double[] dioCrit;
    private final boolean[] dioCap;
    private final int[][] tab;
    private final PwlTable[] tabY;
    /** The scale of each table in time, or null for a constant 1. */
    private final PwlTable[] tabK;

    // State of the last accepted point.
    private double[] x;
    private final double[] capV;
    private final double[] capI;
    private final double[] indV;
    private final double[] indJ;
    private final LineHistory[] history;
    private final double[] dioV;
    /** Depletion charge (C) and its current (A) at the last accepted point, per diode. */
    private final double[] dioQ;
    private final double[] dioIc;
    /** Controlling voltage and its table segment at the last accepted point, per table. */
    private final double[] tabV;
    private final int[] tabSeg;

    // Per-iteration scratch.
    private final double[] dioIter;
    private final double[] dioG;
    private final double[] dioIeq;
    private final double[] lineIh;
    private final double[] trG;
    /** Per source: its DC value, or its PWL table (null for DC) and the segment last used. */
    private final double[] srcDc;
    private final PwlTable[] srcPwl;
    private final int[] srcSeg;
    private final PwlTable[] trTable;
    private final int[] trSeg;
    private final double[] tabIter;
    private final int[] tabIterSeg;
    private final int[] tabKSeg;
    /** Each table's scale at the time point being solved. */
    private final double[] tabS;
    private final double[] tabG;
    private final double[] tabIeq;
    /** The rule and step of the point being solved (the diodes' charge companion depends on them). */
    private Rule rule = Rule.DC;
    private double h;
    private boolean nonlinearChanged;

    // Factorisation cache for the transient system.
    private final double[] matrix;
    /** The volts of each fixed node (Netlist index −2 − f), and the same scaled during DC source stepping. */
    private final double[] fixedVolts;
    private final double[] fixedNow;
    /** Where the assembly under way puts the currents of its entries in fixed nodes' columns (see {@link #add}). */
    private double[] fixedSink;
    /** Per cache entry: the known currents of the fixed nodes with that factorisation's conductances. */
    private final double[][] luFixed;
    /**
     * The last few factorisations, each for a rule, a step and a generation of the conductances
     * that do not depend on the step (timed resistors, linearised diodes and tables): a solve
     * switching between a few step sizes factors each once while those stay the same.
     */
    private final DenseLu[] lus;
    /** How many factorisations are kept: {@value #FACTOR_CACHE}, fewer for a large matrix. */
    private final int cacheSize;
    private final Rule[] luRule;
    private final double[] luH;
    private final long[] luGeneration;
    private final long[] luUsed;
    private DenseLu lu;
    /** The cache entry {@link #lu} is. */
    private int luIndex;
    /**
     * Per cache entry: the table conductances stamped into its factorisation, and (once needed)
     * {@code Z = A⁻¹·U}, column j = the solution for table j's unit current pair (n values per
     * table), for the low-rank update of {@link #solveWithTables}.
     */
    private final double[][] luTabG;
    private final double[][] luZ;
    private final boolean[][] luZReady;
    /** Scratch of the low-rank update: the small k × k system and its right-hand side. */
    private final double[] woodM;
    private final double[] woodR;
    private final double[] tabDelta;
    private final int[] tabActive;
    /** Per table: how many solves in a row its conductance has not changed, and its value at the last solve. */
    private final int[] tabSame;
    private final double[] tabLastG;
    private long generation;
    private long uses;
    private final double[] factoredTrG;
    /** The spare right-hand side / solution vector (swapped with {@link #x}). */
    private double[] spare;
    private final double[] spareColumn;
    private final double[] savedRhs;
    private int factorCount;

    TransientSolver(Circuit circuit, Netlist net, long deadlineNanos) {
        this.net = net;
        this.analysis = circuit.analysis();
        this.deadlineNanos = deadlineNanos;
        this.probes = circuit.probes();
        nodes = net.nodeCount();
        size = net.size();
        dcSize = size + net.lineNodes.size();
        res = net.resistorNodes.toArray(new int[0][]);
        resG = unbox(net.resistorSiemens);
        cap = net.capacitorNodes.toArray(new int[0][]);
        capC = unbox(net.capacitorFarads);
        ind = net.inductors.toArray(new int[0][]);
        indL = unbox(net.inductorHenries);
        src = net.sources.toArray(new int[0][]);
        srcEl = net.sourceElements.toArray(new Primitive[0]);
        tres = net.timedResistorNodes.toArray(new int[0][]);
        tresEl = net.timedResistors.toArray(new Primitive.TimedResistor[0]);
        line = net.lineNodes.toArray(new int[0][]);
        lineG = unbox(net.lineZ0);
        for (int i = 0; i < lineG.length; i++) {
            lineG[i] = 1 / lineG[i];
        }
        lineTd = unbox(net.lineDelay);
        dio = net.diodeNodes.toArray(new int[0][]);
        dioM = net.diodeModels.toArray(new DiodeModel[0]);
        dioNvt = new double[dioM.length];
        dioCrit = new double[dioM.length];
        for (int d = 0; d < dioM.length; d++) {
            dioNvt[d] = Junction.nvt(dioM[d]);
            dioCrit[d] = Junction.criticalVoltage(dioM[d]);
        }
        dioCap = new boolean[dioM.length];
        for (int d = 0; d < dioM.length; d++) {
            dioCap[d] = dioM[d].cjo() > 0;
        }
        tab = net.tableNodes.toArray(new int[0][]);
        tabY = new PwlTable[tab.length];
        tabK = new PwlTable[tab.length];
        for (int k = 0; k < tab.length; k++) {
            Primitive.TableCurrent tc = net.tables.get(k);
            tabY[k] = new PwlTable(tc.x(), tc.y());
            tabK[k] = tc.scaleTimes().length == 0 ? null : new PwlTable(tc.scaleTimes(), tc.scale());
        }
        dioQ = new double[dio.length];
        dioIc = new double[dio.length];
        tabV = new double[tab.length];
        tabVBefore = new double[tab.length];
        tabSeg = new int[tab.length];
        tabIter = new double[tab.length];
        tabIterSeg = new int[tab.length];
        tabKSeg = new int[tab.length];
        tabS = new double[tab.length];
        tabG = new double[tab.length];
        tabIeq = new double[tab.length];
        capV = new double[cap.length];
        capI = new double[cap.length];
        indV = new double[ind.length];
        indJ = new double[ind.length];
        history = new LineHistory[line.length];
        dioV = new double[dio.length];
        dioIter = new double[dio.length];
        dioG = new double[dio.length];
        dioIeq = new double[dio.length];
        lineIh = new double[2 * line.length];
        trG = new double[tres.length];
        srcDc = new double[src.length];
        srcPwl = new PwlTable[src.length];
        srcSeg = new int[src.length];
        for (int k = 0; k < src.length; k++) {
            if (srcEl[k] instanceof Primitive.PwlVoltage pwl) {
                srcPwl[k] = new PwlTable(pwl.times(), pwl.volts());
            } else {
                srcDc[k] = ((Primitive.DcVoltage) srcEl[k]).volts();
            }
        }
        trTable = new PwlTable[tres.length];
        trSeg = new int[tres.length];
        for (int k = 0; k < tres.length; k++) {
            trTable[k] = new PwlTable(tresEl[k].times(), tresEl[k].ohms());
        }
        factoredTrG = new double[tres.length];
        cacheSize = (int) Math.max(6, Math.min(FACTOR_CACHE, FACTOR_CACHE_ENTRIES / ((long) size * size + 1)));
        lus = new DenseLu[cacheSize];
        luRule = new Rule[cacheSize];
        luH = new double[cacheSize];
        luGeneration = new long[cacheSize];
        luUsed = new long[cacheSize];
        luFixed = new double[cacheSize][];
        luTabG = new double[cacheSize][];
        luZ = new double[cacheSize][];
        luZReady = new boolean[cacheSize][];
        for (int i = 0; i < cacheSize; i++) {
            luTabG[i] = new double[tab.length];
            luZ[i] = new double[tab.length * size];
            luZReady[i] = new boolean[tab.length];
        }
        woodM = new double[tab.length * tab.length];
        woodR = new double[tab.length];
        tabDelta = new double[tab.length];
        tabActive = new int[tab.length];
        tabSame = new int[tab.length];
        tabLastG = new double[tab.length];
        matrix = new double[size * size];
        fixedVolts = unbox(net.fixedVolts);
        fixedNow = fixedVolts.clone();
        for (int i = 0; i < cacheSize; i++) {
            luFixed[i] = new double[size];
        }
        Arrays.fill(luGeneration, -1);
        spare = new double[size];
        spareColumn = new double[size];
        savedRhs = new double[size];
    }

    /** The time step the solve uses (s). */
    double step() {
        return Math.min(analysis.maxStep(), LINE_STEP * net.shortestDelay());
    }

    /**
     * The largest step the truncation-error control may grow to (s). The base step when the
     * analysis's step was set explicitly (a user's step is honoured). Otherwise the base step is
     * the elaborator's resolution rule for ngspice (a fraction of the shortest ramp and of every
     * long line's delay), which this engine's own error control need not keep in the flat
     * stretches between edges: the step may double up to {@value #MAX_DOUBLINGS} times, but stays
     * under the line bound ({@value #LOSSLESS_CEILING} shortest delays on a net of lossless lines,
     * a step longer than a delay treating that line as a two-port over the step, see
     * {@code lineTheta}; {@value #LINE_STEP} of the shortest delay with lossy-line sections).
     *
     * @param base the base step (s)
     */
    private double lineCeiling(double base) {
        if (!analysis.stepAuto()) {
            return base;
        }
        double lineBound = (net.hasLossyLine() ? LINE_STEP : LOSSLESS_CEILING) * net.shortestDelay();
        return Math.max(base, Math.min(lineBound, base * (1L << MAX_DOUBLINGS)));
    }

    /**
     * The largest step while a source, timed resistor or table scale is changing (s): the
     * {@link #lineCeiling}, and at most 1/{@value #EDGE_POINTS} of the shortest transition of any
     * of them, so that an edge keeps a resolution of its own whatever the error estimate says.
     * Where every input is constant (an edge arriving through a line, a reflection) the same
     * resolution is asked of the solution instead: a step longer than this that moves any node by
     * more than 1/{@value #EDGE_POINTS} of the largest source voltage is redone at this length
     * (see {@code advance}), so a full-swing edge keeps its ten steps and the ringing tail
     * of a few per cent of the swing does not.
     *
     * @param base the base step (s)
     */
    private double edgeCeiling(double base) {
        double edge = Double.POSITIVE_INFINITY;
        for (Primitive p : srcEl) {
            if (p instanceof Primitive.PwlVoltage v) {
                edge = Math.min(edge, shortestTransition(v.times(), v.volts()));
            }
        }
        for (Primitive.TimedResistor r : tresEl) {
            edge = Math.min(edge, shortestTransition(r.times(), r.ohms()));
        }
        for (Primitive.TableCurrent tc : net.tables) {
            edge = Math.min(edge, shortestTransition(tc.scaleTimes(), tc.scale()));
        }
        return Math.max(base, Math.min(lineCeiling(base), edge / EDGE_POINTS));
    }

    /**
     * The shortest transition of a function of time held outside its points (s): a run of
     * consecutive points over which it keeps changing (a ramp, a sampled switching waveform),
     * from the last point before the change to the first after it; +∞ when it never changes.
     */
    static double shortestTransition(double[] t, double[] v) {
        double shortest = Double.POSITIVE_INFINITY;
        int start = -1;
        for (int i = 1; i <= t.length; i++) {
            boolean changing = i < t.length && v[i] != v[i - 1];
            if (changing && start < 0) {
                start = i - 1;
            } else if (!changing && start >= 0) {
                shortest = Math.min(shortest, t[i - 1] - t[start]);
                start = -1;
            }
        }
        return shortest;
    }

    /** How many times the transient matrix was factored (for the benchmark's notes). */
    int factorCount() {
        return factorCount;
    }

    /** How many steps were redone at half the size for their truncation error. */
    int rejectedSteps() {
        return rejected;
    }

    private int rejected;

    /** How many linear solves the transient took (Newton iterations over all points). */
    int solveCount() {
        return solves;
    }

    private int solves;

    /**
     * Runs the analysis.
     *
     * @return the probes' waveforms on every accepted time point
     * @throws SolveException for a singular matrix, a Newton failure or the timeout
     */
    Waveforms solve() {
        operatingPoint();
        double h = step();
        double stop = analysis.stop();
        double[] breaks = breakpoints(stop, h);
        String[] names = probes.keySet().toArray(new String[0]);
        int[] probeIndex = new int[names.length];
        for (int i = 0; i < names.length; i++) {
            probeIndex[i] = net.indexOf(names[i]);
        }
        int capacity = (int) Math.min(50_000_000L, (long) Math.ceil(stop / h) + breaks.length + 2);
        double[] times = new double[capacity];
        double[][] out = new double[names.length][capacity];
        int count = 0;
        times[count] = 0;
        record(out, probeIndex, count++);

        now = 0;
        damped = DAMPED_STEPS;
        next = 0;
        tiny = 1e-6 * h;
        lteTol = LTE_RELATIVE * referenceVoltage();
        saved = new double[size];
        back1 = new double[nodes];
        back2 = new double[nodes];
        t1 = 0;
        t2 = 0;
        smooth = 1;
        baseStep = h;
        edgeCeiling = edgeCeiling(h);
        lineCeiling = lineCeiling(h);
        ceiling = lineCeiling;
        edgeMove = referenceVoltage() / EDGE_POINTS;
        stretchable = analysis.stepAuto();
        quietSpan = Math.max(net.longestDelay(), 4 * h); // and a few steps, so that the rest is not one step's coincidence
        lowest = 0;
        while (lowest > -LEVELS_PER_OCTAVE * MAX_DOUBLINGS && h * LEVEL_FACTOR[-lowest] < ceiling) {
            lowest--;
        }
        level = 0;
        calm = 0;
        this.breaks = breaks;
        this.stop = stop;
        this.times = times;
        this.out = out;
        this.count = count;
        this.probeIndex = probeIndex;
        while (now < stop - tiny) {
            advance();
        }
        times = this.times;
        out = this.out;
        count = this.count;
        Map<String, double[]> signals = new LinkedHashMap<>();
        double[] axis = Arrays.copyOf(times, count);
        for (int i = 0; i < names.length; i++) {
            double[] values = Arrays.copyOf(out[i], count);
            for (int k = 0; k < count; k++) {
                if (!Double.isFinite(values[k])) {
                    throw new SolveException(FailureKind.CONVERGENCE, "the built-in engine's solution at node `" + names[i]
                            + "` is not finite at t = `" + axis[k] + "` s");
                }
            }
            signals.put(names[i], values);
        }
        return Waveforms.of(axis, signals, false);
    }

    // State of the time loop (one solve), in fields so that one step is a method of its own.
    private double now;
    private int damped;
    private int next;
    private double tiny;
    private double lteTol;
    private double[] saved;
    private double[] back1;
    private double[] back2;
    private double t1;
    private double t2;
    /** Accepted points since the last sharp corner, that one included. */
    private int smooth;
    private double baseStep;
    private double ceiling;
    /** The step ceilings while an input changes and while none does (see {@link #edgeCeiling}). */
    private double edgeCeiling;
    private double lineCeiling;
    /** The most a step longer than the edge ceiling may move a node (V). */
    private double edgeMove;
    /**
     * Steps to go at the edge ceiling after the truncation error rejected a longer step: where the
     * error estimate keeps the step near the edge ceiling anyway (a ringing line), growing
     * beyond it would only be redone.
     */
    private int edgeHold;
    /** Start of the present stretch of rest (see noteRest), NaN when not at rest. */
    private double quietSince = Double.NaN;
    /** How long the solution must have been at rest before a step towards the next breakpoint: the longest line delay (s). */
    private double quietSpan;
    /** The longest such step the last step's drift allows (s). */
    private double quietJump;
    /** Whether a step may be stretched onto a breakpoint beyond 1 % (only with the engine's own step choice). */
    private boolean stretchable;
    /**
     * The step is baseStep·2^(−level/{@value #LEVELS_PER_OCTAVE}): positive levels shorten it for
     * the truncation error, negative ones (only when the step is the engine's own choice) lengthen
     * it up to the ceiling, down to {@code lowest}.
     */
    private int level;
    private int lowest;
    /** Accepted steps since the last rejection. */
    private int calm;
    private double[] breaks;
    private double stop;
    private double[] times;
    private double[][] out;
    private int count;
    private int[] probeIndex;

    /**
     * One attempt at the next time point: accepted (and recorded), or rejected for its
     * truncation error and left to be redone smaller. A method of its own, called every step, so
     * the JIT compiles the per-step work early and whole, not through the time loop's method,
     * which is entered once per solve.
     */
    private void advance() {
        double t = now;
        double h = baseStep;
        while (breaks[next] <= t + tiny) {
            next++;
        }
        int target = stretchable ? hitFrom[next] : next;
        double bp = breaks[target];
        ceiling = flatBefore[next] && edgeHold == 0 ? lineCeiling : edgeCeiling;
        double hTry = level >= 0 ? h / LEVEL_FACTOR[level] : Math.min(ceiling, h * LEVEL_FACTOR[-level]);
        boolean jump = false;
        if (stretchable && t - quietSince >= quietSpan && breaks[next] - t > hTry && flatBefore[next]) {
            // At rest, with nothing changing before the next breakpoint: one step towards it (see quietJump).
            hTry = Math.max(hTry, Math.min(breaks[next] - t, quietJump));
            jump = true;
        }
        // The step is hTry itself, not (t + hTry) − t, which differs from it in the last bits and
        // would miss the factorisation cached for hTry.
        double dt = hTry;
        double tn = t + hTry;
        boolean corner = false;
        if (tn >= bp - 0.01 * hTry || stretchable && bp - t <= BREAK_STRETCH * hTry && bp - t <= ceiling) {
            // On the breakpoint: also when it lies a little beyond the step (then one step, not a
            // step and a sliver; the truncation-error check still judges the longer step).
            tn = bp;
            dt = bp - t;
            corner = sharp[target];
        }
        Rule rule = damped > 0 ? Rule.EULER : Rule.TRAPEZOID;
        if (dt != hTry) {
            dt = snapToCached(dt, rule); // a level's step is the cache's key exactly; only a step onto a breakpoint may be near one
        }
        System.arraycopy(x, 0, saved, 0, size);
        predictRatio = smooth >= 2 && lastStep > 0 ? dt / lastStep : 0;
        solvePoint(rule, dt, tn);
        double ratio = rule == Rule.TRAPEZOID && smooth >= 3 ? truncationError(saved, t, back1, t1, back2, t2, tn) / lteTol : 0;
        int highest = LEVELS_PER_OCTAVE * MAX_HALVINGS;
        if (!jump && dt > edgeCeiling * (1 + STEP_SNAP) && movedBy() > edgeMove) {
            // An edge arrived within a long step: redo it at the edge ceiling (see edgeCeiling).
            int edgeLevel = Math.min(level, 0);
            while (edgeLevel < 0 && h * LEVEL_FACTOR[-edgeLevel] > edgeCeiling) {
                edgeLevel++;
            }
            level = Math.max(level + 1, edgeLevel);
            reject();
            return;
        }
        if (ratio > 1 && level < highest) {
            // Redo the step smaller.
            if (dt > edgeCeiling * (1 + STEP_SNAP)) {
                edgeHold = EDGE_HOLD_STEPS;
            }
            if (!jump) {
                level = Math.min(highest, level + Math.max(1, -levelsFor(ratio)));
            }
            reject();
            return;
        }
        calm++;
        edgeHold = Math.max(0, edgeHold - 1);
        if (corner) {
            level = Math.max(level, 0); // the damped steps after a sharp corner: not beyond the base step
        } else if (ratio < 1) {
            int grown = level - Math.min(LEVELS_PER_OCTAVE, levelsFor(ratio));
            // Back towards the base step at once; beyond it only on a smooth stretch, not just after a rejection.
            int floor = smooth >= 3 && calm > CALM_STEPS ? lowest : Math.min(level, 0);
            level = Math.max(Math.min(level, grown), floor);
        }
        noteRest(corner, t, tn);
        accept(rule, dt, tn);
        lastStep = dt;
        double[] spareBack = back2;
        back2 = back1;
        back1 = spareBack;
        System.arraycopy(saved, 0, back1, 0, nodes);
        t2 = t1;
        t1 = t;
        smooth = corner ? 1 : smooth + 1;
        if (count == times.length) {
            times = Arrays.copyOf(times, count * 2);
            for (int i = 0; i < out.length; i++) {
                out[i] = Arrays.copyOf(out[i], count * 2);
            }
        }
        times[count] = tn;
        record(out, probeIndex, count++);
        t = tn;
        damped = corner ? DAMPED_STEPS : Math.max(0, damped - 1);
        if (count % CLOCK_EVERY == 0 && System.nanoTime() > deadlineNanos) {
            throw new SolveException(FailureKind.TIMEOUT, "the built-in engine ran out of time at simulated t = `"
                    + t + "` s of `" + stop + "` s");
        }
        now = t;
    }

    /**
     * Solves the time point {@code tn}, a step {@code dt} after the last accepted one, into
     * {@link #x}: the lines' history sources, the timed resistors and table scales at tn, then
     * Newton. Apart from the time loop so the JIT compiles the per-step work after a few solves
     * (it is called every step), not only once the loop's method has been entered hundreds of times.
     */
    private void solvePoint(Rule rule, double dt, double tn) {
        for (int l = 0; l < line.length; l++) {
            double theta = lineTheta(l, dt);
            if (theta == 0) {
                history[l].at(tn - lineTd[l], delayed);
                lineIh[2 * l] = lineG[l] * delayed[2] + delayed[3];
                lineIh[2 * l + 1] = lineG[l] * delayed[0] + delayed[1];
            } else {
                // The step is longer than the delay: the waves leaving each port at tn − TD lie inside
                // the step, linear between the last accepted point and tn (see lineTheta).
                history[l].last(delayed);
                double a1 = delayed[0] + delayed[1] / lineG[l];
                double a2 = delayed[2] + delayed[3] / lineG[l];
                lineIh[2 * l] = lineG[l] * (a2 - theta * a1) / (1 + theta);
                lineIh[2 * l + 1] = lineG[l] * (a1 - theta * a2) / (1 + theta);
            }
        }
        for (int k = 0; k < tres.length; k++) {
            trSeg[k] = trTable[k].segmentOf(tn, trSeg[k]);
            double g = 1 / trTable[k].value(tn, trSeg[k]);
            if (Math.abs(g - trG[k]) > TIMED_CHORD * Math.abs(trG[k])) {
                trG[k] = g; // else the factored value stands: a slow creep need not re-factor every step
            }
        }
        scales(tn);
        if (!newton(rule, dt, tn, 1.0)) {
            throw new SolveException(FailureKind.CONVERGENCE, "the built-in engine's Newton iteration did not converge"
                    + " at t = `" + tn + "` s (" + MAX_NEWTON + " iterations)");
        }
    }

    /**
     * Undoes the step being judged, to be redone at the level just set: nothing of it was
     * accepted (the state moves only in accept), and the solution is not at rest after all
     * (ordinary steps until it is again).
     */
    private void reject() {
        System.arraycopy(saved, 0, x, 0, size);
        quietSince = Double.NaN;
        rejected++;
        calm = 0;
    }

    /** The largest change of a node voltage over the step being judged (V). */
    private double movedBy() {
        double moved = 0;
        for (int i = 0; i < nodes; i++) {
            moved = Math.max(moved, Math.abs(x[i] - saved[i]));
        }
        return moved;
    }

    /**
     * Keeps track of rest: a step over which no node moved by more than
     * {@value #REST_FRACTION} of the truncation-error tolerance continues a stretch of rest (or
     * starts one at its beginning); any other step, or a sharp corner, ends it. At rest for a
     * whole longest line delay, every line's history is flat too, and {@code advance} may take
     * one step towards the next breakpoint when no source, timed resistor or table scale changes
     * before it: the solution then stays where it is, and the step is bounded so that the drift
     * seen in the last step, carried over it, stays under a tenth of the tolerance
     * ({@code quietJump}). The truncation-error check still judges that step; a rejection ends the rest.
     */
    private void noteRest(boolean corner, double t, double tn) {
        double moved = movedBy();
        if (corner || moved > REST_FRACTION * lteTol) {
            quietSince = Double.NaN;
            return;
        }
        if (Double.isNaN(quietSince)) {
            quietSince = t;
        }
        double drift = moved / (tn - t);
        quietJump = drift > 0 ? 0.1 * lteTol / drift : Double.POSITIVE_INFINITY;
    }

    /**
     * Levels (quarter octaves) by which the step may change after a step whose truncation error
     * was {@code ratio} times the tolerance: the largest k with 2^(k/4) ≤ 0.9·ratio^(−1/3)
     * (negative when the step must shrink), at most one octave up for a negligible error.
     */
    static int levelsFor(double ratio) {
        // 2^(k/4) ≤ 0.9·ratio^(−1/3)  ⇔  ratio ≤ 0.729·2^(−3k/4): compared against a table, not
        // computed with cbrt and log at every step.
        int k = LEVELS_PER_OCTAVE;
        while (k > -LEVELS_PER_OCTAVE * MAX_HALVINGS && !(ratio <= LEVEL_RATIO[k + LEVELS_PER_OCTAVE * MAX_HALVINGS])) {
            k--;
        }
        return k;
    }

    /** LEVEL_RATIO[k + 4·MAX_HALVINGS] = 0.729·2^(−3k/4): the largest error ratio that allows a change of k levels. */
    private static final double[] LEVEL_RATIO = new double[LEVELS_PER_OCTAVE * (MAX_HALVINGS + 1) + 1];

    static {
        for (int i = 0; i < LEVEL_RATIO.length; i++) {
            int k = i - LEVELS_PER_OCTAVE * MAX_HALVINGS;
            LEVEL_RATIO[i] = 0.729 * Math.pow(2, -3.0 * k / LEVELS_PER_OCTAVE);
        }
    }

    /** Scratch for a line's delayed values: v1, i1, v2, i2. */
    private final double[] delayed = new double[4];

    private void record(double[][] out, int[] probeIndex, int at) {
        for (int i = 0; i < probeIndex.length; i++) {
            out[i][at] = v(x, probeIndex[i]);
        }
    }

    /**
     * The trapezoidal rule's local truncation error estimate (V) of the step from t0 to tn, the
     * largest over the nodes: the difference between the solution and the quadratic through the
     * last three accepted points (Milne's device), scaled by the ratio of the two methods' error
     * constants, {@code (h³/12) / (h(h+h₁)(h+h₁+h₂)/6 − h³/12)} for the trapezoid's
     * {@code −h³·v‴/12} and the extrapolation's {@code v‴/6·Π(tn − tᵢ)}.
     */
    private double truncationError(double[] x0, double t0, double[] x1, double t1, double[] x2, double t2, double tn) {
        double a = tn - t0;
        double b = tn - t1;
        double c = tn - t2;
        double l0 = b * c / ((t0 - t1) * (t0 - t2));
        double l1 = a * c / ((t1 - t0) * (t1 - t2));
        double l2 = a * b / ((t2 - t0) * (t2 - t1));
        double trap = a * a * a / 12;
        double factor = trap / (a * b * c / 6 - trap);
        double worst = 0;
        for (int i = 0; i < nodes; i++) {
            double predicted = l0 * x0[i] + l1 * x1[i] + l2 * x2[i];
            worst = Math.max(worst, Math.abs(x[i] - predicted));
        }
        return worst * factor;
    }

    /** The largest magnitude of any source voltage (V), at least 1 mV: the scale of the truncation error tolerance. */
    private double referenceVoltage() {
        double v = 1e-3;
        for (Primitive p : srcEl) {
            if (p instanceof Primitive.PwlVoltage pwl) {
                for (double u : pwl.volts()) {
                    v = Math.max(v, Math.abs(u));
                }
            } else {
                v = Math.max(v, Math.abs(((Primitive.DcVoltage) p).volts()));
            }
        }
        for (double u : fixedVolts) {
            v = Math.max(v, Math.abs(u)); // the DC sources that hold fixed nodes
        }
        return v;
    }

    /** Each table's scale at time {@code t}. */
    private void scales(double t) {
        for (int k = 0; k < tab.length; k++) {
            if (tabK[k] == null) {
                tabS[k] = 1;
            } else {
                tabKSeg[k] = tabK[k].segmentOf(t, tabKSeg[k]);
                tabS[k] = tabK[k].value(t, tabKSeg[k]);
            }
        }
    }

    /**
     * PWL, timed-resistor and table-scale corners inside (0, stop), and the stop time; sorted,
     * near-duplicates merged. Fills {@link #sharp}: whether a corner restarts the damped steps.
     */
    private double[] breakpoints(double stop, double h) {
        List<double[]> all = new ArrayList<>();
        for (Primitive p : srcEl) {
            if (p instanceof Primitive.PwlVoltage v) {
                corners(v.times(), v.volts(), all);
            }
        }
        for (Primitive.TimedResistor r : tresEl) {
            corners(r.times(), r.ohms(), all);
        }
        for (Primitive.TableCurrent tc : net.tables) {
            corners(tc.scaleTimes(), tc.scale(), all);
        }
        double merge = 1e-6 * h;
        all.removeIf(c -> !(c[0] > merge && c[0] < stop - merge));
        all.sort((a, b) -> Double.compare(a[0], b[0]));
        double[] out = new double[all.size() + 1];
        sharp = new boolean[all.size() + 1];
        int n = 0;
        for (double[] c : all) {
            if (n == 0 || c[0] - out[n - 1] > merge) {
                out[n++] = c[0];
            }
            sharp[n - 1] |= c[1] != 0;
        }
        out[n++] = stop;
        sharp = Arrays.copyOf(sharp, n);
        out = Arrays.copyOf(out, n);
        flatBefore = flatIntervals(out);
        hitFrom = new int[n];
        for (int j = n - 1; j >= 0; j--) {
            hitFrom[j] = sharp[j] || j == n - 1 ? j : hitFrom[j + 1];
        }
        return out;
    }

    /** Whether each breakpoint restarts the damped steps (see {@link #corners}). */
    private boolean[] sharp;
    /**
     * Whether every PWL source, timed resistor and table scale holds its value over the interval
     * that ends at each breakpoint (a step at rest may then go to it, see {@code noteRest}).
     */
    private boolean[] flatBefore;
    /**
     * Per breakpoint, the first breakpoint from it on that a step must land on when the step is
     * the engine's own choice: a sharp corner or the stop time. The corners of a sampled smooth
     * curve (an IBIS waveform, every few tens of picoseconds) are integrated through, the error
     * control judging each step, instead of each splitting a step in two.
     */
    private int[] hitFrom;

    /**
     * Per breakpoint, whether every input (PWL source, timed resistor, table scale) is constant
     * on the interval before it: each is linear between breakpoints (its corners are
     * breakpoints), so its values at the interval's middle and end decide. Computed once per
     * solve, the times increasing, so each table's segment search continues from the last.
     */
    private boolean[] flatIntervals(double[] breaks) {
        List<PwlTable> inputs = new ArrayList<>();
        for (PwlTable p : srcPwl) {
            if (p != null) {
                inputs.add(p);
            }
        }
        inputs.addAll(Arrays.asList(trTable));
        for (PwlTable p : tabK) {
            if (p != null) {
                inputs.add(p);
            }
        }
        int[] hint = new int[inputs.size()];
        boolean[] flat = new boolean[breaks.length];
        for (int j = 0; j < breaks.length; j++) {
            double mid = 0.5 * ((j == 0 ? 0 : breaks[j - 1]) + breaks[j]);
            flat[j] = true;
            for (int q = 0; q < inputs.size() && flat[j]; q++) {
                PwlTable p = inputs.get(q);
                hint[q] = p.segmentOf(mid, hint[q]);
                double atMid = p.value(mid, hint[q]);
                hint[q] = p.segmentOf(breaks[j], hint[q]);
                flat[j] = atMid == p.value(breaks[j], hint[q]);
            }
        }
        return flat;
    }

    /**
     * Adds the corners of a function of time held outside its points, each as {time, 1 if sharp
     * else 0}. A corner is sharp when the slope changes there by more than
     * {@value #SHARP_CORNER} of the larger of its two slopes (a ramp starting or ending); the
     * corners of a finely sampled smooth curve (an IBIS switching waveform) are hit, but
     * integrated through with the trapezoidal rule, whose accuracy backward-Euler steps at each of
     * them would lose.
     */
    private static void corners(double[] t, double[] v, List<double[]> out) {
        for (int i = 0; i < t.length; i++) {
            double before = i == 0 ? 0 : (v[i] - v[i - 1]) / (t[i] - t[i - 1]);
            double after = i == t.length - 1 ? 0 : (v[i + 1] - v[i]) / (t[i + 1] - t[i]);
            boolean isSharp = Math.abs(after - before) > SHARP_CORNER * Math.max(Math.abs(before), Math.abs(after));
            out.add(new double[] {t[i], isSharp ? 1 : 0});
        }
    }

    // ---------------------------------------------------------------- DC operating point

    /** Solves the DC point at t = 0 (sources at their t = 0 values, capacitors open, inductors and lines short). */
    private void operatingPoint() {
        for (int k = 0; k < tres.length; k++) {
            trG[k] = 1 / tresEl[k].ohmsAt(0);
        }
        double[] a = new double[dcSize * dcSize];
        double[] b = new double[dcSize];
        DenseLu dcLu = new DenseLu(dcSize);
        double[] sol = new double[dcSize];
        scales(0);
        rule = Rule.DC;
        resetIterates();
        boolean ok = dcNewton(a, b, dcLu, sol, 1.0);
        if (!ok) {
            // Source stepping: ramp the sources up from zero, each solution starting the next.
            Arrays.fill(sol, 0);
            resetIterates();
            ok = true;
            for (int s = 1; s <= 20 && ok; s++) {
                ok = dcNewton(a, b, dcLu, sol, s / 20.0);
            }
            if (!ok) {
                throw new SolveException(FailureKind.CONVERGENCE,
                        "the built-in engine found no DC operating point (Newton and source stepping failed)");
            }
        }
        System.arraycopy(fixedVolts, 0, fixedNow, 0, fixedVolts.length);
        x = Arrays.copyOf(sol, size);
        for (int c = 0; c < cap.length; c++) {
            capV[c] = v(x, cap[c][0]) - v(x, cap[c][1]);
            capI[c] = 0;
        }
        for (int k = 0; k < ind.length; k++) {
            indJ[k] = x[ind[k][2]];
            indV[k] = 0;
        }
        for (int l = 0; l < line.length; l++) {
            int[] n = line[l];
            double j = sol[size + l];
            history[l] = new LineHistory(lineTd[l]);
            history[l].add(0, v(x, n[0]) - v(x, n[1]), j, v(x, n[2]) - v(x, n[3]), -j);
        }
        System.arraycopy(dioIter, 0, dioV, 0, dio.length);
        for (int d = 0; d < dio.length; d++) {
            dioG[d] = Junction.conductance(dioM[d], dioV[d]);
            dioQ[d] = dioCap[d] ? Junction.charge(dioM[d], dioV[d]) : 0;
            dioIc[d] = 0;
        }
        acceptTables();
    }

    private void resetIterates() {
        Arrays.fill(dioIter, 0);
        Arrays.fill(tabIter, 0);
        for (int k = 0; k < tab.length; k++) {
            tabIterSeg[k] = tabY[k].segmentOf(0, 0);
        }
    }

    private boolean nonlinear() {
        return dio.length > 0 || tab.length > 0;
    }

    private boolean dcNewton(double[] a, double[] b, DenseLu dcLu, double[] sol, double scale) {
        for (int f = 0; f < fixedVolts.length; f++) {
            fixedNow[f] = scale * fixedVolts[f];
        }
        double[] known = new double[dcSize];
        for (int iter = 0; iter < MAX_NEWTON; iter++) {
            boolean limited = linearise(sol, iter, false);
            Arrays.fill(a, 0);
            fixedSink = known;
            Arrays.fill(known, 0);
            stampLinear(a, dcSize, Rule.DC, 0);
            stampNonlinear(a, dcSize);
            int bad = dcLu.factor(a);
            if (bad >= 0) {
                throw singular(bad, "at the DC operating point");
            }
            Arrays.fill(b, 0);
            stampSources(b, 0, scale);
            stampNonlinearCurrents(b);
            for (int i = 0; i < dcSize; i++) {
                b[i] += known[i];
            }
            dcLu.solve(b);
            boolean converged = !limited && (!nonlinear() || iter > 0) && close(b, sol, dcSize);
            System.arraycopy(b, 0, sol, 0, dcSize);
            if (!nonlinear() || converged) {
                return true;
            }
        }
        return false;
    }

    // ---------------------------------------------------------------- transient point

    private boolean newton(Rule rule, double h, double t, double scale) {
        this.rule = rule;
        this.h = h;
        double[] b = spare;
        for (int iter = 0; iter < MAX_NEWTON; iter++) {
            boolean limited = linearise(x, iter, true);
            factorFor(rule, h, t);
            Arrays.fill(b, 0);
            stampSources(b, t, scale);
            stampHistory(b, rule, h);
            stampNonlinearCurrents(b);
            solveWithTables(b, t);
            solves++;
            boolean converged = !limited && (iter > 0 ? close(b, x, size) : true) && linearisationHolds(b);
            double[] previous = x;
            x = b;
            b = previous;
            spare = previous;
            if (!nonlinear() || converged) {
                return true;
            }
        }
        return false;
    }

    /**
     * A step within {@value #STEP_SNAP} (relative) of one whose factorisation is kept for this
     * rule becomes that one: the steps onto evenly spaced breakpoints differ only by the rounding
     * of the times, and each would otherwise be factored anew (and evict a useful entry). The
     * companion models then use a step that differs from the time axis by that much, far below
     * the truncation-error tolerance.
     */
    private double snapToCached(double dt, Rule rule) {
        for (int i = 0; i < cacheSize; i++) {
            if (luRule[i] == rule && luH[i] != dt && Math.abs(luH[i] - dt) <= STEP_SNAP * dt) {
                return luH[i];
            }
        }
        return dt;
    }

    /** Makes {@link #lu} the factorisation of the transient matrix for this rule and step, from the cache or new. */
    private void factorFor(Rule rule, double h, double t) {
        if (nonlinearChanged || !Arrays.equals(trG, factoredTrG)) {
            generation++;
            System.arraycopy(trG, 0, factoredTrG, 0, trG.length);
        }
        if (lu != null && luGeneration[luIndex] == generation && luRule[luIndex] == rule && luH[luIndex] == h) {
            luUsed[luIndex] = ++uses; // the common case: the same factorisation as the last solve
            return;
        }
        int oldest = 0;
        for (int i = 0; i < cacheSize; i++) {
            if (luGeneration[i] == generation && luRule[i] == rule && luH[i] == h) {
                luUsed[i] = ++uses;
                lu = lus[i];
                luIndex = i;
                return;
            }
            if (luUsed[i] < luUsed[oldest]) {
                oldest = i;
            }
        }
        factorInto(oldest, rule, h, t);
    }

    /** Factors the transient matrix with the present conductances into cache entry {@code slot} and makes it {@link #lu}. */
    private void factorInto(int slot, Rule rule, double h, double t) {
        if (lus[slot] == null) {
            lus[slot] = new DenseLu(size);
        }
        Arrays.fill(matrix, 0);
        fixedSink = luFixed[slot];
        Arrays.fill(fixedSink, 0);
        stampLinear(matrix, size, rule, h);
        stampNonlinear(matrix, size);
        int bad = lus[slot].factor(matrix);
        if (bad >= 0) {
            throw singular(bad, "at t = `" + t + "` s");
        }
        factorCount++;
        luGeneration[slot] = generation;
        luRule[slot] = rule;
        luH[slot] = h;
        luUsed[slot] = ++uses;
        lu = lus[slot];
        luIndex = slot;
        System.arraycopy(tabG, 0, luTabG[slot], 0, tab.length);
        Arrays.fill(luZReady[slot], false);
    }

    /**
     * Solves the transient system with the tables' present conductances, from a factorisation
     * that holds other ones: an IBIS table's conductance {@code s(t)·dy/dv} changes at every step
     * of an edge, and re-factoring for each would dominate the solve. The change is a low-rank
     * update (one VCCS per table: {@code ΔA = Σ Δgⱼ·uⱼ·vⱼᵀ}, {@code uⱼ = e₊ − e₋} the current's
     * nodes, {@code vⱼ = e_cp − e_cm} the controlling ones), so the Sherman–Morrison–Woodbury
     * identity gives the exact solution of the updated system,
     * {@code x = y − Z·(I + D·Vᵀ·Z)⁻¹·D·Vᵀ·y} with {@code y = A⁻¹b}, {@code Z = A⁻¹U},
     * {@code D = diag(Δg)}: one solve plus a k × k system (k tables) instead of a factorisation.
     * Newton's iterates are the same as with a fresh factorisation, up to rounding. When the
     * small system has no usable pivot the matrix is factored with the present conductances.
     */
    private void solveWithTables(double[] b, double t) {
        double[] base = luTabG[luIndex];
        int k = 0; // only the tables whose conductance differs from the factored one take part
        boolean settled = false;
        for (int j = 0; j < tab.length; j++) {
            tabSame[j] = tabG[j] == tabLastG[j] ? tabSame[j] + 1 : 0;
            tabLastG[j] = tabG[j];
            double delta = tabG[j] - base[j];
            if (delta != 0) {
                tabDelta[k] = delta;
                tabActive[k++] = j;
                settled |= tabSame[j] >= REBASE_AFTER;
            }
        }
        if (settled) {
            // A table has kept a conductance other than the factored one for a while (a clamp
            // on a new segment, a driver after its edge): factor it in rather than update every solve.
            factorInto(luIndex, rule, h, t);
            k = 0;
        }
        if (k == 0) {
            addKnown(b, 0);
            lu.solve(b);
            return;
        }
        System.arraycopy(b, 0, savedRhs, 0, size);
        addKnown(b, k);
        lu.solve(b);
        double[] z = luZ[luIndex];
        boolean[] ready = luZReady[luIndex];
        for (int i = 0; i < k; i++) {
            int j = tabActive[i];
            if (!ready[j]) {
                // Z's column for table j, computed once per factorisation when the table first takes part.
                Arrays.fill(spareColumn, 0);
                inject(spareColumn, tab[j][0], tab[j][1], 1); // u = e₊ − e₋: the stamp's rows
                lu.solve(spareColumn);
                System.arraycopy(spareColumn, 0, z, j * size, size);
                ready[j] = true;
            }
        }
        for (int i = 0; i < k; i++) {
            int cp = tab[tabActive[i]][2];
            int cm = tab[tabActive[i]][3];
            woodR[i] = tabDelta[i] * (unknownPart(b, cp) - unknownPart(b, cm));
            for (int j = 0; j < k; j++) {
                int o = tabActive[j] * size;
                woodM[i * k + j] = (i == j ? 1 : 0) + tabDelta[i] * ((cp < 0 ? 0 : z[o + cp]) - (cm < 0 ? 0 : z[o + cm]));
            }
        }
        if (!solveSmall(woodM, woodR, k)) {
            // Rare: re-factor with the present conductances and solve afresh.
            generation++;
            factorFor(rule, h, t);
            System.arraycopy(savedRhs, 0, b, 0, size);
            addKnown(b, 0);
            lu.solve(b);
            return;
        }
        for (int j = 0; j < k; j++) {
            double w = woodR[j];
            if (w != 0) {
                int o = tabActive[j] * size;
                for (int i = 0; i < size; i++) {
                    b[i] -= z[o + i] * w;
                }
            }
        }
    }

    /**
     * Adds the fixed nodes' known currents to the right-hand side: those of the factorisation's
     * conductances, and for each of the first {@code k} active tables (see {@code solveWithTables})
     * those of its conductance change, {@code Δg·(v_cp − v_cm)} over the fixed controlling nodes.
     */
    private void addKnown(double[] b, int k) {
        if (fixedVolts.length == 0) {
            return;
        }
        double[] known = luFixed[luIndex];
        for (int i = 0; i < size; i++) {
            b[i] += known[i];
        }
        for (int i = 0; i < k; i++) {
            int[] p = tab[tabActive[i]];
            double vFixed = fixedPart(p[2]) - fixedPart(p[3]);
            if (vFixed != 0) {
                inject(b, p[1], p[0], tabDelta[i] * vFixed); // the update's entries in fixed columns, moved to the right
            }
        }
    }

    /** Gaussian elimination with partial pivoting of a small k × k system in place; r receives the solution. */
    private static boolean solveSmall(double[] m, double[] r, int k) {
        for (int c = 0; c < k; c++) {
            int p = c;
            for (int i = c + 1; i < k; i++) {
                if (Math.abs(m[i * k + c]) > Math.abs(m[p * k + c])) {
                    p = i;
                }
            }
            if (!(Math.abs(m[p * k + c]) > 1e-12)) {
                return false;
            }
            if (p != c) {
                DenseLu.swapRows(m, k, p, c);
                double tmp = r[p];
                r[p] = r[c];
                r[c] = tmp;
            }
            for (int i = c + 1; i < k; i++) {
                double f = m[i * k + c] / m[c * k + c];
                if (f != 0) {
                    for (int j = c; j < k; j++) {
                        m[i * k + j] -= f * m[c * k + j];
                    }
                    r[i] -= f * r[c];
                }
            }
        }
        for (int c = k - 1; c >= 0; c--) {
            double s = r[c];
            for (int j = c + 1; j < k; j++) {
                s -= m[c * k + j] * r[j];
            }
            r[c] = s / m[c * k + c];
        }
        return true;
    }

    /**
     * Linearises every diode at the voltage of {@code sol} (limited by pnjlim against the last
     * linearisation point) and every table at its controlling voltage (limited to the next table
     * point after {@value #TABLE_FREE_ITERATIONS} iterations); keeps a factored conductance while
     * it is close enough.
     *
     * @return whether any voltage was limited (then the iteration has not converged)
     */
    private boolean linearise(double[] sol, int iter, boolean keepFactored) {
        boolean limited = false;
        nonlinearChanged = false;
        for (int d = 0; d < dio.length; d++) {
            double vd;
            if (iter == 0 && keepFactored) {
                vd = dioV[d];
            } else {
                double proposed = v(sol, dio[d][0]) - v(sol, dio[d][1]);
                vd = iter == 0 ? proposed : Junction.limit(proposed, dioIter[d], dioNvt[d], dioCrit[d]);
                limited |= vd != proposed;
            }
            dioIter[d] = vd;
            double id = Junction.current(dioM[d], vd);
            double g = Junction.conductance(dioM[d], vd, id);
            if (dioCap[d] && rule != Rule.DC) {
                g += (rule == Rule.TRAPEZOID ? 2 : 1) / h * Junction.capacitance(dioM[d], vd);
            }
            if (!keepFactored || Math.abs(g - dioG[d]) > CHORD_ABSOLUTE + CHORD_RELATIVE * Math.abs(dioG[d])) {
                dioG[d] = g;
                nonlinearChanged = true;
            }
            dioIeq[d] = diodeCurrent(d, vd, id) - dioG[d] * vd;
        }
        for (int k = 0; k < tab.length; k++) {
            double vc;
            int seg;
            if (iter == 0 && keepFactored) {
                // Linearised where the last two points say the voltage is heading: on a steady
                // slope it lands on that segment, and the first solve holds (see linearisationHolds).
                vc = tabV[k] + (tabV[k] - tabVBefore[k]) * predictRatio;
                seg = tabY[k].segmentOf(vc, tabSeg[k]);
            } else {
                double proposed = v(sol, tab[k][2]) - v(sol, tab[k][3]);
                seg = tabIterSeg[k];
                vc = proposed;
                if (iter < TABLE_FREE_ITERATIONS) {
                    seg = tabY[k].segmentOf(proposed, seg);
                } else if (proposed > tabY[k].upper(seg)) {
                    // Stop on the next table point, linearised with the slope of the segment beyond it.
                    vc = tabY[k].upper(seg++);
                    limited = true;
                } else if (proposed < tabY[k].lower(seg)) {
                    vc = tabY[k].lower(seg--);
                    limited = true;
                }
            }
            tabIter[k] = vc;
            tabIterSeg[k] = seg;
            double g = tabS[k] * tabY[k].slope(seg);
            if (!keepFactored && g != tabG[k]) {
                nonlinearChanged = true;
            }
            tabG[k] = g; // in a transient step the low-rank update of solveWithTables takes it exactly
            tabIeq[k] = tabS[k] * tabY[k].value(vc, seg) - tabG[k] * vc;
        }
        return limited;
    }

    /**
     * A diode's current (A) at junction voltage {@code vd}: the Shockley current and, with CJO &gt; 0
     * in a transient step, the depletion charge's companion current {@code (q(vd) − qₙ)/h}
     * (backward Euler) or {@code 2(q(vd) − qₙ)/h − iₙ} (trapezoidal): from the charge, so the
     * charge is conserved whatever the capacitance does in between.
     */
    private double diodeCurrent(int d, double vd) {
        return diodeCurrent(d, vd, Junction.current(dioM[d], vd));
    }

    /** {@link #diodeCurrent(int, double)} given the Shockley current {@code junction} at {@code vd}. */
    private double diodeCurrent(int d, double vd, double junction) {
        double i = junction;
        if (dioCap[d] && rule != Rule.DC) {
            double dq = Junction.charge(dioM[d], vd) - dioQ[d];
            i += rule == Rule.TRAPEZOID ? 2 * dq / h - dioIc[d] : dq / h;
        }
        return i;
    }

    /** Each table's controlling voltage at the accepted point before the last. */
    private final double[] tabVBefore;
    /**
     * The step being solved over the last accepted one, by which a table's last change is
     * carried forward for its first linearisation; 0 (no prediction) at the start and just after a sharp corner.
     */
    private double predictRatio;
    private double lastStep;

    private void acceptTables() {
        for (int k = 0; k < tab.length; k++) {
            tabVBefore[k] = tabV[k];
            tabV[k] = v(x, tab[k][2]) - v(x, tab[k][3]);
            tabSeg[k] = tabY[k].segmentOf(tabV[k], tabIterSeg[k]);
            tabIterSeg[k] = tabSeg[k];
        }
    }

    private void accept(Rule rule, double h, double t) {
        for (int c = 0; c < cap.length; c++) {
            double vNew = v(x, cap[c][0]) - v(x, cap[c][1]);
            double geq = (rule == Rule.TRAPEZOID ? 2 : 1) * capC[c] / h;
            capI[c] = rule == Rule.TRAPEZOID ? geq * (vNew - capV[c]) - capI[c] : geq * (vNew - capV[c]);
            capV[c] = vNew;
        }
        for (int k = 0; k < ind.length; k++) {
            indV[k] = v(x, ind[k][0]) - v(x, ind[k][1]);
            indJ[k] = x[ind[k][2]];
        }
        for (int l = 0; l < line.length; l++) {
            int[] n = line[l];
            double v1 = v(x, n[0]) - v(x, n[1]);
            double v2 = v(x, n[2]) - v(x, n[3]);
            double self = lineSelfConductance(l, h);
            double mutual = lineMutualConductance(l, h);
            history[l].add(t, v1, self * v1 + mutual * v2 - lineIh[2 * l], v2, self * v2 + mutual * v1 - lineIh[2 * l + 1]);
        }
        for (int d = 0; d < dio.length; d++) {
            double vd = v(x, dio[d][0]) - v(x, dio[d][1]);
            if (dioCap[d]) {
                double q = Junction.charge(dioM[d], vd);
                double dq = q - dioQ[d];
                dioIc[d] = rule == Rule.TRAPEZOID ? 2 * dq / h - dioIc[d] : dq / h;
                dioQ[d] = q;
            }
            dioV[d] = vd;
        }
        acceptTables();
    }

    // ---------------------------------------------------------------- stamps

    /** The matrix part that does not depend on the diodes. */
    private void stampLinear(double[] a, int n, Rule rule, double h) {
        for (int i = 0; i < nodes; i++) {
            a[i * n + i] += NODE_GMIN;
        }
        for (int r = 0; r < res.length; r++) {
            conductance(a, n, res[r][0], res[r][1], resG[r]);
        }
        for (int k = 0; k < tres.length; k++) {
            conductance(a, n, tres[k][0], tres[k][1], trG[k]);
        }
        if (rule != Rule.DC) {
            for (int c = 0; c < cap.length; c++) {
                conductance(a, n, cap[c][0], cap[c][1], (rule == Rule.TRAPEZOID ? 2 : 1) * capC[c] / h);
            }
        }
        for (int k = 0; k < src.length; k++) {
            branch(a, n, src[k][0], src[k][1], src[k][2]);
        }
        for (int k = 0; k < ind.length; k++) {
            int br = ind[k][2];
            branch(a, n, ind[k][0], ind[k][1], br);
            if (rule != Rule.DC) {
                a[br * n + br] -= (rule == Rule.TRAPEZOID ? 2 : 1) * indL[k] / h;
            }
        }
        for (int l = 0; l < line.length; l++) {
            int[] p = line[l];
            if (rule == Rule.DC) {
                // A 0 V source from port 1's voltage to port 2's: current j into a, out of aRef, out of b, into bRef.
                int br = size + l;
                add(a, n, p[0], br, 1);
                add(a, n, p[1], br, -1);
                add(a, n, p[2], br, -1);
                add(a, n, p[3], br, 1);
                add(a, n, br, p[0], 1);
                add(a, n, br, p[1], -1);
                add(a, n, br, p[2], -1);
                add(a, n, br, p[3], 1);
            } else {
                double self = lineSelfConductance(l, h);
                conductance(a, n, p[0], p[1], self);
                conductance(a, n, p[2], p[3], self);
                double mutual = lineMutualConductance(l, h);
                if (mutual != 0) {
                    transconductance(a, n, p[0], p[1], p[2], p[3], mutual);
                    transconductance(a, n, p[2], p[3], p[0], p[1], mutual);
                }
            }
        }
    }

    private void stampSources(double[] b, double t, double scale) {
        for (int k = 0; k < src.length; k++) {
            double value = srcDc[k];
            if (srcPwl[k] != null) {
                srcSeg[k] = srcPwl[k].segmentOf(t, srcSeg[k]);
                value = srcPwl[k].value(t, srcSeg[k]);
            }
            b[src[k][2]] += scale * value;
        }
    }

    private void stampHistory(double[] b, Rule rule, double h) {
        boolean trap = rule == Rule.TRAPEZOID;
        for (int c = 0; c < cap.length; c++) {
            double geq = (trap ? 2 : 1) * capC[c] / h;
            inject(b, cap[c][0], cap[c][1], geq * capV[c] + (trap ? capI[c] : 0));
        }
        for (int k = 0; k < ind.length; k++) {
            int br = ind[k][2];
            double req = (trap ? 2 : 1) * indL[k] / h;
            b[br] += -req * indJ[k] - (trap ? indV[k] : 0);
        }
        for (int l = 0; l < line.length; l++) {
            int[] p = line[l];
            inject(b, p[0], p[1], lineIh[2 * l]);
            inject(b, p[2], p[3], lineIh[2 * l + 1]);
        }
    }

    /** The linearised diodes' and tables' conductances. */
    private void stampNonlinear(double[] a, int n) {
        for (int d = 0; d < dio.length; d++) {
            conductance(a, n, dio[d][0], dio[d][1], dioG[d]);
        }
        for (int k = 0; k < tab.length; k++) {
            // Current g·(v(cp) − v(cm)) leaving plus and entering minus: a voltage-controlled current source.
            int[] p = tab[k];
            double g = tabG[k];
            add(a, n, p[0], p[2], g);
            add(a, n, p[0], p[3], -g);
            add(a, n, p[1], p[2], -g);
            add(a, n, p[1], p[3], g);
        }
    }

    private void stampNonlinearCurrents(double[] b) {
        for (int d = 0; d < dio.length; d++) {
            inject(b, dio[d][1], dio[d][0], dioIeq[d]);
        }
        for (int k = 0; k < tab.length; k++) {
            inject(b, tab[k][1], tab[k][0], tabIeq[k]);
        }
    }

    /**
     * SPICE's current test: at the new solution's junction voltages, the linearised diode
     * currents equal the true ones within the tolerances. With it a step whose diodes stay in a
     * linear region (reverse-biased clamps) needs one solve, not two.
     */
    private boolean linearisationHolds(double[] sol) {
        for (int d = 0; d < dio.length; d++) {
            double vd = v(sol, dio[d][0]) - v(sol, dio[d][1]);
            double linear = dioG[d] * vd + dioIeq[d];
            double exact = diodeCurrent(d, vd);
            if (!(Math.abs(exact - linear) <= RELTOL * Math.max(Math.abs(exact), Math.abs(linear)) + ABSTOL)) {
                return false;
            }
        }
        for (int k = 0; k < tab.length; k++) {
            double vc = v(sol, tab[k][2]) - v(sol, tab[k][3]);
            int seg = tabIterSeg[k];
            if (vc >= tabY[k].lower(seg) && vc <= tabY[k].upper(seg)) {
                continue; // on the segment it was linearised on: the piecewise-linear table is its linearisation there
            }
            double linear = tabG[k] * vc + tabIeq[k];
            double exact = tabS[k] * tabY[k].value(vc, tabY[k].segmentOf(vc, seg));
            if (!(Math.abs(exact - linear) <= RELTOL * Math.max(Math.abs(exact), Math.abs(linear)) + ABSTOL)) {
                return false;
            }
        }
        return true;
    }

    /** Whether two solutions agree within the Newton tolerances. */
    private boolean close(double[] now, double[] before, int n) {
        for (int i = 0; i < n; i++) {
            double tol = RELTOL * Math.max(Math.abs(now[i]), Math.abs(before[i])) + (i < nodes ? VNTOL : ABSTOL);
            if (!(Math.abs(now[i] - before[i]) <= tol)) {
                return false;
            }
        }
        return true;
    }

    private SolveException singular(int row, String when) {
        return new SolveException(FailureKind.SINGULAR_MATRIX, "the circuit matrix is singular " + when + " near "
                + (row < size ? net.describe(row) : "a transmission line's DC connection")
                + " (a node without a DC path to ground, or a loop of voltage sources, lines and inductors)");
    }

    private void conductance(double[] a, int n, int i, int j, double g) {
        add(a, n, i, i, g);
        add(a, n, j, j, g);
        add(a, n, i, j, -g);
        add(a, n, j, i, -g);
    }

    /** A current {@code g·(v(cp) − v(cm))} into the element at {@code p}, out of it at {@code m} (rows p, m). */
    private void transconductance(double[] a, int n, int p, int m, int cp, int cm, double g) {
        add(a, n, p, cp, g);
        add(a, n, p, cm, -g);
        add(a, n, m, cp, -g);
        add(a, n, m, cm, g);
    }

    /**
     * For a step {@code h} longer than line {@code l}'s delay TD (up to {@value #IMPLICIT_LINE_LIMIT} TD), the
     * fraction θ = (h − TD)/h of the step at which the wave arriving at tn left the other port;
     * 0 for a step within the delay (and for a longer one, which only a step at rest takes, over
     * a flat history). With the outgoing waves {@code a = v + Z0·i} linear over the step,
     * {@code v1 − Z0·i1 = (1 − θ)·a2(t) + θ·a2(tn)} and the same with the ports swapped; solved
     * for the currents, the line is a two-port of self conductance {@code (1 + θ²)/(1 − θ²)/Z0},
     * mutual conductance {@code −2θ/(1 − θ²)/Z0} and history currents
     * {@code (a2(t) − θ·a1(t))/((1 + θ)·Z0)}; at θ = 0 the Bergeron model of the step within the delay.
     */
    private double lineTheta(int l, double h) {
        double td = lineTd[l];
        return h > td && h <= IMPLICIT_LINE_LIMIT * td ? (h - td) / h : 0;
    }

    /** Line {@code l}'s self conductance over a step {@code h}, {@code (1 + θ²)/(1 − θ²)/Z0} (see {@link #lineTheta}). */
    private double lineSelfConductance(int l, double h) {
        double theta = lineTheta(l, h);
        return lineG[l] * (1 + theta * theta) / (1 - theta * theta);
    }

    /** Line {@code l}'s mutual conductance over a step {@code h}, {@code −2θ/(1 − θ²)/Z0}; 0 within the delay (see {@link #lineTheta}). */
    private double lineMutualConductance(int l, double h) {
        double theta = lineTheta(l, h);
        return -2 * lineG[l] * theta / (1 - theta * theta);
    }

    /** A branch current {@code br} leaving node {@code p}, entering {@code m}, with {@code v(p) − v(m)} in row br. */
    private void branch(double[] a, int n, int p, int m, int br) {
        add(a, n, p, br, 1);
        add(a, n, m, br, -1);
        add(a, n, br, p, 1);
        add(a, n, br, m, -1);
    }

    /**
     * Adds a matrix entry. An entry in a fixed node's column is a known current instead: it goes to
     * the right-hand side of the assembly under way ({@link #fixedSink}), with the node's voltage.
     */
    private void add(double[] a, int n, int row, int col, double value) {
        if (row >= 0) {
            if (col >= 0) {
                a[row * n + col] += value;
            } else if (col < -1) {
                fixedSink[row] -= value * fixedNow[-2 - col];
            }
        }
    }

    /** A current {@code amps} flowing out of {@code from} and into {@code to} through a source. */
    private static void inject(double[] b, int to, int from, double amps) {
        if (to >= 0) {
            b[to] += amps;
        }
        if (from >= 0) {
            b[from] -= amps;
        }
    }

    /** A node's voltage in a solution: ground 0, a fixed node its known voltage. */
    private double v(double[] sol, int node) {
        return node >= 0 ? sol[node] : node == -1 ? 0 : fixedNow[-2 - node];
    }

    /** The unknowns' part of {@link #v}: 0 for ground and fixed nodes (a vector over the unknowns only). */
    private static double unknownPart(double[] vec, int node) {
        return node < 0 ? 0 : vec[node];
    }

    /** The fixed nodes' part of {@link #v}: their known voltage, 0 for ground and unknowns. */
    private double fixedPart(int node) {
        return node < -1 ? fixedNow[-2 - node] : 0;
    }

    private static double[] unbox(List<Double> values) {
        return values.stream().mapToDouble(Double::doubleValue).toArray();
    }
}
