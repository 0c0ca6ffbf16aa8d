package org.twinlight.batch;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.report.AtomicFiles;

/**
 * Runs a unit of work over the targets of a batch on a number of threads, one target at a time
 * per thread, and records each finished target in the {@link BatchJournal}.
 *
 * <p>Resuming: a target whose journal line is there (with the same description) is not run again;
 * every other target is run from scratch, its output folder first cleared of whatever a killed run
 * left in it. A target's folder is cleared only when it carries the batch's marker file
 * ({@value #MARKER}), so a folder the batch did not make is never deleted. A target that fails
 * (an exception, or exit code 1 or 2) is recorded with its exit code and message, and the batch
 * goes on; failed targets are run again only when asked ({@code retryFailed}).
 */
public final class BatchRunner {
    /** The file that marks a folder as a target folder made by a batch. */
    public static final String MARKER = ".twinlight-batch-target";
    /** The lock file that keeps two batches from running into the same folder. */
    public static final String LOCK_NAME = ".twinlight-batch.lock";
    /** Width of the pictures shown in the index, pixels. */
    static final int THUMBNAIL_WIDTH = 360;
    /** Name of the reduced picture written beside the unit's files. */
    static final String THUMBNAIL_NAME = "index-thumbnail.png";
    /** Longest message kept per target. */
    private static final int MAX_MESSAGE = 2000;

    /** What the runner reports while it works (e.g. a progress bar); called from the worker threads. */
    public interface Progress {
        /** The batch starts: {@code total} targets, of which {@code ok} and {@code failed} finished in earlier runs. */
        void started(int total, int ok, int failed);

        /** One target finished (its journal line is written). */
        void finished(BatchJournal.Entry entry);

        /** Every target has finished. */
        void ended();

        /** Reports nothing. */
        Progress NONE = new Progress() {
            @Override
            public void started(int total, int ok, int failed) {
            }

            @Override
            public void finished(BatchJournal.Entry entry) {
            }

            @Override
            public void ended() {
            }
        };
    }

    /**
     * What a batch run did.
     *
     * @param entries the journal's entry of every target of the batch, in the targets' order
     * @param ranNow how many targets ran in this run
     * @param fromBefore how many were taken from the journal of earlier runs
     */
    public record Outcome(List<BatchJournal.Entry> entries, int ranNow, int fromBefore) {
        /** Targets that succeeded. */
        public long ok() {
            return entries.stream().filter(e -> e.result().ok()).count();
        }

        /** Targets that failed. */
        public long failed() {
            return entries.size() - ok();
        }
    }

    private final UnitOfWork unit;
    private final int threads;
    private final boolean retryFailed;

