package org.ringsweep.runner.input;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.LimitName;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Point;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.net.Segment;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.generators.models.BuiltinModels;

class NetFileLoaderTests {
    private final NetFileLoader loader = new NetFileLoader(new BuiltinModels());

    @TempDir
    Path dir;

    private static Path example() throws URISyntaxException {
        // a verbatim copy of the example in /work/shared/design/formats.md, "Net file"
        return Path.of(NetFileLoaderTests.class.getResource("/nets/formats-example.yaml").toURI());
    }

    private Path write(String name, String text) throws IOException {
        Path f = dir.resolve(name);
        Files.writeString(f, text, StandardCharsets.UTF_8);
        return f;
    }

    private static final String SMALL = """
            format: ringsweep/net-1
            net: CLK
            drivers:
              - { pin: U1.1, model: ramp, v_high: 1.8V, rise: 1ns, r_out: 20 }
            receivers:
              - { pin: U2.1, model: cmos, c_in: 3pF, vih: 1.2, vil: 0.6 }
            """;

    @Test
    void loadsTheFormatsExampleWithItsValues() throws Exception {
        Net net = loader.load(example());
        // values as written in formats.md "Net file"
        assertEquals("SPI0_SCK", net.name());
        assertEquals(Map.of("GND", 0.0, "VCC", 3.3), net.rails());
        Driver d = net.drivers().get(0);
        assertEquals("U1.14", d.pin());
        assertEquals("ramp", d.model());
        assertEquals(new Value.Word("VCC"), d.parameters().get("v_high").orElseThrow());
        assertEquals(Value.of(1.5e-9, Dimension.TIME), d.parameters().get("rise").orElseThrow());
        assertEquals(Value.of(1.5e-9, Dimension.TIME), d.parameters().get("fall").orElseThrow());
        assertEquals(new Value.Word("10-90"), d.parameters().get("edge_ref").orElseThrow());
        assertEquals(Value.of(18, Dimension.RESISTANCE), d.parameters().get("r_out").orElseThrow());
        Receiver r = net.receivers().get(0);
        assertEquals("cmos", r.model());
        assertEquals(4e-12, r.parameters().number("c_in"));
        assertEquals(Value.of(2.0, Dimension.VOLTAGE), r.parameters().get("vih").orElseThrow());
        assertEquals(Value.of(0.8, Dimension.VOLTAGE), r.parameters().get("vil").orElseThrow());
        assertEquals(new Value.Word("rails"), r.parameters().get("clamp").orElseThrow());
        assertEquals(new Value.Word("VCC"), r.parameters().get("supply").orElseThrow());
    }

    @Test
    void computesSegmentDelaysByTheFormatsFormula() throws Exception {
        List<Segment> s = loader.load(example()).segments();
        assertEquals(List.of("TL1", "TL2", "TL3", "TL4"), s.stream().map(Segment::id).toList());
        // formats.md: delay = length * sqrt(er_eff) / c, c = 299 792 458 m/s
        assertEquals(4e-3 * Math.sqrt(3.4) / 299_792_458.0, s.get(0).delaySeconds(), 1e-24);
        assertEquals(60e-3 * Math.sqrt(3.4) / 299_792_458.0, s.get(1).delaySeconds(), 1e-24);
        assertEquals(150e-12, s.get(2).delaySeconds());
        assertEquals(55.0, s.get(2).z0());
        assertEquals("J1", s.get(3).from());
        assertEquals("U9.2", s.get(3).to());
        assertEquals(Value.of(0.025, Dimension.LENGTH), s.get(3).parameters().get("length").orElseThrow());
    }

