package org.ringsweep.runner.check;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.Function;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Point;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.engine.FailureKind;
import org.ringsweep.runner.engine.NgspiceEngine;
import org.ringsweep.runner.engine.SimulationEngine;
import org.ringsweep.runner.engine.SimulationJob;
import org.ringsweep.runner.engine.SimulationOutcome;
import org.ringsweep.runner.input.NetFileLoader;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;
import org.ringsweep.runner.testing.Ngspice;

class PointPipelineTests {
    private static final Net NET = new NetFileLoader(new BuiltinModels()).load(Path.of("src/test/resources/tune/p2p-15ohm.yaml"));
    private static final Net OTHER = new NetFileLoader(new BuiltinModels()).load(Path.of("src/test/resources/nets/formats-example.yaml"));

    @TempDir
    Path dir;

    /** An engine that answers each job with {@code answer}, noting the deck of each run and how many ran at once. */
    private static final class FakeEngine implements SimulationEngine {
        final Function<SimulationJob, SimulationOutcome> answer;
        final List<String> decks = new CopyOnWriteArrayList<>();
        final Map<String, CountDownLatch> started = new ConcurrentHashMap<>();
        final AtomicInteger running = new AtomicInteger();
        final AtomicInteger mostAtOnce = new AtomicInteger();

        FakeEngine(Function<SimulationJob, SimulationOutcome> answer) {
            this.answer = answer;
        }

        CountDownLatch startOf(String deck) {
            return started.computeIfAbsent(deck, d -> new CountDownLatch(1));
        }

        @Override
        public String name() {
            return "fake";
        }

        @Override
        public String version() {
            return "1";
        }

        @Override
        public SimulationOutcome run(SimulationJob job) {
            mostAtOnce.accumulateAndGet(running.incrementAndGet(), Math::max);
            try {
                decks.add(job.deckFileName());
                startOf(job.deckFileName()).countDown();
                return answer.apply(job);
            } finally {
                running.decrementAndGet();
            }
        }
    }

    private static SimulationOutcome failure(FailureKind kind, String message) {
        return new SimulationOutcome.Failure(kind, message, "", Duration.ZERO);
    }

