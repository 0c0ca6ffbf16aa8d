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
    /** A demo system (invented), as a model file. */
    static final String MODEL = """
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
        // truth 0.13 + 0.09 = 0.22 (the model above); a 5σ window of the fit's own uncertainty
        JsonNode sum = json.at("/derived/sumOfRadii");
        assertThat(sum.get("uncertainty").asDouble()).isBetween(1e-6, 0.005);
        assertThat(Math.abs(sum.get("value").asDouble() - 0.22)).isLessThan(5 * sum.get("uncertainty").asDouble());
        // a single file that names no band is the default band, and fit.json says so
        assertThat(json.at("/input/files/0/band").asText()).isEqualTo(FitCommand.DEFAULT_BAND);
        assertThat(json.at("/input/files/0/bandSource").asText()).isEqualTo("default");
        assertThat(json.at("/adequacy/describesData").asBoolean()).isTrue();
        assertThat(json.at("/statistics/clipped/total").asInt()).isZero();
        assertThat(json.at("/statistics/reducedChi2").asDouble()).isBetween(0.8, 1.2);
        assertThat(json.at("/input/sha256").asText()).hasSize(64);
        assertThat(json.at("/caution").asText()).contains("spherical");
        // no temporary files left behind
        try (var files = Files.list(out)) {
            assertThat(files.map(p -> p.getFileName().toString())).noneMatch(n -> n.endsWith(".part"));
        }
    }

    @Test
    void simulateTakesTimesFromAOneColumnFile() throws Exception {
        // regression: --times asks only for a first column of times, but a file of one column was refused
        Path model = Files.writeString(dir.resolve("model.json"), MODEL);
        Path times = Files.writeString(dir.resolve("times.txt"), "2460300.10\n2460300.20\n2460300.25\n2460300.30\n");
        Path csv = dir.resolve("sim.csv");
        Run sim = run("simulate", "--model", model.toString(), "--times", times.toString(), "--out", csv.toString());
        assertThat(sim.code()).as(sim.err()).isZero();
        assertThat(Files.readAllLines(csv).stream().filter(l -> l.startsWith("24603")).count()).isEqualTo(4);
    }

    @Test
    void modelFileWithTrailingTextIsExitTwo() throws Exception {
        Path model = Files.writeString(dir.resolve("model.json"), MODEL + "\n{\"period\": 3}\n");
        Run sim = run("simulate", "--model", model.toString(), "--start", "2460300", "--end", "2460301",
                "--cadence", "5", "--out", dir.resolve("s.csv").toString());
        assertThat(sim.code()).isEqualTo(2);
        assertThat(sim.err()).contains("model.json").contains("line 9").contains("after the end");
    }

    @Test
    void badProximityValuesAreExitTwoNamingTheKey() throws Exception {
        String at = "\"surfaceBrightnessRatio\": 0.6,";
        for (String[] bad : new String[][] {
            {"\"reflection\": {\"albedo1\": 1.5, \"albedo2\": 0.3},", "reflection.albedo1"},
            {"\"massRatio\": -0.4,", "massRatio"},
            {"\"ellipsoidal\": {\"gravityDarkening1\": 0.3, \"gravityDarkening2\": 0.3},", "massRatio"},
            {"\"beaming\": {\"factor1\": 1.0, \"factor2\": 1.0},", "k1"}}) {
            Path model = Files.writeString(dir.resolve("close.json"), MODEL.replace(at, at + " " + bad[0]));
            Run sim = run("simulate", "--model", model.toString(), "--start", "2460300", "--end", "2460301",
                    "--cadence", "5", "--out", dir.resolve("s.csv").toString());
            assertThat(sim.code()).as(bad[0]).isEqualTo(2);
            assertThat(sim.err()).as(bad[0]).contains("close.json").contains(bad[1]).doesNotContain("Exception");
        }
        // and the fit's airmass option: a file without the column, or a missing site
        Path model = Files.writeString(dir.resolve("m.json"), MODEL);
        Path csv = dir.resolve("s.csv");
        assertThat(run("simulate", "--model", model.toString(), "--start", "2460300", "--end", "2460301",
                "--cadence", "5", "--time-scale", "BJD_TDB", "--out", csv.toString()).code()).isZero();
        Run column = run("fit", csv.toString(), "--model", model.toString(), "--airmass", "column", "--out",
                dir.resolve("o1").toString());
        assertThat(column.code()).isEqualTo(2);
        assertThat(column.err()).contains("--airmass column").contains("no airmass column");
        Run noSite = run("fit", csv.toString(), "--model", model.toString(), "--airmass", "computed", "--ra", "10",
                "--dec", "20", "--out", dir.resolve("o2").toString());
        assertThat(noSite.code()).isEqualTo(2);
        assertThat(noSite.err()).contains("--site");
    }

    @Test
    void absurdPeriodOrSupersampleIsExitTwoNamingTheKeyAndRange() throws Exception {
        for (String[] bad : new String[][] {{"\"period\": 2.61", "\"period\": 1e-12", "period"},
            {"\"period\": 2.61", "\"period\": 1e308", "period"},
            {"\"surfaceBrightnessRatio\": 0.6,", "\"surfaceBrightnessRatio\": 0.6, \"exposureTime\": 0.02, "
                + "\"supersample\": 100000000,", "supersample"}}) {
            Path model = Files.writeString(dir.resolve("bad.json"), MODEL.replace(bad[0], bad[1]));
            Run sim = run("simulate", "--model", model.toString(), "--start", "2460300", "--end", "2460301",
                    "--cadence", "5", "--out", dir.resolve("s.csv").toString());
            assertThat(sim.code()).as(bad[1]).isEqualTo(2);
            assertThat(sim.err()).contains("bad.json").contains(bad[2] + " must be").contains(" to ");
        }
    }

    @Test
    void fitLeavesOutliersAndSaysSoWithoutTouchingTheInput() throws Exception {
        Path model = Files.writeString(dir.resolve("model.json"), MODEL);
        Path csv = dir.resolve("sim.csv");
        assertThat(run("simulate", "--model", model.toString(), "--start", "2460300", "--end", "2460304",
                "--cadence", "5", "--noise-ppm", "1000", "--seed", "8", "--out", csv.toString()).code()).isZero();
        java.util.List<String> lines = new java.util.ArrayList<>(Files.readAllLines(csv));
        int changed = 0;
        for (int i = 0; i < lines.size(); i++) {
            if (lines.get(i).startsWith("24603") && i % 97 == 0) {
                String[] f = lines.get(i).split(",");
                f[1] = Double.toString(Double.parseDouble(f[1]) - 0.03);
                lines.set(i, String.join(",", f));
                changed++;
            }
        }
        Path bad = Files.write(dir.resolve("with-outliers.csv"), lines);
        byte[] before = Files.readAllBytes(bad);
        Path out = dir.resolve("clipped");
        Run fit = run("fit", bad.toString(), "--model", model.toString(), "--out", out.toString());
        assertThat(fit.code()).as(fit.err()).isZero();
        JsonNode json = new ObjectMapper().readTree(out.resolve("fit.json").toFile());
        assertThat(json.at("/statistics/clipped/byReason/belowModel").asInt()).isEqualTo(changed);
        assertThat(json.at("/statistics/clipped/byReason/aboveModel").asInt()).isZero();
        assertThat(Files.readAllBytes(bad)).isEqualTo(before);
        Path keep = dir.resolve("kept");
        assertThat(run("fit", bad.toString(), "--model", model.toString(), "--clip", "none", "--out",
                keep.toString()).code()).isZero();
        JsonNode all = new ObjectMapper().readTree(keep.resolve("fit.json").toFile());
        assertThat(all.at("/statistics/clipped/total").asInt()).isZero();
        assertThat(all.at("/statistics/n").asInt()).isEqualTo(json.at("/statistics/n").asInt() + changed);
        assertThat(run("fit", bad.toString(), "--model", model.toString(), "--clip", "2", "--out",
                dir.resolve("x").toString()).code()).isEqualTo(2);
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

    /** sim.csv: the model from {@code start} to {@code end} at 10-min cadence, 500 ppm. */
    private Path simulated(Path model, String start, String end) {
        Path csv = dir.resolve("sim.csv");
        assertThat(run("simulate", "--model", model.toString(), "--start", start, "--end", end,
                "--cadence", "10", "--noise-ppm", "500", "--out", csv.toString()).code()).isZero();
        return csv;
    }

    @Test
    void startingModelWithNoEclipseInTheDataIsExitOneWithAdvice() throws Exception {
        Path model = Files.writeString(dir.resolve("model.json"), MODEL);
        // times between eclipses only
        Path csv = simulated(model, "2460300.5", "2460300.9");
        Run r = run("fit", csv.toString(), "--model", model.toString(), "--out", dir.resolve("o").toString());
        assertThat(r.code()).isEqualTo(1);
        assertThat(r.err()).contains("no eclipse").contains("epoch");
    }

    /**
     * A model epoch in the offset form BJD − 2457000 (3300.25 for 2460300.25) against full Julian
     * dates: refused (exit 2) naming the model file, the key and the full date, not left to end in
     * "no eclipse"; an epoch in MJD form likewise.
     */
    @Test
    void modelEpochInAnOffsetFormIsExitTwoNamingTheOffset() throws Exception {
        Path csv = simulated(Files.writeString(dir.resolve("model.json"), MODEL), "2460300", "2460303");
        Path offset = Files.writeString(dir.resolve("offset.json"), MODEL.replace("2460300.25", "3300.25"));
        Run r = run("fit", csv.toString(), "--model", offset.toString(), "--out", dir.resolve("o").toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("offset.json").contains("key 'epoch'").contains("BJD − 2457000")
                .contains("2460300.25").doesNotContain("no eclipse").doesNotContain("Exception");
        // MJD 60299.75 = JD 2460300.25 (MJD = JD − 2400000.5)
        Path mjd = Files.writeString(dir.resolve("mjd.json"), MODEL.replace("2460300.25", "60299.75"));
        r = run("fit", csv.toString(), "--model", mjd.toString(), "--out", dir.resolve("o").toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("mjd.json").contains("key 'epoch'").contains("MJD").contains("2460300.25");
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
