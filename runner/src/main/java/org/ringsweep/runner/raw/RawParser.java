package org.ringsweep.runner.raw;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.DoubleBuffer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/** One pass over one raw file; see {@link RawFileReader} for the accepted format. */
final class RawParser {
    /** Header lines longer than this are not a raw-file header (bytes). */
    private static final int MAX_LINE = 1 << 16;
    /** More variables than this is not an ngspice plot; keeps the record size in an int. */
    private static final int MAX_VARIABLES = 1 << 20;
    /** Java array limit for one column. */
    private static final long MAX_POINTS = Integer.MAX_VALUE - 8;
    /** Bytes mapped at once for files over 2 GiB. */
    private static final long CHUNK_BYTES = 1L << 30;
    /** Doubles copied per bulk get: small enough to stay in the L1/L2 cache while transposed. */
    private static final int BLOCK_DOUBLES = 8192;

    private final Path file;
    private final FileBytes bytes;
    private final long size;
    /** Where the next unread byte is. */
    private long pos;
    /** Line number of the next unread line (1-based), valid while {@link #linesKnown}. */
    private int line = 1;
    /** False once binary data have been passed: line numbers mean nothing after them. */
    private boolean linesKnown = true;

    /** Bytes decoded per mapped piece; smaller in tests to exercise the piecewise path. */
    private final long chunkBytes;

    RawParser(Path file, FileBytes bytes) {
        this(file, bytes, CHUNK_BYTES);
    }

    RawParser(Path file, FileBytes bytes, long chunkBytes) {
        this.file = file;
        this.bytes = bytes;
        this.size = bytes.size();
        this.chunkBytes = chunkBytes;
    }

    /** Header facts of one plot. */
    private record Header(int number, String title, String plotName, String flags, boolean complex,
                          List<String> variables, long points, boolean binary) {
        String label() {
            return "plot " + number + " (`" + plotName + "`)";
        }
    }

    /** One text line without its terminator; {@code number} is 0 when unknown. */
    private record Line(String text, long offset, int number) {
    }

    List<RawPlot> plots() throws IOException {
        if (size == 0) {
            throw new RawFormatException("raw file `" + file + "` is empty (0 bytes): expected an ngspice raw file"
                    + " starting with a `Title:` line (the simulator wrote nothing)");
        }
        List<RawPlot> plots = new ArrayList<>();
        while (pos < size) {
            Header header = header(plots.size() + 1);
            plots.add(header.binary() ? binaryData(header) : asciiData(header));
        }
        return List.copyOf(plots);
    }

    // ---------------------------------------------------------------- header

    private Header header(int number) throws IOException {
        Line first = nextLine();
        if (!hasKey(first.text(), "Title:")) {
            throw error(first, "expected a `Title:` line starting plot " + number + " of an ngspice raw file, found `"
                    + shown(first.text()) + "`");
        }
        String title = valueOf(first.text(), "Title:");
        String plotName = null;
        String flags = null;
        Boolean complex = null;
        long variableCount = -1;
        long points = -1;
        List<String> variables = null;
        while (true) {
            if (pos >= size) {
                throw error(pos, "the header of plot " + number + " ends with the file; expected a `Variables:`"
                        + " section and a `Binary:` or `Values:` line");
            }
            Line l = nextLine();
            String text = l.text();
            if (hasKey(text, "Date:") || hasKey(text, "Dimensions:") || hasKey(text, "Command:")
                    || hasKey(text, "Option:")) {
                continue; // informative only; a Command: line is never executed
            } else if (hasKey(text, "Plotname:")) {
                plotName = once(plotName, l, "Plotname:", valueOf(text, "Plotname:"));
            } else if (hasKey(text, "Flags:")) {
                flags = once(flags, l, "Flags:", valueOf(text, "Flags:"));
                complex = complexFlag(l, flags);
            } else if (hasKey(text, "No. Variables:")) {
                checkOnce(variableCount >= 0, l, "No. Variables:");
                variableCount = count(l, "No. Variables:", 1, MAX_VARIABLES);
            } else if (hasKey(text, "No. Points:")) {
                checkOnce(points >= 0, l, "No. Points:");
                points = count(l, "No. Points:", 0, MAX_POINTS);
            } else if (hasKey(text, "Variables:")) {
                checkOnce(variables != null, l, "Variables:");
                if (!valueOf(text, "Variables:").isEmpty()) {
                    throw error(l, "expected nothing after `Variables:` (one variable per following line), found `"
                            + shown(text) + "`");
                }
                if (variableCount < 0) {
                    throw error(l, "found `Variables:` before the `No. Variables:` line of plot " + number
                            + "; expected `No. Variables: <count>` first");
                }
                variables = variableLines(number, (int) variableCount);
            } else if (isDataLine(text, "Binary:") || isDataLine(text, "Values:")) {
                String section = isDataLine(text, "Binary:") ? "Binary:" : "Values:";
                requirePresent(plotName, l, number, section, "Plotname:");
                requirePresent(flags, l, number, section, "Flags:");
                requirePresent(variableCount < 0 ? null : "", l, number, section, "No. Variables:");
                requirePresent(points < 0 ? null : "", l, number, section, "No. Points:");
                requirePresent(variables, l, number, section, "Variables:");
                return new Header(number, title, plotName, flags, complex, variables, points,
                        section.equals("Binary:"));
            } else if (hasKey(text, "Title:")) {
                throw error(l, "found a second `Title:` line inside the header of plot " + number
                        + "; expected `Variables:` and then `Binary:` or `Values:` first");
            } else {
                throw error(l, "unexpected header line `" + shown(text) + "` in plot " + number + "; expected one of"
                        + " `Plotname:`, `Flags:`, `No. Variables:`, `No. Points:`, `Variables:`, `Binary:`, `Values:`");
            }
        }
    }

