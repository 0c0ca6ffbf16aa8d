package org.twinlight.photometry;

import java.util.Arrays;

/**
 * Residuals of a light curve from its running median and a robust scatter, used to count
 * outliers: a Hampel-type filter (Hampel 1974, J. Am. Stat. Assoc. 69, 383). For each point
 * the running median is taken over the {@value #WINDOW_POINTS} nearest points in its own segment
 * (fewer at the segment's ends); the scatter is σ = 1.4826 × MAD of all residuals, the factor
 * that makes the MAD a consistent estimator of a Gaussian σ (Rousseeuw &amp; Croux 1993,
 * J. Am. Stat. Assoc. 88, 1273). A point is an outlier when |residual| &gt; k σ.
 *
 * <p>An eclipse sampled by fewer than about half a window of points on its descending branch can
 * have its deepest points counted: the count is a diagnostic, nothing is removed.
 */
final class RunningMedianResiduals {

    /** Points in the running-median window (centred, odd). */
    static final int WINDOW_POINTS = 11;
    /** Consistency factor between the MAD and a Gaussian σ, 1/Φ⁻¹(3/4). */
    static final double MAD_TO_SIGMA = 1.4826;

    private final double[] residuals;
    private final double sigma;

    RunningMedianResiduals(LightCurve lightCurve, double segmentGapDays) {
        int n = lightCurve.size();
        residuals = new double[n];
        int[] starts = Segments.starts(lightCurve, segmentGapDays);
        double[] window = new double[WINDOW_POINTS];
        int half = WINDOW_POINTS / 2;
        for (int k = 0; k < starts.length; k++) {
            int from = starts[k];
            int to = k + 1 < starts.length ? starts[k + 1] : n;
            for (int i = from; i < to; i++) {
                int lo = Math.max(from, i - half);
                int hi = Math.min(to, i + half + 1);
                int m = hi - lo;
                for (int j = 0; j < m; j++) {
                    window[j] = lightCurve.flux(lo + j);
                }
                residuals[i] = lightCurve.flux(i) - median(window, m);
            }
        }
        double[] copy = residuals.clone();
        double centre = median(copy, n);
        for (int i = 0; i < n; i++) {
            copy[i] = Math.abs(residuals[i] - centre);
        }
        sigma = n == 0 ? Double.NaN : MAD_TO_SIGMA * median(copy, n);
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
            if (Math.abs(r) > k * sigma) {
                count++;
            }
        }
        return count;
    }

    /** Median of the first {@code m} values (sorted in place); the mean of the middle two for even m. */
    static double median(double[] values, int m) {
        if (m == 0) {
            return Double.NaN;
        }
        Arrays.sort(values, 0, m);
        return m % 2 == 1 ? values[m / 2] : 0.5 * (values[m / 2 - 1] + values[m / 2]);
    }
}
