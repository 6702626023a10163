package org.ringsweep.runner.report;

import java.nio.file.Path;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import org.ringsweep.runner.check.Caution;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.results.ViolationRecord;
import org.ringsweep.runner.store.PointKey;
import org.ringsweep.runner.tune.Objective;
import org.ringsweep.runner.tune.TuneResult;

/**
 * Writes {@code report.html}: one self-contained HTML5 file (inline CSS and SVG; no script, no
 * font, no image or style sheet from elsewhere) that opens in any browser and prints in black and
 * white.
 *
 * <p>Contents, in order: the title, the engine(s) and versions, the caution; the summary table,
 * nets worst first (error, then fail, then pass; within each, the smallest voltage margin to a
 * limit first); for tune, the recommendation and its re-checks; then one section per net. For a
 * check, every point of the net with, per receiver, one plot per edge (rising, falling) of the
 * receiver waveform and the driver pin waveform with the rails, the VIL..VIH band, the overshoot
 * and undershoot limits and the settle band drawn in, a table of the measured values and the
 * violations in words. For a sweep or tune, per swept path a plot of each key metric against the
 * swept value with its limit and the best (recommended) value marked, a table of the points
 * (capped at {@value #MAX_TABLE_ROWS} rows), and waveforms only for the best point and the first
 * {@link Options#failingWaveforms()} failing points, so the file stays small (the report says how
 * many were left out).
 *
 * <p>Waveforms are decimated to at most 2 × {@link Options#buckets()} + 2 points per trace
 * ({@link Decimator}: min and max per bucket, so peaks survive).
 */
final class HtmlReport {
    /** Most rows in a sweep's points table. */
    static final int MAX_TABLE_ROWS = 200;

    /**
     * @param buckets          decimation buckets per trace (about one per pixel; 1000 by default)
     * @param failingWaveforms most failing points per net whose waveforms a sweep report shows
     */
    record Options(int buckets, int failingWaveforms) {
        static final Options DEFAULT = new Options(1000, 5);
    }

    private static final DateTimeFormatter WHEN =
            DateTimeFormatter.ofPattern("uuuu-MM-dd HH:mm:ss 'UTC'", Locale.ROOT).withZone(ZoneOffset.UTC);
    private static final String[] EDGE_NAMES = {"rise", "rising edge", "fall", "falling edge"};

    private final ReportRun run;
    private final Map<ResultRecord, ContextResolver.Resolved> contexts;
    private final Path outDir;
    private final Options options;
    private int plotCount;

    private HtmlReport(ReportRun run, Map<ResultRecord, ContextResolver.Resolved> contexts, Path outDir, Options options) {
        this.run = run;
        this.contexts = contexts;
        this.outDir = outDir;
        this.options = options;
    }

    /**
     * The report page.
     *
     * @param run      what the report covers
     * @param contexts each record's levels and windows (or why there are none)
     * @param outDir   the output folder, to find raw files
     * @param options  decimation and size caps
     * @param version  the ringsweep version
     * @param when     when the report is written
     */
    static String render(ReportRun run, Map<ResultRecord, ContextResolver.Resolved> contexts, Path outDir, Options options,
                         String version, Instant when) {
        return new HtmlReport(run, contexts, outDir, options).page(version, when);
    }

    private String page(String version, Instant when) {
        StringBuilder b = new StringBuilder(64 * 1024);
        String title = "ringsweep " + run.kind().word + " report";
        b.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n<title>").append(title).append("</title>\n<style>\n")
                .append(CSS).append("</style>\n</head>\n<body>\n<header>\n<h1>").append(title).append("</h1>\n");
        Set<String> engines = new LinkedHashSet<>();
        run.records().forEach(r -> engines.add(r.engineName().isEmpty() ? "(no engine ran)" : r.engineName() + " " + r.engineVersion()));
        b.append("<p class=\"meta\">Written ").append(WHEN.format(when)).append(" by ringsweep ").append(esc(version))
                .append(". Engine: <span class=\"engine\">").append(esc(String.join(", ", engines))).append("</span>. ")
                .append(run.records().size()).append(" point(s).</p>\n");
        b.append("<p class=\"caution\">").append(esc(Caution.TEXT)).append("</p>\n");
        b.append("<p class=\"models\">Every value, plot and verdict in this report depends on the driver, receiver and line models "
                + "given in the net files; check them before trusting a pass.</p>\n");
        for (String n : run.notes()) {
            b.append("<p class=\"note\">").append(esc(n)).append("</p>\n");
        }
        b.append("</header>\n");
        Map<String, List<ResultRecord>> byNet = new LinkedHashMap<>();
        run.records().forEach(r -> byNet.computeIfAbsent(r.net(), k -> new ArrayList<>()).add(r));
        summary(b, byNet);
        if (run.tune() != null) {
            tune(b, run.tune());
        }
        int netIndex = 0;
        for (String net : summaryOrder(byNet)) {
            netIndex++;
            b.append("<section class=\"net\" id=\"net-").append(netIndex).append("\" data-net=\"").append(esc(net)).append("\">\n<h2>Net ")
                    .append(esc(net)).append("</h2>\n");
            List<ResultRecord> records = byNet.get(net);
            ResultRecord first = records.get(0);
            b.append("<p class=\"meta\">Net file <code>").append(esc(first.source())).append("</code>, SHA-256 <code>")
                    .append(esc(first.sourceHash())).append("</code>.</p>\n");
            if (run.kind() == ReportRun.Kind.CHECK) {
                for (ResultRecord r : records) {
                    point(b, r, false);
                }
            } else {
                sweep(b, net, records);
            }
            b.append("</section>\n");
        }
        b.append("<footer>\n<p>Engine: ").append(esc(String.join(", ", engines))).append(". ringsweep ").append(esc(version)).append(".</p>\n")
                .append("<p class=\"caution\">").append(esc(Caution.TEXT)).append("</p>\n</footer>\n</body>\n</html>\n");
        return b.toString();
    }

