package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.orbit.RadialVelocityCurve;

/** {@code fit --velocities} as a user runs it: files written, exit codes, messages. */
class JointFitCommandTest {
    // Demo system (invented): eccentric detached pair.
    static final String MODEL = """
            {
              "period": 2.8731, "epoch": 2460000.4123,
              "radius1": 0.118, "radius2": 0.081, "inclination": 87.6,
              "eccentricity": 0.12, "omega": 70.0, "surfaceBrightnessRatio": 0.58,
              "limbDarkening1": {"law": "quadratic", "coefficients": [0.40, 0.22]},
              "limbDarkening2": {"law": "quadratic", "coefficients": [0.45, 0.20]}
            }
            """;
    static final double K1 = 62.0;
    static final double K2 = 85.0;

    @TempDir
    Path dir;

    private record Run(int code, String out, String err) {
    }

    private static Run run(String... args) {
        ConsoleCapture console = new ConsoleCapture();
        int code = console.run(args);
        return new Run(code, console.out.toString(), console.err.toString());
    }

    /** Velocities of both stars (or star 1 only) with Gaussian noise, by the orbit package's curve. */
    private Path velocities(String name, String scale, boolean both) throws Exception {
        RadialVelocityCurve c = new RadialVelocityCurve(2.8731, 2460000.4123, 0.12, 70.0);
        Random rng = new Random(11);
        StringBuilder sb = new StringBuilder("# time scale: " + scale + "\n");
        sb.append(both ? "time,v1,v1_err,v2,v2_err\n" : "time,v1,v1_err\n");
        for (int i = 0; i < 30; i++) {
            double t = 2460000 + 40 * 2.8731 * rng.nextDouble();
            double s = c.shape(t);
            sb.append(String.format(Locale.ROOT, "%.5f,%.3f,1.5", t, -12.3 + K1 * s + 1.5 * rng.nextGaussian()));
            sb.append(both ? String.format(Locale.ROOT, ",%.3f,2.0%n", -12.3 - K2 * s + 2.0 * rng.nextGaussian())
                    : "\n");
        }
        return Files.writeString(dir.resolve(name), sb.toString());
    }

    private Path[] lightCurveAndStart() throws Exception {
        Path model = Files.writeString(dir.resolve("truth.json"), MODEL);
        Path csv = dir.resolve("lc.csv");
        assertThat(run("simulate", "--model", model.toString(), "--start", "2460000", "--end", "2460011.5",
                "--cadence", "8", "--noise-ppm", "3000", "--seed", "3", "--time-scale", "BJD_TDB", "--out",
                csv.toString()).code()).isZero();
        Path start = Files.writeString(dir.resolve("start.json"), MODEL.replace("0.118", "0.122")
                .replace("87.6", "87.0").replace("70.0", "64.0"));
        return new Path[] {csv, start};
    }

    @Test
    void jointFitWritesVelocityResultsAndPlot() throws Exception {
        Path[] in = lightCurveAndStart();
        Path rv = velocities("rv.csv", "BJD_TDB", true);
        Path out = dir.resolve("joint");
        Run fit = run("fit", in[0].toString(), "--model", in[1].toString(), "--free",
                "epoch,radius1,radius2,inclination,surfaceBrightnessRatio,eccentricity,omega", "--velocities",
                rv.toString(), "--out", out.toString());
        assertThat(fit.code()).as(fit.err()).isZero();
        assertThat(out.resolve("velocities.png")).exists();
        assertThat(out.resolve("fit.png")).exists();
        JsonNode json = new ObjectMapper().readTree(out.resolve("fit.json").toFile());
        for (String k : new String[] {"k1", "k2"}) {
            double truth = k.equals("k1") ? K1 : K2;
            JsonNode e = json.at("/velocities/" + k);
            // 4σ of the fit's own uncertainty: fails for a correct fit once in 16,000
            assertThat(Math.abs(e.get("value").asDouble() - truth)).as(k)
                    .isLessThan(4 * e.get("uncertainty").asDouble());
            assertThat(json.at("/parameters/" + k + "/free").asBoolean()).isTrue();
        }
        // noise 1.5 and 2.0 km/s: the RMS of 30 residuals within about ±40% of it
        assertThat(json.at("/velocities/residualRmsKms/star1").asDouble()).isBetween(0.9, 2.1);
        assertThat(json.at("/velocities/residualRmsKms/star2").asDouble()).isBetween(1.2, 2.8);
        assertThat(fit.out()).contains("velocity residual RMS");
        // dimensions takes K1 and K2 of the joint fit when neither --velocities nor --k1 --k2 is given
        Path dims = dir.resolve("dims");
        Run d = run("dimensions", "--fit", out.resolve("fit.json").toString(), "--draws", "2000", "--out",
                dims.toString());
        assertThat(d.code()).as(d.out() + d.err()).isZero();
        JsonNode dj = new ObjectMapper().readTree(dims.resolve("dimensions.json").toFile());
        assertThat(dj.at("/input/velocities").asText()).contains("jointly");
        for (int star = 1; star <= 2; star++) {
            JsonNode m = dj.at("/star" + star + "/mass");
            // truth from Kepler's third law (AnalyseAfterFitTest.trueMass); 4σ
            assertThat(Math.abs(m.get("value").asDouble() - AnalyseAfterFitTest.trueMass(star))).as("M" + star)
                    .isLessThan(4 * m.get("uncertainty").asDouble());
        }
    }

