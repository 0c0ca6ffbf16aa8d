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

    /** A chain.csv.gz as the sampler writes it: radius2 drawn with σ {@code sigmaR2}, the others as fit.json. */
    private Path chain(String name, double sigmaR2, String extraHeader) throws Exception {
        Random rng = new Random(3);
        StringBuilder sb = new StringBuilder("step,walker,logPosterior,epoch,radius1,radius2,inclination,"
                + "surfaceBrightnessRatio" + extraHeader + ",sumOfRadii\n");
        for (int step = 0; step < 250; step++) {
            for (int walker = 0; walker < 16; walker++) {
                double r1 = 0.105 + 0.001 * rng.nextGaussian();
                double r2 = 0.071 + sigmaR2 * rng.nextGaussian();
                sb.append(String.format(Locale.ROOT, "%d,%d,%.3f,%.6f,%.6f,%.6f,%.4f,%.4f%s,%.6f%n", step, walker,
                        -100 - rng.nextDouble(), EPOCH + 1e-4 * rng.nextGaussian(), r1, r2,
                        88.2 + 0.3 * rng.nextGaussian(), 0.62 + 0.01 * rng.nextGaussian(),
                        extraHeader.isEmpty() ? "" : ",1.0", r1 + r2));
            }
        }
        Path p = dir.resolve(name);
        try (java.io.OutputStream o = new java.util.zip.GZIPOutputStream(Files.newOutputStream(p))) {
            o.write(sb.toString().getBytes(java.nio.charset.StandardCharsets.UTF_8));
        }
        return p;
    }

    /** The fit.json of {@link #fitJson} with a posterior and a convergence block naming {@code chainFile}. */
    private Path withChain(Path fit, String chainFile, boolean converged) throws Exception {
        String json = Files.readString(fit).trim();
        json = json.substring(0, json.length() - 1) + String.format(Locale.ROOT, ", \"posterior\": {}, "
                + "\"convergence\": {\"converged\": %s, \"reason\": \"%s\", \"walkers\": 16, \"steps\": 250, "
                + "\"chainFile\": \"%s\", \"seed\": 1}}", converged, converged ? "chain longer than 50 tau"
                : "chain only 12 autocorrelation times long", chainFile);
        return Files.writeString(fit, json);
    }

    @Test
    void errorsComeFromThePosteriorChainWhenTheFitMadeOne() throws Exception {
        // the chain's radius2 spread (0.003) is three times fit.json's (0.001): R2's error must follow
        // the chain, σ(R2) = a·σ(r2) for R = r·a (a itself known to 0.02 %)
        Path fit = withChain(fitJson("BJD_TDB", "0.0", true), "chain.csv.gz", true);
        chain("chain.csv.gz", 0.003, "");
        Path out = dir.resolve("chain-out");
        int code = console.run("dimensions", "--fit", fit.toString(), "--k1", "95", "--k1-error", "0.5", "--k2", "118",
                "--k2-error", "0.6", "--out", out.toString());
        assertThat(code).as(err.toString()).isZero();
        JsonNode j = json(out.resolve("dimensions.json"));
        double a = j.at("/system/semiMajorAxis/value").asDouble();
        assertThat(j.at("/star2/radius/uncertainty").asDouble()).isCloseTo(a * 0.003, within(0.1 * a * 0.003));
        assertThat(j.at("/method/errorSource").asText()).isEqualTo("posteriorChain");
        assertThat(j.at("/method/draws").asInt()).isEqualTo(4000);
        assertThat(Files.readString(out.resolve("dimensions.txt"))).contains("posterior chain").contains("chain.csv.gz");
        // without the convergence block: fit.json's covariance, said so
        Path plain = fitJson("BJD_TDB", "0.0", true);
        Path out2 = dir.resolve("cov-out");
        assertThat(console.run("dimensions", "--fit", plain.toString(), "--k1", "95", "--k2", "118", "--out",
                out2.toString())).isZero();
        JsonNode j2 = json(out2.resolve("dimensions.json"));
        assertThat(j2.at("/method/errorSource").asText()).isEqualTo("covariance");
        assertThat(j2.at("/star2/radius/uncertainty").asDouble()).isLessThan(0.5 * a * 0.003);
        assertThat(Files.readString(out2.resolve("dimensions.txt"))).contains("fit.json's covariance");
    }

    @Test
    void anUnconvergedChainIsRefusedUnlessAccepted() throws Exception {
        Path fit = withChain(fitJson("BJD_TDB", "0.0", true), "chain.csv.gz", false);
        chain("chain.csv.gz", 0.001, "");
        assertBad("--k1", "95", "--k2", "118");
        assertThat(err.toString()).contains(fit.toString()).contains("convergence.converged").contains("did not converge")
                .contains("12 autocorrelation times").contains("--allow-unconverged");
        Path out = dir.resolve("accepted");
        assertThat(console.run("dimensions", "--fit", fit.toString(), "--k1", "95", "--k2", "118",
                "--allow-unconverged", "--out", out.toString())).as(err.toString()).isZero();
        assertThat(Files.readString(out.resolve("dimensions.txt"))).contains("NOT CONVERGED");
        assertThat(json(out.resolve("dimensions.json")).at("/method/uncertainties").asText()).contains("NOT CONVERGED");
    }

    @Test
    void badChainsAreBadInputNamingTheChainFile() throws Exception {
        Path fit = withChain(fitJson("BJD_TDB", "0.0", true), "chain.csv.gz", true);
        // missing
        assertBad("--k1", "95", "--k2", "118");
        assertThat(err.toString()).contains("chain.csv.gz").contains("not found");
        // not gzip
        Files.writeString(dir.resolve("chain.csv.gz"), "step,walker,logPosterior,radius1\n0,0,-1,0.1\n");
        assertBad("--k1", "95", "--k2", "118");
        assertThat(err.toString()).contains("chain.csv.gz").contains("gzip");
        // a column fit.json fits but the chain lacks
        Path gz = chain("chain.csv.gz", 0.001, "");
        String text = new String(new java.util.zip.GZIPInputStream(Files.newInputStream(gz)).readAllBytes(),
                java.nio.charset.StandardCharsets.UTF_8).replace(",inclination,", ",tilt,");
        try (java.io.OutputStream o = new java.util.zip.GZIPOutputStream(Files.newOutputStream(gz))) {
            o.write(text.getBytes(java.nio.charset.StandardCharsets.UTF_8));
        }
        assertBad("--k1", "95", "--k2", "118");
        assertThat(err.toString()).contains("chain.csv.gz").contains("header").contains("inclination");
        // a value that is not a number: row and column named
        String broken = text.replace(",tilt,", ",inclination,").replaceFirst("\n3,2,([^,]*),", "\n3,2,$1,");
        int at = broken.indexOf('\n', broken.indexOf('\n') + 1);
        broken = broken.substring(0, at + 1) + "0,1,-100.5,2460100.3812,0.105,abc,88.2,0.62,0.176\n"
                + broken.substring(at + 1);
        try (java.io.OutputStream o = new java.util.zip.GZIPOutputStream(Files.newOutputStream(gz))) {
            o.write(broken.getBytes(java.nio.charset.StandardCharsets.UTF_8));
        }
        assertBad("--k1", "95", "--k2", "118");
        assertThat(err.toString()).contains("chain.csv.gz").contains("row 3").contains("radius2").contains("abc");
        assertThat(fit).exists();
    }

    @Test
    void everyBadInputOfTheIssueGivesExitTwoNamingFileAndKey() throws Exception {
        // velocities with no second star when K2 is needed
        fitJson("BJD_TDB", "0.0", true);
        assertBad("--velocities", velocities("BJD_TDB", false).toString());
        assertThat(err.toString()).contains("rv.csv").contains("'v2'");
        // K <= 0, given
        assertBad("--k1", "95", "--k2", "0");
        assertThat(err.toString()).contains("--k2").contains("> 0");
        // a velocity file on another time scale than the light curve's fit.json
        assertBad("--velocities", velocities("BJD_UTC", true).toString());
        assertThat(err.toString()).contains("rv.csv").contains("BJD_UTC").contains("fit.json").contains("BJD_TDB");
        // e >= 1
        fitJson("BJD_TDB", "1.0", true);
        assertBad("--k1", "95", "--k2", "118");
        assertThat(err.toString()).contains("fit.json").contains("parameters.eccentricity").contains("0 <= e < 1");
        // a fit.json from another tool version, without the needed keys
        Path fit = Files.writeString(dir.resolve("fit.json"), "{\"software\": {\"name\": \"twinlight\", "
                + "\"version\": \"0.1\"}, \"result\": {\"r1\": 0.1}}");
        assertBad("--k1", "95", "--k2", "118");
        assertThat(err.toString()).contains(fit.toString()).contains("'parameters'").contains("another tool version");
        fitJson("BJD_TDB", "0.0", true);
        Files.writeString(fit, Files.readString(fit).replace("\"model\"", "\"oldModel\""));
        assertBad("--k1", "95", "--k2", "118");
        assertThat(err.toString()).contains(fit.toString()).contains("'model'");
        fitJson("BJD_TDB", "0.0", true);
        Files.writeString(fit, Files.readString(fit).replace("\"value\": 0.071", "\"value\": \"0.071\""));
        assertBad("--k1", "95", "--k2", "118");
        assertThat(err.toString()).contains(fit.toString()).contains("parameters.radius2.value");
        // temperatures <= 0
        fitJson("BJD_TDB", "0.0", true);
        assertBad("--k1", "95", "--k2", "118", "--teff1", "6000", "--teff2", "-50");
        assertThat(err.toString()).contains("--teff2").contains("> 0 K");
        assertBad("--k1", "95", "--k2", "118", "--teff1", "6000", "--teff1-error", "-1");
        assertThat(err.toString()).contains("--teff1-error");
    }

    @Test
    void anEccentricOrbitCarriesItsErrorsIntoTheMasses() throws Exception {
        // e = 0.3 ± 0.04 and omega = 140 ± 6 deg from the light curve: with the velocities the
        // orbit is combined and K refitted per draw; the mass errors must exceed those with e and
        // omega exact (the fixed-orbit K errors alone)
        double e = 0.3;
        double w = 140;
        RadialVelocityCurve curve = new RadialVelocityCurve(PERIOD, EPOCH, e, w);
        Random rng = new Random(8);
        StringBuilder sb = new StringBuilder("# time scale: BJD_TDB\ntime,v1,v1_err,v2,v2_err\n");
        for (int i = 0; i < 30; i++) {
            double t = EPOCH + 50 * rng.nextDouble();
            sb.append(String.format(Locale.ROOT, "%.5f,%.3f,1.5,%.3f,2.5%n", t, curve.velocity1(t, 55, 3)
                    + 1.5 * rng.nextGaussian(), curve.velocity2(t, 70, 3) + 2.5 * rng.nextGaussian()));
        }
        Path rv = Files.writeString(dir.resolve("rv-ecc.csv"), sb.toString());
        Path fit = fitJson("BJD_TDB", "0.31", true);
        String eccentric = Files.readString(fit)
                .replace("\"eccentricity\": {\"value\": 0.31, \"uncertainty\": 0.0, \"free\": false}",
                        "\"eccentricity\": {\"value\": 0.31, \"uncertainty\": 0.04, \"free\": true}")
                .replace("\"omega\": {\"value\": 90.0, \"uncertainty\": 0.0, \"free\": false}",
                        "\"omega\": {\"value\": 137.0, \"uncertainty\": 6.0, \"free\": true}")
                .replace("\"inclination\": 88.2,", "\"inclination\": 88.2, \"eccentricity\": 0.31, \"omega\": 137.0,");
        Files.writeString(fit, eccentric);
        Path out = dir.resolve("ecc");
        assertThat(console.run("dimensions", "--fit", fit.toString(), "--velocities", rv.toString(), "--out",
                out.toString())).as(err.toString()).isZero();
        JsonNode j = json(out.resolve("dimensions.json"));
        assertThat(j.at("/notes").toString()).contains("combines the light curve and the velocities");
        assertThat(j.at("/method/uncertainties").asText()).contains("refitted");
        // the combined e lies between the light curve's 0.31 and the truth 0.30, closer to the
        // velocities' (which know it to about 0.01)
        assertThat(j.at("/elements/eccentricity/value").asDouble()).isCloseTo(0.30, within(0.03));
        assertThat(j.at("/elements/eccentricity/uncertainty").asDouble()).isLessThan(0.04).isGreaterThan(0.002);
        // the truth by the handbook form (Torres et al. 2010, §3):
        // M1 sin³i = 1.036149e-7 (1−e²)^{3/2} (K1+K2)² K2 P, within 3σ of the result
        double m1 = 1.036149e-7 * Math.pow(1 - 0.09, 1.5) * Math.pow(125, 2) * 70 * PERIOD
                / Math.pow(Math.sin(Math.toRadians(88.2)), 3);
        double sigma = j.at("/star1/mass/uncertainty").asDouble();
        assertThat(Math.abs(j.at("/star1/mass/value").asDouble() - m1)).isLessThan(3 * sigma);
        assertThat(j.at("/warnings").toString()).doesNotContain("disagree");
        // e and omega that the velocities exclude (e = 0.10 +- 0.01): a warning that the orbits disagree
        Files.writeString(fit, eccentric.replace("\"value\": 0.31, \"uncertainty\": 0.04", "\"value\": 0.10, "
                + "\"uncertainty\": 0.01").replace("\"eccentricity\": 0.31", "\"eccentricity\": 0.10"));
        Path out2 = dir.resolve("ecc-disagree");
        console.run("dimensions", "--fit", fit.toString(), "--velocities", rv.toString(), "--draws", "2000", "--out",
                out2.toString());
        assertThat(this.out.toString() + err).contains("disagree");
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
