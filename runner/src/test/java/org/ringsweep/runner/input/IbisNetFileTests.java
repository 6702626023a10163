package org.ringsweep.runner.input;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.models.BuiltinModels;

/**
 * Net files naming IBIS models (formats.md "Driver and receiver models by file"): the `file` key
 * is free text relative to the net file, and corners named slow and fast select the IBIS min and
 * max columns unless the corner sets `ibis_corner` itself. The expected supply voltages are the
 * [Voltage Range] columns of examples/demo-board/parts/kx32.ibs (3.3 V typ, 3.0 V min, 3.6 V max).
 */
class IbisNetFileTests {
    private static final Path NET = Path.of("..", "examples", "demo-board", "ibis", "cs-flash-ibis.yaml");
    private final NetFileLoader loader = new NetFileLoader(new BuiltinModels());

    @TempDir
    Path dir;

    @Test
    void slowAndFastCornersSelectTheMinAndMaxColumnsUnlessTheCornerSaysOtherwise() {
        Net net = loader.load(NET);
        assertEquals(new Value.Word("min"), net.corners().get("slow").values().get(new ValuePath("U1.16", "ibis_corner")));
        assertEquals(new Value.Word("max"), net.corners().get("fast").values().get(new ValuePath("U7.1", "ibis_corner")));
        var own = net.corners().get("weak-typ-supply").values();
        assertEquals(new Value.Word("typ"), own.get(new ValuePath("U1.16", "ibis_corner")));
        assertEquals(new Value.Word("min"), own.get(new ValuePath("U7.1", "ibis_corner")));
    }

    private static double pullupSupply(Elaboration e) {
        return e.circuit().primitives().stream().filter(p -> p instanceof Primitive.DcVoltage v && v.name().startsWith("vpu"))
                .mapToDouble(p -> ((Primitive.DcVoltage) p).volts()).findFirst().orElseThrow();
    }

    @Test
    void theIbisFileIsFoundRelativeToTheNetFileAndTheCornerPicksItsColumn() {
        Net net = loader.load(NET);
        Elaborator elaborator = new Elaborator();
        assertEquals(3.3, pullupSupply(elaborator.elaborate(net, "typ")), 0);
        assertEquals(3.0, pullupSupply(elaborator.elaborate(net.with(net.corners().get("slow")), "slow")), 0);
        assertEquals(3.6, pullupSupply(elaborator.elaborate(net.with(net.corners().get("fast")), "fast")), 0);
        // in33's thresholds come from the file (Vinl = 0.8V, Vinh = 2.0V)
        Elaboration e = elaborator.elaborate(net, "typ");
        assertEquals(0.8, e.receivers().get(0).vil(), 0);
        assertEquals(2.0, e.receivers().get(0).vih(), 0);
    }

    @Test
    void theDemoNetsComponentPinsCarryThePackageAndTheHalfDriveCornerSelectsItsModel() {
        Net net = loader.load(NET);
        Elaboration typ = new Elaborator().elaborate(net, "typ");
        // kx32.ibs [Package] typ R_pkg 0.25 Ω, on the driver (pin 1) and the receiver (pin 3)
        assertEquals(2, typ.circuit().primitives().stream().filter(p -> p instanceof Primitive.Resistor r && r.name().startsWith("rpkg")
                && r.ohms() == 0.25).count());
        assertEquals(new Value.Word("io33_half"), net.corners().get("half-drive").values().get(new ValuePath("U1.16", "ibis_select")));
    }

    @Test
    void packageFalseIsAFlagThatLeavesThePackageOut() throws IOException {
        Path parts = Files.createDirectories(dir.resolve("parts"));
        Files.copy(NET.resolveSibling("../parts/kx32.ibs").normalize(), parts.resolve("kx32.ibs"));
        Path f = write("""
                format: ringsweep/net-1
                net: X
                rails: { VCC: 3.3 }
                drivers:
                  - { pin: U1.1, model: ibis, file: parts/kx32.ibs, component: KX32, ibis_pin: "2", package: false }
                receivers:
                  - { pin: U2.1, model: cmos, c_in: 1pF, vih: 2, vil: 0.8 }
                segments:
                  - { from: U1.1, to: U2.1, z0: 50, delay: 1ns }
                """);
        Net net = loader.load(f);
        assertEquals(new Value.Flag(false), net.drivers().get(0).parameters().get("package").orElseThrow());
        Elaboration e = new Elaborator().elaborate(net, "typ");
        assertTrue(e.circuit().primitives().stream().noneMatch(p -> p.name().startsWith("rpkg") || p.name().startsWith("lpkg")));
    }

    private Path write(String text) throws IOException {
        Path f = dir.resolve("net.yaml");
        Files.writeString(f, text);
        return f;
    }

    @Test
    void anIbisDriverWithoutAModelChoiceIsAnInputError() throws IOException {
        Path f = write("""
                format: ringsweep/net-1
                net: X
                drivers:
                  - { pin: U1.1, model: ibis, file: parts/a.ibs }
                receivers:
                  - { pin: U2.1, model: cmos, c_in: 1pF, vih: 2, vil: 0.8 }
                segments:
                  - { from: U1.1, to: U2.1, z0: 50, delay: 1ns }
                """);
        InputException x = assertThrows(InputException.class, () -> loader.load(f));
        assertTrue(x.getMessage().contains("ibis_model") && x.getMessage().contains(":4:"), x.getMessage());
    }

    @Test
    void anEmptyFileKeyIsAnInputError() throws IOException {
        Path f = write("""
                format: ringsweep/net-1
                net: X
                drivers:
                  - { pin: U1.1, model: ibis, file: "", ibis_model: io33 }
                receivers:
                  - { pin: U2.1, model: cmos, c_in: 1pF, vih: 2, vil: 0.8 }
                segments:
                  - { from: U1.1, to: U2.1, z0: 50, delay: 1ns }
                """);
        InputException x = assertThrows(InputException.class, () -> loader.load(f));
        assertTrue(x.getMessage().contains("drivers[0].file") && x.getMessage().contains("expected text"), x.getMessage());
    }
}
