package org.twinlight.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.LightCurveReader;
import org.twinlight.photometry.ReadOptions;

/** Option values no command can use are refused up front with exit 2, naming the option. */
class OptionChecksTest extends CommandTestSupport {
    private static final String MODEL = """
            {
              "period": 2.61, "epoch": 2460300.25,
              "radius1": 0.13, "radius2": 0.09, "inclination": 88.0,
              "surfaceBrightnessRatio": 0.6,
              "limbDarkening1": {"law": "quadratic", "coefficients": [0.4, 0.2]},
              "limbDarkening2": {"law": "quadratic", "coefficients": [0.45, 0.2]}
            }
            """;
    private static final Path SAMPLE = Path.of("sample-curves", "corvel-pair-ground.csv");

    private Path model() throws Exception {
        return Files.writeString(dir.resolve("model.json"), MODEL);
    }

    private int simulate(String... more) throws Exception {
        String[] base = {"simulate", "--model", model().toString(), "--start", "2460300", "--end", "2460301",
            "--cadence", "10", "--time-scale", "BJD_TDB"};
        String[] all = new String[base.length + more.length];
        System.arraycopy(base, 0, all, 0, base.length);
        System.arraycopy(more, 0, all, base.length, more.length);
        err.getBuffer().setLength(0);
        return console.run(all);
    }

    @Test
    void anEmptyOutIsRefusedByEveryCommand() throws Exception {
        assertThat(console.run("period", SAMPLE.toString(), "--out", "")).isEqualTo(2);
        assertThat(console.run("minima", SAMPLE.toString(), "--period", "0.8731542", "--epoch", "2460571.41238",
                "--out", "")).isEqualTo(2);
        assertThat(console.run("time", SAMPLE.toString(), "--from", "HJD_UTC", "--to", "HJD_TT", "--out", ""))
                .isEqualTo(2);
        assertThat(simulate("--out", "")).isEqualTo(2);
        assertThat(err.toString()).contains("option --out: empty");
    }

    @Test
    void simulateRefusesValuesItCannotWrite() throws Exception {
        assertThat(simulate("--magnitudes", "NaN", "--out", dir.resolve("a.csv").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("--magnitudes", "finite");
        assertThat(simulate("--out", dir.resolve("x.txt").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("--out", ".csv", ".fits");
        assertThat(simulate("--object", "Żuraw binary", "--out", dir.resolve("a.fits").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("--object", "printable ASCII");
        assertThat(simulate("--object", "x".repeat(69), "--out", dir.resolve("a.fits").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("--object", "69 characters", "68");
        assertThat(simulate("--object", "two\nlines", "--out", dir.resolve("a.csv").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("control character (U+000A)");
        assertThat(simulate("--noise-ppm", "Infinity", "--out", dir.resolve("a.csv").toString())).isEqualTo(2);
        assertThat(console.run("simulate", "--model", model().toString(), "--start", "0", "--end", "1e6",
                "--cadence", "0.001", "--out", dir.resolve("big.csv").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("at most 50000000");
        try (var files = Files.list(dir)) {
            assertThat(files.map(p -> p.getFileName().toString())).containsExactly("model.json");
        }
    }

    @Test
    void aNoiseFreeFitsFileReadsBackWithoutAnErrorColumn() throws Exception {
        Path fits = dir.resolve("clean.fits");
        assertThat(simulate("--out", fits.toString())).isZero();
        LightCurve lc = LightCurveReader.read(fits, ReadOptions.defaults());
        assertThat(lc.size()).isEqualTo(145);
        assertThat(lc.hasErrors()).isFalse();
        assertThat(lc.rejectedCount()).isZero();
        assertThat(lc.timeScale().label()).isEqualTo("BJD_TDB");
        // with noise the errors are there
        Path noisy = dir.resolve("noisy.fits");
        assertThat(simulate("--noise-ppm", "500", "--out", noisy.toString())).isZero();
        assertThat(LightCurveReader.read(noisy, ReadOptions.defaults()).fluxError(0)).isEqualTo(500e-6, 
                org.assertj.core.data.Offset.offset(1e-9));
    }

    @Test
    void periodsNoEclipsingBinaryHasAreRefusedAsBadInput() {
        assertThat(console.run("minima", SAMPLE.toString(), "--period", "1e-9", "--epoch", "2460571.41238", "--out",
                dir.resolve("m").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("option --period: 1e-09 d is not a period");
        assertThat(console.run("period", SAMPLE.toString(), "--min-period", "1e-9", "--out",
                dir.resolve("p").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("option --min-period");
        assertThat(console.run("period", SAMPLE.toString(), "--max-period", "1e308", "--out",
                dir.resolve("p").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("option --max-period: 1e+308 d");
    }

    @Test
    void aDirectoryGivenAsTheInputIsCalledADirectory() {
        assertThat(console.run("period", dir.toString(), "--out", dir.resolve("p").toString())).isEqualTo(2);
        assertThat(err.toString()).contains("a directory; expected a file").doesNotContain("no such file");
    }

    @Test
    void hugeValuesAreShortenedInMessages() {
        String huge = "9".repeat(100_000);
        assertThat(console.run("minima", SAMPLE.toString(), "--period", huge + "x", "--epoch", "1", "--out",
                dir.resolve("m").toString())).isEqualTo(2);
        assertThat(err.toString().length()).as("message and usage").isLessThan(10_000);
        assertThat(err.toString()).contains("characters]…");
    }

    @Test
    void messagesWriteNumbersReadably() {
        assertThat(Messages.number(1e-9)).isEqualTo("1e-09");
        assertThat(Messages.number(1e308)).isEqualTo("1e+308");
        assertThat(Messages.number(2.5)).isEqualTo("2.5");
        assertThat(Messages.number(0.8731542)).isEqualTo("0.8731542");
        assertThat(Messages.number(2460571.41238)).isEqualTo("2460571.41238");
    }

    @Test
    void anUncertaintyIsShownToTwoSignificantDigits() {
        // regression: "± 0.00000000 d" for an uncertainty of 2.9e-9 d
        assertThat(Messages.valueWithUncertainty(0.873154203, 2.9e-9, 8)).isEqualTo("0.8731542030 ± 0.0000000029");
        assertThat(Messages.valueWithUncertainty(2.61, 0.0004, 8)).isEqualTo("2.61000000 ± 0.00040000");
        assertThat(Messages.valueWithUncertainty(2.61, Double.NaN, 6)).isEqualTo("2.610000 ± n/a");
        assertThat(Messages.fixed(Double.NaN, 1)).isEqualTo("n/a");
        assertThat(Messages.count(1, "point", "points")).isEqualTo("1 point");
    }
}
