package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.twinlight.orbit.RadialVelocityCurve;

/** {@code analyse} with the stages after the fit: dimensions from K given or fitted jointly, the posterior. */
class AnalyseAfterFitTest {
    // Demo system (invented): the detached, slightly eccentric pair of JointFitCommandTest.
    private static final double PERIOD = 2.8731;
    private static final double EPOCH = 2460000.4123;
    private static final double E = 0.12;
    private static final double OMEGA = 70.0;
    private static final double INCLINATION = 87.6;
    private static final double K1 = JointFitCommandTest.K1;
    private static final double K2 = JointFitCommandTest.K2;
    private static final String MODEL = JointFitCommandTest.MODEL;
    /** A quick analysis: the period and a start given, one start, a few free parameters. */
    private static final String FREE = "epoch,radius1,radius2,inclination,surfaceBrightnessRatio";

    @TempDir
    static Path dir;
    private static Path lightCurve;
    private static Path start;
    private static Path rv;

    private record Run(int code, String out, String err) {
    }

    private static Run run(String... args) {
        ConsoleCapture console = new ConsoleCapture();
        int code = console.run(args);
        return new Run(code, console.out.toString(), console.err.toString());
    }

    @BeforeAll
    static void files() throws Exception {
        Path model = Files.writeString(dir.resolve("truth.json"), MODEL);
        lightCurve = dir.resolve("lc.csv");
        assertThat(run("simulate", "--model", model.toString(), "--start", "2460000", "--end", "2460006",
                "--cadence", "10", "--noise-ppm", "2000", "--seed", "3", "--time-scale", "BJD_TDB", "--out",
                lightCurve.toString()).code()).isZero();
        start = Files.writeString(dir.resolve("start.json"), MODEL.replace("0.118", "0.121")
                .replace("87.6", "87.2"));
        RadialVelocityCurve c = new RadialVelocityCurve(PERIOD, EPOCH, E, OMEGA);
        Random rng = new Random(11);
        StringBuilder sb = new StringBuilder("# time scale: BJD_TDB\ntime,v1,v1_err,v2,v2_err\n");
        for (int i = 0; i < 30; i++) {
            double t = 2460000 + 40 * PERIOD * rng.nextDouble();
            double s = c.shape(t);
            sb.append(String.format(Locale.ROOT, "%.5f,%.3f,1.5,%.3f,2.0%n", t, -12.3 + K1 * s
                    + 1.5 * rng.nextGaussian(), -12.3 - K2 * s + 2.0 * rng.nextGaussian()));
        }
        rv = Files.writeString(dir.resolve("rv.csv"), sb.toString());
    }

    private static List<String> quick(Path out, String... more) {
        List<String> a = new ArrayList<>(List.of("analyse", lightCurve.toString(), "--period", Double.toString(PERIOD),
                "--model", start.toString(), "--starts", "1", "--free", FREE, "--out", out.toString()));
        a.addAll(List.of(more));
        return a;
    }

    /**
     * M sin³i of each star from P, K1, K2 and e (Hilditch 2001, An Introduction to Close Binary Stars,
     * §2.5, from memory): M1 sin³i = (1 − e²)^{3/2} (K1 + K2)² K2 P / (2π G), in nominal solar
     * masses with the nominal solar mass parameter GM = 1.3271244e20 m³ s⁻² (IAU 2015 Resolution B3).
     */
    static double trueMass(int star) {
        double periodSeconds = PERIOD * 86400;
        double k1 = K1 * 1e3;
        double k2 = K2 * 1e3;
        double mSin3i = Math.pow(1 - E * E, 1.5) * (k1 + k2) * (k1 + k2) * (star == 1 ? k2 : k1) * periodSeconds
                / (2 * Math.PI * 1.3271244e20);
        return mSin3i / Math.pow(Math.sin(Math.toRadians(INCLINATION)), 3);
    }

    private static JsonNode json(Path f) throws Exception {
        return new ObjectMapper().readTree(f.toFile());
    }

