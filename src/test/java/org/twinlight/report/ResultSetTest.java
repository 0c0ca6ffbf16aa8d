package org.twinlight.report;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.WorkFailedException;

/** A command's result files appear together or not at all, and one run at a time writes into a directory. */
class ResultSetTest {
    @TempDir
    Path dir;

    private void writeSet(Path out, String tag, String... names) {
        try (ResultSet set = ResultSet.open(out, "demo")) {
            for (String n : names) {
                AtomicFiles.writeString(set.file(n), tag);
            }
            set.commit();
        }
    }

    private static String read(Path p) throws IOException {
        return Files.readString(p, StandardCharsets.UTF_8);
    }

    private static List<String> visible(Path d) throws IOException {
        try (Stream<Path> s = Files.list(d)) {
            return s.map(p -> p.getFileName().toString()).filter(n -> !n.startsWith(".")).sorted().toList();
        }
    }

    private static List<String> hidden(Path d) throws IOException {
        try (Stream<Path> s = Files.list(d)) {
            return s.map(p -> p.getFileName().toString()).filter(n -> n.startsWith(".")).sorted().toList();
        }
    }

    @Test
    void aCommittedSetReplacesThePreviousOneWhole() throws Exception {
        Path out = dir.resolve("results");
        writeSet(out, "one", "a.json", "a.png", "a-V.png");
        writeSet(out, "two", "a.json", "a.png");
        assertThat(visible(out)).containsExactly("a.json", "a.png");
        assertThat(read(out.resolve("a.json"))).isEqualTo("two");
        assertThat(read(out.resolve("a.png"))).isEqualTo("two");
        // only the lock and this command's list of files stay hidden in the directory
        assertThat(hidden(out)).containsExactlyInAnyOrder(ResultSet.LOCK_NAME, ".twinlight-demo.files");
    }

    @Test
    void filesTheUserKeptInTheDirectoryAreLeftAlone() throws Exception {
        Path out = Files.createDirectories(dir.resolve("results"));
        Files.writeString(out.resolve("notes.txt"), "mine");
        writeSet(out, "one", "a.json");
        writeSet(out, "two", "b.json");
        assertThat(visible(out)).containsExactly("b.json", "notes.txt");
    }

    @Test
    void aFailureMidSetLeavesThePreviousSetAndNoTemporaries() throws Exception {
        Path out = dir.resolve("results");
        writeSet(out, "old", "a.json", "a.png");
        assertThatThrownBy(() -> {
            try (ResultSet set = ResultSet.open(out, "demo")) {
                AtomicFiles.writeString(set.file("a.json"), "new");
                // the second file fails as on a full disk
                AtomicFiles.write(set.file("a.png"), o -> {
                    o.write(new byte[100]);
                    throw new IOException("No space left on device");
                });
                set.commit();
            }
        }).isInstanceOf(UncheckedIOException.class).hasMessageContaining("No space left on device");
        assertThat(read(out.resolve("a.json"))).isEqualTo("old");
        assertThat(read(out.resolve("a.png"))).isEqualTo("old");
        assertThat(hidden(out)).noneMatch(n -> n.startsWith(ResultSet.TEMP_PREFIX) || n.endsWith(".part"));
    }

    @Test
    void aFileNamedButNotWrittenStopsTheCommit() throws Exception {
        Path out = dir.resolve("results");
        writeSet(out, "old", "a.json", "a.png");
        try (ResultSet set = ResultSet.open(out, "demo")) {
            AtomicFiles.writeString(set.file("a.json"), "new");
            set.file("a.png");
            assertThatThrownBy(set::commit).isInstanceOf(WorkFailedException.class).hasMessageContaining("a.png");
        }
        assertThat(read(out.resolve("a.json"))).isEqualTo("old");
    }

    @Test
    void staleTemporariesOfAKilledRunAreRemovedByTheNextRun() throws Exception {
        Path out = dir.resolve("results");
        writeSet(out, "old", "a.json", "a.png");
        // what a run killed while writing leaves: a temporary set and a part file of the older writer
        Path killed = Files.createDirectory(out.resolve(ResultSet.TEMP_PREFIX + "123"));
        Files.writeString(killed.resolve("a.json"), "half");
        Files.writeString(out.resolve(".a.png.456.part"), "half");
        writeSet(out, "new", "a.json", "a.png");
        assertThat(hidden(out)).containsExactlyInAnyOrder(ResultSet.LOCK_NAME, ".twinlight-demo.files");
        assertThat(read(out.resolve("a.json"))).isEqualTo("new");
    }

