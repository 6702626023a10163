package org.ringsweep.runner.verdict;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ringsweep.api.net.LimitName;
import org.ringsweep.api.net.Limits;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.quantity.Dimension;

class LimitDefaultsTests {
    @Test
    void unsetLimitsTakeTheDocumentedDefaultsAndAreListedAsDefaulted() {
        EffectiveLimits l = LimitDefaults.resolve(Limits.NONE, 3.3);
        // formats.md "Results": overshoot_max = undershoot_max = 0.3 V, ringback_margin_min = 0 V,
        // monotonic = true, one threshold crossing per edge, settle_band 5 % of the swing, no settle or delay limit
        assertEquals(0.3, l.overshootMaxV(), 0);
        assertEquals(0.3, l.undershootMaxV(), 0);
        assertEquals(0.0, l.ringbackMarginMinV(), 0);
        assertTrue(l.monotonic());
        assertEquals(1, l.crossingsMax());
        assertEquals(0.05 * 3.3, l.settleBandV(), 1e-15);
        assertFalse(l.hasSettleMax());
        assertFalse(l.hasDelayMax());
        assertEquals(List.of("overshoot_max", "undershoot_max", "ringback_margin_min", "settle_band", "monotonic",
                "crossings_max"), l.defaultedKeys());
    }

    @Test
    void limitsSetByTheNetOverrideTheDefaults() {
        // the limits block of the formats.md net-file example
        Limits set = Limits.of(Map.of(
                LimitName.OVERSHOOT_MAX, Value.of(0.5, Dimension.VOLTAGE),
                LimitName.UNDERSHOOT_MAX, Value.of(0.5, Dimension.VOLTAGE),
                LimitName.RINGBACK_MARGIN_MIN, Value.of(0.2, Dimension.VOLTAGE),
                LimitName.SETTLE_MAX, Value.of(10e-9, Dimension.TIME),
                LimitName.SETTLE_BAND, Value.of(0.05, Dimension.DIMENSIONLESS),
                LimitName.MONOTONIC, new Value.Flag(true),
                LimitName.DELAY_MAX, Value.of(2e-9, Dimension.TIME)));
        EffectiveLimits l = LimitDefaults.resolve(set, 3.3);
        assertEquals(0.5, l.overshootMaxV(), 0);
        assertEquals(0.5, l.undershootMaxV(), 0);
        assertEquals(0.2, l.ringbackMarginMinV(), 0);
        assertEquals(10e-9, l.settleMaxS(), 0);
        assertEquals(2e-9, l.delayMaxS(), 0);
        // 5 % of a 3.3 V swing (formats.md: settle_band is a fraction of the swing or a voltage)
        assertEquals(0.165, l.settleBandV(), 1e-15);
        assertTrue(l.monotonic());
        assertEquals(List.of(LimitName.CROSSINGS_MAX), l.defaulted());
        assertTrue(l.isDefaulted(LimitName.CROSSINGS_MAX));
        assertFalse(l.isDefaulted(LimitName.OVERSHOOT_MAX));
    }

    @Test
    void aReceiversLimitsOverrideTheNetsAndOthersStayDefaulted() {
        Limits net = Limits.of(Map.of(LimitName.OVERSHOOT_MAX, Value.of(0.5, Dimension.VOLTAGE)));
        Limits receiver = Limits.of(Map.of(LimitName.OVERSHOOT_MAX, Value.of(0.4, Dimension.VOLTAGE),
                LimitName.MONOTONIC, new Value.Flag(false), LimitName.CROSSINGS_MAX, Value.of(2, Dimension.DIMENSIONLESS)));
        EffectiveLimits l = LimitDefaults.resolve(net.overriddenBy(receiver), 1.8);
        assertEquals(0.4, l.overshootMaxV(), 0);
        assertFalse(l.monotonic());
        assertEquals(2, l.crossingsMax());
        // 5 % default of a 1.8 V swing (formats.md "Results")
        assertEquals(0.09, l.settleBandV(), 1e-15);
        assertEquals(List.of("undershoot_max", "ringback_margin_min", "settle_band"), l.defaultedKeys());
    }

    @Test
    void aSettleBandGivenAsAVoltageIsUsedAsIs() {
        Limits set = Limits.of(Map.of(LimitName.SETTLE_BAND, Value.of(0.1, Dimension.VOLTAGE)));
        EffectiveLimits l = LimitDefaults.resolve(set, 3.3);
        assertEquals(0.1, l.settleBandV(), 0);
        assertFalse(l.isDefaulted(LimitName.SETTLE_BAND));
    }

    @Test
    void wrongKindsOfValueAreRejectedNamingTheKey() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> LimitDefaults.resolve(
                Limits.of(Map.of(LimitName.OVERSHOOT_MAX, Value.of(5e-9, Dimension.TIME))), 3.3));
        assertTrue(e.getMessage().contains("`overshoot_max`"), e.getMessage());
        assertTrue(e.getMessage().contains("voltage"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> LimitDefaults.resolve(
                Limits.of(Map.of(LimitName.CROSSINGS_MAX, Value.of(1.5, Dimension.DIMENSIONLESS))), 3.3));
        assertThrows(IllegalArgumentException.class, () -> LimitDefaults.resolve(
                Limits.of(Map.of(LimitName.CROSSINGS_MAX, Value.of(0, Dimension.DIMENSIONLESS))), 3.3));
        assertThrows(IllegalArgumentException.class, () -> LimitDefaults.resolve(
                Limits.of(Map.of(LimitName.SETTLE_BAND, Value.of(-0.05, Dimension.DIMENSIONLESS))), 3.3));
        assertThrows(IllegalArgumentException.class, () -> LimitDefaults.resolve(
                Limits.of(Map.of(LimitName.MONOTONIC, new Value.Word("yes"))), 3.3));
        assertThrows(IllegalArgumentException.class, () -> LimitDefaults.resolve(
                Limits.of(Map.of(LimitName.DELAY_MAX, Value.of(0, Dimension.TIME))), 3.3));
        assertThrows(IllegalArgumentException.class, () -> LimitDefaults.resolve(Limits.NONE, 0));
        assertThrows(IllegalArgumentException.class, () -> LimitDefaults.resolve(
                Limits.of(Map.of(LimitName.RISE_MAX, Value.of(0, Dimension.TIME))), 3.3));
        assertThrows(IllegalArgumentException.class, () -> LimitDefaults.resolve(
                Limits.of(Map.of(LimitName.RISE_MAX, Value.of(0.3, Dimension.VOLTAGE))), 3.3));
    }

    @Test
    void riseMaxHasNoDefaultAndIsReadAsATime() {
        EffectiveLimits none = LimitDefaults.resolve(Limits.NONE, 3.3);
        assertTrue(!none.hasRiseMax());
        assertTrue(!none.isDefaulted(LimitName.RISE_MAX));
        EffectiveLimits set = LimitDefaults.resolve(Limits.of(Map.of(LimitName.RISE_MAX, Value.of(300e-9, Dimension.TIME))), 3.3);
        assertEquals(300e-9, set.riseMaxS(), 0);
    }
}
