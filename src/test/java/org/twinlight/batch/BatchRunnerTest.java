package org.twinlight.batch;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.FileTime;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicBoolean;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import org.twinlight.report.ResultSet;

/**
 * The runner's promises with units of work made for the test: an interrupted batch resumes
 * without redoing or losing finished targets and redoes a half-done one from scratch; failures
 * are recorded and the batch goes on; folders the batch did not make are left alone.
 */
class BatchRunnerTest {
    @TempDir
    Path dir;

    /** A crash of the whole process, as the unit of work sees it: nothing after it runs. */
    private static final class Halt extends Error {
        Halt() {
            super("simulated crash");
        }
    }

    private List<BatchTarget> targets(int n) throws IOException {
        Path in = Files.createDirectories(dir.resolve("in"));
        for (int i = 1; i <= n; i++) {
            Files.writeString(in.resolve(String.format("t%02d.csv", i)), "time,flux\n1,1\n");
        }
        return TargetDiscovery.fromFolder(in, dir.resolve("out"));
    }

    /** Writes result.txt (as a result set) naming the target and the run. */
    private static TargetResult writeResult(BatchTarget t, String run) {
        try (ResultSet set = ResultSet.open(t.outputDir(), "test")) {
            org.twinlight.report.AtomicFiles.writeString(set.file("result.txt"), t.id() + " " + run + "\n");
            set.commit();
        }
        return new TargetResult(0, "done in " + run, Map.of("period", new TargetResult.KeyValue(1.5, 0.01)),
                List.of("result.txt"), null);
    }

    @Test
    void aBatchStoppedMidwayResumesWithoutRedoingOrLosingFinishedTargetsAndRedoesTheHalfDoneOne() throws Exception {
        List<BatchTarget> targets = targets(6);
        Path out = dir.resolve("out");
        int crashAt = 3;
        AtomicBoolean halted = new AtomicBoolean();
        UnitOfWork crashing = t -> {
            if (halted.get()) {
                throw new Halt();
            }
            if (t.id().equals(targets.get(crashAt).id())) {
                // half of the work is on disk when the process dies
                writeQuietly(t.outputDir().resolve("partial.txt"), "half-written");
                halted.set(true);
                throw new Halt();
            }
            return writeResult(t, "first run");
        };
        assertThatThrownBy(() -> new BatchRunner(crashing, 1, false).run(targets, out, BatchRunner.Progress.NONE))
                .isInstanceOf(Error.class);
        Map<String, BatchJournal.Entry> journal = BatchJournal.read(out);
        assertThat(journal.keySet()).containsExactly("t01", "t02", "t03");
        Map<String, FileTime> times = new HashMap<>();
        Map<String, String> contents = new HashMap<>();
        for (String id : journal.keySet()) {
            Path f = out.resolve(id).resolve("result.txt");
            times.put(id, Files.getLastModifiedTime(f));
            contents.put(id, Files.readString(f));
        }
        assertThat(out.resolve("t04/partial.txt")).exists();
        Thread.sleep(20);

        Set<String> ranAgain = Collections.newSetFromMap(new ConcurrentHashMap<>());
        UnitOfWork healthy = t -> {
            ranAgain.add(t.id());
            assertThat(t.outputDir().resolve("partial.txt")).as("the half-done folder is cleared first").doesNotExist();
            return writeResult(t, "second run");
        };
        BatchRunner.Outcome o = new BatchRunner(healthy, 2, false).run(targets, out, BatchRunner.Progress.NONE);

        assertThat(ranAgain).containsExactlyInAnyOrder("t04", "t05", "t06");
        assertThat(o.ranNow()).isEqualTo(3);
        assertThat(o.fromBefore()).isEqualTo(3);
        assertThat(o.entries()).hasSize(6).allMatch(e -> e.result().ok());
        for (String id : journal.keySet()) {
            Path f = out.resolve(id).resolve("result.txt");
            assertThat(Files.getLastModifiedTime(f)).as(id).isEqualTo(times.get(id));
            assertThat(Files.readString(f)).as(id).isEqualTo(contents.get(id)).contains("first run");
        }
        assertThat(out.resolve("t04/partial.txt")).doesNotExist();
        assertThat(Files.readString(out.resolve("t04/result.txt"))).contains("second run");

        // a third run has nothing left to do
        BatchRunner.Outcome again = new BatchRunner(t -> {
            throw new AssertionError("nothing should run");
        }, 2, false).run(targets, out, BatchRunner.Progress.NONE);
        assertThat(again.ranNow()).isZero();
        assertThat(again.entries()).hasSize(6);
    }

