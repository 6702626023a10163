package org.ringsweep.api.model;

import java.util.List;
import java.util.regex.Pattern;
import org.apiguardian.api.API;

/**
 * An in-house plugin: a bundle of driver models, receiver models and extra edge checks that
 * ringsweep discovers with {@link java.util.ServiceLoader}, from the class path and from every jar
 * in the folder given with {@code --plugins DIR}.
 *
 * <h2>Contract</h2>
 * <ul>
 * <li>{@link #id()} is the plugin's own name: lower-case letters, digits and {@code -}, starting
 *     with a letter ({@link #ID_PATTERN}); it must not start with {@link #RESERVED_PREFIX}. The
 *     host rejects blank, malformed, reserved or duplicate ids, and model or check ids that clash
 *     with a built-in one or another plugin's, naming both sources.</li>
 * <li>{@link #version()} is the plugin's release, shown in {@code ringsweep models} and the load
 *     log; read it from the jar manifest or a build-filtered resource rather than a literal.</li>
 * <li>{@link #apiVersion()} returns {@link ApiVersion#CURRENT} as compiled; the host refuses a
 *     plugin whose number differs from its own.</li>
 * <li>The lists are asked for once, at start-up; the models and checks in them must be stateless
 *     and thread-safe (points run in parallel). A public no-argument constructor is needed for
 *     ServiceLoader.</li>
 * <li>A model or check that throws anything other than {@link ModelParameterException} makes the
 *     point it was working on an error record naming the plugin and the point; the other points
 *     go on. Throw {@link ModelParameterException} for bad parameters: that is an input error
 *     (exit code 2) with the file, line and key.</li>
 * </ul>
 *
 * <h2>Example</h2>
 * <pre>{@code
 * public final class AcmePlugin implements RingsweepPlugin {
 *     public String id() { return "acme-instruments"; }
 *     public String version() { return "1.0.0"; }
 *     public int apiVersion() { return ApiVersion.CURRENT; }
 *     public List<DriverModel> drivers() { return List.of(new AcmeIoDriver()); }
 * }
 * }</pre>
 * and, in the jar, {@code META-INF/services/org.ringsweep.api.model.RingsweepPlugin} holding the
 * line {@code com.acme.ringsweep.AcmePlugin}.
 *
 * @since 0.1
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public interface RingsweepPlugin {
    /** What plugin, model and check ids must match: {@code [a-z][a-z0-9-]*}. */
    Pattern ID_PATTERN = Pattern.compile("[a-z][a-z0-9-]*");

    /** The id prefix reserved for ringsweep's own plugins and models. */
    String RESERVED_PREFIX = "ringsweep";

    /** The plugin's id, e.g. {@code acme-instruments} (see {@link #ID_PATTERN}). */
    String id();

    /** The plugin's version, e.g. {@code 1.2.0}; not blank. */
    String version();

    /** The plugin API version it was built against; must equal {@link ApiVersion#CURRENT}. */
    int apiVersion();

    /** The driver models it adds; none by default. */
    default List<DriverModel> drivers() {
        return List.of();
    }

    /** The receiver models it adds; none by default. */
    default List<ReceiverModel> receivers() {
        return List.of();
    }

    /** The extra edge checks it adds; none by default. */
    default List<EdgeCheck> checks() {
        return List.of();
    }
}
