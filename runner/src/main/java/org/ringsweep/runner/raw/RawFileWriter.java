package org.ringsweep.runner.raw;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.List;
import java.util.Locale;

/**
 * Writes plots as ngspice's {@code write} command does ({@code shared/reference/ngspice.md} §9,
 * §10): a text header, then point-major little-endian float64 records ({@link Encoding#BINARY})
 * or {@code %.15e} text ({@link Encoding#ASCII}), with the exact point count. Several plots
 * follow one another in one file, as with {@code set appendwrite}.
 *
 * <p>Each plot's {@code No. Points:} is the number of records it holds ({@link RawPlot#points()}),
 * whatever it declared when read. {@code Flags:} is written as {@code real} or {@code complex};
 * complex plots get an imaginary part of 0, since a {@link RawPlot} keeps real parts only.
 * Variable types are inferred from the names: {@code time}, {@code frequency}, {@code i(…)} is
 * {@code current}, anything else {@code voltage}.
 */
public final class RawFileWriter {
    /** Records are buffered up to about this many bytes before each write. */
    private static final int BUFFER_BYTES = 1 << 20;
    /** ngspice's {@code Date:} layout (ctime-like, two spaces before the year). */
    private static final DateTimeFormatter DATE =
            DateTimeFormatter.ofPattern("EEE MMM ppd HH:mm:ss  yyyy", Locale.ENGLISH).withZone(ZoneOffset.UTC);
    /** {@code %.15e} keeps 16 significant digits. */
    private static final MathContext SIXTEEN_DIGITS = new MathContext(16, RoundingMode.HALF_EVEN);

    /** The data layout after the header. */
    public enum Encoding {
        /** {@code Binary:} little-endian float64 records (ngspice {@code set filetype=binary}). */
        BINARY,
        /** {@code Values:} text, {@code %.15e} (ngspice {@code set filetype=ascii}). */
        ASCII
    }

    private RawFileWriter() {
    }

    /**
     * Writes the plots to a new or truncated file, dated now (UTC).
     *
     * @param file     the raw file to write
     * @param encoding binary or ASCII data
     * @param plots    at least one plot
     * @throws IllegalArgumentException when a plot cannot be represented: no plots, no variables,
     *                                  columns of unequal length or not one per variable, a name
     *                                  with whitespace, a title with a line break, unknown flags
     * @throws UncheckedIOException     when the file cannot be written
     */
    public static void write(Path file, Encoding encoding, List<RawPlot> plots) {
        write(file, encoding, plots, Instant.now());
    }

