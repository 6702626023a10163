package org.ringsweep.runner.results;

/**
 * A violated limit as it appears in a record.
 *
 * @param limit     the limit's key ({@code overshoot_max}, or {@code settled})
 * @param edge      {@code rise} or {@code fall}
 * @param measured  the measured value (SI units; NaN when there is none)
 * @param value     the limit's value (SI units)
 * @param defaulted whether the limit's value is the documented default
 * @param message   the violation in words
 */
public record ViolationRecord(String limit, String edge, double measured, double value, boolean defaulted, String message) {
}
