package org.twinlight.timing.minima;

import java.util.Map;
import java.util.Random;
import java.util.function.DoubleUnaryOperator;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.ValueKind;
import org.twinlight.time.TimeScale;

/**
 * Synthetic light curves for the timing tests: flat out of eclipse, each eclipse a smooth
 * symmetric dip 1 − D·(1 − (x/h)²)^1.5 for |x| &lt; h (x time from minimum, h half-duration),
 * white Gaussian noise plus, optionally, Gaussian noise correlated in time with an exponential
 * covariance σ²·exp(−|Δt|/τ) (an Ornstein–Uhlenbeck process, drawn exactly at uneven times by
 * x_{i+1} = ρx_i + √(1 − ρ²)·σ·N(0,1), ρ = exp(−Δt/τ); e.g. Gillespie 1996, Phys. Rev. E 54,
 * 2084, eq. 1.3; from memory). Times of the minima may be displaced per eclipse (an O−C).
 */
final class SyntheticEclipses {
    double periodDays = 2.5;
    double epochDays = 2460000.3;
    double secondaryPhase = 0.5;
    double primaryDepth = 0.3;
    double secondaryDepth = 0.12;
    double halfDurationDays = 0.08;
    double cadenceDays = 2.0 / 1440;
    double noise = 0.002;
    /** σ of the correlated part of the noise (0: white noise only). */
    double redNoise = 0.0;
    /** τ of the correlated part, days. */
    double redTimescaleDays = 30.0 / 1440;
    /** Displacement (days) of the minimum of cycle E (E integer primary, n + 0.5 secondary). */
    DoubleUnaryOperator ocDays = e -> 0.0;
    /** Fractional dip (0 out of eclipse, 1 at the deepest) at time x from minimum, half-duration h. */
    java.util.function.DoubleBinaryOperator shape = SyntheticEclipses::dip;

    static double dip(double x, double half) {
        double u = x / half;
        return Math.abs(u) >= 1 ? 0 : Math.pow(1 - u * u, 1.5);
    }

    /**
     * Displaces every minimum from cycle −2 to {@code cycles} by its own random O−C, uniform within
     * ±{@code halfRangeMinutes}.
     */
    void randomOc(long seed, double halfRangeMinutes, int cycles) {
        Random jitter = new Random(seed);
        double[] oc = new double[2 * cycles + 8];
        for (int i = 0; i < oc.length; i++) {
            oc[i] = (jitter.nextDouble() - 0.5) * 2 * halfRangeMinutes / 1440;
        }
        ocDays = e -> oc[(int) Math.floor(2 * e) + 4];
    }

    /** The true time of the minimum of cycle E. */
    double trueTime(double cycle) {
        double n = Math.floor(cycle);
        double phase = cycle == n ? 0 : secondaryPhase;
        return epochDays + periodDays * (n + phase) + ocDays.applyAsDouble(cycle);
    }

    double flux(double t) {
        double c = (t - epochDays) / periodDays;
        long n = Math.round(c);
        double f = 1.0;
        for (long k = n - 1; k <= n + 1; k++) {
            f -= primaryDepth * shape.applyAsDouble(t - trueTime(k), halfDurationDays);
            f -= secondaryDepth * shape.applyAsDouble(t - trueTime(k + 0.5), halfDurationDays);
        }
        return f;
    }

    LightCurve sample(double startDays, double endDays, long seed) {
        Random random = new Random(seed);
        int n = (int) Math.floor((endDays - startDays) / cadenceDays) + 1;
        double[] t = new double[n];
        double[] f = new double[n];
        double[] e = new double[n];
        double red = redNoise * random.nextGaussian();
        for (int i = 0; i < n; i++) {
            t[i] = startDays + i * cadenceDays;
            if (i > 0) {
                double rho = Math.exp(-(t[i] - t[i - 1]) / redTimescaleDays);
                red = rho * red + Math.sqrt(1 - rho * rho) * redNoise * random.nextGaussian();
            }
            f[i] = flux(t[i]) + noise * random.nextGaussian() + (redNoise > 0 ? red : 0);
            e[i] = noise;
        }
        return new LightCurve("synthetic", null, TimeScale.BJD_TDB, ValueKind.FLUX, t, f, e, Map.of());
    }
}