    @Test
    void givenSemiAmplitudesGiveTheMassesOfKeplersThirdLaw() throws Exception {
        Path out = dir.resolve("k");
        Run r = run(quick(out, "--k1", "62.0", "--k1-error", "0.5", "--k2", "85.0", "--k2-error", "0.6",
                "--teff1", "6100", "--teff1-error", "100").toArray(String[]::new));
        assertThat(r.code()).as(r.out() + r.err()).isZero();
        for (String f : List.of("dimensions.json", "dimensions.txt", "mass-radius.png", "mass-luminosity.png")) {
            assertThat(out.resolve(f)).exists();
        }
        JsonNode d = json(out.resolve("dimensions.json"));
        for (int star = 1; star <= 2; star++) {
            JsonNode m = d.at("/star" + star + "/mass");
            // the K errors give about 1.5% in mass; 4σ fails for a correct result once in 16,000
            assertThat(Math.abs(m.get("value").asDouble() - trueMass(star))).as("M" + star)
                    .isLessThan(4 * m.get("uncertainty").asDouble());
        }
        JsonNode results = json(out.resolve("results.json"));
        assertThat(results.at("/dimensions/star1/mass")).isEqualTo(d.at("/star1/mass"));
        assertThat(results.at("/dimensions/star1/logLuminosity").isObject()).isTrue();
        assertThat(r.out()).contains("M1 = ").contains("M2 = ");
        assertThat(Files.readString(out.resolve("report.html"))).contains("id=\"dimensions\"")
                .contains("mass-radius.png");
    }

    @Test
    void velocitiesAreFittedJointlyAndGiveTheDimensions() throws Exception {
        Path out = dir.resolve("rv");
        Run r = run(quick(out, "--velocities", rv.toString()).toArray(String[]::new));
        assertThat(r.code()).as(r.out() + r.err()).isZero();
        JsonNode fit = json(out.resolve("fit.json"));
        assertThat(fit.at("/velocities/k1/value").asDouble()).isBetween(K1 - 3, K1 + 3);
        assertThat(out.resolve("velocities.png")).exists();
        JsonNode d = json(out.resolve("dimensions.json"));
        assertThat(d.at("/input/velocities").asText()).contains("jointly").contains("rv.csv");
        for (int star = 1; star <= 2; star++) {
            JsonNode m = d.at("/star" + star + "/mass");
            assertThat(Math.abs(m.get("value").asDouble() - trueMass(star))).as("M" + star)
                    .isLessThan(4 * m.get("uncertainty").asDouble());
        }
        assertThat(out.resolve("mass-luminosity.png")).doesNotExist();
    }

    @Test
    void posteriorWritesTheChainPlotsAndAutocorrelationTimes() throws Exception {
        Path out = dir.resolve("post");
        Run r = run(quick(out, "--posterior", "--max-steps", "40", "--walkers", "12", "--threads", "1")
                .toArray(String[]::new));
        // 40 steps cannot converge: exit 1 with the files and a report that says why
        assertThat(r.code()).as(r.out() + r.err()).isEqualTo(1);
        for (String f : List.of("chain.csv.gz", "trace.png", "corner.png", "fit.json", "report.html")) {
            assertThat(out.resolve(f)).exists();
        }
        JsonNode fit = json(out.resolve("fit.json"));
        assertThat(fit.at("/convergence/converged").asBoolean()).isFalse();
        assertThat(fit.at("/posterior/radius1/median").isNumber()).isTrue();
        assertThat(fit.at("/convergence/steps").asInt()).isEqualTo(40);
        String html = Files.readString(out.resolve("report.html"));
        assertThat(html).contains("id=\"posterior\"").contains("Not converged").contains("has not converged");
    }

