package org.ringsweep.runner.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import javax.xml.XMLConstants;
import javax.xml.parsers.DocumentBuilderFactory;
import javax.xml.transform.stream.StreamSource;
import javax.xml.validation.Schema;
import javax.xml.validation.SchemaFactory;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.results.ViolationRecord;
import org.ringsweep.runner.testing.Ngspice;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;
import org.xml.sax.SAXException;

/** junit.xml: valid against the committed JUnit XSD, one test case per net, receiver and edge, failures and errors. */
class JunitXmlTests {
    @TempDir
    static Path dir;

    private static Path out;

    @BeforeAll
    static void runCheck() throws Exception {
        Ngspice.require();
        out = dir.resolve("out");
        ReportFixture.checkPhysics(out);
    }

    private static Schema schema() throws SAXException {
        SchemaFactory f = SchemaFactory.newInstance(XMLConstants.W3C_XML_SCHEMA_NS_URI);
        return f.newSchema(ReportFixture.resource("report/junit.xsd").toFile());
    }

    private static void validate(String xml) throws Exception {
        schema().newValidator().validate(new StreamSource(new StringReader(xml)));
    }

    private static Document parse(String xml) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setFeature(XMLConstants.FEATURE_SECURE_PROCESSING, true);
        return f.newDocumentBuilder().parse(new org.xml.sax.InputSource(new StringReader(xml)));
    }

    private static List<Element> elements(Document d, String name) {
        NodeList nl = d.getElementsByTagName(name);
        List<Element> out = new ArrayList<>();
        for (int i = 0; i < nl.getLength(); i++) {
            out.add((Element) nl.item(i));
        }
        return out;
    }

    @Test
    void checkRunWritesJunitXmlThatValidatesAgainstTheSchema() throws Exception {
        validate(Files.readString(out.resolve(Reports.JUNIT_FILE)));
    }

    @Test
    void junitXmlHasOneTestCasePerNetReceiverAndEdgeOfEveryRecord() throws Exception {
        Document d = parse(Files.readString(out.resolve(Reports.JUNIT_FILE)));
        // Expected cases read from results.jsonl with a plain JSON parser, not through the report code.
        Set<String> expected = new HashSet<>();
        com.fasterxml.jackson.databind.ObjectMapper json = new com.fasterxml.jackson.databind.ObjectMapper();
        for (String line : Files.readAllLines(out.resolve("results.jsonl"))) {
            var r = json.readTree(line);
            for (var rr : r.path("receivers")) {
                for (String edge : List.of("rise", "fall")) {
                    if (rr.has(edge)) {
                        expected.add(r.path("net").asText() + "." + r.path("corner").asText() + "|" + rr.path("pin").asText() + " " + edge);
                    }
                }
            }
        }
        Set<String> found = new HashSet<>();
        for (Element tc : elements(d, "testcase")) {
            assertTrue(found.add(tc.getAttribute("classname") + "|" + tc.getAttribute("name")), "duplicate test case " + tc.getAttribute("name"));
        }
        assertEquals(expected, found);
        assertEquals(ReportFixture.physicsNets().size(), elements(d, "testsuite").size(), "one suite per net");
        Element root = d.getDocumentElement();
        assertEquals(String.valueOf(found.size()), root.getAttribute("tests"));
    }

    @Test
    void violationsAreFailuresNamingMetricValueAndLimit() throws Exception {
        Document d = parse(Files.readString(out.resolve(Reports.JUNIT_FILE)));
        Element bounce = elements(d, "testsuite").stream().filter(s -> s.getAttribute("name").equals("BOUNCE_15_OPEN")).findFirst().orElseThrow();
        List<Element> failures = new ArrayList<>();
        NodeList nl = bounce.getElementsByTagName("failure");
        for (int i = 0; i < nl.getLength(); i++) {
            failures.add((Element) nl.item(i));
        }
        assertEquals(2, failures.size(), "both edges of the unterminated 15 ohm net fail");
        assertEquals("2", bounce.getAttribute("failures"));
        // lines-and-terminations.md §2 (lattice diagram): a 3.3 V step through 15 ohm into a 50 ohm line
        // launches 3.3·50/65 = 2.538 V; the open end doubles it to 5.077 V, 1.777 V above the 3.3 V rail.
        // The default limit 0.3 V is formats.md "Results" (common practice).
        Element rise = (Element) failures.stream().filter(f -> ((Element) f.getParentNode()).getAttribute("name").equals("U2.1 rise"))
                .findFirst().orElseThrow();
        assertTrue(rise.getAttribute("message").startsWith("overshoot_v 1.78 V exceeds overshoot_max 0.30 V"), rise.getAttribute("message"));
        assertEquals("overshoot_max", rise.getAttribute("type"));
        Element matched = elements(d, "testsuite").stream().filter(s -> s.getAttribute("name").equals("MATCHED_SERIES")).findFirst().orElseThrow();
        assertEquals(0, matched.getElementsByTagName("failure").getLength(), "the source-matched net passes (lines-and-terminations.md §4)");
        assertEquals("ngspice", property(matched, "engine"));
        assertFalse(property(matched, "engine.version").isBlank());
    }

    private static String property(Element suite, String name) {
        NodeList nl = suite.getElementsByTagName("property");
        for (int i = 0; i < nl.getLength(); i++) {
            Element p = (Element) nl.item(i);
            if (p.getAttribute("name").equals(name)) {
                return p.getAttribute("value");
            }
        }
        return "";
    }

    private static ResultRecord errorRecord(String net, String message) {
        return new ResultRecord(net, "typ", Map.of("R1/value", 22.0), "ngspice", "39", Verdict.ERROR, List.of(), "out/x/typ-0001.cir",
                message, "net.yaml", "abc", List.of(), List.of());
    }

    @Test
    void errorRecordsAreErrorsOnEveryReceiverAndEdgeWithTheEngineMessage() throws Exception {
        String message = "doAnalyses: TRAN:  Timestep too small; time = 1.2e-09";
        String xml = JunitXml.write("ringsweep sweep", List.of(errorRecord("CLK", message)), Map.of("CLK", List.of("U7.6 rise", "U7.6 fall")),
                "test", Instant.parse("2026-01-02T03:04:05Z"));
        validate(xml);
        Document d = parse(xml);
        List<Element> errors = elements(d, "error");
        assertEquals(2, errors.size());
        errors.forEach(e -> assertEquals(message, e.getAttribute("message")));
        assertEquals("CLK.typ.R1/value=22.0", ((Element) errors.get(0).getParentNode()).getAttribute("classname"));
        assertEquals("2", d.getDocumentElement().getAttribute("errors"));
    }

    @Test
    void errorRecordOfANetWithUnknownReceiversIsOneSimulationError() throws Exception {
        String xml = JunitXml.write("ringsweep check", List.of(errorRecord("CLK", "no engine output")), Map.of(), "test", Instant.EPOCH);
        validate(xml);
        List<Element> cases = elements(parse(xml), "testcase");
        assertEquals(1, cases.size());
        assertEquals("simulation", cases.get(0).getAttribute("name"));
    }

    @Test
    void userTextIsEscapedAndCharactersXmlForbidsAreDropped() throws Exception {
        String net = "A<&>\"'\u0001B\uFFFE";
        ViolationRecord v = new ViolationRecord("overshoot_max", "rise", 0.62, 0.3, false, "rising <edge> & \u0007 more");
        ReceiverResult rr = new ReceiverResult("U<1>.2", Verdict.FAIL, Map.of("rise", new EdgeResult(Map.of("overshoot_v", 0.62))), List.of(v));
        ResultRecord r = new ResultRecord(net, "c&1", Map.of(), "ngspice", "39 \u001b[0m", Verdict.FAIL, List.of(rr), "d", "", "s", "h",
                List.of(), List.of());
        String xml = JunitXml.write("ringsweep check", List.of(r), Map.of(), "test", Instant.EPOCH);
        validate(xml);
        Document d = parse(xml);
        assertEquals("A<&>\"'B", elements(d, "testsuite").get(0).getAttribute("name"));
        Element tc = elements(d, "testcase").get(0);
        assertEquals("U<1>.2 rise", tc.getAttribute("name"));
        assertEquals("A<&>\"'B.c&1", tc.getAttribute("classname"));
        Element failure = elements(d, "failure").get(0);
        // "exceeds" wording with both values, two decimals: the format the task asks for.
        assertEquals("overshoot_v 0.62 V exceeds overshoot_max 0.30 V", failure.getAttribute("message"));
        assertTrue(failure.getTextContent().contains("rising <edge> &  more"));
    }

    @Test
    void schemaRejectsATestCaseWithoutAName() {
        String bad = "<testsuites><testsuite name=\"n\" tests=\"1\"><testcase classname=\"x\"/></testsuite></testsuites>";
        assertThrows(SAXException.class, () -> validate(bad));
    }

    @Test
    void schemaRejectsANegativeCount() {
        String bad = "<testsuites><testsuite name=\"n\" tests=\"-1\"/></testsuites>";
        assertThrows(SAXException.class, () -> validate(bad));
    }
}