    @Test
    void loadsPartsStimulusLimitsAndCorners() throws Exception {
        Net net = loader.load(example());
        Part r5 = net.parts().get(0);
        assertEquals(Part.Kind.RESISTOR, r5.kind());
        assertEquals(List.of("R5.1", "R5.2"), r5.points());
        assertEquals(22.0, r5.value());
        Part c9 = net.parts().get(1);
        assertEquals(Part.Kind.CAPACITOR, c9.kind());
        assertEquals(2e-12, c9.value());
        assertEquals(List.of("J1", "GND"), c9.points());
        assertEquals(List.of(Stimulus.Edge.RISE, Stimulus.Edge.FALL), net.stimulus().edges());
        assertTrue(net.stimulus().isSettleAuto());
        assertTrue(net.simulation().isStopAuto() && net.simulation().isStepAuto());
        Map<LimitName, Value> limits = net.limits().asMap();
        assertEquals(Value.of(0.5, Dimension.VOLTAGE), limits.get(LimitName.OVERSHOOT_MAX));
        assertEquals(Value.of(0.5, Dimension.VOLTAGE), limits.get(LimitName.UNDERSHOOT_MAX));
        assertEquals(Value.of(0.2, Dimension.VOLTAGE), limits.get(LimitName.RINGBACK_MARGIN_MIN));
        assertEquals(Value.of(10e-9, Dimension.TIME), limits.get(LimitName.SETTLE_MAX));
        assertEquals(Value.of(0.05, Dimension.DIMENSIONLESS), limits.get(LimitName.SETTLE_BAND));
        assertEquals(new Value.Flag(true), limits.get(LimitName.MONOTONIC));
        assertEquals(Value.of(2e-9, Dimension.TIME), limits.get(LimitName.DELAY_MAX));
        assertEquals(List.of("slow", "fast"), List.copyOf(net.corners().keySet()));
        Point slow = net.corners().get("slow");
        assertEquals(Value.of(2.5e-9, Dimension.TIME), slow.values().get(new ValuePath("U1.14", "rise")));
        assertEquals(Value.of(25, Dimension.RESISTANCE), slow.values().get(new ValuePath("U1.14", "r_out")));
        assertEquals(12.0, ((Value.Number) net.corners().get("fast").values().get(new ValuePath("U1.14", "r_out"))).si());
    }

