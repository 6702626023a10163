package org.ringsweep.generators.models;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.ringsweep.generators.TestNets.params;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Stimulus;

/**
 * Choosing a model through a {@code [Model Selector]}. The expected choices are read off the file
 * text below (IBIS rule: the first entry of a selector is the default).
 */
class IbisModelSelectorTests {
    @TempDir
    Path dir;

    private static String model(String name, String rampDt) {
        return "[Model] " + name + "\nModel_type Output\nC_comp 2p NA NA\n[Voltage Range] 3.3 NA NA\n"
                + "[Pulldown]\n-5 -0.25 NA NA\n10 0.5 NA NA\n[Pullup]\n-5 0.2 NA NA\n10 -0.4 NA NA\n"
                + "[Ramp]\ndV/dt_r 1.5/" + rampDt + " NA NA\ndV/dt_f 1.5/" + rampDt + " NA NA\n";
    }

    @BeforeEach
    void writeFile() throws Exception {
        String text = "[IBIS Ver] 4.2\n"                          // 1
                + "[Component] SEL1\n"                            // 2
                + "[Manufacturer] ringsweep tests\n"              // 3
                + "[Pin] signal_name model_name\n"                // 4
                + "1 OUT io_sel\n"                                // 5
                + "2 BAD bad_sel\n"                               // 6
                + "[Model Selector] io_sel\n"                     // 7
                + "fast  full drive\n"                            // 8
                + "slow  half drive\n"                            // 9
                + "[Model Selector] bad_sel\n"                    // 10
                + "gone  not defined below\n"                     // 11
                + model("fast", "0.5n") + model("slow", "1.5n") + "[End]\n";
        Files.writeString(dir.resolve("sel.ibs"), text);
    }

    private Driver driver(Object... kv) {
        Object[] all = new Object[kv.length + 2];
        all[0] = "file";
        all[1] = "sel.ibs";
        System.arraycopy(kv, 0, all, 2, kv.length);
        return new Driver("U1.1", "ibis", params(all), new Location(dir.resolve("net.yaml").toString(), 4, 3));
    }

    @Test
    void aSelectorNameChoosesItsFirstEntryUnlessIbisSelectNamesAnother() {
        assertEquals("fast", IbisSelection.of(driver("ibis_model", "io_sel")).model().name());
        assertEquals("slow", IbisSelection.of(driver("ibis_model", "io_sel", "ibis_select", "slow")).model().name());
        assertEquals("fast", IbisSelection.of(driver("component", "SEL1", "ibis_pin", "1")).model().name(), "a [Pin] row naming the selector");
        assertEquals("slow", IbisSelection.of(driver("component", "SEL1", "ibis_pin", "1", "ibis_select", "slow")).model().name());
        // the chosen model times the edges: [Ramp] dt/0.6 of `slow` (lines-and-terminations.md §6)
        assertEquals(1.5e-9 / 0.6, IbisDriverModel.INSTANCE.fullTransition(driver("ibis_model", "io_sel", "ibis_select", "slow"),
                Stimulus.Edge.RISE, new org.ringsweep.api.model.NetRails(java.util.Map.of())), 1e-21);
    }

    @Test
    void anUnknownEntryIsAnErrorNamingTheFileLineAndTheValidChoices() {
        ModelParameterException e = assertThrows(ModelParameterException.class,
                () -> IbisSelection.of(driver("ibis_model", "io_sel", "ibis_select", "medium")));
        assertEquals("ibis_select", e.key());
        assertTrue(e.getMessage().contains("`medium`") && e.getMessage().contains("sel.ibs:7: [Model Selector] io_sel")
                && e.getMessage().contains("expected one of fast, slow"), e.getMessage());
    }

    @Test
    void anEntryNamingNoModelIsAnErrorNamingTheSelectorsLine() {
        ModelParameterException e = assertThrows(ModelParameterException.class,
                () -> IbisSelection.of(driver("component", "SEL1", "ibis_pin", "2")));
        assertTrue(e.getMessage().contains("sel.ibs:10: [Model Selector] bad_sel") && e.getMessage().contains("`gone`"), e.getMessage());
    }

    @Test
    void ibisSelectWithAPlainModelIsAnError() {
        ModelParameterException e = assertThrows(ModelParameterException.class,
                () -> IbisSelection.of(driver("ibis_model", "fast", "ibis_select", "slow")));
        assertEquals("ibis_select", e.key());
        assertTrue(e.getMessage().contains("not a [Model Selector]"), e.getMessage());
    }

    @Test
    void anUnknownNameListsModelsAndSelectors() {
        ModelParameterException e = assertThrows(ModelParameterException.class, () -> IbisSelection.of(driver("ibis_model", "io")));
        assertTrue(e.getMessage().contains("expected one of fast, slow, io_sel, bad_sel"), e.getMessage());
    }
}
