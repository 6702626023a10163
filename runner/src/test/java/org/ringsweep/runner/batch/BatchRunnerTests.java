package org.ringsweep.runner.batch;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Point;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.input.NetFileLoader;

class BatchRunnerTests {
    private static List<BatchRunner.Task> tasks(Net net, int n, int first) {
        List<BatchRunner.Task> tasks = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            tasks.add(new BatchRunner.Task(net, new PointRunner.PointSpec("typ", Point.NONE, Map.of(), first + i), "k" + (first + i)));
        }
        return tasks;
    }

    private static List<Integer> sizes(List<List<BatchRunner.Task>> chunks) {
        return chunks.stream().map(List::size).toList();
    }

    @Test
    void chunksHoldConsecutivePointsOfOneNetUpToTheBatchSizeAndAnEvenShareOfTheWorkers() {
        NetFileLoader loader = new NetFileLoader(new BuiltinModels());
        Net a = loader.load(Path.of("src/test/resources/tune/p2p-15ohm.yaml"));
        Net b = loader.load(Path.of("src/test/resources/nets/formats-example.yaml"));
        List<BatchRunner.Task> all = new ArrayList<>(tasks(a, 5, 1));
        all.addAll(tasks(b, 3, 6));

        assertEquals(List.of(4, 1, 3), sizes(BatchRunner.chunks(all, 1, 4)));
        assertEquals(List.of(4, 1, 3), sizes(BatchRunner.chunks(all, 2, 8)), "8 points over 2 workers: at most 4 each");
        assertEquals(List.of(2, 2, 1, 2, 1), sizes(BatchRunner.chunks(all, 4, 8)));
        assertEquals(List.of(1, 1, 1, 1, 1, 1, 1, 1), sizes(BatchRunner.chunks(all, 1, 1)));
        List<BatchRunner.Task> flat = BatchRunner.chunks(all, 1, 4).stream().flatMap(List::stream).toList();
        assertEquals(all, flat, "every task once, in order");
    }

    @Test
    void batchSizeBelowOneIsRefused() {
        PointRunner runner = new PointRunner(null, null, Optional.empty(), Path.of("out"), java.time.Duration.ofSeconds(1));
        assertThrows(IllegalArgumentException.class, () -> new BatchRunner(runner, 1, 0));
    }
}