    @Test
    void velocitiesOnAnotherTimeScaleAreRefusedNamingBothFiles() throws Exception {
        Path[] in = lightCurveAndStart();
        Path rv = velocities("rv-hjd.csv", "HJD_UTC", true);
        Run fit = run("fit", in[0].toString(), "--model", in[1].toString(), "--velocities", rv.toString(), "--out",
                dir.resolve("x").toString());
        assertThat(fit.code()).isEqualTo(2);
        assertThat(fit.err()).contains("rv-hjd.csv").contains("lc.csv").contains("HJD_UTC").contains("BJD_TDB");
        assertThat(dir.resolve("x").resolve("fit.json")).doesNotExist();
    }

    @Test
    void singleLinedVelocitiesHoldK2AndSaySo() throws Exception {
        Path[] in = lightCurveAndStart();
        Path rv = velocities("rv-single.csv", "BJD_TDB", false);
        Path out = dir.resolve("single");
        Run fit = run("fit", in[0].toString(), "--model", in[1].toString(), "--velocities", rv.toString(), "--out",
                out.toString());
        assertThat(fit.code()).as(fit.err()).isZero();
        JsonNode json = new ObjectMapper().readTree(out.resolve("fit.json").toFile());
        assertThat(json.at("/velocities/k2").isNull()).isTrue();
        assertThat(json.at("/parameters/k2").isMissingNode()).isTrue();
        assertThat(json.get("notes").toString()).contains("K2 is held fixed");
        assertThat(fit.out()).contains("k2: not determined");
    }

    @Test
    void jointFitCanBeSampled() throws Exception {
        Path[] in = lightCurveAndStart();
        Path rv = velocities("rv.csv", "BJD_TDB", true);
        Path out = dir.resolve("joint-posterior");
        Run fit = run("fit", in[0].toString(), "--model", in[1].toString(), "--free",
                "epoch,radius1,radius2,inclination", "--velocities", rv.toString(), "--posterior", "--max-steps", "60",
                "--out", out.toString());
        // 60 steps cannot converge: the files are written and the run says so with exit 1, never an internal error
        assertThat(fit.err()).doesNotContain("internal error");
        assertThat(fit.code()).as(fit.err()).isIn(0, 1);
        JsonNode json = new ObjectMapper().readTree(out.resolve("fit.json").toFile());
        assertThat(json.path("posterior").has("k1")).as(json.path("posterior").toString()).isTrue();
        assertThat(json.path("posterior").path("k1").path("median").asDouble()).isBetween(K1 - 5, K1 + 5);
    }

    @Test
    void jointFitWithJitterSamplesOnePerBandAndVelocityFile() throws Exception {
        Path[] in = lightCurveAndStart();
        Path rv = velocities("rv.csv", "BJD_TDB", true);
        Path out = dir.resolve("joint-jitter");
        Run fit = run("fit", in[0].toString(), "--model", in[1].toString(), "--free", "radius1,radius2,inclination",
                "--velocities", rv.toString(), "--posterior", "--jitter", "--max-steps", "60", "--out", out.toString());
        assertThat(fit.err()).doesNotContain("internal error");
        assertThat(fit.code()).as(fit.err()).isIn(0, 1);
        JsonNode post = new ObjectMapper().readTree(out.resolve("fit.json").toFile()).path("posterior");
        assertThat(post.has("jitter")).as(post.toString()).isTrue();
        // the velocity errors are 1.5 and 2.0 km/s: the default prior spans 0.001 to 100 times their median
        assertThat(post.path("jitterVelocity").path("median").asDouble()).isBetween(0.00175, 175.0);
        assertThat(post.path("k1").path("median").asDouble()).isBetween(K1 - 5, K1 + 5);
    }
}