    /**
     * Writes the plots to a new or truncated file with the given {@code Date:} (shown in UTC), so
     * the output is reproducible.
     *
     * @see #write(Path, Encoding, List)
     */
    public static void write(Path file, Encoding encoding, List<RawPlot> plots, Instant date) {
        if (plots.isEmpty()) {
            throw new IllegalArgumentException("no plots to write to `" + file + "`; expected at least one");
        }
        plots.forEach(RawFileWriter::check);
        try (FileChannel out = FileChannel.open(file, StandardOpenOption.CREATE, StandardOpenOption.WRITE,
                StandardOpenOption.TRUNCATE_EXISTING)) {
            for (RawPlot plot : plots) {
                String header = header(plot, date, encoding);
                if (encoding == Encoding.BINARY) {
                    writeBinary(out, header, plot);
                } else {
                    writeAscii(out, header, plot);
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write raw file `" + file + "`: " + e.getMessage(), e);
        }
    }

    private static void check(RawPlot plot) {
        String what = "plot `" + plot.plotName() + "`";
        if (plot.variables().isEmpty() || plot.variables().size() != plot.columns().size()) {
            throw new IllegalArgumentException(what + " has " + plot.variables().size() + " variables and "
                    + plot.columns().size() + " columns; expected one column per variable, at least one");
        }
        for (double[] column : plot.columns()) {
            if (column.length != plot.points()) {
                throw new IllegalArgumentException(what + " has columns of " + plot.points() + " and "
                        + column.length + " points; expected equal lengths");
            }
        }
        for (String name : plot.variables()) {
            if (name.isEmpty() || !name.chars().allMatch(c -> c > 0x20 && c < 0x7f || c > 0xa0 && c <= 0xff)) {
                throw new IllegalArgumentException(what + " has the variable name `" + name + "`; expected"
                        + " non-empty ISO-8859-1 text without whitespace");
            }
        }
        for (String text : List.of(plot.title(), plot.plotName())) {
            if (!text.chars().allMatch(c -> c == '\t' || c >= 0x20 && c != 0x7f && c <= 0xff)) {
                throw new IllegalArgumentException(what + " has the header text `" + text + "`; expected one line"
                        + " of ISO-8859-1 text");
            }
        }
        boolean kind = false;
        for (String token : plot.flags().strip().split("[ \t]+")) {
            String t = token.toLowerCase(Locale.ROOT);
            kind |= t.equals("real") || t.equals("complex");
            if (!List.of("real", "complex", "padded", "unpadded").contains(t)) {
                throw new IllegalArgumentException(what + " has the flags `" + plot.flags() + "`; expected `real`"
                        + " or `complex`");
            }
        }
        if (!kind) {
            throw new IllegalArgumentException(what + " has the flags `" + plot.flags() + "`; expected `real` or"
                    + " `complex`");
        }
    }

    private static String header(RawPlot plot, Instant date, Encoding encoding) {
        StringBuilder b = new StringBuilder(256);
        b.append("Title: ").append(plot.title()).append('\n');
        b.append("Date: ").append(DATE.format(date)).append('\n');
        b.append("Plotname: ").append(plot.plotName()).append('\n');
        b.append("Flags: ").append(plot.isComplex() ? "complex" : "real").append('\n');
        b.append("No. Variables: ").append(plot.variables().size()).append('\n');
        b.append("No. Points: ").append(plot.points()).append('\n');
        b.append("Variables:\n");
        for (int i = 0; i < plot.variables().size(); i++) {
            String name = plot.variables().get(i);
            b.append('\t').append(i).append('\t').append(name).append('\t').append(type(name)).append('\n');
        }
        b.append(encoding == Encoding.BINARY ? "Binary:\n" : "Values:\n");
        return b.toString();
    }

    private static String type(String name) {
        String n = name.toLowerCase(Locale.ROOT);
        if (n.equals("time") || n.equals("frequency")) {
            return n;
        }
        return n.startsWith("i(") ? "current" : "voltage";
    }

    private static void writeBinary(FileChannel out, String header, RawPlot plot) throws IOException {
        writeFully(out, ByteBuffer.wrap(header.getBytes(StandardCharsets.ISO_8859_1)));
        double[][] columns = plot.columns().toArray(new double[0][]);
        boolean complex = plot.isComplex();
        int recordBytes = columns.length * (complex ? 2 : 1) * Double.BYTES;
        ByteBuffer buffer = ByteBuffer.allocateDirect(Math.max(BUFFER_BYTES, recordBytes))
                .order(ByteOrder.LITTLE_ENDIAN);
        int points = plot.points();
        for (int r = 0; r < points; r++) {
            if (buffer.remaining() < recordBytes) {
                writeFully(out, buffer.flip());
                buffer.clear();
            }
            for (double[] column : columns) {
                buffer.putDouble(column[r]);
                if (complex) {
                    buffer.putDouble(0.0);
                }
            }
        }
        writeFully(out, buffer.flip());
    }

    private static void writeAscii(FileChannel out, String header, RawPlot plot) throws IOException {
        StringBuilder b = new StringBuilder(header);
        boolean complex = plot.isComplex();
        for (int r = 0; r < plot.points(); r++) {
            b.append(' ').append(r);
            for (double[] column : plot.columns()) {
                b.append('\t');
                appendE15(b, column[r]);
                b.append(complex ? ",0.0\n" : "\n");
            }
            b.append('\n');
            if (b.length() > BUFFER_BYTES) {
                writeFully(out, ByteBuffer.wrap(b.toString().getBytes(StandardCharsets.ISO_8859_1)));
                b.setLength(0);
            }
        }
        writeFully(out, ByteBuffer.wrap(b.toString().getBytes(StandardCharsets.ISO_8859_1)));
    }

    /** C's {@code %.15e}: exactly rounded (half-even on the exact binary value, as glibc does). */
    static void appendE15(StringBuilder b, double value) {
        if (Double.isNaN(value)) {
            b.append("nan");
            return;
        }
        if (Double.isInfinite(value)) {
            b.append(value > 0 ? "inf" : "-inf");
            return;
        }
        if (value < 0 || value == 0 && 1 / value < 0) {
            b.append('-');
        }
        if (value == 0) {
            b.append("0.000000000000000e+00");
            return;
        }
        BigDecimal rounded = new BigDecimal(Math.abs(value)).round(SIXTEEN_DIGITS);
        String digits = rounded.unscaledValue().toString();
        int exponent = digits.length() - 1 - rounded.scale();
        b.append(digits.charAt(0)).append('.');
        b.append(digits, 1, Math.min(16, digits.length()));
        for (int i = digits.length(); i < 16; i++) {
            b.append('0');
        }
        b.append('e').append(exponent < 0 ? '-' : '+');
        int e = Math.abs(exponent);
        if (e < 10) {
            b.append('0');
        }
        b.append(e);
    }

    private static void writeFully(FileChannel out, ByteBuffer data) throws IOException {
        while (data.hasRemaining()) {
            out.write(data);
        }
    }
}
