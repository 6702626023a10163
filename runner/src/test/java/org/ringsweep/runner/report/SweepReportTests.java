package org.ringsweep.runner.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import javax.xml.XMLConstants;
import javax.xml.transform.stream.StreamSource;
import javax.xml.validation.SchemaFactory;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.check.Caution;
import org.ringsweep.runner.store.ResultStore;
import org.ringsweep.runner.store.StoredRow;
import org.ringsweep.runner.testing.Ngspice;

/** report.html and junit.xml of a sweep (six series resistor values) and of a tune run. */
class SweepReportTests {
    @TempDir
    static Path dir;

    private static Path out;
    private static Document page;

    @BeforeAll
    static void runSweep() throws Exception {
        Ngspice.require();
        out = dir.resolve("sweep");
        ReportFixture.run("sweep", ReportFixture.resource("sweeps/p2p-small.yaml").toString(), "--out", out.toString(), "--jobs", "2", "--quiet");
        page = Jsoup.parse(Files.readString(out.resolve(Reports.HTML_FILE)));
    }

    /** Column values of the store's points table, read with SQL, keyed by R1/value (from the point key). */
    private static Map<Double, Double> column(String name) throws Exception {
        Map<Double, Double> out = new TreeMap<>();
        try (Connection c = DriverManager.getConnection("jdbc:sqlite:" + SweepReportTests.out.resolve(ResultStore.FILE_NAME));
             Statement s = c.createStatement();
             ResultSet rs = s.executeQuery("SELECT point_key, " + name + " FROM points")) {
            while (rs.next()) {
                String key = rs.getString(1);
                out.put(Double.parseDouble(key.substring(key.indexOf("R1/value=") + 9)), rs.getDouble(2));
            }
        }
        return out;
    }

    private static List<double[]> polyline(Element svg) {
        Element area = svg.selectFirst("rect.plot-area");
        double x = Double.parseDouble(area.attr("x"));
        double y = Double.parseDouble(area.attr("y"));
        double w = Double.parseDouble(area.attr("width"));
        double h = Double.parseDouble(area.attr("height"));
        double x0 = Double.parseDouble(area.attr("data-x-min"));
        double x1 = Double.parseDouble(area.attr("data-x-max"));
        double y0 = Double.parseDouble(area.attr("data-y-min"));
        double y1 = Double.parseDouble(area.attr("data-y-max"));
        List<double[]> pts = new ArrayList<>();
        for (String p : svg.selectFirst("polyline[data-trace=metric]").attr("points").trim().split(" ")) {
            String[] xy = p.split(",");
            pts.add(new double[] {x0 + (Double.parseDouble(xy[0]) - x) / w * (x1 - x0), y0 + (y + h - Double.parseDouble(xy[1])) / h * (y1 - y0),
                                  0.006 / w * (x1 - x0), 0.006 / h * (y1 - y0)});
        }
        return pts;
    }

    @Test
    void sweepReportPlotsEachMetricAgainstTheSweptValueAsTheStoreSummarisesIt() throws Exception {
        Map<String, String> columns = Map.of("overshoot", "worst_overshoot_v", "undershoot", "worst_undershoot_v",
                "ringback", "worst_ringback_margin_v", "settle", "longest_settle_s");
        for (Map.Entry<String, String> m : columns.entrySet()) {
            Element svg = page.selectFirst("svg[data-kind=sweep][data-path=R1/value][data-metric=" + m.getKey() + "]");
            assertTrue(svg != null, m.getKey() + " plot");
            // The store computes its summary columns itself (store.PointSummary); the plot must show the same values.
            Map<Double, Double> stored = column(m.getValue());
            List<double[]> pts = polyline(svg);
            assertEquals(stored.size(), pts.size(), m.getKey());
            int i = 0;
            double scale = m.getKey().equals("settle") ? 1e9 : 1;
            for (Map.Entry<Double, Double> e : stored.entrySet()) {
                double[] p = pts.get(i++);
                assertEquals(e.getKey(), p[0], p[2], "swept value");
                assertEquals(e.getValue() * scale, p[1], p[3], m.getKey() + " at R1 = " + e.getKey());
            }
        }
    }