    @Test
    void aSetKilledWhileBeingMovedIsCompletedByTheNextRun() throws Exception {
        Path out = dir.resolve("results");
        writeSet(out, "old", "a.json", "a.png");
        // killed after a.json was moved into place: a.png of the new set is still in the temporary
        Path killed = Files.createDirectory(out.resolve(ResultSet.TEMP_PREFIX + "789"));
        Files.writeString(killed.resolve(".command"), "demo");
        Files.write(killed.resolve(".commit"), List.of("a.json", "a.png"));
        Files.writeString(out.resolve("a.json"), "new");
        Files.writeString(killed.resolve("a.png"), "new");
        // the next run, of another command, first finishes the interrupted set
        try (ResultSet set = ResultSet.open(out, "other")) {
            assertThat(read(out.resolve("a.png"))).isEqualTo("new");
        }
        assertThat(read(out.resolve("a.json"))).isEqualTo("new");
        assertThat(hidden(out)).noneMatch(n -> n.startsWith(ResultSet.TEMP_PREFIX));
    }

    @Test
    void aSecondRunWaitsForTheLockAndRefusesWhenItIsNotFreed() throws Exception {
        Path out = dir.resolve("results");
        try (ResultSet first = ResultSet.open(out, "demo")) {
            long t0 = System.nanoTime();
            assertThatThrownBy(() -> ResultSet.open(out, "demo", 300)).isInstanceOf(WorkFailedException.class)
                    .hasMessageContaining("another twinlight run is writing results into")
                    .hasMessageContaining("choose another --out");
            assertThat((System.nanoTime() - t0) / 1e6).isGreaterThanOrEqualTo(300);
        }
        // freed: the next run goes ahead
        writeSet(out, "after", "a.json");
        assertThat(read(out.resolve("a.json"))).isEqualTo("after");
    }

    @Test
    void concurrentRunsNeverMixTheirFiles() throws Exception {
        Path out = dir.resolve("results");
        int runs = 8;
        ExecutorService pool = Executors.newFixedThreadPool(4);
        CountDownLatch start = new CountDownLatch(1);
        try {
            for (int round = 0; round < 5; round++) {
                List<Future<?>> done = new ArrayList<>();
                for (int k = 0; k < runs; k++) {
                    String tag = "run" + round + "-" + k;
                    done.add(pool.submit(() -> {
                        start.await();
                        writeSet(out, tag, "a.json", "b.csv", "c.png");
                        return null;
                    }));
                }
                start.countDown();
                for (Future<?> f : done) {
                    f.get();
                }
                String a = read(out.resolve("a.json"));
                assertThat(read(out.resolve("b.csv"))).isEqualTo(a);
                assertThat(read(out.resolve("c.png"))).isEqualTo(a);
                assertThat(hidden(out)).noneMatch(n -> n.startsWith(ResultSet.TEMP_PREFIX));
            }
        } finally {
            pool.shutdownNow();
        }
    }

    @Test
    void anOutputDirectoryThatCannotBeCreatedSaysWhy() throws Exception {
        Path file = Files.writeString(dir.resolve("plain.txt"), "x");
        assertThatThrownBy(() -> ResultSet.open(file.resolve("sub"), "demo")).isInstanceOf(WorkFailedException.class)
                .hasMessageContaining("cannot create the output directory").hasMessageNotContaining("Exception");
    }

    @Test
    void writeFailuresSayWhyInWords() {
        assertThat(AtomicFiles.reason(new java.nio.file.AccessDeniedException("/data/out/fit.json")))
                .isEqualTo("permission denied (/data/out/fit.json)");
        assertThat(AtomicFiles.reason(new java.nio.file.FileSystemException("/data/out", null,
                "No space left on device"))).isEqualTo("No space left on device (/data/out)");
        assertThat(AtomicFiles.reason(new IOException())).isEqualTo("an input/output error");
    }
}
