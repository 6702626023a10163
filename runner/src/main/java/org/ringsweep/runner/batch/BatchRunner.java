package org.ringsweep.runner.batch;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import org.ringsweep.api.net.Net;
import org.ringsweep.runner.check.PointRunner;
import org.ringsweep.runner.results.ResultRecord;
import org.ringsweep.runner.results.Verdict;

/**
 * Runs points on a pool of workers and hands each finished record to one writer thread, in the
 * order they finish. A point is independent of every other (its own folder, deck and raw file),
 * so a record does not depend on how many workers there are, nor on how many points share one
 * simulator process (the batch size: consecutive points of one net go to one worker as a chunk,
 * see {@link PointRunner#runBatch}).
 *
 * <p>{@link #stop()} (Ctrl-C) interrupts the workers, which ends their ngspice runs; records
 * of points cut short that way are discarded, never written, so a resumed run re-runs them.
 */
public final class BatchRunner {
    /** One point to run. */
    public record Task(Net net, PointRunner.PointSpec spec, String pointKey) {
    }

    /** Receives finished records on the single writer thread. */
    @FunctionalInterface
    public interface Sink {
        /** Called once per finished point, never concurrently. */
        void accept(Task task, ResultRecord record);
    }

    private final PointRunner runner;
    private final int jobs;
    private final int batchSize;
    private final AtomicBoolean stopping = new AtomicBoolean();
    private volatile ExecutorService workers;
    private volatile ExecutorService writer;

    /**
     * @param runner the point runner (thread-safe)
     * @param jobs   number of workers, at least 1
     */
    public BatchRunner(PointRunner runner, int jobs) {
        this(runner, jobs, 1);
    }

    /**
     * @param runner    the point runner (thread-safe)
     * @param jobs      number of workers, at least 1
     * @param batchSize most points per simulator process ({@link PointRunner#runBatch}), at least 1;
     *                  1 runs every point alone
     */
    public BatchRunner(PointRunner runner, int jobs, int batchSize) {
        if (jobs < 1) {
            throw new IllegalArgumentException("--jobs must be at least 1, found " + jobs);
        }
        if (batchSize < 1) {
            throw new IllegalArgumentException("--batch must be at least 1, found " + batchSize);
        }
        this.runner = runner;
        this.jobs = jobs;
        this.batchSize = batchSize;
    }

    /**
     * The tasks cut into chunks that one worker runs in one simulator process: consecutive tasks
     * of the same net, at most the batch size, and no more than an even share of all tasks per
     * worker, so a small sweep still keeps every worker busy.
     *
     * @param tasks     the tasks in order
     * @param jobs      workers
     * @param batchSize most tasks per chunk
     * @return the chunks, in order, every task in exactly one
     */
    static List<List<Task>> chunks(List<Task> tasks, int jobs, int batchSize) {
        int size = Math.max(1, Math.min(batchSize, (tasks.size() + jobs - 1) / jobs));
        List<List<Task>> chunks = new ArrayList<>();
        List<Task> current = new ArrayList<>();
        for (Task t : tasks) {
            if (!current.isEmpty() && (current.size() == size || !current.get(0).net().equals(t.net()))) {
                chunks.add(List.copyOf(current));
                current.clear();
            }
            current.add(t);
        }
        if (!current.isEmpty()) {
            chunks.add(List.copyOf(current));
        }
        return chunks;
    }

    /**
     * Runs every task and waits for them.
     *
     * @return the number of records written
     */
    public int run(List<Task> tasks, Sink sink, Progress progress) throws InterruptedException {
        workers = Executors.newFixedThreadPool(jobs, r -> {
            Thread t = new Thread(r, "ringsweep-worker");
            t.setDaemon(true);
            return t;
        });
        writer = Executors.newSingleThreadExecutor(r -> new Thread(r, "ringsweep-writer"));
        List<Future<?>> futures = new ArrayList<>();
        int[] written = {0};
        for (List<Task> chunk : chunks(tasks, jobs, batchSize)) {
            futures.add(workers.submit(() -> {
                if (stopping.get()) {
                    return;
                }
                List<ResultRecord> records = runChunk(chunk);
                if (stopping.get() || Thread.currentThread().isInterrupted()) {
                    return; // cut short by stop(): not results
                }
                try {
                    writer.submit(() -> {
                        for (int i = 0; i < chunk.size(); i++) {
                            ResultRecord finished = records.get(i);
                            sink.accept(chunk.get(i), finished);
                            written[0]++;
                            progress.finished(finished.verdict() == Verdict.FAIL, finished.verdict() == Verdict.ERROR);
                        }
                    });
                } catch (java.util.concurrent.RejectedExecutionException stoppedMeanwhile) {
                    // stop() closed the writer between the check above and here: not results
                }
            }));
        }
        try {
            for (Future<?> f : futures) {
                f.get();
            }
        } catch (ExecutionException e) {
            throw new IllegalStateException("a worker failed: " + e.getCause(), e.getCause());
        } catch (java.util.concurrent.CancellationException e) {
            // stopped
        } finally {
            workers.shutdownNow();
            writer.shutdown();
            writer.awaitTermination(1, TimeUnit.MINUTES);
        }
        return written[0];
    }

    /** The records of a chunk, in order; a point that cannot be elaborated or run gives an error record. */
    private List<ResultRecord> runChunk(List<Task> chunk) {
        if (chunk.size() == 1) {
            return List.of(runOne(chunk.get(0)));
        }
        ResultRecord[] records = new ResultRecord[chunk.size()];
        List<Integer> ready = new ArrayList<>();
        List<PointRunner.PointSpec> specs = new ArrayList<>();
        List<org.ringsweep.generators.elaborate.Elaboration> elabs = new ArrayList<>();
        for (int i = 0; i < chunk.size(); i++) {
            Task t = chunk.get(i);
            try {
                elabs.add(runner.elaborate(t.net(), t.spec()));
                specs.add(t.spec());
                ready.add(i);
            } catch (RuntimeException e) {
                records[i] = runner.errorRecord(t.net(), t.spec(), String.valueOf(e.getMessage()));
            }
        }
        try {
            List<ResultRecord> got = runner.runBatch(chunk.get(0).net(), specs, elabs);
            for (int j = 0; j < ready.size(); j++) {
                records[ready.get(j)] = got.get(j);
            }
        } catch (RuntimeException e) {
            for (int i : ready) {
                records[i] = runOne(chunk.get(i)); // the batch itself failed: every point alone
            }
        }
        return List.of(records);
    }

    private ResultRecord runOne(Task task) {
        try {
            return runner.run(task.net(), task.spec());
        } catch (RuntimeException e) {
            return runner.errorRecord(task.net(), task.spec(), String.valueOf(e.getMessage()));
        }
    }

    /** Stops cleanly: no new points, running simulations ended, records already handed over written. */
    public void stop() {
        stopping.set(true);
        ExecutorService w = workers;
        if (w != null) {
            w.shutdownNow();
        }
        ExecutorService out = writer;
        if (out != null) {
            out.shutdown();
            try {
                out.awaitTermination(10, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
    }

    /** Whether {@link #stop()} was called. */
    public boolean stopped() {
        return stopping.get();
    }
}
