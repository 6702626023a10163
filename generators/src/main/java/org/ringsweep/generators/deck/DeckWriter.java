package org.ringsweep.generators.deck;

import freemarker.cache.ClassTemplateLoader;
import freemarker.cache.FileTemplateLoader;
import freemarker.cache.MultiTemplateLoader;
import freemarker.cache.TemplateLoader;
import freemarker.core.PlainTextOutputFormat;
import freemarker.core.TemplateClassResolver;
import freemarker.template.Configuration;
import freemarker.template.DefaultObjectWrapperBuilder;
import freemarker.template.Template;
import freemarker.template.TemplateException;
import freemarker.template.TemplateExceptionHandler;
import java.io.IOException;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TimeZone;
import java.util.regex.Pattern;
import org.ringsweep.api.circuit.Circuit;
import org.ringsweep.api.circuit.DiodeModel;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.circuit.SafeName;
import org.ringsweep.generators.names.NodeNamer;

/**
 * Writes an ngspice deck for a {@link Circuit} through Freemarker templates.
 *
 * <p>The templates are {@code header.ftl} (the title line, {@code .title} and the comment
 * header) and {@code body.ftl} (elements, models, analysis, control block, {@code .end}; it
 * includes {@code elements.ftl}, {@code models.ftl} and {@code control.ftl}). They come from the
 * {@code templates} module's classpath folder {@code /org/ringsweep/templates/}, or, with
 * {@link #withTemplateDir(Path)}, from a user folder whose files override the built-in ones by
 * name. The templates receive plain data only: every name is already a safe identifier, every
 * number a preformatted string ({@link SpiceNumbers}), every piece of user text a
 * {@link NodeNamer#safeComment} fragment.
 *
 * <p>Deck layout: line 1 is the title (ngspice always takes line 1 as the title, ngspice.md §2),
 * then {@code .title}, comment lines with the net, point, source file and source hash, a line
 * saying the deck was generated and the SHA-256 of the deck body (the text after that line, UTF-8)
 * for the record; then the elements, the {@code .model} cards, {@code .tran step stop 0 maxstep},
 * and a {@code .control} block that runs, writes the probes to the raw file, quits with 3 when the
 * last time point falls short of the stop time (a run that gave up early) and else with 0.
 *
 * <p>A {@link Primitive.TimedResistor} becomes {@code B… I = v(a,b)/pwl(time, …)} and a
 * {@link Primitive.TableCurrent} {@code B… I = pwl(time, …) * pwl(v(cp,cm), …)} (the time
 * factor left out when it has no points); both get flat guard points beyond their ends because
 * ngspice's {@code pwl()} extrapolates linearly (ngspice.md §4).
 *
 * <p>A {@link Primitive.SubcircuitText} becomes a {@code .subckt} of its own whose ports are its
 * nodes, plus one {@code X} instance, so its element and internal node names are scoped. Its text
 * may hold element lines only: each non-blank line must start with an element letter and may
 * contain printable ASCII only; a line starting with {@code .}, {@code *} or {@code +}, any token
 * starting with {@code .}, a backquote, or a control word ({@code shell}, {@code source},
 * {@code include}, ...) is rejected with a {@link DeckWriteException}.
 *
 * <p>Deterministic: the same circuit and options give a byte-identical deck (no dates, ordered
 * data only). Built once (one pinned Freemarker {@link Configuration}); read-only and thread-safe
 * afterwards.
 */
public final class DeckWriter {
    /** The classpath folder of the built-in templates. */
    public static final String TEMPLATE_PATH = "/org/ringsweep/templates/";
    private static final Pattern ELEMENT_LINE = Pattern.compile("[A-Za-z][A-Za-z0-9_]*( [ -~]*)?");
    private static final String ELEMENT_LETTERS = "BCDEFGHIJKLMOQRSTUVWYZ";
    private static final Set<String> CONTROL_WORDS = Set.of("shell", "source", "include", "inc", "lib", "control",
            "endc", "exec", "quit", "write", "wrdata", "load", "codemodel", "osdi", "cd", "set", "let", "run",
            "alter", "alterparam", "echo", "print", "hardcopy", "edit", "bg_run", "rusage");

