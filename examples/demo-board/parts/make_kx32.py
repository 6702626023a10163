#!/usr/bin/env python3
"""Writes kx32.ibs: IBIS tables of the invented KX32 MCU's io33 and in33 buffers (demo data).

The shapes are textbook ones, not measurements of any part: a MOSFET output stage as
I = Isat*tanh(V/(Isat*R)) (linear near 0 V, saturating at Isat) and clamp diodes as a junction
with series resistance, V = n*Vt*ln(1 + I/Is) + I*Rs. [Ramp] is computed from the tables
themselves: the 20-80 % step of the DC swing into R_load = 50 ohm (to GND for the rising edge,
to Vcc for the falling edge) over an invented 20-80 % time, so the file is self-consistent.

io33_half is the same pin at half drive strength, chosen through the [Model Selector] io33_drive.
It has [Rising Waveform] and [Falling Waveform] tables into 50 ohm to GND and to Vcc: the pad
voltage integrated (RK4, 1 ps) from KCL at the die pad, C_comp dV/dt = -(ku*Ipu + kd*Ipd +
clamps + (V - V_fixture)/R_fixture), with the file's own (rounded, piecewise-linear) tables and
invented switching coefficients (smoothsteps, the stage turning off faster than the other turns
on). Its [Ramp] is the 20-80 % step and time of those waveforms (rising into the GND fixture,
falling into the Vcc fixture).
"""
import math

CORNERS = ("typ", "min", "max")
VCC = {"typ": 3.3, "min": 3.0, "max": 3.6}
# output stage: (R near 0 V in ohm, saturation current in A)
PD = {"typ": (20.0, 0.080), "min": (28.0, 0.055), "max": (15.0, 0.110)}
PU = {"typ": (25.0, 0.065), "min": (35.0, 0.045), "max": (18.0, 0.090)}
# clamp diode: (Is in A, n, Rs in ohm)
DIODE = {"typ": (1e-14, 1.0, 4.0), "min": (5e-15, 1.0, 6.0), "max": (2e-14, 1.0, 3.0)}
VT = 0.025852
DT_R = {"typ": 1.00e-9, "min": 1.40e-9, "max": 0.70e-9}
DT_F = {"typ": 0.90e-9, "min": 1.25e-9, "max": 0.65e-9}
R_LOAD = 50.0
# io33_half: half drive strength
PD_HALF = {"typ": (40.0, 0.040), "min": (56.0, 0.0275), "max": (30.0, 0.055)}
PU_HALF = {"typ": (50.0, 0.0325), "min": (70.0, 0.0225), "max": (36.0, 0.045)}
C_COMP = {"typ": 3.0e-12, "min": 2.6e-12, "max": 3.5e-12}
T_ON = {"typ": 1.6e-9, "min": 2.2e-9, "max": 1.1e-9}   # time for the stage turning on
LEAD = 0.3e-9                                         # quiet lead-in of the waveform tables
ROWS, ROW_DT = 100, 40e-12


def stage(v, r, isat):
    return isat * math.tanh(v / (isat * r))


def diode(vd, c):
    """Forward current (A) of the clamp junction at forward voltage vd, by bisection."""
    is_, n, rs = DIODE[c]
    if vd <= 0:
        return 0.0
    lo, hi = 0.0, vd / rs
    for _ in range(200):
        mid = (lo + hi) / 2
        if n * VT * math.log1p(mid / is_) + mid * rs > vd:
            hi = mid
        else:
            lo = mid
    return (lo + hi) / 2


def pulldown(v, c, pd=PD):   # Vpad - Vgnd -> current into the pin
    return stage(v, *pd[c])


def pullup(v, c, pu=PU):     # Vcc - Vpad -> current into the pin (negative: it sources)
    return -stage(v, *pu[c])


def gnd_clamp(v, c):  # Vpad - Vgnd -> current into the pin: the diode conducts below GND
    return -diode(-v, c)


def power_clamp(v, c):  # Vcc - Vpad -> current into the pin: the diode conducts above Vcc
    return diode(-v, c)


def solve(f, lo, hi):
    flo = f(lo)
    for _ in range(200):
        mid = (lo + hi) / 2
        if (f(mid) > 0) == (flo > 0):
            lo, flo = mid, f(mid)
        else:
            hi = mid
    return (lo + hi) / 2


def pad_current(v, c, up):
    vcc = VCC[c]
    i = gnd_clamp(v, c) + power_clamp(vcc - v, c)
    return i + (pullup(vcc - v, c) if up else pulldown(v, c))


def ramp(c):
    vcc = VCC[c]
    # rising: load to GND; low level is 0 V exactly, high where the pull-up meets the load line
    vh = solve(lambda v: pad_current(v, c, True) + v / R_LOAD, 0.0, vcc)
    # falling: load to Vcc; high level is Vcc exactly
    vl = solve(lambda v: pad_current(v, c, False) + (v - vcc) / R_LOAD, 0.0, vcc)
    return 0.6 * vh, 0.6 * (vcc - vl)


