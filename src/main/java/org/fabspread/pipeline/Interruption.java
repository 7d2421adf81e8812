package org.fabspread.pipeline;

import java.nio.file.Path;

/**
 * Tells the user, when the program is stopped (Ctrl-C, a termination signal) after the Monte Carlo run,
 * where the unfinished run is and how to continue it. The Monte Carlo run has its own hook, which leaves a
 * checkpoint; the later phases keep what they finished in the run's phase store as they go, so nothing but
 * the message is needed here.
 */
final class Interruption {

    private final Path work;
    private final Thread hook;
    private volatile String phase;
    private volatile boolean armed = true;

    private Interruption(Path work) {
        this.work = work;
        this.hook = new Thread(this::say, "fabspread-interrupted");
    }

    static Interruption install(Path work) {
        Interruption i = new Interruption(work);
        Runtime.getRuntime().addShutdownHook(i.hook);
        return i;
    }

    /** The phase now running (the message names it). */
    void phase(String what) {
        phase = what;
    }

    /** The run ended (finished, failed or handled its interruption): no message, hook removed. */
    void disarm() {
        armed = false;
        try {
            Runtime.getRuntime().removeShutdownHook(hook);
        } catch (IllegalStateException shuttingDown) {
            // the JVM is already exiting; the hook sees armed == false
        }
    }

    private void say() {
        if (armed && phase != null) {
            System.err.println("fabspread: interrupted during " + phase + "; the unfinished run is in " + work
                    + "; run again with --resume to finish");
            System.err.flush();
        }
    }
}
