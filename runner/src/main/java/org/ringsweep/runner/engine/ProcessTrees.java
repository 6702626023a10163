package org.ringsweep.runner.engine;

import java.io.IOException;
import java.time.Duration;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.ReadWriteLock;
import java.util.concurrent.locks.ReentrantReadWriteLock;
import java.util.stream.Collectors;

/**
 * Keeps track of running engine processes so none outlives its run or the JVM: a timed-out run
 * kills its whole process tree, and a shutdown hook (Ctrl-C, normal exit) kills whatever is
 * still running. Thread-safe.
 */
final class ProcessTrees {
    /** How long a politely asked process gets before it is killed outright. */
    static final Duration GRACE = Duration.ofMillis(500);

    private static final Set<Process> RUNNING = ConcurrentHashMap.newKeySet();
    /** Starting and tracking happen under the read lock, so the hook (write lock) never misses a process. */
    private static final ReadWriteLock LOCK = new ReentrantReadWriteLock();
    private static volatile boolean stopping;

    static {
        try {
            Runtime.getRuntime().addShutdownHook(new Thread(ProcessTrees::killAll, "ringsweep-engine-cleanup"));
        } catch (IllegalStateException alreadyShuttingDown) {
            // Nothing to register: the JVM is exiting and kill() still handles the runs it times out.
        }
    }

    private ProcessTrees() {
    }

    /**
     * Starts a process and tracks it until {@link #release} or {@link #kill}; a shutdown that
     * begins meanwhile waits for this to finish and then kills it too.
     *
     * @return the process, or empty when the JVM is already shutting down (nothing was started)
     * @throws IOException when the program cannot be started
     */
    static Optional<Process> start(ProcessBuilder builder) throws IOException {
        LOCK.readLock().lock();
        try {
            if (stopping) {
                return Optional.empty();
            }
            Process process = builder.start();
            RUNNING.add(process);
            return Optional.of(process);
        } finally {
            LOCK.readLock().unlock();
        }
    }

    /** Stops tracking a process that has ended by itself. */
    static void release(Process process) {
        RUNNING.remove(process);
    }

    /** The number of tracked processes (for tests). */
    static int running() {
        return RUNNING.size();
    }

    /**
     * Kills a process and all its descendants: asks them to stop, waits {@link #GRACE}, then
     * kills what is left, and waits for the process to be gone.
     */
    static void kill(Process process) {
        // Snapshot descendants before the parent dies: orphans are re-parented and no longer listed.
        List<ProcessHandle> tree = process.descendants().collect(Collectors.toList());
        tree.forEach(ProcessHandle::destroy);
        process.destroy();
        try {
            if (!process.waitFor(GRACE.toMillis(), TimeUnit.MILLISECONDS)) {
                process.destroyForcibly();
            }
            tree.stream().filter(ProcessHandle::isAlive).forEach(ProcessHandle::destroyForcibly);
            process.waitFor(5, TimeUnit.SECONDS);
        } catch (InterruptedException e) {
            process.destroyForcibly();
            tree.forEach(ProcessHandle::destroyForcibly);
            Thread.currentThread().interrupt();
        } finally {
            RUNNING.remove(process);
        }
    }

    private static void killAll() {
        LOCK.writeLock().lock();
        try {
            stopping = true;
            for (Process p : List.copyOf(RUNNING)) {
                p.descendants().forEach(ProcessHandle::destroyForcibly);
                p.destroyForcibly();
            }
        } finally {
            LOCK.writeLock().unlock();
        }
    }
}
