package org.ringsweep.api.quantity;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apiguardian.api.API;

/**
 * Parses user text into SI base values and formats SI values for people. See {@code formats.md},
 * "Quantities".
 *
 * <p>Accepted forms:
 * <ul>
 *   <li>a plain number, read in the SI base unit: {@code 22}, {@code 1e-9}, {@code .5};</li>
 *   <li>a number, an optional space, an SI prefix ({@code f p n u µ m k M G}, {@code meg} in any
 *       case = 10⁶; {@code K} is read as kilo too) and an optional unit of the expected kind:
 *       {@code 2ns}, {@code 2 ns}, {@code 4pF}, {@code 3.3V}, {@code 22ohm}, {@code 22 Ω},
 *       {@code 100MHz}, {@code 2n};</li>
 *   <li>lengths in {@code m} (with prefixes: {@code mm}, {@code um}), {@code in} and {@code mil}
 *       (1 in = 25.4 mm and 1 mil = 25.4 µm, both exact by definition);</li>
 *   <li>ratios for per-length and speed dimensions: {@code ohm/m}, {@code S/m}, {@code m/s},
 *       {@code mm/ns}, {@code in/ns};</li>
 *   <li>for {@link Dimension#RESISTANCE}, the IEC 60062 letter-and-digit code where the letter
 *       replaces the decimal point: {@code 4k7} = 4700, {@code R22} = 0.22, {@code 2M2} = 2.2·10⁶,
 *       {@code 10R} = 10, {@code 1L5} = 1.5·10⁻³ (letters {@code L R K M G T}, {@code k} and
 *       {@code r} in lower case too);</li>
 *   <li>for {@link Dimension#CAPACITANCE}, the same code with {@code p n u µ m F}: {@code 4p7},
 *       {@code 6n8}, {@code µ47};</li>
 *   <li>for {@link Dimension#DIMENSIONLESS}, a plain number or a percentage: {@code 5%} = 0.05.</li>
 * </ul>
 *
 * <p>A lone {@code m} is milli ({@code 1m} as a time is 1 ms), except for lengths, where it is the
 * metre. For resistance, {@code 2m2} is rejected as ambiguous: the letter code uses {@code M} for
 * mega and {@code L} for milli, while a prefix {@code m} is milli (write {@code 2M2},
 * {@code 2.2M} or {@code 2.2m}). Prefix letters are case-sensitive ({@code M} mega, {@code m}
 * milli), as in IBIS and unlike SPICE; only {@code meg}, {@code ohm} and {@code Hz} ignore case.
 *
 * <p>Decimal arithmetic is exact: the text and the unit factor are multiplied as decimals and
 * rounded to a double once, so {@code 500mil} is the double nearest 0.0127 m.
 *
 * <p>Sign and size are not checked here: callers know whether zero or a negative value makes sense.
 */
@API(status = API.Status.EXPERIMENTAL, since = "0.1")
public final class Quantities {
    private static final Pattern NUMBER =
            Pattern.compile("([+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?)\\s*(\\S*)");
    private static final Pattern RKM_RESISTANCE = Pattern.compile("([+-]?)(\\d*)([RrKkMGTL])(\\d*)");
    private static final Pattern RKM_CAPACITANCE = Pattern.compile("([+-]?)(\\d*)([pnuµμmF])(\\d*)");
    private static final Pattern RKM_MILLI_RESISTANCE = Pattern.compile("[+-]?\\d*m\\d+");
    private static final MathContext WORKING = MathContext.DECIMAL128;

    /** What a unit measures; wider than {@link Dimension} so that messages can name a conductance. */
    private enum Kind {
        VOLTAGE("a voltage"), CURRENT("a current"), TIME("a time"), LENGTH("a length"),
        RESISTANCE("a resistance"), CAPACITANCE("a capacitance"), INDUCTANCE("an inductance"),
        FREQUENCY("a frequency"), CONDUCTANCE("a conductance"), VELOCITY("a velocity"),
        RESISTANCE_PER_LENGTH("a resistance per length"), CONDUCTANCE_PER_LENGTH("a conductance per length"),
        PERCENTAGE("a percentage");

        final String phrase;

        Kind(String phrase) {
            this.phrase = phrase;
        }

        static Kind of(Dimension d) {
            return d == Dimension.DIMENSIONLESS ? null : valueOf(d.name());
        }
    }

    private record Unit(Kind kind, BigDecimal factor, boolean prefixable) {
    }

    private record Scaled(Kind kind, BigDecimal factor) {
    }

