package org.ringsweep.runner.store;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.results.ResultRecord;

/** docs/results-store.md tells sqlite3 users the truth: its schema and its "best" query. */
class DocumentedSchemaTests {
    private static final Path DOC = Path.of("..", "docs", "results-store.md");

    @TempDir
    Path out;

    @Test
    void theDocumentedSchemaIsTheOneTheFileHas() throws Exception {
        ResultStore.open(out).close();
        List<String> inFile = new ArrayList<>();
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + out.resolve(ResultStore.FILE_NAME));
             Statement s = c.createStatement(); ResultSet rs = s.executeQuery("SELECT sql FROM sqlite_schema WHERE sql IS NOT NULL ORDER BY rowid")) {
            while (rs.next()) {
                inFile.add(normal(rs.getString(1)));
            }
        }
        List<String> documented = Arrays.stream(sqlBlockAfter("## Schema").split(";"))
                .map(DocumentedSchemaTests::normal).filter(x -> !x.isEmpty()).toList();
        assertEquals(inFile, documented);
    }

    @Test
    void theDocumentedBestQueryAgreesWithBestPerNet() throws Exception {
        // Invented data with no exact ties, so the query's text tie-break does not matter.
        List<ResultRecord> records = List.of(
                Records.point("A", Records.HASH_A, 22, 0.20, 0.05, 3e-9),
                Records.point("A", Records.HASH_A, 33, 0.10, 0.05, 6e-9),
                Records.point("A", Records.HASH_A, 47, 0.10, 0.05, 5e-9),
                Records.failing("A", Records.HASH_A, 10, 0.35, 1e-9),
                Records.failing("B", Records.HASH_A, 10, 0.50, 1e-9),
                Records.failing("B", Records.HASH_A, 15, 0.40, 1e-9),
                Records.point("C", Records.HASH_A, 22, 0.01, 0.01, 1e-9), // old file of C
                Records.point("C", Records.HASH_B, 22, 0.15, 0.01, 1e-9),
                Records.point("C", Records.HASH_B, 33, 0.12, 0.01, Double.NaN),
                Records.error("D", Records.HASH_A, 1));
        Map<String, String> expected = new LinkedHashMap<>();
        try (ResultStore store = ResultStore.open(out)) {
            for (ResultRecord r : records) {
                store.put(r, PointKey.of(r));
            }
            store.bestPerNet().forEach((net, row) -> expected.put(net, row.pointKey()));
        }
        Map<String, String> queried = new LinkedHashMap<>();
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + out.resolve(ResultStore.FILE_NAME));
             Statement s = c.createStatement(); ResultSet rs = s.executeQuery(sqlBlockAfter("## Best point per net"))) {
            while (rs.next()) {
                queried.put(rs.getString("net"), rs.getString("point_key"));
            }
        }
        assertEquals(Map.of("A", "corner=typ;R5/value=47.0", "B", "corner=typ;R5/value=15.0", "C", "corner=typ;R5/value=33.0"),
                queried);
        assertEquals(expected, queried);
    }

    private static String sqlBlockAfter(String heading) throws Exception {
        String doc = Files.readString(DOC, StandardCharsets.UTF_8);
        int from = doc.indexOf("```sql\n", doc.indexOf(heading)) + "```sql\n".length();
        return doc.substring(from, doc.indexOf("```", from));
    }

    private static String normal(String sql) {
        return sql.replaceAll("--[^\n]*", "").replaceAll("\\s+", " ").replaceAll("\\( ", "(").replaceAll(" \\)", ")").trim();
    }
}
