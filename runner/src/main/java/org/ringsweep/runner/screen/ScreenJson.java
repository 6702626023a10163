package org.ringsweep.runner.screen;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;

/**
 * Writes a {@link ScreenResult} as one line of JSON, format {@code ringsweep/screen-1}; SI units
 * named by the key suffix ({@code _s}, {@code _v}, {@code _hz}, {@code _ohm}, {@code _v_per_s}); NaN
 * becomes null. Thread-safe.
 */
public final class ScreenJson {
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private ScreenJson() {
    }

    /**
     * The record as one JSON line.
     *
     * @param rank the 1-based risk rank among the nets screened together
     */
    public static String line(ScreenResult r, int rank) {
        ObjectNode o = MAPPER.createObjectNode();
        o.put("format", ScreenResult.FORMAT);
        o.put("net", r.net());
        o.put("file", r.file());
        o.put("rank", rank);
        o.put("driver", r.driver());
        o.put("edge_ref", r.edgeRef());
        num(o, "rise_s", r.riseGiven());
        num(o, "rise_10_90_s", r.rise1090());
        num(o, "swing_v", r.swing());
        num(o, "slew_v_per_s", r.slew());
        num(o, "knee_hz", r.knee());
        num(o, "bandwidth_hz", r.bandwidth());
        num(o, "total_delay_s", r.totalDelay());
        num(o, "longest_delay_s", r.longestDelay());
        o.put("farthest_receiver", r.farthest());
        num(o, "delay_to_rise", r.ratio());
        o.put("class", r.lineClass().word());
        o.put("rule", LineClass.RULE);
        num(o, "z0_ohm", r.z0());
        num(o, "r_out_ohm", r.rOut());
        num(o, "r_series_ohm", r.rSeries());
        num(o, "gamma_source", r.gammaSource());
        num(o, "gamma_load", r.gammaLoad());
        num(o, "launch_v", r.launch());
        num(o, "far_first_v", r.farFirst());
        num(o, "overshoot_first_v", r.overshootFirst());
        num(o, "series_r_ohm", r.suggestedSeries());
        num(o, "series_r_e24_ohm", r.suggestedE24());
        if (r.pullUpWindow().isEmpty()) {
            o.putNull("pull_up");
        } else {
            com.fasterxml.jackson.databind.node.ArrayNode pullUp = o.putArray("pull_up");
            r.pullUpWindow().forEach(pullUp::add);
        }
        com.fasterxml.jackson.databind.node.ArrayNode notes = o.putArray("notes");
        r.notes().forEach(notes::add);
        try {
            return MAPPER.writeValueAsString(o);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("cannot write a screen record as JSON", e);
        }
    }

    private static void num(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
        }
    }
}
