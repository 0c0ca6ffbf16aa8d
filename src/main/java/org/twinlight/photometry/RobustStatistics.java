package org.twinlight.photometry;

import java.util.Arrays;

/**
 * Medians and robust noise estimates shared by the readers, the period and minimum searches and
 * the fit. The scale factor 1.4826 turns a median absolute deviation into the σ of a normal
 * distribution (1/Φ⁻¹(3/4); e.g. Rousseeuw &amp; Croux 1993, JASA 88, 1273).
 */
public final class RobustStatistics {
    /** σ of a normal distribution per unit median absolute deviation. */
    public static final double MAD_TO_SIGMA = 1.4826;

    private RobustStatistics() {
    }

    /** Median of the values (not changed); NaN for none. */
    public static double median(double[] values) {
        return medianInPlace(values.clone(), values.length);
    }

    /** Median of the first {@code n} values, sorting them in place; NaN when n = 0. */
    public static double medianInPlace(double[] values, int n) {
        if (n == 0) {
            return Double.NaN;
        }
        Arrays.sort(values, 0, n);
        return n % 2 == 1 ? values[n / 2] : 0.5 * (values[n / 2 - 1] + values[n / 2]);
    }

    /**
     * Median of the first {@code n} values (none NaN) in time proportional to n, reordering them
     * in place (Hoare's selection, "Find", Comm. ACM 4, 321, 1961): for long series where sorting
     * would dominate. The same value as {@link #medianInPlace}; the order left behind is not sorted.
     */
    public static double medianBySelection(double[] values, int n) {
        if (n == 0) {
            return Double.NaN;
        }
        int k = n / 2;
        double upper = select(values, n, k);
        if (n % 2 == 1) {
            return upper;
        }
        double lower = values[0];
        for (int i = 1; i < k; i++) {
            lower = Math.max(lower, values[i]);
        }
        return 0.5 * (lower + upper);
    }

    /** The k-th smallest (0-based) of the first n values; afterwards values[0..k) ≤ values[k] ≤ values(k..n). */
    private static double select(double[] a, int n, int k) {
        int lo = 0;
        int hi = n - 1;
        while (hi > lo) {
            int mid = (lo + hi) >>> 1;
            // median of three as the pivot, so sorted input stays linear
            double x = a[lo];
            double y = a[mid];
            double z = a[hi];
            double pivot = Math.max(Math.min(x, y), Math.min(Math.max(x, y), z));
            int i = lo;
            int j = hi;
            while (i <= j) {
                while (a[i] < pivot) {
                    i++;
                }
                while (a[j] > pivot) {
                    j--;
                }
                if (i <= j) {
                    double t = a[i];
                    a[i] = a[j];
                    a[j] = t;
                    i++;
                    j--;
                }
            }
            if (k <= j) {
                hi = j;
            } else if (k >= i) {
                lo = i;
            } else {
                return a[k];
            }
        }
        return a[k];
    }

    /** 1.4826 × the median absolute deviation from the median: a σ that outliers and eclipses barely move. */
    public static double madSigma(double[] values) {
        double med = median(values);
        double[] dev = new double[values.length];
        for (int i = 0; i < values.length; i++) {
            dev[i] = Math.abs(values[i] - med);
        }
        return MAD_TO_SIGMA * medianInPlace(dev, dev.length);
    }

    /**
     * White-noise σ of a series from its successive differences, madSigma(Δy)/√2: insensitive to
     * slow trends and to the few points on eclipse branches. 0 for fewer than three values.
     */
    public static double pointToPointSigma(double[] y) {
        if (y.length < 3) {
            return 0;
        }
        double[] d = new double[y.length - 1];
        for (int i = 1; i < y.length; i++) {
            d[i - 1] = y[i] - y[i - 1];
        }
        return madSigma(d) / Math.sqrt(2);
    }
}
