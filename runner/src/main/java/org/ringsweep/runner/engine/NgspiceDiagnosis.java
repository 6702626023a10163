package org.ringsweep.runner.engine;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads ngspice's standard error for the signatures of a failed run (reference ngspice.md §1 and
 * §3: exit status 0 does not mean success). Pure function of the text; thread-safe.
 */
final class NgspiceDiagnosis {
    /** Longest quote of ngspice's own lines in a message (characters). */
    static final int MAX_QUOTE = 300;

    /** A failure kind and the words for it. */
    record Finding(FailureKind kind, String message) {
    }

    /** One recognised signature: the text to look for and what it means. */
    private record Signature(String needle, FailureKind kind, String meaning) {
    }

    /** In priority order: the first signature found decides the kind (a parse problem explains the rest). */
    private static final List<Signature> SIGNATURES = List.of(
            new Signature("Error on line", FailureKind.SYNTAX, "ngspice rejected the deck"),
            new Signature("circuit not parsed", FailureKind.SYNTAX, "ngspice rejected the deck"),
            new Signature("Could not find include file", FailureKind.SYNTAX, "ngspice could not find a file the deck includes"),
            new Signature("Undefined parameter", FailureKind.SYNTAX, "the deck uses a parameter it does not define"),
            new Signature("no such command", FailureKind.SYNTAX, "the deck's .control block uses a command ngspice does not know"),
            new Signature("resistance to low", FailureKind.SYNTAX,
                    "an element has no usable value; ngspice substituted 1 mOhm and simulated a different circuit"),
            new Signature("Timestep too small", FailureKind.CONVERGENCE, "ngspice could not converge"),
            new Signature("timestep too small", FailureKind.CONVERGENCE, "ngspice could not converge"),
            new Signature("run simulation(s) aborted", FailureKind.CONVERGENCE, "ngspice could not converge"),
            new Signature("singular matrix", FailureKind.SINGULAR_MATRIX,
                    "the circuit matrix is singular (a node without a DC path to ground, or a loop of ideal sources)"),
            new Signature("is not available or has zero length", FailureKind.MISSING_OUTPUT,
                    "the deck writes a vector the simulation did not produce"),
            new Signature("Fatal error", FailureKind.CRASH, "ngspice stopped with a fatal error"),
            new Signature("fatal error", FailureKind.CRASH, "ngspice stopped with a fatal error"),
            new Signature("Error", FailureKind.CRASH, "ngspice reported an error"));

    private static final Pattern LINE_NUMBER = Pattern.compile("Error on line (\\d+)");
    private static final Pattern TRAN_TIME = Pattern.compile("Timestep too small; time = ([-+0-9.eE]*[0-9])");
    private static final Pattern TROUBLE = Pattern.compile("trouble with (.+?)\\s*$");
    /** Progress and stepping chatter that ngspice prints without line breaks in front of real messages. */
    private static final Pattern CHATTER = Pattern.compile(
            "Reference value\\s*:\\s*\\S+|Trying gmin\\s*=\\s*\\S+|Supplies reduced to\\s*\\S+%");
    private static final Pattern CHECK_NODE = Pattern.compile("singular matrix:\\s*check node (\\S+)");

    private NgspiceDiagnosis() {
    }

    /**
     * The first failure signature in a run's standard error, with a message quoting the lines
     * that show it.
     *
     * @param stderr the run's standard error text
     * @param deck   the deck's path or name, for messages
     * @return the finding, or empty when no signature occurs
     */
    static Optional<Finding> diagnose(String stderr, String deck) {
        List<String> lines = lines(stderr);
        for (Signature s : SIGNATURES) {
            for (String line : lines) {
                if (line.contains(s.needle())) {
                    String detail = detail(s.kind(), lines, deck);
                    String meaning = detail.isEmpty() ? s.meaning() : s.meaning() + " (" + detail + ")";
                    return Optional.of(new Finding(s.kind(), meaning + ": " + quote(lines)));
                }
            }
        }
        return Optional.empty();
    }

    /**
     * ngspice's relevant lines, trimmed and joined with {@code |}, at most {@link #MAX_QUOTE}
     * characters: every line carrying a signature, plus the two lines after an
     * {@code Error on line} (the offending card and the reason).
     */
    static String quote(String stderr) {
        return quote(lines(stderr));
    }

    private static String quote(List<String> lines) {
        List<String> picked = new ArrayList<>();
        for (int i = 0; i < lines.size(); i++) {
            String line = lines.get(i);
            if (SIGNATURES.stream().anyMatch(s -> line.contains(s.needle())) && !picked.contains(line)) {
                picked.add(line);
                if (line.contains("Error on line")) {
                    for (int j = i + 1; j < Math.min(i + 3, lines.size()); j++) {
                        picked.add(lines.get(j));
                    }
                }
            }
        }
        if (picked.isEmpty()) {
            picked = lines.subList(0, Math.min(3, lines.size()));
        }
        return shorten(String.join(" | ", picked));
    }

    private static String detail(FailureKind kind, List<String> lines, String deck) {
        for (String line : lines) {
            Matcher m;
            if (kind == FailureKind.SYNTAX && (m = LINE_NUMBER.matcher(line)).find()) {
                return "line " + m.group(1) + " of `" + deck + "`";
            }
            if (kind == FailureKind.CONVERGENCE && (m = TRAN_TIME.matcher(line)).find()) {
                Matcher where = TROUBLE.matcher(line);
                return "Timestep too small at t = " + m.group(1) + " s"
                        + (where.find() ? " near " + where.group(1).replace("\"", "") : "");
            }
            if (kind == FailureKind.CONVERGENCE && line.contains("Transient op failed")) {
                return "no DC operating point at the start of the transient";
            }
            if (kind == FailureKind.SINGULAR_MATRIX && (m = CHECK_NODE.matcher(line)).find()) {
                return "check node " + m.group(1);
            }
        }
        return "";
    }

    /** Non-blank, trimmed lines without the progress ticker ({@code Reference value : …}) and stepping chatter. */
    private static List<String> lines(String text) {
        List<String> out = new ArrayList<>();
        for (String raw : text.split("[\r\n]+")) {
            String line = CHATTER.matcher(raw).replaceAll("").strip();
            if (!line.isEmpty()) {
                out.add(line.replaceAll("\\s+", " "));
            }
        }
        return out;
    }

    private static String shorten(String s) {
        return s.length() <= MAX_QUOTE ? s : s.substring(0, MAX_QUOTE - 1) + "…";
    }
}
