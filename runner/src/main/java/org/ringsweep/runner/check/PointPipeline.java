package org.ringsweep.runner.check;

import java.util.List;
import java.util.Objects;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.Consumer;
import org.ringsweep.api.net.Net;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.runner.engine.SimulationOutcome;
import org.ringsweep.runner.results.ResultRecord;

/**
 * Runs points one after another, one engine run at a time, and keeps the engine busy: while the
 * engine simulates point i on a thread of its own, the calling thread renders the deck of point
 * i + 1 and, once point i + 1 is running, measures point i. A point's own work is unchanged
 * ({@link PointRunner#prepare}, {@link PointRunner#simulate}, {@link PointRunner#complete}), and
 * so are the records and their order; only the orchestrator's share of the wall-clock time goes.
 *
 * <p>A run whose outcome {@link PointRunner#retries calls for the conservative retry} is
 * completed before the next point starts, so two engine runs never overlap. Anything a step
 * throws becomes that point's error record, as {@link PointRunner#errorRecord} words it.
 * Interrupting the calling thread stops the running simulation (its engine process is killed)
 * and makes the remaining points error records.
 */
public final class PointPipeline {
    /**
     * One point to run, or a record already made (a point that could not be elaborated).
     *
     * @param net         the net
     * @param spec        the point
     * @param elaboration its elaboration, or null when {@code ready} holds the record
     * @param ready       the record to emit as it is, or null
     */
    public record Item(Net net, PointRunner.PointSpec spec, Elaboration elaboration, ResultRecord ready) {
        /** A point to simulate. */
        public static Item of(Net net, PointRunner.PointSpec spec, Elaboration elaboration) {
            return new Item(net, spec, Objects.requireNonNull(elaboration, "elaboration"), null);
        }

        /** A record made without simulating (it keeps its place in the order). */
        public static Item done(Net net, PointRunner.PointSpec spec, ResultRecord record) {
            return new Item(net, spec, null, Objects.requireNonNull(record, "record"));
        }
    }

    private final PointRunner runner;

    /**
     * @param runner the runner, with an engine
     */
    public PointPipeline(PointRunner runner) {
        this.runner = Objects.requireNonNull(runner, "runner");
    }

    /**
     * Runs every item and hands each record to {@code sink} in the items' order, as soon as it
     * and all before it are done.
     *
     * @param items the points
     * @param sink  receives each record on the calling thread
     */
    public void run(List<Item> items, Consumer<ResultRecord> sink) {
        ExecutorService engineThread = Executors.newSingleThreadExecutor(r -> {
            Thread t = new Thread(r, "ringsweep-engine-run");
            t.setDaemon(true); // never keeps the JVM alive; ProcessTrees' hook still kills its process
            return t;
        });
        try {
            // Invariant: `current` is item i's simulation, or null when item i is a ready record.
            Running current = launch(engineThread, prepare(items, 0));
            for (int i = 0; i < items.size(); i++) {
                Item item = items.get(i);
                if (item.ready() != null) {
                    sink.accept(item.ready());
                    current = launch(engineThread, prepare(items, i + 1));
                    continue;
                }
                Ready upcoming = prepare(items, i + 1); // rendered while item i simulates
                ResultRecord record;
                if (current.failure() != null) {
                    record = errorRecord(item, current.failure());
                    current = launch(engineThread, upcoming);
                } else {
                    SimulationOutcome outcome;
                    try {
                        outcome = current.future().get();
                    } catch (InterruptedException e) {
                        current.future().cancel(true); // the engine kills its process
                        Thread.currentThread().interrupt();
                        for (Item rest : items.subList(i, items.size())) {
                            sink.accept(rest.ready() != null ? rest.ready()
                                    : runner.errorRecord(rest.net(), rest.spec(), "interrupted before the point finished"));
                        }
                        return;
                    } catch (ExecutionException e) {
                        if (e.getCause() instanceof Error error) {
                            throw error;
                        }
                        record = errorRecord(item, e.getCause());
                        current = launch(engineThread, upcoming);
                        sink.accept(record);
                        continue;
                    }
                    Running finished = current;
                    if (runner.retries(outcome)) {
                        record = complete(item, finished.point(), outcome); // the retry runs alone
                        current = launch(engineThread, upcoming);
                    } else {
                        current = launch(engineThread, upcoming);
                        record = complete(item, finished.point(), outcome); // measured while the next simulates
                    }
                }
                sink.accept(record);
            }
        } finally {
            engineThread.shutdownNow();
        }
    }

    /** A point's rendered deck, or why it could not be rendered. */
    private record Ready(PointRunner.Prepared point, RuntimeException failure) {
    }

    /** A simulation under way, or the failure that kept it from starting. */
    private record Running(PointRunner.Prepared point, Future<SimulationOutcome> future, RuntimeException failure) {
    }

    /** The deck of item {@code index}; null past the end or for a ready record. */
    private Ready prepare(List<Item> items, int index) {
        if (index >= items.size() || items.get(index).ready() != null) {
            return null;
        }
        Item item = items.get(index);
        try {
            return new Ready(runner.prepare(item.net(), item.spec(), item.elaboration()), null);
        } catch (RuntimeException e) {
            return new Ready(null, e);
        }
    }

    private Running launch(ExecutorService engineThread, Ready ready) {
        if (ready == null) {
            return null;
        }
        if (ready.failure() != null) {
            return new Running(null, null, ready.failure());
        }
        PointRunner.Prepared point = ready.point();
        return new Running(point, engineThread.submit(() -> runner.simulate(point)), null);
    }

    private ResultRecord complete(Item item, PointRunner.Prepared prepared, SimulationOutcome outcome) {
        try {
            return runner.complete(prepared, outcome);
        } catch (RuntimeException e) {
            return errorRecord(item, e);
        }
    }

    private ResultRecord errorRecord(Item item, Throwable cause) {
        return runner.errorRecord(item.net(), item.spec(), String.valueOf(cause.getMessage()));
    }
}
