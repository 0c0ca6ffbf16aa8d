package org.twinlight.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.twinlight.BadInputException;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.ModelFile;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.LightCurveReader;
import org.twinlight.photometry.TextColumn;
import org.twinlight.report.LightCurveFiles;
import org.twinlight.report.ModelFileJson;
import org.twinlight.time.TimeScale;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code simulate}: a synthetic light curve from a model file. */
@Command(name = "simulate", mixinStandardHelpOptions = true, versionProvider = VersionInfo.class,
        sortOptions = false,
        description = {"Make a synthetic light curve from a model file: noise-free, or with Gaussian noise "
                + "from a seed (the same seed gives the same curve).",
            "Writes CSV time,flux[,flux_err] (or time,mag[,mag_err] with --magnitudes), or a FITS binary "
                + "table when the output name ends in .fits."})
public final class SimulateCommand implements Callable<Integer> {

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Option(names = "--model", required = true, paramLabel = "M.json", description = "Model file (JSON).")
    Path model;

    @ArgGroup(exclusive = true, multiplicity = "1")
    Sampling sampling;

    static final class Sampling {
        @Option(names = "--times", paramLabel = "F", description = "File whose first column holds the times to use.")
        Path times;

        @ArgGroup(exclusive = false)
        Regular regular;
    }

    static final class Regular {
        @Option(names = "--start", required = true, paramLabel = "T", description = "First time, days.")
        double start;

        @Option(names = "--end", required = true, paramLabel = "T", description = "Last time, days.")
        double end;

        @Option(names = "--cadence", required = true, paramLabel = "MINUTES", description = "Spacing of the times, minutes.")
        double cadenceMinutes;
    }

    @Option(names = "--noise-ppm", paramLabel = "N", defaultValue = "0",
            description = "Gaussian noise, parts per million of the out-of-eclipse flux (default: none).")
    double noisePpm;

    @Option(names = "--seed", paramLabel = "S", defaultValue = "1", description = "Seed of the noise (default: ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--band", paramLabel = "NAME", description = "Use this band's values of the model file.")
    String band;

    @Option(names = "--gap", paramLabel = "T1:T2", description = "Leave out the times from T1 to T2 (repeatable).")
    List<String> gaps = new ArrayList<>();

    @Option(names = "--nightly-window", paramLabel = "FROM:TO",
            description = "Keep only times whose fraction of the Julian day (0 = noon UT) lies in FROM..TO, e.g. 0.30:0.70 for nights at longitude ~0°.")
    String nightlyWindow;

    @Option(names = "--magnitudes", paramLabel = "M0",
            description = "Write magnitudes M0 − 2.5 log10(flux) instead of flux (CSV only).")
    Double referenceMagnitude;

    @Option(names = "--time-scale", paramLabel = "SCALE", defaultValue = "unknown",
            description = "Time scale to record in the output, e.g. BJD_TDB (default: unknown).")
    String timeScale;

    @Option(names = "--object", paramLabel = "NAME", defaultValue = "synthetic binary",
            description = "Object name written into a FITS header.")
    String objectName;

    @Option(names = "--out", required = true, paramLabel = "F.csv|F.fits", description = "Output file (.csv or .fits).")
    Path out;

    /** Most points one run simulates (100 million doubles take 0.8 GB per column). */
    static final int MAX_POINTS = 50_000_000;