    private static final Map<String, Unit> UNITS = Map.ofEntries(
            Map.entry("V", new Unit(Kind.VOLTAGE, BigDecimal.ONE, true)),
            Map.entry("A", new Unit(Kind.CURRENT, BigDecimal.ONE, true)),
            Map.entry("s", new Unit(Kind.TIME, BigDecimal.ONE, true)),
            Map.entry("m", new Unit(Kind.LENGTH, BigDecimal.ONE, true)),
            // 1 in = 25.4 mm exactly (international inch, 1959); 1 mil = 1/1000 in.
            Map.entry("in", new Unit(Kind.LENGTH, new BigDecimal("0.0254"), false)),
            Map.entry("mil", new Unit(Kind.LENGTH, new BigDecimal("0.0000254"), false)),
            Map.entry("ohm", new Unit(Kind.RESISTANCE, BigDecimal.ONE, true)),
            Map.entry("ohms", new Unit(Kind.RESISTANCE, BigDecimal.ONE, true)),
            Map.entry("\u03a9", new Unit(Kind.RESISTANCE, BigDecimal.ONE, true)),
            Map.entry("\u2126", new Unit(Kind.RESISTANCE, BigDecimal.ONE, true)),
            Map.entry("F", new Unit(Kind.CAPACITANCE, BigDecimal.ONE, true)),
            Map.entry("H", new Unit(Kind.INDUCTANCE, BigDecimal.ONE, true)),
            Map.entry("hz", new Unit(Kind.FREQUENCY, BigDecimal.ONE, true)),
            Map.entry("S", new Unit(Kind.CONDUCTANCE, BigDecimal.ONE, true)));

    private static final Map<Character, BigDecimal> PREFIXES = Map.of(
            'f', new BigDecimal("1e-15"), 'p', new BigDecimal("1e-12"), 'n', new BigDecimal("1e-9"),
            'u', new BigDecimal("1e-6"), 'µ', new BigDecimal("1e-6"), 'μ', new BigDecimal("1e-6"),
            'm', new BigDecimal("1e-3"), 'k', new BigDecimal("1e3"), 'K', new BigDecimal("1e3"),
            'M', new BigDecimal("1e6"));
    private static final BigDecimal GIGA = new BigDecimal("1e9");
    private static final BigDecimal MEGA = new BigDecimal("1e6");

    private Quantities() {
    }

    /**
     * Parses {@code text} as a quantity of the given dimension.
     *
     * @param text     user text such as {@code "2ns"}, {@code "4k7"}, {@code "1.2in"} or {@code "22"};
     *                 null is treated as empty
     * @param expected the dimension the key requires
     * @return the value in SI base units (finite; any sign)
     * @throws QuantityFormatException if the text is not a finite number of that dimension; the
     *                                 message quotes the text and says what was expected, e.g.
     *                                 "expected a time such as `1.5ns` or `2e-9`, found `3pF` (a capacitance)"
     */
    public static double parse(String text, Dimension expected) {
        String t = text == null ? "" : text.strip();
        if (t.isEmpty()) {
            throw new QuantityFormatException("expected " + describe(expected) + ", found nothing");
        }
        if (isNonFinite(t)) {
            throw failure(expected, t, "not a finite number");
        }
        Optional<BigDecimal> code = letterAndDigitCode(t, expected);
        if (code.isPresent()) {
            return finite(code.get(), expected, t);
        }
        Matcher m = NUMBER.matcher(t);
        if (!m.matches()) {
            throw failure(expected, t, null);
        }
        BigDecimal number = new BigDecimal(m.group(1));
        String suffix = m.group(2);
        return finite(number.multiply(factorFor(suffix, expected, t), WORKING), expected, t);
    }

    /**
     * Examples of valid text for a dimension, for messages: {@code `1.5ns` or `2e-9`}.
     *
     * @param d the dimension
     * @return backtick-quoted examples joined in English
     */
    public static String examples(Dimension d) {
        return switch (d) {
            case VOLTAGE -> "`3.3V` or `3.3`";
            case CURRENT -> "`10mA` or `0.01`";
            case TIME -> "`1.5ns` or `2e-9`";
            case LENGTH -> "`45mm`, `500mil` or `0.045`";
            case RESISTANCE -> "`22`, `4k7` or `22ohm`";
            case CAPACITANCE -> "`4pF`, `4p7` or `4e-12`";
            case INDUCTANCE -> "`2nH` or `2e-9`";
            case FREQUENCY -> "`100MHz` or `1e8`";
            case VELOCITY -> "`1.5e8`, `1.5e8m/s` or `150mm/ns`";
            case RESISTANCE_PER_LENGTH -> "`5ohm/m` or `5`";
            case CONDUCTANCE_PER_LENGTH -> "`1e-3S/m` or `1e-3`";
            case DIMENSIONLESS -> "`3.4` or `5%`";
        };
    }

