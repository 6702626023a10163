package org.ringsweep.runner.report;

import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.ringsweep.runner.check.Caution;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.results.ViolationRecord;

/**
 * Writes records as JUnit XML, the report format CI servers read (the element and attribute set
 * of the widely used "JUnit XML" schema: {@code testsuites > testsuite > properties, testcase >
 * failure | error}).
 *
 * <p>Layout, chosen so a CI server's history follows each check from one layout revision to the
 * next:
 * <ul>
 *   <li>one {@code <testsuite>} per net (named after the net), in the order nets first appear;</li>
 *   <li>one {@code <testcase>} per point, receiver and edge: {@code name} is
 *       {@code "<pin> <edge>"} (e.g. {@code U7.6 rise}), {@code classname} is
 *       {@code <net>.<corner>} followed, for swept points, by {@code .<path>=<value>} per swept
 *       value in path order (the point key without its corner, e.g.
 *       {@code SPI0_SCK.typ.R5/value=22.0});</li>
 *   <li>a violated limit is a {@code <failure>} whose {@code message} gives the metric, value and
 *       limit ({@code overshoot_v 0.62 V exceeds overshoot_max 0.30 V}; several are joined with
 *       {@code "; "}), whose {@code type} is the first limit's key, and whose text lists every
 *       violation in words;</li>
 *   <li>an error record (no usable waveform) gives an {@code <error>} with the engine's message
 *       on each receiver and edge the net has (from {@code expectedCases}); when those are unknown,
 *       on one test case named {@code simulation};</li>
 *   <li>{@code time} is {@code 0}: records do not keep run times;</li>
 *   <li>each suite's {@code <properties>} name the engine and its version, the ringsweep version
 *       and the net file with its SHA-256; its {@code <system-out>} carries the caution text.</li>
 * </ul>
 * All user text is escaped and characters XML 1.0 forbids are dropped ({@link Xml}).
 */
public final class JunitXml {
    private static final DateTimeFormatter TIMESTAMP =
            DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mm:ss", Locale.ROOT).withZone(ZoneOffset.UTC);

    private JunitXml() {
    }