    // ---- summary ---------------------------------------------------------------------------

    /** One net's worst values over its points, for the summary. */
    private record NetSummary(String net, Verdict verdict, int pass, int fail, int error, double overshoot, double overshootMargin,
                              double undershoot, double undershootMargin, double ringback, double ringbackMargin, double settle,
                              double worstMargin, int violations) {
    }

    private List<String> summaryOrder(Map<String, List<ResultRecord>> byNet) {
        return summaries(byNet).stream().map(NetSummary::net).toList();
    }

    private List<NetSummary> summaries(Map<String, List<ResultRecord>> byNet) {
        List<NetSummary> out = new ArrayList<>();
        byNet.forEach((net, records) -> out.add(summarise(net, records)));
        out.sort(Comparator.comparingInt((NetSummary s) -> -s.verdict().ordinal())
                .thenComparing(NetSummary::worstMargin, HtmlReport::nanLast)
                .thenComparing(NetSummary::net));
        return out;
    }

    private static int nanLast(double a, double b) {
        if (Double.isNaN(a) || Double.isNaN(b)) {
            return Boolean.compare(Double.isNaN(a), Double.isNaN(b));
        }
        return Double.compare(a, b);
    }

    private NetSummary summarise(String net, List<ResultRecord> records) {
        Verdict worst = Verdict.PASS;
        int pass = 0;
        int fail = 0;
        int error = 0;
        double os = Double.NaN;
        double osM = Double.NaN;
        double us = Double.NaN;
        double usM = Double.NaN;
        double rb = Double.NaN;
        double rbM = Double.NaN;
        double settle = Double.NaN;
        int violations = 0;
        for (ResultRecord r : records) {
            worst = worst.worst(r.verdict());
            switch (r.verdict()) {
                case PASS -> pass++;
                case FAIL -> fail++;
                case ERROR -> error++;
            }
            PointContext ctx = context(r);
            for (ReceiverResult rr : r.receivers()) {
                violations += rr.violations().size();
                PointContext.ReceiverLevels l = ctx == null ? null : ctx.receivers().get(rr.pin());
                double o = metric(rr, "rise", "overshoot_v");
                double u = metric(rr, "fall", "undershoot_v");
                os = max(os, o);
                us = max(us, u);
                for (String edge : rr.edges().keySet()) {
                    rb = min(rb, metric(rr, edge, "ringback_margin_v"));
                    settle = max(settle, metric(rr, edge, "settle_s"));
                    if (l != null) {
                        rbM = min(rbM, metric(rr, edge, "ringback_margin_v") - l.ringbackMarginMinV());
                    }
                }
                if (l != null) {
                    osM = min(osM, l.overshootMaxV() - o);
                    usM = min(usM, l.undershootMaxV() - u);
                }
            }
        }
        double worstMargin = min(min(osM, usM), rbM);
        return new NetSummary(net, worst, pass, fail, error, os, osM, us, usM, rb, rbM, settle, worstMargin, violations);
    }

