package org.twinlight.velocity;

import java.util.List;

/**
 * The outcome of a velocity fit.
 *
 * @param best the best parameters
 * @param estimates every parameter with its uncertainty (fixed ones with 0)
 * @param freeNames names of the fitted quantities, in the order of {@code correlation}
 * @param correlation correlation matrix of the fitted quantities
 * @param covariance covariance matrix of the fitted quantities (scaled as the uncertainties)
 * @param sigma1 errors used for star 1 (the file's, or estimated from the scatter), km/s
 * @param sigma2 errors used for star 2, km/s
 * @param n number of velocities fitted
 * @param chi2 χ² with the errors and jitter used
 * @param degreesOfFreedom n − number of fitted quantities
 * @param rms1Kms RMS of star 1's residuals
 * @param rms2Kms RMS of star 2's residuals (NaN without star 2)
 * @param iterations solver iterations (summed over jitter rounds)
 * @param errorsEstimated whether the errors came from the scatter (the file gave none)
 * @param notes what the reader should know
 */
public record VelocityFitResult(VelocityParameters best, List<VelocityEstimate> estimates, List<String> freeNames,
        double[][] correlation, double[][] covariance, double[] sigma1, double[] sigma2, int n, double chi2,
        int degreesOfFreedom, double rms1Kms, double rms2Kms, int iterations, boolean errorsEstimated,
        List<String> notes) {

    public double reducedChi2() {
        return chi2 / degreesOfFreedom;
    }

    /** The estimate called {@code name}. */
    public VelocityEstimate estimate(String name) {
        return estimates.stream().filter(e -> e.name().equals(name)).findFirst()
                .orElseThrow(() -> new IllegalArgumentException("no estimate " + name));
    }

    /** Covariance of two fitted quantities, 0 when either is fixed. */
    public double covariance(String a, String b) {
        int i = freeNames.indexOf(a);
        int j = freeNames.indexOf(b);
        return i < 0 || j < 0 ? 0.0 : covariance[i][j];
    }
}
