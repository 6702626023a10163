package org.ringsweep.runner.store;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;

/**
 * Exports of stored rows: JSON Lines (the records as stored) and CSV.
 *
 * <p><b>CSV</b> (RFC 4180: comma-separated, CRLF line ends, a field holding a comma, a double
 * quote, CR or LF is enclosed in double quotes with each quote doubled). A header line, then one
 * line per point, receiver and edge (an error point, which has no receivers, gives one line with
 * empty receiver and edge). Columns, in order:
 * <ol>
 *   <li>{@code net}, {@code corner}, {@code point_key};</li>
 *   <li>one column per swept path (e.g. {@code R5/value}), the union over the exported rows in
 *       ascending path order, empty where a point does not sweep that path;</li>
 *   <li>{@code receiver} (pin), {@code edge} ({@code rise}, {@code fall});</li>
 *   <li>the metrics of {@code formats.md} "Results": {@link #METRICS}, then any other metric key
 *       found in the records in first-seen order; empty where the edge lacks it or it is null
 *       ("not found"); numbers as in the JSON record (SI units, {@code Double.toString} form);</li>
 *   <li>{@code violations}: the limit keys this receiver violates on this edge, space-separated;</li>
 *   <li>{@code receiver_verdict}, {@code verdict} (the point's), {@code error}, {@code net_hash}.</li>
 * </ol>
 */
public final class StoreExport {
    /** The metric columns always present, in the order of {@code formats.md}. */
    public static final List<String> METRICS = List.of("v_max", "v_min", "v_final", "overshoot_v", "undershoot_v",
            "ringback_margin_v", "settle_s", "settled", "delay_s", "crossings", "monotonic", "slew_v_per_s");

    private static final ObjectMapper MAPPER = new ObjectMapper();
    /** Keys of a receiver object that are not edges. */
    private static final Set<String> RECEIVER_FIELDS = Set.of("pin", "verdict", "violations");

    private StoreExport() {
    }

    /**
     * Writes each row's record as one line of JSON followed by {@code \n}, in the given order.
     *
     * @throws UncheckedIOException when {@code out} fails
     */
    public static void toJsonLines(Collection<StoredRow> rows, Appendable out) {
        toJsonLines(rows::forEach, out);
    }

    /**
     * Writes each row's record as one line of JSON followed by {@code \n}, row by row as the
     * source yields them (one walk).
     *
     * @throws UncheckedIOException when {@code out} fails
     */
    public static void toJsonLines(RowSource rows, Appendable out) {
        rows.forEach(r -> {
            try {
                out.append(r.recordJson()).append('\n');
            } catch (IOException e) {
                throw new UncheckedIOException("cannot write the JSON Lines export: " + e.getMessage(), e);
            }
        });
    }

    /**
     * Writes the rows as CSV (columns in the class comment), in the given order.
     *
     * @throws UncheckedIOException when {@code out} fails
     */
    public static void toCsv(Collection<StoredRow> rows, Appendable out) {
        toCsv(rows::forEach, out);
    }

    /**
     * Writes the rows as CSV (columns in the class comment), in the order the source yields them.
     * Two walks over the source: the first finds the columns (swept paths and metric keys), the
     * second writes the lines; nothing per row is kept between them.
     *
     * @throws UncheckedIOException when {@code out} fails
     */
    public static void toCsv(RowSource rows, Appendable out) {
        Set<String> paths = new TreeSet<>();
        Set<String> metrics = new LinkedHashSet<>(METRICS);
        rows.forEach(r -> {
            paths.addAll(r.point().keySet());
            for (JsonNode receiver : parse(r).path("receivers")) {
                for (Map.Entry<String, JsonNode> f : receiver.properties()) {
                    if (!RECEIVER_FIELDS.contains(f.getKey()) && f.getValue().isObject()) {
                        f.getValue().fieldNames().forEachRemaining(metrics::add);
                    }
                }
            }
        });
        List<String> header = new ArrayList<>(List.of("net", "corner", "point_key"));
        header.addAll(paths);
        header.addAll(List.of("receiver", "edge"));
        header.addAll(metrics);
        header.addAll(List.of("violations", "receiver_verdict", "verdict", "error", "net_hash"));
        try {
            line(out, header);
            rows.forEach(r -> {
                try {
                    csvLines(r, parse(r), paths, metrics, out);
                } catch (IOException e) {
                    throw new UncheckedIOException(e);
                }
            });
        } catch (IOException | UncheckedIOException e) {
            IOException cause = e instanceof UncheckedIOException u ? u.getCause() : (IOException) e;
            throw new UncheckedIOException("cannot write the CSV export: " + cause.getMessage(), cause);
        }
    }

    /** The lines of one row: one per receiver and edge, or one for a point without receivers. */
    private static void csvLines(StoredRow r, JsonNode rec, Set<String> paths, Set<String> metrics, Appendable out) throws IOException {
        List<String> lead = new ArrayList<>(List.of(r.net(), r.corner(), r.pointKey()));
        for (String p : paths) {
            lead.add(r.point().containsKey(p) ? number(rec.path("point").path(p)) : "");
        }
        List<String> tail = List.of(r.verdict().word(), r.error(), r.netHash());
        boolean any = false;
        for (JsonNode receiver : rec.path("receivers")) {
            for (Map.Entry<String, JsonNode> f : receiver.properties()) {
                if (RECEIVER_FIELDS.contains(f.getKey()) || !f.getValue().isObject()) {
                    continue;
                }
                List<String> cells = new ArrayList<>(lead);
                cells.add(receiver.path("pin").asText());
                cells.add(f.getKey());
                for (String m : metrics) {
                    cells.add(number(f.getValue().path(m)));
                }
                cells.add(violations(receiver, f.getKey()));
                cells.add(receiver.path("verdict").asText());
                cells.addAll(tail);
                line(out, cells);
                any = true;
            }
        }
        if (!any) {
            List<String> cells = new ArrayList<>(lead);
            for (int k = 0; k < 2 + metrics.size() + 2; k++) {
                cells.add("");
            }
            cells.addAll(tail);
            line(out, cells);
        }
    }

    /** One RFC 4180 field. */
    static String field(String s) {
        if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\r') < 0 && s.indexOf('\n') < 0) {
            return s;
        }
        return '"' + s.replace("\"", "\"\"") + '"';
    }

    private static void line(Appendable out, List<String> cells) throws IOException {
        for (int i = 0; i < cells.size(); i++) {
            if (i > 0) {
                out.append(',');
            }
            out.append(field(cells.get(i)));
        }
        out.append("\r\n");
    }

    /** A value cell: numbers and booleans as in the JSON, empty for missing or null. */
    private static String number(JsonNode v) {
        return v.isMissingNode() || v.isNull() ? "" : v.asText();
    }

    private static String violations(JsonNode receiver, String edge) {
        List<String> limits = new ArrayList<>();
        for (JsonNode v : receiver.path("violations")) {
            if (edge.equals(v.path("edge").asText())) {
                limits.add(v.path("limit").asText());
            }
        }
        return String.join(" ", limits);
    }

    private static JsonNode parse(StoredRow r) {
        try {
            return MAPPER.readTree(r.recordJson());
        } catch (IOException e) {
            throw new StoreException("the stored record of net `" + r.net() + "` point `" + r.pointKey()
                    + "` is not valid JSON: " + e.getMessage(), e);
        }
    }
}
