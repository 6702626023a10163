package org.ringsweep.runner.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
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
        return write(outDir, fromStore(store), List.of());
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
                return write(outDir, fromStore(store), sets);
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

    private static ReportRun fromStore(ResultStore store) {
        List<StoredRow> rows = store.rows();
        Map<String, String> latestHash = new HashMap<>();
        rows.forEach(r -> latestHash.put(r.net(), r.netHash()));
        List<ResultRecord> records = new ArrayList<>();
        int older = 0;
        for (StoredRow row : rows) {
            if (row.netHash().equals(latestHash.get(row.net()))) {
                records.add(RecordReader.parse(row.recordJson(), store.file() + " row " + row.id()));
            } else {
                older++;
            }
        }
        Map<String, String> best = new LinkedHashMap<>();
        store.bestPerNet().forEach((net, row) -> best.put(net, row.pointKey()));
        List<String> notes = older == 0 ? List.of()
                : List.of(older + " stored point(s) of earlier versions of the net files are left out; only each net's latest file counts.");
        return new ReportRun(ReportRun.Kind.SWEEP, records, best, notes, null);
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
        return write(outDir, run, sets, HtmlReport.Options.DEFAULT, Instant.now());
    }

    static Written write(Path outDir, ReportRun run, List<String> sets, HtmlReport.Options options, Instant when) {
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
        String junit = JunitXml.write("ringsweep " + run.kind().word, run.records(), expected, version, when);
        Path htmlFile = outDir.resolve(HTML_FILE);
        Path junitFile = outDir.resolve(JUNIT_FILE);
        writeFile(htmlFile, html);
        writeFile(junitFile, junit);
        return new Written(htmlFile, junitFile, new ArrayList<>(notes));
    }

    /** Writes through a temporary file and a move, so a reader never sees half a report. */
    private static void writeFile(Path file, String text) {
        try {
            Files.createDirectories(file.toAbsolutePath().getParent());
            Path tmp = file.resolveSibling(file.getFileName() + ".tmp");
            Files.writeString(tmp, text, StandardCharsets.UTF_8);
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
