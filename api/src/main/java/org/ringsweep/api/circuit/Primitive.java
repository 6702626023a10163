package org.ringsweep.api.circuit;

import java.util.Arrays;
import java.util.List;
import org.apiguardian.api.API;

/**
 * One circuit element. All values are plain SI numbers; nodes and names are safe identifiers
 * ({@link SafeName}). Every record validates its values: a resistor, capacitor, inductor,
 * impedance or delay must be positive and finite.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public sealed interface Primitive {
    /** The element name, unique in the circuit (without the SPICE type letter). */
    String name();

    /** The nodes it connects, in SPICE order. */
    List<String> nodes();

    /**
     * A resistor.
     *
     * @param name element name
     * @param a    first node
     * @param b    second node
     * @param ohms resistance (ohm), positive
     */
    record Resistor(String name, String a, String b, double ohms) implements Primitive {
        /** Validates. */
        public Resistor {
            Checks.names(name, a, b);
            Checks.positive(ohms, "resistance of " + name);
        }

        @Override
        public List<String> nodes() {
            return List.of(a, b);
        }
    }

    /**
     * A capacitor.
     *
     * @param name   element name
     * @param a      first node
     * @param b      second node
     * @param farads capacitance (F), positive
     */
    record Capacitor(String name, String a, String b, double farads) implements Primitive {
        /** Validates. */
        public Capacitor {
            Checks.names(name, a, b);
            Checks.positive(farads, "capacitance of " + name);
        }

        @Override
        public List<String> nodes() {
            return List.of(a, b);
        }
    }

    /**
     * An inductor.
     *
     * @param name    element name
     * @param a       first node
     * @param b       second node
     * @param henries inductance (H), positive
     */
    record Inductor(String name, String a, String b, double henries) implements Primitive {
        /** Validates. */
        public Inductor {
            Checks.names(name, a, b);
            Checks.positive(henries, "inductance of " + name);
        }

        @Override
        public List<String> nodes() {
            return List.of(a, b);
        }
    }

    /**
     * A DC voltage source: {@code v(plus) − v(minus) = volts}.
     *
     * @param name  element name
     * @param plus  positive node
     * @param minus negative node
     * @param volts voltage (V), finite
     */
    record DcVoltage(String name, String plus, String minus, double volts) implements Primitive {
        /** Validates. */
        public DcVoltage {
            Checks.names(name, plus, minus);
            Checks.finite(volts, "voltage of " + name);
        }

        @Override
        public List<String> nodes() {
            return List.of(plus, minus);
        }
    }

    /**
     * A piecewise-linear voltage source; holds its last value after the last point.
     *
     * @param name   element name
     * @param plus   positive node
     * @param minus  negative node
     * @param times  breakpoint times (s), strictly increasing, first ≥ 0
     * @param volts  voltage at each time (V)
     */
    record PwlVoltage(String name, String plus, String minus, double[] times, double[] volts) implements Primitive {
        /** Validates and copies the arrays. */
        public PwlVoltage {
            Checks.names(name, plus, minus);
            if (times.length == 0 || times.length != volts.length) {
                throw new IllegalArgumentException("PWL source " + name + " needs equal, non-empty time and voltage lists");
            }
            times = times.clone();
            volts = volts.clone();
            for (int i = 0; i < times.length; i++) {
                Checks.finite(times[i], "PWL time of " + name);
                Checks.finite(volts[i], "PWL voltage of " + name);
                if (i == 0 ? times[0] < 0 : times[i] <= times[i - 1]) {
                    throw new IllegalArgumentException("PWL times of " + name + " must start at ≥ 0 and increase strictly");
                }
            }
        }

        /** A copy of the breakpoint times. */
        @Override
        public double[] times() {
            return times.clone();
        }

        /** A copy of the breakpoint voltages. */
        @Override
        public double[] volts() {
            return volts.clone();
        }

        /** The source value at time {@code t} (linear between points, held outside). */
        public double valueAt(double t) {
            if (t <= times[0]) {
                return volts[0];
            }
            for (int i = 1; i < times.length; i++) {
                if (t <= times[i]) {
                    return volts[i - 1] + (volts[i] - volts[i - 1]) * (t - times[i - 1]) / (times[i] - times[i - 1]);
                }
            }
            return volts[volts.length - 1];
        }

        @Override
        public List<String> nodes() {
            return List.of(plus, minus);
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof PwlVoltage p && p.name.equals(name) && p.plus.equals(plus) && p.minus.equals(minus)
                    && Arrays.equals(p.times, times) && Arrays.equals(p.volts, volts);
        }

        @Override
        public int hashCode() {
            return name.hashCode() * 31 + Arrays.hashCode(times) * 17 + Arrays.hashCode(volts);
        }

        @Override
        public String toString() {
            return "PwlVoltage[" + name + ", " + plus + ", " + minus + ", t=" + Arrays.toString(times) + ", v=" + Arrays.toString(volts) + "]";
        }
    }

    /**
     * A resistor whose value follows a piecewise-linear function of time: linear between the
     * breakpoints, held at the first value before the first time and at the last value after the
     * last time. A driver whose pull-up and pull-down resistances differ uses it to change its
     * output resistance with the driven state. ngspice has no such element; the deck writer
     * renders it as a behavioural current {@code v(a,b)/R(time)}.
     *
     * @param name  element name
     * @param a     first node
     * @param b     second node
     * @param times breakpoint times (s), strictly increasing, first ≥ 0
     * @param ohms  resistance at each time (ohm), each positive and finite
     */
    record TimedResistor(String name, String a, String b, double[] times, double[] ohms) implements Primitive {
        /** Validates and copies the arrays. */
        public TimedResistor {
            Checks.names(name, a, b);
            if (times.length == 0 || times.length != ohms.length) {
                throw new IllegalArgumentException("timed resistor " + name + " needs equal, non-empty time and resistance lists");
            }
            times = times.clone();
            ohms = ohms.clone();
            for (int i = 0; i < times.length; i++) {
                Checks.finite(times[i], "time of timed resistor " + name);
                Checks.positive(ohms[i], "resistance of timed resistor " + name);
                if (i == 0 ? times[0] < 0 : times[i] <= times[i - 1]) {
                    throw new IllegalArgumentException("times of timed resistor " + name + " must start at ≥ 0 and increase strictly");
                }
            }
        }

        /** A copy of the breakpoint times. */
        @Override
        public double[] times() {
            return times.clone();
        }

        /** A copy of the breakpoint resistances. */
        @Override
        public double[] ohms() {
            return ohms.clone();
        }

        /** The resistance at time {@code t} (ohm; linear between points, held outside). */
        public double ohmsAt(double t) {
            if (t <= times[0]) {
                return ohms[0];
            }
            for (int i = 1; i < times.length; i++) {
                if (t <= times[i]) {
                    return ohms[i - 1] + (ohms[i] - ohms[i - 1]) * (t - times[i - 1]) / (times[i] - times[i - 1]);
                }
            }
            return ohms[ohms.length - 1];
        }

        @Override
        public List<String> nodes() {
            return List.of(a, b);
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof TimedResistor r && r.name.equals(name) && r.a.equals(a) && r.b.equals(b)
                    && Arrays.equals(r.times, times) && Arrays.equals(r.ohms, ohms);
        }

        @Override
        public int hashCode() {
            return name.hashCode() * 31 + Arrays.hashCode(times) * 17 + Arrays.hashCode(ohms);
        }

        @Override
        public String toString() {
            return "TimedResistor[" + name + ", " + a + ", " + b + ", t=" + Arrays.toString(times) + ", ohm=" + Arrays.toString(ohms) + "]";
        }
    }

    /**
     * A current source driven by a table of a controlling voltage and scaled by a function of
     * time: the current from {@code plus} through the element to {@code minus} is
     * {@code scale(t) · y(v(ctrlPlus) − v(ctrlMinus))}. Both functions are linear between their
     * points and held at their end values outside them. With no scale points the scale is 1.
     *
     * <p>IBIS-derived buffers use it for their V–I tables: IBIS gives the current positive
     * <em>into</em> the buffer pin, so a table referenced to ground (pull-down, GND clamp) is
     * {@code plus} = pad, {@code minus} = ground reference, control (pad, ground reference), and
     * a Vcc-relative table (pull-up, POWER clamp) is {@code plus} = pad, {@code minus} = supply,
     * control (supply, pad). The deck writer renders it as a behavioural current source with
     * flat guard points, because ngspice's {@code pwl()} extrapolates linearly (ngspice.md §4).
     *
     * @param name       element name
     * @param plus       node the current leaves (flows from {@code plus} through the element)
     * @param minus      node the current enters
     * @param ctrlPlus   positive controlling node
     * @param ctrlMinus  negative controlling node
     * @param x          controlling voltages (V), at least two, strictly increasing
     * @param y          current at each voltage (A), finite
     * @param scaleTimes times of the scale function (s), strictly increasing, first ≥ 0; may be empty
     * @param scale      scale factor at each time (dimensionless), finite
     */
    record TableCurrent(String name, String plus, String minus, String ctrlPlus, String ctrlMinus,
                        double[] x, double[] y, double[] scaleTimes, double[] scale) implements Primitive {
        /** Validates and copies the arrays. */
        public TableCurrent {
            Checks.names(name, plus, minus, ctrlPlus, ctrlMinus);
            if (x.length < 2 || x.length != y.length) {
                throw new IllegalArgumentException("table current " + name + " needs at least two points and equal x and y lists");
            }
            if (scaleTimes.length != scale.length) {
                throw new IllegalArgumentException("table current " + name + " needs equal scale time and factor lists");
            }
            x = x.clone();
            y = y.clone();
            scaleTimes = scaleTimes.clone();
            scale = scale.clone();
            for (int i = 0; i < x.length; i++) {
                Checks.finite(x[i], "table voltage of " + name);
                Checks.finite(y[i], "table current of " + name);
                if (i > 0 && !(x[i] > x[i - 1])) {
                    throw new IllegalArgumentException("table voltages of " + name + " must increase strictly");
                }
            }
            for (int i = 0; i < scaleTimes.length; i++) {
                Checks.finite(scaleTimes[i], "scale time of " + name);
                Checks.finite(scale[i], "scale factor of " + name);
                if (i == 0 ? scaleTimes[0] < 0 : scaleTimes[i] <= scaleTimes[i - 1]) {
                    throw new IllegalArgumentException("scale times of " + name + " must start at ≥ 0 and increase strictly");
                }
            }
        }

        /** A copy of the controlling voltages. */
        @Override
        public double[] x() {
            return x.clone();
        }

        /** A copy of the currents. */
        @Override
        public double[] y() {
            return y.clone();
        }

        /** A copy of the scale times. */
        @Override
        public double[] scaleTimes() {
            return scaleTimes.clone();
        }

        /** A copy of the scale factors. */
        @Override
        public double[] scale() {
            return scale.clone();
        }

        /** The table current at controlling voltage {@code v} (A; linear between points, held outside). */
        public double currentAt(double v) {
            return held(x, y, v);
        }

        /** The scale at time {@code t} (1 without scale points; linear between points, held outside). */
        public double scaleAt(double t) {
            return scaleTimes.length == 0 ? 1 : held(scaleTimes, scale, t);
        }

        private static double held(double[] xs, double[] ys, double at) {
            if (at <= xs[0]) {
                return ys[0];
            }
            for (int i = 1; i < xs.length; i++) {
                if (at <= xs[i]) {
                    return ys[i - 1] + (ys[i] - ys[i - 1]) * (at - xs[i - 1]) / (xs[i] - xs[i - 1]);
                }
            }
            return ys[ys.length - 1];
        }

        @Override
        public List<String> nodes() {
            return List.of(plus, minus, ctrlPlus, ctrlMinus);
        }

        @Override
        public boolean equals(Object o) {
            return o instanceof TableCurrent t && t.name.equals(name) && t.plus.equals(plus) && t.minus.equals(minus)
                    && t.ctrlPlus.equals(ctrlPlus) && t.ctrlMinus.equals(ctrlMinus) && Arrays.equals(t.x, x)
                    && Arrays.equals(t.y, y) && Arrays.equals(t.scaleTimes, scaleTimes) && Arrays.equals(t.scale, scale);
        }

        @Override
        public int hashCode() {
            return name.hashCode() * 31 + Arrays.hashCode(x) * 17 + Arrays.hashCode(y) * 7 + Arrays.hashCode(scale);
        }

        @Override
        public String toString() {
            return "TableCurrent[" + name + ", " + plus + " -> " + minus + ", ctrl " + ctrlPlus + "," + ctrlMinus
                    + ", x=" + Arrays.toString(x) + ", y=" + Arrays.toString(y) + ", t=" + Arrays.toString(scaleTimes)
                    + ", k=" + Arrays.toString(scale) + "]";
        }
    }

    /**
     * A lossless transmission line (telegrapher's equations with R = G = 0).
     *
     * @param name  element name
     * @param a     port 1 signal node
     * @param aRef  port 1 reference node
     * @param b     port 2 signal node
     * @param bRef  port 2 reference node
     * @param z0    characteristic impedance (ohm), positive
     * @param delay one-way delay (s), positive
     */
    record LosslessLine(String name, String a, String aRef, String b, String bRef, double z0, double delay) implements Primitive {
        /** Validates. */
        public LosslessLine {
            Checks.names(name, a, aRef, b, bRef);
            Checks.positive(z0, "Z0 of " + name);
            Checks.positive(delay, "delay of " + name);
        }

        @Override
        public List<String> nodes() {
            return List.of(a, aRef, b, bRef);
        }
    }

    /**
     * A lossy line with per-length R, L, G, C (uniform RLGC line).
     *
     * @param name   element name
     * @param a      port 1 signal node
     * @param aRef   port 1 reference node
     * @param b      port 2 signal node
     * @param bRef   port 2 reference node
     * @param rPerM  series resistance (ohm/m), ≥ 0
     * @param lPerM  series inductance (H/m), positive
     * @param gPerM  shunt conductance (S/m), ≥ 0
     * @param cPerM  shunt capacitance (F/m), positive
     * @param length length (m), positive
     */
    record LossyLine(String name, String a, String aRef, String b, String bRef,
                     double rPerM, double lPerM, double gPerM, double cPerM, double length) implements Primitive {
        /** Validates. */
        public LossyLine {
            Checks.names(name, a, aRef, b, bRef);
            Checks.nonNegative(rPerM, "R per metre of " + name);
            Checks.positive(lPerM, "L per metre of " + name);
            Checks.nonNegative(gPerM, "G per metre of " + name);
            Checks.positive(cPerM, "C per metre of " + name);
            Checks.positive(length, "length of " + name);
        }

        @Override
        public List<String> nodes() {
            return List.of(a, aRef, b, bRef);
        }
    }

    /**
     * A junction diode with the SPICE level-1 parameters that clamp models need.
     *
     * @param name    element name
     * @param anode   anode node
     * @param cathode cathode node
     * @param model   its model
     */
    record Diode(String name, String anode, String cathode, DiodeModel model) implements Primitive {
        /** Validates. */
        public Diode {
            Checks.names(name, anode, cathode);
            java.util.Objects.requireNonNull(model, "model");
        }

        @Override
        public List<String> nodes() {
            return List.of(anode, cathode);
        }
    }

    /**
     * Sub-circuit text for the ngspice deck, the escape hatch for plugin models that cannot be
     * expressed in primitives. Only ngspice runs it. The text may hold element lines only: the
     * deck writer rejects dot-cards and control commands in it.
     *
     * @param name  element name (the text's own element names are prefixed with it)
     * @param nodes the nodes the text connects to
     * @param text  the element lines
     */
    record SubcircuitText(String name, List<String> nodes, String text) implements Primitive {
        /** Validates and copies. */
        public SubcircuitText {
            Checks.names(name);
            nodes = List.copyOf(nodes);
            nodes.forEach(n -> SafeName.require(n, "node"));
            java.util.Objects.requireNonNull(text, "text");
        }
    }
}
