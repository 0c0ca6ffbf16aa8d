package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.awt.image.BufferedImage;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.Locale;
import java.util.Random;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.BadInputException;
import org.twinlight.WorkFailedException;
import picocli.CommandLine;

class PeriodCommandTest {
    @TempDir
    Path dir;

    /** A light curve with box-shaped eclipses of depth d1 at phase 0 and d2 at phase 0.5 (demo data). */
    private Path writeCurve(String name, double days, double period, double d1, double d2, long seed) throws Exception {
        StringBuilder sb = new StringBuilder("# synthetic binary for tests\ntime,flux,flux_err\n");
        Random rnd = new Random(seed);
        for (double t = 0; t <= days; t += 10.0 / 1440) {
            double ph = (t / period) % 1;
            double f = 1 + 0.003 * rnd.nextGaussian();
            if (ph < 0.025 || ph > 0.975) {
                f -= d1;
            } else if (Math.abs(ph - 0.5) < 0.025) {
                f -= d2;
            }
            sb.append(String.format(Locale.ROOT, "%.6f,%.6f,0.003%n", 2460100 + t, f));
        }
        Path p = dir.resolve(name);
        Files.writeString(p, sb);
        return p;
    }

    private static CommandLine commandLine(StringWriter out, StringWriter err) {
        // The same exit-code mapping as the tool's top-level command.
        CommandLine cl = new CommandLine(new PeriodCommand());
        cl.setOut(new PrintWriter(out));
        cl.setErr(new PrintWriter(err));
        cl.setExitCodeExceptionMapper(t -> t instanceof WorkFailedException ? 1 : 2);
        cl.setExecutionExceptionHandler((ex, c, parse) -> {
            c.getErr().println((ex instanceof BadInputException ? "error: " : "failed: ") + ex.getMessage());
            c.getErr().flush();
            return ex instanceof BadInputException ? 2 : 1;
        });
        return cl;
    }

    @Test
    void writesPeriodJsonPerContractAndAPeriodogramPng() throws Exception {
        Path lc = writeCurve("demo.csv", 15, 2.2, 0.1, 0.03, 1);
        Path out = dir.resolve("out");
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        int code = commandLine(so, se).execute(lc.toString(), "--out", out.toString(), "--time-scale", "BJD_TDB");
        assertThat(code).as(se.toString()).isZero();
        JsonNode j = new ObjectMapper().readTree(out.resolve("period.json").toFile());
        assertThat(j.at("/period/value").asDouble()).isBetween(2.19, 2.21);
        assertThat(j.at("/period/uncertainty").asDouble()).isPositive().isLessThan(0.01);
        assertThat(j.get("method").asText()).isEqualTo("BLS");
        assertThat(j.get("secondaryPhase").asDouble()).isBetween(0.49, 0.51);
        assertThat(j.get("timeScale").asText()).isEqualTo("BJD_TDB");
        assertThat(j.get("candidates").size()).isGreaterThanOrEqualTo(3);
        for (JsonNode c : j.get("candidates")) {
            assertThat(c.has("period") && c.has("power") && c.has("method")).isTrue();
        }
        assertThat(j.at("/decision/status").asText()).isEqualTo("confident");
        assertThat(j.at("/decision/period").asDouble()).isEqualTo(j.at("/period/value").asDouble());
        assertThat(j.at("/decision/evidence").size()).isGreaterThanOrEqualTo(2);
        assertThat(j.at("/decision/alternatives").size()).isZero();
        assertThat(j.at("/input/file").asText()).isEqualTo("demo.csv");
        String sha = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(lc)));
        assertThat(j.at("/input/sha256").asText()).isEqualTo(sha);
        assertThat(j.at("/software/version").asText()).isEqualTo(VersionInfo.version());
        BufferedImage png = ImageIO.read(out.resolve("periodogram.png").toFile());
        assertThat(png.getWidth()).isGreaterThan(800);
        assertThat(png.getHeight()).isGreaterThan(600);
        assertThat(so.toString()).contains("period").contains("secondary at phase").contains("DECISION Confident")
                .contains("evidence:");
        try (var files = Files.list(out)) {
            // besides the results only the hidden lock and list of the result set (ResultSet)
            assertThat(files.map(p -> p.getFileName().toString())).containsExactlyInAnyOrder("period.json",
                    "periodogram.png", ".twinlight.lock", ".twinlight-period.files");
        }
    }

    @Test
    void noiseOnlySaysNotSignificantInSummaryAndJson() throws Exception {
        Path lc = writeCurve("flat.csv", 12, 2.0, 0, 0, 4);
        Path out = dir.resolve("flat");
        StringWriter so = new StringWriter();
        StringWriter se = new StringWriter();
        int code = commandLine(so, se).execute(lc.toString(), "--out", out.toString());
        assertThat(code).isZero();
        assertThat(so.toString()).contains("NOT significant").contains("time scale unknown");
        JsonNode j = new ObjectMapper().readTree(out.resolve("period.json").toFile());
        assertThat(j.get("significant").asBoolean()).isFalse();
        assertThat(j.get("timeScale").asText()).isEqualTo("unknown");
        assertThat(j.at("/decision/status").asText()).isEqualTo("not-significant");
    }

    @Test
    void tooShortBaselineIsExitTwoWithAClearMessage() throws Exception {
        Path lc = writeCurve("short.csv", 0.38, 2.0, 0.1, 0.05, 2);
        StringWriter se = new StringWriter();
        int code = commandLine(new StringWriter(), se).execute(lc.toString(), "--out", dir.resolve("o").toString());
        assertThat(code).isEqualTo(2);
        assertThat(se.toString()).contains("short.csv").contains("too short").contains("two eclipses");
        assertThat(Files.exists(dir.resolve("o").resolve("period.json"))).isFalse();
    }

    @Test
    void badPeriodOptionsAreExitTwoNamingTheOption() throws Exception {
        Path lc = writeCurve("ok.csv", 10, 2.0, 0.1, 0.05, 3);
        StringWriter se = new StringWriter();
        int code = commandLine(new StringWriter(), se).execute(lc.toString(), "--out", dir.toString(),
                "--min-period", "3", "--max-period", "2");
        assertThat(code).isEqualTo(2);
        assertThat(se.toString()).contains("--min-period").contains("--max-period");
        StringWriter se2 = new StringWriter();
        int code2 = commandLine(new StringWriter(), se2).execute(lc.toString(), "--out", dir.toString(),
                "--max-period", "9");
        assertThat(code2).isEqualTo(2);
        assertThat(se2.toString()).contains("half the baseline");
    }

    @Test
    void helpDescribesEveryOption() {
        StringWriter so = new StringWriter();
        int code = commandLine(so, new StringWriter()).execute("--help");
        assertThat(code).isZero();
        assertThat(so.toString()).contains("--out").contains("--min-period").contains("--max-period")
                .contains("--time-scale").contains("half the baseline");
    }
}
