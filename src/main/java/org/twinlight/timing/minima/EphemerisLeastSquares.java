package org.twinlight.timing.minima;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.apache.commons.math3.linear.NonPositiveDefiniteMatrixException;
import org.apache.commons.math3.linear.RealMatrix;
import org.twinlight.WorkFailedException;

/**
 * Weighted linear least squares y = X·β by the normal equations (XᵀWX)β = XᵀWy with W = diag(1/σ²),
 * solved by Cholesky decomposition; the covariance of β is (XᵀWX)⁻¹ (Press et al., Numerical
 * Recipes, 3rd ed., §15.4). The columns are O−C-sized corrections, so the system stays well
 * conditioned.
 */
final class EphemerisLeastSquares {

    /**
     * @param coefficients β
     * @param covariance (XᵀWX)⁻¹, formal (not scaled)
     * @param chi2 Σ((y − Xβ)/σ)²
     */
    record Solution(double[] coefficients, double[][] covariance, double chi2) {
        double sigma(int i) {
            return Math.sqrt(covariance[i][i]);
        }
    }

    private EphemerisLeastSquares() {
    }

    /** @throws WorkFailedException when the columns are degenerate (e.g. all timings in one cycle) */
    static Solution solve(double[][] design, double[] y, double[] sigma) {
        int n = y.length;
        int k = design[0].length;
        double[][] normal = new double[k][k];
        double[] rhs = new double[k];
        for (int i = 0; i < n; i++) {
            double w = 1 / (sigma[i] * sigma[i]);
            for (int p = 0; p < k; p++) {
                rhs[p] += w * design[i][p] * y[i];
                for (int q = p; q < k; q++) {
                    normal[p][q] += w * design[i][p] * design[i][q];
                }
            }
        }
        for (int p = 0; p < k; p++) {
            for (int q = 0; q < p; q++) {
                normal[p][q] = normal[q][p];
            }
        }
        // Scale the columns to unit diagonal before the decomposition; undo it afterwards.
        double[] scale = new double[k];
        for (int p = 0; p < k; p++) {
            scale[p] = normal[p][p] > 0 ? 1 / Math.sqrt(normal[p][p]) : 1;
        }
        double[][] scaled = new double[k][k];
        for (int p = 0; p < k; p++) {
            for (int q = 0; q < k; q++) {
                scaled[p][q] = normal[p][q] * scale[p] * scale[q];
            }
        }
        CholeskyDecomposition chol;
        try {
            chol = new CholeskyDecomposition(new Array2DRowRealMatrix(scaled), 1e-12, 1e-12);
        } catch (NonPositiveDefiniteMatrixException e) {
            throw new WorkFailedException("the ephemeris terms cannot be separated with these timings "
                    + "(too few distinct cycles); add timings from more cycles");
        }
        RealMatrix inv = chol.getSolver().getInverse();
        double[] scaledRhs = new double[k];
        for (int p = 0; p < k; p++) {
            scaledRhs[p] = rhs[p] * scale[p];
        }
        double[] beta = chol.getSolver().solve(new ArrayRealVector(scaledRhs)).toArray();
        double[][] cov = new double[k][k];
        for (int p = 0; p < k; p++) {
            beta[p] *= scale[p];
            for (int q = 0; q < k; q++) {
                cov[p][q] = inv.getEntry(p, q) * scale[p] * scale[q];
            }
        }
        double chi2 = 0;
        for (int i = 0; i < n; i++) {
            double m = 0;
            for (int p = 0; p < k; p++) {
                m += design[i][p] * beta[p];
            }
            double r = (y[i] - m) / sigma[i];
            chi2 += r * r;
        }
        return new Solution(beta, cov, chi2);
    }
}
