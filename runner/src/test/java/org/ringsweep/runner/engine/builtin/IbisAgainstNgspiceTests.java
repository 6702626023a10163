package org.ringsweep.runner.engine.builtin;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.wave.Waveforms;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.engine.SimulationOutcome;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.testing.Ngspice;

/**
 * The demo board's IBIS net (examples/demo-board/ibis/cs-flash-ibis.yaml: the KX32's io33 driver
 * and in33 receiver from parts/kx32.ibs, V–I tables as table-driven current sources) on the
 * built-in engine against ngspice, the reference simulator, at every corner of the net: each
 * receiver edge within the tolerances of {@link NgspiceCrossValidationTests} (v_max and v_min
 * within 1 % of the swing, first threshold crossing within 10 ps + 1 % of its delay).
 */
class IbisAgainstNgspiceTests {
    private static final Path NET = Path.of("..", "examples", "demo-board", "ibis", "cs-flash-ibis.yaml");

    @TempDir
    Path dir;

    @ParameterizedTest(name = "corner {0}")
    @ValueSource(strings = {"typ", "slow", "fast", "weak-typ-supply"})
    void theIbisDemoNetAgreesWithNgspiceOnEveryEdge(String corner) throws IOException {
        Path ngspice = Ngspice.require();
        Net net = new NetFileLoader(new BuiltinModels()).load(NET);
        Net at = corner.equals("typ") ? net : net.with(net.corners().get(corner));
        Elaboration e = new Elaborator().elaborate(at, corner);
        Waveforms ref = Circuits.ngspice(ngspice, e.circuit(), Files.createDirectories(dir.resolve(corner)));
        SimulationOutcome mine = new BuiltinEngine().solve(e.circuit(), Duration.ofSeconds(60));
        if (!(mine instanceof SimulationOutcome.Success ok)) {
            throw new AssertionError("built-in engine failed: " + mine);
        }
        NgspiceCrossValidationTests.compare(e, ref, ok.waveforms(), NET + " corner " + corner, false);
    }
}
