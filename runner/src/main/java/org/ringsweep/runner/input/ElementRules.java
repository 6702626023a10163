package org.ringsweep.runner.input;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.net.Driver;
import org.ringsweep.api.net.Element;
import org.ringsweep.api.net.Part;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.net.Segment;
import org.ringsweep.api.quantity.Dimension;
import org.ringsweep.api.quantity.Quantities;

/** The parameters each kind of element takes and the rule for each: shared by the net file and by overrides. */
final class ElementRules {
    /** Segment parameters in the order to list them. */
    static final Map<String, ValueRule> SEGMENT;

    static {
        Map<String, ValueRule> s = new LinkedHashMap<>();
        s.put("z0", new ValueRule.Quantity(Dimension.RESISTANCE, ValueRule.Bound.POSITIVE, "impedance", "`50` or `50ohm`"));
        s.put("delay", new ValueRule.Quantity(Dimension.TIME, ValueRule.Bound.POSITIVE, "delay", "`150ps` or `1.5e-10`"));
        s.put("length", ValueRule.Quantity.of(Dimension.LENGTH, ValueRule.Bound.POSITIVE));
        s.put("er_eff", new ValueRule.Quantity(Dimension.DIMENSIONLESS, ValueRule.Bound.AT_LEAST_ONE,
                "effective relative permittivity", "`3.4`"));
        s.put("velocity", ValueRule.Quantity.of(Dimension.VELOCITY, ValueRule.Bound.UP_TO_LIGHT));
        s.put("r_per_m", ValueRule.Quantity.of(Dimension.RESISTANCE_PER_LENGTH, ValueRule.Bound.NON_NEGATIVE));
        s.put("g_per_m", ValueRule.Quantity.of(Dimension.CONDUCTANCE_PER_LENGTH, ValueRule.Bound.NON_NEGATIVE));
        SEGMENT = java.util.Collections.unmodifiableMap(s);
    }

    private ElementRules() {
    }

    /** The rule for a part's {@code value}: a resistor may be 0 ohm (a sweep may start at a short), C and L must be positive. */
    static ValueRule partValue(Part.Kind kind) {
        return switch (kind) {
            case RESISTOR -> new ValueRule.Quantity(Dimension.RESISTANCE, ValueRule.Bound.NON_NEGATIVE, "resistance",
                    Quantities.examples(Dimension.RESISTANCE));
            case CAPACITOR -> ValueRule.Quantity.of(Dimension.CAPACITANCE, ValueRule.Bound.POSITIVE);
            case INDUCTOR -> ValueRule.Quantity.of(Dimension.INDUCTANCE, ValueRule.Bound.POSITIVE);
        };
    }

    /** The model of a driver or receiver, if the catalog knows it. */
    static Optional<ModelDescriptor> model(ModelCatalog catalog, Element e) {
        if (e instanceof Driver d) {
            return catalog.find(ModelDescriptor.Role.DRIVER, d.model());
        } else if (e instanceof Receiver r) {
            return catalog.find(ModelDescriptor.Role.RECEIVER, r.model());
        }
        return Optional.empty();
    }

    /** The parameter keys an element takes, in the order to list them. */
    static List<String> parameterKeys(ModelCatalog catalog, Element e) {
        if (e instanceof Segment) {
            return List.copyOf(SEGMENT.keySet());
        } else if (e instanceof Part) {
            return List.of("value");
        }
        return model(catalog, e).map(m -> m.parameters().stream().map(ParameterSpec::key).toList()).orElse(List.of());
    }

    /** The rule for one parameter of an element, if it takes that key. */
    static Optional<ValueRule> rule(ModelCatalog catalog, Element e, String key) {
        if (e instanceof Segment) {
            return Optional.ofNullable(SEGMENT.get(key));
        } else if (e instanceof Part p) {
            return key.equals("value") ? Optional.of(partValue(p.kind())) : Optional.empty();
        }
        return model(catalog, e).flatMap(m -> m.parameter(key)).map(ValueRule::forSpec);
    }

    /** "segment TL1", "part R5", "driver U1.14 (model ramp)". */
    static String describe(Element e) {
        if (e instanceof Segment s) {
            return "segment " + s.id();
        } else if (e instanceof Part p) {
            return p.kind().word() + " " + p.ref();
        } else if (e instanceof Driver d) {
            return "driver " + d.pin() + " (model " + d.model() + ")";
        }
        Receiver r = (Receiver) e;
        return "receiver " + r.pin() + " (model " + r.model() + ")";
    }
}