    private void summary(StringBuilder b, Map<String, List<ResultRecord>> byNet) {
        b.append("<section id=\"summary\">\n<h2>Summary</h2>\n<p>Nets worst first: errors, then failures, then passes; within each, "
                + "the smallest margin to a voltage limit first. A margin is the distance to the limit, negative when it is violated. "
                + "Worst values over every point, receiver and edge of the net.</p>\n");
        b.append("<table class=\"summary\">\n<thead><tr><th>Net</th><th>Verdict</th><th>Points (pass / fail / error)</th>"
                + "<th>Worst overshoot (margin)</th><th>Worst undershoot (margin)</th><th>Worst ringback margin (to its limit)</th>"
                + "<th>Longest settle</th><th>Violations</th>");
        if (run.kind() != ReportRun.Kind.CHECK) {
            b.append("<th>").append(run.kind() == ReportRun.Kind.TUNE ? "Recommended" : "Best point").append("</th>");
        }
        b.append("</tr></thead>\n<tbody>\n");
        int i = 0;
        List<String> order = summaryOrder(byNet);
        for (NetSummary s : summaries(byNet)) {
            i = order.indexOf(s.net()) + 1;
            b.append("<tr class=\"").append(s.verdict().word()).append("\"><td><a href=\"#net-").append(i).append("\">").append(esc(s.net()))
                    .append("</a></td><td class=\"verdict\">").append(verdictWord(s.verdict())).append("</td><td>").append(s.pass() + s.fail() + s.error())
                    .append(" (").append(s.pass()).append(" / ").append(s.fail()).append(" / ").append(s.error()).append(")</td><td>")
                    .append(withMargin(s.overshoot(), s.overshootMargin())).append("</td><td>").append(withMargin(s.undershoot(), s.undershootMargin()))
                    .append("</td><td>").append(withMargin(s.ringback(), s.ringbackMargin())).append("</td><td>")
                    .append(Format.ns(s.settle())).append("</td><td>").append(s.violations()).append("</td>");
            if (run.kind() != ReportRun.Kind.CHECK) {
                String key = run.best().get(s.net());
                b.append("<td>").append(key == null ? "none" : esc(key)).append("</td>");
            }
            b.append("</tr>\n");
        }
        b.append("</tbody>\n</table>\n</section>\n");
    }

    private static String withMargin(double value, double margin) {
        return Format.volts(value) + (Double.isFinite(margin) ? " (" + Format.volts(margin) + ")" : "");
    }

    // ---- tune ------------------------------------------------------------------------------

    private void tune(StringBuilder b, TuneResult t) {
        b.append("<section id=\"tune\">\n<h2>Tune ").append(esc(t.target().toString())).append(" on net ").append(esc(t.net())).append("</h2>\n");
        b.append("<p>Objective: ").append(esc(Objective.DESCRIPTION)).append(". ").append(t.candidates()).append(" candidate(s), ")
                .append(t.evaluated().size()).append(" simulated.</p>\n");
        if (t.recommended().isEmpty()) {
            b.append("<p class=\"verdict fail\">No value in the range passes every limit. Failing at every value simulated: ")
                    .append(esc(t.failingEverywhere().isEmpty() ? "(no single limit)" : String.join(", ", t.failingEverywhere()))).append(".</p>\n");
        } else {
            b.append("<p class=\"recommended\">Recommended ").append(esc(t.target().toString())).append(" = <strong>")
                    .append(Format.si(t.recommended().getAsDouble())).append("</strong>; re-checked at ").append(t.checks().size())
                    .append(" corner / tolerance point(s): ").append(t.robust() ? "all pass" : "<strong>SOME FAIL</strong>").append(".</p>\n");
            b.append("<table>\n<thead><tr><th>Corner</th><th>Value</th><th>Verdict</th></tr></thead>\n<tbody>\n");
            for (TuneResult.Check c : t.checks()) {
                b.append("<tr class=\"").append(c.record().verdict().word()).append("\"><td>").append(esc(c.corner())).append("</td><td>")
                        .append(Format.si(c.value())).append("</td><td class=\"verdict\">").append(verdictWord(c.record().verdict())).append("</td></tr>\n");
            }
            b.append("</tbody>\n</table>\n");
            if (!t.margins().isEmpty()) {
                b.append("<p>Smallest margins to the limits over those checks (positive: inside):</p>\n<table>\n<tbody>\n");
                t.margins().forEach((k, v) -> b.append("<tr><td>").append(esc(k)).append("</td><td>")
                        .append(k.startsWith("settle") || k.startsWith("delay") ? Format.ns(v) : k.startsWith("crossings")
                                ? Format.fixed(v, 0) : Format.volts(v)).append("</td></tr>\n"));
                b.append("</tbody>\n</table>\n");
            }
        }
        b.append("</section>\n");
    }

    // ---- sweeps ----------------------------------------------------------------------------

    private record SweepMetric(String key, String title, String unit, double scale, boolean lowerIsWorse) {
    }