    private List<String> variableLines(int number, int count) throws IOException {
        List<String> names = new ArrayList<>(count);
        for (int i = 0; i < count; i++) {
            String expected = "expected variable line " + i + " of " + count + " (`<tab>" + i
                    + "<tab><name><tab><type>`, as `No. Variables: " + count + "` announces)";
            if (pos >= size) {
                throw error(pos, "the file ends inside the `Variables:` section of plot " + number + "; " + expected);
            }
            Line l = nextLine();
            String[] tokens = l.text().strip().split("[ \t]+");
            if (tokens.length < 3 || !tokens[0].equals(Integer.toString(i))) {
                throw error(l, expected + ", found `" + shown(l.text()) + "`");
            }
            names.add(tokens[1]);
        }
        return names;
    }

    private boolean complexFlag(Line l, String flags) {
        Boolean complex = null;
        for (String token : flags.split("[ \t]+")) {
            String t = token.toLowerCase(Locale.ROOT);
            if (t.equals("real") || t.equals("complex")) {
                if (complex != null) {
                    throw error(l, "`Flags:` names both `real` and `complex`; expected one of them");
                }
                complex = t.equals("complex");
            } else if (!t.equals("padded") && !t.equals("unpadded")) {
                throw error(l, "unknown `Flags:` token `" + shown(token) + "`; expected `real` or `complex`,"
                        + " optionally followed by `padded` or `unpadded`");
            }
        }
        if (complex == null) {
            throw error(l, "`Flags: " + shown(flags) + "` names no data kind; expected `real` or `complex`");
        }
        return complex;
    }

    private long count(Line l, String key, long min, long max) {
        String value = valueOf(l.text(), key);
        long n;
        try {
            n = Long.parseLong(value);
        } catch (NumberFormatException e) {
            throw error(l, "expected a whole number after `" + key + "`, found `" + shown(value) + "`");
        }
        if (n < min || n > max) {
            throw error(l, "`" + key + " " + n + "` is out of range; expected " + min + " to " + max);
        }
        return n;
    }

    private String once(String previous, Line l, String key, String value) {
        checkOnce(previous != null, l, key);
        return value;
    }

    private void checkOnce(boolean seen, Line l, String key) {
        if (seen) {
            throw error(l, "found a second `" + key + "` line in one plot header; expected one");
        }
    }

    private void requirePresent(Object value, Line l, int number, String section, String key) {
        if (value == null) {
            throw error(l, "the header of plot " + number + " has no `" + key + "` line before `" + section
                    + "`; expected `" + key + "` as ngspice writes it");
        }
    }

    /** Reads one line at {@link #pos}, which must be before the end. */
    private Line nextLine() throws IOException {
        long start = pos;
        int window = (int) Math.min(size - start, MAX_LINE + 1L);
        ByteBuffer b = bytes.slice(start, window);
        int end = 0;
        while (end < window && b.get(end) != '\n') {
            byte c = b.get(end);
            if ((c >= 0 && c < 0x20 && c != '\t' && c != '\r') || c == 0x7f) {
                throw error(new Line("", start, linesKnown ? line : 0), "found the non-text byte `0x"
                        + String.format("%02x", c & 0xff) + "` at byte offset " + (start + end) + " in a header line;"
                        + " expected ISO-8859-1 text lines up to `Binary:` or `Values:` (is this an ngspice raw file?)");
            }
            end++;
        }
        if (end == window && end > MAX_LINE) {
            throw error(new Line("", start, linesKnown ? line : 0), "found a header line longer than " + MAX_LINE
                    + " bytes; expected short text lines (is this an ngspice raw file?)");
        }
        byte[] text = new byte[end];
        b.get(0, text);
        int length = end;
        if (length > 0 && text[length - 1] == '\r') {
            length--; // \r\n written on or converted for Windows
        }
        pos = start + Math.min(window, end + 1L);
        Line result = new Line(new String(text, 0, length, StandardCharsets.ISO_8859_1), start, linesKnown ? line : 0);
        line++;
        return result;
    }

