package org.ringsweep.runner.batch;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.RejectedExecutionException;
import java.util.concurrent.Semaphore;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.AtomicReference;
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
 * <p><b>Bounded.</b> Tasks are taken from an iterator only as workers free up: at most
 * {@link #IN_FLIGHT_PER_WORKER} chunks per worker are queued, running or waiting for the writer
 * at any time, so a sweep of a million points holds a few dozen points in memory, never the
 * sweep. Once its records are handed to the sink a chunk is dropped; the runner keeps counters only.
 *
 * <p>{@link #stop()} (Ctrl-C) interrupts the workers, which ends their ngspice runs; records
 * of points cut short that way are discarded, never written, so a resumed run re-runs them.
 */
public final class BatchRunner {
    /** Chunks per worker that may be in flight (submitted, running or being written): one running, one ready. */
    public static final int IN_FLIGHT_PER_WORKER = 2;

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
        List<List<Task>> chunks = new ArrayList<>();
        new Chunker(tasks.iterator(), chunkSize(tasks.size(), jobs, batchSize)).forEachRemaining(chunks::add);
        return chunks;
    }

    /** The most tasks per chunk: the batch size, or an even share of {@code total} over the workers if smaller. */
    static int chunkSize(long total, int jobs, int batchSize) {
        return (int) Math.max(1, Math.min(batchSize, (total + jobs - 1) / jobs));
    }

    /** Cuts an iterator of tasks into chunks as they are asked for (one chunk read ahead at most). */
    private static final class Chunker implements Iterator<List<Task>> {
        private final Iterator<Task> tasks;
        private final int size;
        private Task next;

        Chunker(Iterator<Task> tasks, int size) {
            this.tasks = tasks;
            this.size = size;
            this.next = tasks.hasNext() ? tasks.next() : null;
        }

        @Override
        public boolean hasNext() {
            return next != null;
        }

        @Override
        public List<Task> next() {
            if (next == null) {
                throw new java.util.NoSuchElementException();
            }
            List<Task> chunk = new ArrayList<>(size);
            chunk.add(next);
            next = null;
            while (tasks.hasNext()) {
                Task t = tasks.next();
                if (chunk.size() == size || !chunk.get(0).net().equals(t.net())) {
                    next = t;
                    break;
                }
                chunk.add(t);
            }
            return List.copyOf(chunk);
        }
    }

    /**
     * Runs every task and waits for them.
     *
     * @return the number of records written
     */
    public long run(List<Task> tasks, Sink sink, Progress progress) throws InterruptedException {
        return run(tasks.iterator(), tasks.size(), sink, progress);
    }

    /**
     * Runs the tasks as the iterator yields them, never holding more than
     * {@link #IN_FLIGHT_PER_WORKER} chunks per worker, and waits for them.
     *
     * @param tasks the tasks in order; read on the calling thread only
     * @param total how many the iterator yields (for the even share of small sweeps; an estimate is safe)
     * @return the number of records written
     * @throws RuntimeException what the sink threw (e.g. the store could not be written); the run stops
     */
    public long run(Iterator<Task> tasks, long total, Sink sink, Progress progress) throws InterruptedException {
        workers = Executors.newFixedThreadPool(jobs, r -> {
            Thread t = new Thread(r, "ringsweep-worker");
            t.setDaemon(true);
            return t;
        });
        writer = Executors.newSingleThreadExecutor(r -> new Thread(r, "ringsweep-writer"));
        Semaphore slots = new Semaphore(jobs * IN_FLIGHT_PER_WORKER);
        AtomicReference<Throwable> failure = new AtomicReference<>();
        AtomicLong written = new AtomicLong();
        Chunker chunker = new Chunker(tasks, chunkSize(total, jobs, batchSize));
        try {
            while (!stopping.get() && failure.get() == null && chunker.hasNext()) {
                if (!slots.tryAcquire(100, TimeUnit.MILLISECONDS)) {
                    continue; // every slot busy: look at stop() and failures again
                }
                List<Task> chunk = chunker.next();
                try {
                    workers.submit(() -> work(chunk, sink, progress, slots, failure, written));
                } catch (RejectedExecutionException stoppedMeanwhile) {
                    slots.release();
                }
            }
        } finally {
            if (failure.get() != null) {
                stopping.set(true);
                workers.shutdownNow();
            } else {
                workers.shutdown();
            }
            workers.awaitTermination(Long.MAX_VALUE, TimeUnit.NANOSECONDS);
            writer.shutdown();
            writer.awaitTermination(1, TimeUnit.MINUTES);
        }
        Throwable f = failure.get();
        if (f instanceof RuntimeException e) {
            throw e;
        }
        if (f != null) {
            throw new IllegalStateException("a worker failed: " + f, f);
        }
        return written.get();
    }

    /** A worker's part: run the chunk, hand its records to the writer; the slot is freed once they are written. */
    private void work(List<Task> chunk, Sink sink, Progress progress, Semaphore slots, AtomicReference<Throwable> failure,
                      AtomicLong written) {
        boolean handed = false;
        try {
            if (stopping.get()) {
                return;
            }
            List<ResultRecord> records = runChunk(chunk);
            if (stopping.get() || Thread.currentThread().isInterrupted()) {
                return; // cut short by stop(): not results
            }
            writer.submit(() -> {
                try {
                    for (int i = 0; i < chunk.size(); i++) {
                        ResultRecord finished = records.get(i);
                        sink.accept(chunk.get(i), finished);
                        written.incrementAndGet();
                        progress.finished(finished.verdict() == Verdict.FAIL, finished.verdict() == Verdict.ERROR);
                    }
                } catch (RuntimeException | Error e) {
                    failure.compareAndSet(null, e);
                } finally {
                    slots.release();
                }
            });
            handed = true;
        } catch (RejectedExecutionException stoppedMeanwhile) {
            // stop() closed the writer between the check above and here: not results
        } catch (RuntimeException | Error e) {
            failure.compareAndSet(null, e);
        } finally {
            if (!handed) {
                slots.release();
            }
        }
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
