package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The README's quick start, run on the bundled sample: the analysis, with no hints, must succeed and
 * recover the parameters the sample was simulated with (sample-curves/brindle-pair.model.json) within
 * 4σ of its own uncertainties (common practice, no source, for a single realisation).
 */
class BundledSampleTest {
    @TempDir
    Path dir;

    @Test
    void quickStartAnalysisRecoversTheSimulatedSystem() throws Exception {
        String readme = Files.readString(Path.of("README.md"));
        assertThat(readme).as("the README quick start must be the command tested here").contains(
                "java -jar target/twinlight.jar analyse sample-curves/brindle-pair-space.fits --out results/brindle-pair");
        ConsoleCapture c = new ConsoleCapture();
        int code = c.run("analyse", "sample-curves/brindle-pair-space.fits", "--out", dir.toString());
        assertThat(code).as(c.out + "\n" + c.err).isZero();
        ObjectMapper json = new ObjectMapper();
        JsonNode truth = json.readTree(Path.of("sample-curves", "brindle-pair.model.json").toFile());
        JsonNode fit = json.readTree(dir.resolve("fit.json").toFile()).get("parameters");
        for (String name : new String[] {"period", "radius1", "radius2", "inclination", "eccentricity", "omega",
            "surfaceBrightnessRatio"}) {
            double value = fit.at("/" + name + "/value").asDouble();
            double sigma = fit.at("/" + name + "/uncertainty").asDouble();
            assertThat(Math.abs(value - truth.get(name).asDouble())).as(name).isLessThanOrEqualTo(4 * sigma);
        }
        // the fitted epoch lies in another cycle than the simulation's: compare the phase
        double cycles = (fit.at("/epoch/value").asDouble() - truth.get("epoch").asDouble()) / truth.get("period")
                .asDouble();
        assertThat(Math.abs(cycles - Math.rint(cycles)) * truth.get("period").asDouble())
                .isLessThanOrEqualTo(4 * fit.at("/epoch/uncertainty").asDouble() + 4 * Math.abs(Math.rint(cycles))
                        * fit.at("/period/uncertainty").asDouble());
        JsonNode results = json.readTree(dir.resolve("results.json").toFile());
        assertThat(results.at("/fit/timeScale").asText()).isEqualTo("BJD_TDB");
        assertThat(dir.resolve("report.html")).exists();
    }

    @Test
    void ciRunsBothReadmeQuickStartCommands() throws Exception {
        String readme = Files.readString(Path.of("README.md"));
        String ci = Files.readString(Path.of(".ci", "run"));
        int start = readme.indexOf("```sh", readme.indexOf("## Quick start"));
        String[] commands = readme.substring(start + 5, readme.indexOf("```", start + 5)).strip().split("\n");
        assertThat(commands).as("the quick start is exactly two commands").hasSize(2);
        for (String command : commands) {
            assertThat(ci).as("CI must run the README command " + command).contains(command.strip());
        }
    }
}
