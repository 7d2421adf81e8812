package org.fabspread.sampling;

import java.io.PrintStream;

/**
 * A one-line progress bar (samples done, rate, time left) redrawn at most four times a second.
 * Only for people at a terminal: {@link #forConsole()} gives none when there is no console or the
 * {@code CI} environment variable is set.
 */
public final class Progress implements Runner.Listener {

    private final PrintStream out;
    private final long total;
    private final long start = System.nanoTime();
    private long startSamples = -1;
    private long last;
    private boolean drawn;

    public Progress(PrintStream out, long total) {
        this.out = out;
        this.total = total;
    }

    /** A bar on stderr when a person is watching, else null. */
    public static Progress forConsole(long total) {
        return System.console() != null && System.getenv("CI") == null ? new Progress(System.err, total) : null;
    }

    @Override
    public void chunkDone(long chunksDone, long samplesDone) {
        long now = System.nanoTime();
        if (startSamples < 0) {
            startSamples = samplesDone;
        }
        if (now - last < 250_000_000L && samplesDone < total) {
            return;
        }
        last = now;
        out.print("\r" + line(samplesDone, (now - start) * 1e-9));
        out.flush();
        drawn = true;
    }

    String line(long done, double seconds) {
        double rate = seconds > 0 ? (done - Math.max(0, startSamples)) / seconds : 0;
        String eta = rate > 0 ? clock((total - done) / rate) : "--:--";
        return String.format("%d/%d samples (%.1f%%)  %.0f/s  %s left   ", done, total, 100.0 * done / total, rate, eta);
    }

    static String clock(double seconds) {
        long s = Math.round(seconds);
        return s >= 3600 ? String.format("%d:%02d:%02d", s / 3600, s / 60 % 60, s % 60) : String.format("%d:%02d", s / 60, s % 60);
    }

    /** Ends the line. */
    public void finish() {
        if (drawn) {
            out.println();
            out.flush();
        }
    }
}
