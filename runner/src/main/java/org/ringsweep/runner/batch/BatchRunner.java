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
 * so a record does not depend on how many workers there are.
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
    private final AtomicBoolean stopping = new AtomicBoolean();
    private volatile ExecutorService workers;
    private volatile ExecutorService writer;

    /**
     * @param runner the point runner (thread-safe)
     * @param jobs   number of workers, at least 1
     */
    public BatchRunner(PointRunner runner, int jobs) {
        if (jobs < 1) {
            throw new IllegalArgumentException("--jobs must be at least 1, found " + jobs);
        }
        this.runner = runner;
        this.jobs = jobs;
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
        for (Task task : tasks) {
            futures.add(workers.submit(() -> {
                if (stopping.get()) {
                    return;
                }
                ResultRecord record;
                try {
                    record = runner.run(task.net(), task.spec());
                } catch (RuntimeException e) {
                    record = runner.errorRecord(task.net(), task.spec(), String.valueOf(e.getMessage()));
                }
                if (stopping.get() || Thread.currentThread().isInterrupted()) {
                    return; // cut short by stop(): not a result
                }
                ResultRecord finished = record;
                try {
                    writer.submit(() -> {
                        sink.accept(task, finished);
                        written[0]++;
                        progress.finished(finished.verdict() == Verdict.FAIL, finished.verdict() == Verdict.ERROR);
                    });
                } catch (java.util.concurrent.RejectedExecutionException stoppedMeanwhile) {
                    // stop() closed the writer between the check above and here: not a result
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