    @Test
    void recordsTheSourceAsGivenAndTheSha256OfItsBytes() throws Exception {
        Path f = example();
        Net net = loader.load(f);
        assertEquals(f.toString(), net.source());
        // reference: the JDK's SHA-256 (FIPS 180-4) over the same bytes
        String expected = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(f)));
        assertEquals(expected, net.sourceHash());
    }

    @Test
    void recordsWhereEachParameterWasWritten() throws Exception {
        Path f = example();
        List<String> lines = Files.readAllLines(f);
        int riseLine = 1 + lines.indexOf(lines.stream().filter(l -> l.strip().startsWith("rise:")).findFirst().orElseThrow());
        Driver d = loader.load(f).drivers().get(0);
        assertEquals(riseLine, d.parameters().locationOf("rise").line());
        assertEquals(lines.get(riseLine - 1).indexOf("1.5ns") + 1, d.parameters().locationOf("rise").column());
        assertEquals(f.toString(), d.parameters().locationOf("rise").file());
    }

    @Test
    void namesSegmentsWithoutIdByTheirPositionAndReadsVelocity() throws IOException {
        Net net = loader.load(write("ids.yaml", SMALL + """
                segments:
                  - { from: U1.1, to: J1, z0: 50, length: 150mm, velocity: 150mm/ns }
                  - { from: J1, to: U2.1, z0: 50, delay: 1ns }
                """));
        assertEquals(List.of("TL1", "TL2"), net.segments().stream().map(Segment::id).toList());
        // delay = length / velocity (formats.md): 0.15 m at 1.5e8 m/s is 1 ns
        assertEquals(1e-9, net.segments().get(0).delaySeconds(), 1e-24);
        assertEquals(Value.of(1.8, Dimension.VOLTAGE), net.drivers().get(0).parameters().get("v_high").orElseThrow());
    }

    @Test
    void readsAPeriodicStimulusAndSimulationTimes() throws IOException {
        Net net = loader.load(write("clock.yaml", SMALL + """
                segments: [ { from: U1.1, to: U2.1, z0: 50, delay: 1ns } ]
                stimulus: { period: 100ns, cycles: 3 }
                simulation: { stop: 400ns, step: 10ps }
                """));
        assertTrue(net.stimulus().isPeriodic());
        assertEquals(100e-9, net.stimulus().periodSeconds());
        assertEquals(3, net.stimulus().cycles());
        assertEquals(400e-9, net.simulation().stopSeconds());
        assertEquals(10e-12, net.simulation().stepSeconds());
    }

    @Test
    void acceptsAZeroOhmResistorAndReceiverLimits() throws IOException {
        Net net = loader.load(write("zero.yaml", """
                format: ringsweep/net-1
                net: CLK
                drivers:
                  - { pin: U1.1, model: ramp, v_high: 1.8V, rise: 1ns, r_up: 20, r_down: 15 }
                receivers:
                  - { pin: U2.1, model: cmos, c_in: 3pF, vih: 1.2, vil: 0.6, limits: { settle_band: 50mV, crossings_max: 2 } }
                parts:
                  - { ref: R1, kind: resistor, value: 0, between: [U1.1, U2.1] }
                """));
        assertEquals(0.0, net.parts().get(0).value());
        assertEquals(Value.of(0.05, Dimension.VOLTAGE), net.receivers().get(0).limits().asMap().get(LimitName.SETTLE_BAND));
        assertEquals(Value.of(2, Dimension.DIMENSIONLESS), net.receivers().get(0).limits().asMap().get(LimitName.CROSSINGS_MAX));
    }

    @Test
    void reportsAMissingFile() {
        Path f = dir.resolve("nets/none.yaml");
        InputException e = assertThrows(InputException.class, () -> loader.load(f));
        assertEquals(f + ": no such file; expected a net file (YAML with `format: ringsweep/net-1`)", e.getMessage());
    }

    @Test
    void reportsAnEmptyFileAndOneWithOnlyComments() throws IOException {
        for (String text : List.of("", "# nothing here\n")) {
            InputException e = assertThrows(InputException.class, () -> loader.load(write("empty.yaml", text)));
            assertTrue(e.getMessage().endsWith("empty.yaml: the file is empty; expected a net file starting with `format: ringsweep/net-1`"),
                    e.getMessage());
        }
    }

    @Test
    void reportsAFileThatIsNotUtf8() throws IOException {
        Path f = dir.resolve("latin1.yaml");
        Files.write(f, new byte[] {'n', 'e', 't', ':', ' ', (byte) 0xE9});
        InputException e = assertThrows(InputException.class, () -> loader.load(f));
        assertTrue(e.getMessage().contains("is not UTF-8 text"), e.getMessage());
    }

    @Test
    void namesASweepFileGivenAsANet() throws IOException {
        InputException e = assertThrows(InputException.class,
                () -> loader.load(write("sweep.yaml", "format: ringsweep/sweep-1\nnets: [a.yaml]\n")));
        assertEquals(dir.resolve("sweep.yaml") + ":1:9: format: expected `ringsweep/net-1`, found `ringsweep/sweep-1`"
                + " (that is a sweep file: run it with `ringsweep sweep`)", e.getMessage());
    }

    @Test
    void rejectsVelocityFasterThanLight() throws IOException {
        InputException e = assertThrows(InputException.class, () -> loader.load(write("fast.yaml", SMALL
                + "segments: [ { from: U1.1, to: U2.1, z0: 50, length: 1m, velocity: 3e8 } ]\n")));
        // c = 299 792 458 m/s exactly (SI definition of the metre), so 3e8 m/s is impossible
        assertEquals("segments[0].velocity", e.key());
    }
}
