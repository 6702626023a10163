package org.ringsweep.runner.sweep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.ringsweep.runner.sweep.ESeries.Series;

class ESeriesTests {
    // IEC 60063 lists as given in /work/shared/reference/impedance-and-standards.md §5 (two digits for
    // E12/E24, three for E96), written here in the reference's integer form.
    private static final int[] REF_E12 = {10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82};
    private static final int[] REF_E24 = {10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75,
        82, 91};
    private static final int[] REF_E96 = {100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150,
        154, 158, 162, 165, 169, 174, 178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243, 249, 255, 261, 267,
        274, 280, 287, 294, 301, 309, 316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412, 422, 432, 442, 453, 464, 475,
        487, 499, 511, 523, 536, 549, 562, 576, 590, 604, 619, 634, 649, 665, 681, 698, 715, 732, 750, 768, 787, 806, 825, 845,
        866, 887, 909, 931, 953, 976};

    /** The decade's mantissas as integers of the table's digits (1.5 → 15, 1.02 → 102). */
    private static int[] digits(Series s) {
        return ESeries.decade(s).stream().mapToInt(m -> m.movePointRight(m.scale()).intValueExact()).toArray();
    }

    private static BigDecimal bd(String s) {
        return new BigDecimal(s);
    }

    @Test
    void e12DecadeIsTheIecList() {
        // IEC 60063 E12, impedance-and-standards.md §5
        assertEquals(Arrays.toString(REF_E12), Arrays.toString(digits(Series.E12)));
    }

    @Test
    void e24DecadeIsTheIecListWrittenWithOneDecimal() {
        // IEC 60063 E24, impedance-and-standards.md §5
        assertEquals(Arrays.toString(REF_E24), Arrays.toString(digits(Series.E24)));
        List<BigDecimal> d = ESeries.decade(Series.E24);
        assertEquals(bd("1.0"), d.get(0));
        assertEquals(bd("1.1"), d.get(1));
        assertEquals(bd("9.1"), d.get(23));
    }

    @Test
    void e96DecadeIsTheIecList() {
        // IEC 60063 E96, impedance-and-standards.md §5
        assertEquals(Arrays.toString(REF_E96), Arrays.toString(digits(Series.E96)));
        assertEquals(bd("1.00"), ESeries.decade(Series.E96).get(0));
        assertEquals(bd("9.76"), ESeries.decade(Series.E96).get(95));
    }

    @Test
    void e24DiffersFromTheRoundingFormulaAtTheEightPlacesTheStandardFixes() {
        // impedance-and-standards.md §5: round(10^(i/24), 1 decimal) gives 2.6 2.9 3.2 3.5 3.8 4.2 4.6 8.3
        // where the standard has 2.7 3.0 3.3 3.6 3.9 4.3 4.7 8.2, and agrees everywhere else.
        List<BigDecimal> table = ESeries.decade(Series.E24);
        List<String> formula = new ArrayList<>();
        List<String> standard = new ArrayList<>();
        for (int i = 0; i < 24; i++) {
            BigDecimal rounded = BigDecimal.valueOf(Math.round(10 * Math.pow(10, i / 24.0)), 1);
            if (rounded.compareTo(table.get(i)) != 0) {
                formula.add(rounded.toPlainString());
                standard.add(table.get(i).toPlainString());
            }
        }
        assertEquals(List.of("2.6", "2.9", "3.2", "3.5", "3.8", "4.2", "4.6", "8.3"), formula);
        assertEquals(List.of("2.7", "3.0", "3.3", "3.6", "3.9", "4.3", "4.7", "8.2"), standard);
    }

    @Test
    void e6IsEverySecondE12AndE3EverySecondE6() {
        // impedance-and-standards.md §5: E6 = every 2nd E12 = 10 15 22 33 47 68; E3 (IEC 60063 Table 1) = 10 22 47
        assertEquals("[10, 15, 22, 33, 47, 68]", Arrays.toString(digits(Series.E6)));
        assertEquals("[10, 22, 47]", Arrays.toString(digits(Series.E3)));
    }

    @Test
    void e48IsEverySecondE96() {
        // impedance-and-standards.md §5: E48 = every 2nd E96 (100 105 110 115 121 …)
        int[] expected = IntStream.range(0, 48).map(i -> REF_E96[2 * i]).toArray();
        assertEquals(Arrays.toString(expected), Arrays.toString(digits(Series.E48)));
        assertEquals("[100, 105, 110, 115, 121]", Arrays.toString(Arrays.copyOf(digits(Series.E48), 5)));
    }

