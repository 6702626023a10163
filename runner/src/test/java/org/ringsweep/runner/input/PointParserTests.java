package org.ringsweep.runner.input;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Point;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.generators.models.BuiltinModels;

class PointParserTests {
    private final PointParser parser = new PointParser(new BuiltinModels());
    private Net net;

    @TempDir
    Path dir;

    @BeforeEach
    void loadTheFormatsExample() throws URISyntaxException {
        net = new NetFileLoader(new BuiltinModels()).load(Path.of(getClass().getResource("/nets/formats-example.yaml").toURI()));
    }

    private Point set(String... options) {
        return parser.parse(net, Arrays.stream(options).map(PointParser::fromSetOption).toList());
    }

    private InputException failure(String option) {
        return assertThrows(InputException.class, () -> set(option));
    }

    @Test
    void readsSetOptionsIntoValues() {
        Point p = set("U1.14/rise=2ns", "R5/value=4k7", "TL2/length = 500mil", "U1.14/v_high=GND", "U7.6/clamp=none");
        // 4k7 = 4700 ohm (IEC 60062, reference §6); 500 mil = 0.0127 m exactly (1 in = 25.4 mm)
        assertEquals(Value.of(2e-9, Dimension.TIME), p.values().get(new ValuePath("U1.14", "rise")));
        assertEquals(Value.of(4700, Dimension.RESISTANCE), p.values().get(new ValuePath("R5", "value")));
        assertEquals(Value.of(0.0127, Dimension.LENGTH), p.values().get(new ValuePath("TL2", "length")));
        assertEquals(new Value.Word("GND"), p.values().get(new ValuePath("U1.14", "v_high")));
        assertEquals(new Value.Word("none"), p.values().get(new ValuePath("U7.6", "clamp")));
        assertEquals(4700.0, net.with(p).parts().get(0).value());
    }

    @Test
    void letsTheLastOfTwoAssignmentsWin() {
        Point p = set("R5/value=10", "R5/value=33");
        assertEquals(Value.of(33, Dimension.RESISTANCE), p.values().get(new ValuePath("R5", "value")));
    }

    @Test
    void rejectsASetOptionWithoutEquals() {
        InputException e = assertThrows(InputException.class, () -> PointParser.fromSetOption("R5/value"));
        assertEquals("--set: expected ID/param=value such as `R5/value=33` or `U1.14/rise=2ns`, found `R5/value`", e.getMessage());
    }

    @Test
    void listsTheValidIdsForAnUnknownId() {
        InputException e = failure("R6/value=22");
        assertEquals("--set: R6/value: no element `R6` on net SPI0_SCK; expected one of: U1.14, U7.6, TL1, TL2, TL3, TL4, R5, C9",
                e.getMessage());
        assertEquals("--set", e.file());
        assertEquals("R6/value", e.key());
    }

    @Test
    void listsTheValidParamsForAnUnknownParam() {
        assertTrue(failure("TL2/width=1mm").getMessage().endsWith(
                "unknown parameter `width` for segment TL2; expected one of: z0, delay, length, er_eff, velocity, r_per_m, g_per_m"));
        assertTrue(failure("R5/tolerance=1%").getMessage().endsWith("expected one of: value"));
        assertTrue(failure("U7.6/rise=1ns").getMessage().endsWith("expected one of: c_in, vih, vil, clamp, supply"));
    }

    @Test
    void checksKindAndSignOfValues() {
        assertTrue(failure("U1.14/rise=3pF").getMessage().endsWith("found `3pF` (a capacitance)"));
        assertTrue(failure("TL1/z0=0").getMessage().endsWith("expected a positive impedance such as `50` or `50ohm`, found `0`"));
        assertTrue(failure("C9/value=0").getMessage().contains("positive capacitance"));
        assertEquals(Value.of(0, Dimension.RESISTANCE), set("R5/value=0").values().get(new ValuePath("R5", "value")));
        assertTrue(failure("U1.14/v_high=VDD").getMessage().contains("rail declared under rails (GND, VCC), found `VDD`"));
        assertTrue(failure("U1.14/edge_ref=30-70").getMessage().contains("expected one of `0-100`, `10-90`, `20-80`"));
    }

    @Test
    void refusesOverridesThatADelaySegmentWouldIgnore() {
        // TL3 is given by delay: a length would be shadowed (Segment.delaySeconds reads delay first)
        assertTrue(failure("TL3/length=30mm").getMessage().contains("expected `TL3/delay`"));
        assertTrue(failure("TL1/velocity=1.5e8").getMessage().contains("expected `TL1/er_eff`"));
        assertEquals(Value.of(100e-12, Dimension.TIME), set("TL1/delay=100ps").values().get(new ValuePath("TL1", "delay")));
    }

    @Test
    void checksTheModelsCombinationRulesWithTheOverridesApplied() throws Exception {
        Net noClamp = new NetFileLoader(new BuiltinModels()).load(Files.writeString(dir.resolve("clamp.yaml"), """
                        format: ringsweep/net-1
                        net: N
                        drivers: [ { pin: U1.1, model: ramp, v_high: 1.8, rise: 1ns, r_out: 20 } ]
                        receivers: [ { pin: U2.1, model: cmos, c_in: 3pF, vih: 1.2, vil: 0.6 } ]
                        segments: [ { from: U1.1, to: U2.1, z0: 50, delay: 1ns } ]
                        """));
        InputException e = assertThrows(InputException.class,
                () -> parser.parse(noClamp, List.of(PointParser.fromSetOption("U2.1/clamp=rails"))));
        assertEquals("U2.1/supply", e.key());
    }

    @Test
    void prefixesKeysAndKeepsLocations() {
        Location at = new Location("nets/a.yaml", 7, 12);
        InputException e = assertThrows(InputException.class,
                () -> parser.parse(net, List.of(new PointParser.Assignment("U1.14/r_out", "-1", at)), "corners.slow"));
        assertTrue(e.getMessage().startsWith("nets/a.yaml:7:12: corners.slow.U1.14/r_out: expected a positive resistance"), e.getMessage());
    }

    @Test
    void rejectsAPathWithoutSlash() {
        assertTrue(failure("R5=22").getMessage().contains("expected a path ID/param such as `R5/value`"));
    }
}
