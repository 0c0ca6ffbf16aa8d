package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.zip.GZIPInputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code fit --posterior} as a user runs it: the files, an unconverged chain, bad options and priors. */
class FitPosteriorCommandTest {
    private static final String MODEL = """
            {
              "period": 1.7, "epoch": 2460100.2,
              "radius1": 0.19, "radius2": 0.14, "inclination": 81.0,
              "surfaceBrightnessRatio": 0.72,
              "limbDarkening1": {"law": "quadratic", "coefficients": [0.45, 0.2]},
              "limbDarkening2": {"law": "quadratic", "coefficients": [0.5, 0.18]}
            }
            """;

    @TempDir
    Path dir;

    private record Run(int code, String out, String err) {
    }

    private static Run run(String... args) {
        ConsoleCapture console = new ConsoleCapture();
        int code = console.run(args);
        return new Run(code, console.out.toString(), console.err.toString());
    }

    private Path simulated() {
        Path model = write("truth.json", MODEL);
        Path csv = dir.resolve("sim.csv");
        Run sim = run("simulate", "--model", model.toString(), "--start", "2460100", "--end", "2460103.5",
                "--cadence", "6", "--noise-ppm", "1500", "--seed", "9", "--out", csv.toString());
        assertThat(sim.code()).as(sim.err()).isZero();
        return csv;
    }

