package org.ringsweep.runner.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.results.ResultJson;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;

/** JSON Lines and CSV exports (CSV per RFC 4180, section 2). */
class StoreExportTests {
    @TempDir
    Path out;

    private List<StoredRow> stored(ResultRecord... records) {
        try (ResultStore store = ResultStore.open(out)) {
            for (ResultRecord r : records) {
                store.put(r, PointKey.of(r));
            }
            return store.rows();
        }
    }

    @Test
    void aNetNameWithACommaAndAQuoteIsQuotedWithTheQuoteDoubled() {
        // RFC 4180 §2 rules 6 and 7: a field containing a comma or a double quote is enclosed in
        // double quotes, and a double quote inside it is escaped by another double quote.
        StringBuilder csv = new StringBuilder();
        StoreExport.toCsv(stored(Records.point("BUS,\"A\"", Records.HASH_A, 22, 0.2, 0.1, 4e-9)), csv);
        String[] lines = csv.toString().split("\r\n", -1);
        assertTrue(lines[1].startsWith("\"BUS,\"\"A\"\"\",typ,corner=typ;R5/value=22.0,22.0,U7.6,rise,"), lines[1]);
        assertEquals("", lines[lines.length - 1], "RFC 4180 §2 rule 1: every record ends with CRLF");
    }

    @Test
    void fieldsWithLineBreaksAreQuotedAndPlainOnesAreNot() {
        assertEquals("\"two\r\nlines\"", StoreExport.field("two\r\nlines"));
        assertEquals("\"a\nb\"", StoreExport.field("a\nb"));
        assertEquals("plain", StoreExport.field("plain"));
        assertEquals("", StoreExport.field(""));
    }

    @Test
    void oneLinePerPointReceiverAndEdgeWithTheDocumentedColumns() {
        ResultRecord two = Records.record("CLK", Records.HASH_A, 22, List.of(
                Records.receiver("U2.1", Records.rise(0.12, 3e-9), Records.fall(0.05, 0.8, 5e-9)),
                Records.receiver("U3.1", Records.rise(0.35, 4e-9), Records.fall(0.21, 0.4, 2e-9))));
        ResultRecord swept = new ResultRecord("CLK", "slow", Map.of("R5/value", 33.0, "U1.1/rise", 1.5e-9), "ngspice", "39",
                Verdict.ERROR, List.of(), "d.cir", "ngspice: singular matrix", "nets/CLK.yaml", Records.HASH_A, List.of(), List.of());
        StringBuilder csv = new StringBuilder();
        StoreExport.toCsv(stored(two, swept), csv);
        List<String> lines = Arrays.asList(csv.toString().split("\r\n"));
        List<String> header = List.of(lines.get(0).split(",", -1));
        assertEquals(List.of("net", "corner", "point_key", "R5/value", "U1.1/rise", "receiver", "edge", "v_max", "v_min",
                "v_final", "overshoot_v", "undershoot_v", "ringback_margin_v", "settle_s", "settled", "delay_s", "crossings",
                "monotonic", "slew_v_per_s", "violations", "receiver_verdict", "verdict", "error", "net_hash"), header);
        assertEquals(1 + 4 + 1, lines.size(), "2 receivers x 2 edges, plus one line for the error point");
        List<String> u3rise = List.of(lines.get(3).split(",", -1));
        assertEquals("U3.1", u3rise.get(header.indexOf("receiver")));
        assertEquals("rise", u3rise.get(header.indexOf("edge")));
        assertEquals("0.35", u3rise.get(header.indexOf("overshoot_v")));
        assertEquals("", u3rise.get(header.indexOf("undershoot_v")), "a rising edge has no undershoot");
        assertEquals("", u3rise.get(header.indexOf("U1.1/rise")), "this point does not sweep the rise time");
        List<String> error = List.of(lines.get(5).split(",", -1));
        assertEquals("1.5E-9", error.get(header.indexOf("U1.1/rise")));
        assertEquals("error", error.get(header.indexOf("verdict")));
        assertEquals("ngspice: singular matrix", error.get(header.indexOf("error")));
        assertEquals("", error.get(header.indexOf("receiver")));
        assertEquals(header.size(), error.size());
    }

    @Test
    void violationsAreListedOnTheEdgeTheyHappenedOn() {
        StringBuilder csv = new StringBuilder();
        StoreExport.toCsv(stored(Records.failing("N", Records.HASH_A, 10, 0.45, 1e-9)), csv);
        String[] lines = csv.toString().split("\r\n");
        List<String> header = List.of(lines[0].split(","));
        assertEquals("overshoot_max", List.of(lines[1].split(",", -1)).get(header.indexOf("violations")));
        assertEquals("", List.of(lines[2].split(",", -1)).get(header.indexOf("violations")));
        assertEquals("fail", List.of(lines[2].split(",", -1)).get(header.indexOf("receiver_verdict")));
    }

    @Test
    void jsonLinesAreTheStoredRecordsOnePerLine() {
        ResultRecord a = Records.point("A", Records.HASH_A, 22, 0.2, 0.1, 4e-9);
        ResultRecord b = Records.error("B", Records.HASH_B, 47);
        StringBuilder jsonl = new StringBuilder();
        StoreExport.toJsonLines(stored(a, b), jsonl);
        assertEquals(ResultJson.line(a) + "\n" + ResultJson.line(b) + "\n", jsonl.toString());
    }
}
