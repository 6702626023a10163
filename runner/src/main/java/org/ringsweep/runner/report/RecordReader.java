package org.ringsweep.runner.report;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.results.ViolationRecord;

/**
 * Reads {@code ringsweep/result-1} records back from their JSON form (the inverse of
 * {@link org.ringsweep.runner.results.ResultJson}): a JSON {@code null} metric becomes NaN, as
 * it was before writing; integers stay {@link Integer}, other numbers {@link Double}.
 */
final class RecordReader {
    private static final ObjectMapper MAPPER = new ObjectMapper();
    private static final java.util.Set<String> RECEIVER_KEYS = java.util.Set.of("pin", "verdict", "violations");

    private RecordReader() {
    }

    /** Every record of a JSON Lines file; blank lines are skipped. */
    static List<ResultRecord> readLines(Path file) {
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new ReportException("cannot read `" + file + "`: " + e.getMessage(), e);
        }
        List<ResultRecord> out = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            if (!lines.get(i).isBlank()) {
                out.add(parse(lines.get(i), file + ":" + (i + 1)));
            }
        }
        return out;
    }

    /**
     * One record.
     *
     * @param json  the record as one line of JSON
     * @param where file and line (or store row) for messages
     * @throws ReportException when the text is not a result record
     */
    static ResultRecord parse(String json, String where) {
        JsonNode o;
        try {
            o = MAPPER.readTree(json);
        } catch (IOException e) {
            throw new ReportException(where + ": not valid JSON: " + e.getMessage(), e);
        }
        if (o == null || !ResultRecord.FORMAT.equals(o.path("format").asText())) {
            throw new ReportException(where + ": expected a `" + ResultRecord.FORMAT + "` record, found format `"
                    + (o == null ? "" : o.path("format").asText()) + "`");
        }
        Map<String, Double> point = new LinkedHashMap<>();
        o.path("point").properties().forEach(e -> point.put(e.getKey(), number(e.getValue())));
        List<ReceiverResult> receivers = new ArrayList<>();
        for (JsonNode r : o.path("receivers")) {
            Map<String, EdgeResult> edges = new LinkedHashMap<>();
            for (Map.Entry<String, JsonNode> e : r.properties()) {
                if (!RECEIVER_KEYS.contains(e.getKey()) && e.getValue().isObject()) {
                    edges.put(e.getKey(), new EdgeResult(metrics(e.getValue())));
                }
            }
            List<ViolationRecord> violations = new ArrayList<>();
            for (JsonNode v : r.path("violations")) {
                violations.add(new ViolationRecord(v.path("limit").asText(), v.path("edge").asText(), number(v.path("measured")),
                        number(v.path("value")), v.path("defaulted").asBoolean(), v.path("message").asText()));
            }
            receivers.add(new ReceiverResult(r.path("pin").asText(), verdict(r.path("verdict").asText(), where), edges, violations));
        }
        return new ResultRecord(o.path("net").asText(), o.path("corner").asText(), point, o.path("engine").path("name").asText(),
                o.path("engine").path("version").asText(), verdict(o.path("verdict").asText(), where), receivers,
                o.path("deck").asText(), o.path("error").asText(""), o.path("source").asText(), o.path("source_hash").asText(),
                strings(o.path("defaulted_limits")), strings(o.path("warnings")));
    }

    private static Map<String, Object> metrics(JsonNode edge) {
        Map<String, Object> m = new LinkedHashMap<>();
        for (Map.Entry<String, JsonNode> e : edge.properties()) {
            JsonNode v = e.getValue();
            if (v.isBoolean()) {
                m.put(e.getKey(), v.booleanValue());
            } else if (v.isInt()) {
                m.put(e.getKey(), v.intValue());
            } else if (v.isNumber()) {
                m.put(e.getKey(), v.doubleValue());
            } else if (v.isNull()) {
                m.put(e.getKey(), Double.NaN);
            } else {
                m.put(e.getKey(), v.asText());
            }
        }
        return m;
    }

    private static double number(JsonNode n) {
        return n.isNumber() ? n.doubleValue() : Double.NaN;
    }

    private static List<String> strings(JsonNode array) {
        List<String> out = new ArrayList<>();
        array.forEach(n -> out.add(n.asText()));
        return out;
    }

    private static Verdict verdict(String word, String where) {
        try {
            return Verdict.valueOf(word.toUpperCase(Locale.ROOT));
        } catch (IllegalArgumentException e) {
            throw new ReportException(where + ": unknown verdict `" + word + "`; expected pass, fail or error", e);
        }
    }
}