    private static boolean hasKey(String text, String key) {
        return text.regionMatches(true, 0, key, 0, key.length());
    }

    private static boolean isDataLine(String text, String key) {
        return text.strip().equalsIgnoreCase(key);
    }

    private static String valueOf(String text, String key) {
        return text.substring(key.length()).strip();
    }

    // ---------------------------------------------------------------- binary data

    private RawPlot binaryData(Header h) throws IOException {
        long dataStart = pos;
        long available = size - dataStart;
        int perValue = h.complex() ? 2 : 1;
        int nvars = h.variables().size();
        long recordBytes = (long) nvars * perValue * Double.BYTES;
        long records;
        boolean truncated;
        if (h.points() == 0) {
            // failed or killed run: the count was never rewritten; the rest of the file is this plot
            truncated = true;
            boolean nextPlotFollows = startsWithTitle(dataStart); // a header-only plot, then another
            records = nextPlotFollows ? 0 : available / recordBytes;
            pos = nextPlotFollows ? dataStart : size;
        } else if (available / recordBytes < h.points()) {
            truncated = true; // cut short, usually mid-record by a kill
            records = available / recordBytes;
            pos = size;
        } else {
            truncated = false;
            records = h.points();
            pos = dataStart + records * recordBytes;
            if (pos < size && !startsWithTitle(pos)) {
                throw error(pos, h.label() + " declares `No. Points: " + h.points() + "` (" + h.points() + " records of "
                        + recordBytes + " bytes ending here), but the next " + (size - pos) + " bytes do not start a"
                        + " further plot; expected the end of the file or a `Title:` line");
            }
        }
        if (records > MAX_POINTS) {
            throw error(dataStart, h.label() + " holds " + records + " records; at most " + MAX_POINTS
                    + " can be read");
        }
        linesKnown = false;
        double[][] columns = decode(dataStart, (int) records, nvars, perValue);
        int time = timeIndex(h.variables());
        if (time >= 0) {
            checkTime(h, columns[time], i -> dataStart + i * recordBytes + (long) time * perValue * Double.BYTES);
        }
        return new RawPlot(h.title(), h.plotName(), h.flags(), h.variables(), (int) h.points(),
                Arrays.asList(columns), truncated);
    }

    /** Point-major little-endian records into columns: bulk copies, then a cache-sized transpose. */
    private double[][] decode(long dataStart, int records, int nvars, int perValue) throws IOException {
        double[][] columns = new double[nvars][records];
        int stride = nvars * perValue;
        long recordBytes = (long) stride * Double.BYTES;
        long chunkRecords = Math.max(1, chunkBytes / recordBytes);
        int blockRecords = Math.max(1, BLOCK_DOUBLES / stride);
        double[] block = new double[blockRecords * stride];
        for (long first = 0; first < records; first += chunkRecords) {
            int inChunk = (int) Math.min(chunkRecords, records - first);
            DoubleBuffer data = bytes.slice(dataStart + first * recordBytes, (int) (inChunk * recordBytes))
                    .asDoubleBuffer();
            for (int done = 0; done < inChunk; done += blockRecords) {
                int n = Math.min(blockRecords, inChunk - done);
                data.get(block, 0, n * stride);
                int at = (int) first + done;
                for (int v = 0; v < nvars; v++) {
                    double[] column = columns[v];
                    for (int i = 0, k = v * perValue; i < n; i++, k += stride) {
                        column[at + i] = block[k]; // the real part for complex data
                    }
                }
            }
        }
        return columns;
    }

    private boolean startsWithTitle(long at) throws IOException {
        int n = "Title:".length();
        if (size - at < n) {
            return false;
        }
        byte[] b = new byte[n];
        bytes.slice(at, n).get(b);
        return hasKey(new String(b, StandardCharsets.ISO_8859_1), "Title:");
    }

    // ---------------------------------------------------------------- ASCII data

