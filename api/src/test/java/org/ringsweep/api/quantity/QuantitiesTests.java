package org.ringsweep.api.quantity;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

class QuantitiesTests {

    // Expected values below are decimal literals; Java's literal rounding and the parser's single
    // rounding of an exact decimal product must give the same double, so the checks are exact.

    @ParameterizedTest(name = "{0} ohm = {1}")
    @CsvSource({
            // IEC 60062 letter-and-digit code examples, /work/shared/reference/impedance-and-standards.md §6
            "R47, 0.47", "4R7, 4.7", "470R, 470", "4K7, 4700", "47K3, 47300", "2M2, 2200000", "1K0, 1000",
            // the same examples as quoted in formats.md "Quantities"
            "4k7, 4700", "R22, 0.22", "10R, 10",
            // L is the 10^-3 letter added in the 2016 edition (reference §6)
            "1L5, 0.0015",
            // G and T multipliers (reference §6)
            "1G5, 1500000000", "2T, 2000000000000"})
    void readsResistorLetterAndDigitCodes(String text, double ohms) {
        assertEquals(ohms, Quantities.parse(text, Dimension.RESISTANCE));
    }

    @ParameterizedTest(name = "{0} F = {1}")
    @CsvSource({
            // capacitance examples from reference §6 (IEC 60062)
            "4p7, 4.7e-12", "6n8, 6.8e-9", "µ47, 0.47e-6", "u47, 0.47e-6", "4m7, 4.7e-3"})
    void readsCapacitorLetterAndDigitCodes(String text, double farads) {
        assertEquals(farads, Quantities.parse(text, Dimension.CAPACITANCE));
    }

    @Test
    void readsMilsAndInchesExactly() {
        // 1 in = 25.4 mm exactly (international inch, 1959) and 1 mil = 0.001 in: exact by definition.
        assertEquals(0.0127, Quantities.parse("500mil", Dimension.LENGTH));
        assertEquals(0.0000254, Quantities.parse("1mil", Dimension.LENGTH));
        assertEquals(0.03048, Quantities.parse("1.2in", Dimension.LENGTH));
        assertEquals(0.0254, Quantities.parse("1 in", Dimension.LENGTH));
        // formats.md examples: 45mm, and um as the micrometre
        assertEquals(0.045, Quantities.parse("45mm", Dimension.LENGTH));
        assertEquals(35e-6, Quantities.parse("35um", Dimension.LENGTH));
    }

    @Test
    void readsALoneMAsMetreForLengthsAndAsMilliOtherwise() {
        // formats.md: "a lone m is milli"; for a length the symbol m is the metre itself (SI brochure)
        assertEquals(1.0, Quantities.parse("1m", Dimension.LENGTH));
        assertEquals(1e-3, Quantities.parse("1m", Dimension.TIME));
        assertEquals(1e-3, Quantities.parse("1m", Dimension.RESISTANCE));
        assertEquals(2e-3, Quantities.parse("2ms", Dimension.TIME));
    }

