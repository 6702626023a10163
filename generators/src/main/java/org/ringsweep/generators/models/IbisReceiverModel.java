package org.ringsweep.generators.models;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.model.NetRails;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.model.ReceiverContext;
import org.ringsweep.api.model.ReceiverModel;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.generators.ibis.IbisCorner;
import org.ringsweep.generators.ibis.IbisModel;

/**
 * The built-in {@code ibis} receiver: an IBIS model's input side — its {@code [GND Clamp]} and
 * {@code [POWER Clamp]} tables as {@link Primitive.TableCurrent}s (unscaled, referenced to the
 * model's own clamp reference sources, see {@link IbisDriverModel}) and {@code C_comp} from the
 * die pad to GND; the die pad sits behind the package when the component is known (see
 * {@link IbisPackage}; {@code package: false} puts it at the pin). The waveform is measured at
 * the pin, as for every receiver. An I/O model used here is an input with its output stage off.
 * The thresholds are {@code vih}/{@code vil} when the net gives them, else the model's
 * {@code Vinh}/{@code Vinl}.
 */
public final class IbisReceiverModel implements ReceiverModel {
    /** The shared instance. */
    public static final IbisReceiverModel INSTANCE = new IbisReceiverModel();

    private IbisReceiverModel() {
    }

    @Override
    public String id() {
        return BuiltinModels.IBIS;
    }

    @Override
    public Role role() {
        return Role.RECEIVER;
    }

    @Override
    public String description() {
        return "IBIS input: clamp V-I tables, C_comp and package R-L-C; thresholds from Vinh/Vinl unless vih/vil are given";
    }

    @Override
    public List<ParameterSpec> parameters() {
        List<ParameterSpec> p = new ArrayList<>(IbisSelection.commonParameters());
        p.add(ParameterSpec.voltageOrRail("vih", "Vinh", false, "input high threshold; defaults to the model's Vinh"));
        p.add(ParameterSpec.voltageOrRail("vil", "Vinl", false, "input low threshold; defaults to the model's Vinl"));
        return p;
    }

    @Override
    public List<Problem> check(Parameters given) {
        return IbisSelection.check(given);
    }

    @Override
    public Thresholds thresholds(Receiver receiver, NetRails rails) {
        Parameters p = receiver.parameters();
        IbisModel m = IbisSelection.of(receiver).model();
        double vil = threshold(p, rails, "vil", m.vinl(), "Vinl", m);
        double vih = threshold(p, rails, "vih", m.vinh(), "Vinh", m);
        if (!(vih > vil)) {
            throw new ModelParameterException("vih", "vih `" + vih + "` V must be above vil `" + vil + "` V");
        }
        return new Thresholds(vil, vih, Optional.empty());
    }

    private static double threshold(Parameters p, NetRails rails, String key, double fromModel, String ibisName, IbisModel m) {
        if (p.has(key)) {
            return rails.voltageOrRail(p, key, "");
        }
        if (Double.isNaN(fromModel)) {
            throw new ModelParameterException(key, "IBIS model `" + m.name() + "` gives no " + ibisName + "; expected `" + key + "` in the net file");
        }
        return fromModel;
    }

    @Override
    public double inputCapacitance(Receiver receiver) {
        IbisSelection s = IbisSelection.of(receiver);
        return s.model().cComp().get(s.corner()) + s.packageValues().map(IbisPackage::farads).orElse(0.0);
    }

    @Override
    public void elaborate(Receiver receiver, ReceiverContext ctx) {
        IbisSelection s = IbisSelection.of(receiver);
        s.file().warnings().forEach(ctx::warn);
        IbisModel m = s.model();
        IbisCorner c = s.corner();
        String pin = receiver.pin();
        String pad = IbisPackage.padNode(s, ctx, pin);
        IbisDriverModel.clamps(m, c, ctx, new IbisDriverModel.References(ctx, pin), pin, pad);
        double cComp = m.cComp().get(c);
        if (cComp > 0) {
            ctx.add(new Primitive.Capacitor(ctx.newName("ccomp_" + pin), pad, ctx.groundNode(), cComp));
        }
    }
}
