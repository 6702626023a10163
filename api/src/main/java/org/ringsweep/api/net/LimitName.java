package org.ringsweep.api.net;

import java.util.Optional;
import org.apiguardian.api.API;

/**
 * The limits a net or receiver may set (the {@code limits:} block of a net file), with the key
 * used in files and results.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public enum LimitName {
    /** Highest allowed excursion above the high rail (V). */
    OVERSHOOT_MAX("overshoot_max"),
    /** Lowest allowed excursion below the low rail (V). */
    UNDERSHOOT_MAX("undershoot_max"),
    /** Smallest allowed ringback margin after the threshold crossing (V). */
    RINGBACK_MARGIN_MIN("ringback_margin_min"),
    /** Longest allowed settling time from the source's 50 % point (s). */
    SETTLE_MAX("settle_max"),
    /** Settling band: a fraction of the swing (written {@code 5%}) or a voltage. */
    SETTLE_BAND("settle_band"),
    /** Whether the edge must be monotonic inside VIL..VIH. */
    MONOTONIC("monotonic"),
    /** Longest allowed delay from the source's 50 % point to the receiver threshold (s). */
    DELAY_MAX("delay_max"),
    /** Most threshold crossings allowed per edge (default 1: more is a double clock). */
    CROSSINGS_MAX("crossings_max"),
    /**
     * Longest allowed rise time at the receiver (s): from the last rising VIL crossing to the first
     * VIH crossing after it. With I²C thresholds (VIL 0.3·VDD, VIH 0.7·VDD) this is the I²C
     * specification's 30–70 % t_r.
     */
    RISE_MAX("rise_max");

    private final String key;

    LimitName(String key) {
        this.key = key;
    }

    /** The key in net files and result records. */
    public String key() {
        return key;
    }

    /** The limit with the given file key, if any. */
    public static Optional<LimitName> byKey(String key) {
        for (LimitName n : values()) {
            if (n.key.equals(key)) {
                return Optional.of(n);
            }
        }
        return Optional.empty();
    }
}