    /**
     * What a value of a dimension looks like, for messages: "a time such as `1.5ns` or `2e-9`".
     *
     * @param d the dimension
     * @return an English phrase with an article and examples
     */
    public static String describe(Dimension d) {
        Kind k = Kind.of(d);
        return (k == null ? "a number" : k.phrase) + " such as " + examples(d);
    }

    /**
     * A short human form of an SI value with an engineering prefix and the unit symbol, for
     * messages and tables: 1.5e-9 as a time is {@code "1.5 ns"}, 4700 ohm is {@code "4.7 kohm"},
     * 0.0127 m is {@code "12.7 mm"}. Four significant digits; micro is written {@code u} and ohm
     * {@code ohm} so that the text stays ASCII. The result parses back with {@link #parse} to the
     * value rounded to four significant digits. Per-length and speed values use a power of ten
     * instead of a prefix ({@code "150e6 m/s"}); dimensionless values carry no unit.
     *
     * @param si the value in SI base units
     * @param d  its dimension
     * @return the text; non-finite values as {@link Double#toString(double)}
     */
    public static String format(double si, Dimension d) {
        if (!Double.isFinite(si)) {
            return Double.toString(si);
        }
        String unit = d == Dimension.RESISTANCE ? "ohm" : d.unitSymbol();
        if (si == 0) {
            return unit.isEmpty() ? "0" : "0 " + unit;
        }
        BigDecimal r = new BigDecimal(si).round(new MathContext(4));
        int exp10 = r.precision() - r.scale() - 1;
        if (d == Dimension.DIMENSIONLESS) {
            return exp10 >= -3 && exp10 < 6 ? plain(r) : plain(r.movePointLeft(exp10)) + "e" + exp10;
        }
        int eng = Math.floorDiv(exp10, 3) * 3;
        String mantissa = plain(r.movePointLeft(eng));
        boolean compound = unit.contains("/");
        if (!compound && eng >= -15 && eng <= 9) {
            return mantissa + " " + prefixFor(eng) + unit;
        }
        return mantissa + (eng == 0 ? "" : "e" + eng) + " " + unit;
    }

    private static String plain(BigDecimal b) {
        return b.stripTrailingZeros().toPlainString();
    }

    private static String prefixFor(int eng) {
        return switch (eng) {
            case -15 -> "f";
            case -12 -> "p";
            case -9 -> "n";
            case -6 -> "u";
            case -3 -> "m";
            case 3 -> "k";
            case 6 -> "M";
            case 9 -> "G";
            default -> "";
        };
    }

    private static boolean isNonFinite(String t) {
        String s = t.toLowerCase(Locale.ROOT);
        if (s.startsWith("+") || s.startsWith("-")) {
            s = s.substring(1);
        }
        return s.equals("nan") || s.equals(".nan") || s.equals("inf") || s.equals(".inf") || s.equals("infinity");
    }

    /** The IEC 60062 code value, when the text is one for this dimension. */
    private static Optional<BigDecimal> letterAndDigitCode(String t, Dimension expected) {
        Pattern p;
        if (expected == Dimension.RESISTANCE) {
            if (RKM_MILLI_RESISTANCE.matcher(t).matches()) {
                throw new QuantityFormatException("expected " + describe(expected) + ", found `" + t
                        + "` (ambiguous: in the letter-and-digit code write `" + t.replace('m', 'M')
                        + "` for mega or `" + t.replace('m', 'L') + "` for milli; or use a decimal point)");
            }
            p = RKM_RESISTANCE;
        } else if (expected == Dimension.CAPACITANCE) {
            p = RKM_CAPACITANCE;
        } else {
            return Optional.empty();
        }
        Matcher m = p.matcher(t);
        if (!m.matches() || (m.group(2).isEmpty() && m.group(4).isEmpty())) {
            return Optional.empty();
        }
        String digits = (m.group(2).isEmpty() ? "0" : m.group(2)) + (m.group(4).isEmpty() ? "" : "." + m.group(4));
        BigDecimal value = new BigDecimal(m.group(1) + digits);
        return Optional.of(value.multiply(codeMultiplier(m.group(3).charAt(0))));
    }

    private static BigDecimal codeMultiplier(char letter) {
        return switch (letter) {
            case 'L' -> new BigDecimal("1e-3");
            case 'R', 'r', 'F' -> BigDecimal.ONE;
            case 'K', 'k' -> new BigDecimal("1e3");
            case 'M' -> MEGA;
            case 'G' -> GIGA;
            case 'T' -> new BigDecimal("1e12");
            default -> PREFIXES.get(letter);
        };
    }

