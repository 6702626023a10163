package org.ringsweep.runner.results;

import java.util.List;
import java.util.Map;

/**
 * The record of one simulated point (one net, one corner, one set of swept values), format
 * {@code ringsweep/result-1}.
 *
 * @param net        the net name
 * @param corner     the corner ({@code typ} for the file's own values)
 * @param point      swept path → value (SI), in order; empty for plain checks
 * @param engineName the engine ({@code ngspice}), or empty when none ran
 * @param engineVersion its version
 * @param verdict    pass, fail or error
 * @param receivers  per receiver results (empty for errors)
 * @param deck       the deck file, relative to the working directory as given by {@code --out}
 * @param error      why the point is an error, quoting the engine; empty otherwise
 * @param source     the net file
 * @param sourceHash SHA-256 of the net file
 * @param defaulted  limit keys that took the documented default
 * @param warnings   non-fatal remarks (e.g. a capped settle time)
 */
public record ResultRecord(String net, String corner, Map<String, Double> point, String engineName, String engineVersion,
                           Verdict verdict, List<ReceiverResult> receivers, String deck, String error,
                           String source, String sourceHash, List<String> defaulted, List<String> warnings) {
    /** The record format tag. */
    public static final String FORMAT = "ringsweep/result-1";

    /** Copies. */
    public ResultRecord {
        point = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(point));
        receivers = List.copyOf(receivers);
        defaulted = List.copyOf(defaulted);
        warnings = List.copyOf(warnings);
    }
}
