package org.twinlight.timing.minima;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.analysis.interpolation.SplineInterpolator;
import org.apache.commons.math3.analysis.polynomials.PolynomialSplineFunction;

/**
 * A symmetric eclipse profile ψ(x), x = time from minimum in days, made by folding the eclipses
 * of one type on their own minima: the fractional depth 1 − flux/baseline is averaged in bins of
 * |x| and joined by a natural cubic spline through the bin means mirrored to negative x, so ψ is
 * even by construction (ψ(−x) = ψ(x), ψ'(0) = 0). It is scaled so that its largest bin mean is 1
 * and is constant beyond the outermost bin.
 *
 * <p>The number of bins (6 to 80, at least 5 points a bin) is chosen by the Bayesian information
 * criterion χ² + bins·ln n of the folded points (Schwarz 1978, Ann. Stat. 6, 461): enough bins to
 * follow the shape, not so many that the template follows the noise, whose slope would make the
 * template fit's errors too small.
 *
 * <p>Folding on |x| averages the two branches, so the part of any one eclipse's noise that could
 * shift its own minimum (the odd part) does not enter the template.
 */
final class MinimumTemplate {
    private static final int MIN_BINS = 6;
    private static final int MAX_BINS = 80;
    private final PolynomialSplineFunction spline;
    private final PolynomialSplineFunction derivative;
    private final double reach;
    private final double edgeValue;
    private final double peak;

    private MinimumTemplate(PolynomialSplineFunction spline, double reach, double edgeValue, double peak) {
        this.peak = peak;
        this.spline = spline;
        this.derivative = spline.polynomialSplineDerivative();
        this.reach = reach;
        this.edgeValue = edgeValue;
    }

    /**
     * Builds the template, or returns null when the folded eclipses show no dip.
     *
     * @param offsets time from each eclipse's own minimum, days (all eclipses together)
     * @param depths fractional depth 1 − flux/baseline at those points
     * @param weights 1/σ² of the depths (relative weights suffice), or all 1 when the data carry no errors
     * @param halfWidthDays the template covers |x| ≤ this
     */
    static MinimumTemplate build(double[] offsets, double[] depths, double[] weights, double halfWidthDays) {
        int n = offsets.length;
        int most = Math.max(MIN_BINS, Math.min(MAX_BINS, n / 5));
        MinimumTemplate finest = withBins(offsets, depths, halfWidthDays, most);
        if (finest == null) {
            return null;
        }
        // Noise scale from the finest template's residuals, so that missing (all 1) or misstated
        // point errors do not change the choice.
        double scale = finest.chi2(offsets, depths, weights) / Math.max(1, n - most);
        if (!(scale > 0)) {
            return finest;
        }
        MinimumTemplate best = null;
        double bestScore = Double.POSITIVE_INFINITY;
        for (int bins = MIN_BINS; bins <= most; bins = Math.max(bins + 1, (int) Math.round(bins * 1.4))) {
            MinimumTemplate candidate = bins == most ? finest : withBins(offsets, depths, halfWidthDays, bins);
            if (candidate == null) {
                continue;
            }
            double score = candidate.chi2(offsets, depths, weights) / scale + bins * Math.log(n);
            if (score < bestScore) {
                bestScore = score;
                best = candidate;
            }
        }
        return best;
    }

    /** Weighted squared residuals of the depths about the (unnormalised) template. */
    private double chi2(double[] offsets, double[] depths, double[] weights) {
        double sum = 0;
        for (int i = 0; i < offsets.length; i++) {
            double r = depths[i] - peak * value(offsets[i]);
            sum += weights[i] * r * r;
        }
        return sum;
    }

    private static MinimumTemplate withBins(double[] offsets, double[] depths, double halfWidthDays, int bins) {
        int n = offsets.length;
        double[] sum = new double[bins];
        double[] sumX = new double[bins];
        int[] count = new int[bins];
        for (int i = 0; i < n; i++) {
            double ax = Math.abs(offsets[i]);
            if (ax > halfWidthDays) {
                continue;
            }
            int b = Math.min(bins - 1, (int) (ax / halfWidthDays * bins));
            sum[b] += depths[i];
            sumX[b] += ax;
            count[b]++;
        }
        List<double[]> nodes = new ArrayList<>();
        double peak = Double.NEGATIVE_INFINITY;
        for (int b = 0; b < bins; b++) {
            if (count[b] > 0) {
                double mean = sum[b] / count[b];
                nodes.add(new double[] {sumX[b] / count[b], mean});
                peak = Math.max(peak, mean);
            }
        }
        if (nodes.size() < 3 || !(peak > 0)) {
            return null;
        }
        int m = nodes.size();
        // Mirrored nodes: bin centres are > 0 (mean |x| of a bin), so -c < c holds strictly.
        double[] xs = new double[2 * m];
        double[] ys = new double[2 * m];
        for (int j = 0; j < m; j++) {
            double[] node = nodes.get(j);
            xs[m - 1 - j] = -node[0];
            ys[m - 1 - j] = node[1] / peak;
            xs[m + j] = node[0];
            ys[m + j] = node[1] / peak;
        }
        if (xs[m - 1] >= xs[m]) {
            xs[m] = Math.nextUp(xs[m - 1]);
        }
        for (int i = 1; i < xs.length; i++) {
            if (xs[i] <= xs[i - 1]) {
                xs[i] = Math.nextUp(xs[i - 1]);
            }
        }
        PolynomialSplineFunction spline = new SplineInterpolator().interpolate(xs, ys);
        return new MinimumTemplate(spline, xs[xs.length - 1], ys[ys.length - 1], peak);
    }

    /** ψ(x): 1 near minimum, near 0 out of eclipse. */
    double value(double x) {
        double ax = Math.abs(x);
        return ax >= reach ? edgeValue : spline.value(ax);
    }

    /** dψ/dx. */
    double slope(double x) {
        double ax = Math.abs(x);
        if (ax >= reach) {
            return 0;
        }
        double d = derivative.value(ax);
        return x < 0 ? -d : d;
    }
}