    private RawPlot asciiData(Header h) throws IOException {
        long dataStart = pos;
        if (size - dataStart > Integer.MAX_VALUE) {
            throw error(dataStart, h.label() + " has an ASCII data section over 2 GiB; expected binary data for"
                    + " runs that large (`set filetype=binary`)");
        }
        AsciiCursor c = new AsciiCursor(bytes.slice(dataStart, (int) (size - dataStart)));
        int nvars = h.variables().size();
        int time = timeIndex(h.variables());
        long declared = h.points();
        int capacity = (int) Math.max(16, Math.min(declared, (size - dataStart) / (2L * (nvars + 1)) + 1));
        double[][] columns = new double[nvars][capacity];
        int n = 0;
        boolean truncated = false;
        points:
        while (declared == 0 || n < declared) {
            if (!c.next()) {
                truncated = true;
                break;
            }
            if (c.tokenIsTitle()) {
                if (declared != 0) {
                    throw error(c, h.label() + " has only " + n + " of the " + declared + " points its `No. Points:`"
                            + " line declares before the next `Title:`; expected all of them (only the last plot"
                            + " of a file may be truncated)");
                }
                c.unread();
                truncated = true;
                break;
            }
            if (!c.terminated()) {
                truncated = true; // cut inside the point index
                break;
            }
            if (!c.token().equals(Integer.toString(n))) {
                throw error(c, h.label() + ": expected point index `" + n + "` at the start of point " + n
                        + ", found `" + shown(c.token()) + "`");
            }
            if (n == columns[0].length) {
                int grown = (int) Math.min(MAX_POINTS, 2L * n);
                if (grown == n) {
                    throw error(c, h.label() + " holds more than " + MAX_POINTS + " points; too many to read");
                }
                for (int v = 0; v < nvars; v++) {
                    columns[v] = Arrays.copyOf(columns[v], grown);
                }
            }
            for (int v = 0; v < nvars; v++) {
                if (!c.next() || !c.terminated()) {
                    truncated = true; // the file ends inside this point: drop it
                    break points;
                }
                double value = asciiValue(h, c, v);
                if (v == time && !(Double.isFinite(value) && (n == 0 || value > columns[v][n - 1]))) {
                    checkTimeValue(h, n, value, n == 0 ? Double.NaN : columns[v][n - 1], c.where());
                }
                columns[v][n] = value;
            }
            n++;
        }
        if (!truncated) {
            if (c.next() && !c.tokenIsTitle()) {
                throw error(c, h.label() + " declares `No. Points: " + declared + "`, but more follows its last point:"
                        + " found `" + shown(c.token()) + "`; expected the end of the file or a `Title:` line");
            }
            c.unread();
        }
        pos = dataStart + c.position();
        line = c.line;
        for (int v = 0; v < nvars; v++) {
            columns[v] = Arrays.copyOf(columns[v], n);
        }
        return new RawPlot(h.title(), h.plotName(), h.flags(), h.variables(), (int) declared,
                Arrays.asList(columns), truncated);
    }

    private double asciiValue(Header h, AsciiCursor c, int variable) {
        String token = c.token();
        int comma = token.indexOf(',');
        String name = h.variables().get(variable);
        if (h.complex()) {
            if (comma < 0) {
                throw error(c, h.label() + ": expected a complex value `re,im` for `" + name + "`, found `"
                        + shown(token) + "`");
            }
            number(h, c, name, token.substring(comma + 1));
            return number(h, c, name, token.substring(0, comma));
        }
        if (comma >= 0) {
            throw error(c, h.label() + ": expected a real value for `" + name + "` (`Flags: " + h.flags()
                    + "`), found `" + shown(token) + "`");
        }
        return number(h, c, name, token);
    }

    /** Parses a C-printf number; rejects what C would not write (hex, Java suffixes). */
    private double number(Header h, AsciiCursor c, String name, String text) {
        String lower = text.toLowerCase(Locale.ROOT);
        String unsigned = lower.startsWith("-") || lower.startsWith("+") ? lower.substring(1) : lower;
        if (unsigned.equals("nan")) {
            return Double.NaN;
        }
        if (unsigned.equals("inf") || unsigned.equals("infinity")) {
            return lower.startsWith("-") ? Double.NEGATIVE_INFINITY : Double.POSITIVE_INFINITY;
        }
        boolean digits = false;
        for (int i = 0; i < text.length(); i++) {
            char ch = text.charAt(i);
            if (ch >= '0' && ch <= '9') {
                digits = true;
            } else if (ch != '.' && ch != '-' && ch != '+' && ch != 'e' && ch != 'E') {
                digits = false;
                break;
            }
        }
        if (digits) {
            try {
                return Double.parseDouble(text);
            } catch (NumberFormatException e) {
                // reported below
            }
        }
        throw error(c, h.label() + ": expected a number for `" + name + "`, found `" + shown(text) + "`");
    }

