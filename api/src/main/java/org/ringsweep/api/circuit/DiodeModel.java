package org.ringsweep.api.circuit;

import org.apiguardian.api.API;

/**
 * SPICE level-1 junction diode parameters.
 *
 * @param name safe model name
 * @param is   saturation current (A), positive
 * @param n    emission coefficient, positive
 * @param rs   series resistance (ohm), ≥ 0
 * @param cjo  zero-bias junction capacitance (F), ≥ 0
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public record DiodeModel(String name, double is, double n, double rs, double cjo) {
    /** Validates. */
    public DiodeModel {
        SafeName.require(name, "diode model");
        Checks.positive(is, "IS of " + name);
        Checks.positive(n, "N of " + name);
        Checks.nonNegative(rs, "RS of " + name);
        Checks.nonNegative(cjo, "CJO of " + name);
    }
}
