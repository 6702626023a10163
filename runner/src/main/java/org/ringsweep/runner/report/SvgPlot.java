package org.ringsweep.runner.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * A small SVG line-plot writer for the report: one plot area with linear axes, ticks and grid,
 * polylines, scatter markers, horizontal and vertical reference lines and horizontal bands.
 *
 * <p>Made to read in print and without colour: every trace and reference line has its own dash
 * pattern ({@link Line}) and a text label (traces in the legend under the plot, reference lines
 * at the right end of the line), bands are hatched or lightly filled with a labelled edge, and
 * the only colours are greys plus one accent that is never the sole way to tell things apart.
 *
 * <p>Axes: the range covers every item added (or the one given with {@link #range}) and is
 * widened to "nice" tick values (steps of 1, 2 or 5 × 10ⁿ; P. S. Heckbert, "Nice numbers for graph
 * labels", Graphics Gems, 1990). The plot area is a {@code <rect class="plot-area">} carrying the
 * axis ranges as {@code data-x-min}, {@code data-x-max}, {@code data-y-min} and {@code data-y-max}
 * (in axis units), so a reader (or a test) can map coordinates back to values:
 * {@code x = xMin + (px − rect.x) / rect.width · (xMax − xMin)}, and y likewise from the bottom.
 * Coordinates are written with two decimals (1/100 of a user unit). A builder: not thread-safe.
 */
final class SvgPlot {
    /** Dash patterns; each plot uses each at most once for traces, so they tell traces apart without colour. */
    enum Line {
        /** Solid, thick: the receiver. */
        SOLID("", 1.8),
        /** Long dashes: the driver pin. */
        DASHED("7 4", 1.4),
        /** Dots: limits. */
        DOTTED("1.5 2.5", 1.4),
        /** Dash-dot: the settle band edges and secondary traces. */
        DASH_DOT("8 3 2 3", 1.0),
        /** Thin solid: rails and grid-like references. */
        THIN("", 0.8);

        final String dash;
        final double width;

        Line(String dash, double width) {
            this.dash = dash;
            this.width = width;
        }
    }

    /** Scatter marker shapes. */
    enum Marker {
        /** Open circle. */
        CIRCLE,
        /** Diagonal cross. */
        CROSS
    }

    private record Trace(String label, double[] x, double[] y, Line line, String role) {
    }

    private record Scatter(String label, double[] x, double[] y, Marker marker) {
    }

    private record Ref(double at, String label, Line line, boolean horizontal) {
    }

    private record Band(double y0, double y1, String label, boolean hatched) {
    }

    private record Mark(double x, double y, String label) {
    }

    private static final int LEFT = 62;
    private static final int RIGHT = 120;
    private static final int TOP = 28;
    private static final int BOTTOM = 44;
    private static final int LEGEND_ROW = 16;

    private final String title;
    private final String xLabel;
    private final String yLabel;
    private final int width;
    private final int height;
    private final List<Trace> traces = new ArrayList<>();
    private final List<Scatter> scatters = new ArrayList<>();
    private final List<Ref> refs = new ArrayList<>();
    private final List<Band> bands = new ArrayList<>();
    private final List<Mark> marks = new ArrayList<>();
    private final Map<String, String> attributes = new LinkedHashMap<>();
    private double[] range;
    private String id = "p";

    /**
     * @param title  the title above the plot
     * @param xLabel the x axis label with its unit, e.g. {@code time (ns)}
     * @param yLabel the y axis label with its unit, e.g. {@code voltage (V)}
     * @param width  the width in user units (pixels at 100 %)
     * @param height the height of the plot area plus axes, without the legend
     */
    SvgPlot(String title, String xLabel, String yLabel, int width, int height) {
        this.title = title;
        this.xLabel = xLabel;
        this.yLabel = yLabel;
        this.width = width;
        this.height = height;
    }

    /** Fixes the data range (before widening to nice ticks) instead of taking it from the items. */
    SvgPlot range(double xMin, double xMax, double yMin, double yMax) {
        range = new double[] {xMin, xMax, yMin, yMax};
        return this;
    }

    /** A polyline through (x, y) in order; {@code role} goes into {@code data-trace}. */
    SvgPlot trace(String label, double[] x, double[] y, Line line, String role) {
        traces.add(new Trace(label, x.clone(), y.clone(), line, role));
        return this;
    }

    /** Unconnected markers. */
    SvgPlot points(String label, double[] x, double[] y, Marker marker) {
        scatters.add(new Scatter(label, x.clone(), y.clone(), marker));
        return this;
    }

    /** A horizontal reference line at {@code y}, labelled at its right end. */
    SvgPlot hline(double y, String label, Line line) {
        refs.add(new Ref(y, label, line, true));
        return this;
    }

    /** A vertical reference line at {@code x}, labelled at its top. */
    SvgPlot vline(double x, String label, Line line) {
        refs.add(new Ref(x, label, line, false));
        return this;
    }

    /** A horizontal band between two values: hatched (diagonal lines) or a light fill, with dashed edges. */
    SvgPlot band(double y0, double y1, String label, boolean hatched) {
        bands.add(new Band(Math.min(y0, y1), Math.max(y0, y1), label, hatched));
        return this;
    }

    /** A highlighted point: a large ring with a label (e.g. the recommended value). */
    SvgPlot mark(double x, double y, String label) {
        marks.add(new Mark(x, y, label));
        return this;
    }

    /** The prefix of the ids this plot defines (clip path, hatch pattern); unique within the page. */
    SvgPlot id(String prefix) {
        id = prefix;
        return this;
    }

    /** An attribute on the {@code <svg>} element (name without {@code data-}). */
    SvgPlot data(String name, String value) {
        attributes.put("data-" + name, value);
        return this;
    }

    /** The SVG element. */
    String svg() {
        double[] r = range != null ? range.clone() : extent();
        double[] xs = niceAxis(r[0], r[1]);
        double[] ys = niceAxis(r[2], r[3]);
        double x0 = xs[0];
        double x1 = xs[1];
        double y0 = ys[0];
        double y1 = ys[1];
        int aw = width - LEFT - RIGHT;
        int ah = height - TOP - BOTTOM;
        List<String> legend = new ArrayList<>();
        traces.forEach(t -> legend.add(t.label()));
        scatters.forEach(s -> legend.add(s.label()));
        int total = height + LEGEND_ROW * ((legend.size() + 1) / 2) + 6;
        Scale sx = new Scale(x0, x1, LEFT, LEFT + aw);
        Scale sy = new Scale(y0, y1, TOP + ah, TOP);
        StringBuilder b = new StringBuilder();
        b.append("<svg xmlns=\"http://www.w3.org/2000/svg\" class=\"plot\" viewBox=\"0 0 ").append(width).append(' ').append(total)
                .append("\" width=\"").append(width).append("\" height=\"").append(total).append("\" role=\"img\"");
        attributes.forEach((k, v) -> b.append(' ').append(k).append("=\"").append(Xml.escape(v)).append('"'));
        b.append(">\n<title>").append(Xml.escape(title)).append("</title>\n");
        String clip = id + "-clip";
        b.append("<defs><clipPath id=\"").append(clip).append("\"><rect x=\"").append(LEFT).append("\" y=\"").append(TOP)
                .append("\" width=\"").append(aw).append("\" height=\"").append(ah).append("\"/></clipPath>")
                .append("<pattern id=\"").append(id).append("-hatch").append("\" width=\"6\" height=\"6\" patternUnits=\"userSpaceOnUse\" ")
                .append("patternTransform=\"rotate(45)\"><line x1=\"0\" y1=\"0\" x2=\"0\" y2=\"6\" stroke=\"#999\" stroke-width=\"1\"/></pattern></defs>\n");
        b.append("<text x=\"").append(LEFT).append("\" y=\"16\" class=\"title\">").append(Xml.escape(title)).append("</text>\n");
        b.append("<rect class=\"plot-area\" x=\"").append(LEFT).append("\" y=\"").append(TOP).append("\" width=\"").append(aw)
                .append("\" height=\"").append(ah).append("\" data-x-min=\"").append(num(x0)).append("\" data-x-max=\"").append(num(x1))
                .append("\" data-y-min=\"").append(num(y0)).append("\" data-y-max=\"").append(num(y1))
                .append("\" fill=\"#fff\" stroke=\"#000\" stroke-width=\"1\"/>\n");
        axes(b, xs, ys, sx, sy, aw, ah);
        b.append("<g clip-path=\"url(#").append(clip).append(")\">\n");
        for (Band band : bands) {
            double top = sy.at(band.y1());
            double bottom = sy.at(band.y0());
            b.append("<rect class=\"band\" x=\"").append(LEFT).append("\" y=\"").append(c(top)).append("\" width=\"").append(aw)
                    .append("\" height=\"").append(c(Math.max(0.5, bottom - top))).append("\" fill=\"")
                    .append(band.hatched() ? "url(#" + id + "-hatch)" : "#e8e8e8").append("\" fill-opacity=\"")
                    .append(band.hatched() ? "1" : "0.7").append("\"/>\n");
            for (double y : new double[] {top, bottom}) {
                b.append("<line x1=\"").append(LEFT).append("\" x2=\"").append(LEFT + aw).append("\" y1=\"").append(c(y)).append("\" y2=\"")
                        .append(c(y)).append("\" stroke=\"#777\" stroke-width=\"0.7\" stroke-dasharray=\"8 3 2 3\"/>\n");
            }
        }
        for (Ref ref : refs) {
            if (ref.horizontal()) {
                double y = sy.at(ref.at());
                b.append("<line class=\"ref\" x1=\"").append(LEFT).append("\" x2=\"").append(LEFT + aw).append("\" y1=\"").append(c(y))
                        .append("\" y2=\"").append(c(y)).append('"').append(stroke(ref.line(), "#555")).append("/>\n");
            } else {
                double x = sx.at(ref.at());
                b.append("<line class=\"ref\" x1=\"").append(c(x)).append("\" x2=\"").append(c(x)).append("\" y1=\"").append(TOP)
                        .append("\" y2=\"").append(TOP + ah).append('"').append(stroke(ref.line(), "#555")).append("/>\n");
            }
        }
        for (Trace t : traces) {
            b.append("<polyline class=\"trace\" data-trace=\"").append(Xml.escape(t.role())).append("\" fill=\"none\"")
                    .append(stroke(t.line(), t.line() == Line.SOLID ? "#000" : "#1f4e9a")).append(" points=\"");
            for (int i = 0; i < t.x().length; i++) {
                if (i > 0) {
                    b.append(' ');
                }
                b.append(c(sx.at(t.x()[i]))).append(',').append(c(sy.at(t.y()[i])));
            }
            b.append("\"/>\n");
        }
        for (Scatter s : scatters) {
            for (int i = 0; i < s.x().length; i++) {
                if (!Double.isFinite(s.y()[i])) {
                    continue;
                }
                double px = sx.at(s.x()[i]);
                double py = sy.at(s.y()[i]);
                if (s.marker() == Marker.CIRCLE) {
                    b.append("<circle class=\"point\" cx=\"").append(c(px)).append("\" cy=\"").append(c(py))
                            .append("\" r=\"3.5\" fill=\"#fff\" stroke=\"#000\" stroke-width=\"1.2\"/>\n");
                } else {
                    b.append("<path class=\"point\" d=\"M").append(c(px - 3.5)).append(',').append(c(py - 3.5)).append("L").append(c(px + 3.5))
                            .append(',').append(c(py + 3.5)).append("M").append(c(px - 3.5)).append(',').append(c(py + 3.5)).append("L")
                            .append(c(px + 3.5)).append(',').append(c(py - 3.5)).append("\" stroke=\"#b00\" stroke-width=\"1.6\"/>\n");
                }
            }
        }
        b.append("</g>\n");
        for (Mark m : marks) {
            double px = sx.at(m.x());
            double py = sy.at(m.y());
            b.append("<circle class=\"mark\" cx=\"").append(c(px)).append("\" cy=\"").append(c(py))
                    .append("\" r=\"8\" fill=\"none\" stroke=\"#000\" stroke-width=\"2\"/>\n");
            double ly = py - 10 < TOP + 10 ? py + 18 : py - 10; // below the ring when it sits at the top
            b.append("<text class=\"mark-label\" x=\"").append(c(px + 10)).append("\" y=\"").append(c(ly)).append("\">")
                    .append(Xml.escape(m.label())).append("</text>\n");
        }
        refLabels(b, sx, sy, aw);
        int row = 0;
        int legendTop = height + 2;
        for (int i = 0; i < legend.size(); i++) {
            int col = i % 2;
            row = i / 2;
            int lx = LEFT + col * (aw / 2);
            int ly = legendTop + row * LEGEND_ROW;
            if (i < traces.size()) {
                Line line = traces.get(i).line();
                b.append("<line x1=\"").append(lx).append("\" x2=\"").append(lx + 30).append("\" y1=\"").append(ly).append("\" y2=\"").append(ly)
                        .append('"').append(stroke(line, line == Line.SOLID ? "#000" : "#1f4e9a")).append("/>");
            } else {
                Scatter s = scatters.get(i - traces.size());
                b.append(s.marker() == Marker.CIRCLE
                        ? "<circle cx=\"" + (lx + 15) + "\" cy=\"" + ly + "\" r=\"3.5\" fill=\"#fff\" stroke=\"#000\" stroke-width=\"1.2\"/>"
                        : "<path d=\"M" + (lx + 12) + "," + (ly - 3) + "L" + (lx + 18) + "," + (ly + 3) + "M" + (lx + 12) + "," + (ly + 3) + "L"
                                + (lx + 18) + "," + (ly - 3) + "\" stroke=\"#b00\" stroke-width=\"1.6\"/>");
            }
            b.append("<text class=\"legend\" x=\"").append(lx + 36).append("\" y=\"").append(ly + 4).append("\">")
                    .append(Xml.escape(legend.get(i))).append("</text>\n");
        }
        b.append("</svg>");
        return b.toString();
    }

    private void axes(StringBuilder b, double[] xs, double[] ys, Scale sx, Scale sy, int aw, int ah) {
        b.append("<g class=\"axes\" font-size=\"10\">\n");
        for (double v = xs[0]; v <= xs[1] + xs[2] / 2; v += xs[2]) {
            double x = sx.at(v);
            b.append("<line x1=\"").append(c(x)).append("\" x2=\"").append(c(x)).append("\" y1=\"").append(TOP).append("\" y2=\"").append(TOP + ah)
                    .append("\" stroke=\"#ddd\" stroke-width=\"0.5\"/><line x1=\"").append(c(x)).append("\" x2=\"").append(c(x)).append("\" y1=\"")
                    .append(TOP + ah).append("\" y2=\"").append(TOP + ah + 4).append("\" stroke=\"#000\"/>");
            b.append("<text x=\"").append(c(x)).append("\" y=\"").append(TOP + ah + 15).append("\" text-anchor=\"middle\">")
                    .append(tick(v, xs[2])).append("</text>\n");
        }
        for (double v = ys[0]; v <= ys[1] + ys[2] / 2; v += ys[2]) {
            double y = sy.at(v);
            b.append("<line x1=\"").append(LEFT).append("\" x2=\"").append(LEFT + aw).append("\" y1=\"").append(c(y)).append("\" y2=\"").append(c(y))
                    .append("\" stroke=\"#ddd\" stroke-width=\"0.5\"/><line x1=\"").append(LEFT - 4).append("\" x2=\"").append(LEFT).append("\" y1=\"")
                    .append(c(y)).append("\" y2=\"").append(c(y)).append("\" stroke=\"#000\"/>");
            b.append("<text x=\"").append(LEFT - 6).append("\" y=\"").append(c(y + 3.5)).append("\" text-anchor=\"end\">")
                    .append(tick(v, ys[2])).append("</text>\n");
        }
        b.append("<text x=\"").append(LEFT + aw / 2).append("\" y=\"").append(TOP + ah + 32).append("\" text-anchor=\"middle\">")
                .append(Xml.escape(xLabel)).append("</text>\n");
        b.append("<text transform=\"translate(14,").append(TOP + ah / 2).append(") rotate(-90)\" text-anchor=\"middle\">")
                .append(Xml.escape(yLabel)).append("</text>\n</g>\n");
    }

    /** Labels of horizontal lines and bands at the right of the plot area, pushed apart to stay readable. */
    private void refLabels(StringBuilder b, Scale sx, Scale sy, int aw) {
        List<double[]> at = new ArrayList<>();
        List<String> text = new ArrayList<>();
        for (Ref ref : refs) {
            if (ref.horizontal()) {
                at.add(new double[] {sy.at(ref.at())});
                text.add(ref.label());
            } else {
                b.append("<text class=\"ref-label\" x=\"").append(c(sx.at(ref.at()) + 3)).append("\" y=\"").append(TOP + 10).append("\">")
                        .append(Xml.escape(ref.label())).append("</text>\n");
            }
        }
        for (Band band : bands) {
            at.add(new double[] {(sy.at(band.y0()) + sy.at(band.y1())) / 2});
            text.add(band.label());
        }
        Integer[] order = new Integer[at.size()];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        java.util.Arrays.sort(order, (p, q) -> Double.compare(at.get(p)[0], at.get(q)[0]));
        double last = Double.NEGATIVE_INFINITY;
        for (Integer i : order) {
            double y = Math.max(at.get(i)[0] + 3.5, last + 11);
            last = y;
            b.append("<text class=\"ref-label\" x=\"").append(LEFT + aw + 4).append("\" y=\"").append(c(y)).append("\">")
                    .append(Xml.escape(text.get(i))).append("</text>\n");
        }
    }

    private double[] extent() {
        double[] r = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (Trace t : traces) {
            grow(r, t.x(), t.y());
        }
        for (Scatter s : scatters) {
            grow(r, s.x(), s.y());
        }
        for (Ref ref : refs) {
            if (Double.isFinite(ref.at())) {
                int k = ref.horizontal() ? 2 : 0;
                r[k] = Math.min(r[k], ref.at());
                r[k + 1] = Math.max(r[k + 1], ref.at());
            }
        }
        for (Band band : bands) {
            r[2] = Math.min(r[2], band.y0());
            r[3] = Math.max(r[3], band.y1());
        }
        for (Mark m : marks) {
            grow(r, new double[] {m.x()}, new double[] {m.y()});
        }
        for (int k = 0; k < 4; k += 2) {
            if (!(r[k] <= r[k + 1])) {
                r[k] = 0;
                r[k + 1] = 1;
            }
        }
        return r;
    }

    private static void grow(double[] r, double[] x, double[] y) {
        for (int i = 0; i < x.length; i++) {
            if (Double.isFinite(x[i]) && Double.isFinite(y[i])) {
                r[0] = Math.min(r[0], x[i]);
                r[1] = Math.max(r[1], x[i]);
                r[2] = Math.min(r[2], y[i]);
                r[3] = Math.max(r[3], y[i]);
            }
        }
    }

    /** {min, max, step}: the range widened to multiples of a nice step giving about 6 ticks. */
    static double[] niceAxis(double min, double max) {
        if (max - min <= Math.max(Math.abs(min), Math.abs(max)) * 1e-9) {
            double pad = min == 0 ? 1 : Math.abs(min) * 0.1;
            min -= pad;
            max += pad;
        }
        double step = nice((max - min) / 5, true);
        double lo = Math.floor(min / step + 1e-9) * step;
        double hi = Math.ceil(max / step - 1e-9) * step;
        return new double[] {lo, hi, step};
    }

    /** Heckbert's nice number: 1, 2, 5 or 10 × 10ⁿ near {@code x}, rounded or taken at or above. */
    private static double nice(double x, boolean round) {
        double exp = Math.floor(Math.log10(x));
        double f = x / Math.pow(10, exp);
        double nf;
        if (round) {
            nf = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
        } else {
            nf = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
        }
        return nf * Math.pow(10, exp);
    }

    private static String tick(double v, double step) {
        int decimals = Math.max(0, (int) -Math.floor(Math.log10(step) + 1e-9));
        return Format.fixed(Math.abs(v) < step * 1e-6 ? 0 : v, decimals);
    }

    private static String stroke(Line line, String colour) {
        return " stroke=\"" + colour + "\" stroke-width=\"" + line.width + "\"" + (line.dash.isEmpty() ? "" : " stroke-dasharray=\"" + line.dash + "\"");
    }

    private static String c(double v) {
        return String.format(Locale.ROOT, "%.2f", v);
    }

    private static String num(double v) {
        return Double.toString(v);
    }

    /** A linear map from values to user units. */
    private record Scale(double v0, double v1, double p0, double p1) {
        double at(double v) {
            return p0 + (v - v0) / (v1 - v0) * (p1 - p0);
        }
    }
}
