package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.twinlight.orbit.RadialVelocityCurve;

/** The velocities and dimensions commands as a user runs them: files, exit codes, messages for bad input. */
class DimensionsCommandTest extends CommandTestSupport {

    private static final double PERIOD = 3.2145;
    private static final double EPOCH = 2460100.3812;

    /** A fit.json in the shape the fit command writes (parameters, correlation, model, timeScale). */
    private Path fitJson(String timeScale, String eccentricity, boolean withRadius1) throws Exception {
        String r1 = withRadius1 ? "\"radius1\": {\"value\": 0.105, \"uncertainty\": 0.001, \"free\": true}," : "";
        String json = """
                {"parameters": {
                  "period": {"value": %s, "uncertainty": 0.0, "free": false},
                  "epoch": {"value": %s, "uncertainty": 0.0001, "free": true},
                  %s
                  "radius2": {"value": 0.071, "uncertainty": 0.001, "free": true},
                  "inclination": {"value": 88.2, "uncertainty": 0.3, "free": true},
                  "eccentricity": {"value": %s, "uncertainty": 0.0, "free": false},
                  "omega": {"value": 90.0, "uncertainty": 0.0, "free": false},
                  "surfaceBrightnessRatio": {"value": 0.62, "uncertainty": 0.01, "free": true}},
                 "correlation": {"names": ["epoch", "radius1", "radius2", "inclination", "surfaceBrightnessRatio"],
                   "matrix": [[1,0,0,0,0],[0,1,0.5,-0.3,0],[0,0.5,1,-0.8,0],[0,-0.3,-0.8,1,0],[0,0,0,0,1]]},
                 "model": {"period": %s, "epoch": %s, "radius1": 0.105, "radius2": 0.071, "inclination": 88.2,
                   "surfaceBrightnessRatio": 0.62},
                 "timeScale": "%s"}
                """.formatted(PERIOD, EPOCH, r1, eccentricity, PERIOD, EPOCH, timeScale);
        return Files.writeString(dir.resolve("fit.json"), json);
    }

    /** Velocities of both stars from the contract's model, K1 = 95, K2 = 118, γ = −12 km/s, 1 km/s noise. */
    private Path velocities(String timeScale, boolean secondStar) throws Exception {
        RadialVelocityCurve curve = new RadialVelocityCurve(PERIOD, EPOCH, 0.0, 90.0);
        Random rng = new Random(5);
        StringBuilder sb = new StringBuilder("# time scale: " + timeScale + "\ntime,v1,v1_err"
                + (secondStar ? ",v2,v2_err" : "") + "\n");
        for (int i = 0; i < 30; i++) {
            double t = EPOCH + 50 * rng.nextDouble();
            sb.append(String.format(Locale.ROOT, "%.5f,%.3f,1.0", t, curve.velocity1(t, 95, -12) + rng.nextGaussian()));
            if (secondStar) {
                sb.append(String.format(Locale.ROOT, ",%.3f,1.0", curve.velocity2(t, 118, -12) + rng.nextGaussian()));
            }
            sb.append('\n');
        }
        return Files.writeString(dir.resolve("rv.csv"), sb.toString());
    }

    private JsonNode json(Path p) throws Exception {
        return new ObjectMapper().readTree(p.toFile());
    }

    @Test
    void velocitiesFitWritesJsonAndPlot() throws Exception {
        Path fit = fitJson("BJD_TDB", "0.0", true);
        Path rv = velocities("BJD_TDB", true);
        Path out = dir.resolve("v");
        int code = console.run("velocities", rv.toString(), "--model", fit.toString(), "--out", out.toString());
        assertThat(code).as(err.toString()).isZero();
        JsonNode j = json(out.resolve("velocities.json"));
        double k1 = j.at("/parameters/k1/value").asDouble();
        double s1 = j.at("/parameters/k1/uncertainty").asDouble();
        assertThat(Math.abs(k1 - 95) / s1).isLessThan(4);
        assertThat(j.at("/derived/massRatio/value").asDouble()).isCloseTo(95.0 / 118.0, within(0.02));
        assertThat(j.at("/timeScale").asText()).isEqualTo("BJD_TDB");
        assertThat(j.at("/caution").asText()).contains("Keplerian");
        assertThat(out.resolve("velocities.png")).exists();
    }

