package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

class MinimaCommandTest {

    private static final double PERIOD = 2.5;
    private static final double EPOCH = 2460000.3;
    private static final double HALF_DURATION = 0.08;

    private static double dip(double x) {
        double u = x / HALF_DURATION;
        return Math.abs(u) >= 1 ? 0 : Math.pow(1 - u * u, 1.5);
    }

    /**
     * A synthetic light curve (smooth symmetric dips, 2-min cadence, noise 0.002) over 20 days,
     * with its observations stopping in the middle of the primary eclipse of cycle 4 (partial
     * coverage, timed from the template) and a period change Q = 3e-5 d.
     */
    static Path writeLightCurve(Path dir) throws IOException {
        return writeLightCurve(dir, EPOCH);
    }

    /** The same light curve with its primary of cycle 0 at {@code epoch}. */
    static Path writeLightCurve(Path dir, double epoch) throws IOException {
        StringBuilder sb = new StringBuilder("time,flux,flux_err\n");
        Random random = new Random(3);
        double q = 3e-5;
        for (double t = epoch - 0.5; t < epoch + 20; t += 2.0 / 1440) {
            double tPrimary4 = epoch + 4 * PERIOD;
            if (t > tPrimary4 - 0.02 && t < tPrimary4 + 0.3) {
                continue;
            }
            long n = Math.round((t - epoch) / PERIOD);
            double f = 1;
            for (long k = n - 1; k <= n + 1; k++) {
                f -= 0.3 * dip(t - (epoch + k * PERIOD + q * k * k));
                f -= 0.12 * dip(t - (epoch + (k + 0.5) * PERIOD + q * k * k));
            }
            sb.append(String.format(Locale.ROOT, "%.7f,%.6f,0.002%n", t, f + 0.002 * random.nextGaussian()));
        }
        Path file = dir.resolve("synthetic-system.csv");
        Files.writeString(file, sb.toString());
        return file;
    }

    private static CommandLine commandLine(StringWriter out, StringWriter err) {
        CommandLine cl = TwinlightCommand.commandLine();
        // Until the command is registered in TwinlightCommand; afterwards the registered one is used.
        if (!cl.getSubcommands().containsKey("minima")) {
            cl.addSubcommand("minima", new MinimaCommand());
        }
        cl.setOut(new PrintWriter(out));
        cl.setErr(new PrintWriter(err));
        return cl;
    }

