package org.twinlight.photometry;

/**
 * The time-averaging factor β of residuals (Pont, Zucker &amp; Queloz 2006, MNRAS 373, 231;
 * Winn et al. 2008, ApJ 683, 1076, §3): how much more the mean of the residuals in a bin of
 * width w scatters than white noise would let it. Residuals standardised by their point errors
 * are averaged in consecutive bins of width w; for white noise the mean of M points scatters as
 * σ₁/√M, and correlated ("red") noise makes it scatter more:
 * β_w² = Σ_j M_j·m_j² / (σ₁²·(N_w − 1)), m_j the mean of bin j, M_j its number of points, N_w the
 * number of bins and σ₁² the mean square of the unbinned residuals. This is Winn et al.'s
 * β = σ_N / (σ₁/√M · √(N/(N−1))) written for bins of unequal occupancy (gaps, clipped points),
 * each bin weighted by its number of points.
 *
 * <p>The N − 1 counts the one mean the residuals were made to have. Residuals of a fit with a
 * baseline fitted per night (segment) had S such means (or polynomials) taken out, which forces
 * the bin means of each night to cancel in part: then the sum has N − S degrees of freedom, and
 * dividing by N − 1 would understate β badly when a night holds only a few bins (11 nights of two
 * 4-hour bins would give β² about half its value).
 *
 * <p>Shared by the errors of times of minimum and the noise diagnostics of the light-curve fit.
 */
public final class TimeAveragingBeta {

    /** Fewest bins a width must give for β_w to be computed. */
    public static final int MIN_BINS = 5;

    private TimeAveragingBeta() {
    }

    /**
     * β_w for bins of width {@code widthDays}, each starting at its first point (a gap starts a
     * new bin).
     *
     * @param timesDays times, days, increasing
     * @param z residuals divided by their point errors (any common scale), mean about zero
     * @param widthDays bin width, days
     * @return β_w, NaN when fewer than {@link #MIN_BINS} bins result or the residuals are all zero
     */
    public static double atWidth(double[] timesDays, double[] z, double widthDays) {
        return atWidth(timesDays, z, widthDays, 1);
    }

    /**
     * β_w of residuals from which {@code removed} fitted means (baseline coefficients) were taken.
     *
     * @param removed number of fitted baseline coefficients (at least 1)
     * @return β_w, NaN when fewer than {@link #MIN_BINS} + removed − 1 bins result or the residuals
     *     are all zero
     */
    public static double atWidth(double[] timesDays, double[] z, double widthDays, int removed) {
        if (removed < 1) {
            throw new IllegalArgumentException("at least one mean is removed, got " + removed);
        }
        int n = timesDays.length;
        double ss = 0;
        for (double v : z) {
            ss += v * v;
        }
        double sigma2 = ss / n;
        if (!(sigma2 > 0)) {
            return Double.NaN;
        }
        double total = 0;
        int bins = 0;
        int i = 0;
        while (i < n) {
            double end = timesDays[i] + widthDays;
            double s = 0;
            int m = 0;
            while (i < n && timesDays[i] < end) {
                s += z[i];
                m++;
                i++;
            }
            total += s * s / m;
            bins++;
        }
        return bins - removed + 1 >= MIN_BINS ? Math.sqrt(total / (sigma2 * (bins - removed))) : Double.NaN;
    }
}
