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

    @Test
    void tasksAreTakenOnlyAsWorkersFreeUpSoAtMostTwoChunksPerWorkerAreHeld() throws Exception {
        Net net = new NetFileLoader(new BuiltinModels()).load(Path.of("src/test/resources/tune/p2p-15ohm.yaml"));
        int jobs = 2;
        int batch = 4;
        int n = 400;
        java.util.concurrent.atomic.AtomicLong pulled = new java.util.concurrent.atomic.AtomicLong();
        java.util.concurrent.atomic.AtomicLong written = new java.util.concurrent.atomic.AtomicLong();
        java.util.concurrent.atomic.AtomicLong mostHeld = new java.util.concurrent.atomic.AtomicLong();
        java.util.Iterator<BatchRunner.Task> tasks = new java.util.Iterator<>() {
            private int i;

            @Override
            public boolean hasNext() {
                return i < n;
            }

            @Override
            public BatchRunner.Task next() {
                pulled.incrementAndGet();
                i++;
                return new BatchRunner.Task(net, new PointRunner.PointSpec("typ", Point.NONE, Map.of(), i), "k" + i);
            }
        };
        // no engine: every point is an error record at once, so only the slow writer holds the run back
        PointRunner runner = new PointRunner(null, null, Optional.empty(), Path.of("target/batch-bound"), java.time.Duration.ofSeconds(1));
        Progress quiet = new Progress(new java.io.PrintWriter(new java.io.StringWriter()), n, false, true, java.time.Duration.ofHours(1),
                System::nanoTime);
        long got = new BatchRunner(runner, jobs, batch).run(tasks, n, (task, record) -> {
            mostHeld.accumulateAndGet(pulled.get() - written.get(), Math::max);
            try {
                Thread.sleep(1);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            written.incrementAndGet();
        }, quiet);
        assertEquals(n, got);
        assertEquals(n, written.get());
        // jobs × IN_FLIGHT_PER_WORKER chunks of `batch` tasks, and the one task the chunker reads ahead
        long bound = (long) jobs * BatchRunner.IN_FLIGHT_PER_WORKER * batch + 1;
        org.junit.jupiter.api.Assertions.assertTrue(mostHeld.get() <= bound, "held " + mostHeld.get() + " tasks, bound " + bound);
    }

    @Test
    void aSinkFailureStopsTheRunAndReachesTheCaller() {
        Net net = new NetFileLoader(new BuiltinModels()).load(Path.of("src/test/resources/tune/p2p-15ohm.yaml"));
        PointRunner runner = new PointRunner(null, null, Optional.empty(), Path.of("target/batch-bound"), java.time.Duration.ofSeconds(1));
        Progress quiet = new Progress(new java.io.PrintWriter(new java.io.StringWriter()), 50, false, true, java.time.Duration.ofHours(1),
                System::nanoTime);
        IllegalStateException e = assertThrows(IllegalStateException.class, () -> new BatchRunner(runner, 2, 1).run(tasks(net, 50, 1),
                (task, record) -> {
                    throw new IllegalStateException("disk full");
                }, quiet));
        assertEquals("disk full", e.getMessage());
    }
}
