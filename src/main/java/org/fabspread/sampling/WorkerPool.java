package org.fabspread.sampling;

import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * The thread pools of the runner and the analyses: a fixed number of daemon workers named
 * {@code prefix-1, prefix-2, …} (daemons, so an abandoned run never keeps the program alive), and
 * the unwrapping of a failed task's cause.
 */
public final class WorkerPool {

    private WorkerPool() {
    }

    /** A fixed pool of {@code threads} daemon threads named {@code namePrefix + "-" + n}, n = 1, 2, …. */
    public static ExecutorService fixed(int threads, String namePrefix) {
        AtomicInteger names = new AtomicInteger();
        return Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, namePrefix + "-" + names.incrementAndGet());
            t.setDaemon(true);
            return t;
        });
    }

    /**
     * Rethrows the cause of a failed task when it is unchecked (a {@link RuntimeException} or an
     * {@link Error}, unchanged); returns a checked cause for the caller to wrap.
     */
    public static Throwable rethrowUnchecked(ExecutionException e) {
        Throwable cause = e.getCause();
        if (cause instanceof RuntimeException re) {
            throw re;
        }
        if (cause instanceof Error er) {
            throw er;
        }
        return cause;
    }
}