    @ParameterizedTest(name = "{0} as {1} = {2}")
    @CsvSource({
            // SI prefixes (SI Brochure, 9th edition, table 7), formats.md examples
            "2ns, TIME, 2e-9", "2 ns, TIME, 2e-9", "1.5ns, TIME, 1.5e-9", "150ps, TIME, 150e-12", "1e-9, TIME, 1e-9",
            "3fs, TIME, 3e-15", "2n, TIME, 2e-9", "4pF, CAPACITANCE, 4e-12", "3.3V, VOLTAGE, 3.3", "3.3, VOLTAGE, 3.3",
            "800mV, VOLTAGE, 0.8", "22, RESISTANCE, 22", "22ohm, RESISTANCE, 22", "22 Ohm, RESISTANCE, 22",
            "22Ω, RESISTANCE, 22", "4.7kohm, RESISTANCE, 4700", "1Gohm, RESISTANCE, 1e9", "10mA, CURRENT, 0.01",
            "2nH, INDUCTANCE, 2e-9", "100MHz, FREQUENCY, 1e8", "1 GHz, FREQUENCY, 1e9", "3uF, CAPACITANCE, 3e-6",
            "3µF, CAPACITANCE, 3e-6", "3k, RESISTANCE, 3000", "+2ns, TIME, 2e-9", "-3, RESISTANCE, -3",
            ".5, VOLTAGE, 0.5", "5., VOLTAGE, 5",
            // meg = 1e6 in any case (formats.md)
            "1meg, RESISTANCE, 1e6", "1MEG, RESISTANCE, 1e6", "1Meg, RESISTANCE, 1e6", "2megohm, RESISTANCE, 2e6",
            "1MEGHz, FREQUENCY, 1e6",
            // M is mega and m milli (formats.md; IBIS convention, reference §7)
            "1M, RESISTANCE, 1e6", "1Mohm, RESISTANCE, 1e6", "1mohm, RESISTANCE, 1e-3",
            // ratios: 150 mm/ns = 1.5e8 m/s
            "150mm/ns, VELOCITY, 1.5e8", "1.5e8m/s, VELOCITY, 1.5e8", "1.5e8, VELOCITY, 1.5e8",
            "5ohm/m, RESISTANCE_PER_LENGTH, 5", "5 ohm/mm, RESISTANCE_PER_LENGTH, 5000",
            "1e-3S/m, CONDUCTANCE_PER_LENGTH, 1e-3",
            // a percentage divides by 100 for pure numbers (Dimension javadoc)
            "5%, DIMENSIONLESS, 0.05", "5 %, DIMENSIONLESS, 0.05", "3.4, DIMENSIONLESS, 3.4"})
    void readsPrefixesAndUnits(String text, Dimension d, double expected) {
        assertEquals(expected, Quantities.parse(text, d));
    }

    @Test
    void ignoresSurroundingWhitespace() {
        assertEquals(2e-9, Quantities.parse("  2 ns\t", Dimension.TIME));
    }

    @Test
    void rejectsAUnitOfTheWrongKindNamingBoth() {
        QuantityFormatException e = assertThrows(QuantityFormatException.class, () -> Quantities.parse("3pF", Dimension.TIME));
        assertEquals("expected a time such as `1.5ns` or `2e-9`, found `3pF` (a capacitance)", e.getMessage());
    }

    @ParameterizedTest(name = "{0} as {1}")
    @CsvSource({"45mm, TIME, a length", "2ns, LENGTH, a time", "5%, VOLTAGE, a percentage", "3V, DIMENSIONLESS, a voltage",
            "1mil, TIME, a length", "3S, RESISTANCE, a conductance", "1m/s, TIME, a velocity"})
    void namesTheKindOfAWrongUnit(String text, Dimension d, String kind) {
        QuantityFormatException e = assertThrows(QuantityFormatException.class, () -> Quantities.parse(text, d));
        assertTrue(e.getMessage().contains("found `" + text + "` (" + kind + ")"), e.getMessage());
    }

