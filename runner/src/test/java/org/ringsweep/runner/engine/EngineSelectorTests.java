package org.ringsweep.runner.engine;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ringsweep.runner.testing.Ngspice;

class EngineSelectorTests {

    @Test
    void builtinIsTheInProcessEngine() {
        SimulationEngine e = EngineSelector.select("builtin", Map.of());
        assertEquals("builtin", e.name());
        assertTrue(e instanceof CircuitEngine);
    }

    @Test
    void autoWithoutNgspiceFallsBackToTheBuiltInEngine() {
        assertEquals("builtin", EngineSelector.select(EngineChoice.AUTO, Map.of("PATH", "/nonexistent")).name());
    }

    @Test
    void binaryVariableNamingNoFileIsReportedByName() {
        Map<String, String> env = Map.of(NgspiceEngine.BINARY_VARIABLE, "/nonexistent/ngspice", "PATH", "/usr/bin:/bin");
        assertTrue(NgspiceEngine.locate(env).isEmpty());
        EngineNotFoundException e = assertThrows(EngineNotFoundException.class,
                () -> EngineSelector.select(EngineChoice.NGSPICE, env));
        assertTrue(e.getMessage().contains("RINGSWEEP_NGSPICE names `/nonexistent/ngspice`"), e.getMessage());
    }

    @Test
    void autoAndNgspiceFindNgspiceOnThePath() {
        Path binary = Ngspice.require();
        Map<String, String> env = Map.of("PATH", binary.getParent().toString());
        assertEquals("ngspice", EngineSelector.select("auto", env).name());
        assertEquals("ngspice", EngineSelector.select("NGSPICE", env).name());
    }

    @Test
    void unknownChoiceNamesTheAcceptedOnes() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> EngineChoice.parse("spice3"));
        assertEquals("unknown engine `spice3`; expected `auto`, `ngspice` or `builtin`", e.getMessage());
        assertEquals("builtin", EngineChoice.BUILTIN.toString());
    }
}
