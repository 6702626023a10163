package org.ringsweep.runner.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.store.PointKey;
import org.ringsweep.runner.store.ResultStore;
import org.ringsweep.runner.store.StoredRow;
import org.ringsweep.runner.tune.Objective;
import org.ringsweep.runner.tune.TuneResult;

/**
 * Writes {@code OUT/report.html} ({@link HtmlReport}) and {@code OUT/junit.xml}
 * ({@link JunitXml}) at the end of a run, or rebuilds them from a results store or
 * {@code results.jsonl}.
 *
 * <p>Plots need more than the records hold (rails, thresholds, limits, edge windows, node names):
 * that is re-derived from each record's net file when it is still there unchanged (same SHA-256),
 * with the record's corner and swept values and the run's {@code --set} values applied; where it
 * cannot be, the report says why instead of drawing that plot. Waveforms come from the raw file
 * beside each record's deck.
 */
public final class Reports {
    /** The report for people. */
    public static final String HTML_FILE = "report.html";
    /** The report for CI servers. */
    public static final String JUNIT_FILE = "junit.xml";
    /** The JSON Lines records file a check or tune run writes. */
    public static final String RECORDS_FILE = "results.jsonl";

    /**
     * What was written.
     *
     * @param html  the HTML report
     * @param junit the JUnit XML file
     * @param notes remarks for the user (e.g. plots that could not be drawn, and why)
     */
    public record Written(Path html, Path junit, List<String> notes) {
        /** Copies. */
        public Written {
            notes = List.copyOf(notes);
        }
    }

    private Reports() {
    }

    /**
     * After {@code check}: every record, with its waveforms.
     *
     * @param outDir  the output folder ({@code --out})
     * @param records the run's records, in run order
     * @param sets    the run's {@code --set ID/param=value} options
     * @throws ReportException when a file cannot be written
     */
    public static Written afterCheck(Path outDir, List<ResultRecord> records, List<String> sets) {
        return write(outDir, new ReportRun(ReportRun.Kind.CHECK, records, Map.of(), List.of(), null), sets);
    }

    /**
     * After {@code sweep}: the store's rows of each net's latest net file, the best point per net
     * as {@link ResultStore#bestPerNet()} ranks it.
     *
     * @param outDir the output folder
     * @param store  the open results store
     * @throws ReportException when a file cannot be written or a stored record cannot be read
     */
    public static Written afterSweep(Path outDir, ResultStore store) {
        return fromStore(outDir, store, List.of());
    }

    /**
     * After {@code tune}: every evaluated candidate and every re-check, the recommended value marked.
     *
     * @param outDir the output folder
     * @param result the tune result
     * @throws ReportException when a file cannot be written
     */
    public static Written afterTune(Path outDir, TuneResult result) {
        List<ResultRecord> records = new ArrayList<>();
        result.evaluated().forEach(e -> records.add(e.record()));
        result.checks().forEach(c -> records.add(c.record()));
        Map<String, String> best = new LinkedHashMap<>();
        if (result.recommended().isPresent()) {
            double v = result.recommended().getAsDouble();
            result.evaluated().stream().filter(e -> e.value() == v).findFirst()
                    .ifPresent(e -> best.put(result.net(), PointKey.of(e.record())));
        }
        return write(outDir, new ReportRun(ReportRun.Kind.TUNE, distinct(records), best, List.of(), result), List.of());
    }

