package org.ringsweep.runner.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.results.ViolationRecord;

/** report.html without net files or raw files (no ngspice needed): user text escaped, missing plots explained, errors shown. */
class HtmlFallbackTests {
    @TempDir
    Path out;

    private static final String NET = "<script>alert(1)</script>&\u0001";

    private List<ResultRecord> records() {
        ViolationRecord v = new ViolationRecord("overshoot_max", "rise", 0.62, 0.3, true, "rising edge overshoots <b>the high rail</b> by 0.62 V");
        ReceiverResult rr = new ReceiverResult("U<7>.6", Verdict.FAIL,
                Map.of("rise", new EdgeResult(Map.of("overshoot_v", 0.62, "v_final", 3.3))), List.of(v));
        ResultRecord fail = new ResultRecord(NET, "typ", Map.of(), "ngspice", "39", Verdict.FAIL, List.of(rr),
                out.resolve("n/typ-0001.cir").toString(), "", out.resolve("gone.yaml").toString(), "00", List.of(), List.of());
        ResultRecord error = new ResultRecord("CLK", "typ", Map.of(), "ngspice", "39", Verdict.ERROR, List.of(),
                out.resolve("c/typ-0001.cir").toString(), "Timestep too small <here>", out.resolve("gone2.yaml").toString(), "01",
                List.of(), List.of());
        return List.of(fail, error);
    }

    @Test
    void userTextIsEscapedAndInjectsNoMarkup() throws Exception {
        Reports.Written w = Reports.write(out, new ReportRun(ReportRun.Kind.CHECK, records(), Map.of(), List.of(), null), List.of(),
                HtmlReport.Options.DEFAULT, Instant.EPOCH);
        Document d = Jsoup.parse(Files.readString(w.html()));
        assertTrue(d.select("script, b").isEmpty(), "no element came from user text");
        assertEquals(List.of("CLK", "<script>alert(1)</script>&"), d.select("section.net").eachAttr("data-net"));
        assertTrue(d.text().contains("rising edge overshoots <b>the high rail</b> by 0.62 V"));
    }

    @Test
    void plotsThatCannotBeDrawnAreExplainedAndErrorsQuoteTheEngine() throws Exception {
        Reports.Written w = Reports.write(out, new ReportRun(ReportRun.Kind.CHECK, records(), Map.of(), List.of(), null), List.of(),
                HtmlReport.Options.DEFAULT, Instant.EPOCH);
        Document d = Jsoup.parse(Files.readString(w.html()));
        assertTrue(d.select("svg[data-kind=wave]").isEmpty());
        assertTrue(d.selectFirst("p.missing").text().contains("is not there any more"), d.selectFirst("p.missing").text());
        assertTrue(d.selectFirst("p.error").text().contains("Timestep too small <here>"));
        // Worst first: the error net before the failing one.
        assertEquals("CLK", d.select("table.summary tbody tr").get(0).selectFirst("td").text());
        assertTrue(w.notes().stream().anyMatch(n -> n.contains("gone.yaml")), w.notes().toString());
    }
}