    /**
     * The JUnit XML document.
     *
     * @param suiteName        name of the {@code <testsuites>} root, e.g. {@code ringsweep check}
     * @param records          the records, in run order
     * @param expectedCases    net name → the {@code "<pin> <edge>"} cases of its points, used for error
     *                         records (which have no receivers); a missing net gives one {@code simulation} case
     * @param ringsweepVersion the tool's version for the properties
     * @param timestamp        when the report was written (written in UTC without a zone, as the schema's
     *                         {@code xs:dateTime} form is commonly read)
     * @return the document, UTF-8 declared
     */
    public static String write(String suiteName, List<ResultRecord> records, Map<String, List<String>> expectedCases,
                               String ringsweepVersion, Instant timestamp) {
        Map<String, List<ResultRecord>> byNet = new LinkedHashMap<>();
        for (ResultRecord r : records) {
            byNet.computeIfAbsent(r.net(), k -> new ArrayList<>()).add(r);
        }
        List<String> suites = new ArrayList<>();
        int tests = 0;
        int failures = 0;
        int errors = 0;
        for (Map.Entry<String, List<ResultRecord>> e : byNet.entrySet()) {
            Suite s = suite(e.getKey(), e.getValue(), expectedCases.get(e.getKey()), ringsweepVersion, timestamp);
            suites.add(s.xml());
            tests += s.tests();
            failures += s.failures();
            errors += s.errors();
        }
        StringBuilder b = new StringBuilder("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
        b.append("<testsuites name=\"").append(Xml.escape(suiteName)).append("\" tests=\"").append(tests)
                .append("\" failures=\"").append(failures).append("\" errors=\"").append(errors).append("\" time=\"0\">\n");
        suites.forEach(b::append);
        b.append("</testsuites>\n");
        return b.toString();
    }

    private record Suite(String xml, int tests, int failures, int errors) {
    }

    private static Suite suite(String net, List<ResultRecord> records, List<String> expected, String version, Instant timestamp) {
        StringBuilder cases = new StringBuilder();
        int tests = 0;
        int failures = 0;
        int errors = 0;
        for (ResultRecord r : records) {
            String classname = classname(r);
            if (r.verdict() == Verdict.ERROR || r.receivers().isEmpty()) {
                String message = r.error().isEmpty() ? "no usable waveform" : r.error();
                for (String name : expected == null || expected.isEmpty() ? List.of("simulation") : expected) {
                    cases.append("    <testcase name=\"").append(Xml.escape(name)).append("\" classname=\"").append(Xml.escape(classname))
                            .append("\" time=\"0\">\n      <error message=\"").append(Xml.escape(message)).append("\" type=\"simulation\">")
                            .append(Xml.escape(message)).append("</error>\n    </testcase>\n");
                    tests++;
                    errors++;
                }
                continue;
            }
            for (ReceiverResult rr : r.receivers()) {
                Set<String> edges = new LinkedHashSet<>(rr.edges().keySet());
                rr.violations().forEach(v -> edges.add(v.edge()));
                for (String edge : edges) {
                    List<ViolationRecord> vs = rr.violations().stream().filter(v -> v.edge().equals(edge)).toList();
                    cases.append("    <testcase name=\"").append(Xml.escape(rr.pin() + " " + edge)).append("\" classname=\"")
                            .append(Xml.escape(classname)).append("\" time=\"0\"");
                    tests++;
                    if (vs.isEmpty()) {
                        cases.append("/>\n");
                        continue;
                    }
                    failures++;
                    String message = String.join("; ", vs.stream().map(Format::violation).toList());
                    StringBuilder text = new StringBuilder();
                    for (ViolationRecord v : vs) {
                        text.append(v.message()).append('\n');
                    }
                    EdgeResult er = rr.edges().get(edge);
                    if (er != null) {
                        text.append("measured: ").append(er.metrics()).append('\n');
                    }
                    cases.append(">\n      <failure message=\"").append(Xml.escape(message)).append("\" type=\"")
                            .append(Xml.escape(vs.get(0).limit())).append("\">").append(Xml.escape(text.toString()))
                            .append("</failure>\n    </testcase>\n");
                }
            }
        }
        ResultRecord first = records.get(0);
        Set<String> engines = new LinkedHashSet<>();
        Set<String> engineVersions = new LinkedHashSet<>();
        for (ResultRecord r : records) {
            engines.add(r.engineName());
            engineVersions.add(r.engineVersion());
        }
        StringBuilder b = new StringBuilder();
        b.append("  <testsuite name=\"").append(Xml.escape(net)).append("\" tests=\"").append(tests).append("\" failures=\"")
                .append(failures).append("\" errors=\"").append(errors).append("\" skipped=\"0\" time=\"0\" timestamp=\"")
                .append(TIMESTAMP.format(timestamp)).append("\">\n    <properties>\n");
        property(b, "engine", String.join(", ", engines));
        property(b, "engine.version", String.join(", ", engineVersions));
        property(b, "ringsweep.version", version);
        property(b, "source", first.source());
        property(b, "source_hash", first.sourceHash());
        b.append("    </properties>\n").append(cases);
        b.append("    <system-out>").append(Xml.escape(Caution.TEXT)).append("</system-out>\n");
        b.append("  </testsuite>\n");
        return new Suite(b.toString(), tests, failures, errors);
    }

    private static void property(StringBuilder b, String name, String value) {
        b.append("      <property name=\"").append(Xml.escape(name)).append("\" value=\"").append(Xml.escape(value)).append("\"/>\n");
    }

    /** {@code <net>.<corner>[.<path>=<value>...]}, swept paths in ascending order as in the point key. */
    static String classname(ResultRecord r) {
        StringBuilder b = new StringBuilder(r.net()).append('.').append(r.corner());
        for (Map.Entry<String, Double> e : new TreeMap<>(r.point()).entrySet()) {
            b.append('.').append(e.getKey()).append('=').append(Double.toString(e.getValue()));
        }
        return b.toString();
    }
}