    @Test
    void writesAllFilesAndExitsZero(@TempDir Path dir) throws IOException {
        Path file = writeLightCurve(dir);
        Path out = dir.resolve("out");
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        int code = commandLine(o, e).execute("minima", file.toString(), "--period", String.valueOf(PERIOD),
                "--epoch", String.valueOf(EPOCH), "--out", out.toString(), "--time-scale", "BJD_TDB",
                "--observer", "A. Nonymous", "--band", "V", "--object", "Synthetic Pair 1", "--ra", "12:34:56.78",
                "--dec", "-05:06:07.8");
        assertThat(code).as(e.toString()).isZero();
        for (String name : List.of("minima.csv", "ephemeris.json", "o-c.png", "minima-submission.txt")) {
            assertThat(out.resolve(name)).isRegularFile();
        }
        List<String> csv = Files.readAllLines(out.resolve("minima.csv"));
        assertThat(csv.get(0)).startsWith("#").contains("BJD_TDB");
        assertThat(csv).anyMatch(l -> l.startsWith("cycle,type,time,error,method,n_points,"));
        assertThat(csv.stream().filter(l -> l.contains(",template,")).count()).isGreaterThanOrEqualTo(14);
        assertThat(csv.stream().filter(l -> l.contains(",kvw,")).count()).isGreaterThanOrEqualTo(14);
        assertThat(csv.stream().anyMatch(l -> l.startsWith("4.5,secondary,"))).isTrue();

        JsonNode json = new ObjectMapper().readTree(out.resolve("ephemeris.json").toFile());
        assertThat(json.get("timeScale").asText()).isEqualTo("BJD_TDB");
        assertThat(json.at("/period/value").asDouble()).isBetween(PERIOD - 1e-3, PERIOD + 1e-3);
        assertThat(json.at("/period/uncertainty").asDouble()).isPositive();
        // Injected T = T0 + P·E + Q·E² with Q = 3e-5 d: dP/dE = 2Q = 6e-5 d/cycle. Accept 4σ of the
        // fit's own error, and require that band to be narrower than 3e-5 so that a factor-2 error
        // in dP/dE (3e-5 or 1.2e-4) cannot pass.
        double dPdE = json.at("/quadratic/dPdE/value").asDouble();
        double dPdESigma = json.at("/quadratic/dPdE/uncertainty").asDouble();
        assertThat(dPdESigma).isPositive().isLessThan(3e-5 / 4);
        assertThat(dPdE).isCloseTo(6e-5, within(4 * dPdESigma));
        assertThat(json.at("/bic/preferred").asText()).isEqualTo("quadratic");
        assertThat(json.at("/modelChoice/periodChange").asBoolean()).isTrue();
        assertThat(json.at("/modelChoice/deltaBicThreshold").asDouble()).isEqualTo(6.0);
        // The primary of cycle 4 is cut by the end of the data: timed from the template, flagged.
        assertThat(csv).anyMatch(l -> l.startsWith("4,primary,") && l.contains(",template,") && l.endsWith(",partial"));
        assertThat(csv).noneMatch(l -> l.startsWith("4,primary,") && l.contains(",kvw,"));
        assertThat(json.get("skipped")).isNotNull();

        assertThat(json.get("caution").asText()).contains("symmetric").contains("before submission");
        String table = Files.readString(out.resolve("minima-submission.txt"));
        assertThat(table).contains("# Caution: The times of minimum depend on").contains("before");
        assertThat(table).contains("Time scale: BJD_TDB").contains("OBSERVER").contains("A. Nonymous")
                .contains("FILTER").contains("# Object: Synthetic Pair 1")
                .contains("RA 12:34:56.78 = 188.736583 deg, Dec -05:06:07.8 = -5.102167 deg");
        assertThat(o.toString()).contains("partly covered").contains("preferred: quadratic")
                .doesNotContain("warning");
        List<String> rows = table.lines().filter(l -> !l.startsWith("#")).toList();
        assertThat(rows).hasSize((int) csv.stream().filter(l -> l.contains(",template,")).count());
        for (String row : rows) {
            String[] f = row.trim().split("\\s+", 10);
            assertThat(Double.parseDouble(f[0])).isBetween(EPOCH - 1, EPOCH + 21);
            assertThat(Double.parseDouble(f[1])).isPositive();
            assertThat(f[2]).isIn("P", "S");
            assertThat(f[5]).isEqualTo("TPL");
            assertThat(f[7]).isIn("full", "part");
            assertThat(f[8]).isEqualTo("V");
            assertThat(f[9]).isEqualTo("A. Nonymous");
        }
    }

    @Test
    void reflectionTimingsAgainstTheFittedEphemeris(@TempDir Path dir) throws IOException {
        Path file = writeLightCurve(dir);
        Path out = dir.resolve("out");
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        int code = commandLine(o, e).execute("minima", file.toString(), "--period", String.valueOf(PERIOD),
                "--epoch", String.valueOf(EPOCH), "--out", out.toString(), "--method", "kvw", "--oc-reference",
                "fitted", "--window", "300min", "--allow-unknown-scale");
        assertThat(code).as(e.toString()).isZero();
        JsonNode json = new ObjectMapper().readTree(out.resolve("ephemeris.json").toFile());
        assertThat(json.get("method").asText()).isEqualTo("kvw");
        assertThat(json.get("timeScale").asText()).isEqualTo("unknown");
        assertThat(json.at("/windowDays/primary").asDouble()).isCloseTo(300.0 / 1440, within(1e-12));
        // Against the fitted linear ephemeris the linear fit's own corrections vanish.
        assertThat(json.at("/ocReference/period").asDouble()).isCloseTo(json.at("/period/value").asDouble(),
                within(1e-6));
        assertThat(Files.readString(out.resolve("minima-submission.txt"))).contains("KVW").contains("Time scale: unknown");
    }

    @Test
    void epochAtTheShallowerEclipseIsWarnedAbout(@TempDir Path dir) throws IOException {
        Path file = writeLightCurve(dir);
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        int code = commandLine(o, e).execute("minima", file.toString(), "--period", String.valueOf(PERIOD),
                "--epoch", String.valueOf(EPOCH + PERIOD / 2), "--out", dir.resolve("out").toString(),
                "--allow-unknown-scale");
        assertThat(code).as(e.toString()).isZero();
        assertThat(o.toString()).contains("warning").contains("epoch may be a secondary minimum");
    }

