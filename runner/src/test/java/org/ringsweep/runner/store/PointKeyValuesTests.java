package org.ringsweep.runner.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.LinkedHashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;

class PointKeyValuesTests {
    @Test
    void valuesReadBackFromTheKeyExactlyEscapesIncluded() {
        Map<String, Double> point = new LinkedHashMap<>();
        point.put("R5/value", 22.0);
        point.put("U1.14/rise", 1.5e-9);
        point.put("odd%;=/x", -0.0);
        point.put("R7/value", 0.1 + 0.2); // 0.30000000000000004: Double.toString round-trips every double
        String key = PointKey.of("slow", point);
        // docs/results-store.md "Point key": % ; = written as %25 %3B %3D
        assertEquals("corner=slow;R5/value=22.0;R7/value=0.30000000000000004;U1.14/rise=1.5E-9;odd%25%3B%3D/x=-0.0", key);
        assertEquals(new java.util.TreeMap<>(point), new java.util.TreeMap<>(PointKey.values(key)));
        assertEquals(Double.doubleToRawLongBits(-0.0), Double.doubleToRawLongBits(PointKey.values(key).get("odd%;=/x")));
        assertEquals(Map.of(), PointKey.values("corner=typ"));
        assertThrows(IllegalArgumentException.class, () -> PointKey.values("R5/value=22.0"));
    }
}
