package org.ringsweep.runner.importer;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.jgrapht.Graph;
import org.jgrapht.alg.spanning.KruskalMinimumSpanningTree;
import org.jgrapht.graph.DefaultWeightedEdge;
import org.jgrapht.graph.SimpleWeightedGraph;

/**
 * A driver-rooted rectilinear minimum spanning tree: the estimate of a net's routing from its pin
 * coordinates when no routed lengths are known. The tree minimises the sum of Manhattan
 * distances {@code |Δx| + |Δy|} over the complete graph of the pins (Kruskal on JGraphT), then
 * each edge is oriented away from the root. It is a spanning tree of the pins only (no Steiner
 * points), so it is never shorter than the best rectilinear Steiner tree and at most 1.5 times
 * longer (Hwang 1976); routers add detours, hence the importer's detour factor.
 */
public final class RectilinearTree {
    /**
     * One tree edge, oriented away from the root.
     *
     * @param from      the point nearer the root
     * @param to        the point farther from the root
     * @param manhattan the Manhattan distance (m)
     */
    public record Edge(String from, String to, double manhattan) {
    }

    private RectilinearTree() {
    }

    /** The Manhattan distance of two {x, y} points (m). */
    public static double manhattan(double[] a, double[] b) {
        return Math.abs(a[0] - b[0]) + Math.abs(a[1] - b[1]);
    }

    /**
     * The tree over {@code points}, rooted at {@code root}, edges in breadth-first order from the
     * root (ties by the points' order in the map).
     *
     * @param points point name to {x, y} in metres, in a stable order; at least the root
     * @param root   a key of {@code points}
     * @return {@code points.size() − 1} edges
     */
    public static List<Edge> of(Map<String, double[]> points, String root) {
        if (!points.containsKey(root)) {
            throw new IllegalArgumentException("root `" + root + "` is not among the points");
        }
        Graph<String, DefaultWeightedEdge> g = new SimpleWeightedGraph<>(DefaultWeightedEdge.class);
        points.keySet().forEach(g::addVertex);
        List<String> names = new ArrayList<>(points.keySet());
        for (int i = 0; i < names.size(); i++) {
            for (int j = i + 1; j < names.size(); j++) {
                DefaultWeightedEdge e = g.addEdge(names.get(i), names.get(j));
                g.setEdgeWeight(e, manhattan(points.get(names.get(i)), points.get(names.get(j))));
            }
        }
        Map<String, List<String>> adjacent = new LinkedHashMap<>();
        names.forEach(n -> adjacent.put(n, new ArrayList<>()));
        for (DefaultWeightedEdge e : new KruskalMinimumSpanningTree<>(g).getSpanningTree().getEdges()) {
            String a = g.getEdgeSource(e);
            String b = g.getEdgeTarget(e);
            adjacent.get(a).add(b);
            adjacent.get(b).add(a);
        }
        Map<String, Integer> order = new HashMap<>();
        for (int i = 0; i < names.size(); i++) {
            order.put(names.get(i), i);
        }
        adjacent.values().forEach(l -> l.sort((x, y) -> Integer.compare(order.get(x), order.get(y))));
        List<Edge> edges = new ArrayList<>();
        Set<String> seen = new HashSet<>(List.of(root));
        Deque<String> queue = new ArrayDeque<>(List.of(root));
        while (!queue.isEmpty()) {
            String p = queue.removeFirst();
            for (String q : adjacent.get(p)) {
                if (seen.add(q)) {
                    edges.add(new Edge(p, q, manhattan(points.get(p), points.get(q))));
                    queue.addLast(q);
                }
            }
        }
        return List.copyOf(edges);
    }
}