    // ---------------------------------------------------------------- checks

    private static int timeIndex(List<String> variables) {
        for (int i = 0; i < variables.size(); i++) {
            if (variables.get(i).equalsIgnoreCase("time")) {
                return i;
            }
        }
        return -1;
    }

    private interface Offsets {
        long of(int record);
    }

    private void checkTime(Header h, double[] time, Offsets offsets) {
        for (int i = 0; i < time.length; i++) {
            if (!(Double.isFinite(time[i]) && (i == 0 || time[i] > time[i - 1]))) {
                checkTimeValue(h, i, time[i], i == 0 ? Double.NaN : time[i - 1], "byte offset " + offsets.of(i));
            }
        }
    }

    private void checkTimeValue(Header h, int point, double t, double previous, String where) {
        if (!Double.isFinite(t)) {
            throw new RawFormatException("raw file `" + file + "`, " + where + ": " + h.label() + ", point " + point
                    + ": `time` is `" + t + "`; expected a finite time (s)");
        }
        if (point > 0 && !(t > previous)) {
            throw new RawFormatException("raw file `" + file + "`, " + where + ": " + h.label() + ", point " + point
                    + ": `time` = `" + t + "` is not after the previous `" + previous + "`; expected strictly"
                    + " increasing time (s)");
        }
    }

    // ---------------------------------------------------------------- messages

    private RawFormatException error(Line l, String what) {
        String where = l.number() > 0 ? "line " + l.number() + " (byte offset " + l.offset() + ")"
                : "byte offset " + l.offset();
        return new RawFormatException("raw file `" + file + "`, " + where + ": " + what);
    }

    private RawFormatException error(long offset, String what) {
        return new RawFormatException("raw file `" + file + "`, byte offset " + offset + ": " + what);
    }

    private RawFormatException error(AsciiCursor c, String what) {
        return new RawFormatException("raw file `" + file + "`, " + c.where() + ": " + what);
    }

    /** Text for a message: control characters made visible, long text shortened. */
    private static String shown(String text) {
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < text.length() && b.length() < 80; i++) {
            char ch = text.charAt(i);
            if (ch < 0x20 || ch == 0x7f) {
                b.append(ch == '\t' ? "\\t" : String.format("\\x%02x", (int) ch));
            } else {
                b.append(ch);
            }
        }
        if (b.length() >= 80) {
            b.append("…");
        }
        return b.toString();
    }

    /** Whitespace-separated tokens of an ASCII data section, with line numbers. */
    private final class AsciiCursor {
        private final ByteBuffer b;
        private final int limit;
        private int p;
        private int start;
        private int end;
        private int tokenLine;
        private int line = RawParser.this.line;

        AsciiCursor(ByteBuffer b) {
            this.b = b;
            this.limit = b.limit();
        }

        /** Moves to the next token; false at the end of the data. */
        boolean next() {
            while (p < limit) {
                byte ch = b.get(p);
                if (ch == '\n') {
                    line++;
                } else if (ch != ' ' && ch != '\t' && ch != '\r') {
                    break;
                }
                p++;
            }
            if (p >= limit) {
                start = end = p;
                return false;
            }
            start = p;
            tokenLine = line;
            while (p < limit) {
                byte ch = b.get(p);
                if (ch == ' ' || ch == '\t' || ch == '\r' || ch == '\n') {
                    break;
                }
                p++;
            }
            end = p;
            return true;
        }

        /** Goes back to the start of the current token (so a next plot's header is read from there). */
        void unread() {
            p = start;
            line = tokenLine == 0 ? line : tokenLine;
        }

        /** Whether whitespace follows the token: a token cut by the end of the file is incomplete. */
        boolean terminated() {
            return end < limit;
        }

        String token() {
            byte[] text = new byte[end - start];
            b.get(start, text);
            return new String(text, StandardCharsets.ISO_8859_1);
        }

        boolean tokenIsTitle() {
            int n = "Title:".length();
            if (end - start < n) {
                return false;
            }
            byte[] text = new byte[n];
            b.get(start, text);
            return hasKey(new String(text, StandardCharsets.ISO_8859_1), "Title:");
        }

        int position() {
            return p;
        }

        String where() {
            String offset = "byte offset " + (RawParser.this.pos + start);
            return linesKnown ? "line " + tokenLine + " (" + offset + ")" : offset;
        }
    }
}
