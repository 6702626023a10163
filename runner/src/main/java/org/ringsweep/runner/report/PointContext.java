package org.ringsweep.runner.report;

import java.util.List;
import java.util.Map;

/**
 * What a plot needs beyond the record: the levels and limits each receiver was judged by, the
 * measurement windows of the edges and the node names in the raw file. Re-derived from the
 * record's net file at the record's point (see {@link ContextResolver}), exactly as the run
 * derived them.
 *
 * @param driverPin  the first driver's pin as the user wrote it
 * @param driverNode its node in the raw file ({@code v(<node>)})
 * @param edges      the measured edges in time order
 * @param receivers  pin → levels, in file order
 */
record PointContext(String driverPin, String driverNode, List<Edge> edges, Map<String, ReceiverLevels> receivers) {
    PointContext {
        edges = List.copyOf(edges);
        receivers = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(receivers));
    }

    /**
     * One measured edge's window.
     *
     * @param word     {@code rise} or {@code fall}
     * @param start    start of the transition at the source (s)
     * @param source50 the source's 50 % point (s)
     * @param end      end of the window (s)
     */
    record Edge(String word, double start, double source50, double end) {
    }

    /**
     * One receiver's levels and limits (V, s).
     *
     * @param pin                the pin as the user wrote it
     * @param node               its node in the raw file
     * @param lowRail            the low rail (undershoot is measured from it)
     * @param highRail           the high rail (overshoot is measured from it)
     * @param vil                input low threshold
     * @param vih                input high threshold
     * @param overshootMaxV      overshoot limit above the high rail
     * @param undershootMaxV     undershoot limit below the low rail
     * @param ringbackMarginMinV smallest allowed ringback margin
     * @param settleBandV        half-width of the settle band around each edge's final level
     * @param settleMaxS         settle-time limit; NaN when none is set
     */
    record ReceiverLevels(String pin, String node, double lowRail, double highRail, double vil, double vih,
                          double overshootMaxV, double undershootMaxV, double ringbackMarginMinV, double settleBandV,
                          double settleMaxS) {
    }
}
