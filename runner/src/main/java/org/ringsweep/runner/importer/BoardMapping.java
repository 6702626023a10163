package org.ringsweep.runner.importer;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.ringsweep.api.net.Location;

/**
 * A board mapping file ({@code format: ringsweep/board-1}, formats.md "Board mapping file"):
 * what the importer needs beyond the netlist. Values are kept as the user wrote them (they are
 * copied into the generated net files and checked when those load).
 *
 * @param file       the file as the user named it
 * @param rails      rail name to voltage text
 * @param drivers    driver pin rules, first match wins
 * @param receivers  receiver pin rules, first match wins
 * @param series     series-part rules (by refdes)
 * @param classes    net classes by net name, first match wins
 * @param include    nets to include; empty: every net with a driver and a receiver
 * @param exclude    nets to leave out (power, ground)
 * @param ignore     pins ({@code REFDES.PIN} globs) deliberately not modelled (test points, ...)
 * @param lengths    the length table (resolved against the board file's folder), or null
 * @param detour     factor on Manhattan distances for estimated lengths (≥ 1)
 * @param unit       metres per unit of plain numbers in CSV coordinates and lengths, NaN when not given
 */
public record BoardMapping(String file, Map<String, String> rails, List<PinRule> drivers, List<PinRule> receivers,
        List<SeriesRule> series, List<NetClass> classes, List<Glob> include, List<Glob> exclude, List<Glob> ignore,
        Path lengths, double detour, double unit) {
    /** The default detour factor: routed traces are rarely the straight Manhattan path. */
    public static final double DEFAULT_DETOUR = 1.2;

    /** Copies the collections. */
    public BoardMapping {
        Objects.requireNonNull(file, "file");
        rails = Map.copyOf(rails);
        drivers = List.copyOf(drivers);
        receivers = List.copyOf(receivers);
        series = List.copyOf(series);
        classes = List.copyOf(classes);
        include = List.copyOf(include);
        exclude = List.copyOf(exclude);
        ignore = List.copyOf(ignore);
    }

    /**
     * A driver or receiver rule.
     *
     * @param pins       a {@code REFDES.PIN} glob
     * @param model      the model id
     * @param parameters model parameters as written, in file order
     * @param location   where the rule is
     */
    public record PinRule(Glob pins, String model, Map<String, String> parameters, Location location) {
        /** Copies the parameters (order kept). */
        public PinRule {
            parameters = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(parameters));
        }
    }

    /**
     * A two-pin part that joins its two nets into one.
     *
     * @param refs     a refdes glob
     * @param kind     {@code resistor}, {@code capacitor} or {@code inductor}
     * @param value    the value as written
     * @param location where the rule is
     */
    public record SeriesRule(Glob refs, String kind, String value, Location location) {
    }

    /**
     * A net class.
     *
     * @param nets        a net-name glob
     * @param z0          characteristic impedance as written
     * @param erEff       effective relative permittivity as written
     * @param limits      limit name to value as written, in file order
     * @param termination series resistor value to add at the driver when the net has no series
     *                    part, or null for none
     * @param location    where the class is
     */
    public record NetClass(Glob nets, String z0, String erEff, Map<String, String> limits, String termination, Location location) {
        /** Copies the limits (order kept). */
        public NetClass {
            limits = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(limits));
        }
    }
}