    @Override
    public Integer call() {
        OptionChecks.notEmpty("--out", out);
        String outName = out.getFileName() == null ? "" : out.getFileName().toString().toLowerCase(Locale.ROOT);
        boolean fits = outName.endsWith(".fits") || outName.endsWith(".fit") || outName.endsWith(".fts");
        if (!fits && !outName.endsWith(".csv")) {
            throw new BadInputException("option --out: '" + out + "' ends in neither .csv nor .fits; the name says "
                    + "which is written (CSV: time,flux[,flux_err]; FITS: a binary table)");
        }
        OptionChecks.finite("--magnitudes", referenceMagnitude);
        OptionChecks.finite("--noise-ppm", noisePpm);
        if (fits) {
            OptionChecks.fitsText("--object", objectName);
        }
        OptionChecks.plainText("--object", objectName);
        if (sampling.regular != null) {
            Regular r = sampling.regular;
            OptionChecks.finite("--start", r.start);
            OptionChecks.finite("--end", r.end);
            OptionChecks.finite("--cadence", r.cadenceMinutes);
            double points = (r.end - r.start) * 1440 / r.cadenceMinutes;
            if (r.cadenceMinutes > 0 && points > MAX_POINTS) {
                throw new BadInputException(String.format(Locale.ROOT, "options --start/--end/--cadence: %s points "
                        + "asked for; at most %d are simulated in one run (a longer cadence or a shorter span)",
                        Messages.number(Math.floor(points) + 1), MAX_POINTS));
            }
        }
        ModelFile mf = ModelFileJson.read(model);
        if (band != null && !mf.bands().containsKey(band)) {
            throw new BadInputException(model + ": option --band: the model has no band '" + band + "'"
                    + (mf.bands().isEmpty() ? "" : "; it has " + String.join(", ", mf.bands().keySet())));
        }
        if (!mf.covers(band)) {
            throw new BadInputException(model + ": the model gives surfaceBrightnessRatio only per band; choose one "
                    + "with --band (" + String.join(", ", mf.bands().keySet()) + ")");
        }
        BinaryParameters p = mf.forBand(band);
        TimeScale scale = TimeScale.parse(timeScale).orElseThrow(() -> new BadInputException(
                "option --time-scale: unknown time scale '" + timeScale + "'; expected one of " + TimeScale.acceptedLabels()));
        double[] times;
        if (sampling.times != null) {
            // only the times are needed: a file of one column is enough
            TextColumn column = LightCurveReader.readColumn(sampling.times, null);
            times = java.util.stream.IntStream.range(0, column.size()).mapToDouble(column::value).sorted().toArray();
        } else {
            List<SyntheticLightCurve.Gap> gapList = new ArrayList<>();
            for (String g : gaps) {
                double[] v = pair(g, "--gap");
                gapList.add(new SyntheticLightCurve.Gap(v[0], v[1]));
            }
            double[] window = nightlyWindow == null ? null : pair(nightlyWindow, "--nightly-window");
            try {
                times = SyntheticLightCurve.regularTimes(sampling.regular.start, sampling.regular.end,
                        sampling.regular.cadenceMinutes, gapList, window);
            } catch (IllegalArgumentException e) {
                throw new BadInputException("options --start/--end/--cadence: " + e.getMessage());
            }
        }
        if (times.length == 0) {
            throw new BadInputException("no times left to simulate: check --start/--end, --gap and --nightly-window");
        }
        if (!(noisePpm >= 0)) {
            throw new BadInputException("option --noise-ppm: expected a value ≥ 0, got " + noisePpm);
        }
        OutputTargets.checkFile(out, java.util.Arrays.asList(model, sampling.times));
        LightCurve lc = SyntheticLightCurve.observe(new BinaryModel(p), times, noisePpm, seed,
                out.getFileName().toString(), band, scale);
        String note = "simulated by twinlight " + VersionInfo.version() + " from " + model.getFileName()
                + (noisePpm > 0 ? ", noise " + noisePpm + " ppm, seed " + seed : ", noise-free");
        if (fits) {
            if (referenceMagnitude != null) {
                throw new BadInputException("option --magnitudes: FITS output holds flux; write CSV for magnitudes");
            }
            if (!scale.isKnown()) {
                throw new BadInputException("option --time-scale: a FITS table declares the time scale of its times "
                        + "(TIMESYS, TIMEREF); give one, e.g. --time-scale BJD_TDB, or write CSV");
            }
            double ref = Math.floor(times[0] / 1000.0) * 1000.0;
            LightCurveFiles.writeFits(lc, out, ref, objectName);
        } else {
            LightCurveFiles.writeCsv(lc, out, referenceMagnitude, note);
        }
        console().printf(Locale.ROOT, "wrote %s: %d points, %.4f to %.4f (%s)%n", out, lc.size(), lc.startDays(),
                lc.endDays(), scale.label());
        return 0;
    }

    private static double[] pair(String text, String option) {
        String[] parts = text.split(":");
        if (parts.length != 2) {
            throw new BadInputException("option " + option + ": expected two numbers A:B, got '" + text + "'");
        }
        try {
            double a = Double.parseDouble(parts[0].trim());
            double b = Double.parseDouble(parts[1].trim());
            if (!(b > a)) {
                throw new BadInputException("option " + option + ": the second number must be larger than the first, got '" + text + "'");
            }
            return new double[] {a, b};
        } catch (NumberFormatException e) {
            throw new BadInputException("option " + option + ": expected two numbers A:B, got '" + text + "'");
        }
    }

    private java.io.PrintWriter console() {
        return spec.commandLine().getOut();
    }
}
