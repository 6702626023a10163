package org.ringsweep.generators.ibis;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads IBIS files: a practical subset of IBIS 3.2 to 7 (impedance-and-standards.md §7).
 *
 * <p>Supported keywords: {@code [IBIS Ver]}, {@code [Comment Char]}, {@code [File Name]},
 * {@code [File Rev]}, {@code [Date]}, {@code [Source]}, {@code [Notes]}, {@code [Disclaimer]},
 * {@code [Copyright]}, {@code [Component]}, {@code [Manufacturer]}, {@code [Package]},
 * {@code [Pin]}, {@code [Model Selector]}, {@code [Model]} (sub-parameters {@code Model_type}, {@code Polarity},
 * {@code Enable}, {@code Vinl}, {@code Vinh}, {@code Vmeas}, {@code Vref}, {@code Cref},
 * {@code Rref}, {@code C_comp}), {@code [Voltage Range]}, {@code [Pullup Reference]},
 * {@code [Pulldown Reference]}, {@code [POWER Clamp Reference]}, {@code [GND Clamp Reference]},
 * {@code [Temperature Range]}, {@code [Pullup]}, {@code [Pulldown]}, {@code [GND Clamp]},
 * {@code [POWER Clamp]}, {@code [Ramp]}, {@code [Rising Waveform]}, {@code [Falling Waveform]}
 * (fixture sub-parameters {@code R_fixture}, {@code V_fixture}, {@code V_fixture_min},
 * {@code V_fixture_max}, {@code L_fixture}, {@code C_fixture}, {@code R_dut}, {@code L_dut},
 * {@code C_dut}) and {@code [End]}. Every other keyword, and every other model sub-parameter, is
 * skipped with a warning in {@link IbisFile#warnings()} that names it and its line: never
 * silently.
 *
 * <p>Rules: keywords and sub-parameter names are case-insensitive, and a space and an underscore
 * are the same in keywords ({@code [Pullup_Reference]}); names and other text are
 * case-sensitive. A comment runs from the comment character ({@code |}, or the one set by
 * {@code [Comment Char]}) to the end of the line. Numbers take the IBIS scale suffixes
 * {@code T G M k m u n p f} — {@code M} is mega, {@code m} milli, unlike SPICE — and any letters
 * after the number or its suffix are a unit and ignored ({@code 5pF}, {@code 3.3V}, {@code 10mA}).
 * {@code NA} is allowed in min and max columns and then takes the typ value (documented fallback;
 * a typ of NA is an error). {@code [Ramp]} values are unreduced fractions {@code dV/dt}
 * ({@code 2.20/1.06n}). Table abscissae must increase strictly. Content after {@code [End]} is
 * ignored.
 *
 * <p>Every problem is an {@link IbisFormatException} naming the file, line, keyword and what was
 * expected. Stateless and thread-safe.
 */
public final class IbisParser {
    private static final Pattern NUMBER = Pattern.compile(
            "([+-]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][+-]?\\d+)?)([TGMkmunpf]?)([A-Za-z]*)");
    private static final Set<String> TEXT_KEYWORDS = Set.of("file rev", "date", "source", "notes", "disclaimer",
            "copyright");
    private static final Set<String> TABLE_KEYWORDS = Set.of("pullup", "pulldown", "gnd clamp", "power clamp");
    private static final Set<String> RANGE_KEYWORDS = Set.of("voltage range", "pullup reference", "pulldown reference",
            "power clamp reference", "gnd clamp reference", "temperature range");

    private IbisParser() {
    }

    /**
     * Reads a file.
     *
     * @param file  the file
     * @param label the file as the user named it, for messages
     * @throws IbisFormatException if it cannot be read or is not valid IBIS
     */
    public static IbisFile parse(Path file, String label) {
        String text;
        try {
            // IBIS files are ASCII; ISO-8859-1 maps every byte, so stray bytes cannot fail the read.
            text = Files.readString(file, StandardCharsets.ISO_8859_1);
        } catch (IOException e) {
            throw new IbisFormatException(label, 0, "", "cannot be read (" + e.getMessage() + "); expected an IBIS file");
        }
        return parse(text, label);
    }

    /**
     * Reads IBIS text.
     *
     * @param text  the file's content
     * @param label the file as the user named it, for messages
     * @throws IbisFormatException if it is not valid IBIS
     */
    public static IbisFile parse(String text, String label) {
        return new Reader(label).read(text);
    }

    /**
     * Reads one IBIS number: a decimal with an optional exponent, an optional scale suffix
     * ({@code T G M k m u n p f}) and optional unit letters, or {@code NA} (returned as NaN).
     *
     * @throws IllegalArgumentException if the text is not such a number
     */
    public static double number(String token) {
        if (token.equalsIgnoreCase("NA")) {
            return Double.NaN;
        }
        Matcher m = NUMBER.matcher(token);
        if (!m.matches()) {
            throw new IllegalArgumentException("`" + token + "` is not a number; expected e.g. `3.3`, `-1.5e-3`, `5p`, `2.2n`, `10mA` or NA");
        }
        double v = Double.parseDouble(m.group(1));
        return switch (m.group(2)) {
            case "T" -> v * 1e12;
            case "G" -> v * 1e9;
            case "M" -> v * 1e6;
            case "k" -> v * 1e3;
            case "m" -> v * 1e-3;
            case "u" -> v * 1e-6;
            case "n" -> v * 1e-9;
            case "p" -> v * 1e-12;
            case "f" -> v * 1e-15;
            default -> v;
        };
    }

    /** What the lines after the current keyword hold. */
    private enum Section { NONE, TEXT, COMPONENT, PACKAGE, PIN, MODEL, RANGE, TABLE, RAMP, WAVEFORM, SELECTOR, SKIP }

    /** The state of one read. */
    private static final class Reader {
        private final String file;
        private final List<String> warnings = new ArrayList<>();
        private final List<IbisComponent> components = new ArrayList<>();
        private final Map<String, IbisModel> models = new LinkedHashMap<>();
        private final Map<String, IbisModelSelector> selectors = new LinkedHashMap<>();
        private SelectorDraft selector;
        private char commentChar = '|';
        private String version;
        private String fileName = "";
        private Section section = Section.NONE;
        private String keyword = "";
        private String keywordNorm = "";
        private int keywordLine;
        private ComponentDraft component;
        private ModelDraft model;
        private TableDraft table;
        private RampDraft ramp;
        private WaveformDraft waveform;
        private boolean ended;

        Reader(String file) {
            this.file = file;
        }

        IbisFile read(String text) {
            String[] lines = text.split("\r\n|\n|\r", -1);
            for (int i = 0; i < lines.length && !ended; i++) {
                line(lines[i], i + 1);
            }
            closeSection();
            closeModel();
            closeComponent();
            if (version == null) {
                throw new IbisFormatException(file, 0, "[IBIS Ver]", "missing; expected an IBIS file starting with e.g. `[IBIS Ver] 3.2`");
            }
            if (!ended) {
                warnings.add(file + ": no [End] keyword; the file may be cut short");
            }
            for (IbisModelSelector sel : selectors.values()) {
                if (models.containsKey(sel.name())) {
                    throw new IbisFormatException(file, sel.line(), "[Model Selector]", "`" + sel.name()
                            + "` is also the name of a [Model]; expected a selector name distinct from every model name");
                }
            }
            return new IbisFile(file, version, fileName, components, models, selectors, warnings);
        }

        private void line(String raw, int n) {
            int c = raw.indexOf(commentChar);
            String line = (c >= 0 ? raw.substring(0, c) : raw).strip();
            if (line.isEmpty()) {
                return;
            }
            if (line.startsWith("[")) {
                int close = line.indexOf(']');
                if (close < 0) {
                    throw new IbisFormatException(file, n, line, "expected a keyword closed by `]`");
                }
                keyword(line.substring(0, close + 1), line.substring(close + 1).strip(), n);
            } else {
                data(line, n);
            }
        }

        // ---- keywords ----

        private void keyword(String kw, String arg, int n) {
            closeSection();
            keyword = kw;
            keywordLine = n;
            keywordNorm = kw.substring(1, kw.length() - 1).replace('_', ' ').strip().replaceAll("\\s+", " ").toLowerCase(Locale.ROOT);
            if (version == null && !keywordNorm.equals("ibis ver")) {
                throw new IbisFormatException(file, n, kw, "expected `[IBIS Ver]` as the first keyword of an IBIS file");
            }
            section = Section.NONE;
            switch (keywordNorm) {
                case "ibis ver" -> {
                    version = requireArg(arg, n, "the version such as `3.2`");
                }
                case "comment char" -> {
                    String a = requireArg(arg, n, "a character followed by `_char`, such as `#_char`");
                    if (!a.endsWith("_char") || a.length() != 6) {
                        throw new IbisFormatException(file, n, kw, "expected a character followed by `_char`, such as `#_char`, found `" + a + "`");
                    }
                    commentChar = a.charAt(0);
                }
                case "file name" -> {
                    fileName = requireArg(arg, n, "the file name");
                }
                case "end" -> {
                    ended = true;
                }
                case "component" -> {
                    closeModel();
                    closeComponent();
                    component = new ComponentDraft(requireArg(arg, n, "the component name"));
                    section = Section.COMPONENT;
                }
                case "manufacturer" -> {
                    requireComponent(n);
                    component.manufacturer = arg;
                    section = Section.TEXT;
                }
                case "package" -> {
                    requireComponent(n);
                    section = Section.PACKAGE;
                }
                case "pin" -> {
                    requireComponent(n);
                    section = Section.PIN;
                }
                case "model" -> {
                    closeModel();
                    closeComponent();
                    model = new ModelDraft(uniqueName(arg, n, "model", models.keySet()), n);
                    section = Section.MODEL;
                }
                case "model selector" -> {
                    closeModel();
                    selector = new SelectorDraft(uniqueName(arg, n, "selector", selectors.keySet()), n);
                    section = Section.SELECTOR;
                }
                case "rising waveform", "falling waveform" -> {
                    requireModel(n);
                    waveform = new WaveformDraft(keywordNorm.startsWith("rising"));
                    section = Section.WAVEFORM;
                }
                case "ramp" -> {
                    requireModel(n);
                    if (model.ramp != null) {
                        duplicate(n);
                    }
                    ramp = new RampDraft();
                    section = Section.RAMP;
                }
                default -> {
                    if (TEXT_KEYWORDS.contains(keywordNorm)) {
                        section = Section.TEXT;
                    } else if (RANGE_KEYWORDS.contains(keywordNorm)) {
                        requireModel(n);
                        range(arg, n);
                        section = Section.RANGE;
                    } else if (TABLE_KEYWORDS.contains(keywordNorm)) {
                        requireModel(n);
                        if (model.tables.containsKey(keywordNorm)) {
                            duplicate(n);
                        }
                        table = new TableDraft(kw);
                        section = Section.TABLE;
                    } else {
                        warnings.add(file + ":" + n + ": keyword " + kw + " is not supported; its data was skipped");
                        section = Section.SKIP;
                    }
                }
            }
        }

        /** The keyword's name argument, checked not to be one of {@code taken}. */
        private String uniqueName(String arg, int n, String what, Set<String> taken) {
            String name = requireArg(arg, n, "the " + what + " name");
            if (taken.contains(name)) {
                throw new IbisFormatException(file, n, keyword, what + " `" + name + "` is defined twice; expected unique " + what + " names");
            }
            return name;
        }

        private void duplicate(int n) {
            throw new IbisFormatException(file, n, keyword, "given twice in model `" + model.name + "`; expected it once per model");
        }

        private String requireArg(String arg, int n, String expected) {
            if (arg.isEmpty()) {
                throw new IbisFormatException(file, n, keyword, "expected " + expected + " after the keyword");
            }
            return arg;
        }

        private void requireComponent(int n) {
            if (component == null) {
                throw new IbisFormatException(file, n, keyword, "expected inside a [Component]");
            }
        }

        private void requireModel(int n) {
            if (model == null) {
                throw new IbisFormatException(file, n, keyword, "expected inside a [Model]");
            }
        }

        private void range(String arg, int n) {
            if (model.ranges.containsKey(keywordNorm)) {
                duplicate(n);
            }
            String[] t = tokens(arg);
            if (t.length != 3) {
                throw new IbisFormatException(file, n, keyword, "expected three values typ, min, max (NA allowed for min and max), found "
                        + t.length);
            }
            model.ranges.put(keywordNorm, rangeOf(t, 0, n));
        }

        // ---- data lines ----

        private void data(String line, int n) {
            switch (section) {
                case TEXT, SKIP -> {
                }
                case NONE -> throw new IbisFormatException(file, n, keyword.isEmpty() ? "" : keyword,
                        "unexpected text `" + line + "`; expected a keyword in brackets or a comment");
                case COMPONENT -> throw new IbisFormatException(file, n, keyword,
                        "unexpected text `" + line + "`; expected a keyword such as [Manufacturer], [Package] or [Pin]");
                case RANGE -> throw new IbisFormatException(file, n, keyword,
                        "unexpected text `" + line + "`; expected the three values on the keyword's own line");
                case PACKAGE -> packageLine(line, n);
                case PIN -> pinLine(line, n);
                case MODEL -> modelLine(line, n);
                case TABLE -> tableRow(table, line, n, "voltage");
                case RAMP -> rampLine(line, n);
                case WAVEFORM -> waveformLine(line, n);
                case SELECTOR -> selectorLine(line, n);
                default -> throw new IllegalStateException(section.name());
            }
        }

        private void packageLine(String line, int n) {
            String[] t = tokens(line);
            String name = t[0].toLowerCase(Locale.ROOT);
            if (!Set.of("r_pkg", "l_pkg", "c_pkg").contains(name)) {
                throw new IbisFormatException(file, n, keyword, "expected R_pkg, L_pkg or C_pkg, found `" + t[0] + "`");
            }
            if (t.length != 4) {
                throw new IbisFormatException(file, n, keyword, "expected `" + t[0] + "` with three values typ, min, max");
            }
            component.pkg.put(name, rangeOf(t, 1, n));
        }

        private void pinLine(String line, int n) {
            String[] t = line.split("\\s+");
            if (t.length != 3 && t.length != 6) {
                throw new IbisFormatException(file, n, keyword, "expected `pin signal_name model_name` optionally followed by R_pin L_pin C_pin, found "
                        + t.length + " columns");
            }
            double r = t.length == 6 ? num(t[3], n) : Double.NaN;
            double l = t.length == 6 ? num(t[4], n) : Double.NaN;
            double c = t.length == 6 ? num(t[5], n) : Double.NaN;
            for (IbisPin p : component.pins) {
                if (p.pin().equals(t[0])) {
                    throw new IbisFormatException(file, n, keyword, "pin `" + t[0] + "` is listed twice");
                }
            }
            component.pins.add(new IbisPin(t[0], t[1], t[2], r, l, c));
        }

        private void modelLine(String line, int n) {
            String[] t = tokens(line);
            String name = t[0].toLowerCase(Locale.ROOT);
            switch (name) {
                case "model_type" -> model.modelType = single(t, n);
                case "polarity" -> model.polarity = single(t, n);
                case "enable" -> single(t, n);
                case "vinl", "vinh", "vmeas", "vref", "cref", "rref" -> {
                    double v = num(single(t, n), n);
                    if (Double.isNaN(v)) {
                        throw new IbisFormatException(file, n, keyword, "`" + t[0] + "` must be a number, found NA");
                    }
                    model.numbers.put(name, v);
                }
                case "c_comp" -> {
                    if (t.length != 4) {
                        throw new IbisFormatException(file, n, keyword, "expected `C_comp` with three values typ, min, max (NA allowed for min and max)");
                    }
                    model.cComp = rangeOf(t, 1, n);
                }
                default -> warnings.add(file + ":" + n + ": sub-parameter `" + t[0] + "` of [Model] " + model.name
                        + " is not supported and was skipped");
            }
        }

        private String single(String[] t, int n) {
            if (t.length != 2) {
                throw new IbisFormatException(file, n, keyword, "expected `" + t[0] + "` with one value");
            }
            return t[1];
        }

        private void tableRow(TableDraft d, String line, int n, String xName) {
            String[] t = line.split("\\s+");
            if (t.length != 4) {
                throw new IbisFormatException(file, n, keyword, "expected four columns (" + xName + ", typ, min, max), found " + t.length);
            }
            double x = num(t[0], n);
            double typ = num(t[1], n);
            if (Double.isNaN(x) || Double.isNaN(typ)) {
                throw new IbisFormatException(file, n, keyword, "the " + xName + " and typ columns must be numbers, found NA");
            }
            if (!d.x.isEmpty() && !(x > d.x.get(d.x.size() - 1))) {
                throw new IbisFormatException(file, n, keyword, "expected " + xName + "s in increasing order, found `" + t[0]
                        + "` after `" + d.x.get(d.x.size() - 1) + "`");
            }
            d.x.add(x);
            d.typ.add(typ);
            d.min.add(num(t[2], n));
            d.max.add(num(t[3], n));
        }

        private void rampLine(String line, int n) {
            String[] t = tokens(line);
            String name = t[0].toLowerCase(Locale.ROOT);
            switch (name) {
                case "dv/dt_r", "dv/dt_f" -> {
                    if (t.length != 4) {
                        throw new IbisFormatException(file, n, keyword, "expected `" + t[0] + "` with three fractions typ, min, max such as `2.20/1.06n`");
                    }
                    double[][] f = new double[3][];
                    for (int i = 0; i < 3; i++) {
                        f[i] = fraction(t[i + 1], n, i > 0);
                    }
                    IbisRange dv = new IbisRange(f[0][0], f[1][0], f[2][0]);
                    IbisRange dt = new IbisRange(f[0][1], f[1][1], f[2][1]);
                    if (name.endsWith("r")) {
                        ramp.riseDv = dv;
                        ramp.riseDt = dt;
                    } else {
                        ramp.fallDv = dv;
                        ramp.fallDt = dt;
                    }
                }
                case "r_load" -> {
                    double r = num(single(t, n), n);
                    if (!(r > 0)) {
                        throw new IbisFormatException(file, n, keyword, "expected a positive R_load, found `" + t[1] + "`");
                    }
                    ramp.rLoad = r;
                }
                default -> throw new IbisFormatException(file, n, keyword, "expected dV/dt_r, dV/dt_f or R_load, found `" + t[0] + "`");
            }
        }

        private double[] fraction(String token, int n, boolean naAllowed) {
            if (token.equalsIgnoreCase("NA")) {
                if (!naAllowed) {
                    throw new IbisFormatException(file, n, keyword, "the typ column must be a fraction such as `2.20/1.06n`, found NA");
                }
                return new double[] {Double.NaN, Double.NaN};
            }
            int slash = token.indexOf('/');
            if (slash < 0) {
                throw new IbisFormatException(file, n, keyword, "expected a fraction dV/dt such as `2.20/1.06n`, found `" + token + "`");
            }
            double dv = num(token.substring(0, slash), n);
            double dt = num(token.substring(slash + 1), n);
            if (!(dv > 0) || !(dt > 0)) {
                throw new IbisFormatException(file, n, keyword, "expected a positive voltage step over a positive time such as `2.20/1.06n`, found `"
                        + token + "`");
            }
            return new double[] {dv, dt};
        }

        private void selectorLine(String line, int n) {
            String[] t = line.split("\\s+", 2);
            for (IbisModelSelector.Entry e : selector.entries) {
                if (e.model().equals(t[0])) {
                    throw new IbisFormatException(file, n, keyword, "model `" + t[0] + "` is listed twice");
                }
            }
            selector.entries.add(new IbisModelSelector.Entry(t[0], t.length > 1 ? t[1].strip() : ""));
        }

        private void waveformLine(String line, int n) {
            if (Character.isLetter(line.charAt(0))) {
                String[] t = tokens(line);
                String name = t[0].toLowerCase(Locale.ROOT);
                if (!Set.of("r_fixture", "v_fixture", "v_fixture_min", "v_fixture_max", "l_fixture", "c_fixture", "r_dut",
                        "l_dut", "c_dut").contains(name)) {
                    throw new IbisFormatException(file, n, keyword, "expected a fixture sub-parameter (R_fixture, V_fixture, V_fixture_min, "
                            + "V_fixture_max, L_fixture, C_fixture, R_dut, L_dut, C_dut) or a row, found `" + t[0] + "`");
                }
                if (!waveform.table.x.isEmpty()) {
                    throw new IbisFormatException(file, n, keyword, "`" + t[0] + "` must come before the table rows");
                }
                double v = num(single(t, n), n);
                if (Double.isNaN(v)) {
                    throw new IbisFormatException(file, n, keyword, "`" + t[0] + "` must be a number, found NA");
                }
                waveform.params.put(name, v);
            } else {
                tableRow(waveform.table, line, n, "time");
            }
        }

        // ---- closing ----

        private void closeSection() {
            switch (section) {
                case TABLE -> {
                    model.tables.put(keywordNorm, table.build(keywordLine));
                    table = null;
                }
                case RAMP -> {
                    if (ramp.riseDv == null || ramp.fallDv == null) {
                        throw new IbisFormatException(file, keywordLine, "[Ramp]", "expected both dV/dt_r and dV/dt_f");
                    }
                    model.ramp = new IbisRamp(ramp.riseDv, ramp.riseDt, ramp.fallDv, ramp.fallDt, ramp.rLoad);
                    ramp = null;
                }
                case SELECTOR -> {
                    if (selector.entries.isEmpty()) {
                        throw new IbisFormatException(file, keywordLine, keyword, "expected at least one row `model_name description`");
                    }
                    selectors.put(selector.name, new IbisModelSelector(selector.name, selector.entries, selector.line));
                    selector = null;
                }
                case WAVEFORM -> {
                    Double r = waveform.params.get("r_fixture");
                    Double v = waveform.params.get("v_fixture");
                    if (r == null || v == null) {
                        throw new IbisFormatException(file, keywordLine, keyword, "expected R_fixture and V_fixture");
                    }
                    if (!(r > 0)) {
                        throw new IbisFormatException(file, keywordLine, keyword, "expected a positive R_fixture, found `" + r + "`");
                    }
                    IbisRange vf = new IbisRange(v, waveform.params.getOrDefault("v_fixture_min", Double.NaN),
                            waveform.params.getOrDefault("v_fixture_max", Double.NaN));
                    IbisWaveform w = new IbisWaveform(r, vf, p("l_fixture"), p("c_fixture"), p("r_dut"), p("l_dut"), p("c_dut"),
                            waveform.table.build(keywordLine), keywordLine);
                    (waveform.rising ? model.rising : model.falling).add(w);
                    waveform = null;
                }
                default -> {
                }
            }
            section = Section.NONE;
        }

        private double p(String key) {
            return waveform.params.getOrDefault(key, Double.NaN);
        }

        private void closeComponent() {
            if (component == null) {
                return;
            }
            components.add(new IbisComponent(component.name, component.manufacturer == null ? "" : component.manufacturer,
                    component.pkg.get("r_pkg"), component.pkg.get("l_pkg"), component.pkg.get("c_pkg"), component.pins));
            component = null;
        }

        private void closeModel() {
            if (model == null) {
                return;
            }
            ModelDraft m = model;
            model = null;
            String at = "[Model] " + m.name;
            if (m.modelType == null) {
                throw new IbisFormatException(file, m.line, at, "missing Model_type; expected e.g. `Model_type I/O`");
            }
            if (m.cComp == null) {
                throw new IbisFormatException(file, m.line, at, "missing C_comp; expected e.g. `C_comp 5.0pF 4.0pF 6.0pF`");
            }
            IbisRange range = m.ranges.get("voltage range");
            if (range == null) {
                boolean needsPullupRef = m.tables.containsKey("pullup") && !m.ranges.containsKey("pullup reference");
                boolean needsClampRef = m.tables.containsKey("power clamp") && !m.ranges.containsKey("power clamp reference");
                if (needsPullupRef || needsClampRef) {
                    throw new IbisFormatException(file, m.line, at, "missing [Voltage Range]; expected it, or [Pullup Reference] and "
                            + "[POWER Clamp Reference] for the Vcc-relative tables");
                }
            }
            boolean output = !(m.modelType.equalsIgnoreCase("Input") || m.modelType.equalsIgnoreCase("Terminator")
                    || m.modelType.equalsIgnoreCase("Input_ECL"));
            if (output && m.ramp == null && m.rising.isEmpty() && m.falling.isEmpty() && !m.modelType.toLowerCase(Locale.ROOT).startsWith("series")) {
                warnings.add(file + ":" + m.line + ": " + at + " of type " + m.modelType + " has no [Ramp] and no waveforms; it cannot drive");
            }
            models.put(m.name, new IbisModel(m.name, m.modelType, m.polarity == null ? "Non-Inverting" : m.polarity,
                    num(m, "vinl"), num(m, "vinh"), num(m, "vmeas"), num(m, "vref"), num(m, "cref"), num(m, "rref"), m.cComp,
                    range, m.ranges.get("pullup reference"), m.ranges.get("pulldown reference"),
                    m.ranges.get("power clamp reference"), m.ranges.get("gnd clamp reference"),
                    m.ranges.get("temperature range"), m.tables.get("pullup"), m.tables.get("pulldown"),
                    m.tables.get("gnd clamp"), m.tables.get("power clamp"), m.ramp, m.rising, m.falling, m.line));
        }

        private static double num(ModelDraft m, String key) {
            return m.numbers.getOrDefault(key, Double.NaN);
        }

        // ---- values ----

        private static String[] tokens(String line) {
            // `Vinl = 0.8V` and `Vinl 0.8V` read the same.
            String s = line.replace("=", " = ").strip();
            List<String> out = new ArrayList<>();
            for (String t : s.split("\\s+")) {
                if (!t.equals("=") && !t.isEmpty()) {
                    out.add(t);
                }
            }
            return out.toArray(new String[0]);
        }

        private double num(String token, int n) {
            try {
                return number(token);
            } catch (IllegalArgumentException e) {
                throw new IbisFormatException(file, n, keyword, e.getMessage());
            }
        }

        private IbisRange rangeOf(String[] t, int from, int n) {
            double typ = num(t[from], n);
            if (Double.isNaN(typ)) {
                throw new IbisFormatException(file, n, keyword, "the typ value must be a number, found NA");
            }
            return new IbisRange(typ, num(t[from + 1], n), num(t[from + 2], n));
        }

        /** A table being read. */
        private final class TableDraft {
            final List<Double> x = new ArrayList<>();
            final List<Double> typ = new ArrayList<>();
            final List<Double> min = new ArrayList<>();
            final List<Double> max = new ArrayList<>();
            final String kw;

            TableDraft(String kw) {
                this.kw = kw;
            }

            IbisTable build(int line) {
                if (x.size() < 2) {
                    throw new IbisFormatException(file, line, kw, "expected at least two rows, found " + x.size());
                }
                return new IbisTable(arr(x), arr(typ), arr(min), arr(max));
            }
        }

        private static double[] arr(List<Double> l) {
            return l.stream().mapToDouble(Double::doubleValue).toArray();
        }

        /** A component being read. */
        private static final class ComponentDraft {
            final String name;
            String manufacturer;
            final Map<String, IbisRange> pkg = new LinkedHashMap<>();
            final List<IbisPin> pins = new ArrayList<>();

            ComponentDraft(String name) {
                this.name = name;
            }
        }

        /** A model being read. */
        private static final class ModelDraft {
            final String name;
            final int line;
            String modelType;
            String polarity;
            IbisRange cComp;
            IbisRamp ramp;
            final Map<String, Double> numbers = new LinkedHashMap<>();
            final Map<String, IbisRange> ranges = new LinkedHashMap<>();
            final Map<String, IbisTable> tables = new LinkedHashMap<>();
            final List<IbisWaveform> rising = new ArrayList<>();
            final List<IbisWaveform> falling = new ArrayList<>();

            ModelDraft(String name, int line) {
                this.name = name;
                this.line = line;
            }
        }

        /** A [Model Selector] being read. */
        private static final class SelectorDraft {
            final String name;
            final int line;
            final List<IbisModelSelector.Entry> entries = new ArrayList<>();

            SelectorDraft(String name, int line) {
                this.name = name;
                this.line = line;
            }
        }

        /** A [Ramp] being read. */
        private static final class RampDraft {
            IbisRange riseDv;
            IbisRange riseDt;
            IbisRange fallDv;
            IbisRange fallDt;
            double rLoad = IbisRamp.DEFAULT_R_LOAD;
        }

        /** A waveform being read. */
        private final class WaveformDraft {
            final boolean rising;
            final Map<String, Double> params = new LinkedHashMap<>();
            final TableDraft table;

            WaveformDraft(boolean rising) {
                this.rising = rising;
                this.table = new TableDraft(rising ? "[Rising Waveform]" : "[Falling Waveform]");
            }
        }
    }
}
