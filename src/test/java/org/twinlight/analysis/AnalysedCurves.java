package org.twinlight.analysis;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.concurrent.ConcurrentHashMap;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;

/**
 * Synthetic light curves the analysis has not seen (other periods, radii and limb darkening than the
 * bundled samples), written as files, and their analyses run once per test JVM and shared by the
 * test classes (the analyses are the slow part).
 */
final class AnalysedCurves {
    /** Space-like: continuous, 10-minute integrations, 600 ppm; limb darkening unlike the default. */
    static final BinaryParameters SPACE = new BinaryParameters(2.3117, 2460000.7342, 0.118, 0.081, 87.4, 0, 90, 0.62,
            0, LimbDarkening.quadratic(0.47, 0.21), LimbDarkening.quadratic(0.55, 0.18), 10.0 / 1440, 5);
    /** Ground-like: short period, nights with weather, night-to-night zero points, magnitudes, 4 mmag. */
    static final BinaryParameters GROUND = new BinaryParameters(0.64371, 2460100.3518, 0.214, 0.168, 84.1, 0, 90,
            0.83, 0, LimbDarkening.quadratic(0.5, 0.2), LimbDarkening.quadratic(0.55, 0.2), 0, 1);

    private static final Map<String, Outcome> RUNS = new ConcurrentHashMap<>();

    /** An analysis and its output folder. */
    record Outcome(AnalysisOutcome outcome, Path outputDir, Path input) {
    }

    private AnalysedCurves() {
    }

    static Path root() {
        Path p = Path.of("target", "analysis-tests").toAbsolutePath();
        try {
            Files.createDirectories(p);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return p;
    }

    /** The analysis of the space-like curve of {@code seed}, with no hints. */
    static Outcome space(long seed) {
        return RUNS.computeIfAbsent("space-" + seed, k -> {
            Path f = writeSpace(root().resolve(k + ".csv"), seed);
            return run(AnalysisSettings.defaults().withFiles(List.of(f.toString())), root().resolve(k), f);
        });
    }

    /** The analysis of the ground-like curve of {@code seed}, with no hints. */
    static Outcome ground(long seed) {
        return RUNS.computeIfAbsent("ground-" + seed, k -> {
            Path f = writeGround(root().resolve(k + ".csv"), seed);
            return run(AnalysisSettings.defaults().withFiles(List.of(f.toString())), root().resolve(k), f);
        });
    }

    static Outcome run(AnalysisSettings s, Path out, Path input) {
        return new Outcome(TargetAnalysis.run(new AnalysisRequest(s, out)), out, input);
    }

    /** 10 days of 10-minute flux points with Gaussian noise. */
    static Path writeSpace(Path f, long seed) {
        List<double[]> rows = new ArrayList<>();
        SplittableRandom rng = new SplittableRandom(seed);
        BinaryModel m = new BinaryModel(SPACE);
        for (double t = 2460001.0; t < 2460011.0; t += 10.0 / 1440) {
            rows.add(new double[] {t, m.flux(t) * (1 + 600e-6 * gaussian(rng)), 600e-6});
        }
        return write(f, "# time scale: BJD_TDB\ntime,flux,flux_err", rows);
    }

    /**
     * 30 nights of 6.5 hours at 3-minute cadence, a third of them lost to weather, each night with its
     * own zero point (σ 0.01 mag), 4 mmag noise, as magnitudes.
     */
    static Path writeGround(Path f, long seed) {
        List<double[]> rows = new ArrayList<>();
        SplittableRandom rng = new SplittableRandom(seed);
        BinaryModel m = new BinaryModel(GROUND);
        for (int night = 0; night < 30; night++) {
            if (rng.nextDouble() < 1.0 / 3) {
                continue;
            }
            double zeroPoint = 0.01 * gaussian(rng);
            double start = 2460100.0 + night + 0.32 + 0.03 * rng.nextDouble();
            for (double t = start; t < start + 6.5 / 24; t += 3.0 / 1440) {
                double mag = 11.2 - 2.5 * Math.log10(m.flux(t)) + zeroPoint + 0.004 * gaussian(rng);
                rows.add(new double[] {t, mag, 0.004});
            }
        }
        return write(f, "# time scale: HJD_UTC\ntime,mag,mag_err", rows);
    }

    /** Gaussian noise of 1000 ppm over 10 days: no eclipse. */
    static Path writeFlat(Path f, long seed) {
        List<double[]> rows = new ArrayList<>();
        SplittableRandom rng = new SplittableRandom(seed);
        for (double t = 2460001.0; t < 2460011.0; t += 10.0 / 1440) {
            rows.add(new double[] {t, 1 + 1000e-6 * gaussian(rng), 1000e-6});
        }
        return write(f, "# time scale: BJD_TDB\ntime,flux,flux_err", rows);
    }

    /** Eight days of a binary with a 30-day period: one primary eclipse only. */
    static Path writeOneEclipse(Path f, long seed) {
        BinaryParameters p = SPACE.withPeriodDays(30).withEpochDays(2460004.5).withRadii(0.03, 0.02)
                .withInclinationDeg(89.6);
        BinaryModel m = new BinaryModel(p);
        List<double[]> rows = new ArrayList<>();
        SplittableRandom rng = new SplittableRandom(seed);
        for (double t = 2460001.0; t < 2460009.0; t += 10.0 / 1440) {
            rows.add(new double[] {t, m.flux(t) * (1 + 600e-6 * gaussian(rng)), 600e-6});
        }
        return write(f, "# time scale: BJD_TDB\ntime,flux,flux_err", rows);
    }

    private static Path write(Path f, String header, List<double[]> rows) {
        StringBuilder b = new StringBuilder(header).append('\n');
        for (double[] r : rows) {
            b.append(String.format(Locale.ROOT, "%.7f,%.8f,%.6f%n", r[0], r[1], r[2]));
        }
        try {
            Files.writeString(f, b);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return f;
    }

    /** A standard normal deviate (Marsaglia polar method; Marsaglia &amp; Bray 1964, SIAM Rev. 6, 260). */
    static double gaussian(SplittableRandom rng) {
        double u;
        double v;
        double s;
        do {
            u = 2 * rng.nextDouble() - 1;
            v = 2 * rng.nextDouble() - 1;
            s = u * u + v * v;
        } while (s >= 1 || s == 0);
        return u * Math.sqrt(-2 * Math.log(s) / s);
    }
}