    /** The factor that turns the number before {@code suffix} into SI base units. */
    private static BigDecimal factorFor(String suffix, Dimension expected, String t) {
        if (suffix.isEmpty()) {
            return BigDecimal.ONE;
        }
        Kind want = Kind.of(expected);
        if (suffix.equals("%")) {
            if (want == null) {
                return new BigDecimal("0.01");
            }
            throw failure(expected, t, Kind.PERCENTAGE.phrase);
        }
        Optional<Scaled> unit = scaledUnit(suffix);
        if (unit.isPresent() && unit.get().kind() == want) {
            return unit.get().factor();
        }
        Optional<BigDecimal> lonePrefix = prefix(suffix);
        if (want != null && lonePrefix.isPresent()) {
            return lonePrefix.get();
        }
        if (unit.isPresent()) {
            throw failure(expected, t, unit.get().kind().phrase);
        }
        if (lonePrefix.isPresent()) {
            throw failure(expected, t, "a pure number takes no SI prefix");
        }
        throw failure(expected, t, "unknown unit `" + suffix + "`");
    }

    /** A unit with optional prefix, or a ratio of two such units. */
    private static Optional<Scaled> scaledUnit(String s) {
        int slash = s.indexOf('/');
        if (slash < 0) {
            return simpleUnit(s);
        }
        Optional<Scaled> top = simpleUnit(s.substring(0, slash));
        Optional<Scaled> bottom = simpleUnit(s.substring(slash + 1));
        if (top.isEmpty() || bottom.isEmpty()) {
            return Optional.empty();
        }
        Kind ratio = ratioKind(top.get().kind(), bottom.get().kind());
        if (ratio == null) {
            return Optional.empty();
        }
        return Optional.of(new Scaled(ratio, top.get().factor().divide(bottom.get().factor(), WORKING)));
    }

    private static Kind ratioKind(Kind top, Kind bottom) {
        if (top == Kind.LENGTH && bottom == Kind.TIME) {
            return Kind.VELOCITY;
        } else if (top == Kind.RESISTANCE && bottom == Kind.LENGTH) {
            return Kind.RESISTANCE_PER_LENGTH;
        } else if (top == Kind.CONDUCTANCE && bottom == Kind.LENGTH) {
            return Kind.CONDUCTANCE_PER_LENGTH;
        }
        return null;
    }

    private static Optional<Scaled> simpleUnit(String s) {
        Unit exact = unit(s);
        if (exact != null) {
            return Optional.of(new Scaled(exact.kind(), exact.factor()));
        }
        if (s.length() > 3 && s.substring(0, 3).equalsIgnoreCase("meg")) {
            Unit u = unit(s.substring(3));
            if (u != null && u.prefixable()) {
                return Optional.of(new Scaled(u.kind(), MEGA.multiply(u.factor())));
            }
        }
        if (s.length() > 1) {
            BigDecimal p = s.charAt(0) == 'G' ? GIGA : PREFIXES.get(s.charAt(0));
            Unit u = unit(s.substring(1));
            if (p != null && u != null && u.prefixable()) {
                return Optional.of(new Scaled(u.kind(), p.multiply(u.factor())));
            }
        }
        return Optional.empty();
    }

    private static Unit unit(String s) {
        Unit u = UNITS.get(s);
        if (u != null) {
            return u;
        }
        String lower = s.toLowerCase(Locale.ROOT);
        // ohm and Hz are accepted in any case; the other symbols are single letters whose case matters.
        return lower.equals("ohm") || lower.equals("ohms") || lower.equals("hz") ? UNITS.get(lower) : null;
    }

    private static Optional<BigDecimal> prefix(String s) {
        if (s.equalsIgnoreCase("meg")) {
            return Optional.of(MEGA);
        }
        if (s.length() == 1) {
            return Optional.ofNullable(s.charAt(0) == 'G' ? GIGA : PREFIXES.get(s.charAt(0)));
        }
        return Optional.empty();
    }

    private static double finite(BigDecimal value, Dimension expected, String t) {
        double d = value.doubleValue();
        if (!Double.isFinite(d)) {
            throw failure(expected, t, "too large for a number");
        }
        return d;
    }

    private static QuantityFormatException failure(Dimension expected, String t, String why) {
        return new QuantityFormatException("expected " + describe(expected) + ", found `" + t + "`"
                + (why == null ? "" : " (" + why + ")"));
    }
}