    /**
     * Phase of the secondary conjunction after the primary one, from the exact Kepler solution:
     * conjunctions at ν + ω = 90° (primary) and 270° (secondary) (Kallrath &amp; Milone 2009, Eclipsing
     * Binary Stars, 2nd ed., §3.1), ν → E by tan(E/2) = √((1−e)/(1+e)) tan(ν/2), M = E − e sin E
     * (Kepler's equation). At i = 89° the least projected separation, hence the minimum, comes 8 s after
     * the secondary conjunction (the (dr/dν)/r · cos²i term; independent estimate in docs/timing.md).
     */
    private static double secondaryConjunctionPhase(double e, double omegaDeg) {
        double[] meanAnomaly = new double[2];
        for (int k = 0; k < 2; k++) {
            double nu = Math.toRadians(90 + 180 * k - omegaDeg);
            double ecc = 2 * Math.atan(Math.sqrt((1 - e) / (1 + e)) * Math.tan(nu / 2));
            meanAnomaly[k] = ecc - e * Math.sin(ecc);
        }
        double phase = (meanAnomaly[1] - meanAnomaly[0]) / (2 * Math.PI);
        return phase - Math.floor(phase);
    }

    /**
     * e = 0.32, ω = 35°, P = 4.6123 d, 27 d at 2-min cadence, 800 ppm: the secondary lies at phase
     * 0.668, inside the range searched around the default phase 0.5 but far from 0.5. It is found,
     * said to be found, and every secondary is timed at the phase Kepler's equation gives.
     */
    @Test
    void eccentricSecondaryAwayFromHalfPhaseIsFoundAndTimed(@TempDir Path dir) throws IOException {
        double period = 4.6123;
        double epoch = 2460100.5;
        double e = 0.32;
        double omegaDeg = 35;
        double expected = secondaryConjunctionPhase(e, omegaDeg);
        // First-order form, Kallrath & Milone 2009 eq. (3.1.24): e cos ω = (π/2)(Δφ − ½) gives 0.6669;
        // the exact phase must lie near it (the e³ terms move it by < 0.002).
        assertThat(expected).isCloseTo(0.5 + 2 / Math.PI * e * Math.cos(Math.toRadians(omegaDeg)), within(0.002));
        Path model = dir.resolve("eccentric.model.json");
        Files.writeString(model, String.format(Locale.ROOT, "{\"period\":%s,\"epoch\":%s,\"radius1\":0.08,"
                + "\"radius2\":0.06,\"inclination\":89.0,\"eccentricity\":%s,\"omega\":%s,"
                + "\"surfaceBrightnessRatio\":0.8,\"thirdLight\":0.0,"
                + "\"limbDarkening1\":{\"law\":\"quadratic\",\"coefficients\":[0.4,0.2]},"
                + "\"limbDarkening2\":{\"law\":\"quadratic\",\"coefficients\":[0.45,0.2]}}", period, epoch, e,
                omegaDeg));
        Path curve = dir.resolve("eccentric.csv");
        StringWriter o = new StringWriter();
        StringWriter err = new StringWriter();
        int code = commandLine(o, err).execute("simulate", "--model", model.toString(), "--start", "2460100",
                "--end", "2460127", "--cadence", "2", "--noise-ppm", "800", "--seed", "3", "--time-scale", "BJD_TDB",
                "--out", curve.toString());
        assertThat(code).as(err.toString()).isZero();
        Path out = dir.resolve("out");
        code = commandLine(o, err).execute("minima", curve.toString(), "--period", String.valueOf(period),
                "--epoch", String.valueOf(epoch), "--out", out.toString());
        assertThat(code).as(err.toString()).isZero();
        assertThat(o.toString()).containsPattern("one is seen at phase 0\\.66[6-9]");
        List<String[]> secondaries = Files.readAllLines(out.resolve("minima.csv")).stream()
                .filter(l -> l.contains(",secondary,") && l.contains(",template,")).map(l -> l.split(",")).toList();
        assertThat(secondaries).hasSize(6);
        for (String[] row : secondaries) {
            double cycle = Double.parseDouble(row[0]);
            double phase = (Double.parseDouble(row[2]) - epoch) / period - Math.floor(cycle);
            // 0.0002 phase = 80 s: the first-order phase (5 min away) or the default 0.5 cannot pass.
            assertThat(phase).as("cycle %s", cycle).isCloseTo(expected, within(2e-4));
        }
    }

    /** Exit code and standard error of one run. */
    private record Run(int code, String err) {
    }

    /** Runs {@code minima FILE --period P --epoch 2460000.3 --out DIR/out}. */
    private static Run runWithPeriod(Path dir, Path file, String period) {
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        int code = commandLine(o, e).execute("minima", file.toString(), "--period", period, "--epoch", "2460000.3",
                "--out", dir.resolve("out").toString());
        return new Run(code, e.toString());
    }

