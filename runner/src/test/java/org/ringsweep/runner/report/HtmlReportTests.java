package org.ringsweep.runner.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.parser.Parser;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.check.Caution;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.raw.RawFileReader;
import org.ringsweep.runner.raw.RawPlot;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.testing.Ngspice;

/** report.html of a check run: parses, is self-contained, one plot per receiver and edge, plotted points are the raw samples. */
class HtmlReportTests {
    private static final ObjectMapper JSON = new ObjectMapper();

    @TempDir
    static Path dir;

    private static Path out;
    private static Document page;

    @BeforeAll
    static void runCheck() throws Exception {
        Ngspice.require();
        out = dir.resolve("out");
        ReportFixture.checkPhysics(out);
        page = Jsoup.parse(Files.readString(out.resolve(Reports.HTML_FILE)));
    }

    @Test
    void reportParsesAsHtmlWithASummaryTableFirst() {
        assertEquals("ringsweep check report", page.title());
        Element summary = page.selectFirst("section#summary table.summary");
        assertTrue(summary != null, "summary table");
        Element firstNet = page.selectFirst("section.net");
        assertTrue(summary.elementSiblingIndex() >= 0 && page.html().indexOf("table class=\"summary\"") < page.html().indexOf("section class=\"net\""),
                "summary comes before the nets");
        // The one failing net (the unterminated 15 ohm bounce) is listed first: fail before pass.
        assertEquals("BOUNCE_15_OPEN", summary.select("tbody tr").get(0).selectFirst("td").text());
        assertEquals("BOUNCE_15_OPEN", firstNet.attr("data-net"));
    }

    @Test
    void reportHasNoExternalReferencesAndNoScripts() {
        assertTrue(page.select("script").isEmpty(), "no scripts");
        assertTrue(page.select("link, img, iframe, object, embed").isEmpty(), "nothing loaded from elsewhere");
        for (Element e : page.select("[src], [href]")) {
            String ref = e.hasAttr("src") ? e.attr("src") : e.attr("href");
            assertTrue(ref.startsWith("#"), "only in-page links, found `" + ref + "`");
        }
        assertFalse(page.select("style").html().contains("url(http"), "no fonts or images from the network");
        assertFalse(page.select("style").html().contains("@import"));
    }

    @Test
    void reportCarriesTheCautionAndTheEngineVersion() throws Exception {
        assertTrue(page.text().contains(Caution.TEXT));
        JsonNode r = JSON.readTree(Files.readAllLines(out.resolve("results.jsonl")).get(0));
        assertTrue(page.selectFirst("span.engine").text().contains("ngspice " + r.path("engine").path("version").asText()));
        assertTrue(page.text().contains("depends on the driver, receiver and line models"));
    }

    @Test
    void reportHasOneWaveformPlotPerReceiverAndEdge() throws Exception {
        Set<String> expected = new HashSet<>();
        for (String line : Files.readAllLines(out.resolve("results.jsonl"))) {
            JsonNode r = JSON.readTree(line);
            for (JsonNode rr : r.path("receivers")) {
                for (String edge : List.of("rise", "fall")) {
                    if (rr.has(edge)) {
                        expected.add(r.path("net").asText() + "|" + rr.path("pin").asText() + "|" + edge);
                    }
                }
            }
        }
        List<String> found = new ArrayList<>();
        for (Element svg : page.select("svg[data-kind=wave]")) {
            found.add(svg.attr("data-net") + "|" + svg.attr("data-pin") + "|" + svg.attr("data-edge"));
        }
        assertEquals(expected.size(), found.size(), "one plot each: " + found);
        assertEquals(expected, new HashSet<>(found));
        for (Element svg : page.select("svg[data-kind=wave]")) {
            assertEquals(1, svg.select("polyline[data-trace=receiver]").size());
            assertEquals(1, svg.select("polyline[data-trace=driver]").size(), "the driver pin waveform beside the receiver's");
            String labels = svg.select("text").eachText().toString();
            for (String word : List.of("high rail", "low rail", "VIL..VIH", "settle band", "limit")) {
                assertTrue(labels.contains(word), word + " is labelled in " + svg.attr("data-net") + " " + svg.attr("data-edge"));
            }
        }
    }

    @Test
    void violationsAreListedInWords() throws Exception {
        List<String> items = page.select("section.net[data-net=BOUNCE_15_OPEN] ul.violations li").eachText();
        for (String line : Files.readAllLines(out.resolve("results.jsonl"))) {
            JsonNode r = JSON.readTree(line);
            if (r.path("net").asText().equals("BOUNCE_15_OPEN")) {
                for (JsonNode v : r.path("receivers").get(0).path("violations")) {
                    assertTrue(items.stream().anyMatch(i -> i.contains(v.path("message").asText())), v.path("message").asText());
                }
            }
        }
        assertFalse(items.isEmpty());
    }

    /** One (t in ns, v) point of a polyline, mapped back through the plot area's axis ranges. */
    private static List<double[]> plotted(Element svg, String trace) {
        Element area = svg.selectFirst("rect.plot-area");
        double x = Double.parseDouble(area.attr("x"));
        double y = Double.parseDouble(area.attr("y"));
        double w = Double.parseDouble(area.attr("width"));
        double h = Double.parseDouble(area.attr("height"));
        double x0 = Double.parseDouble(area.attr("data-x-min"));
        double x1 = Double.parseDouble(area.attr("data-x-max"));
        double y0 = Double.parseDouble(area.attr("data-y-min"));
        double y1 = Double.parseDouble(area.attr("data-y-max"));
        List<double[]> out = new ArrayList<>();
        for (String p : svg.selectFirst("polyline[data-trace=" + trace + "]").attr("points").trim().split(" ")) {
            String[] xy = p.split(",");
            double px = Double.parseDouble(xy[0]);
            double py = Double.parseDouble(xy[1]);
            out.add(new double[] {x0 + (px - x) / w * (x1 - x0), y0 + (y + h - py) / h * (y1 - y0),
                                  0.005 / w * (x1 - x0) * 1.01, 0.005 / h * (y1 - y0) * 1.01});
        }
        return out;
    }

