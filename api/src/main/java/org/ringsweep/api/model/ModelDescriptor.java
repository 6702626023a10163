package org.ringsweep.api.model;

import java.util.List;
import java.util.Optional;
import org.apiguardian.api.API;
import org.ringsweep.api.net.Parameters;

/**
 * What a driver or receiver model is called, what it takes and where it came from.
 *
 * <p>Example, a descriptor for a model with one resistance:
 * <pre>{@code
 * ModelDescriptor d = new ModelDescriptor() {
 *     public String id() { return "acme-buffer"; }
 *     public Role role() { return Role.DRIVER; }
 *     public String description() { return "ACME output buffer"; }
 *     public List<ParameterSpec> parameters() {
 *         return List.of(ParameterSpec.number("r_out", Dimension.RESISTANCE, "25", false, "output resistance"));
 *     }
 * };
 * }</pre>
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public interface ModelDescriptor {
    /** Whether a model drives or receives. */
    enum Role {
        /** A driver model. */
        DRIVER,
        /** A receiver model. */
        RECEIVER
    }

    /**
     * A problem with a set of parameters that a per-key check cannot see.
     *
     * @param key     the key concerned
     * @param message what is wrong and what was expected
     */
    record Problem(String key, String message) {
    }

    /** The model id used in net files; lower-case letters, digits and {@code -}. */
    String id();

    /** Driver or receiver. */
    Role role();

    /** One line for {@code ringsweep models}. */
    String description();

    /** The parameters, in the order to list them. */
    List<ParameterSpec> parameters();

    /** Where the model comes from ({@code built-in}, or a plugin jar). */
    default String origin() {
        return "built-in";
    }

    /** The spec of one parameter. */
    default Optional<ParameterSpec> parameter(String key) {
        return parameters().stream().filter(p -> p.key().equals(key)).findFirst();
    }

    /**
     * Checks combinations of parameters (e.g. "r_out, or both r_up and r_down"). Per-key type,
     * required and allowed-word checks are done by the caller from {@link #parameters()}.
     *
     * @param given the parameters as given in the file (before defaults)
     * @return the problems, empty when fine
     */
    default List<Problem> check(Parameters given) {
        return List.of();
    }
}