    @Test
    void aFailingTargetIsRecordedWithItsExitCodeAndTheBatchGoesOn() throws Exception {
        List<BatchTarget> targets = targets(5);
        Path out = dir.resolve("out");
        UnitOfWork unit = t -> switch (t.id()) {
            case "t02" -> throw new BadInputException(t.files().get(0) + ": line 2, column 'flux': not a number");
            case "t03" -> throw new WorkFailedException("no significant eclipse period; give the period");
            case "t04" -> TargetResult.failed(1, "one eclipse only\nsecond line");
            case "t05" -> throw new IllegalStateException("a bug");
            default -> writeResult(t, "run");
        };
        BatchRunner.Outcome o = new BatchRunner(unit, 2, false).run(targets, out, BatchRunner.Progress.NONE);

        Map<String, TargetResult> byId = new HashMap<>();
        o.entries().forEach(e -> byId.put(e.id(), e.result()));
        assertThat(byId.get("t01").exitCode()).isZero();
        assertThat(byId.get("t02").exitCode()).isEqualTo(2);
        assertThat(byId.get("t02").message()).contains("t02.csv", "column 'flux'");
        assertThat(byId.get("t03").exitCode()).isEqualTo(1);
        assertThat(byId.get("t03").message()).contains("no significant eclipse period");
        assertThat(byId.get("t04").exitCode()).isEqualTo(1);
        assertThat(byId.get("t04").message()).isEqualTo("one eclipse only second line");
        assertThat(byId.get("t05").exitCode()).isEqualTo(1);
        assertThat(byId.get("t05").message()).startsWith("internal error").contains("a bug");
        assertThat(o.failed()).isEqualTo(4);

        // failures are finished targets: kept on a new run, run again only when asked
        List<String> ran = Collections.synchronizedList(new ArrayList<>());
        UnitOfWork fixed = t -> {
            ran.add(t.id());
            return writeResult(t, "retry");
        };
        assertThat(new BatchRunner(fixed, 2, false).run(targets, out, BatchRunner.Progress.NONE).failed())
                .isEqualTo(4);
        assertThat(ran).isEmpty();
        BatchRunner.Outcome retried = new BatchRunner(fixed, 2, true).run(targets, out, BatchRunner.Progress.NONE);
        assertThat(ran).containsExactlyInAnyOrder("t02", "t03", "t04", "t05");
        assertThat(retried.failed()).isZero();
    }

    @Test
    void aFolderTheBatchDidNotMakeIsNeverCleared() throws Exception {
        List<BatchTarget> targets = targets(2);
        Path out = dir.resolve("out");
        Path precious = Files.createDirectories(out.resolve("t01")).resolve("notes.txt");
        Files.writeString(precious, "my notes");
        BatchRunner.Outcome o = new BatchRunner(t -> writeResult(t, "run"), 1, false).run(targets, out,
                BatchRunner.Progress.NONE);
        assertThat(Files.readString(precious)).isEqualTo("my notes");
        assertThat(o.entries().get(0).result().exitCode()).isEqualTo(1);
        assertThat(o.entries().get(0).result().message()).contains("was not made by a batch");
        assertThat(o.entries().get(1).result().ok()).isTrue();
    }

    @Test
    void aTornLastLineOfTheJournalIsIgnoredAndTheNextLineStartsAfreshLine() throws Exception {
        List<BatchTarget> targets = targets(3);
        Path out = dir.resolve("out");
        new BatchRunner(t -> writeResult(t, "run"), 1, false).run(targets.subList(0, 1), out,
                BatchRunner.Progress.NONE);
        // a kill in the middle of writing the second target's line
        Files.writeString(out.resolve(BatchJournal.FILE_NAME), "{\"target\":\"t02\",\"fingerp",
                StandardCharsets.UTF_8, StandardOpenOption.APPEND);
        assertThat(BatchJournal.read(out).keySet()).containsExactly("t01");
        BatchRunner.Outcome o = new BatchRunner(t -> writeResult(t, "run"), 1, false).run(targets, out,
                BatchRunner.Progress.NONE);
        assertThat(o.ranNow()).isEqualTo(2);
        assertThat(BatchJournal.read(out).keySet()).containsExactly("t01", "t02", "t03");
    }

    @Test
    void aChangedTargetDescriptionIsRunAgain() throws Exception {
        List<BatchTarget> targets = targets(2);
        Path out = dir.resolve("out");
        new BatchRunner(t -> writeResult(t, "run"), 1, false).run(targets, out, BatchRunner.Progress.NONE);
        BatchTarget t1 = targets.get(0);
        BatchTarget changed = new BatchTarget(t1.id(), t1.label(), t1.files(), 2.5, null, null, List.of(), null, t1.outputDir(),
                t1.origin());
        List<String> ran = new ArrayList<>();
        new BatchRunner(t -> {
            ran.add(t.id());
            return writeResult(t, "again");
        }, 1, false).run(List.of(changed, targets.get(1)), out, BatchRunner.Progress.NONE);
        assertThat(ran).containsExactly("t01");
    }

    private static void writeQuietly(Path f, String text) {
        try {
            Files.writeString(f, text);
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }
}
