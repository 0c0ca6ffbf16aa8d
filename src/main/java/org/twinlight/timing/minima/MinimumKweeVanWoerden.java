package org.twinlight.timing.minima;

import java.util.Arrays;
import java.util.Locale;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;

/**
 * The time of minimum of one eclipse by the method of Kwee &amp; van Woerden (1956, Bull. Astron.
 * Inst. Netherlands 12, 327; formulas from memory): the light curve, interpolated to equal steps,
 * is reflected about a trial time T and the sum of squared differences of the reflected pairs,
 * S(T), is formed; S(T) = A·T² + B·T + C is fitted near its smallest value and the minimum is
 * T₀ = −B/(2A). The original error is σ²(T₀) = (4AC − B²)/(4A²(Z − 1)), with Z = N/4 the number of
 * independent pairs among the N interpolated points used.
 *
 * <p>As Deeg (2021, Galaxies 9, 1) remarks, that error is unreliable; twinlight keeps it for
 * comparison only and estimates the error by re-measuring synthetic replicas (see
 * {@link MinimumFinder}). Following Deeg, S(T) is fitted through more than three trial times
 * (five), spaced widely enough for the rise of S(T) to stand above its noise.
 */
final class MinimumKweeVanWoerden {

    /** Number of trial times the quadratic is fitted through (odd). */
    private static final int FOLDS = 5;

    /**
     * Outcome of one measurement; {@code failure} is null when the time was found.
     *
     * @param timeDays time of minimum, in the coordinates of the input
     * @param classicErrorDays the original error formula, NaN when 4AC − B² ≤ 0
     * @param pointsUsed N, the interpolated points used on both sides
     * @param trialStepDays final spacing of the trial times of the quadratic, days
     * @param failure reason for people when no time was found, else null
     */
    record Result(double timeDays, double classicErrorDays, int pointsUsed, double trialStepDays, String failure) {
        static Result failed(String why) {
            return new Result(Double.NaN, Double.NaN, 0, Double.NaN, why);
        }

        boolean ok() {
            return failure == null;
        }
    }

    private MinimumKweeVanWoerden() {
    }

    /**
     * Measures the minimum of one eclipse.
     *
     * @param x times relative to a reference near the minimum, days, strictly increasing
     * @param f flux at those times
     * @param guess expected minimum, same coordinates
     * @param searchHalfDays the minimum is looked for within guess ± this
     * @param reflectMaxDays largest half-width of the reflected part
     * @param reflectMinDays smallest acceptable half-width of the reflected part
     */
    static Result measure(double[] x, double[] f, double guess, double searchHalfDays, double reflectMaxDays,
            double reflectMinDays) {
        return measure(x, f, guess, searchHalfDays, reflectMaxDays, reflectMinDays, 0.0);
    }