    @Test
    void settingsUsedRepeatTheDimensions() throws Exception {
        Path out = dir.resolve("first");
        assertThat(run(quick(out, "--k1", "62", "--k2", "85", "--k2-error", "0.7", "--draws", "500")
                .toArray(String[]::new)).code()).isZero();
        JsonNode used = json(out.resolve("settings-used.json"));
        assertThat(used.get("k2Error").asDouble()).isEqualTo(0.7);
        assertThat(used.get("draws").asInt()).isEqualTo(500);
        Path again = dir.resolve("again");
        Run r = run("analyse", "--settings", out.resolve("settings-used.json").toString(), "--out", again.toString());
        assertThat(r.code()).as(r.out() + r.err()).isZero();
        assertThat(json(again.resolve("dimensions.json")).get("star1"))
                .isEqualTo(json(out.resolve("dimensions.json")).get("star1"));
        assertThat(Files.readString(again.resolve("settings-used.json")))
                .isEqualTo(Files.readString(out.resolve("settings-used.json")));
    }

    @Test
    void badInputIsExitTwoNamingTheFileOrKey() {
        Path out = dir.resolve("bad");
        Run missing = run(quick(out, "--velocities", dir.resolve("nowhere.csv").toString()).toArray(String[]::new));
        assertThat(missing.code()).isEqualTo(2);
        assertThat(missing.err()).contains("nowhere.csv").contains("no such file").doesNotContain("Exception");
        Run half = run(quick(out, "--k1", "60").toArray(String[]::new));
        assertThat(half.code()).isEqualTo(2);
        assertThat(half.err()).contains("'k2'").contains("missing");
        Run both = run(quick(out, "--k1", "60", "--k2", "80", "--velocities", rv.toString()).toArray(String[]::new));
        assertThat(both.code()).isEqualTo(2);
        assertThat(both.err()).contains("not both");
        Run orphan = run(quick(out, "--teff1-error", "80").toArray(String[]::new));
        assertThat(orphan.code()).isEqualTo(2);
        assertThat(orphan.err()).contains("'teff1Error'").contains("without its value");
        assertThat(out.resolve("report.html")).doesNotExist();
    }
    @Test
    void batchRowsWithVelocitiesOrSemiAmplitudesPutTheMassesInTheSummary() throws Exception {
        Path folder = Files.createDirectories(dir.resolve("survey"));
        Files.copy(lightCurve, folder.resolve("lc.csv"));
        Files.copy(rv, folder.resolve("rv.csv"));
        Files.copy(start, folder.resolve("start.json"));
        Files.writeString(folder.resolve("quick.json"), "{\"starts\": 1, \"free\": [\"" + FREE.replace(",", "\", \"")
                + "\"], \"draws\": 500}");
        Path manifest = Files.writeString(folder.resolve("targets.csv"), String.format(Locale.ROOT, """
                file,label,period,model,settings,velocities,k1,k2
                lc.csv,joint,%s,start.json,quick.json,rv.csv,,
                lc.csv,given,%s,start.json,quick.json,,62,85
                lc.csv,none,%s,start.json,quick.json,,,
                """, PERIOD, PERIOD, PERIOD));
        Path out = dir.resolve("batch");
        Run r = run("batch", manifest.toString(), "--out", out.toString(), "--threads", "1");
        assertThat(r.code()).as(r.out() + r.err()).isZero();
        List<String> lines = Files.readAllLines(out.resolve("summary.csv")).stream().filter(l -> !l.startsWith("#"))
                .toList();
        List<String> header = List.of(lines.get(0).split(","));
        assertThat(header).contains("mass1", "mass1_uncertainty", "mass2", "radius1Rsun", "radius2Rsun_uncertainty");
        int mass1 = header.indexOf("mass1");
        for (String line : lines.subList(1, lines.size())) {
            // the message cell is quoted and may hold commas: count from the end of the row
            String[] cells = line.split(",", -1);
            String value = cells[cells.length - header.size() + mass1];
            if (line.startsWith("none,")) {
                assertThat(value).as(line).isEmpty();
            } else {
                assertThat(Double.parseDouble(value)).as(line).isBetween(0.9 * trueMass(1), 1.1 * trueMass(1));
            }
        }
    }
}