def fmt(x):
    return "%.4e" % x


def table(name, f, vs):
    lines = ["[%s]" % name, "| voltage   I(typ)       I(min)       I(max)"]
    for v in vs:
        lines.append("%7.2f   %s  %s  %s" % (v, fmt(f(v, "typ")), fmt(f(v, "min")), fmt(f(v, "max"))))
    return lines


def grid():
    # -Vcc .. 2*Vcc of the typ supply (impedance-and-standards.md section 7), finer near the rails
    vs = [-3.3, -2.5, -2.0, -1.5, -1.2, -1.0, -0.9, -0.8, -0.7, -0.6, -0.5, -0.4, -0.2, 0.0, 0.2, 0.4, 0.6,
          0.8, 1.0, 1.25, 1.5, 2.0, 2.5, 3.0, 3.3, 3.6, 4.0, 5.0, 6.6]
    return vs


def clamp_grid():
    return [-3.3, -2.5, -2.0, -1.5, -1.2, -1.0, -0.9, -0.8, -0.7, -0.6, -0.5, -0.4, -0.2, 0.0, 3.3]


def as_read(f, vs, c):
    """The table f as a reader sees it: rounded as printed, linear between rows, held outside."""
    ys = [float(fmt(f(v, c))) for v in vs]

    def g(x):
        if x <= vs[0]:
            return ys[0]
        for i in range(1, len(vs)):
            if x <= vs[i]:
                return ys[i - 1] + (ys[i] - ys[i - 1]) * (x - vs[i - 1]) / (vs[i] - vs[i - 1])
        return ys[-1]
    return g


def smooth(x):
    x = min(1.0, max(0.0, x))
    return x * x * (3 - 2 * x)


def waveform(c, rising, v_fix):
    """Pad voltage of io33_half into 50 ohm to v_fix at the table rows, and (t, v) at 1 ps."""
    vcc = VCC[c]
    ipd = as_read(lambda v, k: pulldown(v, k, PD_HALF), grid(), c)
    ipu = as_read(lambda v, k: pullup(v, k, PU_HALF), grid(), c)
    igc = as_read(gnd_clamp, clamp_grid(), c)
    ipc = as_read(power_clamp, clamp_grid(), c)

    def k(t):
        on = smooth((t - LEAD) / T_ON[c])
        off = 1 - smooth((t - LEAD) / (0.6 * T_ON[c]))
        return (on, off) if rising else (off, on)

    def current(t, v):
        ku, kd = k(t)
        return ku * ipu(vcc - v) + kd * ipd(v) + igc(v) + ipc(vcc - v) + (v - v_fix) / R_LOAD

    ku0, kd0 = k(0.0)
    v = solve(lambda x: ku0 * ipu(vcc - x) + kd0 * ipd(x) + igc(x) + ipc(vcc - x) + (x - v_fix) / R_LOAD, -1.0, vcc + 1.0)
    h = 1e-12
    cc = C_COMP[c]
    steps = int(round((ROWS - 1) * ROW_DT / h))
    fine = [(0.0, v)]
    for i in range(steps):
        t = i * h
        f = lambda tt, vv: -current(tt, vv) / cc
        a = f(t, v)
        b = f(t + h / 2, v + h / 2 * a)
        d = f(t + h / 2, v + h / 2 * b)
        e = f(t + h, v + h * d)
        v += h / 6 * (a + 2 * b + 2 * d + e)
        fine.append(((i + 1) * h, v))
    stride = int(round(ROW_DT / h))
    return [fine[i * stride][1] for i in range(ROWS)], fine


def ramp_of(fine):
    """20-80 % step and time of a waveform given at 1 ps."""
    v0, v1 = fine[0][1], fine[-1][1]

    def cross(level):
        for (ta, va), (tb, vb) in zip(fine, fine[1:]):
            if (va - level) * (vb - level) <= 0 and va != vb:
                return ta + (tb - ta) * (level - va) / (vb - va)
        raise ValueError("no crossing")
    t20 = cross(v0 + 0.2 * (v1 - v0))
    t80 = cross(v0 + 0.8 * (v1 - v0))
    return 0.6 * abs(v1 - v0), t80 - t20


