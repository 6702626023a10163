package org.ringsweep.runner.importer;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** The rectilinear minimum spanning tree against trees worked out by hand. */
class RectilinearTreeTests {
    @Test
    void fourPinNetGivesTheHandComputedManhattanTree() {
        // The SPI0_SCK piece of the demo board, in inches: R5.2 (1.26, 1.1), U7.6 (2.8, 1.1),
        // U9.2 (2.8, 1.9), U11.2 (1.9, 1.9). Manhattan distances by hand:
        // R5.2-U7.6 1.54, R5.2-U9.2 2.34, R5.2-U11.2 1.44, U7.6-U9.2 0.80, U7.6-U11.2 1.70, U9.2-U11.2 0.90.
        // Kruskal by hand: take 0.80, 0.90, then 1.44 (1.54 would close a cycle): total 3.14 in,
        // and from the root R5.2 the tree is the chain R5.2 → U11.2 → U9.2 → U7.6.
        Map<String, double[]> pts = new LinkedHashMap<>();
        pts.put("R5.2", new double[] {1.26, 1.1});
        pts.put("U7.6", new double[] {2.8, 1.1});
        pts.put("U9.2", new double[] {2.8, 1.9});
        pts.put("U11.2", new double[] {1.9, 1.9});
        List<RectilinearTree.Edge> tree = RectilinearTree.of(pts, "R5.2");
        assertEquals(3, tree.size());
        assertEquals(3.14, tree.stream().mapToDouble(RectilinearTree.Edge::manhattan).sum(), 1e-12);
        assertEquals(new RectilinearTree.Edge("R5.2", "U11.2", 1.44), round(tree.get(0)));
        assertEquals(new RectilinearTree.Edge("U11.2", "U9.2", 0.9), round(tree.get(1)));
        assertEquals(new RectilinearTree.Edge("U9.2", "U7.6", 0.8), round(tree.get(2)));
    }

    @Test
    void aStarIsRootedAtTheDriverEvenWhenTheDriverIsALeaf() {
        // A plus-shaped net: centre C (0,0), arms at distance 1; the driver D sits on the west arm.
        // By hand the MST is the four unit edges to C (total 4); rooted at D: D → C, then C → N, E, S.
        Map<String, double[]> pts = new LinkedHashMap<>();
        pts.put("C", new double[] {0, 0});
        pts.put("N", new double[] {0, 1});
        pts.put("E", new double[] {1, 0});
        pts.put("S", new double[] {0, -1});
        pts.put("D", new double[] {-1, 0});
        List<RectilinearTree.Edge> tree = RectilinearTree.of(pts, "D");
        assertEquals(4, tree.stream().mapToDouble(RectilinearTree.Edge::manhattan).sum(), 1e-12);
        assertEquals("D", tree.get(0).from());
        assertEquals("C", tree.get(0).to());
        tree.subList(1, 4).forEach(e -> assertEquals("C", e.from()));
    }

    private static RectilinearTree.Edge round(RectilinearTree.Edge e) {
        return new RectilinearTree.Edge(e.from(), e.to(), Math.round(e.manhattan() * 1e9) / 1e9);
    }
}
