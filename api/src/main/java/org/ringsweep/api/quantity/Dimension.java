package org.ringsweep.api.quantity;

import org.apiguardian.api.API;

/**
 * The physical kind a value must have, with its SI base unit symbol.
 *
 * <p>Each key of a net file expects one dimension; a value of another kind is an input error.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public enum Dimension {
    /** Volts. */
    VOLTAGE("V"),
    /** Amperes. */
    CURRENT("A"),
    /** Seconds. */
    TIME("s"),
    /** Metres. */
    LENGTH("m"),
    /** Ohms. */
    RESISTANCE("ohm"),
    /** Farads. */
    CAPACITANCE("F"),
    /** Henries. */
    INDUCTANCE("H"),
    /** Hertz. */
    FREQUENCY("Hz"),
    /** Metres per second. */
    VELOCITY("m/s"),
    /** Ohms per metre (series loss of a line). */
    RESISTANCE_PER_LENGTH("ohm/m"),
    /** Siemens per metre (shunt loss of a line). */
    CONDUCTANCE_PER_LENGTH("S/m"),
    /** A pure number (relative permittivity, a factor); a trailing {@code %} divides by 100. */
    DIMENSIONLESS("");

    private final String unitSymbol;

    Dimension(String unitSymbol) {
        this.unitSymbol = unitSymbol;
    }

    /** The SI base unit symbol, empty for {@link #DIMENSIONLESS}. */
    public String unitSymbol() {
        return unitSymbol;
    }

    /** A lower-case English name for messages, e.g. "voltage". */
    public String displayName() {
        return name().toLowerCase(java.util.Locale.ROOT).replace('_', ' ');
    }
}