    private final Configuration cfg;

    private DeckWriter(TemplateLoader loader) {
        Configuration c = new Configuration(Configuration.VERSION_2_3_34);
        c.setTemplateLoader(loader);
        c.setDefaultEncoding("UTF-8");
        c.setOutputEncoding("UTF-8");
        c.setLocale(Locale.ROOT);
        c.setTimeZone(TimeZone.getTimeZone("UTC"));
        c.setLocalizedLookup(false);
        c.setTemplateExceptionHandler(TemplateExceptionHandler.RETHROW_HANDLER);
        c.setLogTemplateExceptions(false);
        c.setWrapUncheckedExceptions(true);
        c.setFallbackOnNullLoopVariable(false);
        c.setOutputFormat(PlainTextOutputFormat.INSTANCE);
        c.setNewBuiltinClassResolver(TemplateClassResolver.ALLOWS_NOTHING_RESOLVER);
        c.setAPIBuiltinEnabled(false);
        c.setObjectWrapper(new DefaultObjectWrapperBuilder(Configuration.VERSION_2_3_34).build());
        c.setTemplateUpdateDelayMilliseconds(Long.MAX_VALUE);
        this.cfg = c;
    }

    /** A writer with the built-in templates. */
    public DeckWriter() {
        this(new ClassTemplateLoader(DeckWriter.class, TEMPLATE_PATH));
    }

    /**
     * A writer whose templates come from {@code dir} first and from the built-in set for any
     * file the folder lacks (the {@code --templates DIR} option).
     *
     * @throws IllegalArgumentException if {@code dir} is not a readable folder
     */
    public static DeckWriter withTemplateDir(Path dir) {
        if (!Files.isDirectory(dir)) {
            throw new IllegalArgumentException("template folder `" + dir + "` does not exist or is not a folder");
        }
        try {
            return new DeckWriter(new MultiTemplateLoader(new TemplateLoader[] {
                new FileTemplateLoader(dir.toFile()), new ClassTemplateLoader(DeckWriter.class, TEMPLATE_PATH)}));
        } catch (IOException e) {
            throw new IllegalArgumentException("template folder `" + dir + "` cannot be read: " + e.getMessage(), e);
        }
    }

    /**
     * Renders the deck.
     *
     * @param circuit the circuit
     * @param options raw file name and settings
     * @return the deck text, lines ending in {@code \n}
     * @throws DeckWriteException if a template fails or a sub-circuit text is not allowed
     */
    public String render(Circuit circuit, DeckOptions options) {
        return render(circuit, options, false);
    }

    /**
     * Renders the deck of one point of a batch: the same title, header, elements, models and
     * analysis line as {@link #render}, but no {@code .control} block, so a batch master deck
     * ({@link #renderBatch}) can {@code source} it. The raw file name of {@code options} is not
     * used (the master deck writes the raw file).
     *
     * @param circuit the circuit
     * @param options the settings (binary and conservative as for {@link #render})
     * @return the deck text, lines ending in {@code \n}
     * @throws DeckWriteException as {@link #render}, and when the templates (a user's
     *                            {@code control.ftl} that ignores {@code circuitOnly}) still write a
     *                            {@code .control} block: such a point cannot run in a batch
     */
    public String renderCircuitOnly(Circuit circuit, DeckOptions options) {
        String deck = render(circuit, options, true);
        for (String line : deck.split("\n")) {
            String t = line.strip().toLowerCase(Locale.ROOT);
            if (t.startsWith(".control") || t.startsWith(".endc")) {
                throw new DeckWriteException("the templates write a .control block into a circuit-only deck"
                        + " (control.ftl must leave it out when `circuitOnly` is true); the point cannot run in a batch");
            }
        }
        return deck;
    }

