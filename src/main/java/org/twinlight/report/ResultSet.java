package org.twinlight.report;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.channels.OverlappingFileLockException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;
import org.twinlight.WorkFailedException;

/**
 * The files one command writes into its output directory, written as a set: every file goes into
 * a fresh hidden temporary directory inside the output directory, and only when all of them are
 * written are they moved into place. A run that fails part-way (a full disk, a write error, an
 * exception, a kill) leaves the previous complete set untouched.
 *
 * <p>A lock file ({@value #LOCK_NAME}) in the output directory keeps two runs from writing into
 * the same directory at once. The lock is taken when the writing starts (after the computation) and
 * held only while the set is written, so a second run normally waits a moment and then writes its
 * own whole set over the first; if the lock is still held after {@link #DEFAULT_WAIT_MILLIS} ms it
 * refuses with a {@link WorkFailedException} (exit 1, not 2: nothing is wrong with its input, and
 * the same command succeeds once the other run has finished). The operating system drops the lock when a
 * process dies, so a killed run never blocks the next one.
 *
 * <p>Once the lock is held, temporaries left by a killed run are removed; a set whose moving had
 * begun when the run was killed (its directory holds the commit list) is moved into place first, so
 * the directory ends with one whole set. Files of this command's previous set that the new set
 * does not contain (e.g. the plot of a band no longer fitted) are removed, so no file of an older
 * run stays beside a newer set.
 *
 * <pre>{@code
 * try (ResultSet set = ResultSet.open(outDir, "period")) {
 *     PeriodResultJson.write(set.file("period.json"), ...);
 *     PeriodogramPlot.write(set.file("periodogram.png"), ...);
 *     set.commit();
 * }
 * }</pre>
 */
public final class ResultSet implements AutoCloseable {
    /** Name of the lock file kept in the output directory. */
    public static final String LOCK_NAME = ".twinlight.lock";
    /** Prefix of the temporary directories of unfinished sets. */
    public static final String TEMP_PREFIX = ".twinlight-set-";
    /** How long a run waits for another run's lock on the same directory before refusing. */
    public static final long DEFAULT_WAIT_MILLIS = 20_000;

    private static final String COMMIT_LIST = ".commit";
    private static final String COMMAND_FILE = ".command";
    private static final String MANIFEST_PREFIX = ".twinlight-";
    private static final String MANIFEST_SUFFIX = ".files";

    private final Path directory;
    private final String command;
    private final FileChannel lockChannel;
    private final FileLock lock;
    private final Path temporary;
    private final Set<String> names = new LinkedHashSet<>();
    private boolean committed;

    private ResultSet(Path directory, String command, FileChannel lockChannel, FileLock lock, Path temporary) {
        this.directory = directory;
        this.command = command;
        this.lockChannel = lockChannel;
        this.lock = lock;
        this.temporary = temporary;
    }

    /** Opens a set for {@code command} in {@code directory}, waiting up to the default time for the lock. */
    public static ResultSet open(Path directory, String command) {
        return open(directory, command, DEFAULT_WAIT_MILLIS);
    }

    /**
     * Opens a set: creates {@code directory} if missing, takes its lock (waiting up to
     * {@code waitMillis}), cleans up after killed runs and makes a fresh temporary directory.
     *
     * @throws WorkFailedException when the directory cannot be created or written, or another run holds the lock
     */
    public static ResultSet open(Path directory, String command, long waitMillis) {
        Path dir = directory.toAbsolutePath().normalize();
        try {
            Files.createDirectories(dir);
        } catch (IOException e) {
            throw new WorkFailedException("cannot create the output directory " + directory + ": " + AtomicFiles.reason(e)
                    + "; choose another --out");
        }
        FileChannel channel;
        try {
            channel = FileChannel.open(dir.resolve(LOCK_NAME), StandardOpenOption.CREATE, StandardOpenOption.WRITE);
        } catch (IOException e) {
            throw new WorkFailedException("cannot write into the output directory " + directory + ": " + AtomicFiles.reason(e)
                    + "; choose another --out");
        }
        FileLock lock = null;
        try {
            long deadline = System.nanoTime() + waitMillis * 1_000_000L;
            while (lock == null) {
                lock = tryLock(channel);
                if (lock == null) {
                    if (System.nanoTime() > deadline) {
                        throw new WorkFailedException("another twinlight run is writing results into " + directory
                                + " (it holds " + LOCK_NAME + "); wait until it has finished, or choose another --out");
                    }
                    Thread.sleep(50);
                }
            }
            recover(dir);
            Path tmp = Files.createTempDirectory(dir, TEMP_PREFIX);
            Files.writeString(tmp.resolve(COMMAND_FILE), command, StandardCharsets.UTF_8);
            return new ResultSet(dir, command, channel, lock, tmp);
        } catch (IOException e) {
            release(channel, lock);
            throw new WorkFailedException("cannot write into the output directory " + directory + ": " + AtomicFiles.reason(e)
                    + "; choose another --out");
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            release(channel, lock);
            throw new WorkFailedException("interrupted while waiting for the lock on " + directory);
        } catch (RuntimeException e) {
            release(channel, lock);
            throw e;
        }
    }