    /**
     * Rebuilds both files from {@code OUT/results.sqlite} when it exists (as after a sweep), else
     * from {@code OUT/results.jsonl}: records with swept values make a sweep report with the best
     * point per net by {@link Objective#BEST_FIRST} (ties keep the earlier record); records without
     * make a check report.
     *
     * @param outDir the output folder of an earlier run
     * @param sets   the {@code --set} options the run was given (they are not in the records)
     * @throws ReportException when neither file exists, or one cannot be read or written
     */
    public static Written rebuild(Path outDir, List<String> sets) {
        if (Files.isRegularFile(outDir.resolve(ResultStore.FILE_NAME))) {
            try (ResultStore store = ResultStore.open(outDir)) {
                return fromStore(outDir, store, sets);
            }
        }
        Path jsonl = outDir.resolve(RECORDS_FILE);
        if (!Files.isRegularFile(jsonl)) {
            throw new ReportException("`" + outDir + "` holds neither " + ResultStore.FILE_NAME + " nor " + RECORDS_FILE
                    + "; expected the --out folder of a check, sweep or tune run");
        }
        List<ResultRecord> records = RecordReader.readLines(jsonl);
        boolean swept = records.stream().anyMatch(r -> !r.point().isEmpty());
        if (!swept) {
            return write(outDir, new ReportRun(ReportRun.Kind.CHECK, records, Map.of(), List.of(), null), sets);
        }
        Map<String, ResultRecord> best = new LinkedHashMap<>();
        for (ResultRecord r : records) {
            if (r.verdict() == Verdict.ERROR) {
                continue;
            }
            ResultRecord current = best.get(r.net());
            if (current == null || Objective.BEST_FIRST.compare(r, current) < 0) {
                best.put(r.net(), r);
            }
        }
        Map<String, String> bestKeys = new LinkedHashMap<>();
        best.forEach((net, r) -> bestKeys.put(net, PointKey.of(r)));
        return write(outDir, new ReportRun(ReportRun.Kind.SWEEP, records, bestKeys, List.of("Rebuilt from " + RECORDS_FILE + "."), null), sets);
    }

    /**
     * The most points of one net a sweep report draws before it samples them (the HTML report
     * holds its records in memory; {@code junit.xml} always streams every point).
     */
    static final int POINTS_PER_NET = 1_000;

    /**
     * The sweep report of a store, in bounded memory: per net (its latest file), every point
     * when it has at most {@link #POINTS_PER_NET}; else every k-th point in run order plus the
     * best point and the notable ones ({@link ResultStore#notableIds}: the worst of each summary
     * metric, the first fail and error), with a note saying so. {@code junit.xml} gets every
     * point, streamed from the store.
     */
    private static Written fromStore(Path outDir, ResultStore store, List<String> sets) {
        Map<String, String> latest = store.latestFiles();
        Map<String, StoredRow> bestRows = store.bestPerNet();
        List<ResultRecord> records = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        List<JunitXml.NetRecords> junit = new ArrayList<>();
        long inLatest = 0;
        for (Map.Entry<String, String> file : latest.entrySet()) {
            String net = file.getKey();
            String hash = file.getValue();
            long n = store.counts(hash).get(net).total();
            inLatest += n;
            long stride = (n + POINTS_PER_NET - 1) / POINTS_PER_NET;
            Set<Long> keep = new HashSet<>();
            if (stride > 1) {
                keep.addAll(store.notableIds(net, hash));
                StoredRow best = bestRows.get(net);
                if (best != null) {
                    keep.add(best.id());
                }
            }
            long[] index = {0};
            int before = records.size();
            store.rowsOf(hash).forEach(row -> {
                if (row.net().equals(net) && (index[0]++ % stride == 0 || keep.contains(row.id()))) {
                    records.add(RecordReader.parse(row.recordJson(), store.file() + " row " + row.id()));
                }
            });
            if (stride > 1) {
                notes.add("Net " + net + " has " + n + " points: this report draws " + (records.size() - before) + " of them (one in every "
                        + stride + " in run order, the best point, the worst of each metric and the first fail and error point);"
                        + " its counts and tables are over those. " + JUNIT_FILE + " and " + ResultStore.FILE_NAME
                        + " hold every point (ringsweep results OUT_DIR --csv).");
            }
            junit.add(new JunitXml.NetRecords() {
                @Override
                public String net() {
                    return net;
                }

                @Override
                public void forEach(java.util.function.Consumer<ResultRecord> action) {
                    store.rowsOf(hash).forEach(row -> {
                        if (row.net().equals(net)) {
                            action.accept(RecordReader.parse(row.recordJson(), store.file() + " row " + row.id()));
                        }
                    });
                }
            });
        }
        long older = store.size() - inLatest;
        if (older > 0) {
            notes.add(0, older + " stored point(s) of earlier versions of the net files are left out; only each net's latest file counts.");
        }
        Map<String, String> best = new LinkedHashMap<>();
        bestRows.forEach((net, row) -> best.put(net, row.pointKey()));
        return write(outDir, new ReportRun(ReportRun.Kind.SWEEP, records, best, notes, null), sets, junit);
    }