    @Test
    void e192HoldsE96AtEveryOtherPlaceAndTheKnownExceptionNineTwenty() {
        // IEC 60063 builds E96 from every 2nd E192 value; compared with the E96 list of §5.
        int[] e192 = digits(Series.E192);
        assertEquals(192, e192.length);
        assertEquals(Arrays.toString(REF_E96), Arrays.toString(IntStream.range(0, 96).map(i -> e192[2 * i]).toArray()));
        // 920 where round(100·10^(i/192)) gives 919 (reference §5, marked there as from memory)
        assertTrue(Arrays.stream(e192).anyMatch(v -> v == 920));
        assertTrue(Arrays.stream(e192).noneMatch(v -> v == 919));
        for (int i = 1; i < e192.length; i++) {
            assertTrue(e192[i] > e192[i - 1], "ascending at " + i);
        }
    }

    @Test
    void betweenE24TenAndHundredHoldsTheDecadeAndTheNextDecadesFirstValue() {
        // IEC 60063 E24 (§5): 10 … 91 are the 24 values of the decade; 100 starts the next one.
        List<Double> v = ESeries.between(Series.E24, 10, 100);
        assertEquals(25, v.size());
        assertEquals(10.0, v.get(0));
        assertEquals(91.0, v.get(23));
        assertEquals(100.0, v.get(24));
        for (int i = 0; i < 24; i++) {
            assertEquals(REF_E24[i], v.get(i));
        }
    }

    @Test
    void betweenSpansSeveralDecadesWithExactDecimals() {
        // IEC 60063 E12 (§5) from 3.3 to 470: 3.3 3.9 4.7 5.6 6.8 8.2, then 10 … 82, then 100 … 470
        List<BigDecimal> v = ESeries.betweenExact(Series.E12, 3.3, 470);
        assertEquals(6 + 12 + 9, v.size());
        assertEquals(0, v.get(0).compareTo(bd("3.3")));
        assertEquals(0, v.get(v.size() - 1).compareTo(bd("470")));
        // 4.7 is the double 4.7 itself, not a sum such as 4.7000000000000002 (reference §5: exact decimals)
        assertEquals(4.7, ESeries.between(Series.E12, 3.3, 470).get(2));
        assertEquals(4.7e-12, ESeries.between(Series.E12, 1e-12, 1e-11).get(8));
    }

    @Test
    void betweenRejectsNonPositiveOrReversedBounds() {
        assertThrows(IllegalArgumentException.class, () -> ESeries.between(Series.E24, 0, 10));
        assertThrows(IllegalArgumentException.class, () -> ESeries.between(Series.E24, 100, 10));
    }

    @Test
    void nearestChoosesTheSmallestLogDistance() {
        // |ln(36/35)| = 0.0282 < |ln(33/35)| = 0.0588 (reference §5 snapping rule), so 36 and not 33
        assertEquals(36.0, ESeries.nearest(Series.E24, 35));
        // 9.7 kΩ in E12: |ln(10k/9.7k)| = 0.0305 < |ln(8.2k/9.7k)| = 0.168 — the next decade wins
        assertEquals(10_000.0, ESeries.nearest(Series.E12, 9_700));
        // a preferred value snaps to itself: 4.7 nF (E6)
        assertEquals(4.7e-9, ESeries.nearest(Series.E6, 4.7e-9));
    }

    @Test
    void nextUpAndDownStepToTheNeighboursAcrossDecades() {
        // IEC 60063 E24 (§5): neighbours of 22 are 20 and 24; above 91 comes 100; below 10 comes 9.1
        assertEquals(24.0, ESeries.nextUp(Series.E24, 22));
        assertEquals(20.0, ESeries.nextDown(Series.E24, 22));
        assertEquals(100.0, ESeries.nextUp(Series.E24, 91));
        assertEquals(9.1, ESeries.nextDown(Series.E24, 10));
        // ceiling/floor keep a preferred value and round others outwards: 23 → 24 up, 22 down
        assertEquals(22.0, ESeries.ceiling(Series.E24, 22));
        assertEquals(24.0, ESeries.ceiling(Series.E24, 23));
        assertEquals(22.0, ESeries.floor(Series.E24, 23));
    }

    @Test
    void namesAreReadWithoutRegardToCase() {
        assertEquals(Series.E24, Series.named("e24").orElseThrow());
        assertTrue(Series.named("E25").isEmpty());
    }
}
