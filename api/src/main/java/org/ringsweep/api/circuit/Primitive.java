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
