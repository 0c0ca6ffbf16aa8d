package org.twinlight.timing.period;

import java.util.Map;
import java.util.Random;
import org.twinlight.photometry.LightCurve;
import org.twinlight.photometry.ValueKind;
import org.twinlight.time.TimeScale;

/**
 * Synthetic eclipsing-binary light curves for tests: trapezoid eclipses (primary at the epoch,
 * secondary at a given phase) on a flat level of 1, evenly sampled, with Gaussian noise.
 *
 * @param periodDays orbital period
 * @param epochDays time of a primary minimum
 * @param primaryDepth depth of the primary, relative flux
 * @param primaryWidth full width of the primary, fraction of the period
 * @param secondaryDepth depth of the secondary (0 for none)
 * @param secondaryPhase phase of the secondary after the primary
 * @param secondaryWidth full width of the secondary, fraction of the period
 * @param ingressFraction ingress duration over the half width (1 = V shape, small = box)
 */
public record SyntheticEclipsingCurve(double periodDays, double epochDays, double primaryDepth, double primaryWidth,
        double secondaryDepth, double secondaryPhase, double secondaryWidth, double ingressFraction) {

    public static SyntheticEclipsingCurve circular(double period, double depth1, double depth2, double width) {
        return new SyntheticEclipsingCurve(period, 0.37 * period, depth1, width, depth2, 0.5, width, 0.3);
    }

    public double flux(double t) {
        double ph = (t - epochDays) / periodDays;
        ph -= Math.floor(ph);
        return 1 - primaryDepth * profile(dist(ph, 0), primaryWidth)
                - secondaryDepth * profile(dist(ph, secondaryPhase), secondaryWidth);
    }

    private double profile(double d, double width) {
        double half = width / 2;
        double ingress = ingressFraction * half;
        if (d >= half) {
            return 0;
        }
        return d <= half - ingress ? 1 : (half - d) / ingress;
    }

    private static double dist(double a, double b) {
        double d = Math.abs(a - b) % 1;
        return d > 0.5 ? 1 - d : d;
    }

    /** Samples every {@code cadenceDays} from {@code startDays} over {@code baselineDays} with noise σ. */
    public LightCurve sample(double startDays, double baselineDays, double cadenceDays, double noise, long seed,
            boolean withErrors) {
        int n = (int) Math.floor(baselineDays / cadenceDays) + 1;
        double[] t = new double[n];
        double[] f = new double[n];
        double[] e = withErrors ? new double[n] : null;
        Random rnd = new Random(seed);
        for (int i = 0; i < n; i++) {
            t[i] = startDays + i * cadenceDays;
            f[i] = flux(t[i]) + noise * rnd.nextGaussian();
            if (e != null) {
                e[i] = noise;
            }
        }
        return new LightCurve("synthetic-" + seed, null, TimeScale.UNKNOWN, ValueKind.FLUX, t, f, e, Map.of());
    }
}