    private static final List<SweepMetric> SWEEP_METRICS = List.of(
            new SweepMetric("overshoot", "worst overshoot", "V", 1, false),
            new SweepMetric("undershoot", "worst undershoot", "V", 1, false),
            new SweepMetric("ringback", "worst ringback margin", "V", 1, true),
            new SweepMetric("settle", "longest settle", "ns", 1e9, false));

    /** Sweep points in point order: corner, then the swept values by path name (as the store's point order). */
    private static final Comparator<ResultRecord> POINT_ORDER = (a, c) -> {
        int k = a.corner().compareTo(c.corner());
        if (k != 0) {
            return k;
        }
        var ia = new TreeMap<>(a.point()).entrySet().iterator();
        var ic = new TreeMap<>(c.point()).entrySet().iterator();
        while (ia.hasNext() && ic.hasNext()) {
            var ea = ia.next();
            var ec = ic.next();
            k = ea.getKey().compareTo(ec.getKey());
            if (k == 0) {
                k = Double.compare(ea.getValue(), ec.getValue());
            }
            if (k != 0) {
                return k;
            }
        }
        return Boolean.compare(ia.hasNext(), ic.hasNext());
    };

    private void sweep(StringBuilder b, String net, List<ResultRecord> unordered) {
        List<ResultRecord> records = new ArrayList<>(unordered);
        records.sort(POINT_ORDER);
        String bestKey = run.best().get(net);
        ResultRecord best = bestKey == null ? null : records.stream().filter(r -> PointKey.of(r).equals(bestKey)).findFirst().orElse(null);
        String bestWord = run.kind() == ReportRun.Kind.TUNE ? "recommended" : "best";
        long errors = records.stream().filter(r -> r.verdict() == Verdict.ERROR).count();
        b.append("<p>").append(records.size()).append(" point(s); ").append(bestWord).append(" (").append(esc(Objective.DESCRIPTION)).append("): ")
                .append(best == null ? "none (no point without error)" : "<code>" + esc(bestKey) + "</code> — " + verdictWord(best.verdict()))
                .append(".</p>\n");
        Set<String> paths = new TreeSet<>();
        records.forEach(r -> paths.addAll(r.point().keySet()));
        Map<String, Double> limits = limits(best != null ? best : records.get(0));
        for (String path : paths) {
            b.append("<h3>Metrics against ").append(esc(path)).append("</h3>\n<div class=\"plots\">\n");
            for (SweepMetric m : SWEEP_METRICS) {
                sweepPlot(b, net, path, m, records, best, bestWord, limits.getOrDefault(m.key(), Double.NaN));
            }
            b.append("</div>\n");
            if (errors > 0) {
                b.append("<p class=\"note\">").append(errors).append(" error point(s) have no values and are not plotted.</p>\n");
            }
        }
        pointsTable(b, records, bestKey);
        List<ResultRecord> shown = new ArrayList<>();
        if (best != null) {
            shown.add(best);
        }
        List<ResultRecord> failing = records.stream().filter(r -> r.verdict() == Verdict.FAIL && r != shownFirst(shown)).toList();
        shown.addAll(failing.subList(0, Math.min(failing.size(), options.failingWaveforms())));
        b.append("<h3>Waveforms</h3>\n<p>Shown for the ").append(bestWord).append(" point and the first ")
                .append(Math.min(failing.size(), options.failingWaveforms())).append(" of ").append(failing.size())
                .append(" failing point(s)");
        if (failing.size() > options.failingWaveforms()) {
            b.append("; the other ").append(failing.size() - options.failingWaveforms()).append(" are left out to keep this file small "
                    + "(their decks and raw files are under the output folder)");
        }
        b.append(".</p>\n");
        for (ResultRecord r : shown) {
            point(b, r, r == best);
        }
    }

    private static ResultRecord shownFirst(List<ResultRecord> shown) {
        return shown.isEmpty() ? null : shown.get(0);
    }

    /** The strictest limit over the receivers of a record, per sweep metric key. */
    private Map<String, Double> limits(ResultRecord r) {
        Map<String, Double> out = new LinkedHashMap<>();
        PointContext ctx = context(r);
        if (ctx == null) {
            return out;
        }
        for (PointContext.ReceiverLevels l : ctx.receivers().values()) {
            out.merge("overshoot", l.overshootMaxV(), Math::min);
            out.merge("undershoot", l.undershootMaxV(), Math::min);
            out.merge("ringback", l.ringbackMarginMinV(), Math::max);
            if (Double.isFinite(l.settleMaxS())) {
                out.merge("settle", l.settleMaxS(), Math::min);
            }
        }
        return out;
    }