    private static RawPlot raw(String net) throws Exception {
        for (String line : Files.readAllLines(out.resolve("results.jsonl"))) {
            JsonNode r = JSON.readTree(line);
            if (r.path("net").asText().equals(net)) {
                return RawFileReader.read(PointRunner.rawFileOf(Path.of(r.path("deck").asText()))).get(0);
            }
        }
        throw new AssertionError("no record of " + net);
    }

    private static String node(String netFile, String pin) {
        Elaboration e = new Elaborator().elaborate(new NetFileLoader(new BuiltinModels()).load(ReportFixture.resource("physics/" + netFile)), "typ");
        return e.circuit().probes().entrySet().stream().filter(x -> x.getValue().equals(pin)).findFirst().orElseThrow().getKey();
    }

    @Test
    void decimatedPlotPointsAreSamplesOfTheRawWaveformAndKeepItsPeak() throws Exception {
        Element svg = page.selectFirst("svg[data-kind=wave][data-net=BOUNCE_15_OPEN][data-edge=rise]");
        RawPlot raw = raw("BOUNCE_15_OPEN");
        double[] t = raw.column("time").orElseThrow();
        double[] v = raw.column("v(" + node("bounce-15ohm-open.yaml", "U2.1") + ")").orElseThrow();
        List<double[]> pts = plotted(svg, "receiver");
        assertTrue(pts.size() < t.length, "long waveform thinned");
        double plottedMax = Double.NEGATIVE_INFINITY;
        int j = 0;
        for (double[] p : pts) {
            // Each plotted point is one raw sample: find it, in time order, within the coordinate rounding.
            while (j < t.length && t[j] * 1e9 < p[0] - p[2]) {
                j++;
            }
            boolean match = false;
            for (int k = j; k < t.length && t[k] * 1e9 <= p[0] + p[2]; k++) {
                match |= Math.abs(v[k] - p[1]) <= p[3];
            }
            assertTrue(match, "plotted (" + p[0] + " ns, " + p[1] + " V) is a raw sample");
            plottedMax = Math.max(plottedMax, p[1]);
        }
        double rawMax = Double.NEGATIVE_INFINITY;
        for (double x : v) {
            rawMax = Math.max(rawMax, x);
        }
        // The open-end peak (5.077 V, lattice diagram of lines-and-terminations.md §2) survives thinning.
        assertEquals(rawMax, plottedMax, pts.get(0)[3]);
        assertEquals(5.077, plottedMax, 0.01);
    }

    @Test
    void undecimatedPlotHasExactlyTheRawSamplesOfTheEdgeWindow() throws Exception {
        Path again = dir.resolve("again");
        ReportFixture.run("check", ReportFixture.resource("physics/matched-series.yaml").toString(), "--out", again.toString(), "--quiet");
        List<ResultRecord> records = RecordReader.readLines(again.resolve("results.jsonl"));
        ReportRun run = new ReportRun(ReportRun.Kind.CHECK, records, Map.of(), List.of(), null);
        Reports.write(again, run, List.of(), new HtmlReport.Options(1_000_000, 5), Instant.EPOCH);
        Document d = Jsoup.parse(Files.readString(again.resolve(Reports.HTML_FILE)));
        Element svg = d.selectFirst("svg[data-kind=wave][data-edge=fall]");
        RawPlot raw = RawFileReader.read(PointRunner.rawFileOf(Path.of(records.get(0).deck()))).get(0);
        double[] t = raw.column("time").orElseThrow();
        double[] v = raw.column("v(" + node("matched-series.yaml", "U2.1") + ")").orElseThrow();
        List<double[]> pts = plotted(svg, "receiver");
        int first = 0;
        while (t[first] * 1e9 < pts.get(0)[0] - pts.get(0)[2]) {
            first++;
        }
        for (int i = 0; i < pts.size(); i++) {
            double[] p = pts.get(i);
            assertEquals(t[first + i] * 1e9, p[0], p[2], "time of point " + i);
            assertEquals(v[first + i], p[1], p[3], "voltage of point " + i);
        }
        // The window ends at the stop time: the last plotted point is the raw file's last sample.
        assertEquals(t.length, first + pts.size());
    }

    @Test
    void reportCommandRebuildsBothFilesFromResultsJsonl() throws Exception {
        Path html = out.resolve(Reports.HTML_FILE);
        String before = Jsoup.parse(Files.readString(html)).select("svg[data-kind=wave]").eachAttr("data-net").toString();
        Files.delete(html);
        Files.delete(out.resolve(Reports.JUNIT_FILE));
        assertEquals(0, ReportFixture.run("report", out.toString(), "--quiet"));
        assertTrue(Files.exists(out.resolve(Reports.JUNIT_FILE)));
        Document rebuilt = Jsoup.parse(Files.readString(html));
        assertEquals(before, rebuilt.select("svg[data-kind=wave]").eachAttr("data-net").toString());
        page = rebuilt;
    }

    @Test
    void junitXmlParsesAsXmlForJsoupToo() throws Exception {
        org.jsoup.nodes.Document x = Jsoup.parse(Files.readString(out.resolve(Reports.JUNIT_FILE)), "", Parser.xmlParser());
        assertFalse(x.select("testcase").isEmpty());
    }
}