    /**
     * @param unit the work done per target
     * @param threads how many targets run at once (≥ 1)
     * @param retryFailed whether targets recorded as failed by an earlier run are run again
     */
    public BatchRunner(UnitOfWork unit, int threads, boolean retryFailed) {
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1, got " + threads);
        }
        this.unit = unit;
        this.threads = threads;
        this.retryFailed = retryFailed;
    }

    /**
     * Runs every target not finished yet, writing the journal into {@code batchDir}.
     *
     * @throws WorkFailedException when another batch runs into {@code batchDir}, or the journal cannot be written
     */
    public Outcome run(List<BatchTarget> targets, Path batchDir, Progress progress) {
        try (FileChannel lockChannel = lockChannel(batchDir); FileLock lock = lock(lockChannel, batchDir);
                BatchJournal journal = BatchJournal.open(batchDir)) {
            Map<String, BatchJournal.Entry> before = BatchJournal.read(batchDir);
            List<BatchTarget> pending = new ArrayList<>();
            int okBefore = 0;
            int failedBefore = 0;
            for (BatchTarget t : targets) {
                BatchJournal.Entry e = before.get(t.id());
                if (isDone(e, t)) {
                    okBefore += e.result().ok() ? 1 : 0;
                    failedBefore += e.result().ok() ? 0 : 1;
                } else {
                    pending.add(t);
                }
            }
            progress.started(targets.size(), okBefore, failedBefore);
            runAll(pending, journal, progress);
            progress.ended();
            Map<String, BatchJournal.Entry> after = BatchJournal.read(batchDir);
            List<BatchJournal.Entry> entries = targets.stream().map(t -> after.get(t.id()))
                    .filter(java.util.Objects::nonNull).toList();
            return new Outcome(entries, pending.size(), targets.size() - pending.size());
        } catch (IOException e) {
            throw new WorkFailedException("cannot use the batch folder " + batchDir + ": " + AtomicFiles.reason(e));
        }
    }

    /** Whether the journal's entry finishes the target for this run. */
    private boolean isDone(BatchJournal.Entry e, BatchTarget t) {
        return e != null && e.fingerprint().equals(t.fingerprint()) && (e.result().ok() || !retryFailed);
    }

    private void runAll(List<BatchTarget> pending, BatchJournal journal, Progress progress) {
        if (pending.isEmpty()) {
            return;
        }
        ExecutorService pool = Executors.newFixedThreadPool(Math.min(threads, pending.size()), r -> {
            Thread th = new Thread(r, "batch-worker");
            th.setDaemon(true);
            return th;
        });
        try {
            List<Future<?>> futures = new ArrayList<>();
            for (BatchTarget t : pending) {
                futures.add(pool.submit(() -> {
                    BatchJournal.Entry e = runOne(t);
                    journal.append(e);
                    progress.finished(e);
                }));
            }
            for (Future<?> f : futures) {
                f.get();
            }
        } catch (ExecutionException e) {
            Throwable c = e.getCause();
            if (c instanceof Error err) {
                throw err;
            }
            throw c instanceof RuntimeException r ? r : new WorkFailedException("the batch stopped: " + c);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new WorkFailedException("the batch was interrupted; run it again to resume");
        } finally {
            pool.shutdownNow();
        }
    }

    /** Runs one target from a clean folder; every failure becomes a recorded result. */
    BatchJournal.Entry runOne(BatchTarget t) {
        long start = System.nanoTime();
        TargetResult r;
        try {
            prepareFolder(t);
            r = unit.run(t);
            if (r == null) {
                r = TargetResult.failed(1, "internal error: the analysis returned no result");
            }
        } catch (BadInputException e) {
            r = TargetResult.failed(2, "error: " + e.getMessage());
        } catch (WorkFailedException | UncheckedIOException e) {
            r = TargetResult.failed(1, "failed: " + e.getMessage());
        } catch (OutOfMemoryError e) {
            r = TargetResult.failed(1, "failed: out of memory; give Java more memory with -Xmx, or run fewer "
                    + "--threads so that each target has more");
        } catch (RuntimeException | StackOverflowError e) {
            r = TargetResult.failed(1, "internal error: " + e);
        }
        r = withThumbnail(t, oneLine(r));
        return new BatchJournal.Entry(t.id(), t.fingerprint(), r, (System.nanoTime() - start) * 1e-9);
    }

    /** The result with its message on one line and not too long (it goes into CSV and HTML cells). */
    private static TargetResult oneLine(TargetResult r) {
        String m = r.message().replaceAll("[\\r\\n\\t\\u2028\\u2029]+", " ").strip();
        if (m.length() > MAX_MESSAGE) {
            m = m.substring(0, MAX_MESSAGE) + " ...";
        }
        return new TargetResult(r.exitCode(), m, r.keyResults(), r.files(), r.thumbnail());
    }

    /** The result with a reduced copy of its picture for the index (none when it cannot be made). */
    private static TargetResult withThumbnail(BatchTarget t, TargetResult r) {
        if (r.thumbnail() == null) {
            return r;
        }
        Path picture = t.outputDir().resolve(r.thumbnail()).normalize();
        if (!picture.startsWith(t.outputDir()) || !Files.isRegularFile(picture)) {
            return new TargetResult(r.exitCode(), r.message(), r.keyResults(), r.files(), null);
        }
        boolean reduced = Thumbnails.reduce(picture, t.outputDir().resolve(THUMBNAIL_NAME), THUMBNAIL_WIDTH);
        return new TargetResult(r.exitCode(), r.message(), r.keyResults(), r.files(),
                reduced ? THUMBNAIL_NAME : r.thumbnail());
    }

    /**
     * Makes the target's folder empty and marked: a folder left by a killed run (it has the marker)
     * is cleared; a folder the batch did not make must be empty.
     */
    static void prepareFolder(BatchTarget t) {
        Path dir = t.outputDir();
        try {
            if (Files.isDirectory(dir)) {
                if (Files.exists(dir.resolve(MARKER))) {
                    clear(dir);
                } else if (!isEmpty(dir)) {
                    throw new WorkFailedException("the output folder " + dir + " exists and was not made by a batch; "
                            + "nothing in it was changed. Move it away, or choose another --out");
                }
            } else if (Files.exists(dir)) {
                throw new WorkFailedException("a file " + dir + " is where the target's output folder belongs; "
                        + "move it away, or choose another --out");
            }
            Files.createDirectories(dir);
            Files.writeString(dir.resolve(MARKER), t.fingerprint() + "\n");
        } catch (IOException e) {
            throw new WorkFailedException("cannot prepare the output folder " + dir + ": " + AtomicFiles.reason(e));
        }
    }

    private static boolean isEmpty(Path dir) throws IOException {
        try (DirectoryStream<Path> s = Files.newDirectoryStream(dir)) {
            return !s.iterator().hasNext();
        }
    }

    /** Deletes everything inside {@code dir} except the marker (kept until the folder is marked again). */
    private static void clear(Path dir) throws IOException {
        try (Stream<Path> walk = Files.walk(dir)) {
            List<Path> all = walk.sorted((a, b) -> b.getNameCount() - a.getNameCount()).toList();
            for (Path p : all) {
                if (!p.equals(dir) && !p.equals(dir.resolve(MARKER))) {
                    Files.deleteIfExists(p);
                }
            }
        }
    }

    private static FileChannel lockChannel(Path batchDir) {
        try {
            Files.createDirectories(batchDir);
            return FileChannel.open(batchDir.resolve(LOCK_NAME), StandardOpenOption.CREATE, StandardOpenOption.WRITE);
        } catch (IOException e) {
            throw new WorkFailedException("cannot write into the batch folder " + batchDir + ": "
                    + AtomicFiles.reason(e) + "; choose another --out");
        }
    }

    private static FileLock lock(FileChannel channel, Path batchDir) throws IOException {
        FileLock lock;
        try {
            lock = channel.tryLock();
        } catch (OverlappingFileLockException e) {
            lock = null;
        }
        if (lock == null) {
            throw new WorkFailedException("another batch is running into " + batchDir + " (it holds " + LOCK_NAME
                    + "); wait until it has finished, or choose another --out");
        }
        return lock;
    }
}