    private void sweepPlot(StringBuilder b, String net, String path, SweepMetric m, List<ResultRecord> records, ResultRecord best,
                           String bestWord, double limit) {
        List<double[]> pass = new ArrayList<>();
        List<double[]> fail = new ArrayList<>();
        TreeMap<Double, Double> worstPerX = new TreeMap<>();
        int perX = 0;
        Map<Double, Integer> counts = new java.util.HashMap<>();
        for (ResultRecord r : records) {
            Double x = r.point().get(path);
            if (x == null || r.verdict() == Verdict.ERROR) {
                continue;
            }
            double y = summaryMetric(r, m.key()) * m.scale();
            (r.verdict() == Verdict.PASS ? pass : fail).add(new double[] {x, y});
            perX = Math.max(perX, counts.merge(x, 1, Integer::sum));
            if (Double.isFinite(y)) {
                worstPerX.merge(x, y, m.lowerIsWorse() ? Math::min : Math::max);
            }
        }
        String unit = m.unit();
        SvgPlot plot = new SvgPlot(net + ": " + m.title() + " against " + path, path, m.title() + " (" + unit + ")", 460, 300)
                .id("p" + (++plotCount)).data("kind", "sweep").data("net", net).data("path", path).data("metric", m.key());
        plot.trace(perX > 1 ? "worst over the other swept values and corners" : "each point", keys(worstPerX), values(worstPerX),
                SvgPlot.Line.DASH_DOT, "metric");
        if (!pass.isEmpty()) {
            plot.points("pass", column(pass, 0), column(pass, 1), SvgPlot.Marker.CIRCLE);
        }
        if (!fail.isEmpty()) {
            plot.points("fail", column(fail, 0), column(fail, 1), SvgPlot.Marker.CROSS);
        }
        if (Double.isFinite(limit)) {
            String name = switch (m.key()) {
                case "overshoot" -> "overshoot_max";
                case "undershoot" -> "undershoot_max";
                case "ringback" -> "ringback_margin_min";
                default -> "settle_max";
            };
            plot.hline(limit * m.scale(), name + " " + (unit.equals("ns") ? Format.ns(limit) : Format.volts(limit)), SvgPlot.Line.DOTTED);
        }
        if (best != null && best.point().containsKey(path) && Double.isFinite(summaryMetric(best, m.key()))) {
            plot.mark(best.point().get(path), summaryMetric(best, m.key()) * m.scale(), bestWord + " " + Format.si(best.point().get(path)));
        }
        b.append("<figure class=\"sweep\">").append(plot.svg()).append("<figcaption>").append(esc(m.title())).append(" over all receivers and edges "
                + "of each point against ").append(esc(path)).append("; circles pass, crosses fail; dotted line: the limit; ring: the ")
                .append(bestWord).append(" point.</figcaption></figure>\n");
    }

    private static double[] keys(TreeMap<Double, Double> m) {
        return m.keySet().stream().mapToDouble(Double::doubleValue).toArray();
    }

    private static double[] values(TreeMap<Double, Double> m) {
        return m.values().stream().mapToDouble(Double::doubleValue).toArray();
    }

    private static double[] column(List<double[]> rows, int k) {
        return rows.stream().mapToDouble(r -> r[k]).toArray();
    }

    /**
     * The summary values of a point as the results store defines its columns: max
     * {@code overshoot_v} over rising edges, max {@code undershoot_v} over falling edges, min
     * {@code ringback_margin_v} and max {@code settle_s} over all edges; NaN when an edge lacks the value.
     */
    static double summaryMetric(ResultRecord r, String key) {
        double out = Double.NaN;
        boolean first = true;
        for (ReceiverResult rr : r.receivers()) {
            for (Map.Entry<String, EdgeResult> e : rr.edges().entrySet()) {
                String metric = switch (key) {
                    case "overshoot" -> e.getKey().equals("rise") ? "overshoot_v" : null;
                    case "undershoot" -> e.getKey().equals("fall") ? "undershoot_v" : null;
                    case "ringback" -> "ringback_margin_v";
                    default -> "settle_s";
                };
                if (metric == null || !e.getValue().metrics().containsKey(metric)) {
                    continue;
                }
                double v = number(e.getValue().metrics().get(metric));
                if (!Double.isFinite(v)) {
                    return Double.NaN;
                }
                out = first ? v : key.equals("ringback") ? Math.min(out, v) : Math.max(out, v);
                first = false;
            }
        }
        return out;
    }

