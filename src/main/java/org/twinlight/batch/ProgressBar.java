package org.twinlight.batch;

import java.io.PrintWriter;
import java.util.Locale;

/**
 * A one-line progress bar for a terminal: targets done out of the total, failures, and the time
 * left estimated from the pace of this run. Redrawn in place (carriage return) at most a few times
 * a second.
 */
public final class ProgressBar implements BatchRunner.Progress {
    private static final int BAR_WIDTH = 30;
    private static final long REDRAW_NANOS = 250_000_000L;

    private final PrintWriter out;
    private int total;
    private int done;
    private int failed;
    private int doneNow;
    private long startNanos;
    private long lastDraw;

    /** A bar drawn on {@code out} (standard error of a terminal). */
    public ProgressBar(PrintWriter out) {
        this.out = out;
    }

    @Override
    public synchronized void started(int total, int ok, int failed) {
        this.total = total;
        this.done = ok + failed;
        this.failed = failed;
        this.startNanos = System.nanoTime();
        draw(true);
    }

    @Override
    public synchronized void finished(BatchJournal.Entry entry) {
        done++;
        doneNow++;
        if (!entry.result().ok()) {
            failed++;
        }
        draw(done == total);
    }

    @Override
    public synchronized void ended() {
        draw(true);
        out.println();
        out.flush();
    }

    private void draw(boolean always) {
        long now = System.nanoTime();
        if (!always && now - lastDraw < REDRAW_NANOS) {
            return;
        }
        lastDraw = now;
        out.print("\r" + line((now - startNanos) * 1e-9));
        out.flush();
    }

    /** The bar's text after {@code elapsedSeconds} of this run. */
    String line(double elapsedSeconds) {
        int filled = total == 0 ? BAR_WIDTH : (int) ((long) BAR_WIDTH * done / total);
        String bar = "#".repeat(filled) + ".".repeat(BAR_WIDTH - filled);
        String left = doneNow == 0 ? "time left: estimating" : done >= total ? "done"
                : "time left ~" + duration(elapsedSeconds / doneNow * (total - done));
        return String.format(Locale.ROOT, "[%s] %d/%d done, %d failed, %s   ", bar, done, total, failed, left);
    }

    /** Seconds as "45 s", "12 min" or "3.4 h". */
    static String duration(double seconds) {
        if (seconds < 90) {
            return String.format(Locale.ROOT, "%.0f s", seconds);
        }
        if (seconds < 5400) {
            return String.format(Locale.ROOT, "%.0f min", seconds / 60);
        }
        return String.format(Locale.ROOT, "%.1f h", seconds / 3600);
    }
}
