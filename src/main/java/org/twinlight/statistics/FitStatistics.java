package org.twinlight.statistics;

/**
 * Summary statistics of a least-squares fit, and the error-scaling rule shared by every fitter.
 *
 * <p><b>The rule</b> ({@link #varianceScale}): the covariance (JᵀJ)⁻¹ of weighted residuals is
 * multiplied by
 * <ul>
 * <li>χ²ν when the errors were estimated from the data's scatter (or are known only up to a
 * factor): the absolute scale then comes from the residuals alone (Press et al. 2007,
 * <i>Numerical Recipes</i>, 3rd ed., §15.6, from memory);</li>
 * <li>max(1, χ²ν) when the errors were stated with the data: a χ²ν above 1 says the scatter is
 * larger than they claim, and the uncertainties grow with it (the Birge ratio, Birge 1932, Phys.
 * Rev. 40, 207); a χ²ν below 1 on a finite number of degrees of freedom is chance as often as it
 * is overstated errors (its spread is √(2/ν)), and shrinking on it makes small data sets confident
 * and wrong, so the stated errors are then kept as they are.</li>
 * </ul>
 */
public final class FitStatistics {
    private FitStatistics() {
    }

    /**
     * The factor the covariance of a fit is multiplied by (its square root multiplies the
     * uncertainties).
     *
     * @param chi2 χ² at the optimum
     * @param dof degrees of freedom n − k; ≤ 0 gives 1
     * @param errorsEstimated whether the errors were estimated from the scatter rather than stated
     */
    public static double varianceScale(double chi2, int dof, boolean errorsEstimated) {
        if (dof <= 0 || !Double.isFinite(chi2)) {
            return 1.0;
        }
        double reduced = chi2 / dof;
        return errorsEstimated ? reduced : Math.max(1.0, reduced);
    }

    /** Bayesian information criterion χ² + k ln n (Schwarz 1978, Ann. Stat. 6, 461). */
    public static double bic(double chi2, int fittedCount, int n) {
        return chi2 + fittedCount * Math.log(n);
    }

    /** Root-mean-square of the values. */
    public static double rms(double[] values) {
        double s = 0;
        for (double v : values) {
            s += v * v;
        }
        return values.length == 0 ? Double.NaN : Math.sqrt(s / values.length);
    }

    /** The correlation matrix of a covariance matrix (1 on the diagonal; 0 where a variance is 0). */
    public static double[][] correlation(double[][] covariance) {
        int k = covariance.length;
        double[][] c = new double[k][k];
        for (int a = 0; a < k; a++) {
            for (int b = 0; b < k; b++) {
                double den = Math.sqrt(covariance[a][a] * covariance[b][b]);
                c[a][b] = den > 0 ? covariance[a][b] / den : (a == b ? 1 : 0);
            }
        }
        return c;
    }
}