    private void pointsTable(StringBuilder b, List<ResultRecord> records, String bestKey) {
        b.append("<h3>Points</h3>\n<table class=\"points\">\n<thead><tr><th>Point</th><th>Verdict</th><th>Worst overshoot</th>"
                + "<th>Worst undershoot</th><th>Worst ringback margin</th><th>Longest settle</th><th>Violations or error</th></tr></thead>\n<tbody>\n");
        int n = 0;
        for (ResultRecord r : records) {
            if (n++ == MAX_TABLE_ROWS) {
                break;
            }
            String key = PointKey.of(r);
            Set<String> why = new LinkedHashSet<>();
            r.receivers().forEach(rr -> rr.violations().forEach(v -> why.add(rr.pin() + ": " + Format.violation(v))));
            if (!r.error().isEmpty()) {
                why.add(r.error());
            }
            b.append("<tr class=\"").append(r.verdict().word()).append("\"><td><code>").append(esc(key)).append("</code>")
                    .append(key.equals(bestKey) ? " <strong>(" + (run.kind() == ReportRun.Kind.TUNE ? "recommended" : "best") + ")</strong>" : "")
                    .append("</td><td class=\"verdict\">").append(verdictWord(r.verdict())).append("</td><td>").append(Format.volts(summaryMetric(r, "overshoot")))
                    .append("</td><td>").append(Format.volts(summaryMetric(r, "undershoot"))).append("</td><td>")
                    .append(Format.volts(summaryMetric(r, "ringback"))).append("</td><td>").append(Format.ns(summaryMetric(r, "settle")))
                    .append("</td><td>").append(esc(String.join("; ", why))).append("</td></tr>\n");
        }
        b.append("</tbody>\n</table>\n");
        if (records.size() > MAX_TABLE_ROWS) {
            b.append("<p class=\"note\">The first ").append(MAX_TABLE_ROWS).append(" of ").append(records.size())
                    .append(" points are listed; <code>ringsweep results OUT_DIR --csv</code> gives them all.</p>\n");
        }
    }

    // ---- one point -------------------------------------------------------------------------

    private void point(StringBuilder b, ResultRecord r, boolean best) {
        String key = PointKey.of(r);
        b.append("<section class=\"point ").append(r.verdict().word()).append("\" data-point=\"").append(esc(key)).append("\">\n<h3>")
                .append(esc(r.net())).append(" · ").append(esc(key)).append(best ? " (" + (run.kind() == ReportRun.Kind.TUNE ? "recommended" : "best") + ")" : "")
                .append(" — ").append(verdictWord(r.verdict())).append("</h3>\n");
        b.append("<p class=\"meta\">Engine ").append(esc(r.engineName() + " " + r.engineVersion())).append("; deck <code>").append(esc(r.deck()))
                .append("</code>").append(r.defaulted().isEmpty() ? "" : "; defaulted limits: " + esc(String.join(", ", r.defaulted()))).append(".</p>\n");
        if (!r.error().isEmpty()) {
            b.append("<p class=\"error\">Error: ").append(esc(r.error())).append("</p>\n");
        }
        if (!r.warnings().isEmpty()) {
            b.append("<ul class=\"warnings\">\n");
            r.warnings().forEach(w -> b.append("<li>Warning: ").append(esc(w)).append("</li>\n"));
            b.append("</ul>\n");
        }
        if (r.receivers().isEmpty()) {
            b.append("</section>\n");
            return;
        }
        ContextResolver.Resolved resolved = contexts.get(r);
        PointContext ctx = context(r);
        WaveformFile.Loaded waves = WaveformFile.load(r, outDir);
        for (ReceiverResult rr : r.receivers()) {
            b.append("<h4>Receiver ").append(esc(rr.pin())).append(" — ").append(verdictWord(rr.verdict())).append("</h4>\n<div class=\"plots\">\n");
            PointContext.ReceiverLevels levels = ctx == null ? null : ctx.receivers().get(rr.pin());
            for (String edge : rr.edges().keySet()) {
                String problem = ctx == null ? (resolved == null ? "no net file context" : resolved.problem())
                        : levels == null ? "the net file has no receiver " + rr.pin() : !waves.found() ? waves.problem() : null;
                if (problem == null) {
                    problem = wavePlot(b, r, rr, edge, ctx, levels, waves);
                }
                if (problem != null) {
                    b.append("<p class=\"missing\">").append(esc(rr.pin() + " " + edgeName(edge))).append(": waveform not drawn: ")
                            .append(esc(problem)).append("</p>\n");
                }
            }
            b.append("</div>\n");
            metricsTable(b, rr);
            if (!rr.violations().isEmpty()) {
                b.append("<ul class=\"violations\">\n");
                for (ViolationRecord v : rr.violations()) {
                    b.append("<li>").append(esc(rr.pin() + ", " + v.message())).append("</li>\n");
                }
                b.append("</ul>\n");
            }
        }
        b.append("</section>\n");
    }

