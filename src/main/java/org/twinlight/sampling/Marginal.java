package org.twinlight.sampling;

import java.util.Arrays;

/**
 * The summary of one quantity's marginal posterior: median, central 68 % and 95 % intervals
 * (16th/84th and 2.5th/97.5th percentiles) and, when the samples pile up at a physical bound
 * (i = 90°, e = 0, ℓ₃ = 0), a one-sided limit measured from that bound.
 *
 * @param median 50th percentile
 * @param lower68 15.87th percentile
 * @param upper68 84.13th percentile
 * @param lower95 2.5th percentile
 * @param upper95 97.5th percentile
 * @param autocorrelationTime τ of the quantity along the chain, in steps (NaN if not computed)
 * @param limit the one-sided limit, or null when the posterior does not pile up at a bound
 */
public record Marginal(double median, double lower68, double upper68, double lower95, double upper95,
        double autocorrelationTime, Limit limit) {

    /** Probability inside ±1σ of a Gaussian, for the 68 % interval. */
    static final double ONE_SIGMA = 0.682689492137086;
    /**
     * Histogram bins between the bound and the 95 % one-sided quantile in the pile-up test; the
     * samples pile up when the bin at the bound holds at least {@link #PILE_UP_FRACTION} of the
     * fullest bin (common practice, no source: the density is highest at, or flat up to, the bound).
     */
    static final int PILE_UP_BINS = 10;
    static final double PILE_UP_FRACTION = 0.8;

    /**
     * A one-sided limit.
     *
     * @param side "upper" (the quantity is below value95 at 95 %: a bound at the lower end, e = 0)
     *     or "lower" (above value95: a bound at the upper end, i = 90°)
     * @param value68 the 68 % limit
     * @param value95 the 95 % limit
     */
    public record Limit(String side, double value68, double value95) {
    }

    /**
     * Summarises samples.
     *
     * @param samples the retained samples (not changed)
     * @param tau the autocorrelation time to report
     * @param lowerEdge a physical lower bound that is a reachable value (e = 0, ℓ₃ = 0), else NaN
     * @param upperEdge a physical upper bound that is a reachable value (i = 90°), else NaN
     */
    public static Marginal of(double[] samples, double tau, double lowerEdge, double upperEdge) {
        double[] s = samples.clone();
        Arrays.sort(s);
        double lo68 = (1 - ONE_SIGMA) / 2;
        Limit limit = null;
        if (!Double.isNaN(lowerEdge) && pilesUp(s, lowerEdge, quantile(s, 0.95))) {
            limit = new Limit("upper", quantile(s, ONE_SIGMA), quantile(s, 0.95));
        } else if (!Double.isNaN(upperEdge) && pilesUp(s, upperEdge, quantile(s, 0.05))) {
            limit = new Limit("lower", quantile(s, 1 - ONE_SIGMA), quantile(s, 0.05));
        }
        return new Marginal(quantile(s, 0.5), quantile(s, lo68), quantile(s, 1 - lo68), quantile(s, 0.025),
                quantile(s, 0.975), tau, limit);
    }

    /** True when a histogram from {@code edge} to {@code far} is fullest (nearly) in the bin at the edge. */
    static boolean pilesUp(double[] sorted, double edge, double far) {
        double width = (far - edge) / PILE_UP_BINS;
        if (!(Math.abs(width) > 0)) {
            // 95 % of the samples sit on the bound itself
            return true;
        }
        int[] counts = new int[PILE_UP_BINS];
        for (double v : sorted) {
            int b = (int) Math.floor((v - edge) / width);
            if (b >= 0 && b < PILE_UP_BINS) {
                counts[b]++;
            }
        }
        int max = Arrays.stream(counts).max().orElse(0);
        return max > 0 && counts[0] >= PILE_UP_FRACTION * max;
    }

    /** Quantile of sorted values with linear interpolation between order statistics (Hyndman &amp; Fan 1996, type 7). */
    public static double quantile(double[] sorted, double p) {
        int n = sorted.length;
        if (n == 0) {
            return Double.NaN;
        }
        double h = (n - 1) * p;
        int i = (int) Math.floor(h);
        if (i >= n - 1) {
            return sorted[n - 1];
        }
        return sorted[i] + (h - i) * (sorted[i + 1] - sorted[i]);
    }
}
