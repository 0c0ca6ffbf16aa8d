package org.twinlight.timing.period;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.twinlight.eclipse.BinaryModel;
import org.twinlight.eclipse.BinaryParameters;
import org.twinlight.eclipse.LimbDarkening;
import org.twinlight.eclipse.SyntheticLightCurve;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.ValueKind;
import org.twinlight.time.TimeScale;

/**
 * Hard but realistic period-search cases made with the project's own binary model: an eccentric orbit,
 * exact twins, one visible eclipse per orbit, near-equal grazing eclipses from ground nights with nightly
 * zero points, sparse survey sampling, a long period with phase 0.5 never observed, a period near the
 * search floor, and noise alone. Each case is a fictional system; the seed sets the noise (and, where the
 * sampling is random, the sampling).
 */
public final class PeriodScenarios {
    /** Start of every synthetic data set, days. */
    static final double START = 2461000.0;
    private static final LimbDarkening LD = LimbDarkening.quadratic(0.4, 0.2);

    private PeriodScenarios() {
    }

    /** A case: the light curve and the true orbital period. */
    public record Case(String name, LightCurve lightCurve, double truePeriodDays) {
    }

    private static BinaryParameters binary(double period, double r1, double r2, double incl, double e, double omega,
            double j) {
        return new BinaryParameters(period, START + 0.37 * period, r1, r2, incl, e, omega, j, 0, LD, LD, 0, 1);
    }

    private static LightCurve observe(BinaryParameters p, double[] t, double noisePpm, long seed, String name) {
        return SyntheticLightCurve.observe(new BinaryModel(p), t, noisePpm, seed, name + "-" + seed, null,
                TimeScale.BJD_TDB);
    }

    private static double[] regular(double days, double cadenceMinutes) {
        return SyntheticLightCurve.regularTimes(START, START + days, cadenceMinutes, null, null);
    }

    /** P = 4.6123 d, e = 0.32, ω = 35° (secondary near phase 0.67), 27 d at 2 minutes, 800 ppm. */
    public static Case eccentric(long seed) {
        return eccentric(seed, 2);
    }

    /** The eccentric case at another cadence (minutes). */
    public static Case eccentric(long seed, double cadenceMinutes) {
        BinaryParameters p = binary(4.6123, 0.07, 0.06, 89.0, 0.32, 35, 0.8);
        return new Case("eccentric", observe(p, regular(27, cadenceMinutes), 800, seed, "eccentric"), 4.6123);
    }

    /** Identical stars in a circular orbit: P = 2.9071 d, 27 d at 2 minutes. */
    public static Case twins(long seed, double noisePpm) {
        return twins(seed, noisePpm, 2);
    }

    /** The twins at another cadence (minutes). */
    public static Case twins(long seed, double noisePpm, double cadenceMinutes) {
        BinaryParameters p = binary(2.9071, 0.09, 0.09, 88.5, 0, 90, 1.0);
        return new Case("twins", observe(p, regular(27, cadenceMinutes), noisePpm, seed, "twins"), 2.9071);
    }

    /**
     * A dark companion of 0.4 times the primary's radius: one visible, flat-bottomed eclipse per orbit,
     * P = 3.3371 d, 27 d at the given cadence (minutes), 800 ppm.
     */
    public static Case oneEclipsePerOrbit(long seed, double cadenceMinutes) {
        BinaryParameters p = binary(3.3371, 0.08, 0.032, 89.0, 0, 90, 0.0);
        return new Case("one-eclipse", observe(p, regular(27, cadenceMinutes), 800, seed, "one-eclipse"), 3.3371);
    }

    /**
     * Near-equal grazing eclipses (P = 1.7327 d, light ratio 0.93, impact parameter ~0.7 of the sum of
     * radii) from about 45 six-hour ground nights over 70 days, 3-minute cadence, 3 mmag noise and a
     * nightly zero point of 5 mmag rms.
     */
    public static Case groundGrazing(long seed) {
        BinaryParameters p = binary(1.7327, 0.11, 0.105, 82.0, 0, 90, 0.93);
        Random rnd = new Random(seed * 7919 + 11);
        List<Double> times = new ArrayList<>();
        List<Integer> night = new ArrayList<>();
        int n = 0;
        for (int d = 0; d < 70; d++) {
            if (rnd.nextDouble() < 0.36) {
                continue;
            }
            double start = START + d + 0.30 + 0.04 * rnd.nextDouble();
            for (double t = start; t < start + 0.25; t += 3.0 / 1440) {
                times.add(t);
                night.add(n);
            }
            n++;
        }
        double[] t = times.stream().mapToDouble(Double::doubleValue).toArray();
        LightCurve clean = observe(p, t, 3000, seed, "ground-grazing");
        double[] zero = new double[n];
        for (int k = 0; k < n; k++) {
            zero[k] = 1 + 0.005 * rnd.nextGaussian();
        }
        double[] f = clean.fluxes();
        for (int i = 0; i < f.length; i++) {
            f[i] *= zero[night.get(i)];
        }
        return new Case("ground-grazing", withFlux(clean, f), 1.7327);
    }