    /**
     * Renders a batch master deck from {@code batch.ftl}: one ngspice process sources each entry's
     * circuit-only deck in turn, runs it, writes its probes to the entry's raw file, prints
     * {@code RSW_DONE <k> <last time point>} on standard output (k counting entries from 0), and
     * removes plots and circuit before the next entry; it ends with {@code quit 0}. The deck holds
     * no user text: a fixed title and the generated names of the entries only.
     *
     * @param entries the points, in running order; at least one
     * @param binary  binary raw files ({@code set filetype=binary}), else ASCII
     * @return the master deck text, lines ending in {@code \n}
     * @throws DeckWriteException if the template fails
     * @throws IllegalArgumentException when {@code entries} is empty
     */
    public String renderBatch(List<BatchEntry> entries, boolean binary) {
        if (entries.isEmpty()) {
            throw new IllegalArgumentException("a batch needs at least one entry");
        }
        Map<String, Object> model = new LinkedHashMap<>();
        model.put("filetype", binary ? "binary" : "ascii");
        List<Map<String, Object>> list = new ArrayList<>();
        for (BatchEntry e : entries) {
            list.add(Map.of("deck", e.deckFileName(), "raw", e.rawFileName(), "probes", e.probes()));
        }
        model.put("entries", list);
        String deck = process("batch.ftl", model);
        return deck.endsWith("\n") ? deck : deck + "\n";
    }

    private String render(Circuit circuit, DeckOptions options, boolean circuitOnly) {
        Map<String, Object> model = dataModel(circuit, options);
        model.put("circuitOnly", circuitOnly);
        String body = process("body.ftl", model);
        if (!body.endsWith("\n")) {
            body = body + "\n";
        }
        model.put("bodySha256", NodeNamer.sha256Hex(body));
        String header = process("header.ftl", model);
        if (!header.endsWith("\n")) {
            header = header + "\n";
        }
        return header + body;
    }

    private String process(String name, Map<String, Object> model) {
        try {
            Template t = cfg.getTemplate(name);
            StringWriter out = new StringWriter();
            t.process(model, out);
            return out.toString().replace("\r\n", "\n");
        } catch (TemplateException e) {
            throw new DeckWriteException("deck template " + name + " failed: " + e.getMessageWithoutStackTop(), e);
        } catch (IOException e) {
            throw new DeckWriteException("deck template " + name + " cannot be read: " + e.getMessage(), e);
        }
    }

    private static Map<String, Object> dataModel(Circuit c, DeckOptions o) {
        Map<String, Object> m = new LinkedHashMap<>();
        String title = c.title().trim();
        if (title.isEmpty() || !Character.isLetterOrDigit(title.charAt(0))) {
            title = "net " + title;
        }
        m.put("title", title);
        List<Map<String, String>> notes = new ArrayList<>();
        c.notes().forEach((k, v) -> notes.add(Map.of("key", NodeNamer.safeComment(k), "value", NodeNamer.safeComment(v))));
        m.put("notes", notes);
        List<Map<String, Object>> elements = new ArrayList<>();
        Map<String, Map<String, Object>> models = new LinkedHashMap<>();
        Map<String, Object> modelOwners = new LinkedHashMap<>();
        double stop = c.analysis().stop();
        for (Primitive p : c.primitives()) {
            elements.add(element(p, stop, models, modelOwners));
        }
        m.put("elements", elements);
        m.put("models", new ArrayList<>(models.values()));
        double maxStep = o.conservative() ? c.analysis().maxStep() / 4 : c.analysis().maxStep();
        double step = Math.min(c.analysis().step(), maxStep);
        m.put("step", SpiceNumbers.format(step));
        m.put("stop", SpiceNumbers.format(stop));
        m.put("maxStep", SpiceNumbers.format(maxStep));
        m.put("stopCheck", SpiceNumbers.format(stop * (1 - 1e-9)));
        m.put("conservative", o.conservative());
        m.put("filetype", o.binary() ? "binary" : "ascii");
        m.put("raw", o.rawFileName());
        List<String> probes = new ArrayList<>();
        c.probes().keySet().forEach(n -> probes.add(SafeName.require(n, "probe")));
        m.put("probes", probes);
        return m;
    }