    /** Runs minima on the synthetic light curve with the given --epoch and extra options (unknown scale allowed). */
    private static Run runWithEpoch(Path dir, String epoch, String... extra) throws IOException {
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        List<String> args = new java.util.ArrayList<>(List.of("minima", writeLightCurve(dir).toString(), "--period",
                String.valueOf(PERIOD), "--epoch", epoch, "--out", dir.resolve("out").toString(),
                "--allow-unknown-scale"));
        args.addAll(List.of(extra));
        int code = commandLine(o, e).execute(args.toArray(String[]::new));
        return new Run(code, e.toString());
    }

    /** An epoch far from the data is refused naming --epoch and the cycles between, not --window. */
    @Test
    void epochFarFromTheDataIsExitTwoNamingTheEpoch(@TempDir Path dir) throws IOException {
        Run r = runWithEpoch(dir, "1e15");
        assertThat(r.code()).isEqualTo(2);
        // (1e15 − 2460020) / 2.5 = 4.0e14 cycles
        assertThat(r.err()).contains("--epoch").contains("4.00e+14 cycles").contains("after the data")
                .doesNotContain("--window").doesNotContain("Exception");
        // The epoch in the offset form JD − 2450000 (10000.3 for 2460000.3) names the full date.
        r = runWithEpoch(dir, "10000.3");
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("JD − 2450000").contains("2460000.3");
    }

    @Test
    void raWithoutDecNamesTheMissingOption(@TempDir Path dir) throws IOException {
        Run r = runWithEpoch(dir, String.valueOf(EPOCH), "--ra", "10");
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("option --dec is missing").contains("only --ra was given");
    }

    @Test
    void badFileExitsTwoNamingTheFile(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("broken.csv");
        Files.writeString(file, "this is not photometry\nat all\n");
        Run r = runWithPeriod(dir, file, "2.5");
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("broken.csv").doesNotContain("Exception");
    }

    @Test
    void nonPositivePeriodExitsTwoNamingTheValue(@TempDir Path dir) throws IOException {
        Run r = runWithPeriod(dir, writeLightCurve(dir), "-2.5");
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("--period").contains("-2.5");
    }

    /** A two-band file is measured band by band: --band chooses the band, without it the bands are listed. */
    @Test
    void severalBandsNeedABand(@TempDir Path dir) throws IOException {
        List<String> lines = Files.readAllLines(writeLightCurve(dir));
        StringBuilder sb = new StringBuilder("time,flux,flux_err,band\n");
        for (int i = 1; i < lines.size(); i++) {
            sb.append(lines.get(i)).append(i % 2 == 0 ? ",V" : ",R").append('\n');
        }
        Path file = dir.resolve("two-bands.csv");
        Files.writeString(file, sb.toString());
        Run without = runWithPeriod(dir, file, "2.5");
        assertThat(without.code()).isEqualTo(2);
        assertThat(without.err()).contains("two-bands.csv").contains("--band").contains("V").contains("R");

        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        Path out = dir.resolve("out-r");
        int code = commandLine(o, e).execute("minima", file.toString(), "--period", String.valueOf(PERIOD), "--epoch",
                String.valueOf(EPOCH), "--out", out.toString(), "--band", "R", "--allow-unknown-scale");
        assertThat(code).as(e.toString()).isZero();
        assertThat(Files.readString(out.resolve("minima-submission.txt"))).contains("FILTER").contains(" R ");
    }

    @Test
    void helpDescribesEveryOption() {
        StringWriter o = new StringWriter();
        CommandLine cl = new CommandLine(new MinimaCommand());
        cl.setOut(new PrintWriter(o));
        assertThat(cl.execute("--help")).isZero();
        assertThat(o.toString()).contains("--secondary-phase").contains("--window").contains("--method")
                .contains("--observer").contains("--band").contains("--time-scale").contains("--object")
                .contains("--ra").contains("--dec").contains("--to-scale").contains("--allow-unknown-scale")
                .doesNotContain("--filter");
    }

    /** Runs minima on {@code file} with the extra arguments; the output directory is DIR/out. */
    private static Run run(Path dir, Path file, double epoch, String... extra) {
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        List<String> args = new java.util.ArrayList<>(List.of("minima", file.toString(), "--period",
                String.valueOf(PERIOD), "--epoch", String.valueOf(epoch), "--out", dir.resolve("out").toString()));
        args.addAll(List.of(extra));
        int code = commandLine(o, e).execute(args.toArray(new String[0]));
        return new Run(code, e.toString());
    }

