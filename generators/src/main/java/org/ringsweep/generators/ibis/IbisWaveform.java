package org.ringsweep.generators.ibis;

/**
 * A {@code [Rising Waveform]} or {@code [Falling Waveform]}: the pad voltage over time into a test
 * fixture. Fixture values the file does not give are NaN; {@code V_fixture_min}/{@code _max}
 * default to {@code V_fixture}.
 *
 * @param rFixture    fixture resistance (ohm)
 * @param vFixture    fixture voltage, by corner (V)
 * @param lFixture    fixture inductance (H), NaN when absent
 * @param cFixture    fixture capacitance (F), NaN when absent
 * @param rDut        series resistance at the buffer (ohm), NaN when absent
 * @param lDut        series inductance at the buffer (H), NaN when absent
 * @param cDut        capacitance at the buffer (F), NaN when absent
 * @param table       time (s) against pad voltage (V), typ/min/max
 * @param line        the line of the keyword in the file
 */
public record IbisWaveform(double rFixture, IbisRange vFixture, double lFixture, double cFixture,
                           double rDut, double lDut, double cDut, IbisTable table, int line) {
}
