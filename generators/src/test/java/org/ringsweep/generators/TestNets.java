package org.ringsweep.generators;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Limits;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.NetBuilder;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.net.Segment;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.quantity.Dimension;

/** Nets for tests, written in code the way the parser would build them. */
public final class TestNets {
    private TestNets() {
    }

    /** Parameters from key, value pairs: Double values become numbers of the given dimension map, Strings words. */
    public static Parameters params(Object... kv) {
        Map<String, Value> m = new LinkedHashMap<>();
        Map<String, Location> locs = new LinkedHashMap<>();
        for (int i = 0; i < kv.length; i += 2) {
            String key = (String) kv[i];
            Object v = kv[i + 1];
            m.put(key, v instanceof Value val ? val : v instanceof Number n ? Value.of(n.doubleValue(), dimensionOf(key)) : new Value.Word((String) v));
            locs.put(key, new Location("nets/test.yaml", 10 + i / 2, 7));
        }
        return Parameters.of(m, locs);
    }

    private static Dimension dimensionOf(String key) {
        switch (key) {
            case "rise": case "fall": case "delay":
                return Dimension.TIME;
            case "r_out": case "r_up": case "r_down":
                return Dimension.RESISTANCE;
            case "c_in":
                return Dimension.CAPACITANCE;
            case "length":
                return Dimension.LENGTH;
            case "z0":
                return Dimension.RESISTANCE;
            case "r_per_m":
                return Dimension.RESISTANCE_PER_LENGTH;
            case "g_per_m":
                return Dimension.CONDUCTANCE_PER_LENGTH;
            case "velocity":
                return Dimension.VELOCITY;
            case "er_eff":
                return Dimension.DIMENSIONLESS;
            default:
                return Dimension.VOLTAGE;
        }
    }

    public static Location at(int line) {
        return new Location("nets/test.yaml", line, 3);
    }

    public static Driver ramp(String pin, Object... kv) {
        return new Driver(pin, "ramp", params(kv), at(4));
    }

    public static Receiver cmos(String pin, Object... kv) {
        return new Receiver(pin, "cmos", params(kv), Limits.NONE, at(12));
    }

    public static Segment segment(String id, String from, String to, Object... kv) {
        return new Segment(id, from, to, params(kv), at(20));
    }

    public static Part part(String ref, Part.Kind kind, double value, String a, String b) {
        Dimension d = kind == Part.Kind.RESISTOR ? Dimension.RESISTANCE : kind == Part.Kind.CAPACITOR ? Dimension.CAPACITANCE : Dimension.INDUCTANCE;
        return new Part(ref, kind, a, b, Parameters.of(Map.of("value", Value.of(value, d)), Map.of("value", at(30))), at(30));
    }

    /** The example net of formats.md "Net file" (without limits and corners). */
    public static NetBuilder formatsExample() {
        return new NetBuilder("SPI0_SCK").source("nets/spi0_sck.yaml", "3f2a")
                .rail("VCC", 3.3)
                .driver(ramp("U1.14", "v_high", "VCC", "rise", 1.5e-9, "fall", 1.5e-9, "edge_ref", "10-90", "r_out", 18.0))
                .receiver(cmos("U7.6", "c_in", 4e-12, "vih", 2.0, "vil", 0.8, "clamp", "rails", "supply", "VCC"))
                .receiver(cmos("U9.2", "c_in", 4e-12, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.14", "R5.1", "z0", 50.0, "length", 4e-3, "er_eff", 3.4))
                .segment(segment("TL2", "R5.2", "J1", "z0", 50.0, "length", 60e-3, "er_eff", 3.4))
                .segment(segment("TL3", "J1", "U7.6", "z0", 55.0, "delay", 150e-12))
                .segment(segment("TL4", "J1", "U9.2", "z0", 55.0, "length", 25e-3, "er_eff", 3.4))
                .part(part("R5", Part.Kind.RESISTOR, 22, "R5.1", "R5.2"))
                .part(part("C9", Part.Kind.CAPACITOR, 2e-12, "J1", "GND"));
    }

    /** A driver, one line and one receiver. */
    public static NetBuilder pointToPoint(double rOut, double z0, double delay) {
        return new NetBuilder("p2p").rail("VCC", 3.3)
                .driver(ramp("U1.1", "v_high", "VCC", "rise", 1e-9, "r_out", rOut))
                .receiver(cmos("U2.1", "c_in", 1e-12, "vih", 2.0, "vil", 0.8))
                .segment(segment("TL1", "U1.1", "U2.1", "z0", z0, "delay", delay));
    }

    public static List<String> lines(String deck) {
        return List.of(deck.split("\n", -1));
    }
}