    private static Map<String, Object> element(Primitive p, double stop, Map<String, Map<String, Object>> models,
                                               Map<String, Object> owners) {
        Map<String, Object> e = new LinkedHashMap<>();
        e.put("name", p.name());
        if (p instanceof Primitive.Resistor r) {
            put(e, "resistor", "a", r.a(), "b", r.b(), "value", SpiceNumbers.format(r.ohms()));
        } else if (p instanceof Primitive.Capacitor cap) {
            put(e, "capacitor", "a", cap.a(), "b", cap.b(), "value", SpiceNumbers.format(cap.farads()));
        } else if (p instanceof Primitive.Inductor l) {
            put(e, "inductor", "a", l.a(), "b", l.b(), "value", SpiceNumbers.format(l.henries()));
        } else if (p instanceof Primitive.DcVoltage v) {
            put(e, "dc", "a", v.plus(), "b", v.minus(), "value", SpiceNumbers.format(v.volts()));
        } else if (p instanceof Primitive.PwlVoltage v) {
            put(e, "pwl", "a", v.plus(), "b", v.minus());
            e.put("points", points(v.times(), v.volts()));
        } else if (p instanceof Primitive.TimedResistor r) {
            put(e, "timedResistor", "a", r.a(), "b", r.b());
            double[] t = r.times();
            double[] ohms = r.ohms();
            // ngspice's pwl() extrapolates linearly (ngspice.md §4): flat guard points hold the ends.
            double[] gt = new double[t.length + 2];
            double[] gv = new double[t.length + 2];
            gt[0] = Math.min(-1, t[0] - 1);
            gv[0] = ohms[0];
            System.arraycopy(t, 0, gt, 1, t.length);
            System.arraycopy(ohms, 0, gv, 1, t.length);
            gt[gt.length - 1] = Math.max(t[t.length - 1], stop) + 1;
            gv[gv.length - 1] = ohms[ohms.length - 1];
            e.put("points", points(gt, gv));
        } else if (p instanceof Primitive.TableCurrent tc) {
            put(e, "tableCurrent", "a", tc.plus(), "b", tc.minus(), "cp", tc.ctrlPlus(), "cm", tc.ctrlMinus());
            double[] x = tc.x();
            double[] y = tc.y();
            // pwl() extrapolates linearly (ngspice.md §4): flat guard points 1 kV beyond each end hold the table's end values.
            double span = Math.max(1e3, x[x.length - 1] - x[0]);
            double[] gx = new double[x.length + 2];
            double[] gy = new double[x.length + 2];
            gx[0] = x[0] - span;
            gy[0] = y[0];
            System.arraycopy(x, 0, gx, 1, x.length);
            System.arraycopy(y, 0, gy, 1, y.length);
            gx[gx.length - 1] = x[x.length - 1] + span;
            gy[gy.length - 1] = y[y.length - 1];
            e.put("points", points(gx, gy));
            double[] t = tc.scaleTimes();
            double[] k = tc.scale();
            if (t.length > 0) {
                double[] gt = new double[t.length + 2];
                double[] gk = new double[t.length + 2];
                gt[0] = Math.min(-1, t[0] - 1);
                gk[0] = k[0];
                System.arraycopy(t, 0, gt, 1, t.length);
                System.arraycopy(k, 0, gk, 1, t.length);
                gt[gt.length - 1] = Math.max(t[t.length - 1], stop) + 1;
                gk[gk.length - 1] = k[k.length - 1];
                e.put("scale", points(gt, gk));
            } else {
                e.put("scale", List.of());
            }
        } else if (p instanceof Primitive.LosslessLine t) {
            put(e, "lossless", "a", t.a(), "aRef", t.aRef(), "b", t.b(), "bRef", t.bRef(),
                    "z0", SpiceNumbers.format(t.z0()), "delay", SpiceNumbers.format(t.delay()));
        } else if (p instanceof Primitive.LossyLine t) {
            // LTRA rejects R and G both non-zero (ngspice.md §4); the TXL model takes full RLGC.
            boolean both = t.rPerM() > 0 && t.gPerM() > 0;
            String modelName = "m" + t.name();
            put(e, both ? "txl" : "ltra", "a", t.a(), "aRef", t.aRef(), "b", t.b(), "bRef", t.bRef(), "model", modelName);
            Map<String, Object> model = new LinkedHashMap<>();
            put(model, both ? "txl" : "ltra", "name", modelName, "r", SpiceNumbers.format(t.rPerM()),
                    "l", SpiceNumbers.format(t.lPerM()), "g", SpiceNumbers.format(t.gPerM()),
                    "c", SpiceNumbers.format(t.cPerM()), "length", SpiceNumbers.format(t.length()));
            addModel(models, owners, modelName, t, model);
        } else if (p instanceof Primitive.Diode d) {
            DiodeModel dm = d.model();
            put(e, "diode", "a", d.anode(), "b", d.cathode(), "model", dm.name());
            Map<String, Object> model = new LinkedHashMap<>();
            put(model, "diode", "name", dm.name(), "is", SpiceNumbers.format(dm.is()), "n", SpiceNumbers.format(dm.n()),
                    "rs", SpiceNumbers.format(dm.rs()), "cjo", SpiceNumbers.format(dm.cjo()));
            addModel(models, owners, dm.name(), dm, model);
        } else if (p instanceof Primitive.SubcircuitText s) {
            List<String> ports = new ArrayList<>();
            s.nodes().stream().filter(n -> !n.equals(SafeName.GROUND)).distinct().forEach(ports::add);
            if (ports.isEmpty()) {
                throw new DeckWriteException("sub-circuit text " + s.name() + " connects to no node but ground");
            }
            put(e, "subcircuit", "subckt", "s" + s.name(), "ports", String.join(" ", ports));
            e.put("lines", subcircuitLines(s));
        } else {
            throw new DeckWriteException("the deck writer does not know primitive " + p.getClass().getSimpleName());
        }
        return e;
    }

