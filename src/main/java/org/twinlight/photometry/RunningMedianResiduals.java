package org.twinlight.photometry;

import java.util.Arrays;

/**
 * Residuals of a light curve from its running median and a robust scatter, used to count
 * outliers: a Hampel-type filter (Hampel 1974, J. Am. Stat. Assoc. 69, 383).
 *
 * <p>For each point the running median is taken over its neighbours, up to
 * {@value #HALF_WINDOW_POINTS} on each side within its own segment (fewer at the segment's ends),
 * leaving the point itself out so that a spike does not pull its own reference. The residual of
 * white noise of standard deviation σ then has variance σ²(1 + π/(2m)) for m neighbours, π σ²/(2m)
 * being the large-sample variance of a median of m values (from memory: Kendall &amp; Stuart, The
 * Advanced Theory of Statistics, vol. 1, the sampling variance of the median); for m ≤ 2 the
 * median is the mean and the variance is σ²(1 + 1/m). Each residual is divided by that factor's
 * square root, so that σ = 1.4826 × MAD of the scaled residuals estimates the point-to-point noise
 * (1.4826 makes the MAD a consistent estimator of a Gaussian σ; Rousseeuw &amp; Croux 1993,
 * J. Am. Stat. Assoc. 88, 1273). A point is an outlier when its scaled residual exceeds k σ.
 * A point alone in its segment has no residual and is never an outlier.
 *
 * <p>An eclipse sampled by fewer than about {@value #HALF_WINDOW_POINTS} points on its descending
 * branch can have its deepest points counted: the count is a diagnostic, nothing is removed.
 */
final class RunningMedianResiduals {

    /** Neighbours on each side of a point in the running median. */
    static final int HALF_WINDOW_POINTS = 5;
    /** Consistency factor between the MAD and a Gaussian σ, 1/Φ⁻¹(3/4). */
    static final double MAD_TO_SIGMA = RobustStatistics.MAD_TO_SIGMA;

    private final double[] residuals;
    private final double sigma;

    RunningMedianResiduals(LightCurve lightCurve, double segmentGapDays) {
        int n = lightCurve.size();
        residuals = new double[n];
        int[] starts = Segments.starts(lightCurve, segmentGapDays);
        double[] window = new double[2 * HALF_WINDOW_POINTS];
        int used = 0;
        for (int k = 0; k < starts.length; k++) {
            int from = starts[k];
            int to = k + 1 < starts.length ? starts[k + 1] : n;
            for (int i = from; i < to; i++) {
                int m = 0;
                for (int j = Math.max(from, i - HALF_WINDOW_POINTS); j < Math.min(to, i + HALF_WINDOW_POINTS + 1); j++) {
                    if (j != i) {
                        window[m++] = lightCurve.flux(j);
                    }
                }
                if (m == 0) {
                    residuals[i] = Double.NaN;
                    continue;
                }
                double varianceFactor = m <= 2 ? 1.0 + 1.0 / m : 1.0 + Math.PI / (2.0 * m);
                residuals[i] = (lightCurve.flux(i) - median(window, m)) / Math.sqrt(varianceFactor);
                used++;
            }
        }
        double[] finite = new double[used];
        int c = 0;
        for (double r : residuals) {
            if (!Double.isNaN(r)) {
                finite[c++] = r;
            }
        }
        double centre = median(finite, used);
        for (int i = 0; i < used; i++) {
            finite[i] = Math.abs(finite[i] - centre);
        }
        sigma = used == 0 ? Double.NaN : MAD_TO_SIGMA * median(finite, used);
    }

    /** The robust point-to-point scatter σ, flux units (0 when more than half the residuals are 0). */
    double sigma() {
        return sigma;
    }

    /** Number of points with |residual| &gt; {@code k} σ; 0 when σ is 0 or undefined. */
    int countBeyond(double k) {
        if (!(sigma > 0)) {
            return 0;
        }
        int count = 0;
        for (double r : residuals) {
            if (Math.abs(r) > k * sigma) { // false for NaN
                count++;
            }
        }
        return count;
    }

    /** Median of the first {@code m} values (sorted in place); the mean of the middle two for even m. */
    static double median(double[] values, int m) {
        return RobustStatistics.medianInPlace(values, m);
    }
}