    private Path write(String name, String text) {
        try {
            return Files.writeString(dir.resolve(name), text);
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    @Test
    void anUnconvergedChainIsWrittenAndEndsWithExitOne() throws Exception {
        Path csv = simulated();
        Path start = write("start.json", MODEL.replace("0.19", "0.195"));
        Path out = dir.resolve("post");
        Run r = run("fit", csv.toString(), "--model", start.toString(), "--free", "radius1,radius2,inclination",
                "--posterior", "--max-steps", "150", "--seed", "4", "--threads", "1", "--out", out.toString());
        assertThat(r.code()).as(r.err()).isEqualTo(1);
        assertThat(r.err()).contains("not converged").contains("--max-steps");
        for (String f : new String[] {"fit.json", "chain.csv.gz", "trace.png", "corner.png"}) {
            assertThat(out.resolve(f)).exists();
        }
        JsonNode json = new ObjectMapper().readTree(out.resolve("fit.json").toFile());
        JsonNode conv = json.get("convergence");
        assertThat(conv.get("converged").asBoolean()).isFalse();
        assertThat(conv.get("reason").asText()).contains("step limit of 150");
        assertThat(conv.get("walkers").asInt()).isEqualTo(32);
        assertThat(conv.get("steps").asInt()).isEqualTo(150);
        assertThat(conv.get("seed").asLong()).isEqualTo(4);
        assertThat(conv.get("chainFile").asText()).isEqualTo("chain.csv.gz");
        JsonNode r2 = json.at("/posterior/radius2");
        assertThat(r2.get("lower95").asDouble()).isLessThan(r2.get("median").asDouble());
        assertThat(r2.get("upper68").asDouble()).isGreaterThan(r2.get("median").asDouble());
        assertThat(json.at("/posterior/lightRatio/median").isNumber()).isTrue();
        int burnIn = conv.get("burnIn").asInt();
        try (BufferedReader in = new BufferedReader(new InputStreamReader(new GZIPInputStream(
                Files.newInputStream(out.resolve("chain.csv.gz"))), StandardCharsets.UTF_8))) {
            String header = in.readLine();
            assertThat(header).startsWith("step,walker,logPosterior,radius1,radius2,inclination,sumOfRadii");
            assertThat(in.readLine()).startsWith(burnIn + ",0,");
            assertThat(in.lines().count()).isEqualTo((150L - burnIn) * 32 - 1);
        }
    }

    @Test
    void badSamplerOptionsAndPriorsAreRefusedByName() {
        Path csv = simulated();
        Path out = dir.resolve("bad");
        Run walkers = run("fit", csv.toString(), "--model", write("m.json", MODEL).toString(), "--posterior",
                "--walkers", "7", "--out", out.toString());
        assertThat(walkers.code()).isEqualTo(2);
        assertThat(walkers.err()).contains("--walkers").contains("even");
        Run noPosterior = run("fit", csv.toString(), "--model", write("m2.json", MODEL).toString(), "--seed", "3",
                "--out", out.toString());
        assertThat(noPosterior.code()).isEqualTo(2);
        assertThat(noPosterior.err()).contains("--posterior");
        String withPrior = MODEL.replace("\"period\"", "\"priors\": {\"radius2\": {\"uniform\": [0.3, 0.4]}},\n  \"period\"");
        Path p = write("prior.json", withPrior);
        Run prior = run("fit", csv.toString(), "--model", p.toString(), "--posterior", "--out", out.toString());
        assertThat(prior.code()).as(prior.err()).isEqualTo(2);
        assertThat(prior.err()).contains("prior.json").contains("priors.radius2").contains("outside the uniform prior");
        assertThat(out.resolve("fit.json")).doesNotExist();
    }

    @Test
    void jitterIsSampledWrittenAndItsBadUsesRefused() throws Exception {
        Path csv = simulated();
        Path out = dir.resolve("jitter");
        Run r = run("fit", csv.toString(), "--model", write("j.json", MODEL).toString(), "--free", "radius2",
                "--posterior", "--jitter", "--max-steps", "100", "--seed", "6", "--threads", "1", "--out",
                out.toString());
        assertThat(r.code()).as(r.err()).isIn(0, 1);
        JsonNode json = new ObjectMapper().readTree(out.resolve("fit.json").toFile());
        assertThat(json.at("/posterior/jitter/median").isNumber()).isTrue();
        assertThat(json.at("/settings/jitter").asBoolean()).isTrue();
        assertThat(json.at("/settings/seed").asLong()).isEqualTo(6);
        assertThat(json.at("/convergence/notes").toString()).contains("jitter");
        try (BufferedReader in = new BufferedReader(new InputStreamReader(new GZIPInputStream(
                Files.newInputStream(out.resolve("chain.csv.gz"))), StandardCharsets.UTF_8))) {
            assertThat(in.readLine()).startsWith("step,walker,logPosterior,radius2,jitter,");
        }
        Path bad = dir.resolve("bad");
        Run noPosterior = run("fit", csv.toString(), "--model", write("j2.json", MODEL).toString(), "--jitter",
                "--out", bad.toString());
        assertThat(noPosterior.code()).isEqualTo(2);
        assertThat(noPosterior.err()).contains("--jitter").contains("--posterior");
        Run withBeta = run("fit", csv.toString(), "--model", write("j3.json", MODEL).toString(), "--posterior",
                "--jitter", "--inflate-errors", "beta", "--out", bad.toString());
        assertThat(withBeta.code()).isEqualTo(2);
        assertThat(withBeta.err()).contains("--inflate-errors");
        Path p = write("jprior.json", MODEL.replace("\"period\"", "\"priors\": {\"jitter\": {\"uniform\": [0, 0.01]}},\n  \"period\""));
        Run prior = run("fit", csv.toString(), "--model", p.toString(), "--posterior", "--out", bad.toString());
        assertThat(prior.code()).as(prior.err()).isEqualTo(2);
        assertThat(prior.err()).contains("jprior.json").contains("priors.jitter").contains("--jitter");
        Path n = write("jneg.json", MODEL.replace("\"period\"", "\"priors\": {\"jitter\": {\"uniform\": [-0.01, -0.001]}},\n  \"period\""));
        Run negative = run("fit", csv.toString(), "--model", n.toString(), "--posterior", "--jitter", "--out",
                bad.toString());
        assertThat(negative.code()).as(negative.err()).isEqualTo(2);
        assertThat(negative.err()).contains("priors.jitter").contains("positive");
        assertThat(bad.resolve("fit.json")).doesNotExist();
    }

    @Test
    void seedDrivesTheGlobalSearchAndIsRecorded() throws Exception {
        Path csv = simulated();
        JsonNode[] runs = new JsonNode[2];
        for (int k = 0; k < 2; k++) {
            Path out = dir.resolve("global" + k);
            Run r = run("fit", csv.toString(), "--model", write("g" + k + ".json", MODEL).toString(), "--free",
                    "radius1,radius2,inclination", "--global", "--seed", "11", "--out", out.toString());
            assertThat(r.code()).as(r.err()).isZero();
            runs[k] = new ObjectMapper().readTree(out.resolve("fit.json").toFile());
        }
        assertThat(runs[0].at("/settings/seed").asLong()).isEqualTo(11);
        assertThat(runs[1].get("parameters")).isEqualTo(runs[0].get("parameters"));
        assertThat(runs[1].get("minima")).isEqualTo(runs[0].get("minima"));
    }
}
