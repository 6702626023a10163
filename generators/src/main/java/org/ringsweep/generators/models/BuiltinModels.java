package org.ringsweep.generators.models;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.quantity.Dimension;

/** Descriptors of the built-in models: {@code ramp} (driver) and {@code cmos} (receiver). */
public final class BuiltinModels implements ModelCatalog {
    /** The built-in ramp driver id. */
    public static final String RAMP = "ramp";
    /** The built-in CMOS receiver id. */
    public static final String CMOS = "cmos";

    private static final ModelDescriptor RAMP_MODEL = new ModelDescriptor() {
        @Override
        public String id() {
            return RAMP;
        }

        @Override
        public Role role() {
            return Role.DRIVER;
        }

        @Override
        public String description() {
            return "linear Thevenin source: an ideal ramp between v_low and v_high behind r_out (or r_up/r_down)";
        }

        @Override
        public List<ParameterSpec> parameters() {
            return List.of(
                    ParameterSpec.voltageOrRail("v_high", "", true, "high level: a voltage or a rail name"),
                    ParameterSpec.voltageOrRail("v_low", "GND", false, "low level: a voltage or a rail name"),
                    ParameterSpec.number("rise", Dimension.TIME, "", true, "rising transition time between the edge_ref levels"),
                    ParameterSpec.number("fall", Dimension.TIME, "rise", false, "falling transition time; defaults to rise"),
                    ParameterSpec.word("edge_ref", Set.of("10-90", "20-80", "0-100"), "10-90", "levels rise and fall are measured between"),
                    ParameterSpec.number("r_out", Dimension.RESISTANCE, "", false, "output resistance for both states"),
                    ParameterSpec.number("r_up", Dimension.RESISTANCE, "r_out", false, "output resistance driving high"),
                    ParameterSpec.number("r_down", Dimension.RESISTANCE, "r_out", false, "output resistance driving low"),
                    ParameterSpec.number("delay", Dimension.TIME, "0", false, "extra delay before the first edge starts"));
        }

        @Override
        public List<Problem> check(Parameters given) {
            List<Problem> problems = new ArrayList<>();
            boolean both = given.has("r_up") && given.has("r_down");
            if (!given.has("r_out") && !both) {
                problems.add(new Problem(given.has("r_up") ? "r_down" : given.has("r_down") ? "r_up" : "r_out",
                        "expected r_out, or both r_up and r_down"));
            }
            return problems;
        }
    };

    private static final ModelDescriptor CMOS_MODEL = new ModelDescriptor() {
        @Override
        public String id() {
            return CMOS;
        }

        @Override
        public Role role() {
            return Role.RECEIVER;
        }

        @Override
        public String description() {
            return "CMOS input: capacitance to GND, input thresholds, optional clamp diodes to GND and supply";
        }

        @Override
        public List<ParameterSpec> parameters() {
            return List.of(
                    ParameterSpec.number("c_in", Dimension.CAPACITANCE, "", true, "input capacitance to GND"),
                    ParameterSpec.voltageOrRail("vih", "", true, "input high threshold"),
                    ParameterSpec.voltageOrRail("vil", "", true, "input low threshold"),
                    ParameterSpec.word("clamp", Set.of("none", "rails"), "none", "clamp diodes: none, or to GND and to supply"),
                    ParameterSpec.rail("supply", "", false, "the rail the receiver runs from (its high rail; required with clamp: rails)"));
        }

        @Override
        public List<Problem> check(Parameters given) {
            boolean clamps = given.get("clamp").map(v -> v.display().equals("rails")).orElse(false);
            if (clamps && !given.has("supply")) {
                return List.of(new Problem("supply", "clamp: rails needs supply: the rail the upper diode goes to"));
            }
            return List.of();
        }
    };

    @Override
    public List<ModelDescriptor> all() {
        return List.of(RAMP_MODEL, CMOS_MODEL);
    }
}
