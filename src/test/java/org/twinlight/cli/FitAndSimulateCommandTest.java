package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The simulate and fit commands as a user runs them: files written, exit codes, messages. */
class FitAndSimulateCommandTest {
    private static final String MODEL = """
            {
              "period": 2.61, "epoch": 2460300.25,
              "radius1": 0.13, "radius2": 0.09, "inclination": 88.0,
              "surfaceBrightnessRatio": 0.6,
              "limbDarkening1": {"law": "quadratic", "coefficients": [0.4, 0.2]},
              "limbDarkening2": {"law": "quadratic", "coefficients": [0.45, 0.2]}
            }
            """;

    @TempDir
    Path dir;

    private record Run(int code, String err) {
    }

    private static Run run(String... args) {
        ConsoleCapture console = new ConsoleCapture();
        int code = console.run(args);
        return new Run(code, console.err.toString());
    }

    @Test
    void simulateThenFitWritesAllResults() throws Exception {
        Path model = Files.writeString(dir.resolve("model.json"), MODEL);
        Path csv = dir.resolve("sim.csv");
        Run sim = run("simulate", "--model", model.toString(), "--start", "2460300", "--end", "2460306",
                "--cadence", "5", "--noise-ppm", "1000", "--seed", "4", "--time-scale", "BJD_TDB", "--out", csv.toString());
        assertThat(sim.code()).isZero();
        assertThat(Files.readString(csv)).startsWith("# time scale: BJD_TDB").contains("time,flux,flux_err");

        Path start = Files.writeString(dir.resolve("start.json"), MODEL.replace("0.13", "0.125").replace("88.0", "87.3"));
        Path out = dir.resolve("result");
        Run fit = run("fit", csv.toString(), "--model", start.toString(), "--out", out.toString());
        assertThat(fit.code()).as(fit.err()).isZero();
        for (String f : new String[] {"fit.json", "residuals.csv", "model.json", "fit.png"}) {
            assertThat(out.resolve(f)).exists();
        }
        JsonNode json = new ObjectMapper().readTree(out.resolve("fit.json").toFile());
        assertThat(json.at("/parameters/radius1/free").asBoolean()).isTrue();
        assertThat(json.at("/parameters/period/free").asBoolean()).isFalse();
        assertThat(json.at("/derived/sumOfRadii/value").asDouble()).isGreaterThan(0.2);
        assertThat(json.at("/statistics/reducedChi2").asDouble()).isBetween(0.8, 1.2);
        assertThat(json.at("/input/sha256").asText()).hasSize(64);
        assertThat(json.at("/caution").asText()).contains("spherical");
        // no temporary files left behind
        try (var files = Files.list(out)) {
            assertThat(files.map(p -> p.getFileName().toString())).noneMatch(n -> n.endsWith(".part"));
        }
    }

    @Test
    void sameSeedGivesTheSameFileByteForByte() throws Exception {
        Path model = Files.writeString(dir.resolve("model.json"), MODEL);
        for (String ext : new String[] {"csv", "fits"}) {
            Path a = dir.resolve("a." + ext);
            Path b = dir.resolve("b." + ext);
            for (Path p : new Path[] {a, b}) {
                assertThat(run("simulate", "--model", model.toString(), "--start", "2460300", "--end", "2460301",
                        "--cadence", "10", "--noise-ppm", "700", "--seed", "9", "--time-scale", "BJD_TDB", "--out",
                        p.toString()).code()).isZero();
            }
            assertThat(Files.readAllBytes(a)).as(ext).isEqualTo(Files.readAllBytes(b));
        }
    }

    @Test
    void fitsOutputNeedsADeclaredTimeScale() throws Exception {
        // a FITS table without TIMESYS would read back as UTC by the standard's default
        Path model = Files.writeString(dir.resolve("model.json"), MODEL);
        Run r = run("simulate", "--model", model.toString(), "--start", "2460300", "--end", "2460301", "--cadence", "10",
                "--out", dir.resolve("x.fits").toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("--time-scale");
    }

    @Test
    void unknownModelKeyIsExitTwoNamingTheKey() throws Exception {
        Path model = Files.writeString(dir.resolve("bad.json"), MODEL.replace("\"period\"", "\"periodd\""));
        Run r = run("simulate", "--model", model.toString(), "--start", "0", "--end", "1", "--cadence", "10",
                "--out", dir.resolve("x.csv").toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("bad.json").contains("periodd").contains("unknown key").doesNotContain("Exception");
    }

    @Test
    void unknownFreeParameterIsExitTwo() throws Exception {
        Path model = Files.writeString(dir.resolve("model.json"), MODEL);
        Path csv = dir.resolve("sim.csv");
        assertThat(run("simulate", "--model", model.toString(), "--start", "2460300", "--end", "2460303",
                "--cadence", "10", "--out", csv.toString()).code()).isZero();
        Run r = run("fit", csv.toString(), "--model", model.toString(), "--free", "radius1,radiusX", "--out",
                dir.resolve("o").toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("radiusX");
    }

    @Test
    void startingModelWithNoEclipseInTheDataIsExitOneWithAdvice() throws Exception {
        Path model = Files.writeString(dir.resolve("model.json"), MODEL);
        Path csv = dir.resolve("sim.csv");
        // times between eclipses only
        assertThat(run("simulate", "--model", model.toString(), "--start", "2460300.5", "--end", "2460300.9",
                "--cadence", "10", "--noise-ppm", "500", "--out", csv.toString()).code()).isZero();
        Run r = run("fit", csv.toString(), "--model", model.toString(), "--out", dir.resolve("o").toString());
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.err()).contains("no eclipse").contains("epoch");
    }

    @Test
    void everyCommandHasHelp() {
        for (String c : new String[] {"simulate", "fit", "bench"}) {
            ConsoleCapture console = new ConsoleCapture();
            assertThat(console.run(c, "--help")).isZero();
            assertThat(console.out.toString()).contains("Usage:").contains(c);
        }
    }
}