    private static List<ResultRecord> distinct(List<ResultRecord> records) {
        Map<ResultRecord, Boolean> seen = new IdentityHashMap<>();
        List<ResultRecord> out = new ArrayList<>();
        for (ResultRecord r : records) {
            if (seen.put(r, Boolean.TRUE) == null) {
                out.add(r);
            }
        }
        return out;
    }

    static Written write(Path outDir, ReportRun run, List<String> sets) {
        return write(outDir, run, sets, null);
    }

    /** @param junit the JUnit suites streamed from a store, or null to write them from the run's records */
    private static Written write(Path outDir, ReportRun run, List<String> sets, List<JunitXml.NetRecords> junit) {
        return write(outDir, run, sets, HtmlReport.Options.DEFAULT, Instant.now(), junit);
    }

    static Written write(Path outDir, ReportRun run, List<String> sets, HtmlReport.Options options, Instant when) {
        return write(outDir, run, sets, options, when, null);
    }

    private static Written write(Path outDir, ReportRun run, List<String> sets, HtmlReport.Options options, Instant when,
                                 List<JunitXml.NetRecords> junit) {
        ContextResolver resolver = new ContextResolver(sets);
        Map<ResultRecord, ContextResolver.Resolved> contexts = new IdentityHashMap<>();
        Map<String, List<String>> expected = new LinkedHashMap<>();
        LinkedHashSet<String> notes = new LinkedHashSet<>();
        for (ResultRecord r : run.records()) {
            ContextResolver.Resolved c = resolver.resolve(r);
            contexts.put(r, c);
            if (c.found()) {
                expected.computeIfAbsent(r.net(), k -> {
                    List<String> cases = new ArrayList<>();
                    c.context().receivers().keySet().forEach(pin -> c.context().edges().forEach(e -> cases.add(pin + " " + e.word())));
                    return cases;
                });
            } else {
                notes.add(r.net() + ": levels and limits not drawn: " + c.problem());
            }
        }
        String version = version();
        String html = HtmlReport.render(run, contexts, outDir, options, version, when);
        Path htmlFile = outDir.resolve(HTML_FILE);
        Path junitFile = outDir.resolve(JUNIT_FILE);
        writeFile(htmlFile, html);
        String suiteName = "ringsweep " + run.kind().word;
        if (junit == null) {
            writeFile(junitFile, JunitXml.write(suiteName, run.records(), expected, version, when));
        } else {
            writeFile(junitFile, out -> JunitXml.write(out, suiteName, junit, expected, version, when));
        }
        return new Written(htmlFile, junitFile, new ArrayList<>(notes));
    }

    /** Writes through a temporary file and a move, so a reader never sees half a report. */
    private static void writeFile(Path file, String text) {
        writeFile(file, out -> {
            try {
                out.append(text);
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
        });
    }

    /** As {@link #writeFile(Path, String)}, the text written by {@code body} as it goes (buffered, UTF-8). */
    private static void writeFile(Path file, java.util.function.Consumer<Appendable> body) {
        try {
            Files.createDirectories(file.toAbsolutePath().getParent());
            Path tmp = file.resolveSibling(file.getFileName() + ".tmp");
            try (java.io.Writer w = Files.newBufferedWriter(tmp, StandardCharsets.UTF_8)) {
                body.accept(w);
            } catch (java.io.UncheckedIOException e) {
                throw e.getCause();
            }
            Files.move(tmp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } catch (IOException e) {
            throw new ReportException("cannot write `" + file + "`: " + e.getMessage(), e);
        }
    }

    /** The ringsweep version from the jar manifest. */
    static String version() {
        String v = Reports.class.getPackage().getImplementationVersion();
        return v == null ? "(development build)" : v;
    }

    /**
     * Reads one {@code ringsweep/result-1} record back from its JSON line (for tools that compare
     * stored records, e.g. {@code sweep --verify}).
     *
     * @param json  the record as one line of JSON
     * @param where file and line (or store row) for messages
     * @throws ReportException when the text is not a result record
     */
    public static ResultRecord parseRecord(String json, String where) {
        return RecordReader.parse(json, where);
    }
}
