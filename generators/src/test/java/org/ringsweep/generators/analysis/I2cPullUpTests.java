package org.ringsweep.generators.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ringsweep.generators.analysis.I2cPullUp.Mode;

/** The I²C pull-up window against lines-and-terminations.md §7 "Worked numbers" (NXP UM10204 §7.1, Table 10). */
class I2cPullUpTests {
    /** The worked numbers are quoted to 0.1 Ω. */
    private static final double QUOTED = 0.05;

    @Test
    void minimumPullUpAtThreePointThreeVoltsIs966Point7OhmsAtThreeMilliampsAnd145OhmsAtTwenty() {
        // lines-and-terminations.md §7 worked numbers: (3.3 − 0.4)/3 mA, (3.3 − 0.4)/20 mA
        assertEquals(966.7, I2cPullUp.rMin(Mode.STANDARD, 3.3), QUOTED);
        assertEquals(966.7, I2cPullUp.rMin(Mode.FAST, 3.3), QUOTED);
        assertEquals(145.0, I2cPullUp.rMin(Mode.FAST_PLUS, 3.3), QUOTED);
        // lines-and-terminations.md §7: 5 V gives 1533.3 Ω
        assertEquals(1533.3, I2cPullUp.rMin(Mode.FAST, 5.0), QUOTED);
    }

    @Test
    void maximumPullUpFollowsTheRiseTimeOverPoint8473TimesTheBusCapacitance() {
        // lines-and-terminations.md §7 worked numbers
        assertEquals(2950.5, I2cPullUp.rMax(Mode.STANDARD, 400e-12), QUOTED + 0.05);
        assertEquals(1770.3, I2cPullUp.rMax(Mode.FAST, 200e-12), QUOTED);
        assertEquals(3540.7, I2cPullUp.rMax(Mode.FAST, 100e-12), QUOTED);
        assertEquals(885.2, I2cPullUp.rMax(Mode.FAST, 400e-12), QUOTED);
        assertEquals(257.5, I2cPullUp.rMax(Mode.FAST_PLUS, 550e-12), QUOTED);
        assertEquals(708.1, I2cPullUp.rMax(Mode.FAST_PLUS, 200e-12), QUOTED);
        // lines-and-terminations.md §7: ln(7/3) = 0.8473
        assertEquals(0.8473, I2cPullUp.RISE_30_70_PER_RC, 0.00005);
    }

    @Test
    void fastModeAtFourHundredPicofaradsHasNoValidResistor() {
        // lines-and-terminations.md §7: Fm 400 pF 885.2 Ω < Rp(min) 966.7 Ω ⇒ infeasible
        I2cPullUp.Window w = I2cPullUp.window(Mode.FAST, 3.3, 400e-12);
        assertFalse(w.feasible());
        assertTrue(w.capacitanceWithinLimit());
    }

    @Test
    void fourPointSevenKilohmsIsOutsideTheFastModeWindowAtTwoHundredPicofaradsButOnePointFiveIsInside() {
        // lines-and-terminations.md §7: window [966.7, 1770.3] Ω; E12 picks inside it are 1.0k, 1.2k, 1.5k
        I2cPullUp.Window w = I2cPullUp.window(Mode.FAST, 3.3, 200e-12);
        assertTrue(w.feasible());
        assertFalse(w.contains(4700));
        assertTrue(w.contains(1000));
        assertTrue(w.contains(1500));
        assertFalse(w.contains(820));
    }

    @Test
    void lowVoltageBusesUseTwentyPercentOfTheSupplyAsTheLowLevel() {
        // lines-and-terminations.md §7: VOL max 0.2·VDD when VDD ≤ 2 V; 1.8 V → 0.36 V, (1.8 − 0.36)/3 mA = 480 Ω
        assertEquals(0.36, I2cPullUp.vOlMax(1.8), 1e-12);
        assertEquals(480.0, I2cPullUp.rMin(Mode.FAST, 1.8), 1e-9);
        assertEquals(0.4, I2cPullUp.vOlMax(3.3), 0);
    }

    @Test
    void busCapacitanceLimitsAreFourHundredFourHundredAndFiveHundredFiftyPicofarads() {
        // lines-and-terminations.md §7 table (UM10204 Table 10)
        assertEquals(400e-12, Mode.STANDARD.busCapacitanceMaxF(), 0);
        assertEquals(400e-12, Mode.FAST.busCapacitanceMaxF(), 0);
        assertEquals(550e-12, Mode.FAST_PLUS.busCapacitanceMaxF(), 0);
        assertFalse(I2cPullUp.window(Mode.FAST, 3.3, 450e-12).capacitanceWithinLimit());
        assertTrue(I2cPullUp.window(Mode.FAST_PLUS, 3.3, 450e-12).capacitanceWithinLimit());
    }

    @Test
    void zeroBusCapacitanceIsRejected() {
        assertThrows(IllegalArgumentException.class, () -> I2cPullUp.rMax(Mode.FAST, 0));
    }
}
