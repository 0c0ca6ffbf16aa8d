package org.twinlight.timing;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.analysis.interpolation.SplineInterpolator;
import org.apache.commons.math3.analysis.polynomials.PolynomialSplineFunction;

/**
 * A symmetric eclipse profile ψ(x), x = time from minimum in days, made by folding the eclipses
 * of one type on their own minima: the fractional depth 1 − flux/baseline is averaged in bins of
 * |x| (about 40 points a bin, so the slope of the template is not dominated by noise) and joined by a natural cubic spline through the bin means mirrored to negative x, so ψ is
 * even by construction (ψ(−x) = ψ(x), ψ'(0) = 0). It is scaled so that its largest bin mean is 1
 * and is constant beyond the outermost bin.
 *
 * <p>Folding on |x| averages the two branches, so the part of any one eclipse's noise that could
 * shift its own minimum (the odd part) does not enter the template.
 */
final class MinimumTemplate {
    private final PolynomialSplineFunction spline;
    private final PolynomialSplineFunction derivative;
    private final double reach;
    private final double edgeValue;

    private MinimumTemplate(PolynomialSplineFunction spline, double reach, double edgeValue) {
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
     * @param halfWidthDays the template covers |x| ≤ this
     */
    static MinimumTemplate build(double[] offsets, double[] depths, double halfWidthDays) {
        int n = offsets.length;
        int bins = Math.max(6, Math.min(40, n / 40));
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
        return new MinimumTemplate(spline, xs[xs.length - 1], ys[ys.length - 1]);
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