    /** Appends one edge's plot; returns why it cannot be drawn, or null. */
    private String wavePlot(StringBuilder b, ResultRecord r, ReceiverResult rr, String edge, PointContext ctx,
                            PointContext.ReceiverLevels l, WaveformFile.Loaded waves) {
        PointContext.Edge window = ctx.edges().stream().filter(e -> e.word().equals(edge)).findFirst().orElse(null);
        if (window == null) {
            return "the stimulus has no " + edge + " edge";
        }
        double[] t = waves.time();
        double[] v = waves.voltage(l.node()).orElse(null);
        if (v == null) {
            return "raw file `" + waves.file() + "` has no vector v(" + l.node() + ")";
        }
        double[] d = waves.voltage(ctx.driverNode()).orElse(null);
        double span = window.end() - window.start();
        double lo = Math.max(t[0], window.start() - 0.05 * span);
        double hi = Math.min(t[t.length - 1], window.end());
        int from = lowerBound(t, lo);
        int to = upperBound(t, hi);
        if (to - from < 2) {
            return "the raw file holds fewer than two samples in the edge's window";
        }
        String title = r.net() + " " + rr.pin() + " " + edgeName(edge) + " (" + PointKey.of(r) + ")";
        SvgPlot plot = new SvgPlot(title, "time (ns)", "voltage (V)", 560, 330).id("p" + (++plotCount)).data("kind", "wave")
                .data("net", r.net()).data("pin", rr.pin()).data("edge", edge).data("point", PointKey.of(r));
        int[] keep = Decimator.keep(t, v, from, to, options.buckets());
        plot.trace("receiver " + rr.pin(), pick(t, keep, 1e9), pick(v, keep, 1), SvgPlot.Line.SOLID, "receiver");
        if (d != null) {
            int[] keepD = Decimator.keep(t, d, from, to, options.buckets());
            plot.trace("driver pin " + ctx.driverPin(), pick(t, keepD, 1e9), pick(d, keepD, 1), SvgPlot.Line.DASHED, "driver");
        }
        plot.hline(l.highRail(), "high rail " + Format.volts(l.highRail()), SvgPlot.Line.THIN);
        plot.hline(l.lowRail(), "low rail " + Format.volts(l.lowRail()), SvgPlot.Line.THIN);
        if (edge.equals("rise")) {
            plot.hline(l.highRail() + l.overshootMaxV(), "overshoot limit " + Format.volts(l.highRail() + l.overshootMaxV()), SvgPlot.Line.DOTTED);
        } else {
            plot.hline(l.lowRail() - l.undershootMaxV(), "undershoot limit " + Format.volts(l.lowRail() - l.undershootMaxV()), SvgPlot.Line.DOTTED);
        }
        plot.band(l.vil(), l.vih(), "VIL..VIH " + Format.volts(l.vil()) + ".." + Format.volts(l.vih()), true);
        double vFinal = number(rr.edges().get(edge).metrics().get("v_final"));
        if (Double.isFinite(vFinal)) {
            plot.band(vFinal - l.settleBandV(), vFinal + l.settleBandV(), "settle band ±" + Format.volts(l.settleBandV()), false);
        }
        plot.vline(window.source50() * 1e9, "source 50 %", SvgPlot.Line.THIN);
        int points = keep.length;
        b.append("<figure class=\"wave\">").append(plot.svg()).append("<figcaption>").append(esc(rr.pin() + " " + edgeName(edge)))
                .append(": receiver (solid) and driver pin ").append(esc(ctx.driverPin())).append(" (dashed); thin lines: rails; dotted: the ")
                .append(edge.equals("rise") ? "overshoot" : "undershoot").append(" limit; hatched: VIL..VIH; grey: the settle band around the final level")
                .append(points < to - from ? "; " + (to - from) + " samples thinned to " + points + " (min and max kept per pixel)" : "")
                .append(".</figcaption></figure>\n");
        return null;
    }

    private static double[] pick(double[] a, int[] keep, double scale) {
        double[] out = new double[keep.length];
        for (int i = 0; i < keep.length; i++) {
            out[i] = a[keep[i]] * scale;
        }
        return out;
    }

    /** First index with {@code t[i] >= x}. */
    private static int lowerBound(double[] t, double x) {
        int i = java.util.Arrays.binarySearch(t, x);
        if (i >= 0) {
            while (i > 0 && t[i - 1] == x) {
                i--;
            }
            return i;
        }
        return -i - 1;
    }

    /** First index with {@code t[i] > x}. */
    private static int upperBound(double[] t, double x) {
        int i = lowerBound(t, x);
        while (i < t.length && t[i] <= x) {
            i++;
        }
        return i;
    }