    /**
     * Survey sampling: three seasons of 200 nights a year apart, about 250 points a season (one to three
     * points on a night, half an hour apart), P = 3.17 d, 5 mmag noise.
     */
    public static Case sparseSurvey(long seed, int pointsPerSeason) {
        BinaryParameters p = binary(3.17, 0.16, 0.12, 87.0, 0, 90, 0.6);
        Random rnd = new Random(seed * 104729 + 3);
        List<Double> times = new ArrayList<>();
        for (int season = 0; season < 3; season++) {
            int inSeason = 0;
            while (inSeason < pointsPerSeason) {
                double nightStart = START + 350 * season + rnd.nextInt(200) + 0.3 + 0.3 * rnd.nextDouble();
                int k = 1 + rnd.nextInt(3);
                for (int j = 0; j < k && inSeason < pointsPerSeason; j++) {
                    times.add(nightStart + j * 0.02);
                    inSeason++;
                }
            }
        }
        double[] t = times.stream().mapToDouble(Double::doubleValue).sorted().distinct().toArray();
        return new Case("sparse-survey", observe(p, t, 5000, seed, "sparse-survey"), 3.17);
    }

    /**
     * P = 30.113 d with 16 seven-hour nights in 214 days, three of them on primary eclipses and none
     * within 0.08 of phase 0.5, 2 mmag noise.
     */
    public static Case longPeriodNoHalfPhase(long seed) {
        double period = 30.113;
        BinaryParameters p = binary(period, 0.02, 0.017, 89.9, 0, 90, 0.8);
        double epoch = p.epochDays();
        Random rnd = new Random(seed * 31 + 5);
        List<Double> starts = new ArrayList<>();
        for (int cycle : new int[] {1, 3, 6}) {
            starts.add(epoch + cycle * period - 0.15 - 0.1 * rnd.nextDouble());
        }
        while (starts.size() < 16) {
            double s = START + 214 * rnd.nextDouble();
            double ph = ((s + 0.15 - epoch) / period) % 1.0;
            ph = ph < 0 ? ph + 1 : ph;
            boolean clash = starts.stream().anyMatch(x -> Math.abs(x - s) < 1);
            if (Math.abs(ph - 0.5) > 0.08 && !clash) {
                starts.add(s);
            }
        }
        List<Double> times = new ArrayList<>();
        starts.stream().sorted().forEach(s -> {
            for (double t = s; t < s + 0.29; t += 2.0 / 1440) {
                times.add(t);
            }
        });
        double[] t = times.stream().mapToDouble(Double::doubleValue).toArray();
        return new Case("long-no-half", observe(p, t, 2000, seed, "long-no-half"), period);
    }

    /**
     * A detached pair with clearly different eclipses (r1 0.13, r2 0.10, i 88.5°, surface brightness ratio
     * 0.6: primary about 0.46 deep, secondary about 0.26, both fully seen) over a short run that covers
     * only two to five cycles: {@code days} at {@code cadenceMinutes}, 1500 ppm. Space-like runs are
     * continuous; ground-like ones keep 8-hour nights (the first third of each day).
     */
    public static Case shortUnequal(long seed, double periodDays, double days, double cadenceMinutes,
            boolean groundNights) {
        BinaryParameters p = binary(periodDays, 0.13, 0.10, 88.5, 0, 90, 0.6);
        double[] t = regular(days, cadenceMinutes);
        if (groundNights) {
            t = java.util.Arrays.stream(t).filter(x -> x - START - Math.floor(x - START) < 1.0 / 3).toArray();
        }
        String name = groundNights ? "short-unequal-ground" : "short-unequal";
        return new Case(name, observe(p, t, 1500, seed, name), periodDays);
    }

    /** A close pair at P = 0.1234 d (below the default floor of 0.2 d), 27 d at 2 minutes, 1500 ppm. */
    public static Case nearFloor(long seed) {
        BinaryParameters p = binary(0.1234, 0.30, 0.22, 84.0, 0, 90, 0.55);
        return new Case("near-floor", observe(p, regular(10, 2), 1500, seed, "near-floor"), 0.1234);
    }

    /** Noise alone: 27 d at 10 minutes, 1000 ppm. */
    public static Case noiseOnly(long seed) {
        double[] t = regular(27, 10);
        Random rnd = new Random(seed * 17 + 1);
        double[] f = new double[t.length];
        double[] e = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            f[i] = 1 + 0.001 * rnd.nextGaussian();
            e[i] = 0.001;
        }
        return new Case("noise", new LightCurve("noise-" + seed, null, TimeScale.BJD_TDB, ValueKind.FLUX, t, f, e,
                Map.of()), Double.NaN);
    }

    private static LightCurve withFlux(LightCurve lc, double[] f) {
        return new LightCurve(lc.source(), lc.band(), lc.timeScale(), ValueKind.FLUX, lc.timesDays(), f,
                lc.hasErrors() ? lc.fluxErrors() : null, Map.of());
    }
}