    @Test
    void dimensionsFromGivenSemiAmplitudes() throws Exception {
        Path fit = fitJson("BJD_TDB", "0.0", true);
        Path out = dir.resolve("d");
        int code = console.run("dimensions", "--fit", fit.toString(), "--k1", "95", "--k1-error", "0.5", "--k2", "118",
                "--k2-error", "0.6", "--teff1", "6400", "--teff1-error", "100", "--teff2", "5600", "--out",
                out.toString());
        assertThat(code).as(err.toString()).isZero();
        JsonNode j = json(out.resolve("dimensions.json"));
        // handbook form (Torres et al. 2010, §3): M1 sin³i = 1.036149e-7 (K1+K2)² K2 P
        double m1 = 1.036149e-7 * Math.pow(95 + 118, 2) * 118 * PERIOD / Math.pow(Math.sin(Math.toRadians(88.2)), 3);
        assertThat(j.at("/star1/mass/value").asDouble()).isCloseTo(m1, within(1e-5 * m1));
        assertThat(j.at("/star1/mass/uncertainty").asDouble()).isPositive();
        assertThat(j.at("/star2/luminosity/value").asDouble()).isPositive();
        assertThat(j.at("/system/semiMajorAxis/value").asDouble()).isPositive();
        assertThat(j.at("/units/mass").asText()).isEqualTo("nominal solar masses");
        assertThat(j.at("/caution").asText()).contains("spherical");
        assertThat(Files.readString(out.resolve("dimensions.txt"))).contains("±");
        assertThat(out.resolve("mass-radius.png")).exists();
        assertThat(out.resolve("mass-luminosity.png")).exists();
    }

    @Test
    void dimensionsFromAVelocityFile() throws Exception {
        Path fit = fitJson("BJD_TDB", "0.0", true);
        Path rv = velocities("BJD_TDB", true);
        Path out = dir.resolve("d");
        int code = console.run("dimensions", "--fit", fit.toString(), "--velocities", rv.toString(), "--out",
                out.toString());
        assertThat(code).as(err.toString()).isZero();
        JsonNode j = json(out.resolve("dimensions.json"));
        assertThat(j.at("/elements/k2/value").asDouble()).isCloseTo(118, within(3.0));
        assertThat(j.at("/star1/luminosity").isMissingNode()).isTrue();
        assertThat(out.resolve("mass-luminosity.png")).doesNotExist();
    }

    @Test
    void badInputNamesFileAndKey() throws Exception {
        Path fit = fitJson("BJD_TDB", "0.0", true);
        Path out = dir.resolve("bad");
        assertThat(console.run("dimensions", "--fit", fit.toString(), "--k1", "95", "--out", out.toString())).isEqualTo(2);
        assertThat(err.toString()).contains("--k2").contains("second star");
        assertBad("--k1", "-3", "--k2", "100");
        assertThat(err.toString()).contains("--k1").contains("> 0");
        assertBad("--k1", "90", "--k2", "100", "--teff1", "0");
        assertThat(err.toString()).contains("--teff1");

        Path noRadius = fitJson("BJD_TDB", "0.0", false);
        assertBad("--k1", "90", "--k2", "100");
        assertThat(err.toString()).contains(noRadius.toString()).contains("parameters.radius1");

        fitJson("BJD_TDB", "1.2", true);
        assertBad("--k1", "90", "--k2", "100");
        assertThat(err.toString()).contains("eccentricity");

        fitJson("BJD_TDB", "0.0", true);
        Path hjd = velocities("HJD_UTC", true);
        assertBad("--velocities", hjd.toString());
        assertThat(err.toString()).contains("rv.csv").contains("HJD_UTC").contains("timeScale");

        Path single = velocities("BJD_TDB", false);
        assertBad("--velocities", single.toString());
        assertThat(err.toString()).contains("rv.csv").contains("v2").contains("star 2");
    }

