package org.ringsweep.runner.report;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.ringsweep.api.net.Location;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Point;
import org.ringsweep.api.net.Receiver;
import org.ringsweep.api.net.Value;
import org.ringsweep.api.net.ValuePath;
import org.ringsweep.generators.elaborate.EdgeEvent;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.elaborate.ReceiverProbe;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.input.PointParser;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.verdict.EffectiveLimits;
import org.ringsweep.runner.verdict.LimitDefaults;

/**
 * Re-derives a record's {@link PointContext} from its net file: loads the file named by the
 * record's {@code source}, refuses it when its SHA-256 differs from the record's
 * {@code source_hash} (the file changed since the run, so its levels may not be the ones the
 * record was judged by), applies the corner, then the {@code --set} values, then the swept values
 * (the order {@code check}, {@code sweep} and {@code tune} apply them), elaborates and resolves the
 * limits as the run did. Nets are loaded once per file. Not thread-safe.
 */
final class ContextResolver {
    /** A context, or why there is none. */
    record Resolved(PointContext context, String problem) {
        boolean found() {
            return context != null;
        }
    }

    private final BuiltinModels catalog = new BuiltinModels();
    private final NetFileLoader loader = new NetFileLoader(catalog);
    private final PointParser parser = new PointParser(catalog);
    private final Elaborator elaborator = new Elaborator();
    private final List<String> sets;
    private final Map<String, Object> nets = new HashMap<>();

    /** @param sets the {@code --set ID/param=value} options of the run (empty for sweeps and tune) */
    ContextResolver(List<String> sets) {
        this.sets = List.copyOf(sets);
    }

    /** The context of a record, or the reason it cannot be had (the file is missing, changed or no longer loads). */
    Resolved resolve(ResultRecord r) {
        Object loaded = nets.computeIfAbsent(r.source() + "\n" + r.sourceHash(), k -> load(r));
        if (loaded instanceof String problem) {
            return new Resolved(null, problem);
        }
        Net net = (Net) loaded;
        try {
            Point corner = r.corner().equals("typ") ? Point.NONE : net.corners().get(r.corner());
            if (corner == null) {
                return new Resolved(null, "net file `" + r.source() + "` has no corner `" + r.corner() + "`");
            }
            Point set = parser.parse(net, sets.stream().map(PointParser::fromSetOption).toList());
            Map<ValuePath, Value> swept = new LinkedHashMap<>();
            for (Map.Entry<String, Double> e : r.point().entrySet()) {
                ValuePath path = ValuePath.parse(e.getKey());
                Value v = parser.value(net, path, Double.toString(e.getValue()), new Location("record", 0, 0), e.getKey());
                // Bit for bit the recorded value, whatever the text round trip does.
                swept.put(path, v instanceof Value.Number n ? Value.of(e.getValue(), n.dimension()) : v);
            }
            Point overrides = corner.then(set).then(Point.of(swept));
            Net applied = net.with(overrides);
            Elaboration elab = elaborator.elaborate(applied, r.corner());
            List<PointContext.Edge> edges = new ArrayList<>();
            for (EdgeEvent e : elab.edges()) {
                edges.add(new PointContext.Edge(e.direction().word(), e.start(), e.source50(), e.end()));
            }
            Map<String, PointContext.ReceiverLevels> receivers = new LinkedHashMap<>();
            for (ReceiverProbe p : elab.receivers()) {
                Receiver receiver = applied.receivers().stream().filter(x -> x.pin().equals(p.pin())).findFirst().orElseThrow();
                EffectiveLimits l = LimitDefaults.resolve(applied.limitsFor(receiver), elab.swing());
                receivers.put(p.pin(), new PointContext.ReceiverLevels(p.pin(), p.node(), p.lowRail(), p.highRail(), p.vil(), p.vih(),
                        l.overshootMaxV(), l.undershootMaxV(), l.ringbackMarginMinV(), l.settleBandV(), l.settleMaxS()));
            }
            String driverPin = elab.circuit().probes().getOrDefault(elab.driverNode(), elab.driverNode());
            return new Resolved(new PointContext(driverPin, elab.driverNode(), edges, receivers), null);
        } catch (RuntimeException e) {
            return new Resolved(null, "net file `" + r.source() + "` no longer elaborates at this point: " + e.getMessage());
        }
    }

    private Object load(ResultRecord r) {
        Path file = Path.of(r.source());
        if (!Files.isRegularFile(file)) {
            return "net file `" + r.source() + "` is not there any more";
        }
        try {
            Net net = loader.load(file);
            if (!net.sourceHash().equals(r.sourceHash())) {
                return "net file `" + r.source() + "` changed since the run (its SHA-256 differs from the record's)";
            }
            return net;
        } catch (RuntimeException e) {
            return "net file `" + r.source() + "` no longer loads: " + e.getMessage();
        }
    }
}