    private static SimulationOutcome pause(long millis, SimulationOutcome outcome) {
        try {
            Thread.sleep(millis);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        return outcome;
    }

    private PointRunner runner(SimulationEngine engine, Path out) {
        return new PointRunner(new Elaborator(), new DeckWriter(), Optional.of(engine), out, Duration.ofSeconds(30));
    }

    private static List<PointPipeline.Item> items(PointRunner runner, Net net, int n) {
        List<PointPipeline.Item> items = new ArrayList<>();
        for (int i = 1; i <= n; i++) {
            PointRunner.PointSpec spec = new PointRunner.PointSpec("typ", Point.NONE, Map.of(), i);
            items.add(PointPipeline.Item.of(net, spec, runner.elaborate(net, spec)));
        }
        return items;
    }

    private static String deckName(ResultRecord r) {
        return Path.of(r.deck()).getFileName().toString();
    }

    @Test
    void theNextPointSimulatesWhileTheLastOneIsBeingCompleted() {
        FakeEngine engine = new FakeEngine(job -> failure(FailureKind.CRASH, "no such engine"));
        PointRunner runner = runner(engine, dir);
        List<PointPipeline.Item> items = items(runner, NET, 4);
        List<ResultRecord> records = new ArrayList<>();
        List<Boolean> nextWasRunning = new ArrayList<>();

        new PointPipeline(runner).run(items, r -> {
            int next = records.size() + 2;
            records.add(r);
            if (next <= items.size()) {
                // A pipeline that waits for this record before starting the next run would never get there.
                try {
                    nextWasRunning.add(engine.startOf(String.format("typ-%04d.cir", next)).await(10, TimeUnit.SECONDS));
                } catch (InterruptedException e) {
                    throw new AssertionError(e);
                }
            }
        });

        assertEquals(List.of(true, true, true), nextWasRunning);
        assertEquals(List.of("typ-0001.cir", "typ-0002.cir", "typ-0003.cir", "typ-0004.cir"),
                records.stream().map(PointPipelineTests::deckName).toList(), "records in the points' order");
        assertEquals(1, engine.mostAtOnce.get(), "one engine run at a time");
        records.forEach(r -> assertEquals(Verdict.ERROR, r.verdict()));
    }

    @Test
    void aRunThatIsRetriedEndsBeforeTheNextPointStarts() {
        FakeEngine engine = new FakeEngine(job -> pause(30, failure(FailureKind.CONVERGENCE, "timestep too small")));
        PointRunner runner = runner(engine, dir);
        List<ResultRecord> records = new ArrayList<>();

        new PointPipeline(runner).run(items(runner, NET, 3), records::add);

        assertEquals(List.of("typ-0001.cir", "typ-0001-conservative.cir", "typ-0002.cir", "typ-0002-conservative.cir",
                "typ-0003.cir", "typ-0003-conservative.cir"), engine.decks);
        assertEquals(1, engine.mostAtOnce.get(), "the retry never overlaps the next point's run");
        records.forEach(r -> assertTrue(r.error().contains("the retry with conservative options failed too"), r.error()));
    }

    @Test
    void anEngineThatThrowsGivesThatPointAnErrorRecordAndTheOthersStillRun() {
        FakeEngine engine = new FakeEngine(job -> {
            if (job.deckFileName().equals("typ-0002.cir")) {
                throw new IllegalStateException("engine fell over");
            }
            return failure(FailureKind.CRASH, "exit status 1");
        });
        PointRunner runner = runner(engine, dir);
        List<ResultRecord> records = new ArrayList<>();

        new PointPipeline(runner).run(items(runner, NET, 3), records::add);

        assertEquals(3, records.size());
        assertEquals("engine fell over", records.get(1).error());
        assertTrue(records.get(2).error().contains("exit status 1"), records.get(2).error());
        assertEquals(List.of("typ-0001.cir", "typ-0002.cir", "typ-0003.cir"), engine.decks);
    }

    @Test
    void recordsMadeBeforehandKeepTheirPlaceInTheOrder() {
        FakeEngine engine = new FakeEngine(job -> failure(FailureKind.CRASH, "exit status 1"));
        PointRunner runner = runner(engine, dir);
        List<PointPipeline.Item> items = new ArrayList<>(items(runner, NET, 3));
        PointRunner.PointSpec spec = new PointRunner.PointSpec("slow", Point.NONE, Map.of(), 9);
        ResultRecord made = runner.errorRecord(NET, spec, "plugin threw");
        items.add(0, PointPipeline.Item.done(NET, spec, made));
        items.add(2, PointPipeline.Item.done(NET, spec, made));
        List<ResultRecord> records = new ArrayList<>();

        new PointPipeline(runner).run(items, records::add);

        assertEquals(List.of("slow-0009.cir", "typ-0001.cir", "slow-0009.cir", "typ-0002.cir", "typ-0003.cir"),
                records.stream().map(PointPipelineTests::deckName).toList());
        assertEquals(3, engine.decks.size());
    }

    @Test
    void interruptingTheCallerStopsTheRunningSimulationAndEndsEveryPoint() throws InterruptedException {
        AtomicBoolean runInterrupted = new AtomicBoolean();
        FakeEngine engine = new FakeEngine(job -> {
            try {
                Thread.sleep(60_000);
                return failure(FailureKind.CRASH, "not interrupted");
            } catch (InterruptedException e) {
                runInterrupted.set(true);
                return failure(FailureKind.TIMEOUT, "interrupted");
            }
        });
        PointRunner runner = runner(engine, dir);
        List<ResultRecord> records = new CopyOnWriteArrayList<>();
        Thread caller = new Thread(() -> new PointPipeline(runner).run(items(runner, NET, 3), records::add));
        caller.start();
        assertTrue(engine.startOf("typ-0001.cir").await(10, TimeUnit.SECONDS));

        caller.interrupt();
        caller.join(10_000);

        assertTrue(!caller.isAlive(), "the pipeline returned");
        assertEquals(3, records.size(), "every point has its record");
        records.forEach(r -> assertEquals(Verdict.ERROR, r.verdict()));
        for (int i = 0; i < 100 && !runInterrupted.get(); i++) {
            Thread.sleep(50);
        }
        assertTrue(runInterrupted.get(), "the running simulation was stopped");
        assertEquals(List.of("typ-0001.cir"), engine.decks, "nothing more was started");
    }

    @Test
    void withNgspiceTheRecordsAreThoseOfRunningEachPointAlone() {
        // Reference: the same points run one by one with PointRunner.run and ngspice itself.
        NgspiceEngine ngspice = NgspiceEngine.at(Ngspice.require());
        PointRunner alone = runner(ngspice, dir.resolve("alone"));
        PointRunner piped = runner(ngspice, dir.resolve("piped"));
        List<PointPipeline.Item> items = new ArrayList<>(items(piped, NET, 2));
        items.addAll(items(piped, OTHER, 2));
        List<ResultRecord> records = new ArrayList<>();

        new PointPipeline(piped).run(items, records::add);

        assertEquals(items.size(), records.size());
        for (int i = 0; i < items.size(); i++) {
            PointPipeline.Item item = items.get(i);
            ResultRecord expected = alone.run(item.net(), item.spec(), item.elaboration());
            ResultRecord got = records.get(i);
            assertEquals(expected.verdict(), got.verdict(), "point " + i);
            assertEquals(expected.receivers(), got.receivers(), "point " + i);
            assertEquals(expected.error(), got.error(), "point " + i);
            assertEquals(Path.of(expected.deck()).getFileName(), Path.of(got.deck()).getFileName());
        }
        assertTrue(records.stream().anyMatch(r -> r.verdict() != Verdict.ERROR), "the points were simulated");
    }
}
