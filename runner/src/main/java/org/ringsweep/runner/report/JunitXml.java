package org.ringsweep.runner.report;

import java.io.IOException;
import java.io.UncheckedIOException;
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
import java.util.function.Consumer;
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
     * The records of one net (one {@code <testsuite>}), walked as often as the writer asks: twice,
     * once to count the suite's cases for its attributes and once to write them.
     */
    public interface NetRecords {
        /** The net name. */
        String net();

        /** Hands every record of the net to {@code action}, in run order. */
        void forEach(Consumer<ResultRecord> action);
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
        List<NetRecords> nets = new ArrayList<>();
        byNet.forEach((net, rs) -> nets.add(new NetRecords() {
            @Override
            public String net() {
                return net;
            }

            @Override
            public void forEach(Consumer<ResultRecord> action) {
                rs.forEach(action);
            }
        }));
        StringBuilder b = new StringBuilder();
        write(b, suiteName, nets, expectedCases, ringsweepVersion, timestamp);
        return b.toString();
    }

    /**
     * Writes the JUnit XML document to {@code out} as it goes: each net's records are walked
     * twice (counts, then cases), so memory does not grow with the number of records.
     *
     * @param nets the nets in suite order; a net without records gives no suite
     * @throws UncheckedIOException when {@code out} fails
     * @see #write(String, List, Map, String, Instant)
     */
    public static void write(Appendable out, String suiteName, List<NetRecords> nets, Map<String, List<String>> expectedCases,
                             String ringsweepVersion, Instant timestamp) {
        List<Counts> counts = new ArrayList<>();
        int tests = 0;
        int failures = 0;
        int errors = 0;
        for (NetRecords n : nets) {
            Counts c = new Counts();
            List<String> expected = expectedCases.get(n.net());
            Appendable none = new NullAppendable();
            n.forEach(r -> {
                c.first = c.first == null ? r : c.first;
                c.engines.add(r.engineName());
                c.engineVersions.add(r.engineVersion());
                cases(r, expected, none, c);
            });
            counts.add(c);
            tests += c.tests;
            failures += c.failures;
            errors += c.errors;
        }
        try {
            out.append("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n");
            out.append("<testsuites name=\"").append(Xml.escape(suiteName)).append("\" tests=\"").append(String.valueOf(tests))
                    .append("\" failures=\"").append(String.valueOf(failures)).append("\" errors=\"").append(String.valueOf(errors))
                    .append("\" time=\"0\">\n");
            for (int i = 0; i < nets.size(); i++) {
                Counts c = counts.get(i);
                if (c.first == null) {
                    continue;
                }
                NetRecords n = nets.get(i);
                StringBuilder b = new StringBuilder();
                b.append("  <testsuite name=\"").append(Xml.escape(n.net())).append("\" tests=\"").append(c.tests).append("\" failures=\"")
                        .append(c.failures).append("\" errors=\"").append(c.errors).append("\" skipped=\"0\" time=\"0\" timestamp=\"")
                        .append(TIMESTAMP.format(timestamp)).append("\">\n    <properties>\n");
                property(b, "engine", String.join(", ", c.engines));
                property(b, "engine.version", String.join(", ", c.engineVersions));
                property(b, "ringsweep.version", ringsweepVersion);
                property(b, "source", c.first.source());
                property(b, "source_hash", c.first.sourceHash());
                b.append("    </properties>\n");
                out.append(b);
                List<String> expected = expectedCases.get(n.net());
                Counts ignored = new Counts();
                n.forEach(r -> cases(r, expected, out, ignored));
                out.append("    <system-out>").append(Xml.escape(Caution.TEXT)).append("</system-out>\n");
                out.append("  </testsuite>\n");
            }
            out.append("</testsuites>\n");
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write the JUnit XML report: " + e.getMessage(), e);
        }
    }

    /** A suite's counts and properties, gathered on the first walk. */
    private static final class Counts {
        int tests;
        int failures;
        int errors;
        ResultRecord first;
        final Set<String> engines = new LinkedHashSet<>();
        final Set<String> engineVersions = new LinkedHashSet<>();
    }

    /** Discards what is written: the counting walk. */
    private static final class NullAppendable implements Appendable {
        @Override
        public Appendable append(CharSequence csq) {
            return this;
        }

        @Override
        public Appendable append(CharSequence csq, int start, int end) {
            return this;
        }

        @Override
        public Appendable append(char c) {
            return this;
        }
    }

    /** The test cases of one record, appended to {@code out} and counted in {@code c}. */
    private static void cases(ResultRecord r, List<String> expected, Appendable out, Counts c) {
        try {
            String classname = classname(r);
            if (r.verdict() == Verdict.ERROR || r.receivers().isEmpty()) {
                String message = r.error().isEmpty() ? "no usable waveform" : r.error();
                for (String name : expected == null || expected.isEmpty() ? List.of("simulation") : expected) {
                    out.append("    <testcase name=\"").append(Xml.escape(name)).append("\" classname=\"").append(Xml.escape(classname))
                            .append("\" time=\"0\">\n      <error message=\"").append(Xml.escape(message)).append("\" type=\"simulation\">")
                            .append(Xml.escape(message)).append("</error>\n    </testcase>\n");
                    c.tests++;
                    c.errors++;
                }
                return;
            }
            for (ReceiverResult rr : r.receivers()) {
                Set<String> edges = new LinkedHashSet<>(rr.edges().keySet());
                rr.violations().forEach(v -> edges.add(v.edge()));
                for (String edge : edges) {
                    List<ViolationRecord> vs = rr.violations().stream().filter(v -> v.edge().equals(edge)).toList();
                    out.append("    <testcase name=\"").append(Xml.escape(rr.pin() + " " + edge)).append("\" classname=\"")
                            .append(Xml.escape(classname)).append("\" time=\"0\"");
                    c.tests++;
                    if (vs.isEmpty()) {
                        out.append("/>\n");
                        continue;
                    }
                    c.failures++;
                    String message = String.join("; ", vs.stream().map(Format::violation).toList());
                    StringBuilder text = new StringBuilder();
                    for (ViolationRecord v : vs) {
                        text.append(v.message()).append('\n');
                    }
                    EdgeResult er = rr.edges().get(edge);
                    if (er != null) {
                        text.append("measured: ").append(er.metrics()).append('\n');
                    }
                    out.append(">\n      <failure message=\"").append(Xml.escape(message)).append("\" type=\"")
                            .append(Xml.escape(vs.get(0).limit())).append("\">").append(Xml.escape(text.toString()))
                            .append("</failure>\n    </testcase>\n");
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write the JUnit XML report: " + e.getMessage(), e);
        }
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
