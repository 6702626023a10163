package org.ringsweep.runner.plugins;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Point;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;

/** A plugin model that throws gives an error record naming the plugin and the point. */
class PluginFailureTests {
    @TempDir
    Path dir;

    @Test
    void aModelWhoseElaborateThrowsGivesAnErrorRecordNamingThePluginAndThePoint() throws Exception {
        PluginRegistry r = PluginRegistry.builder().discoverClassPath(false)
                .add(new TestPlugins.BrokenDriverPlugin(), "broken.jar").build();
        Path file = dir.resolve("net.yaml");
        Files.writeString(file, "format: ringsweep/net-1\nnet: BROKEN\nrails: { VCC: 3.3 }\n"
                + "drivers:\n  - { pin: U1.1, model: broken-io, v_high: VCC, rise: 1ns, r_out: 25 }\n"
                + "receivers:\n  - { pin: U2.1, model: cmos, c_in: 2pF, vih: 2.0, vil: 0.8 }\n"
                + "segments:\n  - { from: U1.1, to: U2.1, z0: 50, delay: 1ns }\n");
        Net net = new NetFileLoader(r.catalog()).load(file);
        PointRunner runner = new PointRunner(r.elaborator(), null, Optional.empty(), dir, Duration.ofSeconds(10), r.checks());
        ResultRecord rec = runner.run(net, new PointRunner.PointSpec("slow", Point.NONE, Map.of(), 1));
        assertEquals(Verdict.ERROR, rec.verdict());
        assertTrue(rec.error().startsWith("plugin `test-broken-driver` 0.0.1 (broken.jar): driver model `broken-io` (elaborate) failed: "
                + "java.lang.IllegalStateException: table index 3 out of range"), rec.error());
        assertTrue(rec.error().endsWith("(net BROKEN, point slow)"), rec.error());
    }
}
