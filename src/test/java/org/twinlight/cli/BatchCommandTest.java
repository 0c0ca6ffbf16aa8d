package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.Test;
import org.twinlight.batch.BatchJournal;
import org.twinlight.batch.SyntheticTargets;

/**
 * The batch command as a user meets it: a real batch process killed with SIGKILL in the middle
 * and started again loses and redoes nothing finished; a damaged light curve fails its own target
 * only; a bad manifest is refused before anything runs.
 */
class BatchCommandTest extends CommandTestSupport {

    private Path syntheticFolder(int n) throws Exception {
        Path in = Files.createDirectories(dir.resolve("in"));
        // periods 1.17 to 1.86 d: shorter ones leave too few points per eclipse at this cadence for a timing
        for (int k = 2; k < n + 2; k++) {
            SyntheticTargets.write(in, String.format("sys-%02d", k), k, 8, 10);
        }
        return in;
    }

    private static List<CSVRecord> summary(Path out) throws Exception {
        return CSVFormat.DEFAULT.builder().setCommentMarker('#').setHeader().setSkipHeaderRecord(true).get()
                .parse(new StringReader(Files.readString(out.resolve("summary.csv")))).getRecords();
    }

    @Test
    void aBatchKilledWithSigkillResumesWithoutLosingOrRedoingFinishedTargets() throws Exception {
        int n = 6;
        Path in = syntheticFolder(n);
        Path out = dir.resolve("out");
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Process p = new ProcessBuilder(List.of(java, "-cp", System.getProperty("java.class.path"),
                TwinlightCommand.class.getName(), "batch", in.toString(), "--out", out.toString(), "--threads", "2"))
                .redirectErrorStream(true).redirectOutput(dir.resolve("first-run.txt").toFile()).start();
        Path journal = out.resolve(BatchJournal.FILE_NAME);
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (lines(journal) < 2 && p.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(20);
        }
        p.destroyForcibly();
        assertThat(p.waitFor(30, TimeUnit.SECONDS)).isTrue();
        Map<String, BatchJournal.Entry> before = BatchJournal.read(out);
        assertThat(before.size()).as("killed in the middle of the batch").isBetween(1, n - 1);
        Map<String, FileTime> times = new HashMap<>();
        Map<String, byte[]> fits = new HashMap<>();
        for (String id : before.keySet()) {
            for (String f : before.get(id).result().files()) {
                times.put(id + "/" + f, Files.getLastModifiedTime(out.resolve(id).resolve(f)));
                fits.put(id + "/" + f, Files.readAllBytes(out.resolve(id).resolve(f)));
            }
        }
        assertThat(times).isNotEmpty();

        int code = console.run("batch", in.toString(), "--out", out.toString(), "--threads", "2");

        assertThat(code).as(err.toString()).isZero();
        assertThat(out.toString()).isNotEmpty();
        assertThat(this.out.toString()).contains(n + " targets, " + n + " ok, 0 failed",
                "kept from an earlier run");
        for (String f : times.keySet()) {
            assertThat(Files.getLastModifiedTime(out.resolve(f))).as(f).isEqualTo(times.get(f));
            assertThat(Files.readAllBytes(out.resolve(f))).as(f).isEqualTo(fits.get(f));
        }
        List<CSVRecord> rows = summary(out);
        assertThat(rows).hasSize(n);
        for (CSVRecord r : rows) {
            int k = Integer.parseInt(r.get("target").substring(4, 6));
            // the simulator's period, recovered within a few 1e-4 d from 8 days of data (injected truth)
            assertThat(Double.parseDouble(r.get("period"))).as(r.get("target"))
                    .isCloseTo(SyntheticTargets.model(k).periodDays(), org.assertj.core.data.Offset.offset(5e-4));
            assertThat(r.get("status")).isEqualTo("ok");
        }
        try (Stream<Path> all = Files.walk(out)) {
            assertThat(all.map(x -> x.getFileName().toString()))
                    .noneMatch(name -> name.startsWith(".twinlight-set-") || name.endsWith(".part"));
        }
        assertThat(BatchJournal.read(out)).hasSize(n);
    }

    private static long lines(Path f) throws Exception {
        if (!Files.exists(f)) {
            return 0;
        }
        return new String(Files.readAllBytes(f), StandardCharsets.UTF_8).chars().filter(c -> c == '\n').count();
    }

    @Test
    void aDamagedLightCurveFailsItsOwnTargetAndTheBatchGoesOn() throws Exception {
        Path in = Files.createDirectories(dir.resolve("in"));
        SyntheticTargets.write(in, "good", 3, 8, 10);
        Files.writeString(in.resolve("broken.csv"), "time,flux\n2460100.1,1.0\n2460100.2,abc\n");
        Path out = dir.resolve("out");
        int code = console.run("batch", in.toString(), "--out", out.toString(), "--threads", "1");
        assertThat(code).isEqualTo(1);
        assertThat(err.toString()).contains("1 of 2 targets failed").doesNotContain("Exception").doesNotContain("\tat ");
        List<CSVRecord> rows = summary(out);
        assertThat(rows).extracting(r -> r.get("target") + " " + r.get("status") + " " + r.get("exit_code"))
                .containsExactly("broken.csv failed 2", "good.csv ok 0");
        assertThat(rows.get(0).get("message")).contains("broken.csv");
        assertThat(Files.readString(in.resolve("broken.csv"))).isEqualTo("time,flux\n2460100.1,1.0\n2460100.2,abc\n");
        assertThat(Files.readString(out.resolve("index.html"))).contains("src=\"good/");
    }

    @Test
    void badUsageIsRefusedBeforeAnythingRuns() throws Exception {
        Path in = Files.createDirectories(dir.resolve("in"));
        Path m = Files.writeString(in.resolve("targets.csv"), "file,label\n../elsewhere.csv,x\n");
        Files.writeString(dir.resolve("elsewhere.csv"), "time,flux\n");
        assertThat(console.run("batch", m.toString(), "--out", dir.resolve("o").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("targets.csv: row 1 (line 2), column 'file'", "leads out");
        assertThat(dir.resolve("o")).doesNotExist();

        err.getBuffer().setLength(0);
        assertThat(console.run("batch", in.toString(), "--out", in.toString())).isEqualTo(2);
        assertThat(err.toString()).contains("--out");
        err.getBuffer().setLength(0);
        assertThat(console.run("batch", dir.resolve("nothing").toString(), "--out", dir.resolve("o").toString()))
                .isEqualTo(2);
        assertThat(err.toString()).contains("no such file or folder");
        err.getBuffer().setLength(0);
        assertThat(console.run("batch", in.toString(), "--out", dir.resolve("o").toString(), "--threads", "0"))
                .isEqualTo(2);
        assertThat(err.toString()).contains("--threads");
        out.getBuffer().setLength(0);
        assertThat(console.run("batch", "--help")).isZero();
        assertThat(out.toString()).contains("MANIFEST.csv", "--threads", "--allow-outside", "--retry-failed");
    }
}
