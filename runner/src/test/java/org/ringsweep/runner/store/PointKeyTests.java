package org.ringsweep.runner.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.util.LinkedHashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The canonical point key documented in docs/results-store.md. */
class PointKeyTests {
    @Test
    void pathsComeInSortedOrderWithJavaDoubleText() {
        Map<String, Double> point = new LinkedHashMap<>();
        point.put("U1.14/rise", 1.5e-9);
        point.put("R5/value", 22.0);
        // Double.toString(1.5e-9) is "1.5E-9" (Java SE API, Double.toString: computerized
        // scientific notation below 10^-3).
        assertEquals("corner=typ;R5/value=22.0;U1.14/rise=1.5E-9", PointKey.of("typ", point));
    }

    @Test
    void insertionOrderDoesNotChangeTheKey() {
        Map<String, Double> a = new LinkedHashMap<>();
        a.put("B/x", 1.0);
        a.put("A/y", 2.0);
        assertEquals(PointKey.of("slow", Map.of("A/y", 2.0, "B/x", 1.0)), PointKey.of("slow", a));
    }

    @Test
    void separatorsInsideNamesAreEscaped() {
        assertEquals("corner=a%3Bb%3Dc%25;R%3B1/value=1.0", PointKey.of("a;b=c%", Map.of("R;1/value", 1.0)));
        assertNotEquals(PointKey.of("typ;R1/value=1.0", Map.of()), PointKey.of("typ", Map.of("R1/value", 1.0)));
    }

    @Test
    void aPlainCheckHasOnlyTheCorner() {
        assertEquals("corner=fast", PointKey.of("fast", Map.of()));
    }
}
