package org.twinlight.timing.minima;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.twinlight.photometry.TimeAveragingBeta;

/**
 * How much the noise near an eclipse is correlated in time on the time scale of the eclipse's
 * branches: the time-averaging factor β of Winn et al. (2008, ApJ 683, 1076, §3; after Pont,
 * Zucker &amp; Queloz 2006, MNRAS 373, 231). Residuals standardised by their point errors are
 * averaged in bins of width w ({@link TimeAveragingBeta} gives β_w). β is the mean of β_w over
 * w = 1, 1.4 and 2 times the branch duration (half the eclipse duration), the time over which the
 * minimum's position is decided.
 *
 * <p>The residuals are those of the <em>out-of-eclipse</em> light near the eclipse (minus the
 * median of each stretch of data between gaps): inside the eclipse the fitted time, depth and
 * baseline absorb exactly the slow, antisymmetric part of the noise that moves a minimum, so the
 * eclipse's own residuals would show too little of it. Where too little out-of-eclipse light lies
 * near an eclipse, the out-of-eclipse light of the whole curve is used.
 */
final class CorrelatedNoise {

    /** Fewest bins a width must give to count. */
    static final int MIN_BINS = TimeAveragingBeta.MIN_BINS;
    /** Widths, in units of the branch duration. */
    private static final double[] WIDTHS = {1.0, 1.4, 2.0};

    private CorrelatedNoise() {
    }

    /**
     * β from standardised residuals.
     *
     * @param x times, days, increasing
     * @param z residuals divided by their point errors (any common scale)
     * @param branchDays half the eclipse duration, days
     * @return β, NaN when no width gives {@link #MIN_BINS} bins
     */
    static double beta(double[] x, double[] z, double branchDays) {
        if (x.length < 2 * MIN_BINS) {
            return Double.NaN;
        }
        double sum = 0;
        int widths = 0;
        for (double factor : WIDTHS) {
            double b = TimeAveragingBeta.atWidth(x, z, factor * branchDays);
            if (Double.isFinite(b)) {
                sum += b;
                widths++;
            }
        }
        return widths == 0 ? Double.NaN : sum / widths;
    }

    /**
     * Standardised out-of-eclipse residuals of a light curve: the points outside every eclipse
     * window, minus the median of each stretch between gaps longer than {@code gapDays}, times
     * √(weight).
     *
     * @param t times, days, increasing
     * @param f flux
     * @param w weights 1/σ²
     * @param inEclipse true for the points inside an eclipse window
     * @param gapDays a gap longer than this starts a new stretch
     * @return {times, residuals}
     */
    static double[][] outOfEclipseResiduals(double[] t, double[] f, double[] w, boolean[] inEclipse, double gapDays) {
        List<double[]> rows = new ArrayList<>();
        int start = 0;
        for (int i = 1; i <= t.length; i++) {
            if (i == t.length || t[i] - t[i - 1] > gapDays) {
                List<Integer> kept = new ArrayList<>();
                for (int j = start; j < i; j++) {
                    if (!inEclipse[j]) {
                        kept.add(j);
                    }
                }
                if (kept.size() >= 3) {
                    double[] v = kept.stream().mapToDouble(j -> f[j]).toArray();
                    double median = MinimumProfileEstimate.median(v);
                    for (int j : kept) {
                        rows.add(new double[] {t[j], (f[j] - median) * Math.sqrt(w[j])});
                    }
                }
                start = i;
            }
        }
        double[][] out = new double[2][rows.size()];
        for (int i = 0; i < rows.size(); i++) {
            out[0][i] = rows.get(i)[0];
            out[1][i] = rows.get(i)[1];
        }
        return out;
    }

    /** The part of {@code residuals} ({times, values}) within [from, to]. */
    static double[][] between(double[][] residuals, double from, double to) {
        double[] x = residuals[0];
        int a = MinimumFinder.lowerBound(x, from);
        int b = MinimumFinder.lowerBound(x, to);
        return new double[][] {Arrays.copyOfRange(x, a, b), Arrays.copyOfRange(residuals[1], a, b)};
    }
}
