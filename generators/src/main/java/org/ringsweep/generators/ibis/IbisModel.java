package org.ringsweep.generators.ibis;

import java.util.List;
import java.util.Optional;

/**
 * One {@code [Model]}. Sub-parameters and keywords a file does not give are NaN (single numbers)
 * or null (ranges, tables, ramp); use the {@code Optional} accessors below to read those.
 *
 * @param name             the model name
 * @param modelType        {@code Model_type} as written ({@code I/O}, {@code Output}, {@code Input}, ...)
 * @param polarity         {@code Polarity} ({@code Non-Inverting} when absent)
 * @param vinl             input low threshold (V) or NaN
 * @param vinh             input high threshold (V) or NaN
 * @param vmeas            timing reference voltage (V) or NaN
 * @param vref             timing load reference voltage (V) or NaN
 * @param cref             timing load capacitance (F) or NaN
 * @param rref             timing load resistance (ohm) or NaN
 * @param cComp            die capacitance {@code C_comp} (F)
 * @param voltageRange     {@code [Voltage Range]} (V) or null
 * @param pullupRef        {@code [Pullup Reference]} (V) or null
 * @param pulldownRef      {@code [Pulldown Reference]} (V) or null
 * @param powerClampRef    {@code [POWER Clamp Reference]} (V) or null
 * @param gndClampRef      {@code [GND Clamp Reference]} (V) or null
 * @param temperatureRange {@code [Temperature Range]} (°C) or null
 * @param pullup           {@code [Pullup]}: Vcc − Vpad (V) against current into the pin (A), or null
 * @param pulldown         {@code [Pulldown]}: Vpad − Vgnd (V) against current into the pin (A), or null
 * @param gndClamp         {@code [GND Clamp]}: Vpad − Vgnd (V) against current into the pin (A), or null
 * @param powerClamp       {@code [POWER Clamp]}: Vcc − Vpad (V) against current into the pin (A), or null
 * @param ramp             {@code [Ramp]} or null
 * @param rising           the {@code [Rising Waveform]} tables, in file order
 * @param falling          the {@code [Falling Waveform]} tables, in file order
 * @param line             the line of the {@code [Model]} keyword
 */
public record IbisModel(String name, String modelType, String polarity, double vinl, double vinh, double vmeas,
                        double vref, double cref, double rref, IbisRange cComp, IbisRange voltageRange,
                        IbisRange pullupRef, IbisRange pulldownRef, IbisRange powerClampRef, IbisRange gndClampRef,
                        IbisRange temperatureRange, IbisTable pullup, IbisTable pulldown, IbisTable gndClamp,
                        IbisTable powerClamp, IbisRamp ramp, List<IbisWaveform> rising, List<IbisWaveform> falling,
                        int line) {
    /** Copies the waveform lists. */
    public IbisModel {
        rising = List.copyOf(rising);
        falling = List.copyOf(falling);
    }

    /** The pull-up supply (V): {@code [Pullup Reference]}, else {@code [Voltage Range]}, else NaN. */
    public double pullupReference(IbisCorner c) {
        return pullupRef != null ? pullupRef.get(c) : voltageRange != null ? voltageRange.get(c) : Double.NaN;
    }

    /** The pull-down reference (V): {@code [Pulldown Reference]}, else 0. */
    public double pulldownReference(IbisCorner c) {
        return pulldownRef != null ? pulldownRef.get(c) : 0;
    }

    /** The power-clamp reference (V): {@code [POWER Clamp Reference]}, else {@code [Voltage Range]}, else NaN. */
    public double powerClampReference(IbisCorner c) {
        return powerClampRef != null ? powerClampRef.get(c) : voltageRange != null ? voltageRange.get(c) : Double.NaN;
    }

    /** The ground-clamp reference (V): {@code [GND Clamp Reference]}, else 0. */
    public double gndClampReference(IbisCorner c) {
        return gndClampRef != null ? gndClampRef.get(c) : 0;
    }

    /** {@code [Pullup]}, if given. */
    public Optional<IbisTable> pullupTable() {
        return Optional.ofNullable(pullup);
    }

    /** {@code [Pulldown]}, if given. */
    public Optional<IbisTable> pulldownTable() {
        return Optional.ofNullable(pulldown);
    }

    /** {@code [GND Clamp]}, if given. */
    public Optional<IbisTable> gndClampTable() {
        return Optional.ofNullable(gndClamp);
    }

    /** {@code [POWER Clamp]}, if given. */
    public Optional<IbisTable> powerClampTable() {
        return Optional.ofNullable(powerClamp);
    }

    /** {@code [Ramp]}, if given. */
    public Optional<IbisRamp> rampData() {
        return Optional.ofNullable(ramp);
    }

    /** Whether the model is an input only ({@code Input}, {@code Input_ECL}). */
    public boolean isInputOnly() {
        return modelType.equalsIgnoreCase("Input") || modelType.equalsIgnoreCase("Input_ECL");
    }
}