    private static FileLock tryLock(FileChannel channel) throws IOException {
        try {
            return channel.tryLock();
        } catch (OverlappingFileLockException e) {
            // held by another run inside this same Java process
            return null;
        }
    }

    /**
     * Where to write the result file {@code name} of this set (inside the temporary directory);
     * after {@link #commit()} it is at {@code directory/name}.
     */
    public Path file(String name) {
        if (committed) {
            throw new IllegalStateException("the result set in " + directory + " is already committed");
        }
        if (name.isEmpty() || name.contains("/") || name.contains("\\") || name.startsWith(".")) {
            throw new IllegalArgumentException("not a plain result file name: '" + name + "'");
        }
        names.add(name);
        return temporary.resolve(name);
    }

    /** The output directory (absolute). */
    public Path directory() {
        return directory;
    }

    /**
     * Moves every written file into place and removes files of this command's previous set that
     * the new set does not contain.
     *
     * @throws WorkFailedException when a file of the set was not written or cannot be moved
     */
    public void commit() {
        try {
            List<String> written = new ArrayList<>();
            for (String n : names) {
                if (!Files.isRegularFile(temporary.resolve(n))) {
                    throw new WorkFailedException("the result file " + n + " was not written; nothing in "
                            + directory + " was changed");
                }
                written.add(n);
            }
            // the commit list marks the set as complete: a run killed from here on is finished by the next one
            Files.write(temporary.resolve(COMMIT_LIST), written, StandardCharsets.UTF_8);
            finish(directory, temporary, command);
            committed = true;
        } catch (IOException e) {
            throw new WorkFailedException("cannot move the results into " + directory + ": " + AtomicFiles.reason(e));
        }
    }

    /** Removes the temporary directory of an uncommitted set and releases the lock. */
    @Override
    public void close() {
        try {
            if (!committed) {
                deleteTree(temporary);
            }
        } catch (IOException e) {
            // left for the next run to clean up
        } finally {
            release(lockChannel, lock);
        }
    }

    /** Moves a complete set from {@code tmp} into {@code dir}, updates the manifest, removes {@code tmp}. */
    private static void finish(Path dir, Path tmp, String command) throws IOException {
        List<String> set = Files.readAllLines(tmp.resolve(COMMIT_LIST), StandardCharsets.UTF_8);
        Path manifest = dir.resolve(MANIFEST_PREFIX + command + MANIFEST_SUFFIX);
        for (String n : set) {
            Path from = tmp.resolve(n);
            if (Files.exists(from)) {
                move(from, dir.resolve(n));
            }
        }
        if (Files.isRegularFile(manifest)) {
            for (String old : Files.readAllLines(manifest, StandardCharsets.UTF_8)) {
                if (!old.isBlank() && !set.contains(old) && isPlainName(old)) {
                    Files.deleteIfExists(dir.resolve(old));
                }
            }
        }
        AtomicFiles.writeString(manifest, String.join("\n", set) + "\n");
        deleteTree(tmp);
    }

    private static boolean isPlainName(String n) {
        return !n.startsWith(".") && !n.contains("/") && !n.contains("\\");
    }

    private static void move(Path from, Path to) throws IOException {
        try {
            Files.move(from, to, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(from, to, StandardCopyOption.REPLACE_EXISTING);
        }
    }

    /**
     * Cleans up after killed runs (the lock is held): finishes sets that were being moved into
     * place, removes unfinished temporaries and the hidden part files of interrupted writes.
     */
    private static void recover(Path dir) throws IOException {
        List<Path> stale = new ArrayList<>();
        try (DirectoryStream<Path> entries = Files.newDirectoryStream(dir)) {
            for (Path p : entries) {
                String n = p.getFileName().toString();
                if ((n.startsWith(TEMP_PREFIX) && Files.isDirectory(p))
                        || (n.startsWith(".") && n.endsWith(".part") && Files.isRegularFile(p))) {
                    stale.add(p);
                }
            }
        }
        for (Path p : stale) {
            if (Files.isDirectory(p) && Files.isRegularFile(p.resolve(COMMIT_LIST))) {
                String command = commandOfTemporary(p);
                if (command != null) {
                    finish(dir, p, command);
                    continue;
                }
            }
            deleteTree(p);
        }
    }

    /** The command whose set a temporary holds, from the commit list's companion file. */
    private static String commandOfTemporary(Path tmp) throws IOException {
        Path owner = tmp.resolve(COMMAND_FILE);
        return Files.isRegularFile(owner) ? Files.readString(owner, StandardCharsets.UTF_8).trim() : null;
    }

    private static void deleteTree(Path root) throws IOException {
        if (!Files.exists(root)) {
            return;
        }
        try (Stream<Path> walk = Files.walk(root)) {
            List<Path> all = walk.sorted((a, b) -> b.getNameCount() - a.getNameCount()).toList();
            for (Path p : all) {
                Files.deleteIfExists(p);
            }
        }
    }

    private static void release(FileChannel channel, FileLock lock) {
        try {
            if (lock != null && lock.isValid()) {
                lock.release();
            }
            channel.close();
        } catch (IOException e) {
            // closing the channel drops the lock in any case
        }
    }
}