    @Test
    void swappedStarsAreBadInputSayingWhatToTry() throws Exception {
        Path fit = fitJson("BJD_TDB", "0.0", true);
        Path rv = velocities("BJD_TDB", true);
        Path out = dir.resolve("swapped");
        int code = console.run("velocities", rv.toString(), "--model", fit.toString(), "--v1-column", "v2",
                "--v1-error-column", "v2_err", "--v2-column", "v1", "--v2-error-column", "v1_err", "--out",
                out.toString());
        assertThat(code).as(err.toString()).isEqualTo(2);
        assertThat(err.toString()).contains("rv.csv").contains("swapped").contains("half a period")
                .contains("--v1-column").doesNotContain("Exception");
        assertThat(out.resolve("velocities.json")).doesNotExist();
        assertBad("--velocities", rv.toString(), "--v1-column", "v2", "--v1-error-column", "v2_err", "--v2-column",
                "v1", "--v2-error-column", "v1_err");
        assertThat(err.toString()).contains("swapped").contains("epoch");
    }

    @Test
    void aFitJsonWithoutCorrelationsIsWarnedAbout() throws Exception {
        Path fit = fitJson("BJD_TDB", "0.0", true);
        String noCorr = Files.readString(fit).replaceAll("(?s)\"correlation\": \\{.*?\\]\\]\\},", "");
        assertThat(noCorr).doesNotContain("correlation");
        Files.writeString(fit, noCorr);
        Path out = dir.resolve("nocorr");
        int code = console.run("dimensions", "--fit", fit.toString(), "--k1", "95", "--k1-error", "0.5", "--k2", "118",
                "--k2-error", "0.6", "--out", out.toString());
        assertThat(code).as(err.toString()).isZero();
        assertThat(this.out.toString()).contains("warning: ").contains("no 'correlation' block");
        assertThat(json(out.resolve("dimensions.json")).at("/warnings").toString())
                .contains("ignore their correlations").contains("radius2").contains("inclination");
        assertThat(Files.readString(out.resolve("dimensions.txt"))).contains("# warning: ")
                .contains("ignore their correlations");
        // with the block there is no such warning
        fitJson("BJD_TDB", "0.0", true);
        Path out2 = dir.resolve("withcorr");
        assertThat(console.run("dimensions", "--fit", fit.toString(), "--k1", "95", "--k2", "118", "--out",
                out2.toString())).isZero();
        assertThat(Files.readString(out2.resolve("dimensions.txt"))).doesNotContain("ignore their correlations");
    }

    @Test
    void geometryThatCannotEclipseIsWarnedAbout() throws Exception {
        Path fit = fitJson("BJD_TDB", "0.0", true);
        Files.writeString(fit, Files.readString(fit).replace("88.2", "30.0"));
        Path out = dir.resolve("tilted");
        assertThat(console.run("dimensions", "--fit", fit.toString(), "--k1", "95", "--k2", "118", "--out",
                out.toString())).as(err.toString()).isZero();
        assertThat(Files.readString(out.resolve("dimensions.txt"))).contains("no eclipse");
        assertThat(json(out.resolve("dimensions.json")).at("/warnings").toString()).contains("not from an eclipse");
    }

    private void assertBad(String... options) {
        err.getBuffer().setLength(0);
        String[] args = new String[options.length + 5];
        args[0] = "dimensions";
        args[1] = "--fit";
        args[2] = dir.resolve("fit.json").toString();
        System.arraycopy(options, 0, args, 3, options.length);
        args[options.length + 3] = "--out";
        args[options.length + 4] = dir.resolve("bad").toString();
        assertThat(console.run(args)).as(err.toString()).isEqualTo(2);
        assertThat(err.toString()).doesNotContain("Exception").doesNotContain("\tat ");
    }

    @Test
    void helpListsTheOptions() {
        assertThat(console.run("dimensions", "--help")).isZero();
        assertThat(out.toString()).contains("--fit").contains("--velocities").contains("--teff1");
        out.getBuffer().setLength(0);
        assertThat(console.run("velocities", "--help")).isZero();
        assertThat(out.toString()).contains("--model").contains("--jitter").contains("--v2-column");
    }
}
