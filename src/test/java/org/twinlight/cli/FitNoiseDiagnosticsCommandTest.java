package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The noise block of fit.json, its terminal lines and --inflate-errors, as a user runs them. */
class FitNoiseDiagnosticsCommandTest {
    private static final String MODEL = FitAndSimulateCommandTest.MODEL;
    private static final List<String> FREE = List.of("epoch", "radius1", "radius2", "inclination",
            "surfaceBrightnessRatio");

    @TempDir
    Path dir;

    private Path simulated() throws Exception {
        Path model = Files.writeString(dir.resolve("model.json"), MODEL);
        Path csv = dir.resolve("sim.csv");
        assertThat(new ConsoleCapture().run("simulate", "--model", model.toString(), "--start", "2460300", "--end",
                "2460306", "--cadence", "5", "--noise-ppm", "1000", "--seed", "4", "--time-scale", "BJD_TDB", "--out",
                csv.toString())).isZero();
        return csv;
    }

    @Test
    void everyFitReportsBetaAndThePermutationAndInflationMultipliesTheErrors() throws Exception {
        Path csv = simulated();
        Path start = Files.writeString(dir.resolve("start.json"), MODEL.replace("0.13", "0.125").replace("88.0", "87.3"));
        ConsoleCapture plain = new ConsoleCapture();
        assertThat(plain.run("fit", csv.toString(), "--model", start.toString(), "--out", dir.resolve("a").toString()))
                .as(plain.err.toString()).isZero();
        assertThat(plain.out.toString()).contains("correlated noise: beta = ").contains("permutation")
                .contains("quote the larger");
        JsonNode a = new ObjectMapper().readTree(dir.resolve("a/fit.json").toFile());
        JsonNode noise = a.get("noise");
        // white noise: β = 1 within the scatter of a median over a few widths of ~100 bins each
        // (Winn et al. 2008, ApJ 683, 1076: β = 1 for white noise)
        assertThat(noise.get("beta").asDouble()).isBetween(0.8, 1.25);
        assertThat(noise.get("betaByBinMinutes").size()).isGreaterThanOrEqualTo(3);
        assertThat(noise.get("shifts").asInt()).isEqualTo(40);
        assertThat(noise.get("errorsInflatedBy").asDouble()).isEqualTo(1.0);
        for (String name : FREE) {
            double cov = a.at("/parameters/" + name + "/uncertainty").asDouble();
            double perm = noise.at("/residualPermutation/" + name + "/sigma").asDouble();
            // white noise: the permutation spread is of the covariance error's size (40 correlated
            // shifts: within a factor 2.5 either way, common practice, no source)
            assertThat(perm / cov).as(name).isBetween(0.4, 2.5);
            assertThat(noise.at("/quoted/" + name + "/uncertainty").asDouble()).as(name)
                    .isGreaterThanOrEqualTo(cov * Math.max(1, noise.get("beta").asDouble()) * (1 - 1e-12))
                    .isGreaterThanOrEqualTo(perm);
        }

        ConsoleCapture inflated = new ConsoleCapture();
        assertThat(inflated.run("fit", csv.toString(), "--model", start.toString(), "--inflate-errors", "beta", "--out",
                dir.resolve("b").toString())).as(inflated.err.toString()).isZero();
        JsonNode b = new ObjectMapper().readTree(dir.resolve("b/fit.json").toFile());
        double factor = Math.max(1, b.at("/noise/beta").asDouble());
        assertThat(b.at("/noise/errorsInflatedBy").asDouble()).isEqualTo(factor);
        for (String name : FREE) {
            assertThat(b.at("/parameters/" + name + "/value").asDouble()).isEqualTo(a.at("/parameters/" + name
                    + "/value").asDouble());
            assertThat(b.at("/parameters/" + name + "/uncertainty").asDouble()).as(name).isCloseTo(
                    factor * a.at("/parameters/" + name + "/uncertainty").asDouble(),
                    org.assertj.core.data.Percentage.withPercentage(1e-9));
        }
    }

    @Test
    void badInflationChoiceIsExitTwoNamingTheOption() throws Exception {
        Path csv = simulated();
        ConsoleCapture c = new ConsoleCapture();
        assertThat(c.run("fit", csv.toString(), "--model", Files.writeString(dir.resolve("m.json"), MODEL).toString(), "--inflate-errors",
                "twice", "--out", dir.resolve("o").toString())).isEqualTo(2);
        assertThat(c.err.toString()).contains("--inflate-errors").contains("beta or none").contains("twice")
                .doesNotContain("Exception");
        ConsoleCapture help = new ConsoleCapture();
        assertThat(help.run("fit", "--help")).isZero();
        assertThat(help.out.toString()).contains("--inflate-errors");
    }
}
