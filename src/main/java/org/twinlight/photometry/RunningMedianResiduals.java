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
 * J. Am. Stat. Assoc. 88, 1273). A point is an outlier when its scaled residual exceeds k σ and it
 * also lies beyond k σ, on the same side, of straight lines through its neighbours on the left and
 * on the right (so that the first and last points of an eclipse's branch are not counted).
 * A point alone in its segment has no residual and is never an outlier.
 *
 * <p>An eclipse sampled by fewer than about {@value #HALF_WINDOW_POINTS} points on its descending
 * branch can still have its deepest points counted: the count is a diagnostic, nothing is removed.
 */
final class RunningMedianResiduals {

    /** Neighbours on each side of a point in the running median. */
    static final int HALF_WINDOW_POINTS = 5;
    /** Consistency factor between the MAD and a Gaussian σ, 1/Φ⁻¹(3/4). */
    static final double MAD_TO_SIGMA = RobustStatistics.MAD_TO_SIGMA;

    /** Points on each side used for the one-sided straight-line check of a candidate outlier. */
    static final int SIDE_POINTS = 4;

    private final double[] residuals;
    private final double sigma;
    private final double[] t;
    private final double[] y;
    private final int[] segmentOf;
    private final int[] starts;

    RunningMedianResiduals(LightCurve lightCurve, double segmentGapDays) {
        int n = lightCurve.size();
        residuals = new double[n];
        t = lightCurve.timesDays();
        y = lightCurve.fluxes();
        starts = Segments.starts(lightCurve, segmentGapDays);
        segmentOf = new int[n];
        double[] window = new double[2 * HALF_WINDOW_POINTS];
        int used = 0;
        for (int k = 0; k < starts.length; k++) {
            int from = starts[k];
            int to = k + 1 < starts.length ? starts[k + 1] : n;
            for (int i = from; i < to; i++) {
                segmentOf[i] = k;
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
        double centre = RobustStatistics.medianBySelection(finite, used);
        for (int i = 0; i < used; i++) {
            finite[i] = Math.abs(finite[i] - centre);
        }
        sigma = used == 0 ? Double.NaN : MAD_TO_SIGMA * RobustStatistics.medianBySelection(finite, used);
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
        for (int i = 0; i < residuals.length; i++) {
            double r = residuals[i];
            if (Math.abs(r) > k * sigma && beyondBothSides(i, k)) { // false for NaN
                count++;
            }
        }
        return count;
    }

    /**
     * Whether point i also lies more than k σ (of the prediction) from straight lines fitted to
     * {@value #SIDE_POINTS} neighbours on its left and on its right, on the same side of both. A
     * point where an eclipse's branch begins or ends sits on one of those lines; a spike sits on
     * neither. A side with fewer than two neighbours does not veto.
     */
    private boolean beyondBothSides(int i, double k) {
        int seg = segmentOf[i];
        int from = starts[seg];
        int to = seg + 1 < starts.length ? starts[seg + 1] : y.length;
        double left = sideDeviation(Math.max(from, i - SIDE_POINTS), i, i);
        double right = sideDeviation(i + 1, Math.min(to, i + 1 + SIDE_POINTS), i);
        boolean leftBeyond = Double.isNaN(left) || Math.abs(left) > k;
        boolean rightBeyond = Double.isNaN(right) || Math.abs(right) > k;
        boolean sameSide = Double.isNaN(left) || Double.isNaN(right) || Math.signum(left) == Math.signum(right);
        return leftBeyond && rightBeyond && sameSide;
    }

    /**
     * (y_i − line(t_i)) / (σ √(1 + 1/n + (t_i − t̄)²/S_tt)) for the least-squares line through the
     * points [a, b): the standardised prediction error of a straight-line fit (e.g. Draper &amp;
     * Smith 1998, Applied Regression Analysis, 3rd ed., §3.1). NaN for fewer than two points.
     */
    private double sideDeviation(int a, int b, int i) {
        int n = b - a;
        if (n < 2) {
            return Double.NaN;
        }
        double tm = 0;
        double ym = 0;
        for (int j = a; j < b; j++) {
            tm += t[j];
            ym += y[j];
        }
        tm /= n;
        ym /= n;
        double stt = 0;
        double sty = 0;
        for (int j = a; j < b; j++) {
            stt += (t[j] - tm) * (t[j] - tm);
            sty += (t[j] - tm) * (y[j] - ym);
        }
        double slope = stt > 0 ? sty / stt : 0;
        double predicted = ym + slope * (t[i] - tm);
        double factor = 1 + 1.0 / n + (stt > 0 ? (t[i] - tm) * (t[i] - tm) / stt : 0);
        return (y[i] - predicted) / (sigma * Math.sqrt(factor));
    }

    /** Median of the first {@code m} values (sorted in place); the mean of the middle two for even m. */
    static double median(double[] values, int m) {
        return RobustStatistics.medianInPlace(values, m);
    }
}
