package org.ringsweep.generators.models;

import org.ringsweep.api.model.ModelParameterException;
import org.ringsweep.api.net.Parameters;
import org.ringsweep.api.net.Value;

/** Reading model parameters with messages that name the key. */
final class ModelParameters {
    private ModelParameters() {
    }

    static double number(Parameters p, String key) {
        Value v = p.get(key).orElseThrow(() -> new ModelParameterException(key, "`" + key + "` is missing; expected a number"));
        if (v instanceof Value.Number n) {
            return n.si();
        }
        throw new ModelParameterException(key, "expected a number, found `" + v.display() + "`");
    }

    static double positive(Parameters p, String key) {
        double v = number(p, key);
        if (!(v > 0)) {
            throw new ModelParameterException(key, "expected a positive value, found `" + v + "`");
        }
        return v;
    }

    static double nonNegative(Parameters p, String key, double fallback) {
        if (!p.has(key)) {
            return fallback;
        }
        double v = number(p, key);
        if (!(v >= 0)) {
            throw new ModelParameterException(key, "expected zero or a positive value, found `" + v + "`");
        }
        return v;
    }

    static String word(Parameters p, String key, String fallback) {
        return p.get(key).map(Value::display).orElse(fallback);
    }
}
