package org.ringsweep.generators.models;

import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.ringsweep.api.circuit.DiodeModel;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.model.ReceiverContext;
import org.ringsweep.api.model.ReceiverModel;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.quantity.Dimension;

/**
 * The built-in {@code cmos} receiver: its input capacitance {@code c_in} from the pin to GND and,
 * with {@code clamp: rails}, two clamp diodes: GND → pin (anode on GND) and pin → {@code supply}
 * (anode on the pin). A {@code c_in} of 0 adds no capacitor.
 *
 * <p>The clamps use {@link #CLAMP}, one generic silicon junction (IS = 1e-14 A, N = 1,
 * RS = 5 Ω, CJO = 0). It is not any datasheet's model: it only shows whether an overshoot would
 * be clamped near a diode drop beyond the rail. Where the real clamp matters, use an IBIS model
 * of the part.
 */
public final class CmosReceiverModel implements ReceiverModel {
    /** The shared instance. */
    public static final CmosReceiverModel INSTANCE = new CmosReceiverModel();

    /** The generic clamp diode: IS = 1e-14 A, N = 1, RS = 5 Ω, CJO = 0 (not a datasheet model). */
    public static final DiodeModel CLAMP = new DiodeModel("dclamp", 1e-14, 1, 5, 0);

    private CmosReceiverModel() {
    }

    @Override
    public String id() {
        return BuiltinModels.CMOS;
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

    @Override
    public Thresholds thresholds(Receiver receiver, NetRails rails) {
        Parameters p = receiver.parameters();
        double vil = rails.voltageOrRail(p, "vil", "");
        double vih = rails.voltageOrRail(p, "vih", "");
        if (!(vih > vil)) {
            throw new ModelParameterException("vih", "vih `" + vih + "` V must be above vil `" + vil + "` V");
        }
        Optional<String> supply = p.get("supply").map(v -> v.display());
        if (supply.isPresent() && rails.volts(supply.get()).isEmpty()) {
            throw new ModelParameterException("supply", "rail `" + supply.get() + "` is not declared under rails; expected one of "
                    + String.join(", ", rails.asMap().keySet()));
        }
        return new Thresholds(vil, vih, supply);
    }

    @Override
    public double inputCapacitance(Receiver receiver) {
        return ModelParameters.nonNegative(receiver.parameters(), "c_in", 0);
    }

    @Override
    public void elaborate(Receiver receiver, ReceiverContext ctx) {
        Parameters p = receiver.parameters();
        Thresholds th = thresholds(receiver, ctx.rails());
        double cIn = ModelParameters.nonNegative(p, "c_in", Double.NaN);
        if (Double.isNaN(cIn)) {
            throw new ModelParameterException("c_in", "`c_in` is missing; expected a capacitance");
        }
        String pin = ctx.pinNode();
        if (cIn > 0) {
            ctx.add(new Primitive.Capacitor(ctx.newName("cin_" + receiver.pin()), pin, ctx.groundNode(), cIn));
        }
        String clamp = ModelParameters.word(p, "clamp", "none");
        switch (clamp) {
            case "none":
                break;
            case "rails":
                String supply = th.supply().orElseThrow(() -> new ModelParameterException("supply",
                        "clamp: rails needs supply: the rail the upper diode goes to"));
                ctx.add(new Primitive.Diode(ctx.newName("clo_" + receiver.pin()), ctx.groundNode(), pin, CLAMP));
                ctx.add(new Primitive.Diode(ctx.newName("chi_" + receiver.pin()), pin, ctx.railNode(supply), CLAMP));
                break;
            default:
                throw new ModelParameterException("clamp", "expected none or rails, found `" + clamp + "`");
        }
    }
}
