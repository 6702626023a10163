package org.ringsweep.runner.results;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.util.Map;

/**
 * Writes result records as single-line JSON in the field order of {@code formats.md}. NaN and
 * infinities become {@code null}. Thread-safe.
 */
public final class ResultJson {
    private static final ObjectMapper MAPPER = new ObjectMapper();

    private ResultJson() {
    }

    /** The record as one line of JSON (no trailing newline). */
    public static String line(ResultRecord r) {
        try {
            return MAPPER.writeValueAsString(tree(r));
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("cannot write a result record as JSON", e);
        }
    }

    /** The record as a JSON tree. */
    public static ObjectNode tree(ResultRecord r) {
        ObjectNode o = MAPPER.createObjectNode();
        o.put("format", ResultRecord.FORMAT);
        o.put("net", r.net());
        o.put("corner", r.corner());
        ObjectNode point = o.putObject("point");
        r.point().forEach((k, v) -> putNumber(point, k, v));
        ObjectNode engine = o.putObject("engine");
        engine.put("name", r.engineName());
        engine.put("version", r.engineVersion());
        o.put("verdict", r.verdict().word());
        ArrayNode receivers = o.putArray("receivers");
        for (ReceiverResult rr : r.receivers()) {
            ObjectNode ro = receivers.addObject();
            ro.put("pin", rr.pin());
            ro.put("verdict", rr.verdict().word());
            rr.edges().forEach((edge, er) -> ro.set(edge, metrics(er)));
            ArrayNode vs = ro.putArray("violations");
            for (ViolationRecord v : rr.violations()) {
                ObjectNode vo = vs.addObject();
                vo.put("limit", v.limit());
                vo.put("edge", v.edge());
                putNumber(vo, "measured", v.measured());
                putNumber(vo, "value", v.value());
                vo.put("defaulted", v.defaulted());
                vo.put("message", v.message());
            }
        }
        o.put("deck", r.deck());
        if (!r.error().isEmpty()) {
            o.put("error", r.error());
        }
        o.put("source", r.source());
        o.put("source_hash", r.sourceHash());
        ArrayNode defaulted = o.putArray("defaulted_limits");
        r.defaulted().forEach(defaulted::add);
        if (!r.warnings().isEmpty()) {
            ArrayNode w = o.putArray("warnings");
            r.warnings().forEach(w::add);
        }
        return o;
    }

    private static JsonNode metrics(EdgeResult er) {
        ObjectNode eo = MAPPER.createObjectNode();
        for (Map.Entry<String, Object> m : er.metrics().entrySet()) {
            Object v = m.getValue();
            if (v instanceof Boolean b) {
                eo.put(m.getKey(), b);
            } else if (v instanceof Integer i) {
                eo.put(m.getKey(), i);
            } else if (v instanceof Double d) {
                putNumber(eo, m.getKey(), d);
            } else if (v == null) {
                eo.putNull(m.getKey());
            } else {
                eo.put(m.getKey(), v.toString());
            }
        }
        return eo;
    }

    private static void putNumber(ObjectNode o, String key, double v) {
        if (Double.isFinite(v)) {
            o.put(key, v);
        } else {
            o.putNull(key);
        }
    }
}