    @Test
    void sweepPlotsMarkTheBestPointAndDrawTheLimit() throws Exception {
        StoredRow best;
        try (ResultStore store = ResultStore.open(out)) {
            best = store.bestPerNet().values().iterator().next();
        }
        Element svg = page.selectFirst("svg[data-kind=sweep][data-metric=overshoot]");
        Element mark = svg.selectFirst("circle.mark");
        Element area = svg.selectFirst("rect.plot-area");
        double x = Double.parseDouble(area.attr("data-x-min")) + (Double.parseDouble(mark.attr("cx")) - Double.parseDouble(area.attr("x")))
                / Double.parseDouble(area.attr("width")) * (Double.parseDouble(area.attr("data-x-max")) - Double.parseDouble(area.attr("data-x-min")));
        assertEquals(best.point().get("R1/value"), x, 0.05);
        assertTrue(svg.select("text").eachText().stream().anyMatch(t -> t.startsWith("overshoot_max 0.30 V")),
                "the default limit of formats.md \"Results\" is drawn");
        assertTrue(page.selectFirst("table.summary").text().contains(best.pointKey()));
    }

    @Test
    void sweepReportShowsWaveformsOnlyForTheBestAndFailingPoints() {
        List<String> points = page.select("svg[data-kind=wave]").eachAttr("data-point");
        long failing = page.select("table.points tr.fail").size();
        assertEquals((1 + Math.min(failing, HtmlReport.Options.DEFAULT.failingWaveforms())) * 2, points.size(), "rise and fall per shown point");
        assertTrue(page.text().contains(Caution.TEXT));
    }

    @Test
    void sweepJunitXmlValidatesWithOneCasePerPointReceiverAndEdge() throws Exception {
        String xml = Files.readString(out.resolve(Reports.JUNIT_FILE));
        SchemaFactory.newInstance(XMLConstants.W3C_XML_SCHEMA_NS_URI).newSchema(ReportFixture.resource("report/junit.xsd").toFile())
                .newValidator().validate(new StreamSource(new java.io.StringReader(xml)));
        Document x = Jsoup.parse(xml, "", org.jsoup.parser.Parser.xmlParser());
        assertEquals(6 * 2, x.select("testcase").size(), "6 points × 1 receiver × 2 edges");
        // A rising edge fails on overshoot exactly where the store's worst overshoot exceeds the 0.3 V default (formats.md "Results").
        long over = column("worst_overshoot_v").values().stream().filter(v -> v > 0.3).count();
        assertTrue(over > 0, "the sweep has overshooting points");
        assertEquals(over, x.select("testcase[name$=rise]:has(failure[message*=overshoot_v])").size());
    }

    @Test
    void reportCommandRebuildsFromTheStore() throws Exception {
        Files.delete(out.resolve(Reports.HTML_FILE));
        assertEquals(0, ReportFixture.run("report", out.toString(), "--quiet"));
        Document rebuilt = Jsoup.parse(Files.readString(out.resolve(Reports.HTML_FILE)));
        assertEquals(page.select("svg[data-kind=sweep]").size(), rebuilt.select("svg[data-kind=sweep]").size());
        assertEquals("ringsweep sweep report", rebuilt.title());
    }

    @Test
    void tuneWritesAReportWithTheRecommendation() throws Exception {
        Path tune = dir.resolve("tune");
        ReportFixture.run("tune", ReportFixture.resource("tune/p2p-15ohm.yaml").toString(), "--vary", "R1/value", "--series", "E12",
                "--from", "10", "--to", "68", "--out", tune.toString(), "--quiet");
        Document d = Jsoup.parse(Files.readString(tune.resolve(Reports.HTML_FILE)));
        assertEquals("ringsweep tune report", d.title());
        Element rec = d.selectFirst("section#tune");
        assertTrue(rec != null);
        assertFalse(d.select("svg[data-kind=sweep][data-path=R1/value]").isEmpty());
        assertTrue(Files.exists(tune.resolve(Reports.JUNIT_FILE)));
    }
}