    @Test
    void unknownTimeScaleIsRefusedUnlessAllowed(@TempDir Path dir) throws IOException {
        Path file = writeLightCurve(dir);
        Run r = run(dir, file, EPOCH);
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("synthetic-system.csv").contains("time scale").contains("--time-scale")
                .contains("--allow-unknown-scale").doesNotContain("Exception");
        assertThat(dir.resolve("out").resolve("minima-submission.txt")).doesNotExist();
        Run converted = run(dir, file, EPOCH, "--to-scale", "BJD_TDB");
        assertThat(converted.code()).isEqualTo(2);
        assertThat(converted.err()).contains("cannot be converted").contains("--time-scale");
    }

    /** Text that reaches an output file must stay on one line: a newline is refused naming the option. */
    @Test
    void controlCharactersInTextOptionsAreRefused(@TempDir Path dir) throws IOException {
        Path file = writeLightCurve(dir);
        for (String option : List.of("--observer", "--object", "--band")) {
            Run r = run(dir, file, EPOCH, "--time-scale", "BJD_TDB", option, "A. Nonymous\n2460001.0 0.001 P");
            assertThat(r.code()).as(option).isEqualTo(2);
            assertThat(r.err()).contains("option " + option).contains("control character").contains("U+000A");
        }
        assertThat(run(dir, file, EPOCH, "--time-scale", "BJD_TDB", "--to-scale", "NOT_A_SCALE").err())
                .contains("option --to-scale").contains("NOT_A_SCALE");
        Run noPosition = run(dir, file, EPOCH, "--time-scale", "JD_UTC", "--to-scale", "BJD_TDB");
        assertThat(noPosition.code()).isEqualTo(2);
        assertThat(noPosition.err()).contains("--ra").contains("--dec");
        assertThat(run(dir, file, EPOCH, "--time-scale", "BJD_TDB", "--ra", "25:00:00", "--dec", "10").err())
                .contains("option --ra");
    }

    /**
     * --to-scale BJD_TDB converts the times of minimum. Outside value: ERFA (pyerfa 2.0.0.1, row 2 of
     * src/test/resources/org/twinlight/time/erfa-reference.csv): at MJD_UTC 55646.5465312767 towards
     * RA 3.064188574°, Dec −2.956755898°, BMJD_TDB = 55646.541538662830, a shift of −431.360 s. The
     * primary of cycle 0 sits at that instant; its converted time must differ from the unconverted
     * one by that shift within 0.05 s (the shift changes by less than 9 s a day, and the measured
     * minimum lies within seconds of the reference instant).
     */
    @Test
    void timesAreConvertedToBarycentricDynamicalTime(@TempDir Path dir) throws IOException {
        double epoch = 2400000.5 + 55646.5465312767;
        Path file = writeLightCurve(dir, epoch);
        Run plain = run(dir, file, epoch, "--time-scale", "JD_UTC");
        assertThat(plain.code()).as(plain.err()).isZero();
        double before = cycleZeroTime(dir.resolve("out").resolve("minima.csv"));
        Path again = dir.resolve("again");
        Files.createDirectories(again);
        Run converted = run(again, file, epoch, "--time-scale", "JD_UTC", "--to-scale", "BJD_TDB", "--ra",
                "3.064188574", "--dec", "-2.956755898", "--object", "Synthetic Pair 1");
        assertThat(converted.code()).as(converted.err()).isZero();
        double after = cycleZeroTime(again.resolve("out").resolve("minima.csv"));
        double expectedShiftSeconds = (55646.541538662830 - 55646.5465312767) * 86400;
        assertThat((after - before) * 86400).isCloseTo(expectedShiftSeconds, within(0.05));
        assertThat(Files.readString(again.resolve("out").resolve("minima-submission.txt")))
                .contains("Time scale: BJD_TDB").contains("converted from JD_UTC");
        JsonNode json = new ObjectMapper().readTree(again.resolve("out").resolve("ephemeris.json").toFile());
        assertThat(json.get("timeScale").asText()).isEqualTo("BJD_TDB");
    }

    private static double cycleZeroTime(Path csv) throws IOException {
        return Files.readAllLines(csv).stream().filter(l -> l.startsWith("0,primary,") && l.contains(",template,"))
                .mapToDouble(l -> Double.parseDouble(l.split(",")[2])).findFirst().orElseThrow();
    }
}