    @ParameterizedTest
    @ValueSource(strings = {"3 parsecs", "2nsec", "4k7", "2 n s", "1x"})
    void rejectsUnknownUnitsForATime(String text) {
        QuantityFormatException e = assertThrows(QuantityFormatException.class, () -> Quantities.parse(text, Dimension.TIME));
        assertTrue(e.getMessage().startsWith("expected a time such as `1.5ns` or `2e-9`, found `" + text + "`"), e.getMessage());
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "  ", "abc", "4,7", "1_000", "0x10", "e9", "--3", "1e", "ns"})
    void rejectsGarbage(String text) {
        QuantityFormatException e = assertThrows(QuantityFormatException.class, () -> Quantities.parse(text, Dimension.VOLTAGE));
        assertTrue(e.getMessage().contains("expected a voltage such as `3.3V` or `3.3`"), e.getMessage());
    }

    @ParameterizedTest
    @ValueSource(strings = {"NaN", "nan", ".nan", "Infinity", "-Infinity", "inf", ".inf", "-.inf"})
    void rejectsNonFiniteNumbers(String text) {
        QuantityFormatException e = assertThrows(QuantityFormatException.class, () -> Quantities.parse(text, Dimension.TIME));
        assertTrue(e.getMessage().endsWith("found `" + text + "` (not a finite number)"), e.getMessage());
    }

    @Test
    void rejectsAPrefixOnAPureNumber() {
        QuantityFormatException e = assertThrows(QuantityFormatException.class, () -> Quantities.parse("2k", Dimension.DIMENSIONLESS));
        assertEquals("expected a number such as `3.4` or `5%`, found `2k` (a pure number takes no SI prefix)", e.getMessage());
    }

    @Test
    void saysNothingWasFoundForEmptyText() {
        QuantityFormatException e = assertThrows(QuantityFormatException.class, () -> Quantities.parse(" ", Dimension.LENGTH));
        assertEquals("expected a length such as `45mm`, `500mil` or `0.045`, found nothing", e.getMessage());
    }

    @Test
    void rejectsNumbersBeyondTheDoubleRange() {
        assertThrows(QuantityFormatException.class, () -> Quantities.parse("1e400", Dimension.TIME));
    }

    @Test
    void rejectsLowerCaseMLetterCodeForResistanceAsAmbiguous() {
        // reference §6: "treat m as milli only for capacitance; reject m for resistors" (in the letter code)
        QuantityFormatException e = assertThrows(QuantityFormatException.class, () -> Quantities.parse("2m2", Dimension.RESISTANCE));
        assertTrue(e.getMessage().contains("`2M2`") && e.getMessage().contains("`2L2`"), e.getMessage());
    }

    @Test
    void keepsPrefixCaseMeaningful() {
        // formats.md: M = mega, m = milli; SPICE's case-blind reading (2.2M = 2.2 mΩ) is not followed (reference §6)
        assertEquals(2.2e6, Quantities.parse("2.2M", Dimension.RESISTANCE));
        assertEquals(2.2e-3, Quantities.parse("2.2m", Dimension.RESISTANCE));
    }

    @Test
    void doesNotReadLetterCodesForOtherDimensions() {
        assertThrows(QuantityFormatException.class, () -> Quantities.parse("4k7", Dimension.VOLTAGE));
        assertThrows(QuantityFormatException.class, () -> Quantities.parse("4p7", Dimension.RESISTANCE));
    }

    @ParameterizedTest(name = "{0} {1} -> {2}")
    @CsvSource({
            // engineering notation: exponent a multiple of 3, SI prefix (SI Brochure table 7)
            "1.5e-9, TIME, 1.5 ns", "4700, RESISTANCE, 4.7 kohm", "0.0127, LENGTH, 12.7 mm", "22, RESISTANCE, 22 ohm",
            "4e-12, CAPACITANCE, 4 pF", "3.3, VOLTAGE, 3.3 V", "0, TIME, 0 s", "-0.3, VOLTAGE, -300 mV",
            "2.54e-5, LENGTH, 25.4 um", "1e8, FREQUENCY, 100 MHz", "1.5e8, VELOCITY, 150e6 m/s", "0.05, DIMENSIONLESS, 0.05",
            "3.4, DIMENSIONLESS, 3.4", "999.96, RESISTANCE, 1 kohm", "1.23456e-9, TIME, 1.235 ns", "2e-18, TIME, 2e-18 s"})
    void formatsWithAnEngineeringPrefix(double si, Dimension d, String expected) {
        assertEquals(expected, Quantities.format(si, d));
    }

    @ParameterizedTest
    @CsvSource({"1.5e-9, TIME", "4700, RESISTANCE", "0.0127, LENGTH", "1.5e8, VELOCITY", "2e-18, TIME", "5e-3, RESISTANCE_PER_LENGTH"})
    void formatsTextThatParsesBack(double si, Dimension d) {
        assertEquals(si, Quantities.parse(Quantities.format(si, d), d), Math.abs(si) * 1e-12);
    }
}
