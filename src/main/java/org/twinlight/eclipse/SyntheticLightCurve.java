package org.twinlight.eclipse;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.ValueKind;
import org.twinlight.time.TimeScale;

/**
 * Synthetic light curves from the binary model: regular sampling with optional gaps and nightly
 * windows, and Gaussian noise from a seeded generator (the same seed gives the same curve).
 */
public final class SyntheticLightCurve {

    /** An interval [startDays, endDays] with no data (e.g. a data downlink). */
    public record Gap(double startDays, double endDays) {
        public Gap {
            if (!(endDays > startDays)) {
                throw new IllegalArgumentException("a gap must end after it starts: " + startDays + " .. " + endDays);
            }
        }

        boolean contains(double t) {
            return t >= startDays && t <= endDays;
        }
    }

    private SyntheticLightCurve() {
    }

    /**
     * Regularly spaced times from start to end (inclusive when it falls on the grid).
     *
     * @param startDays first time
     * @param endDays last possible time
     * @param cadenceMinutes spacing, minutes
     * @param gaps intervals left out
     * @param nightlyWindow null, or {from, to}: keep only times whose fraction of the Julian day
     *     (0 = noon UT) lies in [from, to]; e.g. {0.30, 0.70} for night-time at longitude ~0°
     */
    public static double[] regularTimes(double startDays, double endDays, double cadenceMinutes, List<Gap> gaps,
            double[] nightlyWindow) {
        if (!(endDays > startDays)) {
            throw new IllegalArgumentException("end (" + endDays + ") must be after start (" + startDays + ")");
        }
        if (!(cadenceMinutes > 0)) {
            throw new IllegalArgumentException("cadence must be a positive number of minutes, got " + cadenceMinutes);
        }
        double step = cadenceMinutes / 1440.0;
        long n = (long) Math.floor((endDays - startDays) / step + 1e-9) + 1;
        if (n > 50_000_000L) {
            throw new IllegalArgumentException("that would be " + n + " points; use a longer cadence or a shorter span");
        }
        List<Double> kept = new ArrayList<>();
        for (long i = 0; i < n; i++) {
            double t = startDays + i * step;
            if (gaps != null && gaps.stream().anyMatch(g -> g.contains(t))) {
                continue;
            }
            if (nightlyWindow != null) {
                double frac = t - Math.floor(t);
                if (frac < nightlyWindow[0] || frac > nightlyWindow[1]) {
                    continue;
                }
            }
            kept.add(t);
        }
        return kept.stream().mapToDouble(Double::doubleValue).toArray();
    }

    /**
     * Model fluxes at the times, with Gaussian noise of {@code noisePpm} parts per million of the
     * out-of-eclipse flux when it is positive (and errors of that size), none when it is 0.
     */
    public static LightCurve observe(BinaryModel model, double[] timesDays, double noisePpm, long seed,
            String source, String band, TimeScale scale) {
        if (!(noisePpm >= 0)) {
            throw new IllegalArgumentException("noise must be ≥ 0 ppm, got " + noisePpm);
        }
        double[] flux = model.flux(timesDays);
        double[] err = null;
        if (noisePpm > 0) {
            SplittableRandom rng = new SplittableRandom(seed);
            double sigma = noisePpm * 1e-6;
            err = new double[flux.length];
            for (int i = 0; i < flux.length; i++) {
                flux[i] += sigma * gaussian(rng);
                err[i] = sigma;
            }
        }
        return new LightCurve(source, band, scale, ValueKind.FLUX, timesDays, flux, err, Map.of());
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
