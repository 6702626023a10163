package org.ringsweep.generators.ibis;

/**
 * One row of {@code [Pin]}. Package values a row does not give are NaN.
 *
 * @param pin    the pin name ({@code 1}, {@code A12})
 * @param signal the signal name
 * @param model  the model name (or POWER, GND, NC)
 * @param rPin   pin resistance (ohm) or NaN
 * @param lPin   pin inductance (H) or NaN
 * @param cPin   pin capacitance (F) or NaN
 */
public record IbisPin(String pin, String signal, String model, double rPin, double lPin, double cPin) {
}