    private static void addModel(Map<String, Map<String, Object>> models, Map<String, Object> owners, String name,
                                 Object owner, Map<String, Object> model) {
        Object before = owners.putIfAbsent(name, owner);
        if (before != null && !before.equals(owner) || before == null && models.containsKey(name)) {
            throw new DeckWriteException("model name " + name + " is used for two different models");
        }
        models.putIfAbsent(name, model);
    }

    private static void put(Map<String, Object> m, String kind, String... pairs) {
        m.put("kind", kind);
        for (int i = 0; i < pairs.length; i += 2) {
            m.put(pairs[i], pairs[i + 1]);
        }
    }

    private static List<Map<String, String>> points(double[] t, double[] v) {
        List<Map<String, String>> pts = new ArrayList<>();
        for (int i = 0; i < t.length; i++) {
            pts.add(Map.of("t", SpiceNumbers.format(t[i]), "v", SpiceNumbers.format(v[i])));
        }
        return pts;
    }

    /** The element lines of a sub-circuit text, checked (see the class comment). */
    static List<String> subcircuitLines(Primitive.SubcircuitText s) {
        List<String> lines = new ArrayList<>();
        String text = s.text();
        if (text.indexOf('\r') >= 0) {
            throw new DeckWriteException("sub-circuit text " + s.name() + " contains a carriage return; expected plain element lines");
        }
        int number = 0;
        for (String raw : text.split("\n", -1)) {
            number++;
            String line = raw.strip();
            if (line.isEmpty()) {
                continue;
            }
            String problem = null;
            if (!ELEMENT_LINE.matcher(line).matches()) {
                problem = "expected an element line: a letter, a name, then printable ASCII";
            } else if (ELEMENT_LETTERS.indexOf(Character.toUpperCase(line.charAt(0))) < 0) {
                problem = "`" + line.charAt(0) + "` is not an element letter";
            } else if (line.indexOf('`') >= 0) {
                problem = "a backquote is not allowed";
            } else {
                for (String token : line.split("[\\s=(),]+")) {
                    if (token.startsWith(".") || CONTROL_WORDS.contains(token.toLowerCase(Locale.ROOT))) {
                        problem = "`" + NodeNamer.safeComment(token) + "` is not allowed in element lines";
                        break;
                    }
                }
            }
            if (problem != null) {
                throw new DeckWriteException("sub-circuit text " + s.name() + ", line " + number + ": " + problem);
            }
            lines.add(line);
        }
        if (lines.isEmpty()) {
            throw new DeckWriteException("sub-circuit text " + s.name() + " has no element lines");
        }
        return lines;
    }
}
