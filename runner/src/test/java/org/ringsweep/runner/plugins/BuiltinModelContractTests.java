package org.ringsweep.runner.plugins;

import java.util.List;
import java.util.Map;
import org.ringsweep.generators.models.CmosReceiverModel;
import org.ringsweep.generators.models.IbisDriverModel;
import org.ringsweep.generators.models.IbisReceiverModel;
import org.ringsweep.generators.models.OpenDrainDriverModel;
import org.ringsweep.generators.models.RampDriverModel;
import org.ringsweep.runner.testing.ModelContract;

/** The model contract over every built-in model. */
class BuiltinModelContractTests extends ModelContract {
    /** The demo board's invented IBIS file (absolute, so the contract's temporary net file finds it). */
    private static final String DEMO_IBIS = java.nio.file.Path.of("..", "examples", "demo-board", "parts", "kx32.ibs")
            .toAbsolutePath().normalize().toString();

    @Override
    protected List<ModelCase> cases() {
        List<ModelCase> cases = List.of(
                new ModelCase(RampDriverModel.INSTANCE, Map.of("v_high", "VCC", "rise", "1ns", "r_out", "25")),
                new ModelCase(OpenDrainDriverModel.INSTANCE, Map.of("v_high", "VCC", "r_on", "20", "i2c_mode", "none")),
                new ModelCase(IbisDriverModel.INSTANCE, Map.of("file", DEMO_IBIS, "ibis_model", "io33")),
                new ModelCase(IbisReceiverModel.INSTANCE, Map.of("file", DEMO_IBIS, "ibis_model", "in33")),
                new ModelCase(CmosReceiverModel.INSTANCE, Map.of("c_in", "2pF", "vih", "2.0", "vil", "0.8")));
        // Every built-in model has a case: a new built-in must be added here.
        org.junit.jupiter.api.Assertions.assertEquals(PluginRegistry.builtInOnly().catalog().all().size(), cases.size(),
                "a contract case per built-in model");
        return cases;
    }
}
