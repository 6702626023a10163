package org.ringsweep.runner.cli;

import java.io.PrintWriter;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.ringsweep.runner.results.EdgeResult;
import org.ringsweep.runner.results.ReceiverResult;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.results.ViolationRecord;

/**
 * The human table of {@code check}: one row per net, corner, receiver and edge with the key
 * metrics; failing rows carry the word FAIL and a {@code <<} marker (never colour alone), and the
 * violations follow in words.
 */
final class ResultTable {
    private static final String[] HEADER = {"NET", "CORNER", "RECEIVER", "EDGE", "PEAK", "EXCESS", "RINGBACK", "SETTLE", "DELAY", "XINGS", "VERDICT"};

    private ResultTable() {
    }

    static void print(List<ResultRecord> records, PrintWriter out, boolean quiet) {
        List<String[]> rows = new ArrayList<>();
        List<String> notes = new ArrayList<>();
        for (ResultRecord r : records) {
            r.warnings().forEach(w -> notes.add("NOTE " + r.net() + " " + r.corner() + ": " + w));
            if (r.verdict() == Verdict.ERROR) {
                rows.add(new String[] {r.net(), r.corner(), "-", "-", "", "", "", "", "", "", "ERROR <<"});
                notes.add("ERROR " + r.net() + " " + r.corner() + ": " + r.error());
                continue;
            }
            for (ReceiverResult rr : r.receivers()) {
                for (Map.Entry<String, EdgeResult> e : rr.edges().entrySet()) {
                    boolean rise = e.getKey().equals("rise");
                    Map<String, Object> m = e.getValue().metrics();
                    boolean edgeFails = rr.violations().stream().anyMatch(v -> v.edge().equals(e.getKey()));
                    rows.add(new String[] {r.net(), r.corner(), rr.pin(), e.getKey(),
                            volts(rise ? m.get("v_max") : m.get("v_min")),
                            volts(rise ? m.get("overshoot_v") : m.get("undershoot_v")),
                            volts(m.get("ringback_margin_v")),
                            seconds(m.get("settle_s")),
                            seconds(m.get("delay_s")),
                            String.valueOf(m.get("crossings")),
                            edgeFails ? "FAIL <<" : "pass"});
                }
                for (ViolationRecord v : rr.violations()) {
                    notes.add("FAIL " + r.net() + " " + r.corner() + " " + rr.pin() + " " + v.edge() + ": " + v.message());
                }
            }
        }
        if (!quiet) {
            out.println("PEAK: highest (rise) or lowest (fall) voltage; EXCESS: beyond the high (rise) or low (fall) rail;");
            out.println("RINGBACK: margin kept from the threshold after the first crossing; SETTLE, DELAY from the source's 50 % point.");
            out.println();
        }
        printAligned(rows, out);
        if (!notes.isEmpty()) {
            out.println();
            notes.forEach(n -> out.println("  " + n));
        }
        long pass = records.stream().filter(r -> r.verdict() == Verdict.PASS).count();
        long fail = records.stream().filter(r -> r.verdict() == Verdict.FAIL).count();
        long error = records.stream().filter(r -> r.verdict() == Verdict.ERROR).count();
        out.println();
        out.printf(Locale.ROOT, "%d point(s): %d pass, %d fail, %d error%n", records.size(), pass, fail, error);
    }

    private static void printAligned(List<String[]> rows, PrintWriter out) {
        int[] width = new int[HEADER.length];
        for (int i = 0; i < HEADER.length; i++) {
            width[i] = HEADER[i].length();
        }
        for (String[] row : rows) {
            for (int i = 0; i < row.length; i++) {
                width[i] = Math.max(width[i], row[i].length());
            }
        }
        List<String[]> all = new ArrayList<>();
        all.add(HEADER);
        all.addAll(rows);
        for (String[] row : all) {
            StringBuilder b = new StringBuilder();
            for (int i = 0; i < row.length; i++) {
                boolean numeric = i >= 4 && i <= 9;
                String cell = row[i];
                String pad = " ".repeat(width[i] - cell.length());
                b.append(numeric ? pad + cell : cell + pad).append(i < row.length - 1 ? "  " : "");
            }
            out.println(b.toString().stripTrailing());
        }
    }

    static String volts(Object v) {
        return v instanceof Double d && Double.isFinite(d) ? String.format(Locale.ROOT, "%.3f V", d) : "n/a";
    }

    static String seconds(Object v) {
        if (!(v instanceof Double d) || !Double.isFinite(d)) {
            return "n/a";
        }
        return String.format(Locale.ROOT, "%.3f ns", d * 1e9);
    }
}
