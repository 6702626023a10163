package org.ringsweep.generators.models;

import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.model.ElaborationContext;

/**
 * The package parasitics of one IBIS pin at one corner, and the circuit that models them:
 * {@code die pad —R— —L— pin} with {@code C} from the pin to ground. This is the usual lumped
 * reading of {@code [Package]} / {@code [Pin]} (impedance-and-standards.md §7, "Behavioural
 * SPICE build": R_pkg–L_pkg in series with C_pkg at the pin); the die pad carries C_comp and
 * the V–I tables. A zero value leaves its element out.
 *
 * @param ohms    series resistance (ohm), ≥ 0
 * @param henries series inductance (H), ≥ 0
 * @param farads  capacitance from the pin to ground (F), ≥ 0
 */
record IbisPackage(double ohms, double henries, double farads) {
    /** Validates: every value finite and ≥ 0. */
    IbisPackage {
        for (double v : new double[] {ohms, henries, farads}) {
            if (!(v >= 0) || !Double.isFinite(v)) {
                throw new IllegalArgumentException("package R, L and C must be finite and ≥ 0, found " + ohms + ", " + henries + ", " + farads);
            }
        }
    }

    /**
     * Adds the package between a new die-pad node and the context's pin node.
     *
     * @return the die-pad node (the pin node itself when R and L are both zero)
     */
    String attach(ElaborationContext ctx, String pin) {
        String pinNode = ctx.pinNode();
        if (farads > 0) {
            ctx.add(new Primitive.Capacitor(ctx.newName("cpkg_" + pin), pinNode, ctx.groundNode(), farads));
        }
        if (ohms == 0 && henries == 0) {
            return pinNode;
        }
        String die = ctx.newNode(pin + "_die");
        if (ohms > 0 && henries > 0) {
            String mid = ctx.newNode(pin + "_pkg");
            ctx.add(new Primitive.Resistor(ctx.newName("rpkg_" + pin), die, mid, ohms));
            ctx.add(new Primitive.Inductor(ctx.newName("lpkg_" + pin), mid, pinNode, henries));
        } else if (ohms > 0) {
            ctx.add(new Primitive.Resistor(ctx.newName("rpkg_" + pin), die, pinNode, ohms));
        } else {
            ctx.add(new Primitive.Inductor(ctx.newName("lpkg_" + pin), die, pinNode, henries));
        }
        return die;
    }

    /** The die-pad node of a selection: behind its package when it has one, else the pin node. */
    static String padNode(IbisSelection s, ElaborationContext ctx, String pin) {
        return s.packageValues().map(p -> p.attach(ctx, pin)).orElse(ctx.pinNode());
    }
}