def waveform_tables(lines):
    ramps = {}
    for rising, name in ((True, "Rising Waveform"), (False, "Falling Waveform")):
        for to_vcc in (False, True):
            cols = {}
            for c in CORNERS:
                rows, fine = waveform(c, rising, VCC[c] if to_vcc else 0.0)
                cols[c] = rows
                if to_vcc != rising:
                    ramps[(rising, c)] = ramp_of(fine)
            lines += ["[%s]" % name, "R_fixture = 50"]
            if to_vcc:
                lines += ["V_fixture = 3.3", "V_fixture_min = 3.0", "V_fixture_max = 3.6"]
            else:
                lines += ["V_fixture = 0.0"]
            lines += ["| time      V(typ)      V(min)      V(max)"]
            for i in range(ROWS):
                lines.append("%.3fn   %.5f   %.5f   %.5f" % (i * ROW_DT * 1e9, cols["typ"][i], cols["min"][i], cols["max"][i]))
    return ramps


def model_common(lines):
    lines += ["[Voltage Range]      3.3V     3.0V     3.6V",
              "[Temperature Range]  25.0     100.0    0.0"]


def output_model(lines, name, pd, pu, timing_load):
    """The [Model] header, sub-parameters and V-I tables of an I/O buffer with these stages."""
    lines += ["[Model]         %-s" % name,
              "Model_type      I/O",
              "Polarity        Non-Inverting",
              "Enable          Active-High",
              "Vinl = 0.8V",
              "Vinh = 2.0V",
              "Vmeas = 1.65V"] + timing_load + [
              "|            typ      min      max",
              "C_comp       3.0pF    2.6pF    3.5pF"]
    model_common(lines)
    lines += table("Pulldown", lambda v, c: pulldown(v, c, pd), grid())
    lines += table("Pullup", lambda v, c: pullup(v, c, pu), grid())
    lines += table("GND Clamp", gnd_clamp, clamp_grid())
    lines += table("POWER Clamp", power_clamp, clamp_grid())


def main():
    out = []
    out += ["[IBIS Ver]      3.2",
            "[File Name]     kx32.ibs",
            "[File Rev]      0.1",
            "[Date]          December 2026",
            "[Source]        Invented demo data for the ringsweep demo board; not any real part.",
            "                Generated by make_kx32.py in this folder.",
            "[Notes]         The KX32 MCU does not exist. Its tables are textbook shapes: an output",
            "                stage I = Isat*tanh(V/(Isat*R)) and clamp diodes with series resistance.",
            "[Disclaimer]    Demo data only. Do not use it to judge a real design.",
            "[Copyright]     Public domain (CC0).",
            "|",
            "[Component]     KX32",
            "[Manufacturer]  Invented Demo Devices",
            "[Package]",
            "| variable  typ      min      max",
            "R_pkg       0.25     0.20     0.35",
            "L_pkg       3.0nH    2.5nH    3.8nH",
            "C_pkg       0.6pF    0.5pF    0.8pF",
            "[Pin]  signal_name  model_name  R_pin  L_pin  C_pin",
            "1      PA0          io33_drive",
            "2      PA1          io33_drive  0.30   3.5nH  0.7pF",
            "3      PB0          in33",
            "4      VDD          POWER",
            "5      VSS          GND",
            "6      NC1          NC",
            "|",
            "[Model Selector] io33_drive",
            "| model_name  description",
            "io33          Full drive strength (default)",
            "io33_half     Half drive strength, slower edges",
            "|"]
    output_model(out, "io33", PD, PU, ["Cref = 0pF", "Rref = 50", "Vref = 0"])
    out += ["[Ramp]", "| variable   typ              min              max"]
    for edge, dts in (("r", DT_R), ("f", DT_F)):
        cells = []
        for c in CORNERS:
            dv = ramp(c)[0 if edge == "r" else 1]
            cells.append("%.3f/%.3fn" % (dv, dts[c] * 1e9))
        out.append("dV/dt_%s     %s" % (edge, "   ".join(cells)))
    out += ["R_load = 50"]
    out += ["|", "[Model]         in33",
            "Model_type      Input",
            "Polarity        Non-Inverting",
            "Vinl = 0.8V",
            "Vinh = 2.0V",
            "C_comp       2.5pF    2.2pF    NA"]
    model_common(out)
    out += table("GND Clamp", gnd_clamp, clamp_grid())
    out += table("POWER Clamp", power_clamp, clamp_grid())
    out += ["|"]
    output_model(out, "io33_half", PD_HALF, PU_HALF, [])
    waves = []
    ramps = waveform_tables(waves)
    out += ["[Ramp]", "| variable   typ              min              max"]
    for edge, rising in (("r", True), ("f", False)):
        cells = ["%.3f/%.3fn" % (ramps[(rising, c)][0], ramps[(rising, c)][1] * 1e9) for c in CORNERS]
        out.append("dV/dt_%s     %s" % (edge, "   ".join(cells)))
    out += ["R_load = 50"]
    out += waves
    out += ["|", "[End]"]
    with open("kx32.ibs", "w") as f:
        f.write("\n".join(out) + "\n")


main()