    /**
     * As {@link #measure(double[], double[], double, double, double, double)}, with the trial
     * times of the quadratic spaced by at least {@code minTrialStepDays} (so that replicas of an
     * eclipse are measured the same way as the eclipse).
     */
    static Result measure(double[] x, double[] f, double guess, double searchHalfDays, double reflectMaxDays,
            double reflectMinDays, double minTrialStepDays) {
        int n = x.length;
        if (n < 6) {
            return Result.failed("too few points for Kwee–van Woerden (" + n + ")");
        }
        double step = medianSpacing(x);
        double lo = guess - searchHalfDays;
        double hi = guess + searchHalfDays;
        // Trial times stay within the search range ± two of the widest trial steps.
        double coarseStep = Math.min(step, searchHalfDays / 5);
        double reach = Math.max(2 * coarseStep, Math.max(searchHalfDays / 2, 2 * minTrialStepDays));
        double reflect = Math.min(reflectMaxDays, Math.min(x[n - 1] - hi, lo - x[0]) - reach);
        if (reflect < reflectMinDays) {
            return Result.failed(String.format(Locale.ROOT,
                    "one-sided coverage: only %.1f min of data on one side of the expected minimum, need %.1f min",
                    Math.max(0, Math.min(x[n - 1] - guess, guess - x[0])) * 1440,
                    (reflectMinDays + searchHalfDays + reach) * 1440));
        }
        int pairs = (int) Math.floor(reflect / step);
        if (pairs < 4) {
            return Result.failed("too few interpolated pairs across the eclipse (" + pairs + ")");
        }
        // Coarse scan in steps of the cadence, then the trial times for the quadratic at half the
        // cadence around the coarse minimum.
        int coarse = (int) Math.floor(2 * searchHalfDays / coarseStep) + 1;
        int bestCoarse = 0;
        double bestValue = Double.POSITIVE_INFINITY;
        for (int j = 0; j < coarse; j++) {
            double v = sumOfSquares(x, f, lo + j * coarseStep, step, pairs);
            if (v < bestValue) {
                bestValue = v;
                bestCoarse = j;
            }
        }
        if (bestCoarse == 0 || bestCoarse == coarse - 1) {
            return Result.failed(String.format(Locale.ROOT,
                    "minimum not found within ±%.1f min of the expected time", searchHalfDays * 1440));
        }
        // The quadratic needs trial times far enough apart for the rise of S(T) to stand above
        // its noise, whose wiggles (pairs changing partners from one cadence to the next) are
        // about S_min/√Z while the rise over δT is A·δT² = S_min·(δT/σ)²/(Z − 1): so
        // δT ≳ σ·Z^¼. Start at a twelfth of the search range and widen the spacing until it
        // is (at most a quarter of the search range); re-centre while the minimum lies outside.
        double maxStep = Math.max(searchHalfDays / 4, minTrialStepDays);
        double trialStep = Math.max(Math.max(coarseStep / 2, searchHalfDays / 12), minTrialStepDays);
        double t0 = lo + bestCoarse * coarseStep;
        int half = FOLDS / 2;
        double[] s = new double[FOLDS];
        int used = 2 * pairs;
        double z = used / 4.0;
        for (int round = 0; round < 8; round++) {
            for (int j = 0; j < FOLDS; j++) {
                s[j] = sumOfSquares(x, f, t0 + (j - half) * trialStep, step, pairs);
            }
            // Quadratic least squares S = A u² + B u + C through the trial times, u measured from
            // the middle one so the normal equations stay well conditioned.
            double[] coeff = fitQuadratic(s, half, half, trialStep);
            double a = coeff[0];
            double b = coeff[1];
            double c = coeff[2];
            if (!(a > 0)) {
                if (trialStep >= maxStep) {
                    return Result.failed("no symmetric minimum near the predicted time (a flat or noisy eclipse, or the eclipse is elsewhere: check --secondary-phase against the phase the period command measures)");
                }
                trialStep = Math.min(2 * trialStep, maxStep);
                continue;
            }
            double u0 = -b / (2 * a);
            if (Math.abs(u0) > half * trialStep) {
                t0 += Math.signum(u0) * half * trialStep;
                if (t0 < lo || t0 > hi) {
                    break;
                }
                continue;
            }
            double disc = 4 * a * c - b * b;
            double classic = disc > 0 && z > 1 ? Math.sqrt(disc / (4 * a * a * (z - 1))) : Double.NaN;
            double needed = Double.isNaN(classic) ? 0 : classic * Math.pow(z, 0.25);
            if (trialStep < needed && trialStep < maxStep) {
                trialStep = Math.min(needed, maxStep);
                t0 += u0;
                continue;
            }
            return new Result(t0 + u0, classic, used, trialStep, null);
        }
        return Result.failed("the reflection sum has no well-defined minimum");
    }

    /** S(T): sum over k of [f(T + (k−½)Δ) − f(T − (k−½)Δ)]², f linearly interpolated. */
    static double sumOfSquares(double[] x, double[] f, double t, double step, int pairs) {
        double sum = 0;
        // The points T ± (k−½)Δ move monotonically outwards, so the bracketing indices only walk.
        int right = Math.max(1, lowerIndex(x, t));
        int left = right;
        for (int k = 1; k <= pairs; k++) {
            double d = (k - 0.5) * step;
            double tr = t + d;
            while (right < x.length - 1 && x[right] < tr) {
                right++;
            }
            double tl = t - d;
            while (left > 1 && x[left - 1] > tl) {
                left--;
            }
            double diff = between(x, f, right, tr) - between(x, f, left, tl);
            sum += diff * diff;
        }
        return sum;
    }

    /** Linear interpolation at t between x[i−1] and x[i]. */
    private static double between(double[] x, double[] f, int i, double t) {
        double w = (t - x[i - 1]) / (x[i] - x[i - 1]);
        return f[i - 1] + w * (f[i] - f[i - 1]);
    }

    /** First index with x[i] ≥ t (x.length when none). */
    private static int lowerIndex(double[] x, double t) {
        int i = Arrays.binarySearch(x, t);
        return i >= 0 ? i : -i - 1;
    }

    private static double[] fitQuadratic(double[] s, int centre, int half, double du) {
        double[][] m = new double[3][3];
        double[] r = new double[3];
        for (int j = centre - half; j <= centre + half; j++) {
            double u = (j - centre) * du;
            double[] basis = {u * u, u, 1};
            for (int p = 0; p < 3; p++) {
                r[p] += basis[p] * s[j];
                for (int q = 0; q < 3; q++) {
                    m[p][q] += basis[p] * basis[q];
                }
            }
        }
        return new LUDecomposition(
                new Array2DRowRealMatrix(m)).getSolver()
                .solve(new ArrayRealVector(r)).toArray();
    }

    static double medianSpacing(double[] x) {
        double[] d = new double[x.length - 1];
        for (int i = 1; i < x.length; i++) {
            d[i - 1] = x[i] - x[i - 1];
        }
        Arrays.sort(d);
        return d[d.length / 2];
    }
}