    private static final List<String[]> TABLE_METRICS = List.of(
            new String[] {"v_max", "peak high", "V"}, new String[] {"v_min", "peak low", "V"}, new String[] {"v_final", "final", "V"},
            new String[] {"overshoot_v", "overshoot", "V"}, new String[] {"undershoot_v", "undershoot", "V"},
            new String[] {"ringback_margin_v", "ringback margin", "V"}, new String[] {"settle_s", "settle", "s"},
            new String[] {"delay_s", "delay", "s"}, new String[] {"crossings", "crossings", ""}, new String[] {"monotonic", "monotonic", ""},
            new String[] {"slew_v_per_s", "slew (V/ns)", "V/s"});

    private static void metricsTable(StringBuilder b, ReceiverResult rr) {
        b.append("<table class=\"metrics\">\n<thead><tr><th>Edge</th>");
        TABLE_METRICS.forEach(m -> b.append("<th>").append(m[1]).append("</th>"));
        b.append("</tr></thead>\n<tbody>\n");
        rr.edges().forEach((edge, er) -> {
            b.append("<tr><td>").append(esc(edge)).append("</td>");
            for (String[] m : TABLE_METRICS) {
                Object v = er.metrics().get(m[0]);
                String text;
                if (v == null) {
                    text = "";
                } else if (v instanceof Boolean flag) {
                    text = flag ? "yes" : "no";
                } else if (m[2].equals("V")) {
                    text = Format.fixed(number(v), 3);
                } else if (m[2].equals("s")) {
                    text = Format.ns(number(v));
                } else if (m[2].equals("V/s")) {
                    text = Format.fixed(number(v) / 1e9, 2);
                } else {
                    text = String.valueOf(v);
                }
                if (text.equals("NaN")) {
                    text = "not found";
                }
                b.append("<td>").append(esc(text)).append("</td>");
            }
            b.append("</tr>\n");
        });
        b.append("</tbody>\n</table>\n");
    }

    // ---- helpers ---------------------------------------------------------------------------

    private PointContext context(ResultRecord r) {
        ContextResolver.Resolved c = contexts.get(r);
        return c == null ? null : c.context();
    }

    private static double metric(ReceiverResult rr, String edge, String key) {
        EdgeResult e = rr.edges().get(edge);
        return e == null ? Double.NaN : number(e.metrics().get(key));
    }

    private static double number(Object v) {
        return v instanceof Number n ? n.doubleValue() : Double.NaN;
    }

    private static double max(double a, double b) {
        return Double.isNaN(a) ? b : Double.isNaN(b) ? a : Math.max(a, b);
    }

    private static double min(double a, double b) {
        return Double.isNaN(a) ? b : Double.isNaN(b) ? a : Math.min(a, b);
    }

    private static String edgeName(String edge) {
        for (int i = 0; i < EDGE_NAMES.length; i += 2) {
            if (EDGE_NAMES[i].equals(edge)) {
                return EDGE_NAMES[i + 1];
            }
        }
        return edge;
    }

    private static String verdictWord(Verdict v) {
        return v == Verdict.PASS ? "pass" : v.word().toUpperCase(Locale.ROOT);
    }

    private static String esc(String s) {
        return Xml.escape(s);
    }

    private static final String CSS = String.join("\n",
            "body { font-family: sans-serif; color: #000; background: #fff; margin: 1.5em; max-width: 1250px; }",
            "h1 { font-size: 1.5em; } h2 { font-size: 1.25em; border-bottom: 2px solid #000; margin-top: 1.6em; }",
            "h3 { font-size: 1.05em; margin-top: 1.4em; } h4 { font-size: 1em; margin: 1em 0 0.3em; }",
            "table { border-collapse: collapse; margin: 0.5em 0; font-size: 0.9em; }",
            "th, td { border: 1px solid #888; padding: 0.2em 0.5em; text-align: left; vertical-align: top; }",
            "th { background: #eee; }",
            "tr.fail td.verdict, tr.error td.verdict { font-weight: bold; }",
            "tr.fail td.verdict::before { content: \"\\2716  \"; } tr.error td.verdict::before { content: \"\\26A0  \"; }",
            "p.caution { border: 2px solid #000; padding: 0.5em; font-weight: bold; }",
            "p.error { font-weight: bold; } p.missing, p.note { font-style: italic; }",
            ".plots { display: flex; flex-wrap: wrap; gap: 1em; }",
            "figure { margin: 0; break-inside: avoid; page-break-inside: avoid; }",
            "figcaption { font-size: 0.8em; max-width: 560px; }",
            "svg.plot { font-family: sans-serif; font-size: 10px; }",
            "svg .title { font-size: 11px; font-weight: bold; } svg .ref-label, svg .legend, svg .mark-label { font-size: 10px; }",
            "ul.violations li { font-weight: bold; }",
            "@media print { body { margin: 0; max-width: none; } section.net { break-before: page; } a { color: #000; text-decoration: none; } }",
            "");
}
